#include "planner/decision.h"

#include <gtest/gtest.h>

#include <cmath>

namespace planner {
namespace {

RunResult Completed(int64_t step) {
  RunResult r;
  r.completion_step = step;
  r.simulated_steps = step;
  return r;
}

// Paired differences from hand-made runs: every number is checked by hand.
TEST(DecisionTest, PairedDifferenceUsesRunsWhereBothCompleted) {
  const std::vector<RunResult> a = {Completed(1008), Completed(2016), Completed(3024),
                                    Completed(-1)};
  const std::vector<RunResult> b = {Completed(2016), Completed(2016), Completed(5040),
                                    Completed(1008)};
  const PairedDifference d = PairedCompletionDifference("A", a, "B", b);
  EXPECT_EQ(d.pairs, 3);
  // Differences b - a in weeks: 1, 0, 2 -> mean 1, sd 1, se 1/sqrt(3).
  EXPECT_DOUBLE_EQ(d.mean_weeks, 1.0);
  EXPECT_NEAR(d.se_weeks, 1.0 / std::sqrt(3.0), 1e-12);
  // A sooner in runs 0 and 2; run 3: A incomplete, B complete -> B sooner.
  EXPECT_DOUBLE_EQ(d.p_a_sooner, 0.5);
}

TEST(DecisionTest, CostIsWeeklyTimesWeeksPlusMobilisation) {
  CostModel cost;
  cost.weekly = 12000;
  cost.mobilisation = 90000;
  EXPECT_DOUBLE_EQ(CampaignCost(cost, 40.5), 12000 * 40.5 + 90000);
}

TEST(DecisionTest, RankingOrdersByTheChosenQuantileAndCost) {
  ScenarioResult fast, slow;
  fast.name = "fast";
  slow.name = "slow";
  fast.summary.p80.value = 30;
  slow.summary.p80.value = 40;
  fast.cost.weekly = 20000;  // expensive per week
  slow.cost.weekly = 10000;
  const std::vector<std::vector<RunResult>> runs = {{Completed(30 * 1008)},
                                                    {Completed(40 * 1008)}};
  const Comparison by_p80 = RankScenarios({slow, fast}, {runs[1], runs[0]}, RankBy::kP80);
  EXPECT_EQ(by_p80.ranked[0].name, "fast");
  ASSERT_TRUE(by_p80.best_two);
  EXPECT_EQ(by_p80.best_two->a, "fast");
  EXPECT_DOUBLE_EQ(by_p80.best_two->mean_weeks, 10.0);
  const Comparison by_cost = RankScenarios({fast, slow}, runs, RankBy::kExpectedCost);
  EXPECT_EQ(by_cost.ranked[0].name, "slow");  // 400k against 600k
  EXPECT_DOUBLE_EQ(by_cost.ranked[0].expected_cost, 400000.0);
  EXPECT_DOUBLE_EQ(*by_cost.ranked[1].cost_p80, 600000.0);
}

TEST(DecisionTest, ShiftStartMovesDeadlineAndPlannedOutagesAlike) {
  Plan p;
  p.start = Date{2027, 3, 1};
  p.deadline = Date{2028, 3, 1};
  PlannedOutage o;
  o.from = Date{2027, 6, 14};
  o.to = Date{2027, 6, 21};
  p.planned_outages = {o};
  const Plan q = ShiftStart(p, Date{2027, 10, 1});
  EXPECT_EQ(DaysBetween(q.start, q.deadline), DaysBetween(p.start, p.deadline));
  EXPECT_EQ(DaysBetween(q.start, q.planned_outages[0].from),
            DaysBetween(p.start, p.planned_outages[0].from));
  EXPECT_TRUE(q.start == (Date{2027, 10, 1}));
}

}  // namespace
}  // namespace planner
