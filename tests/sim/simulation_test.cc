#include "planner/simulation.h"

#include <gtest/gtest.h>

#include <algorithm>
#include <boost/math/distributions/negative_binomial.hpp>
#include <cmath>
#include <vector>

#include "planner/forecast.h"
#include "planner/monte_carlo.h"
#include "planner/quantile.h"
#include "planner/weibull.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

using testing_plans::Outages;
using testing_plans::SingleCellPlan;

std::vector<RunResult> Simulate(const Plan& plan, int runs, uint64_t seed,
                                int threads = 2) {
  const Simulator sim(plan);
  MonteCarloOptions mc;
  mc.runs = runs;
  mc.seed = seed;
  mc.threads = threads;
  return RunMonteCarlo(sim, mc, nullptr);
}

// With independent records and one cell of probability p per record, the
// records needed for n counts are n plus a negative binomial (n, p) number of
// failures (DESIGN.md sanity anchor; Boost.Math negative_binomial_distribution
// is the reference). Checked three ways: the mean within 4 standard errors,
// the empirical CDF at several points within 4 binomial standard errors, and
// the exact quantiles inside the distribution-free 99.9 % intervals.
TEST(SimulationTest, IndependentRecordsGiveNegativeBinomialCompletion) {
  const double a = 8.0, k = 2.0, lo = 11.0, hi = 13.0;
  const int n = 40;
  const Plan plan = SingleCellPlan(a, k, lo, hi, n);
  const double p = WeibullBinProbability(plan.site.sectors[0].weibull, lo, hi);
  const boost::math::negative_binomial_distribution<double> nb(n, p);
  const int runs = 4000;
  const std::vector<RunResult> results = Simulate(plan, runs, 2027);

  std::vector<double> steps;
  for (const RunResult& r : results) {
    ASSERT_GT(r.completion_step, 0);
    steps.push_back(static_cast<double>(r.completion_step));
  }
  std::sort(steps.begin(), steps.end());
  double mean = 0;
  for (double s : steps) mean += s;
  mean /= runs;
  const double sd = std::sqrt(n * (1 - p)) / p;
  EXPECT_NEAR(mean, n / p, 4 * sd / std::sqrt(runs));

  for (double q : {0.1, 0.25, 0.5, 0.75, 0.9}) {
    const double t = n + boost::math::quantile(nb, q);
    const double f = boost::math::cdf(nb, std::floor(t) - n);
    const double empirical =
        static_cast<double>(std::upper_bound(steps.begin(), steps.end(), std::floor(t)) -
                            steps.begin()) /
        runs;
    EXPECT_NEAR(empirical, f, 4 * std::sqrt(f * (1 - f) / runs)) << "t=" << t;
  }
  for (double q : {0.1, 0.5, 0.8, 0.9}) {
    // Smallest t with P(T <= t) >= q: the exact q-quantile of the discrete T.
    double t = n;
    while (boost::math::cdf(nb, t - n) < q) t += 1;
    const QuantileEstimate est = EstimateQuantile(steps, q, 0.999);
    ASSERT_TRUE(est.ci_lo && est.ci_hi);
    EXPECT_LE(*est.ci_lo, t) << "q=" << q;
    EXPECT_GE(*est.ci_hi, t) << "q=" << q;
  }
}

