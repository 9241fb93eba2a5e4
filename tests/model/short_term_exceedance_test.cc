// High-wind shutdown on short-term averages: the Rice/Davenport model of
// P(max of the tau-second moving average over a record >= threshold),
// checked against exact properties, an independent quadrature and a direct
// simulation of Kaimal turbulence.
#include "model/short_term_exceedance.h"

#include <gtest/gtest.h>

#include <algorithm>
#include <boost/math/quadrature/gauss_kronrod.hpp>
#include <boost/math/quadrature/ooura_fourier_integrals.hpp>
#include <boost/random/mersenne_twister.hpp>
#include <boost/random/normal_distribution.hpp>
#include <cmath>
#include <complex>
#include <limits>
#include <vector>

namespace planner {
namespace {

constexpr double kPi = 3.14159265358979323846;
constexpr double kInf = std::numeric_limits<double>::infinity();

RecordSpectrum Spectrum(double mean_ms, double cutoff_hz = kInf) {
  RecordSpectrum s;
  s.mean_speed_ms = mean_ms;
  s.length_scale_m = IecKaimalLengthScale(90.0);
  s.record_s = 600.0;
  s.cutoff_hz = cutoff_hz;
  return s;
}

// ---------------------------------------------------------------- exact cases

TEST(IecKaimalLengthScale, IsEightPointOneTimesPointSevenZCappedAtSixtyMetres) {
  // IEC 61400-1 ed.3: Lambda_1 = 0.7 z (z < 60 m), 42 m above; L_1u = 8.1 Lambda_1
  // (as quoted by secondary sources).
  EXPECT_DOUBLE_EQ(IecKaimalLengthScale(40.0), 8.1 * 28.0);
  EXPECT_DOUBLE_EQ(IecKaimalLengthScale(60.0), 8.1 * 42.0);
  EXPECT_DOUBLE_EQ(IecKaimalLengthScale(120.0), 340.2);
}

TEST(ShortTermExceedance, TenMinuteAverageIsTheRecordMeanItself) {
  const RecordSpectrum s = Spectrum(24.0);
  const MovingAverageMoments m = MovingAverageMomentsOf(s, 600.0);
  EXPECT_EQ(m.sigma_ratio, 0.0);
  EXPECT_EQ(ShortTermExceedanceProbability(s, 3.0, 600.0, 25.0), 0.0);
  EXPECT_EQ(ShortTermExceedanceProbability(s, 3.0, 600.0, 24.0), 1.0);  // >= as cut-out
  EXPECT_EQ(ShortTermExceedanceProbability(s, 3.0, 600.0, 23.9), 1.0);
}

TEST(ShortTermExceedance, NoTurbulenceMeansTheMeanDecides) {
  const RecordSpectrum s = Spectrum(20.0);
  EXPECT_EQ(ShortTermExceedanceProbability(s, 0.0, 3.0, 20.5), 0.0);
  EXPECT_EQ(ShortTermExceedanceProbability(s, 0.0, 3.0, 20.0), 1.0);
  EXPECT_EQ(ShortTermExceedanceProbability(s, 0.0, 30.0, 19.0), 1.0);
}

TEST(ShortTermExceedance, ThresholdAtOrBelowTheMeanIsReachedForSure) {
  // The record splits into 600/tau windows whose averages average to U.
  const RecordSpectrum s = Spectrum(15.0);
  EXPECT_EQ(ShortTermExceedanceProbability(s, 2.0, 3.0, 15.0), 1.0);
  EXPECT_EQ(ShortTermExceedanceProbability(s, 2.0, 30.0, 10.0), 1.0);
}

TEST(ShortTermExceedance, FallsWithThresholdAndAveragingTimeAndRisesWithSigma) {
  const RecordSpectrum s = Spectrum(20.0);
  double previous = 1.0;
  for (double x = 20.0; x <= 40.0; x += 0.25) {
    const double p = ShortTermExceedanceProbability(s, 2.4, 3.0, x);
    EXPECT_LE(p, previous) << x;
    EXPECT_GE(p, 0.0);
    previous = p;
  }
  EXPECT_LT(previous, 1e-6);
  const double taus[] = {1.0, 3.0, 10.0, 30.0, 60.0, 300.0, 600.0};
  previous = 1.0;
  for (double tau : taus) {
    const double p = ShortTermExceedanceProbability(s, 2.4, tau, 26.0);
    EXPECT_LE(p, previous) << tau;
    previous = p;
  }
  EXPECT_LT(ShortTermExceedanceProbability(s, 2.0, 3.0, 28.0),
            ShortTermExceedanceProbability(s, 3.0, 3.0, 28.0));
}

TEST(ShortTermExceedance, AveragingReducesTheVarianceMoreForLongerAverages) {
  const RecordSpectrum s = Spectrum(15.0);
  double previous = 1.0;
  const double taus[] = {1.0, 3.0, 10.0, 30.0, 100.0, 300.0, 599.0};
  for (double tau : taus) {
    const MovingAverageMoments m = MovingAverageMomentsOf(s, tau);
    EXPECT_LT(m.sigma_ratio, previous) << tau;
    EXPECT_GT(m.sigma_ratio, 0.0) << tau;
    EXPECT_GT(m.zero_upcrossing_hz, 0.0) << tau;
    previous = m.sigma_ratio;
  }
}

// ------------------------------------------- moments by an independent route

// Autocovariance of the unit-variance record spectrum (Kaimal kept on
// [1/T, inf)), R(s) = int S(f) cos(2 pi f s) df, by Boost.Math's Ooura
// double-exponential Fourier quadrature over [0, inf) less a Gauss-Kronrod
// integral over [0, 1/T). Independent of the code's panels and tails.
struct IndependentKaimal {
  double a;  // L/U
  double f0;
  double scale;
  boost::math::quadrature::ooura_fourier_cos<double> ooura{1e-10};
  IndependentKaimal(double length_m, double mean_ms, double record_s)
      : a(length_m / mean_ms),
        f0(1.0 / record_s),
        scale(1.0 / std::pow(1.0 + 6.0 * a * f0, -2.0 / 3.0)) {}
  double S(double f) const { return scale * 4.0 * a * std::pow(1.0 + 6.0 * a * f, -5.0 / 3.0); }
  double R(double lag_s) {
    auto s = [this](double f) { return S(f); };
    if (lag_s == 0.0) return 1.0;
    const double omega = 2.0 * kPi * lag_s;
    // Ooura integrates g(t) cos(omega t) over t in [0, inf); t = f here.
    const double all = ooura.integrate(s, omega).first;
    auto low = [&](double f) { return S(f) * std::cos(omega * f); };
    const double below =
        boost::math::quadrature::gauss_kronrod<double, 61>::integrate(low, 0.0, f0, 15, 1e-12);
    return all - below;
  }
};

TEST(MovingAverageMoments, MatchTheTimeDomainFormulasByIndependentQuadrature) {
  // Variance of a tau-average: (2/tau^2) int_0^tau (tau - s) R(s) ds;
  // derivative variance: m2 = 2 (R(0) - R(tau)) / tau^2 (the tau-average's
  // derivative is (u(t) - u(t - tau)) / tau). Textbook identities of
  // stationary processes (e.g. Vanmarcke, Random Fields, 1983; from memory).
  for (double mean_ms : {8.0, 25.0}) {
    IndependentKaimal k(IecKaimalLengthScale(90.0), mean_ms, 600.0);
    for (double tau : {3.0, 30.0}) {
      auto integrand = [&](double lag) { return (tau - lag) * k.R(lag); };
      const double var = 2.0 / (tau * tau) *
                         boost::math::quadrature::gauss_kronrod<double, 31>::integrate(
                             integrand, 0.0, tau, 10, 1e-10);
      const double m2 = 2.0 * (1.0 - k.R(tau)) / (tau * tau);
      const double nu0 = std::sqrt(m2 / var) / (2.0 * kPi);
      const MovingAverageMoments m = MovingAverageMomentsOf(Spectrum(mean_ms), tau);
      EXPECT_NEAR(m.sigma_ratio * m.sigma_ratio, var, 1e-6 * var) << mean_ms << " " << tau;
      EXPECT_NEAR(m.zero_upcrossing_hz, nu0, 1e-6 * nu0) << mean_ms << " " << tau;
    }
  }
}

TEST(MovingAverageMoments, CutoffBelowTheFilterLeavesTheVarianceAlmostWhole) {
  // With the spectrum kept below 0.05 Hz and tau = 1 s, sinc^2 >= 0.99 on
  // the whole band, so sigma_tau / sigma is within 1 % of 1.
  const MovingAverageMoments m = MovingAverageMomentsOf(Spectrum(10.0, 0.05), 1.0);
  EXPECT_GT(m.sigma_ratio, 0.995);
  EXPECT_LE(m.sigma_ratio, 1.0);
}

// ------------------------------------------------------- direct simulation

// In-place radix-2 FFT with exponent sign +1 (synthesis), no normalisation.
void InverseFft(std::vector<std::complex<double>>& x) {
  const std::size_t n = x.size();
  for (std::size_t i = 1, j = 0; i < n; ++i) {
    std::size_t bit = n >> 1;
    for (; j & bit; bit >>= 1) j ^= bit;
    j ^= bit;
    if (i < j) std::swap(x[i], x[j]);
  }
  for (std::size_t len = 2; len <= n; len <<= 1) {
    const double ang = 2.0 * kPi / static_cast<double>(len);
    const std::complex<double> wlen(std::cos(ang), std::sin(ang));
    for (std::size_t i = 0; i < n; i += len) {
      std::complex<double> w(1.0, 0.0);
      for (std::size_t k = 0; k < len / 2; ++k) {
        const std::complex<double> u = x[i + k];
        const std::complex<double> v = x[i + k + len / 2] * w;
        x[i + k] = u + v;
        x[i + k + len / 2] = u - v;
        w *= wlen;
      }
    }
  }
}

// A periodic Gaussian series of unit variance, sampled every dt, whose
// spectrum is the record spectrum of the model (Kaimal on [1/T, 1/(2 dt)]):
// independent Gaussian Fourier coefficients, each with the spectrum's exact
// mass over its frequency bin (Shinozuka-type spectral synthesis with random
// amplitudes, as in Veers 1988 / TurbSim, here in one dimension).
std::vector<double> KaimalSeries(double length_m, double mean_ms, double record_s,
                                 double dt, std::size_t n, std::uint64_t seed) {
  const double a = length_m / mean_ms;
  const double f0 = 1.0 / record_s;
  const double fc = 0.5 / dt;
  auto above = [a](double f) { return std::pow(1.0 + 6.0 * a * f, -2.0 / 3.0); };
  const double total = above(f0) - above(fc);
  const double df = 1.0 / (static_cast<double>(n) * dt);
  boost::random::mt19937_64 engine(seed);
  boost::random::normal_distribution<double> normal;
  std::vector<std::complex<double>> z(n, {0.0, 0.0});
  for (std::size_t k = 1; k < n / 2; ++k) {
    const double lo = std::max(f0, (k - 0.5) * df);
    const double hi = std::min(fc, (k + 0.5) * df);
    const double g1 = normal(engine);
    const double g2 = normal(engine);
    if (hi <= lo) continue;
    const double var = (above(lo) - above(hi)) / total;
    // 2 Re(z e^{i theta}) has variance 4 |z|^2 / 2 ... = var with this scale.
    z[k] = 0.5 * std::sqrt(var) * std::complex<double>(g1, g2);
  }
  InverseFft(z);
  std::vector<double> u(n);
  for (std::size_t i = 0; i < n; ++i) u[i] = 2.0 * z[i].real();
  return u;
}

// Per 600 s record, the largest trailing moving average (window of tau)
// ending inside the record. The series is periodic, so windows wrap.
std::vector<double> RecordMaxima(const std::vector<double>& u, double dt, double record_s,
                                 double tau) {
  const std::size_t n = u.size();
  const std::size_t w = static_cast<std::size_t>(std::lround(tau / dt));
  const std::size_t per_record = static_cast<std::size_t>(std::lround(record_s / dt));
  std::vector<double> prefix(n + 1, 0.0);
  for (std::size_t i = 0; i < n; ++i) prefix[i + 1] = prefix[i] + u[i];
  std::vector<double> maxima;
  for (std::size_t r = 0; (r + 1) * per_record <= n; ++r) {
    double best = -kInf;
    for (std::size_t e = r * per_record; e < (r + 1) * per_record; ++e) {
      // Samples e - w + 1 .. e, wrapping below 0.
      const double sum = (e + 1 >= w)
                             ? prefix[e + 1] - prefix[e + 1 - w]
                             : prefix[e + 1] + prefix[n] - prefix[n - (w - e - 1)];
      best = std::max(best, sum / static_cast<double>(w));
    }
    maxima.push_back(best);
  }
  return maxima;
}

struct SimulationCase {
  double mean_ms;
  double ti;
  double tau_s;
  double threshold_ms;
};

// Synthesised 10-minute records against the model. Per mean speed, one
// periodic series of 2^22 samples at 4 Hz (1747 records of 600 s); the
// spectrum is cut at the 2 Hz Nyquist frequency, and the model is told so
// (cutoff_hz), so both describe the same process. The tau-average is the
// mean of the tau/dt samples ending at each sample time, its maximum over
// the 2400 end times of a record is compared with the threshold. TI only
// scales the fluctuations, so the points differ in (threshold - U) /
// sigma_tau; they are picked at shutdown-like thresholds with P in about
// [0.2, 0.8], where a count is most informative.
//
// Tolerance: 4 standard errors of the simulated share, the SE being the
// larger of the binomial SE at the model's p and a batch-means SE (32
// batches of consecutive records: the records come from one continuous
// series, so neighbours share slow components). No allowance is added for
// the two known biases of the model against this simulation, which stayed
// inside the 4 SE at every point (largest gap 3.0 SE, U 12 m/s, tau 3 s,
// simulation below the model): the maximum is sampled every 0.25 s, so the
// simulation misses the top of some peaks (lowers its share), and Davenport's
// Poisson assumption ignores the clustering of up-crossings, small at these
// levels of 2 to 3 sigma_tau above the mean (up-crossings of ever higher
// levels tend to a Poisson process: Cramer & Leadbetter 1967; from memory).
TEST(ShortTermExceedance, MatchesDirectSimulationOfKaimalTurbulence) {
  const double dt = 0.25;
  const std::size_t n = std::size_t{1} << 22;
  const double length_m = IecKaimalLengthScale(90.0);
  const SimulationCase cases[] = {
      // U, TI, tau, threshold
      {25.0, 0.12, 3.0, 33.0},   // 3 s gust, sigma 3.0 m/s
      {25.0, 0.18, 3.0, 35.0},   // 3 s gust, sigma 4.5 m/s
      {25.0, 0.12, 30.0, 29.0},  // 30 s mean
      {25.0, 0.08, 30.0, 28.0},  // 30 s mean, low turbulence
      {12.0, 0.18, 3.0, 18.0},   // lower mean: shorter-relative length L/U
      {12.0, 0.12, 30.0, 14.0},
  };
  for (double mean_ms : {25.0, 12.0}) {
    const std::vector<double> u = KaimalSeries(length_m, mean_ms, 600.0, dt, n,
                                               static_cast<std::uint64_t>(mean_ms * 1000));
    for (double tau : {3.0, 30.0}) {
      const std::vector<double> maxima = RecordMaxima(u, dt, 600.0, tau);
      const RecordSpectrum s = Spectrum(mean_ms, 0.5 / dt);
      const MovingAverageMoments m = MovingAverageMomentsOf(s, tau);
      for (const SimulationCase& c : cases) {
        if (c.mean_ms != mean_ms || c.tau_s != tau) continue;
        const double sigma = c.ti * c.mean_ms;
        const double p_model =
            ExceedanceFromMoments(m, c.mean_ms, sigma, 600.0, c.threshold_ms);
        const std::size_t records = maxima.size();
        const std::size_t batches = 32;
        const std::size_t per_batch = records / batches;
        std::size_t hits = 0;
        double batch_sq = 0.0;
        for (std::size_t b = 0; b < batches; ++b) {
          std::size_t batch_hits = 0;
          for (std::size_t r = b * per_batch; r < (b + 1) * per_batch; ++r) {
            batch_hits += c.mean_ms + sigma * maxima[r] >= c.threshold_ms;
          }
          const double d = static_cast<double>(batch_hits) / per_batch - p_model;
          batch_sq += d * d;
        }
        for (double x : maxima) hits += c.mean_ms + sigma * x >= c.threshold_ms;
        const double p_sim = static_cast<double>(hits) / records;
        const double se_binomial = std::sqrt(p_model * (1.0 - p_model) / records);
        const double se_batch = std::sqrt(batch_sq / (batches - 1)) / std::sqrt(batches);
        const double se = std::max(se_binomial, se_batch);
        EXPECT_GT(p_model, 0.15);
        EXPECT_LT(p_model, 0.85);
        EXPECT_NEAR(p_sim, p_model, 4.0 * se)
            << "U " << c.mean_ms << " TI " << c.ti << " tau " << c.tau_s << " x "
            << c.threshold_ms << " se_binomial " << se_binomial << " se_batch "
            << se_batch;
      }
    }
  }
}

}  // namespace
}  // namespace planner
