#include "planner/reachability.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <limits>

#include "planner/angle_range.h"
#include "planner/calendar.h"

namespace planner {
namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();
// A TI of exactly the table mean is compared with the bin edges with this
// slack (in percent), so that rounding never makes a reachable bin look
// unreachable: the check only reports what is certain.
constexpr double kTiSlackPct = 1e-6;

// Sets of wind speeds as sorted, disjoint, half-open intervals [lo, hi).
using SpeedSet = std::vector<Bin>;

SpeedSet Normalized(SpeedSet s) {
  s.erase(std::remove_if(s.begin(), s.end(), [](const Bin& b) { return !(b.lo < b.hi); }),
          s.end());
  std::sort(s.begin(), s.end(), [](const Bin& a, const Bin& b) { return a.lo < b.lo; });
  SpeedSet out;
  for (const Bin& b : s) {
    if (!out.empty() && b.lo <= out.back().hi) {
      out.back().hi = std::max(out.back().hi, b.hi);
    } else {
      out.push_back(b);
    }
  }
  return out;
}

SpeedSet Unite(SpeedSet a, const SpeedSet& b) {
  a.insert(a.end(), b.begin(), b.end());
  return Normalized(a);
}

SpeedSet Intersect(const SpeedSet& a, const SpeedSet& b) {
  SpeedSet out;
  for (const Bin& x : a) {
    for (const Bin& y : b) out.push_back({std::max(x.lo, y.lo), std::min(x.hi, y.hi)});
  }
  return Normalized(out);
}

SpeedSet Subtract(const SpeedSet& a, const SpeedSet& b) {
  SpeedSet out = Normalized(a);
  for (const Bin& y : Normalized(b)) {
    SpeedSet next;
    for (const Bin& x : out) {
      next.push_back({x.lo, std::min(x.hi, y.lo)});
      next.push_back({std::max(x.lo, y.hi), x.hi});
    }
    out = Normalized(next);
  }
  return out;
}

std::string Num(double x) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.6g", x);
  return buf;
}

std::string SpeedText(double x) { return Num(x) + " m/s"; }

std::string RangeText(const Bin& b) {
  return std::isinf(b.hi) ? Num(b.lo) + " m/s and above"
                          : Num(b.lo) + "-" + Num(b.hi) + " m/s";
}

// True when the days [0, days) from the start are all inside `windows`
// (day offsets [from, to), any order, may overlap or stick out).
bool CoversDays(std::vector<std::pair<int64_t, int64_t>> windows, int64_t days) {
  std::sort(windows.begin(), windows.end());
  int64_t covered = 0;
  for (const auto& [from, to] : windows) {
    if (from > covered) break;
    covered = std::max(covered, to);
  }
  return covered >= days;
}

// Whether `ranges` (empty = every direction) contain every direction of
// `valid`, up to single directions (which have probability 0). Exact: both
// are unions of arcs, so testing the middle of each arc between their edges
// decides it.
bool CoversValidDirections(const std::vector<AngleRange>& ranges,
                           const std::vector<AngleRange>& valid) {
  if (ranges.empty()) return true;
  std::vector<double> edges = {0.0, 360.0};
  for (const auto* set : {&ranges, &valid}) {
    for (const AngleRange& r : *set) edges.insert(edges.end(), {r.from_deg, r.to_deg});
  }
  std::sort(edges.begin(), edges.end());
  for (std::size_t i = 0; i + 1 < edges.size(); ++i) {
    if (!(edges[i] < edges[i + 1])) continue;
    const double mid = 0.5 * (edges[i] + edges[i + 1]);
    bool in_valid = false, in_rule = false;
    for (const AngleRange& r : valid) in_valid = in_valid || AngleRangeContains(r, mid);
    for (const AngleRange& r : ranges) in_rule = in_rule || AngleRangeContains(r, mid);
    if (in_valid && !in_rule) return false;
  }
  return true;
}

// A rule that holds in every month, at every hour and from every valid
// direction: at its wind speeds it applies to every record that can count.
bool AlwaysInForce(const CurtailmentRule& rule, const Plan& plan) {
  const bool every_month = rule.months.empty() || rule.months.size() >= 12;
  const bool every_hour = rule.hours.from_hour == 0 && rule.hours.to_hour == 24;
  return every_month && every_hour &&
         CoversValidDirections(rule.directions, plan.valid_sectors);
}

