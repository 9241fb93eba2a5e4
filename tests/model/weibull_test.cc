// Weibull distribution against the reference implementation in Boost.Math
// (boost::math::weibull_distribution; Boost's shape is k, scale is A).
#include "planner/weibull.h"

#include <gtest/gtest.h>

#include <boost/math/distributions/weibull.hpp>

namespace planner {
namespace {

struct WeibullCase {
  double a_ms, k;
};

class WeibullTest : public ::testing::TestWithParam<WeibullCase> {};

TEST_P(WeibullTest, CdfMatchesBoostMath) {
  const Weibull w{GetParam().a_ms, GetParam().k};
  const boost::math::weibull_distribution<double> ref(w.shape, w.scale_ms);
  for (double v : {0.1, 1.0, 3.0, 7.5, 11.0, 18.0, 25.0, 35.0}) {
    EXPECT_NEAR(WeibullCdf(w, v), boost::math::cdf(ref, v), 1e-14) << "v=" << v;
  }
}

TEST_P(WeibullTest, QuantileMatchesBoostMath) {
  const Weibull w{GetParam().a_ms, GetParam().k};
  const boost::math::weibull_distribution<double> ref(w.shape, w.scale_ms);
  for (double p : {1e-6, 0.01, 0.1, 0.5, 0.9, 0.999, 1 - 1e-9}) {
    EXPECT_NEAR(WeibullQuantile(w, p), boost::math::quantile(ref, p),
                1e-10 * boost::math::quantile(ref, p))
        << "p=" << p;
  }
}

TEST_P(WeibullTest, MeanMatchesGammaFormula) {
  const Weibull w{GetParam().a_ms, GetParam().k};
  const boost::math::weibull_distribution<double> ref(w.shape, w.scale_ms);
  EXPECT_NEAR(WeibullMean(w), boost::math::mean(ref), 1e-12 * boost::math::mean(ref));
}

TEST_P(WeibullTest, BinProbabilityIsCdfDifference) {
  const Weibull w{GetParam().a_ms, GetParam().k};
  const boost::math::weibull_distribution<double> ref(w.shape, w.scale_ms);
  EXPECT_NEAR(WeibullBinProbability(w, 11.0, 12.0),
              boost::math::cdf(ref, 12.0) - boost::math::cdf(ref, 11.0), 1e-14);
  EXPECT_EQ(WeibullBinProbability(w, 12.0, 11.0), 0.0);
}

// Typical hub-height climates (common practice: k between 1.5 and 3).
INSTANTIATE_TEST_SUITE_P(HubHeightClimates, WeibullTest,
                         ::testing::Values(WeibullCase{6.8, 1.7}, WeibullCase{9.6, 2.2},
                                           WeibullCase{11.3, 2.9},
                                           WeibullCase{4.0, 1.2}));

}  // namespace
}  // namespace planner
