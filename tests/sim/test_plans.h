// Plans built in code for simulation tests: small, exact, no YAML.
#ifndef FILLCAST_TESTS_SIM_TEST_PLANS_H_
#define FILLCAST_TESTS_SIM_TEST_PLANS_H_

#include "planner/plan.h"

namespace planner {
namespace testing_plans {

// Exponential outages with the given MTBF and MTTR in hours.
inline OutageModel Outages(double mtbf_h, double mttr_h) {
  OutageModel m;
  m.mtbf_h = mtbf_h;
  m.mttr_h = mttr_h;
  return m;
}

// One sector (Weibull a_ms, k), independent records, always available, all
// directions valid, no quality rejects; one production cell [lo_ms, hi_ms)
// without TI bins needing `required` records. Deadline after `deadline_days`,
// horizon `horizon_weeks`.
inline Plan SingleCellPlan(double a_ms, double k, double lo_ms, double hi_ms,
                           int required, int deadline_days = 1, int horizon_weeks = 4) {
  Plan p;
  p.name = "single cell";
  p.site.sectors = {Sector{1.0, Weibull{a_ms, k}}};
  p.site.sector_persistence = 0.0;
  p.site.wind_persistence_h = 0.0;
  p.start = Date{2027, 1, 1};
  p.deadline = AddDays(p.start, deadline_days);
  p.horizon_weeks = horizon_weeks;
  p.turbine.cut_in_ms = 0.5;
  p.turbine.cut_out_ms = 60.0;
  p.turbine.restart_ms = 57.0;
  Cell cell;
  cell.wind_ms = {lo_ms, hi_ms};
  cell.required = required;
  p.matrix.cells = {cell};
  StateGrid grid;
  grid.wind_bins_ms = {cell.wind_ms};
  grid.cell_index = {0};
  p.matrix.grids = {grid};
  return p;
}

// Three wind cells (6-8, 12-14 and 16-18 m/s needing 60, 40 and 25
// records) with persistence and outages, so that cells fill at spread-out
// times and the last cell varies from run to run.
inline Plan ThreeCellPlan() {
  Plan plan = SingleCellPlan(8.0, 2.0, 6.0, 8.0, 60, 20, 30);
  plan.site.wind_persistence_h = 18;
  plan.site.sector_persistence = 0.9;
  plan.turbine_outages = Outages(300, 30);
  const Bin bins[3] = {{6, 8}, {12, 14}, {16, 18}};
  const int required[3] = {60, 40, 25};
  plan.matrix.cells.clear();
  StateGrid grid;
  for (int i = 0; i < 3; ++i) {
    Cell c;
    c.wind_ms = bins[i];
    c.required = required[i];
    plan.matrix.cells.push_back(c);
    grid.wind_bins_ms.push_back(bins[i]);
    grid.cell_index.push_back(i);
  }
  plan.matrix.grids = {grid};
  return plan;
}

}  // namespace testing_plans
}  // namespace planner

#endif  // FILLCAST_TESTS_SIM_TEST_PLANS_H_