// What the plan allows, as sets of wind speeds per kind of record or event.
struct Analysis {
  bool daq_always_down = false;
  bool turbine_always_down = false;
  bool turbine_can_be_down = false;
  SpeedSet always_stop, always_reduce;  // rules in force at all times
  SpeedSet any_stop, any_reduce;        // rules in force at some time
  SpeedSet any_reduce_or_storm;         // any_reduce and the storm-control band
  std::vector<std::string> always_names;
  SpeedSet operating;   // [cut-in, cut-out)
  SpeedSet producing;   // speeds at which the turbine can produce at all
  SpeedSet normal;      // ... produce normally (no curtailment rule)
  SpeedSet reduced;     // ... produce in a reduced mode
  SpeedSet parked;      // speeds at which a parked record can count
  SpeedSet stop_event;  // speeds at which production can end normally
};

void AnalyseAvailability(const Plan& plan, Analysis* a) {
  std::vector<std::pair<int64_t, int64_t>> turbine, daq;
  const int64_t horizon_days = static_cast<int64_t>(plan.horizon_weeks) * 7;
  for (const PlannedOutage& o : plan.planned_outages) {
    const int64_t from = DaysBetween(plan.start, o.from);
    const int64_t to = DaysBetween(plan.start, o.to);
    if (o.turbine) turbine.push_back({from, to});
    if (o.daq) daq.push_back({from, to});
    if (o.turbine && to > 0 && from < horizon_days) a->turbine_can_be_down = true;
  }
  a->daq_always_down = CoversDays(daq, horizon_days);
  a->turbine_always_down = CoversDays(turbine, horizon_days);
  if (plan.turbine_outages.mtbf_h > 0.0) a->turbine_can_be_down = true;
}

void AnalyseCurtailment(const Plan& plan, Analysis* a) {
  for (const CurtailmentRule& rule : plan.curtailment) {
    const Bin wind{rule.wind_lo_ms, rule.wind_hi_ms};
    const bool stop = rule.action == CurtailmentRule::Action::kStop;
    (stop ? a->any_stop : a->any_reduce).push_back(wind);
    if (!AlwaysInForce(rule, plan)) continue;
    (stop ? a->always_stop : a->always_reduce).push_back(wind);
    a->always_names.push_back("'" + rule.name + "'");
  }
  for (SpeedSet* s : {&a->any_stop, &a->any_reduce, &a->always_stop, &a->always_reduce}) {
    *s = Normalized(*s);
  }
}

Analysis Analyse(const Plan& plan) {
  Analysis a;
  AnalyseAvailability(plan, &a);
  AnalyseCurtailment(plan, &a);
  const TurbineSpec& t = plan.turbine;
  a.operating = {{t.cut_in_ms, t.cut_out_ms}};
  if (!a.turbine_always_down) {
    a.producing = Subtract(a.operating, a.always_stop);
    a.normal = Subtract(a.producing, a.always_reduce);
    a.reduced = Intersect(a.producing, a.any_reduce);
    a.any_reduce_or_storm = a.any_reduce;
    if (t.storm_control_from_ms > 0) {
      const SpeedSet storm = {{t.storm_control_from_ms, t.cut_out_ms}};
      a.reduced = Unite(a.reduced, Subtract(storm, a.always_stop));
      a.normal = Subtract(a.normal, storm);
      a.any_reduce_or_storm = Unite(a.any_reduce, storm);
    }
  }
  // A stop on a short-term average can come at any speed the turbine runs
  // at (however rarely at low ones); after it, the restart wait parks the
  // turbine below the restart speed too.
  const bool short_term_stops = !t.shutdown_rules.empty();
  const double parked_from_ms =
      short_term_stops || t.restart_wait_min > 0 ? t.cut_in_ms : t.restart_ms;
  // Parked: below cut-in; from the restart speed up after a high-wind stop;
  // under a stop rule; during a turbine outage when such records count.
  if (!a.turbine_always_down) {
    a.parked = Unite({{0.0, t.cut_in_ms}, {parked_from_ms, kInf}}, a.any_stop);
    // A park test parks a producing turbine with the wind in its window; the
    // wind may then move anywhere in the park's hours, so the parked records
    // may fall at any production speed.
    if (!plan.crew_parking.empty()) a.parked = Unite(a.parked, a.producing);
  }
  if (plan.parked_counts_during_outage && a.turbine_can_be_down) a.parked = {{0.0, kInf}};
  if (!a.producing.empty()) {
    const double stops_from_ms = short_term_stops ? t.cut_in_ms : t.cut_out_ms;
    a.stop_event = Unite({{0.0, t.cut_in_ms}, {stops_from_ms, kInf}},
                         Intersect(a.any_stop, a.operating));
  }
  return a;
}

