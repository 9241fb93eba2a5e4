#include "sim/weather_process.h"

#include <gtest/gtest.h>

#include <algorithm>
#include <boost/math/distributions/normal.hpp>
#include <boost/math/distributions/weibull.hpp>
#include <boost/random/normal_distribution.hpp>
#include <cmath>
#include <vector>

#include "planner/random_stream.h"

namespace planner {
namespace {

// Sample autocorrelation at lag k.
double Autocorrelation(const std::vector<double>& x, int k) {
  double mean = 0;
  for (double v : x) mean += v;
  mean /= x.size();
  double num = 0, den = 0;
  for (size_t i = 0; i < x.size(); ++i) {
    den += (x[i] - mean) * (x[i] - mean);
    if (i + k < x.size()) num += (x[i] - mean) * (x[i + k] - mean);
  }
  return num / den;
}

// Lag-k autocorrelation of the latent AR(1) is phi^k (Brown, Katz & Murphy
// 1984; any time-series textbook, e.g. Box & Jenkins). Tolerance: 4 standard
// errors of the sample autocorrelation of an AR(1) (Bartlett's formula,
// var r_k ~ [(1+phi^2)(1-phi^2k)/(1-phi^2) - 2k phi^2k] / N).
TEST(WeatherProcessTest, LatentAr1LagAutocorrelationIsPhiToTheK) {
  const LatentAr1 ar(2.0);  // tau = 2 h -> phi = exp(-1/12)
  ASSERT_NEAR(ar.phi, std::exp(-1.0 / 12.0), 1e-15);
  Engine engine = MakeRunEngine(7, 0);
  boost::random::normal_distribution<double> normal;
  const int n = 400000;
  std::vector<double> z(n);
  z[0] = normal(engine);
  for (int i = 1; i < n; ++i) z[i] = ar.Next(z[i - 1], normal(engine));
  for (int k : {1, 6, 24, 72}) {
    const double phi2 = ar.phi * ar.phi, phi2k = std::pow(ar.phi, 2 * k);
    const double var = ((1 + phi2) * (1 - phi2k) / (1 - phi2) - 2 * k * phi2k) / n;
    EXPECT_NEAR(Autocorrelation(z, k), std::pow(ar.phi, k), 4 * std::sqrt(var))
        << "lag " << k;
  }
}

// Jumping the AR(1) k steps at once is exact for a Gaussian AR(1):
// x_{t+k} | x_t ~ N(phi^k x_t, 1 - phi^2k) (Box & Jenkins). Checked two ways:
// the jump's coefficients against pow(), and the sample correlation of
// (x, jumped x) against phi^k within 4 standard errors ((1 - rho^2)/sqrt(n)).
TEST(WeatherProcessTest, Ar1SkipperJumpsExactlyKSteps) {
  const double tau_h = 6.0;
  const Ar1Skipper skip(tau_h);
  const double phi = Ar1Phi(tau_h);
  for (int64_t k : {0, 1, 5, 36, 1023, 1024, 5000}) {
    const double p = std::pow(phi, static_cast<double>(k));
    EXPECT_NEAR(skip.Advance(1.0, k, 0.0), p, 1e-12) << k;
    EXPECT_NEAR(skip.Advance(0.0, k, 1.0), std::sqrt(1 - p * p), 1e-12) << k;
  }
  Engine engine = MakeRunEngine(3, 3);
  boost::random::normal_distribution<double> normal;
  const int n = 200000;
  for (int64_t k : {6, 72}) {
    double sxy = 0, sxx = 0, syy = 0;
    for (int i = 0; i < n; ++i) {
      const double x = normal(engine);
      const double y = skip.Advance(x, k, normal(engine));
      sxy += x * y, sxx += x * x, syy += y * y;
    }
    const double rho = std::pow(phi, static_cast<double>(k));
    EXPECT_NEAR(sxy / std::sqrt(sxx * syy), rho, 4 * (1 - rho * rho) / std::sqrt(n)) << k;
  }
}

TEST(WeatherProcessTest, ZeroTimeScaleGivesIndependentRecords) {
  const LatentAr1 ar(0.0);
  EXPECT_EQ(ar.phi, 0.0);
  EXPECT_EQ(ar.innovation, 1.0);
  const Ar1Skipper skip(0.0);
  EXPECT_EQ(skip.Advance(2.0, 1, 0.5), 0.5);  // nothing kept after one step
}

// The chain keeps its sector with probability r, else draws from the
// frequencies, so the frequencies are its stationary distribution. The
// indicator of a sector then has lag-k autocorrelation r^k, which inflates the
// variance of its mean by (1 + r) / (1 - r); tolerance 4 such standard errors.
TEST(WeatherProcessTest, SectorChainVisitsSectorsAtTheirFrequencies) {
  const std::vector<double> freq = {0.04, 0.05, 0.07, 0.08, 0.06, 0.05,
                                    0.08, 0.12, 0.15, 0.13, 0.10, 0.07};
  SectorChain chain;
  chain.keep_probability = 0.9;
  chain.frequencies = AliasTable(freq);
  Engine engine = MakeRunEngine(11, 0);
  const int n = 1000000;
  std::vector<long> visits(freq.size(), 0);
  int s = chain.frequencies.Draw(UniformDouble(engine));
  for (int i = 0; i < n; ++i) {
    s = chain.Next(s, UniformDouble(engine), UniformDouble(engine));
    ++visits[s];
  }
  const double inflation = (1 + 0.9) / (1 - 0.9);
  for (size_t i = 0; i < freq.size(); ++i) {
    const double se = std::sqrt(freq[i] * (1 - freq[i]) / n * inflation);
    EXPECT_NEAR(static_cast<double>(visits[i]) / n, freq[i], 4 * se) << "sector " << i;
  }
}

// The tabulated normal-to-Weibull map equals the exact composition
// Weibull^-1(Phi(z)) computed with Boost.Math's normal and weibull
// distributions, to the documented accuracy: relative 1e-4 above 1 % of A,
// absolute 1e-6 A below (speeds that far under cut-in count for no cell).
TEST(WeatherProcessTest, SpeedTransformMatchesBoostWeibullOfNormal) {
  const boost::math::normal_distribution<double> normal;
  for (double k : {1.4, 2.0, 2.6}) {
    const SpeedTransform table(k);
    const boost::math::weibull_distribution<double> weibull(k, 1.0);
    for (double z = -6.0; z <= 6.0; z += 0.0371) {
      const double p = boost::math::cdf(normal, z);
      const double ref =
          (p < 0.5) ? boost::math::quantile(weibull, p)
                    : boost::math::quantile(boost::math::complement(
                          weibull, boost::math::cdf(boost::math::complement(normal, z))));
      EXPECT_NEAR(table(z), ref, 1e-4 * std::max(ref, 0.01)) << "k=" << k << " z=" << z;
    }
  }
}

}  // namespace
}  // namespace planner
