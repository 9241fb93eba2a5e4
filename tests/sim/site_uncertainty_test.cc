// The site model's uncertainty (SiteModel::mean_speed_uncertainty_pct): one
// lognormal factor on every Weibull A per simulated campaign, from a stream
// of its own, and the split of the spread into weather and site model.
#include <gtest/gtest.h>

#include <boost/math/distributions/lognormal.hpp>
#include <cmath>
#include <vector>

#include "planner/forecast.h"
#include "planner/hold_ups.h"
#include "planner/monte_carlo.h"
#include "planner/simulation.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

// One cell that never fills, so that every run lasts to the horizon.
Plan EndlessPlan(double uncertainty_pct) {
  Plan plan = testing_plans::SingleCellPlan(8.0, 2.0, 6.0, 8.0, 100000000, 7, 4);
  plan.site.wind_persistence_h = 12;
  plan.site.mean_speed_uncertainty_pct = uncertainty_pct;
  return plan;
}

// The factor has mean 1 and the stated standard deviation: the lognormal
// with sigma^2 = ln(1 + cv^2) and mu = -sigma^2 / 2 (checked against
// Boost.Math's lognormal moments), and the sample of per-run factors over
// 2,000 runs matches both within 4 standard errors.
TEST(SiteUncertaintyTest, EachRunDrawsOneFactorWithMeanOneAndTheStatedSpread) {
  const double cv = 0.10;
  const double s2 = std::log1p(cv * cv);
  const boost::math::lognormal_distribution<double> law(-0.5 * s2, std::sqrt(s2));
  EXPECT_NEAR(boost::math::mean(law), 1.0, 1e-12);
  EXPECT_NEAR(boost::math::standard_deviation(law), cv, 1e-12);

  const Simulator with(EndlessPlan(10.0)), exact(EndlessPlan(0.0));
  const int runs = 2000;
  double sum = 0, sum2 = 0;
  for (int run = 0; run < runs; ++run) {
    RunResult a, b;
    with.Run(3, run, &a);
    exact.Run(3, run, &b);
    ASSERT_EQ(a.simulated_steps, b.simulated_steps);
    // Every speed of the run is scaled by the same factor: the sums'
    // ratio is the factor (the weather's draws are the same).
    const double f = a.speed_sum_ms / b.speed_sum_ms;
    sum += f;
    sum2 += f * f;
    if (run < 20) {
      RunResult c;
      exact.Run(3, run, &c);
      EXPECT_EQ(c.speed_sum_ms, b.speed_sum_ms);
    }
  }
  const double mean = sum / runs;
  const double sd = std::sqrt((sum2 / runs - mean * mean) * runs / (runs - 1));
  EXPECT_NEAR(mean, 1.0, 4.0 * cv / std::sqrt(runs));
  // Standard error of a sample standard deviation, sigma / sqrt(2 (n - 1)),
  // for a near-normal law (a lognormal this narrow is).
  EXPECT_NEAR(sd, cv, 4.0 * cv / std::sqrt(2.0 * (runs - 1)));
}

// Taken as exact (SimulationOptions::site_uncertainty false), a plan with a
// stated uncertainty runs exactly as the same plan without it.
TEST(SiteUncertaintyTest, TakenAsExactRunsAsWithoutTheField) {
  SimulationOptions exact;
  exact.site_uncertainty = false;
  const Simulator stated(EndlessPlan(8.0), exact), none(EndlessPlan(0.0));
  for (uint64_t run = 0; run < 5; ++run) {
    RunResult a, b;
    stated.Run(9, run, &a);
    none.Run(9, run, &b);
    EXPECT_EQ(a.speed_sum_ms, b.speed_sum_ms);
    EXPECT_EQ(a.count_at_end, b.count_at_end);
  }
}

// The split: without a stated uncertainty there is none; with one, the
// "site model exact" forecast is the plan's forecast without the field.
TEST(SiteUncertaintyTest, SplitOnlyWithAStatedUncertainty) {
  MonteCarloOptions mc;
  mc.runs = 200;
  mc.seed = 5;
  Plan plan = testing_plans::ThreeCellPlan();
  EXPECT_FALSE(ForecastSiteModelExact(plan, {}, mc, nullptr));
  plan.site.mean_speed_uncertainty_pct = 6;
  const std::optional<SiteModelSpread> e = ForecastSiteModelExact(plan, {}, mc, nullptr);
  ASSERT_TRUE(e);
  EXPECT_EQ(e->mean_speed_uncertainty_pct, 6);
  Plan none = plan;
  none.site.mean_speed_uncertainty_pct = 0;
  const std::vector<RunResult> runs = RunMonteCarlo(Simulator(none), mc, nullptr);
  const Simulator sim(none);
  const ForecastSummary direct =
      SummarizeForecast(none.matrix, sim.deadline_steps(), sim.horizon_steps(), runs,
                        mc.seed);
  EXPECT_EQ(e->p80.value, direct.p80.value);
  EXPECT_EQ(e->p50.value, direct.p50.value);
}

}  // namespace
}  // namespace planner
