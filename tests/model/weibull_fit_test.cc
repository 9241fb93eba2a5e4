// Weibull maximum-likelihood fit (model/weibull_fit.h): on the open Irish
// daily-wind data (tests/data/irish-daily-wind, README there) the estimate
// solves the likelihood equations, agrees with independent solvers built on
// Boost.Math's TOMS 748 root finder and with a brute-force grid; the KS
// distance matches a direct computation with Boost.Math's Weibull CDF; and
// samples drawn with Boost.Random from a known Weibull give back its
// parameters within their standard errors.
#include "model/weibull_fit.h"

#include <gtest/gtest.h>

#include <algorithm>
#include <boost/math/distributions/weibull.hpp>
#include <boost/math/tools/toms748_solve.hpp>
#include <boost/random/mersenne_twister.hpp>
#include <boost/random/weibull_distribution.hpp>
#include <cmath>
#include <cstdint>
#include <limits>
#include <string>
#include <vector>

#include "model/irish_wind_data.h"

namespace planner {
namespace {

constexpr double kCalmMs = 0.5;  // fit-site's default calm threshold

// A station's days split into observed speeds and calms (censored below
// kCalmMs), as fit-site does for data without seasons removed.
struct Sample {
  std::vector<double> observed;
  std::vector<double> below;
  std::vector<double> ln_observed, ln_below;  // their logarithms, for speed
};

void Add(Sample* s, double v) {
  std::vector<double>& to = v < kCalmMs ? s->below : s->observed;
  to.push_back(v < kCalmMs ? kCalmMs : v);
  (v < kCalmMs ? s->ln_below : s->ln_observed).push_back(std::log(to.back()));
}

Sample StationSample(const std::string& code) {
  Sample s;
  for (double v : irish_wind::SpeedsMs(code)) Add(&s, v);
  return s;
}

// The partial derivatives of the censored Weibull log-likelihood, written
// out here by hand from l(A, k) = sum ln f(x_i) + sum ln F(c_j), with
// f(x) = (k/A)(x/A)^(k-1) exp(-(x/A)^k) and F(c) = 1 - exp(-(c/A)^k).
struct Scores {
  double d_shape = 0.0;
  double d_scale = 0.0;
};

Scores ScoresAt(const Sample& s, double a_ms, double k) {
  Scores r;
  const double n = static_cast<double>(s.observed.size());
  const double ln_a = std::log(a_ms);
  r.d_shape = n / k - n * ln_a;
  r.d_scale = -n * k / a_ms;
  for (double ln_x : s.ln_observed) {
    const double u = std::exp(k * (ln_x - ln_a));  // (x/A)^k
    r.d_shape += ln_x - u * (ln_x - ln_a);
    r.d_scale += k / a_ms * u;
  }
  for (double ln_c : s.ln_below) {
    const double t = std::exp(k * (ln_c - ln_a));     // (c/A)^k
    const double w = std::exp(-t) / -std::expm1(-t);  // d ln F / dt
    r.d_shape += w * t * (ln_c - ln_a);
    r.d_scale -= w * t * k / a_ms;
  }
  return r;
}

double LogLikelihoodViaBoost(const Sample& s, double a_ms, double k) {
  const boost::math::weibull_distribution<double> w(k, a_ms);
  double l = 0.0;
  for (double x : s.observed) l += std::log(boost::math::pdf(w, x));
  for (double c : s.below) l += std::log(boost::math::cdf(w, c));
  return l;
}

const boost::math::tools::eps_tolerance<double> kTolerance(50);

// k from the profile equation of a complete sample by TOMS 748 (Boost.Math),
// with g(k) written out plainly here; A = (mean x^k)^(1/k).
Weibull SolveCompleteWithToms748(const std::vector<double>& x) {
  double mean_ln = 0.0;
  for (double v : x) mean_ln += std::log(v) / static_cast<double>(x.size());
  auto g = [&](double k) {
    double s0 = 0.0, s1 = 0.0;
    for (double v : x) {
      s0 += std::pow(v, k);
      s1 += std::pow(v, k) * std::log(v);
    }
    return s1 / s0 - 1.0 / k - mean_ln;
  };
  std::uintmax_t iterations = 200;
  const auto [lo, hi] =
      boost::math::tools::toms748_solve(g, 0.2, 20.0, kTolerance, iterations);
  const double k = 0.5 * (lo + hi);
  double sum = 0.0;
  for (double v : x) sum += std::pow(v, k);
  return Weibull{std::pow(sum / static_cast<double>(x.size()), 1.0 / k), k};
}

// The censored MLE by nested TOMS 748 solves of the hand-written scores: for
// each k the A where dl/dA = 0, then the k where dl/dk = 0 there.
Weibull SolveCensoredWithToms748(const Sample& s) {
  auto scale_for = [&](double k) {
    std::uintmax_t iterations = 200;
    const auto [lo, hi] = boost::math::tools::toms748_solve(
        [&](double a) { return ScoresAt(s, a, k).d_scale; }, 0.05, 60.0, kTolerance,
        iterations);
    return 0.5 * (lo + hi);
  };
  std::uintmax_t iterations = 200;
  const auto [lo, hi] = boost::math::tools::toms748_solve(
      [&](double k) { return ScoresAt(s, scale_for(k), k).d_shape; }, 0.3, 10.0,
      kTolerance, iterations);
  const double k = 0.5 * (lo + hi);
  return Weibull{scale_for(k), k};
}

class IrishStationFitTest : public ::testing::TestWithParam<const char*> {};

// At the maximum both partial derivatives vanish (scaled to a per-record,
// dimensionless size: |dl/dk| k / N and |dl/dA| A / N).
TEST_P(IrishStationFitTest, EstimateSolvesTheLikelihoodEquations) {
  const Sample s = StationSample(GetParam());
  const WeibullFit fit = FitWeibullMle(s.observed, s.below);
  const double n_all = static_cast<double>(s.observed.size() + s.below.size());
  const Scores d = ScoresAt(s, fit.weibull.scale_ms, fit.weibull.shape);
  EXPECT_LT(std::fabs(d.d_shape) * fit.weibull.shape / n_all, 1e-8);
  EXPECT_LT(std::fabs(d.d_scale) * fit.weibull.scale_ms / n_all, 1e-8);
  EXPECT_EQ(fit.censored, static_cast<int64_t>(s.below.size()));
}

TEST_P(IrishStationFitTest, CompleteSampleAgreesWithBoostToms748OnTheProfileEquation) {
  const Sample s = StationSample(GetParam());  // the observed days as a complete sample
  const WeibullFit fit = FitWeibullMle(s.observed);
  const Weibull ref = SolveCompleteWithToms748(s.observed);
  EXPECT_NEAR(fit.weibull.shape, ref.shape, 1e-9 * ref.shape);
  EXPECT_NEAR(fit.weibull.scale_ms, ref.scale_ms, 1e-9 * ref.scale_ms);
  EXPECT_NEAR(WeibullProfileEquation(s.observed, fit.weibull.shape), 0.0, 1e-12);
}

TEST_P(IrishStationFitTest, CensoredFitAgreesWithNestedBoostToms748) {
  const Sample s = StationSample(GetParam());
  const WeibullFit fit = FitWeibullMle(s.observed, s.below);
  const Weibull ref = SolveCensoredWithToms748(s);
  EXPECT_NEAR(fit.weibull.shape, ref.shape, 1e-8 * ref.shape);
  EXPECT_NEAR(fit.weibull.scale_ms, ref.scale_ms, 1e-8 * ref.scale_ms);
}

// Brute force: on a 7 x 7 grid of +-0.3 % around the estimate (steps of
// 0.1 %), the log-likelihood computed with Boost.Math's pdf and cdf is
// highest at the centre, and our log-likelihood agrees with it there.
TEST_P(IrishStationFitTest, EstimateIsTheBestPointOfAFineGrid) {
  const Sample s = StationSample(GetParam());
  const WeibullFit fit = FitWeibullMle(s.observed, s.below);
  const double a0 = fit.weibull.scale_ms, k0 = fit.weibull.shape;
  const double centre = LogLikelihoodViaBoost(s, a0, k0);
  EXPECT_NEAR(WeibullLogLikelihood(s.observed, s.below, fit.weibull), centre,
              1e-10 * std::fabs(centre));
  for (int i = -3; i <= 3; ++i) {
    for (int j = -3; j <= 3; ++j) {
      if (i == 0 && j == 0) continue;
      EXPECT_LT(LogLikelihoodViaBoost(s, a0 * (1 + 0.001 * i), k0 * (1 + 0.001 * j)),
                centre)
          << "grid point " << i << ", " << j;
    }
  }
}

// sup |F_n - F| computed directly: at each distinct value v, F_n(v) and the
// limit from the left F_n(v-) by counting, F from Boost.Math.
TEST_P(IrishStationFitTest, KsDistanceMatchesADirectComputation) {
  const std::vector<double> all = irish_wind::SpeedsMs(GetParam());
  const Sample s = StationSample(GetParam());
  const WeibullFit fit = FitWeibullMle(s.observed, s.below);
  std::vector<double> sorted = all;
  std::sort(sorted.begin(), sorted.end());
  const boost::math::weibull_distribution<double> w(fit.weibull.shape,
                                                    fit.weibull.scale_ms);
  const double n = static_cast<double>(sorted.size());
  double d = 0.0;
  for (double v : sorted) {
    const double at = std::upper_bound(sorted.begin(), sorted.end(), v) - sorted.begin();
    const double before =
        std::lower_bound(sorted.begin(), sorted.end(), v) - sorted.begin();
    const double f = v > 0.0 ? boost::math::cdf(w, v) : 0.0;
    d = std::max({d, std::fabs(at / n - f), std::fabs(before / n - f)});
  }
  EXPECT_NEAR(KolmogorovSmirnovDistance(all, fit.weibull), d, 1e-12);
}

// The 12 stations of the data set (stations.csv).
INSTANTIATE_TEST_SUITE_P(IrishDailyWind, IrishStationFitTest,
                         ::testing::Values("RPT", "VAL", "ROS", "KIL", "SHA", "BIR",
                                           "DUB", "CLA", "MUL", "CLO", "BEL", "MAL"));

std::vector<double> DrawWeibull(double a_ms, double k, int n, uint32_t seed) {
  boost::random::mt19937 engine(seed);
  boost::random::weibull_distribution<double> draw(k, a_ms);  // Boost: (shape, scale)
  std::vector<double> x(n);
  for (double& v : x) v = draw(engine);
  return x;
}

// Expected-information standard errors (model/weibull_fit.h; the factors
// 0.608 and 1.109 are the usual textbook values, from memory).
double ShapeSe(double k, double n) { return k * std::sqrt(0.6079 / n); }
double ScaleSe(double a_ms, double k, double n) {
  return a_ms / k * std::sqrt(1.1087 / n);
}

TEST(WeibullFitTest, RecoversKnownParametersWithinFourStandardErrors) {
  const double a_ms = 8.5, k = 2.2;
  const int n = 200000;
  const WeibullFit fit = FitWeibullMle(DrawWeibull(a_ms, k, n, 20240611u));
  EXPECT_NEAR(fit.weibull.shape, k, 4.0 * ShapeSe(k, n));
  EXPECT_NEAR(fit.weibull.scale_ms, a_ms, 4.0 * ScaleSe(a_ms, k, n));
  // The observed information converges to the expected one at rate 1/sqrt(n):
  // at n = 200,000 they agree to well within 2 %.
  EXPECT_NEAR(fit.se_shape / ShapeSe(k, n), 1.0, 0.02);
  EXPECT_NEAR(fit.se_scale_ms / ScaleSe(a_ms, k, n), 1.0, 0.02);
}

// The spread of 300 independent estimates matches the standard errors: the
// sample standard deviation of R normal estimates has a relative standard
// error of 1 / sqrt(2 (R - 1)) (textbook), so 4 of those is the tolerance.
TEST(WeibullFitTest, StandardErrorsMatchTheSpreadOfReplicates) {
  const double a_ms = 7.0, k = 1.9;
  const int n = 1000, replicates = 300;
  double sk = 0.0, skk = 0.0, sa = 0.0, saa = 0.0;
  for (int r = 0; r < replicates; ++r) {
    const WeibullFit fit = FitWeibullMle(DrawWeibull(a_ms, k, n, 1000u + r));
    sk += fit.weibull.shape;
    skk += fit.weibull.shape * fit.weibull.shape;
    sa += fit.weibull.scale_ms;
    saa += fit.weibull.scale_ms * fit.weibull.scale_ms;
  }
  const double rr = replicates;
  const double sd_k = std::sqrt((skk - sk * sk / rr) / (rr - 1.0));
  const double sd_a = std::sqrt((saa - sa * sa / rr) / (rr - 1.0));
  const double tolerance = 4.0 / std::sqrt(2.0 * (rr - 1.0));
  EXPECT_NEAR(sd_k / ShapeSe(k, n), 1.0, tolerance);
  EXPECT_NEAR(sd_a / ScaleSe(a_ms, k, n), 1.0, tolerance);
}

// Calms as censored records give back the true parameters; dropping them
// would cut off the lower tail and overstate k and A by many standard errors
// (here about 4 % calms).
TEST(WeibullFitTest, CensoringCalmsAvoidsTheBiasOfDroppingThem) {
  const double a_ms = 3.5, k = 1.6;
  const int n = 100000;
  Sample s;
  for (double v : DrawWeibull(a_ms, k, n, 77u)) Add(&s, v);
  const WeibullFit censored = FitWeibullMle(s.observed, s.below);
  EXPECT_NEAR(censored.weibull.shape, k, 4.0 * censored.se_shape);
  EXPECT_NEAR(censored.weibull.scale_ms, a_ms, 4.0 * censored.se_scale_ms);
  const WeibullFit dropped = FitWeibullMle(s.observed);
  EXPECT_GT(dropped.weibull.shape - k, 10.0 * dropped.se_shape);
  EXPECT_GT(dropped.weibull.scale_ms - a_ms, 10.0 * dropped.se_scale_ms);
}

// For a sample from the fitted family, the KS distance stays below the
// Kolmogorov distribution's 1 % critical value 1.628 / sqrt(n) (from memory;
// with fitted parameters the true critical value is smaller, so this holds
// with more than 99 % probability).
TEST(WeibullFitTest, KsDistanceOfAWeibullSampleIsSmall) {
  const int n = 20000;
  const std::vector<double> x = DrawWeibull(9.0, 2.4, n, 4242u);
  const WeibullFit fit = FitWeibullMle(x);
  EXPECT_LT(KolmogorovSmirnovDistance(x, fit.weibull), 1.628 / std::sqrt(n));
  // A clearly wrong Weibull is far away.
  EXPECT_GT(KolmogorovSmirnovDistance(x, Weibull{9.0, 1.2}), 0.1);
}

TEST(WeibullFitTest, RejectsSamplesThatCannotBeFitted) {
  const double nan = std::numeric_limits<double>::quiet_NaN();
  EXPECT_FALSE(CanFitWeibull({}));
  EXPECT_FALSE(CanFitWeibull({3.0}));
  EXPECT_FALSE(CanFitWeibull({2.0, 2.0, 2.0}));
  EXPECT_FALSE(CanFitWeibull({1.0, 0.0}));
  EXPECT_FALSE(CanFitWeibull({1.0, nan}));
  EXPECT_FALSE(CanFitWeibull({1.0, 2.0}, {0.0}));
  EXPECT_TRUE(CanFitWeibull({1.0, 2.0}, {0.5}));
}

}  // namespace
}  // namespace planner
