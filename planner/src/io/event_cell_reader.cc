#include "io/event_cell_reader.h"

#include <algorithm>
#include <string>
#include <vector>

#include "io/plan_fields.h"

namespace planner {
namespace io {
namespace {

const std::vector<std::string> kEventCellFields = {"event", "wind_ms", "min_records",
                                                   "optional", "channels"};
constexpr double kMaxRecords = 1000000;

// Every event type a cell may name: the natural ones, then the plan's tests.
std::vector<std::string> EventTypeNames(const Plan& plan) {
  std::vector<std::string> names = {kStartUpEvent, kNormalStopEvent};
  for (const ManualTest& t : plan.manual_tests) names.push_back(t.name);
  return names;
}

std::string RangeText(double lo, double hi) {
  return FormatNumber(lo) + "-" + FormatNumber(hi) + " m/s";
}

// A cell that no event of its type could ever fall in is a mistake.
void CheckCanFill(const Field& wind, const std::string& event, const Bin& bin,
                  const Plan& plan) {
  const TurbineSpec& t = plan.turbine;
  if (event == kStartUpEvent && (bin.hi <= t.cut_in_ms || bin.lo >= t.cut_out_ms)) {
    Fail(wind, PairText(wind) + " lies outside turbine.cut_in_ms to cut_out_ms (" +
                   RangeText(t.cut_in_ms, t.cut_out_ms) +
                   "); a start-up begins production, so this cell could never fill");
  }
  for (const ManualTest& test : plan.manual_tests) {
    if (test.name != event) continue;
    if (bin.hi > test.wind_lo_ms && bin.lo < test.wind_hi_ms) return;
    Fail(wind, PairText(wind) + " lies outside the wind window of manual test " +
                   test.name + " (" + RangeText(test.wind_lo_ms, test.wind_hi_ms) +
                   "), so this cell could never fill");
  }
}

struct EventCellInput {
  std::string event;
  Field wind;
  Cell cell;
};

EventCellInput ReadEventCell(const Field& f, const Plan& plan,
                             const std::vector<std::string>& valid) {
  const FieldMap m(f, kEventCellFields);
  const Field event_field = m.Get("event");
  const std::string event = AsText(event_field);
  if (std::find(valid.begin(), valid.end(), event) == valid.end()) {
    Fail(event_field, Describe(event_field.node) +
                          " is not an event type; valid: " + JoinWords(valid) +
                          (plan.manual_tests.empty()
                               ? " (manual tests are defined in manual_tests.tests)"
                               : ""));
  }
  const Field wind = m.Get("wind_ms");
  const auto [lo, hi] = ReadWindRange(wind);
  EventCellInput in{event, wind, Cell{}};
  in.cell.wind_ms = Bin{lo, hi};
  in.cell.required = AsWholeNumber(m.Get("min_records"), Interval("[]", 1, kMaxRecords));
  in.cell.optional = ReadBool(m, "optional", false);
  if (const auto c = m.Find("channels")) in.cell.channels = ReadChannelNeeds(*c, plan);
  CheckCanFill(wind, event, in.cell.wind_ms, plan);
  return in;
}

}  // namespace

void ReadEventCells(const Field& f, const Plan& plan, CaptureMatrix* matrix) {
  const std::vector<Field> items = AsList(f);
  if (items.empty())
    Fail(f, "is empty; give at least one event cell, or leave the field out");
  const std::vector<std::string> valid = EventTypeNames(plan);
  std::vector<EventCellInput> read;
  for (const Field& item : items) {
    EventCellInput in = ReadEventCell(item, plan, valid);
    for (const EventCellInput& earlier : read) {
      if (earlier.event != in.event) continue;
      const Bin& a = earlier.cell.wind_ms;
      const Bin& b = in.cell.wind_ms;
      if (b.lo >= a.hi || b.hi <= a.lo) continue;
      const std::string at = earlier.wind.path.substr(0, earlier.wind.path.rfind('.'));
      Fail(in.wind, PairText(in.wind) + " overlaps the " + in.event + " cell " +
                        RangeText(a.lo, a.hi) + " of " + at +
                        "; an event must fall in at most one cell of its type");
    }
    read.push_back(in);
  }
  for (EventCellInput& in : read) {
    auto type =
        std::find(matrix->event_types.begin(), matrix->event_types.end(), in.event);
    if (type == matrix->event_types.end()) {
      matrix->event_types.push_back(in.event);
      type = matrix->event_types.end() - 1;
    }
    in.cell.event = static_cast<int>(type - matrix->event_types.begin());
    matrix->cells.push_back(in.cell);
  }
}

}  // namespace io
}  // namespace planner
