// What holds the campaign up (planner/hold_ups.h): the plan's processes
// switched off one at a time, and their forecasts from the same runs and seed.
#include "planner/hold_ups.h"

#include <gtest/gtest.h>

#include <string>

#include "planner/angle_range.h"
#include "planner/forecast_accumulator.h"
#include "planner/monte_carlo.h"
#include "planner/plan_reader.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

double SectorDegrees(const std::vector<AngleRange>& ranges) {
  double sum = 0;
  for (const AngleRange& r : ranges) sum += AngleRangeWidth(r);
  return sum;
}

// The demo plan uses all four: one variant each, in order, each without
// exactly its process.
TEST(HoldUpsTest, DemoPlanHasOneVariantPerProcess) {
  const Plan plan = LoadPlan(std::string(FILLCAST_SOURCE_DIR) + "/demo-site/plan.yaml");
  const std::vector<ProcessVariant> v = ProcessVariants(plan);
  ASSERT_EQ(v.size(), 4u);
  EXPECT_EQ(v[0].key, "short_term_stops");
  EXPECT_TRUE(v[0].plan.turbine.shutdown_rules.empty());
  EXPECT_EQ(v[0].plan.turbine.restart_wait_min, 0);
  EXPECT_EQ(v[0].plan.episodes.size(), plan.episodes.size());
  EXPECT_EQ(v[1].key, "episode:icing");
  EXPECT_TRUE(v[1].plan.episodes.empty());
  EXPECT_FALSE(v[1].plan.turbine.shutdown_rules.empty());
  EXPECT_EQ(v[2].key, "channel_groups");
  EXPECT_TRUE(v[2].plan.channel_groups.empty());
  for (const Cell& c : v[2].plan.matrix.cells) EXPECT_EQ(c.channels, kAllChannels);
  EXPECT_EQ(v[3].key, "turbine_wakes");
  // Seen from the mast alone, more of the circle is valid; the rest of the
  // plan is as it was.
  EXPECT_GT(SectorDegrees(v[3].plan.valid_sectors), SectorDegrees(plan.valid_sectors));
  EXPECT_EQ(v[3].plan.channel_groups.size(), plan.channel_groups.size());
  EXPECT_TRUE(ProcessVariants(testing_plans::ThreeCellPlan()).empty());
}

// A variant's forecast is the forecast of the plan without that process made
// directly with the same runs and seed, to the last bit; P80 saved is the
// difference. An episode that makes records invalid for long stretches
// holds the campaign up: switched off, P80 comes sooner (by more than the
// two P80s' 95 % intervals, so not by chance).
TEST(HoldUpsTest, VariantForecastIsTheSameRunsWithoutTheProcess) {
  Plan plan = testing_plans::ThreeCellPlan();
  EpisodeModel e;
  e.name = "icing";
  e.starts_per_month.fill(3.0);
  e.mean_h = 48;
  e.stops_turbine = false;
  e.invalidates_records = true;
  plan.episodes = {e};
  MonteCarloOptions mc;
  mc.runs = 1500;
  mc.seed = 17;
  mc.threads = 2;
  const auto forecast = [&](const Plan& p) {
    const Simulator sim(p);
    ForecastAccumulator acc(p.matrix, sim.deadline_steps(), sim.horizon_steps(),
                            sim.relaxed_share());
    RunMonteCarloInChunks({&sim}, mc, nullptr,
                          [&acc](uint64_t, const std::vector<std::vector<RunResult>>& c) {
                            for (const RunResult& r : c[0]) acc.Add(r);
                          });
    return acc.Summary(mc.seed);
  };
  const ForecastSummary with_all = forecast(plan);
  const std::vector<HoldUp> h = ForecastHoldUps(plan, {}, mc, with_all, nullptr);
  ASSERT_EQ(h.size(), 1u);
  Plan without = plan;
  without.episodes.clear();
  const ForecastSummary direct = forecast(without);
  ASSERT_TRUE(direct.p80.value && with_all.p80.value);
  EXPECT_EQ(h[0].p80.value, direct.p80.value);
  EXPECT_EQ(h[0].p50.value, direct.p50.value);
  EXPECT_EQ(h[0].p_complete_by_deadline, direct.p_complete_by_deadline);
  EXPECT_EQ(h[0].p80_saved_weeks, *with_all.p80.value - *direct.p80.value);
  ASSERT_TRUE(with_all.p80.ci_lo && direct.p80.ci_hi);
  EXPECT_GT(*with_all.p80.ci_lo, *direct.p80.ci_hi);
}

}  // namespace
}  // namespace planner
