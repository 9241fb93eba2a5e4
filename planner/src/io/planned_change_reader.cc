#include "io/planned_change_reader.h"

#include <algorithm>
#include <optional>
#include <string>

#include "io/plan_fields.h"

namespace planner {
namespace io {
namespace {

const std::vector<std::string> kChangeFields = {"name", "date", "resets"};
const std::vector<std::string> kSelectorFields = {"state", "event", "wind_ms"};
constexpr size_t kMaxChanges = 16;

// Whether cell c (of matrix m) is chosen by the selector: its state or event
// type, and its wind bin inside wind_ms when given.
struct Selector {
  std::optional<OperatingState> state;
  int event = -1;
  double lo_ms = -kInfinity, hi_ms = kInfinity;
  bool Holds(const Cell& c) const {
    const bool kind = state ? (c.event < 0 && c.state == *state) : c.event == event;
    return kind && c.wind_ms.lo >= lo_ms && c.wind_ms.hi <= hi_ms;
  }
};

Selector ReadSelector(const Field& f, const CaptureMatrix& matrix) {
  const FieldMap m(f, kSelectorFields);
  Selector s;
  const std::optional<Field> state = m.Find("state");
  const std::optional<Field> event = m.Find("event");
  if (state.has_value() == event.has_value()) {
    Fail(f, "must give either state (production, parked, reduced) or event (an event "
            "type of the capture matrix), not both or neither");
  }
  if (state) {
    const std::string word = AsText(*state);
    for (int k = 0; k < kOperatingStateCount; ++k) {
      if (word == OperatingStateName(static_cast<OperatingState>(k)))
        s.state = static_cast<OperatingState>(k);
    }
    if (!s.state) {
      Fail(*state, Describe(state->node) +
                       " is not an operating state; valid: production, parked, reduced");
    }
  } else {
    const std::string name = AsText(*event);
    const auto it = std::find(matrix.event_types.begin(), matrix.event_types.end(), name);
    if (it == matrix.event_types.end()) {
      Fail(*event, Describe(event->node) +
                       " is not an event type of the capture matrix; valid: " +
                       (matrix.event_types.empty() ? std::string("none (no event cells)")
                                                   : JoinWords(matrix.event_types)));
    }
    s.event = static_cast<int>(it - matrix.event_types.begin());
  }
  if (const auto wind = m.Find("wind_ms")) {
    const auto [lo, hi] = ReadWindRange(*wind);
    s.lo_ms = lo;
    s.hi_ms = hi;
  }
  return s;
}

// `resets`: "all", or a list of selectors. The cells chosen, ascending.
std::vector<int> ReadResets(const Field& f, const CaptureMatrix& matrix) {
  std::vector<Selector> selectors;
  if (f.node.IsScalar()) {
    if (AsText(f) != "all") {
      Fail(f, Describe(f.node) +
                  " is not a choice of cells; give all, or a list such as "
                  "[{state: production}, {event: start_up}]");
    }
    std::vector<int> all(matrix.cells.size());
    for (size_t c = 0; c < all.size(); ++c) all[c] = static_cast<int>(c);
    return all;
  }
  const std::vector<Field> items = AsList(f);
  if (items.empty()) Fail(f, "is empty; give all, or at least one choice of cells");
  for (const Field& item : items) selectors.push_back(ReadSelector(item, matrix));
  std::vector<int> cells;
  for (size_t c = 0; c < matrix.cells.size(); ++c) {
    const bool chosen = std::any_of(selectors.begin(), selectors.end(),
                                    [&](const Selector& s) { return s.Holds(matrix.cells[c]); });
    if (chosen) cells.push_back(static_cast<int>(c));
  }
  if (cells.empty()) {
    Fail(f, "chooses no cell of the capture matrix; check the states, events and wind "
            "ranges");
  }
  return cells;
}

PlannedChange ReadChange(const Field& f, const Plan& plan, NameSet* names) {
  const FieldMap m(f, kChangeFields);
  PlannedChange change;
  change.name = names->Read(m);
  const Field date = m.Get("date");
  change.date = AsDate(date);
  if (DaysBetween(plan.start, change.date) <= 0) {
    Fail(date, Text(date) + " is not after the start (" + FormatDate(plan.start) +
                   "); a change resets counts from 00:00 of a later date");
  }
  change.cells = ReadResets(m.Get("resets"), plan.matrix);
  return change;
}

}  // namespace

std::vector<PlannedChange> ReadPlannedChanges(const Field& f, const Plan& plan) {
  const std::vector<Field> items = AsList(f);
  if (items.empty()) Fail(f, "is empty; give at least one change, or leave the field out");
  if (items.size() > kMaxChanges) {
    Fail(f, std::to_string(items.size()) + " changes given; at most " +
                std::to_string(kMaxChanges) + " are allowed");
  }
  NameSet names("planned change");
  std::vector<PlannedChange> changes;
  for (const Field& item : items) changes.push_back(ReadChange(item, plan, &names));
  std::stable_sort(changes.begin(), changes.end(),
                   [](const PlannedChange& a, const PlannedChange& b) {
                     return DaysFromCivil(a.date) < DaysFromCivil(b.date);
                   });
  return changes;
}

}  // namespace io
}  // namespace planner
