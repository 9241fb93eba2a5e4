#include "planner/logged_counts.h"

#include <algorithm>
#include <cmath>

#include "planner/angle_range.h"
#include "planner/error.h"

namespace planner {
namespace {

const char* const kStateWords[kLoggedStateCount] = {"production", "parked", "reduced",
                                                    "outage"};

// The plan's matrix as lookups by state and by event type.
class CellFinder {
 public:
  explicit CellFinder(const Plan& plan) : plan_(plan) {
    for (const StateGrid& g : plan.matrix.grids) {
      grid_[static_cast<int>(g.state)] = &g;
    }
  }

  // Record cell of a valid, non-test record in grid state `state`, or -1;
  // *missing is set when the std was needed but not logged.
  int RecordCell(OperatingState state, const LoggedRecord& r, bool* missing) const {
    const StateGrid* g = grid_[static_cast<int>(state)];
    if (g == nullptr) return -1;
    const int w = FindBin(g->wind_bins_ms, r.speed_ms);
    if (w < 0) return -1;
    if (g->ti_bins_pct.empty()) return g->cell_index[static_cast<size_t>(w)];
    if (std::isnan(r.speed_std_ms)) {
      *missing = true;
      return -1;
    }
    if (!(r.speed_ms > 0)) return -1;
    const int t = FindBin(g->ti_bins_pct, 100.0 * r.speed_std_ms / r.speed_ms);
    if (t < 0) return -1;
    return g->cell_index[static_cast<size_t>(w) * g->ti_bins_pct.size() +
                         static_cast<size_t>(t)];
  }

  // Event type index of a logged event name, or -1.
  int EventType(const std::string& name) const {
    const std::vector<std::string>& types = plan_.matrix.event_types;
    const auto it = std::find(types.begin(), types.end(), name);
    return it == types.end() ? -1 : static_cast<int>(it - types.begin());
  }

  // Event cell of type `type` whose wind bin holds speed_ms, or -1.
  int EventCell(int type, double speed_ms) const {
    const std::vector<Cell>& cells = plan_.matrix.cells;
    for (size_t c = 0; c < cells.size(); ++c) {
      if (cells[c].event == type && speed_ms >= cells[c].wind_ms.lo &&
          speed_ms < cells[c].wind_ms.hi) {
        return static_cast<int>(c);
      }
    }
    return -1;
  }

 private:
  const Plan& plan_;
  const StateGrid* grid_[kOperatingStateCount] = {nullptr, nullptr, nullptr};
};

bool InValidSector(const Plan& plan, double direction_deg) {
  for (const AngleRange& a : plan.valid_sectors) {
    if (AngleRangeContains(a, direction_deg)) return true;
  }
  return false;
}

// Counts one cell and notes when the last required cell reaches its minimum.
class Tally {
 public:
  Tally(const CaptureMatrix& m, LoggedCounts* out)
      : m_(m), out_(out), remaining_(RequiredCellCount(m)) {
    out_->counts.assign(m.cells.size(), 0);
  }
  void Count(int cell, int64_t record_end_s) {
    const uint32_t n = ++out_->counts[static_cast<size_t>(cell)];
    const Cell& c = m_.cells[static_cast<size_t>(cell)];
    if (c.optional || n != static_cast<uint32_t>(c.required)) return;
    if (--remaining_ == 0) out_->complete_time_s = record_end_s;
  }
  bool Full() const { return remaining_ <= 0; }
  // A planned change: its cells start again from 0 (unless the matrix was
  // complete before it: the campaign was over).
  void Reset(const PlannedChange& change) {
    if (Full()) return;
    for (const int cell : change.cells) {
      uint32_t& n = out_->counts[static_cast<size_t>(cell)];
      const Cell& c = m_.cells[static_cast<size_t>(cell)];
      if (!c.optional && n >= static_cast<uint32_t>(c.required)) ++remaining_;
      n = 0;
    }
  }

