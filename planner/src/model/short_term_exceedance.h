// Probability that a short-term average of the wind speed (a 3 s gust, a 30 s
// mean, ...) reaches a shutdown threshold somewhere inside one 10-minute
// record, given the record's mean speed and standard deviation.
//
// Model (docs/methods.md, "High-wind shutdown on short-term averages"):
//
// - Within the record, the longitudinal wind speed is U + u(t), u a zero-mean
//   stationary Gaussian process with the one-sided Kaimal spectrum of
//   IEC 61400-1 ed.3 Annex C (eq. C.2 as quoted in secondary sources;
//   the standard's own text was not available):
//       f S(f) / sigma^2 = 4 f L / U / (1 + 6 f L / U)^(5/3),
//   L = L_1u = 8.1 Lambda_1, Lambda_1 = 0.7 z for hub height z < 60 m,
//   42 m above (IecKaimalLengthScale). Components slower than the record
//   (f < 1/T) belong to the record's mean, not to its fluctuations, and
//   components above cutoff_hz are not seen: the spectrum is kept on
//   [1/T, cutoff_hz] and scaled so that its variance there is the record's
//   sigma^2 (closed form: integral of S over [a, b] is
//   sigma^2 ((1 + 6aL/U)^(-2/3) - (1 + 6bL/U)^(-2/3))).
// - The tau-second moving average filters the spectrum by
//   |sin(pi f tau) / (pi f tau)|^2. Its spectral moments
//       m0 = int S(f) sinc^2 df           (variance sigma_tau^2)
//       m2 = int (2 pi f)^2 S(f) sinc^2 df = (4/tau^2) int S(f) sin^2(pi f tau) df
//   are integrated numerically (Gauss-Legendre panels, analytic tail; relative
//   error below 1e-6, checked against Boost.Math in the test).
// - Rice (1944, 1945): the mean rate of up-crossings of level x by a
//   stationary Gaussian process is nu0 exp(-(x - U)^2 / (2 m0)) with the zero
//   up-crossing rate nu0 = sqrt(m2 / m0) / (2 pi).
// - Davenport (1964): up-crossings of a high level taken as a Poisson
//   process, P(max over T < x) = exp(-nu0 T exp(-(x - U)^2 / (2 m0))).
//   Davenport, A. G. (1964), "Note on the distribution of the largest value of
//   a random function with application to gust loading", Proc. ICE 28,
//   187-196. Rice, S. O. (1944, 1945), "Mathematical analysis of random
//   noise", Bell System Technical Journal 23, 282-332 and 24, 46-156.
//
// The event is "reaches or exceeds" (>=), as the run loop's cut-out test
// (speed >= cut_out) is, so that a 600 s rule reproduces today's behaviour.
//
// Cost: MovingAverageMoments is a few thousand spectrum evaluations (tens of
// microseconds for tau = 3 s); it depends on U but not on sigma (sigma only
// scales the process). Before the run loop, tabulate it over U for each
// (tau, length scale) rule; ExceedanceFromMoments is then a couple of exp()
// per record. Nothing here allocates, throws, reads or writes.
#ifndef PLANNER_MODEL_SHORT_TERM_EXCEEDANCE_H_
#define PLANNER_MODEL_SHORT_TERM_EXCEEDANCE_H_

#include <limits>

namespace planner {

// L_1u of IEC 61400-1 ed.3 Annex C for the Kaimal u-spectrum, m:
// 8.1 x Lambda_1, Lambda_1 = 0.7 min(z, 60 m). hub_height_m > 0.
// (Numbers as quoted by secondary sources; the standard's text was not at hand.)
double IecKaimalLengthScale(double hub_height_m);

// The spectrum seen within one record.
struct RecordSpectrum {
  double mean_speed_ms = 10.0;    // U, the record's mean; > 0
  double length_scale_m = 340.2;  // Kaimal L_1u; > 0 (default: hub >= 60 m)
  double record_s = 600.0;        // T; > 0
  // Highest frequency present (anemometer and sampling), Hz; > 1 / record_s.
  double cutoff_hz = std::numeric_limits<double>::infinity();
};

// Statistics of the tau-second moving average, for a record whose standard
// deviation is 1 (sigma_tau scales with the record's sigma, nu0 does not).
struct MovingAverageMoments {
  double sigma_ratio = 0.0;  // sigma_tau / sigma, in (0, 1]; 0 when tau >= T
  double zero_upcrossing_hz = 0.0;  // nu0 of Rice; 0 when tau >= T
};

// Precondition: 1 s <= averaging_s <= spectrum.record_s (shorter averages
// need ever more panels: the unfiltered Kaimal process has no finite nu0).
// averaging_s >= record_s is the record mean itself and returns {0, 0}.
MovingAverageMoments MovingAverageMomentsOf(const RecordSpectrum& spectrum,
                                            double averaging_s);

// P(max over the record of the tau-second moving average >= threshold_ms).
// mean_speed_ms = U, sigma_ms = the record's standard deviation (>= 0),
// record_s = T > 0. Exact cases: sigma_ms == 0 or moments.sigma_ratio == 0
// (tau = T): 1 if U >= threshold, else 0. threshold <= U with sigma > 0: 1
// (the record splits into T/tau consecutive windows whose averages average to
// U, so one of them is >= U; exact when T/tau is whole, the model's value to
// within exp(-nu0 T) otherwise). Otherwise Davenport's formula above.
double ExceedanceFromMoments(const MovingAverageMoments& moments, double mean_speed_ms,
                             double sigma_ms, double record_s, double threshold_ms);

// Both steps in one call (for tests and tabulation).
double ShortTermExceedanceProbability(const RecordSpectrum& spectrum, double sigma_ms,
                                      double averaging_s, double threshold_ms);

}  // namespace planner

#endif  // PLANNER_MODEL_SHORT_TERM_EXCEEDANCE_H_
