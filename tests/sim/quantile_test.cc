// Sample quantiles and their distribution-free confidence intervals.
//
// References:
//  - Definition of the estimate: the inverse of the empirical distribution
//    function, X_(ceil(n p)) (Hyndman & Fan 1996, "Sample quantiles in
//    statistical packages", definition 1; from memory).
//  - Interval: [X_(l), X_(u)] covers the true p-quantile of a continuous law
//    with probability P(l <= B <= u - 1), B ~ binomial(n, p) (order-statistic
//    interval, e.g. Hahn & Meeker 1991, ch. 5; from memory). Every binomial
//    probability below comes from Boost.Math, the reference library.
#include "planner/quantile.h"

#include <gtest/gtest.h>

#include <algorithm>
#include <boost/math/distributions/binomial.hpp>
#include <boost/math/distributions/exponential.hpp>
#include <boost/random/exponential_distribution.hpp>
#include <boost/random/mersenne_twister.hpp>
#include <cmath>
#include <limits>
#include <vector>

namespace planner {
namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();

// P(Bin(n, p) <= k) from Boost.Math, with F(k < 0) = 0 and F(k >= n) = 1.
double BinCdf(long n, double p, long k) {
  if (k < 0) return 0.0;
  if (k >= n) return 1.0;
  return boost::math::cdf(boost::math::binomial_distribution<double>(n, p),
                          static_cast<double>(k));
}

struct RankCase {
  long n;
  double p;
  double confidence;
};

class QuantileRankTableTest : public ::testing::TestWithParam<RankCase> {};

TEST_P(QuantileRankTableTest, CoversAndIsTightestEqualTailedChoice) {
  const RankCase c = GetParam();
  const RankInterval r = QuantileRankInterval(c.n, c.p, c.confidence);
  const double tail = (1.0 - c.confidence) / 2.0;
  SCOPED_TRACE(::testing::Message()
               << "n=" << c.n << " p=" << c.p << " lo=" << r.lo << " hi=" << r.hi);

  ASSERT_GE(r.lo, 0);
  ASSERT_LE(r.hi, c.n + 1);
  ASSERT_LT(r.lo, r.hi);

  // Coverage of [X_(l), X_(u)]: P(l <= B <= u - 1) >= confidence.
  const double coverage = BinCdf(c.n, c.p, r.hi - 1) - BinCdf(c.n, c.p, r.lo - 1);
  EXPECT_GE(coverage, c.confidence - 1e-12);

  // Each tail within its half of the error budget...
  EXPECT_LE(BinCdf(c.n, c.p, r.lo - 1), tail + 1e-12);
  EXPECT_GE(BinCdf(c.n, c.p, r.hi - 1), 1.0 - tail - 1e-12);
  // ...and neither bound can move inwards by one rank without breaking it.
  if (r.lo < c.n) {
    EXPECT_GT(BinCdf(c.n, c.p, r.lo), tail);
  }
  if (r.hi > 1) {
    EXPECT_LT(BinCdf(c.n, c.p, r.hi - 2), 1.0 - tail);
  }
}

INSTANTIATE_TEST_SUITE_P(
    QuantileCases, QuantileRankTableTest,
    ::testing::Values(
        RankCase{1, 0.5, 0.95}, RankCase{5, 0.5, 0.95}, RankCase{10, 0.1, 0.95},
        RankCase{10, 0.9, 0.95}, RankCase{20, 0.5, 0.95}, RankCase{50, 0.05, 0.95},
        RankCase{100, 0.5, 0.95}, RankCase{100, 0.9, 0.95}, RankCase{200, 0.8, 0.95},
        RankCase{500, 0.1, 0.95}, RankCase{1000, 0.5, 0.95}, RankCase{2000, 0.9, 0.95},
        RankCase{4000, 0.8, 0.95}, RankCase{20000, 0.9, 0.95},
        RankCase{100000, 0.5, 0.95}, RankCase{300, 0.5, 0.90}, RankCase{300, 0.9, 0.99}));

TEST(QuantileRankIntervalTest, MedianOfHundredUsesRanks40And61) {
  // Textbook value for the 95 % interval of the median with n = 100: the
  // 40th and 61st order statistics (tables of median confidence intervals,
  // e.g. Conover, Practical Nonparametric Statistics; from memory).
  const RankInterval r = QuantileRankInterval(100, 0.5, 0.95);
  EXPECT_EQ(r.lo, 40);
  EXPECT_EQ(r.hi, 61);
}

TEST(QuantileRankIntervalTest, FiveSamplesGiveNoBoundsForTheMedian) {
  // By hand: P(B <= 0) = P(B >= 5) = 1/32 = 0.03125 > 0.025 for B ~ Bin(5, 1/2),
  // so neither the smallest nor the largest sample is a 95 % bound.
  const RankInterval r = QuantileRankInterval(5, 0.5, 0.95);
  EXPECT_EQ(r.lo, 0);
  EXPECT_EQ(r.hi, 6);
}

TEST(QuantileEstimateTest, PointEstimateIsTypeOneOrderStatistic) {
  // X_(ceil(n p)) of 1..10 (Hyndman & Fan definition 1; from memory).
  std::vector<double> x;
  for (int i = 1; i <= 10; ++i) x.push_back(i);
  struct {
    double p;
    double expected;
  } cases[] = {{0.05, 1}, {0.1, 1}, {0.15, 2}, {0.3, 3},   {0.5, 5},
               {0.7, 7},  {0.8, 8}, {0.9, 9},  {0.91, 10}, {0.99, 10}};
  for (const auto& c : cases) {
    SCOPED_TRACE(c.p);
    const QuantileEstimate q = EstimateQuantile(x, c.p);
    EXPECT_DOUBLE_EQ(q.p, c.p);
    ASSERT_TRUE(q.value.has_value());
    EXPECT_DOUBLE_EQ(*q.value, c.expected);
  }
}

TEST(QuantileEstimateTest, WholeRankIsNotRoundedUpByFloatingPoint) {
  // In exact arithmetic 100 x 0.07 = 7 and 100 x 0.14 = 14, so the estimates
  // are X_(7) and X_(14); in doubles the products come out just above.
  std::vector<double> x;
  for (int i = 1; i <= 100; ++i) x.push_back(i);
  EXPECT_EQ(EstimateQuantile(x, 0.07).value, 7.0);
  EXPECT_EQ(EstimateQuantile(x, 0.14).value, 14.0);
  EXPECT_EQ(EstimateQuantile(x, 0.29).value, 29.0);
}

TEST(QuantileEstimateTest, IntervalIsTheOrderStatisticsOfTheRanks) {
  std::vector<double> x;
  for (int i = 1; i <= 100; ++i) x.push_back(10.0 * i);
  const QuantileEstimate q = EstimateQuantile(x, 0.5);
  // Ranks 40 and 61 (see MedianOfHundredUsesRanks40And61).
  ASSERT_TRUE(q.ci_lo && q.ci_hi);
  EXPECT_DOUBLE_EQ(*q.ci_lo, 400.0);
  EXPECT_DOUBLE_EQ(*q.ci_hi, 610.0);
}

TEST(QuantileEstimateTest, OpenBoundsAreEmpty) {
  const std::vector<double> x = {1, 2, 3, 4, 5};
  const QuantileEstimate q = EstimateQuantile(x, 0.5);
  EXPECT_EQ(q.value, 3.0);
  EXPECT_FALSE(q.ci_lo.has_value());  // rank 0
  EXPECT_FALSE(q.ci_hi.has_value());  // rank 6
}

TEST(QuantileEstimateTest, IncompleteRunsAreNotReached) {
  // 100 samples, the top 15 of them +infinity (runs that never finished).
  std::vector<double> x;
  for (int i = 1; i <= 85; ++i) x.push_back(i);
  for (int i = 0; i < 15; ++i) x.push_back(kInf);

  const QuantileEstimate p50 = EstimateQuantile(x, 0.5);
  ASSERT_TRUE(p50.value && p50.ci_lo && p50.ci_hi);
  EXPECT_DOUBLE_EQ(*p50.value, 50.0);

  // P80: rank 80 is finite, but its upper bound is a higher rank; take it from
  // the ranks so this test follows the binomial, not our code.
  const RankInterval r80 = QuantileRankInterval(100, 0.8);
  const QuantileEstimate p80 = EstimateQuantile(x, 0.8);
  ASSERT_TRUE(p80.value.has_value());
  EXPECT_DOUBLE_EQ(*p80.value, 80.0);
  ASSERT_EQ(p80.ci_hi.has_value(), r80.hi <= 85);
  if (p80.ci_hi) {
    EXPECT_DOUBLE_EQ(*p80.ci_hi, static_cast<double>(r80.hi));
  }

  const RankInterval r90 = QuantileRankInterval(100, 0.9);
  const QuantileEstimate p90 = EstimateQuantile(x, 0.9);
  EXPECT_FALSE(p90.value.has_value());  // rank 90 is +inf
  EXPECT_FALSE(p90.ci_hi.has_value());  // and so is every rank above it
  ASSERT_EQ(p90.ci_lo.has_value(), r90.lo >= 1 && r90.lo <= 85);
  if (p90.ci_lo) {
    EXPECT_DOUBLE_EQ(*p90.ci_lo, static_cast<double>(r90.lo));
  }

  const std::vector<double> none(7, kInf);
  const QuantileEstimate q = EstimateQuantile(none, 0.1);
  EXPECT_FALSE(q.value || q.ci_lo || q.ci_hi);
}

TEST(QuantileEstimateTest, CoversExponentialQuantilesFromFourThousandDraws) {
  // Draws from the unit exponential (Boost.Random, fixed seed). True
  // quantiles from Boost.Math. The tolerance on the point estimate is four
  // asymptotic standard errors of a sample quantile,
  // sqrt(p (1 - p) / n) / f(Q_p) (e.g. Serfling 1980, sec. 2.3; from memory).
  boost::random::mt19937 gen(20240611u);
  boost::random::exponential_distribution<double> law(1.0);
  const long n = 4000;
  std::vector<double> x(n);
  for (double& v : x) v = law(gen);
  std::sort(x.begin(), x.end());

  const boost::math::exponential_distribution<double> ref(1.0);
  for (double p : {0.1, 0.5, 0.8, 0.9}) {
    SCOPED_TRACE(p);
    const double truth = boost::math::quantile(ref, p);
    const QuantileEstimate q = EstimateQuantile(x, p);
    ASSERT_TRUE(q.value && q.ci_lo && q.ci_hi);
    EXPECT_LE(*q.ci_lo, truth);
    EXPECT_GE(*q.ci_hi, truth);
    EXPECT_LE(*q.ci_lo, *q.value);
    EXPECT_GE(*q.ci_hi, *q.value);
    const double se = std::sqrt(p * (1 - p) / n) / boost::math::pdf(ref, truth);
    EXPECT_NEAR(*q.value, truth, 4 * se);
  }
}

TEST(QuantileEstimateTest, CoverageOverRepeatedSamplesMatchesBinomial) {
  // 2,000 samples of n = 60 from the unit exponential; how often the interval
  // for P80 covers the true P80 must match the exact coverage from Boost.Math
  // within four binomial standard errors.
  const long n = 60, reps = 2000;
  const double p = 0.8;
  const double truth =
      boost::math::quantile(boost::math::exponential_distribution<>(1), p);
  const RankInterval r = QuantileRankInterval(n, p);
  const double exact = BinCdf(n, p, r.hi - 1) - BinCdf(n, p, r.lo - 1);

  boost::random::mt19937 gen(7u);
  boost::random::exponential_distribution<double> law(1.0);
  long covered = 0;
  std::vector<double> x(n);
  for (long rep = 0; rep < reps; ++rep) {
    for (double& v : x) v = law(gen);
    std::sort(x.begin(), x.end());
    const QuantileEstimate q = EstimateQuantile(x, p);
    // An open bound (no order statistic) counts as covering on that side.
    const bool lo_ok = !q.ci_lo || *q.ci_lo <= truth;
    const bool hi_ok = !q.ci_hi || *q.ci_hi >= truth;
    covered += (lo_ok && hi_ok) ? 1 : 0;
  }
  const double share = static_cast<double>(covered) / reps;
  const double se = std::sqrt(exact * (1 - exact) / reps);
  EXPECT_GE(exact, 0.95);
  EXPECT_NEAR(share, exact, 4 * se);
}

}  // namespace
}  // namespace planner
