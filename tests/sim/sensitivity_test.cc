// What relaxing a cell buys is computed from the same runs. Because every run
// draws the same random numbers whatever the matrix asks (common random
// numbers), re-simulating with the cell optional, or with its minimum
// lowered, must give exactly the completion times computed from the first
// runs: an exact property of the method, not a statistical one.
#include <gtest/gtest.h>

#include <cmath>

#include "planner/decision.h"
#include "planner/forecast.h"
#include "planner/monte_carlo.h"
#include "planner/simulation.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

using testing_plans::ThreeCellPlan;

ForecastSummary Forecast(const Plan& plan, std::vector<RunResult>* runs_out = nullptr) {
  const Simulator sim(plan);
  MonteCarloOptions mc;
  mc.runs = 300;
  mc.seed = 99;
  const std::vector<RunResult> runs = RunMonteCarlo(sim, mc, nullptr);
  if (runs_out != nullptr) *runs_out = runs;
  return SummarizeForecast(plan.matrix, sim.deadline_steps(), sim.horizon_steps(), runs,
                           99, sim.relaxed_share());
}

TEST(SensitivityTest, OptionalSavingEqualsRerunWithTheCellOptional) {
  const Plan plan = ThreeCellPlan();
  const ForecastSummary base = Forecast(plan);
  for (int c = 0; c < 3; ++c) {
    Plan changed = plan;
    changed.matrix.cells[c].optional = true;
    const ForecastSummary rerun = Forecast(changed);
    ASSERT_TRUE(base.p50.value && rerun.p50.value && base.p80.value && rerun.p80.value);
    ASSERT_TRUE(base.cells[c].saved_p50_if_optional &&
                base.cells[c].saved_p80_if_optional);
    EXPECT_DOUBLE_EQ(*base.cells[c].saved_p50_if_optional,
                     *base.p50.value - *rerun.p50.value)
        << "cell " << c;
    EXPECT_DOUBLE_EQ(*base.cells[c].saved_p80_if_optional,
                     *base.p80.value - *rerun.p80.value)
        << "cell " << c;
  }
}

TEST(SensitivityTest, RelaxedSavingEqualsRerunWithTheLowerMinimum) {
  const Plan plan = ThreeCellPlan();
  const ForecastSummary base = Forecast(plan);
  ASSERT_DOUBLE_EQ(base.relaxed_share, 0.8);
  for (int c = 0; c < 3; ++c) {
    Plan changed = plan;
    changed.matrix.cells[c].required =
        static_cast<int>(std::ceil(0.8 * plan.matrix.cells[c].required));
    const ForecastSummary rerun = Forecast(changed);
    ASSERT_TRUE(base.cells[c].saved_p80_if_relaxed);
    EXPECT_DOUBLE_EQ(*base.cells[c].saved_p80_if_relaxed,
                     *base.p80.value - *rerun.p80.value)
        << "cell " << c;
    EXPECT_GE(*base.cells[c].saved_p80_if_relaxed, 0.0);
  }
}

TEST(SensitivityTest, BottleneckSentenceNamesTheCellAndTheSaving) {
  const Plan plan = ThreeCellPlan();
  const ForecastSummary s = Forecast(plan);
  ASSERT_GE(s.bottleneck_cell, 0);
  const std::string sentence = BottleneckSentence(plan.matrix, s);
  EXPECT_NE(sentence.find("The campaign waits mostly on " +
                          CellLabel(plan.matrix, plan.matrix.cells[s.bottleneck_cell])),
            std::string::npos)
      << sentence;
  EXPECT_NE(sentence.find("at P80"), std::string::npos) << sentence;
}

// The fill curve is the share of required cells full: 0 at week 0 (no cell
// can fill before its first records) and, in every run that completed, 1 from
// its completion week on; its median reaches 1 by the completion P50.
TEST(SensitivityTest, FillCurveRisesFromZeroToOne) {
  const Plan plan = ThreeCellPlan();
  const ForecastSummary s = Forecast(plan);
  ASSERT_FALSE(s.fill_curve.empty());
  EXPECT_EQ(s.fill_curve.front().p90, 0.0);
  for (size_t w = 1; w < s.fill_curve.size(); ++w) {
    EXPECT_GE(s.fill_curve[w].p50, s.fill_curve[w - 1].p50);
    EXPECT_LE(s.fill_curve[w].p10, s.fill_curve[w].p50);
    EXPECT_LE(s.fill_curve[w].p50, s.fill_curve[w].p90);
  }
  const size_t week_p50 = static_cast<size_t>(std::ceil(*s.p50.value));
  ASSERT_LT(week_p50, s.fill_curve.size());
  EXPECT_EQ(s.fill_curve[week_p50].p50, 1.0);
}

}  // namespace
}  // namespace planner
