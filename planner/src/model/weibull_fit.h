// Maximum-likelihood fit of a two-parameter Weibull to wind speeds, with
// calms as left-censored records, and its goodness of fit.
//
// Speeds x_1..x_n > 0 are observed; each calm j is only known to lie below
// its threshold c_j > 0 (a calm's speed is not measured well enough to use,
// but it is not absent either). With F(v) = 1 - exp(-(v/A)^k), a = ln A,
// u_i = (x_i/A)^k and t_j = (c_j/A)^k the log-likelihood is
//
//   l(A, k) = n ln k - n k a + (k - 1) sum ln x_i - sum u_i
//             + sum_j ln(1 - exp(-t_j))
//
// (the usual likelihood of a censored sample: density for observed values,
// F(c) for values known only to be below c; e.g. Cohen 1965, Technometrics 7,
// reference from memory). Leaving the calms out instead would cut off the
// distribution's lower tail and bias k and A upwards: by about 6 % in k at a
// site with 2 % calms (our simulation; docs/fit-site.md).
//
// Without calms, dl/dA = 0 gives A = (mean x^k)^(1/k) and dl/dk = 0 becomes
// the profile likelihood equation
//
//   g(k) = sum x^k ln x / sum x^k - 1/k - mean ln x = 0,
//
// whose left side increases strictly with k, so the root is unique.
// With calms, for each k the equation dl/da = 0 (sum u - sum t/(e^t - 1) = n)
// has one root a(k), its left side decreasing in a; k then solves
// dl/dk (k, a(k)) = 0. Both are found by Newton steps kept inside a bracket.
//
// Standard errors come from the observed information (minus the Hessian of
// l at the estimate). For complete, independent samples they approach the
// expected-information values (derived; the rounded factors are the usual
// textbook ones, from memory):
//
//   Var(k) = 6 / pi^2 * k^2 / n                          (= 0.6079 k^2 / n)
//   Var(A) = (1 + 6 (1 - gamma)^2 / pi^2) A^2 / (k^2 n)  (= 1.1087 ...)
//
// Autocorrelated records carry less information: for wind data these are
// lower bounds.
#ifndef PLANNER_MODEL_WEIBULL_FIT_H_
#define PLANNER_MODEL_WEIBULL_FIT_H_

#include <cstdint>
#include <vector>

#include "planner/weibull.h"

namespace planner {

struct WeibullFit {
  Weibull weibull;
  int64_t n = 0;             // observed speeds
  int64_t censored = 0;      // calms
  double se_scale_ms = 0.0;  // from the observed information
  double se_shape = 0.0;
  double log_likelihood = 0.0;
  int iterations = 0;  // of the root finder for k
};

// True if FitWeibullMle can fit: at least 2 observed speeds, all finite and
// > 0, not all equal; censoring thresholds finite and > 0.
bool CanFitWeibull(const std::vector<double>& speeds_ms,
                   const std::vector<double>& censored_below_ms = {});

// The maximum-likelihood Weibull of the observed speeds and the censored
// calms. Precondition: CanFitWeibull(...). k to a relative precision of
// about 1e-13.
WeibullFit FitWeibullMle(const std::vector<double>& speeds_ms,
                         const std::vector<double>& censored_below_ms = {});

// g(k) above (complete samples), evaluated stably (speeds scaled by their
// largest value, which leaves g unchanged).
double WeibullProfileEquation(const std::vector<double>& speeds_ms, double shape);

// l(A, k) above.
double WeibullLogLikelihood(const std::vector<double>& speeds_ms,
                            const std::vector<double>& censored_below_ms,
                            const Weibull& w);

// Kolmogorov-Smirnov distance sup_v |F_n(v) - F(v)| between the sample's
// empirical distribution F_n and the Weibull F (0 to 1). With parameters
// fitted to the same sample the classical KS critical values do not apply
// (they are too large), so it is reported as a distance, not a test.
double KolmogorovSmirnovDistance(std::vector<double> speeds_ms, const Weibull& w);

}  // namespace planner

#endif  // PLANNER_MODEL_WEIBULL_FIT_H_
