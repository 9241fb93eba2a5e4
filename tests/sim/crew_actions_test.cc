// What the site crew does (sim/crew_actions.h): manual tests only within
// their dates, and park tests that fill parked cells at mid wind speeds by
// parking a producing turbine for a set time.
#include <gtest/gtest.h>

#include <vector>

#include "planner/calendar.h"
#include "planner/simulation.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

// ThreeCellPlan with an emergency-stop cell at 6-14 m/s, done by the crew.
Plan PlanWithTest() {
  Plan plan = testing_plans::ThreeCellPlan();
  plan.turbine_outages = OutageModel{};
  plan.matrix.event_types = {"emergency_stop"};
  Cell test;
  test.event = 0;
  test.wind_ms = {6, 14};
  test.required = 100000;  // never full: the crew keeps testing
  plan.matrix.cells.push_back(test);
  ManualTest t;
  t.name = "emergency_stop";
  t.wind_lo_ms = 6;
  t.wind_hi_ms = 14;
  t.min_interval_h = 24;
  plan.manual_tests = {t};
  plan.horizon_weeks = 20;
  for (Cell& c : plan.matrix.cells) c.required = 100000;
  return plan;
}

// Tests are done only from the later of the start plus the lead time and
// `from`, and before `to` (exact property of the model); inside the window
// the crew does them.
TEST(CrewActionsTest, ManualTestsOnlyWithinTheirDates) {
  Plan plan = PlanWithTest();
  plan.manual_tests[0].dates.lead_time_days = 20;
  plan.manual_tests[0].dates.from = AddDays(plan.start, 10);
  plan.manual_tests[0].dates.to = AddDays(plan.start, 60);
  const Simulator sim(plan);
  RunResult result;
  std::vector<TracedRecord> records;
  int64_t tests = 0;
  for (uint64_t run = 0; run < 3; ++run) {
    sim.Trace(5, run, &result, &records);
    for (const TracedRecord& r : records) {
      if (!r.manual_test) continue;
      ++tests;
      EXPECT_GE(r.step, 20 * kStepsPerDay) << "run " << run;
      EXPECT_LT(r.step, 60 * kStepsPerDay) << "run " << run;
    }
  }
  EXPECT_GT(tests, 30);  // about one a working day for 40 days, three runs
}

// A park test: with a parked cell at 10-14 m/s, the crew parks the producing
// turbine for 2 h (12 records) when the wind is in 8-16 m/s. Every park is
// exactly 12 parked records with the turbine available at production wind
// speeds (nothing else parks this turbine there), each starting after a
// record in the window during crew hours; at least 48 h apart; and the
// parked cell fills, which it never does without the park test.
TEST(CrewActionsTest, ParkTestsFillParkedCellsAtMidWind) {
  Plan plan = testing_plans::ThreeCellPlan();
  plan.turbine_outages = OutageModel{};
  plan.horizon_weeks = 20;
  Cell parked;
  parked.state = OperatingState::kParked;
  parked.wind_ms = {10, 14};
  parked.required = 30;
  plan.matrix.cells.push_back(parked);
  StateGrid grid;
  grid.state = OperatingState::kParked;
  grid.wind_bins_ms = {parked.wind_ms};
  grid.cell_index = {static_cast<int>(plan.matrix.cells.size()) - 1};
  plan.matrix.grids.push_back(grid);
  const Plan without = plan;
  CrewParking park;
  park.name = "park_mid_wind";
  park.wind_lo_ms = 8;
  park.wind_hi_ms = 16;
  park.hours = 2;
  park.min_interval_h = 48;
  plan.crew_parking = {park};
  const Simulator sim(plan), sim_without(without);
  const int parked_cell = static_cast<int>(plan.matrix.cells.size()) - 1;
  RunResult result, result_without;
  std::vector<TracedRecord> records;
  for (uint64_t run = 0; run < 3; ++run) {
    sim.Trace(8, run, &result, &records);
    int64_t in_park = 0, parks = 0, last_start = INT64_MIN / 2;
    for (size_t i = 0; i < records.size(); ++i) {
      const TracedRecord& r = records[i];
      const bool crew_parked = r.state == OperatingState::kParked && r.turbine_up &&
                               r.speed_ms >= plan.turbine.cut_in_ms;
      if (crew_parked) {
        ++in_park;
        if (in_park == 1) {  // a park starts after a producing record in the window
          ++parks;
          ASSERT_GT(i, 0u);
          const TracedRecord& before = records[i - 1];
          EXPECT_EQ(before.state, OperatingState::kProduction);
          EXPECT_GE(before.speed_ms, 8.0);
          EXPECT_LT(before.speed_ms, 16.0);
          EXPECT_GE(r.step - last_start, 48 * kStepsPerHour);
          last_start = r.step;
        }
      } else if (in_park > 0) {
        EXPECT_EQ(in_park, 12) << "park ending at record " << r.step;
        in_park = 0;
      }
    }
    EXPECT_GT(parks, 0);
    EXPECT_GE(result.full_step[parked_cell], 0) << "run " << run;
    sim_without.Run(8, run, &result_without);
    EXPECT_EQ(result_without.count_at_end[parked_cell], 0u);
    // The shorter loop agrees with the traced one.
    RunResult fast;
    sim.Run(8, run, &fast);
    EXPECT_EQ(fast.count_at_end, result.count_at_end);
    EXPECT_EQ(fast.full_step, result.full_step);
    EXPECT_EQ(fast.completion_step, result.completion_step);
  }
}

}  // namespace
}  // namespace planner
