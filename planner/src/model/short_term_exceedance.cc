#include "model/short_term_exceedance.h"

#include <algorithm>
#include <cmath>

#include <boost/math/constants/constants.hpp>
#include <boost/math/quadrature/gauss.hpp>

namespace planner {
namespace {

constexpr double kPi = boost::math::constants::pi<double>();
// Relative error allowed in each spectral moment (bound of the tail left out).
constexpr double kRelTol = 1e-6;
// Panels below 1/tau grow by this ratio; 10-point Gauss-Legendre on each.
constexpr double kPanelRatio = 1.5;
// Guard against a runaway loop; with tau >= 1 s the tolerance is met long before.
constexpr int kMaxPanels = 200000;

using Gauss = boost::math::quadrature::gauss<double, 10>;

// The Kaimal spectrum of unit variance on [f0, fc], and what its tails need.
struct UnitKaimal {
  double a;      // L / U, s
  double scale;  // 1 / (integral of the raw shape over [f0, fc])

  // Integral of the raw shape 4a/(1+6af)^(5/3) from f to infinity.
  static double Above(double a, double f) {
    return std::isinf(f) ? 0.0 : std::pow(1.0 + 6.0 * a * f, -2.0 / 3.0);
  }
  double S(double f) const {
    return scale * 4.0 * a * std::pow(1.0 + 6.0 * a * f, -5.0 / 3.0);
  }
  double Slope(double f) const {  // dS/df (< 0)
    return -(5.0 / 3.0) * 6.0 * a * S(f) / (1.0 + 6.0 * a * f);
  }
  double Mass(double lo, double hi) const { return scale * (Above(a, lo) - Above(a, hi)); }
};

}  // namespace

double IecKaimalLengthScale(double hub_height_m) {
  // IEC 61400-1 ed.3 6.3 / Annex C: Lambda_1 = 0.7 z below 60 m, 42 m above;
  // L_1u = 8.1 Lambda_1 (as quoted by secondary sources).
  return 8.1 * 0.7 * std::min(hub_height_m, 60.0);
}

MovingAverageMoments MovingAverageMomentsOf(const RecordSpectrum& spectrum,
                                            double averaging_s) {
  const double tau = averaging_s;
  const double big_t = spectrum.record_s;
  if (tau >= big_t) return {0.0, 0.0};
  const double a = spectrum.length_scale_m / spectrum.mean_speed_ms;
  const double f0 = 1.0 / big_t;
  const double fc = spectrum.cutoff_hz;
  const UnitKaimal s{a, 1.0 / (UnitKaimal::Above(a, f0) - UnitKaimal::Above(a, fc))};

  // m0 integrand S sinc^2(pi f tau); m2 is (4/tau^2) x the integral of
  // S sin^2(pi f tau), whose factor is applied at the end.
  auto m0_integrand = [&](double f) {
    const double x = kPi * f * tau;
    const double sinc = std::sin(x) / x;
    return s.S(f) * sinc * sinc;
  };
  auto m2_integrand = [&](double f) {
    const double sn = std::sin(kPi * f * tau);
    return s.S(f) * sn * sn;
  };

  double m0 = 0.0;
  double m2 = 0.0;  // without the 4/tau^2
  // Below 1/tau the filter does not oscillate: geometric panels from 1/T.
  const double f1 = std::min(1.0 / tau, fc);
  const int n_geo =
      std::max(1, static_cast<int>(std::ceil(std::log(f1 / f0) / std::log(kPanelRatio))));
  const double ratio = std::pow(f1 / f0, 1.0 / n_geo);
  double lo = f0;
  for (int i = 0; i < n_geo; ++i) {
    const double hi = (i + 1 == n_geo) ? f1 : lo * ratio;
    m0 += Gauss::integrate(m0_integrand, lo, hi);
    m2 += Gauss::integrate(m2_integrand, lo, hi);
    lo = hi;
  }

  // Above 1/tau: half-period panels, so that every panel end has
  // sin(2 pi f tau) = 0, until the tail is small enough or fc is reached.
  const double h = 0.5 / tau;
  double fb = f1;
  bool reached_cutoff = fb >= fc;
  for (int j = 0; !reached_cutoff && j < kMaxPanels; ++j) {
    const double hi = std::min(f1 + (j + 1) * h, fc);
    m0 += Gauss::integrate(m0_integrand, fb, hi);
    m2 += Gauss::integrate(m2_integrand, fb, hi);
    fb = hi;
    reached_cutoff = fb >= fc;
    // Tail bounds beyond fb (see below): stop once both are below tolerance.
    const double m0_tail_bound = s.S(fb) / (2.0 * kPi * kPi * tau * tau * fb);
    const double w = 2.0 * kPi * tau;
    const double m2_tail_bound = 0.5 * -s.Slope(fb) / (w * w);
    if (m0_tail_bound <= kRelTol * m0 && m2_tail_bound <= kRelTol * m2) break;
  }

  if (!reached_cutoff) {
    // m0: the tail of S sinc^2 lies in [0, int S/(pi f tau)^2] <=
    // [0, S(fb)/(pi^2 tau^2 fb)] (S decreasing); take the middle.
    m0 += s.S(fb) / (2.0 * kPi * kPi * tau * tau * fb);
    // m2: int S sin^2 = (1/2) int S - (1/2) int S cos(2 pi f tau). The first
    // is closed form; the second, integrated by parts twice from a panel end
    // (sin = 0), is [S' cos]_{fb}^{fc} / w^2 + S(fc) sin(w fc) / w, with a
    // remainder below |S'(fb)| / w^2 (S'' > 0, S' -> 0), w = 2 pi tau.
    const double w = 2.0 * kPi * tau;
    double cos_part = -s.Slope(fb) * std::cos(w * fb) / (w * w);
    if (!std::isinf(fc)) {
      cos_part += s.Slope(fc) * std::cos(w * fc) / (w * w) + s.S(fc) * std::sin(w * fc) / w;
    }
    m2 += 0.5 * s.Mass(fb, fc) - 0.5 * cos_part;
  }
  m2 *= 4.0 / (tau * tau);
  return {std::sqrt(m0), std::sqrt(m2 / m0) / (2.0 * kPi)};
}

double ExceedanceFromMoments(const MovingAverageMoments& moments, double mean_speed_ms,
                             double sigma_ms, double record_s, double threshold_ms) {
  const double sigma_tau = moments.sigma_ratio * sigma_ms;
  if (sigma_tau <= 0.0) return mean_speed_ms >= threshold_ms ? 1.0 : 0.0;
  if (threshold_ms <= mean_speed_ms) return 1.0;
  const double beta = (threshold_ms - mean_speed_ms) / sigma_tau;
  const double expected_upcrossings =
      moments.zero_upcrossing_hz * record_s * std::exp(-0.5 * beta * beta);
  return -std::expm1(-expected_upcrossings);
}

double ShortTermExceedanceProbability(const RecordSpectrum& spectrum, double sigma_ms,
                                      double averaging_s, double threshold_ms) {
  return ExceedanceFromMoments(MovingAverageMomentsOf(spectrum, averaging_s),
                               spectrum.mean_speed_ms, sigma_ms, spectrum.record_s,
                               threshold_ms);
}

}  // namespace planner
