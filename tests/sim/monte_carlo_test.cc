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
  std::vector<int64_t> folded;  // completion steps in the order folded
  std::vector<uint64_t> firsts;
  const PrecisionResult p = RunToPrecision(
      sim, mc, 0.8, 0.2, 12800, nullptr,
      [&](uint64_t first, const std::vector<std::vector<RunResult>>& chunk) {
        firsts.push_back(first);
        for (const RunResult& r : chunk[0]) folded.push_back(r.completion_step);
      });
  ASSERT_TRUE(p.target_met);
  EXPECT_LE(p.ci_width_weeks, 0.2);
  EXPECT_GT(p.rounds, 1);
  ASSERT_EQ(static_cast<long>(folded.size()), p.runs);
  EXPECT_EQ(firsts.front(), 0u);
  mc.runs = static_cast<int>(p.runs);
  const std::vector<RunResult> once = RunMonteCarlo(sim, mc, nullptr);
  ASSERT_EQ(once.size(), folded.size());
  for (size_t i = 0; i < once.size(); ++i) {
    ASSERT_EQ(once[i].completion_step, folded[i]) << i;
  }
}

TEST(MonteCarloTest, RunToPrecisionStopsAtTheCap) {
  const Plan plan = testing_plans::SingleCellPlan(8.0, 2.0, 11.0, 13.0, 60, 2, 6);
  const Simulator sim(plan);
  MonteCarloOptions mc;
  mc.runs = 40;
  long folded = 0;
  const PrecisionResult p =
      RunToPrecision(sim, mc, 0.8, 1e-9, 100, nullptr,
                     [&](uint64_t, const std::vector<std::vector<RunResult>>& chunk) {
                       folded += static_cast<long>(chunk[0].size());
                     });
  EXPECT_FALSE(p.target_met);
  EXPECT_EQ(p.runs, 100);
  EXPECT_EQ(folded, 100);
}

}  // namespace
}  // namespace planner
