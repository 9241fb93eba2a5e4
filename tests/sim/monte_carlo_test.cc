#include "planner/monte_carlo.h"

#include <gtest/gtest.h>

#include "sim/test_plans.h"

namespace planner {
namespace {

// Adding runs to reach a precision gives exactly the runs of one batch of the
// final size (run i is always the same campaign), and the interval width it
// reports is met.
TEST(MonteCarloTest, RunToPrecisionEqualsOneBatchOfTheFinalSize) {
  Plan plan = testing_plans::SingleCellPlan(8.0, 2.0, 11.0, 13.0, 60, 2, 6);
  plan.site.wind_persistence_h = 12;
  const Simulator sim(plan);
  MonteCarloOptions mc;
  mc.runs = 50;
  mc.seed = 4;
  const PrecisionResult p = RunToPrecision(sim, mc, 0.8, 0.2, 12800, nullptr);
  ASSERT_TRUE(p.target_met);
  EXPECT_LE(p.ci_width_weeks, 0.2);
  EXPECT_GT(p.rounds, 1);
  mc.runs = static_cast<int>(p.runs.size());
  const std::vector<RunResult> once = RunMonteCarlo(sim, mc, nullptr);
  ASSERT_EQ(once.size(), p.runs.size());
  for (size_t i = 0; i < once.size(); ++i) {
    ASSERT_EQ(once[i].completion_step, p.runs[i].completion_step) << i;
  }
}

TEST(MonteCarloTest, RunToPrecisionStopsAtTheCap) {
  const Plan plan = testing_plans::SingleCellPlan(8.0, 2.0, 11.0, 13.0, 60, 2, 6);
  const Simulator sim(plan);
  MonteCarloOptions mc;
  mc.runs = 40;
  const PrecisionResult p = RunToPrecision(sim, mc, 0.8, 1e-9, 100, nullptr);
  EXPECT_FALSE(p.target_met);
  EXPECT_EQ(p.runs.size(), 100u);
}

}  // namespace
}  // namespace planner
