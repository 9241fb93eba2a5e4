// Compiling the plan's operations for the run loop: planned outages,
// curtailment rules, event cells, manual tests and the crew calendar.
#include <algorithm>
#include <cmath>
#include <string>

#include "sim/compiled_model.h"

namespace planner {

uint32_t HourMask(const HourWindow& w) {
  uint32_t mask = 0;
  const auto add = [&mask](int from, int to) {
    for (int h = from; h < to; ++h) mask |= 1u << h;
  };
  if (w.from_hour < w.to_hour) {
    add(w.from_hour, w.to_hour);
  } else if (w.from_hour > w.to_hour) {  // wraps past midnight
    add(w.from_hour, 24);
    add(0, w.to_hour);
  }
  return mask;
}

namespace {

std::vector<StepInterval> Merge(std::vector<StepInterval> v) {
  std::sort(v.begin(), v.end(),
            [](const StepInterval& a, const StepInterval& b) { return a.from < b.from; });
  std::vector<StepInterval> out;
  for (const StepInterval& i : v) {
    if (!out.empty() && i.from <= out.back().to) {
      out.back().to = std::max(out.back().to, i.to);
    } else {
      out.push_back(i);
    }
  }
  return out;
}

void CompilePlannedOutages(const Plan& plan, CompiledModel* m) {
  std::vector<StepInterval> turbine, daq;
  for (const PlannedOutage& o : plan.planned_outages) {
    const StepInterval steps{DaysBetween(plan.start, o.from) * kStepsPerDay,
                             DaysBetween(plan.start, o.to) * kStepsPerDay};
    if (steps.to <= 0 || steps.from >= steps.to) continue;
    if (o.turbine) turbine.push_back(steps);
    if (o.daq) daq.push_back(steps);
  }
  m->planned_turbine = Merge(turbine);
  m->planned_daq = Merge(daq);
}

ActionSteps CompileActionSteps(const Plan& plan, const ActionDates& d) {
  ActionSteps s;
  int64_t first_day = d.lead_time_days;
  if (d.from) first_day = std::max(first_day, DaysBetween(plan.start, *d.from));
  s.first_step = first_day * kStepsPerDay;
  if (d.to) s.end_step = DaysBetween(plan.start, *d.to) * kStepsPerDay;
  return s;
}

void CompileParking(const Plan& plan, CompiledModel* m) {
  for (const CrewParking& p : plan.crew_parking) {
    CompiledParking cp;
    cp.wind_lo_ms = p.wind_lo_ms;
    cp.wind_hi_ms = p.wind_hi_ms;
    cp.park_steps = std::max<int64_t>(1, std::llround(p.hours * kStepsPerHour));
    cp.min_interval_steps = static_cast<int64_t>(std::ceil(p.min_interval_h * kStepsPerHour));
    cp.steps = CompileActionSteps(plan, p.dates);
    m->crew_parking.push_back(cp);
    // The parked cells whose wind bin the park's window overlaps.
    for (size_t c = 0; c < plan.matrix.cells.size(); ++c) {
      const Cell& cell = plan.matrix.cells[c];
      if (cell.event < 0 && cell.state == OperatingState::kParked &&
          cell.wind_ms.hi > p.wind_lo_ms && cell.wind_ms.lo < p.wind_hi_ms)
        m->manual_test_cell[c] = 1;
    }
  }
}

void CompileEvents(const Plan& plan, CompiledModel* m) {
  const CaptureMatrix& matrix = plan.matrix;
  m->events.resize(matrix.event_types.size());
  m->manual_test_cell.assign(matrix.cells.size(), 0);
  for (size_t e = 0; e < matrix.event_types.size(); ++e) {
    const std::string& name = matrix.event_types[e];
    if (name == kStartUpEvent) m->start_up_event = static_cast<int>(e);
    if (name == kNormalStopEvent) m->normal_stop_event = static_cast<int>(e);
    std::vector<std::pair<Bin, int>> bins;
    for (size_t c = 0; c < matrix.cells.size(); ++c) {
      if (matrix.cells[c].event == static_cast<int>(e)) {
        bins.push_back({matrix.cells[c].wind_ms, static_cast<int>(c)});
      }
    }
    std::sort(bins.begin(), bins.end(),
              [](const auto& a, const auto& b) { return a.first.lo < b.first.lo; });
    std::vector<Bin> edges;
    for (const auto& [bin, cell] : bins) {
      edges.push_back(bin);
      m->events[e].cells.push_back(cell);
    }
    m->events[e].wind = BinLookup(edges);
  }
  for (const ManualTest& t : plan.manual_tests) {
    const auto it =
        std::find(matrix.event_types.begin(), matrix.event_types.end(), t.name);
    if (it == matrix.event_types.end()) continue;  // no cells: never needed
    CompiledManualTest ct;
    ct.event_type = static_cast<int>(it - matrix.event_types.begin());
    ct.wind_lo_ms = t.wind_lo_ms;
    ct.wind_hi_ms = t.wind_hi_ms;
    ct.min_interval_steps =
        static_cast<int64_t>(std::ceil(t.min_interval_h * kStepsPerHour));
    ct.steps = CompileActionSteps(plan, t.dates);
    m->events[ct.event_type].manual = true;
    for (int cell : m->events[ct.event_type].cells) m->manual_test_cell[cell] = 1;
    m->manual_tests.push_back(ct);
  }
}

void CompileCrew(const Plan& plan, CompiledModel* m) {
  m->crew_hour_mask = HourMask(plan.crew.hours);
  const int64_t first = DaysFromCivil(plan.start);
  m->day_crew.resize(m->day_month.size());
  for (size_t d = 0; d < m->day_crew.size(); ++d) {
    // 1970-01-01 was a Thursday (weekday 4 with Sunday = 0).
    const int64_t weekday = ((first + static_cast<int64_t>(d)) % 7 + 11) % 7;
    m->day_crew[d] = plan.crew.weekdays[weekday] ? 1 : 0;
  }
}

}  // namespace

void CompileOperations(const Plan& plan, CompiledModel* m) {
  CompilePlannedOutages(plan, m);
  m->curtailment = CurtailmentRules(plan.curtailment);
  CompileEvents(plan, m);
  CompileParking(plan, m);
  CompileCrew(plan, m);
}

}  // namespace planner