std::string AlwaysRulesText(const Analysis& a) {
  std::string names;
  for (const std::string& n : a.always_names) names += (names.empty() ? "" : ", ") + n;
  return "curtailment rule" + std::string(a.always_names.size() == 1 ? " " : "s ") +
         names + (a.always_names.size() == 1 ? " holds" : " hold") +
         " in every month, at every hour and from every valid direction";
}

// Why no record of a record cell's state can fall in its wind bin.
std::string RecordCellReason(const Plan& plan, const Analysis& a, const Cell& c) {
  const TurbineSpec& t = plan.turbine;
  const std::string range = RangeText(c.wind_ms);
  const std::string operating = "cut-in (" + SpeedText(t.cut_in_ms) + ") and cut-out (" +
                                SpeedText(t.cut_out_ms) + ")";
  if (a.turbine_always_down && c.state != OperatingState::kParked) {
    return "the turbine is out of service for the whole simulated time (planned "
           "outages), so it never produces";
  }
  switch (c.state) {
    case OperatingState::kProduction:
      if (Intersect({c.wind_ms}, a.operating).empty()) {
        return "its wind speeds lie outside " + operating;
      }
      return AlwaysRulesText(a) + " and stops or reduces the turbine at " + range +
             ", so it never produces normally there";
    case OperatingState::kReduced:
      if (Intersect(Intersect({c.wind_ms}, a.operating), a.any_reduce_or_storm).empty()) {
        const std::string storm =
            t.storm_control_from_ms > 0
                ? ", and storm control reduces only from " +
                      SpeedText(t.storm_control_from_ms) + " up"
                : "";
        return "no curtailment rule with action: reduce applies between " + operating +
               " at " + range + storm;
      }
      return AlwaysRulesText(a) + " and stops the turbine at " + range;
    case OperatingState::kParked:
      break;
  }
  if (a.turbine_always_down) {
    return "the turbine is out of service for the whole simulated time (planned "
           "outages), and records during outages count only with "
           "outages.parked_counts_during_outage: true";
  }
  return "a record is parked only below cut-in (" + SpeedText(t.cut_in_ms) +
         "), from the restart speed (" + SpeedText(t.restart_ms) +
         ") up after a high-wind stop, while a curtailment stop rule applies, "
         "during a park test (manual_tests.parking), or during a turbine outage "
         "with outages.parked_counts_during_outage: true; "
         "none of these can happen at " +
         range + ", where an available turbine produces";
}

// Rows of a TI table that give the TI at some speed of `speeds`: a speed in
// a row's bin uses that row, one outside every bin the nearest row (the
// earlier row at a tie, in the middle of a gap). Row r is used on (lo, hi]
// with lo, hi the middles of the gaps around it; taking hi as closed even
// where the next row starts at it can only add rows (the check stays
// certain).
std::vector<const TiTableRow*> TiRowsFor(const TurbulenceModel& model,
                                         const SpeedSet& speeds) {
  std::vector<const TiTableRow*> rows;
  const std::vector<TiTableRow>& table = model.table;
  for (std::size_t r = 0; r < table.size(); ++r) {
    const double lo =
        r == 0 ? -kInf : 0.5 * (table[r - 1].wind_hi_ms + table[r].wind_lo_ms);
    const double hi = r + 1 == table.size()
                          ? kInf
                          : 0.5 * (table[r].wind_hi_ms + table[r + 1].wind_lo_ms);
    for (const Bin& s : speeds) {
      if (s.lo <= hi && s.hi > lo) {
        rows.push_back(&table[r]);
        break;
      }
    }
  }
  return rows;
}

// Non-empty when a table model with a standard deviation of 0 gives a TI
// outside the cell's TI bin at every speed the cell can have.
std::string TiReason(const Plan& plan, const Cell& c, const SpeedSet& speeds) {
  const TurbulenceModel& model = plan.site.turbulence;
  if (!c.ti_binned || model.kind != TurbulenceModel::Kind::kTable) return "";
  std::string means;
  for (const TiTableRow* row : TiRowsFor(model, speeds)) {
    const double mean_pct = 100.0 * row->ti_mean;
    if (row->ti_std > 0.0) return "";
    if (mean_pct >= c.ti_pct.lo - kTiSlackPct && mean_pct < c.ti_pct.hi + kTiSlackPct) {
      return "";
    }
    means += (means.empty() ? "" : ", ") + Num(mean_pct) + " %";
  }
  return "the site's turbulence table gives a TI of exactly " + means +
         " at these wind speeds (ti_std_pct: 0), never " + Num(c.ti_pct.lo) + "-" +
         Num(c.ti_pct.hi) + " %";
}

