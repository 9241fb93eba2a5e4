#include "sim/ziggurat_normal.h"

#include <gtest/gtest.h>

#include <algorithm>
#include <boost/math/distributions/normal.hpp>
#include <cmath>
#include <vector>

namespace planner {
namespace {

// The ziggurat draws follow the standard normal of Boost.Math: the
// Kolmogorov-Smirnov distance of 10^6 draws stays below the 0.1 % critical
// value 1.95 / sqrt(n) (Kolmogorov's asymptotic distribution), and the tail
// shares beyond 2 and 3.5 (where the slow path works) lie within 4 binomial
// standard errors of the exact ones.
TEST(ZigguratNormalTest, DrawsFollowTheStandardNormal) {
  const boost::math::normal_distribution<double> ref;
  Engine e = MakeRunEngine(314, 15);
  ZigguratNormal normal;
  const int n = 1000000;
  std::vector<double> x(n);
  for (double& v : x) v = normal(e);
  std::sort(x.begin(), x.end());
  double d = 0;
  for (int i = 0; i < n; ++i) {
    const double f = boost::math::cdf(ref, x[i]);
    d = std::max({d, f - static_cast<double>(i) / n, static_cast<double>(i + 1) / n - f});
  }
  EXPECT_LT(d, 1.95 / std::sqrt(n));
  for (double t : {2.0, 3.5}) {
    const double p = 2 * boost::math::cdf(boost::math::complement(ref, t));
    const long beyond =
        std::count_if(x.begin(), x.end(), [t](double v) { return std::abs(v) > t; });
    EXPECT_NEAR(static_cast<double>(beyond) / n, p, 4 * std::sqrt(p * (1 - p) / n)) << t;
  }
}

// The same checks for the 32-bit form the simulation uses (one 64-bit draw
// feeds a normal and two 16-bit decisions): low and high halves of the engine
// words both give standard normals.
TEST(ZigguratNormalTest, WordDrawsFollowTheStandardNormal) {
  const boost::math::normal_distribution<double> ref;
  Engine e = MakeRunEngine(2718, 28);
  const int n = 1000000;
  for (int shift : {0, 32}) {
    std::vector<double> x(n);
    for (double& v : x) v = ZigguratNormal::FromWord(static_cast<uint32_t>(e() >> shift));
    std::sort(x.begin(), x.end());
    double d = 0;
    for (int i = 0; i < n; ++i) {
      const double f = boost::math::cdf(ref, x[i]);
      d = std::max(
          {d, f - static_cast<double>(i) / n, static_cast<double>(i + 1) / n - f});
    }
    EXPECT_LT(d, 1.95 / std::sqrt(n)) << shift;
    for (double t : {2.0, 3.5}) {
      const double p = 2 * boost::math::cdf(boost::math::complement(ref, t));
      const long beyond =
          std::count_if(x.begin(), x.end(), [t](double v) { return std::abs(v) > t; });
      EXPECT_NEAR(static_cast<double>(beyond) / n, p, 4 * std::sqrt(p * (1 - p) / n))
          << shift << " " << t;
    }
  }
}

TEST(ZigguratNormalTest, SameEngineStateSameDraws) {
  Engine a = MakeRunEngine(1, 2), b = MakeRunEngine(1, 2);
  ZigguratNormal normal;
  for (int i = 0; i < 1000; ++i) ASSERT_EQ(normal(a), normal(b));
}

}  // namespace
}  // namespace planner