// Mean count at the deadline = sum over records of P(turbine up) x P(DAQ up) x
// (1 - reject) x sum_s f_s (valid share of s) P_s(bin). With exponential
// outages starting up, P(up at t) = A + (1 - A) exp(-c t) (two-state Markov
// chain, reliability textbooks); A = MTBF / (MTBF + MTTR). Weather starts in
// its stationary state, so the sector and speed marginals hold at every step
// despite persistence. Tolerance: 4 standard errors across runs.
TEST(SimulationTest, MeanCountAtDeadlineIsRecordsTimesProbabilities) {
  Plan plan = SingleCellPlan(9.0, 2.0, 6.0, 9.0, 100000, 70, 12);
  plan.site.sectors = {Sector{0.25, Weibull{7.0, 1.8}}, Sector{0.35, Weibull{9.5, 2.2}},
                       Sector{0.40, Weibull{8.0, 2.0}}};  // 120-degree sectors
  plan.site.sector_persistence = 0.95;
  plan.site.wind_persistence_h = 24.0;
  plan.valid_sectors = {AngleRange{300, 0}};          // half of sector 0 (300..60)
  plan.valid_sectors.push_back(AngleRange{60, 180});  // all of sector 1
  plan.turbine_outages = Outages(200.0, 40.0);
  plan.daq_outages = Outages(500.0, 20.0);
  plan.quality_reject_fraction = 0.05;
  const int runs = 600;
  const std::vector<RunResult> results = Simulate(plan, runs, 4242);

  const double cell_p =
      0.25 * 0.5 * WeibullBinProbability(plan.site.sectors[0].weibull, 6, 9) +
      0.35 * 1.0 * WeibullBinProbability(plan.site.sectors[1].weibull, 6, 9);
  const int64_t records = 70 * 144;
  // P(both up at t) = product (independent processes): sum term by term.
  double expected = 0;
  for (int64_t t = 0; t < records; ++t) {
    const double at =
        200.0 / 240.0 + (40.0 / 240.0) * std::exp(-t * (1 / 1200.0 + 1 / 240.0));
    const double ad =
        500.0 / 520.0 + (20.0 / 520.0) * std::exp(-t * (1 / 3000.0 + 1 / 120.0));
    expected += at * ad;
  }
  expected *= 0.95 * cell_p;

  double mean = 0, var = 0;
  for (const RunResult& r : results) mean += r.count_at_deadline[0];
  mean /= runs;
  for (const RunResult& r : results) var += std::pow(r.count_at_deadline[0] - mean, 2);
  var /= runs - 1;
  EXPECT_NEAR(mean, expected, 4 * std::sqrt(var / runs));
}

TEST(SimulationTest, SameSeedSameResultsForAnyThreadCount) {
  Plan plan = SingleCellPlan(8.0, 2.0, 10.0, 12.0, 30, 7, 8);
  plan.site.wind_persistence_h = 30;
  plan.site.sector_persistence = 0.97;
  plan.turbine_outages = Outages(300, 30);
  const std::vector<RunResult> one = Simulate(plan, 64, 5, 1);
  const std::vector<RunResult> two = Simulate(plan, 64, 5, 2);
  const std::vector<RunResult> three = Simulate(plan, 64, 5, 3);
  for (size_t i = 0; i < one.size(); ++i) {
    EXPECT_EQ(one[i].completion_step, two[i].completion_step);
    EXPECT_EQ(one[i].completion_step, three[i].completion_step);
    EXPECT_EQ(one[i].count_at_deadline, two[i].count_at_deadline);
    EXPECT_EQ(one[i].full_step, three[i].full_step);
  }
  // And a different seed gives a different campaign.
  const std::vector<RunResult> other = Simulate(plan, 64, 6, 2);
  int differ = 0;
  for (size_t i = 0; i < one.size(); ++i)
    differ += one[i].completion_step != other[i].completion_step;
  EXPECT_GT(differ, 32);
}

TEST(SimulationTest, UnreachableCellNeverCompletesAndRunStopsAtHorizon) {
  // A cell above cut-out can never see production.
  Plan plan = SingleCellPlan(8.0, 2.0, 30.0, 31.0, 5, 3, 2);
  plan.turbine.cut_out_ms = 25.0;
  plan.turbine.restart_ms = 22.0;
  const std::vector<RunResult> results = Simulate(plan, 8, 1);
  for (const RunResult& r : results) {
    EXPECT_EQ(r.completion_step, -1);
    EXPECT_EQ(r.simulated_steps, 2 * kStepsPerWeek);
    EXPECT_EQ(r.count_at_end[0], 0u);
  }
}

TEST(SimulationTest, RunContinuesToDeadlineAfterCompletion) {
  const Plan plan = SingleCellPlan(8.0, 2.0, 2.0, 20.0, 3, 10, 4);
  const std::vector<RunResult> results = Simulate(plan, 4, 3);
  for (const RunResult& r : results) {
    EXPECT_GT(r.completion_step, 0);
    EXPECT_LT(r.completion_step, 144);
    EXPECT_EQ(r.simulated_steps, 10 * 144);
    EXPECT_EQ(r.count_at_deadline[0], r.count_at_end[0]);
    EXPECT_EQ(r.last_cell, 0);
  }
}

}  // namespace
}  // namespace planner