const ManualTest* FindTest(const Plan& plan, const std::string& name) {
  for (const ManualTest& t : plan.manual_tests) {
    if (t.name == name) return &t;
  }
  return nullptr;
}

// Non-empty when no event of the cell's type can fall in its wind bin.
std::string EventCellReason(const Plan& plan, const Analysis& a, const Cell& c) {
  const TurbineSpec& t = plan.turbine;
  const std::string& type = plan.matrix.event_types[static_cast<std::size_t>(c.event)];
  const SpeedSet wind = {c.wind_ms};
  if (a.producing.empty()) {
    return a.turbine_always_down
               ? "the turbine is out of service for the whole simulated time (planned "
                 "outages), so it never starts or stops"
               : AlwaysRulesText(a) +
                     " and stops the turbine at every speed between "
                     "cut-in and cut-out, so it never produces";
  }
  if (type == kStartUpEvent) {
    if (!Intersect(wind, a.producing).empty()) return "";
    if (Intersect(wind, a.operating).empty()) {
      return "a start-up begins production, which happens only between cut-in (" +
             SpeedText(t.cut_in_ms) + ") and cut-out (" + SpeedText(t.cut_out_ms) + ")";
    }
    return AlwaysRulesText(a) + " and stops the turbine at " + RangeText(c.wind_ms) +
           ", so production never starts there";
  }
  if (type == kNormalStopEvent) {
    if (!Intersect(wind, a.stop_event).empty()) return "";
    return "a normal stop happens only when the wind drops below cut-in (" +
           SpeedText(t.cut_in_ms) + "), reaches cut-out (" + SpeedText(t.cut_out_ms) +
           ") or a curtailment stop rule starts to apply, and none of these can happen "
           "at " +
           RangeText(c.wind_ms);
  }
  const ManualTest* test = FindTest(plan, type);
  if (test == nullptr) return "";
  const Bin window{test->wind_lo_ms, test->wind_hi_ms};
  if (!Intersect(Intersect(wind, {window}), a.normal).empty()) return "";
  return "manual test " + type +
         " is done only while the turbine produces normally (from cut-in, " +
         SpeedText(t.cut_in_ms) + ", to cut-out, " + SpeedText(t.cut_out_ms) +
         ", with no curtailment rule in force) and the wind is in its window " +
         RangeText(window) + "; no speed of " + RangeText(c.wind_ms) + " meets both";
}

// Empty when the cell can fill, else why not.
std::string CellReason(const Plan& plan, const Analysis& a, const Cell& c) {
  if (a.daq_always_down) {
    return "the data acquisition is out of service for the whole simulated time "
           "(planned outages), so no record or event counts";
  }
  if (c.event >= 0) return EventCellReason(plan, a, c);
  const SpeedSet& state_speeds = c.state == OperatingState::kProduction ? a.normal
                                 : c.state == OperatingState::kReduced  ? a.reduced
                                                                        : a.parked;
  const SpeedSet speeds = Intersect({c.wind_ms}, state_speeds);
  if (speeds.empty()) return RecordCellReason(plan, a, c);
  return TiReason(plan, c, speeds);
}

}  // namespace

Reachability FindUnreachableCells(const Plan& plan) {
  const Analysis a = Analyse(plan);
  Reachability r;
  const CaptureMatrix& m = plan.matrix;
  for (std::size_t i = 0; i < m.cells.size(); ++i) {
    const Cell& c = m.cells[i];
    if (c.event >= static_cast<int>(m.event_types.size())) continue;
    const std::string why = CellReason(plan, a, c);
    if (why.empty()) continue;
    UnreachableCell u;
    u.cell = static_cast<int>(i);
    u.required = !c.optional && c.required > 0;
    u.reason = "Cell " + CellLabel(m, c) + " can never fill: " + why + ".";
    r.required_unreachable += u.required ? 1 : 0;
    r.cells.push_back(u);
  }
  return r;
}

std::string UnreachableAdvice(const Reachability& r) {
  if (r.required_unreachable == 0) return "";
  const bool one = r.required_unreachable == 1;
  return std::string(
             "The capture matrix cannot complete as planned: no simulated run "
             "can complete, and each runs to the horizon. Make ") +
         (one ? "the cell" : "these cells") + " optional, remove " +
         (one ? "it" : "them") + " (min_records: 0), or change the plan so that " +
         (one ? "it" : "they") + " can fill.";
}

}  // namespace planner