 private:
  const CaptureMatrix& m_;
  LoggedCounts* out_;
  int remaining_;
};

}  // namespace

const char* LoggedStateName(LoggedState s) { return kStateWords[static_cast<int>(s)]; }

std::optional<LoggedState> ParseLoggedState(const std::string& word) {
  for (int i = 0; i < kLoggedStateCount; ++i) {
    if (word == kStateWords[i]) return static_cast<LoggedState>(i);
  }
  return std::nullopt;
}

bool MatrixFull(const CaptureMatrix& matrix, const std::vector<uint32_t>& counts) {
  for (size_t c = 0; c < matrix.cells.size(); ++c) {
    const uint32_t n = c < counts.size() ? counts[c] : 0;
    if (!matrix.cells[c].optional && n < static_cast<uint32_t>(matrix.cells[c].required))
      return false;
  }
  return true;
}

LoggedCounts CountLoggedRecords(const Plan& plan,
                                const std::vector<LoggedRecord>& records,
                                const Date& as_of) {
  LoggedCounts out;
  const CellFinder finder(plan);
  Tally tally(plan.matrix, &out);
  if (tally.Full()) out.complete_time_s = DateTime(plan.start);
  const int64_t start_s = DateTime(plan.start), end_s = DateTime(as_of);
  // The planned changes before as_of, applied as the records pass them.
  size_t change = 0;
  const auto reset_before = [&](int64_t time_s) {
    for (; change < plan.planned_changes.size() &&
           DateTime(plan.planned_changes[change].date) <= time_s &&
           DateTime(plan.planned_changes[change].date) < end_s;
         ++change) {
      tally.Reset(plan.planned_changes[change]);
    }
  };
  // Load-channel groups: by name, and those every cell needs.
  uint32_t every_cell_needs = 0;
  if (!plan.channel_groups.empty()) {
    every_cell_needs = static_cast<uint32_t>((1ull << plan.channel_groups.size()) - 1);
    for (const Cell& c : plan.matrix.cells) every_cell_needs &= c.channels;
  }
  const auto channels_down = [&](const std::string& names) {
    uint32_t mask = 0;
    bool unknown = false;
    for (size_t from = 0; from < names.size();) {
      const size_t end = std::min(names.find(';', from), names.size());
      const std::string name = names.substr(from, end - from);
      const auto g = std::find_if(plan.channel_groups.begin(), plan.channel_groups.end(),
                                  [&](const ChannelGroup& x) { return x.name == name; });
      if (g == plan.channel_groups.end()) {
        unknown = true;
      } else {
        mask |= 1u << (g - plan.channel_groups.begin());
      }
      from = end + 1;
    }
    out.unknown_channel_groups += unknown;
    return mask;
  };
  for (const LoggedRecord& r : records) {
    reset_before(r.time_s);
    if (r.time_s < start_s) {
      ++out.before_start;
      continue;
    }
    if (r.time_s >= end_s) {
      ++out.after_as_of;
      continue;
    }
    ++out.records_used;
    if (!out.first_time_s) out.first_time_s = r.time_s;
    out.last_time_s = r.time_s;
    const bool known = !std::isnan(r.speed_ms) && !std::isnan(r.direction_deg);
    if (known && r.quality_ok) {
      out.has_last_wind = true;
      out.last_wind_time_s = r.time_s;
      out.last_speed_ms = r.speed_ms;
      out.last_direction_deg = r.direction_deg;
    }
    const int64_t record_end_s = r.time_s + kRecordSeconds;
    const uint32_t down = r.channels_down.empty() ? 0u : channels_down(r.channels_down);
    bool valid = false;
    if (down & every_cell_needs) {
      ++out.channels_down;
    } else if (!r.quality_ok) {
      ++out.quality_rejected;
    } else if (!known) {
      ++out.missing_values;
    } else if (!InValidSector(plan, r.direction_deg)) {
      ++out.outside_sector;
    } else {
      valid = true;
    }
    // Events first, as in the simulation (a start-up record also counts as a
    // normal record; a manual-test record does not).
    bool test_record = false;
    if (!r.event.empty()) {
      const int type = finder.EventType(r.event);
      test_record = r.event != kStartUpEvent && r.event != kNormalStopEvent;
      if (type < 0) {
        ++out.unknown_events;
      } else if (valid) {
        const int cell = finder.EventCell(type, r.speed_ms);
        if (cell >= 0 && (plan.matrix.cells[cell].channels & down) == 0)
          tally.Count(cell, record_end_s), ++out.counted_events;
      }
    }
    if (!valid || test_record) continue;
    if (r.state == LoggedState::kOutage && !plan.parked_counts_during_outage) continue;
    const OperatingState grid_state =
        r.state == LoggedState::kProduction ? OperatingState::kProduction
        : r.state == LoggedState::kReduced  ? OperatingState::kReduced
                                            : OperatingState::kParked;
    bool missing = false;
    const int cell = finder.RecordCell(grid_state, r, &missing);
    if (missing) ++out.missing_values;
    if (cell >= 0 && (plan.matrix.cells[cell].channels & down) == 0)
      tally.Count(cell, record_end_s), ++out.counted_records;
  }
  reset_before(end_s - 1);  // changes after the last record, before as_of
  return out;
}

void CheckAsOfDate(const Plan& plan, const Date& as_of) {
  const int64_t days = DaysBetween(plan.start, as_of);
  const int64_t horizon_days = static_cast<int64_t>(plan.horizon_weeks) * 7;
  if (days < 0 || days >= horizon_days) {
    const Date last = AddDays(plan.start, horizon_days - 1);
    ThrowAt(SourceLocation{}, "--as-of",
            FormatDate(as_of) + " is " +
                (days < 0 ? "before the plan's start" : "beyond the plan's horizon") +
                "; valid: a date from " + FormatDate(plan.start) + " to " +
                FormatDate(last));
  }
}

CampaignState MakeCampaignState(const Plan& plan, const LoggedCounts& logged,
                                const Date& as_of) {
  CampaignState state;
  state.elapsed_days = DaysBetween(plan.start, as_of);
  state.counts = logged.counts;
  state.has_last_wind = logged.has_last_wind;
  state.last_speed_ms = logged.last_speed_ms;
  state.last_direction_deg = logged.last_direction_deg;
  return state;
}

}  // namespace planner
