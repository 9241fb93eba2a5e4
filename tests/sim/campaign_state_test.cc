// Continuing a running campaign: counts carried over, the calendar where it
// is, the weather started from the latest logged wind.
#include <gtest/gtest.h>

#include "planner/monte_carlo.h"
#include "planner/plan_reader.h"
#include "planner/simulation.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

std::vector<RunResult> Continue(const Plan& plan, const CampaignState& state, int runs) {
  const Simulator sim(plan);
  MonteCarloOptions mc;
  mc.runs = runs;
  mc.seed = 17;
  mc.state = &state;
  return RunMonteCarlo(sim, mc, nullptr);
}

TEST(CampaignStateTest, FullMatrixForecastsZeroRemainingWeeks) {
  const Plan plan = testing_plans::SingleCellPlan(8.0, 2.0, 10.0, 12.0, 50, 30, 10);
  CampaignState state;
  state.elapsed_days = 12;
  state.counts = {50};
  for (const RunResult& r : Continue(plan, state, 5)) {
    EXPECT_EQ(r.completion_step, 12 * kStepsPerDay);  // complete at the as-of date
    EXPECT_EQ(r.full_step[0], 12 * kStepsPerDay);
    EXPECT_GE(r.count_at_end[0], 50u);  // records go on accumulating to the deadline
  }
}

// Counts carry over: needing one more record, the run completes at the first
// record in the bin after the as-of date, never before it.
TEST(CampaignStateTest, CountsSoFarCarryOver) {
  const Plan plan = testing_plans::SingleCellPlan(8.0, 2.0, 2.0, 30.0, 500, 30, 10);
  CampaignState state;
  state.elapsed_days = 5;
  state.counts = {499};
  for (const RunResult& r : Continue(plan, state, 20)) {
    EXPECT_GT(r.completion_step, 5 * kStepsPerDay);
    EXPECT_LT(r.completion_step, 5 * kStepsPerDay + 10);  // P(2 <= V < 30) ~ 0.94
    EXPECT_GE(r.count_at_deadline[0], 500u);
  }
}

// With a very persistent wind (tau = 2000 h), the first day after the as-of
// date keeps the last logged speed: its mean lies close to 20 m/s although the
// climate's mean is 7 m/s. (phi^144 = 0.988: the latent score barely moves.)
TEST(CampaignStateTest, WeatherStartsFromTheLastLoggedWind) {
  Plan plan = testing_plans::SingleCellPlan(7.9, 2.0, 2.0, 30.0, 1, 30, 10);
  plan.site.wind_persistence_h = 2000;
  CampaignState state;
  state.elapsed_days = 29;  // the deadline is one day later
  state.counts = {1};       // complete: the run goes on to the deadline only
  state.has_last_wind = true;
  state.last_speed_ms = 20.0;
  state.last_direction_deg = 200.0;
  for (const RunResult& r : Continue(plan, state, 10)) {
    ASSERT_EQ(r.simulated_steps, 30 * kStepsPerDay);
    const double first_day_mean = r.speed_sum_ms / kStepsPerDay;
    EXPECT_GT(first_day_mean, 17.0);
    EXPECT_LT(first_day_mean, 23.0);
  }
}

}  // namespace
}  // namespace planner

namespace planner {
namespace {

// A traced run is the same run, and its records, counted per cell, give the
// run's counts exactly.
TEST(CampaignStateTest, TraceReproducesTheRunsCounts) {
  Plan plan = testing_plans::SingleCellPlan(8.0, 2.0, 6.0, 9.0, 400, 20, 4);
  plan.site.wind_persistence_h = 12;
  plan.turbine_outages = testing_plans::Outages(100, 10);
  plan.quality_reject_fraction = 0.1;
  const Simulator sim(plan);
  RunResult plain, traced;
  std::vector<TracedRecord> records;
  sim.Run(3, 1, &plain);
  sim.Trace(3, 1, &traced, &records);
  EXPECT_EQ(plain.completion_step, traced.completion_step);
  EXPECT_EQ(plain.count_at_end, traced.count_at_end);
  ASSERT_EQ(static_cast<int64_t>(records.size()), traced.simulated_steps);
  uint32_t counted = 0;
  for (const TracedRecord& r : records) {
    const bool in_cell = r.valid && r.turbine_up &&
                         r.state == OperatingState::kProduction && r.speed_ms >= 6.0 &&
                         r.speed_ms < 9.0;
    EXPECT_EQ(in_cell, r.cell == 0) << "step " << r.step;
    counted += r.cell == 0;
  }
  EXPECT_EQ(counted, traced.count_at_end[0]);
}

// On the demo plan (curtailment, reduced mode, start-up and normal-stop
// events, manual tests), every count of a traced run is one traced record:
// its record cell or its event cell.
TEST(CampaignStateTest, TracedRecordsAndEventsGiveEveryCount) {
  Plan plan = LoadPlan(std::string(FILLCAST_SOURCE_DIR) + "/demo-site/plan.yaml");
  plan.horizon_weeks = 20;
  plan.deadline = AddDays(plan.start, 7 * 20);
  const Simulator sim(plan);
  RunResult traced;
  std::vector<TracedRecord> records;
  sim.Trace(11, 2, &traced, &records);
  std::vector<uint32_t> counted(traced.count_at_end.size(), 0);
  int events = 0;
  for (const TracedRecord& r : records) {
    if (r.cell >= 0) ++counted[r.cell];
    if (r.event_cell < 0) continue;
    ++counted[r.event_cell];
    ++events;
    EXPECT_TRUE(r.valid) << "step " << r.step;
    EXPECT_GE(r.event_type, 0) << "step " << r.step;
  }
  EXPECT_GT(events, 0);
  EXPECT_EQ(counted, traced.count_at_end);
}

}  // namespace
}  // namespace planner
