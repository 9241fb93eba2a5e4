#include "model/weibull_fit.h"

#include <algorithm>
#include <cmath>

namespace planner {
namespace {

constexpr double kPi = 3.14159265358979323846;
constexpr double kRelativeTolerance = 1e-13;
constexpr int kMaxIterations = 200;

// Logarithms of the data scaled by the largest observed speed, so that
// (x/A)^k stays representable for any k; a = ln(A / max).
struct LogData {
  std::vector<double> ln_x;  // observed, <= 0
  std::vector<double> ln_c;  // censoring thresholds
  double ln_max = 0.0;
  double sum_ln_x = 0.0;
};

LogData ToLogs(const std::vector<double>& speeds_ms,
               const std::vector<double>& below_ms) {
  LogData d;
  const double max_ms = *std::max_element(speeds_ms.begin(), speeds_ms.end());
  d.ln_max = std::log(max_ms);
  for (double x : speeds_ms) {
    d.ln_x.push_back(std::log(x / max_ms));
    d.sum_ln_x += d.ln_x.back();
  }
  for (double c : below_ms) d.ln_c.push_back(std::log(c / max_ms));
  return d;
}

// phi(t) = t / (e^t - 1) = t h'(t) for h(t) = ln(1 - e^-t), and its
// derivative, accurate for small and large t (series: phi = 1 - t/2 + t^2/12
// - t^4/720, the Bernoulli-number expansion).
double Phi(double t) {
  if (t < 1e-3) return 1.0 - t / 2.0 + t * t / 12.0;
  if (t > 1.0) return t * std::exp(-t) / -std::expm1(-t);
  return t / std::expm1(t);
}

double PhiSlope(double t) {
  if (t < 1e-3) return -0.5 + t / 6.0 - t * t * t / 180.0;
  if (t > 1.0) {
    const double e = std::exp(-t), d = -std::expm1(-t);
    return e * (d - t) / (d * d);
  }
  const double e = std::expm1(t);
  return (e - t * (1.0 + e)) / (e * e);
}

// Score and Hessian of l in (k, a), in one pass over the data.
struct Derivatives {
  double score_k = 0.0, score_a = 0.0;
  double h_kk = 0.0, h_ka = 0.0, h_aa = 0.0;
  double sum_u = 0.0, sum_phi = 0.0;  // for the inner equation in a
};

Derivatives Evaluate(const LogData& d, double k, double a) {
  const double n = static_cast<double>(d.ln_x.size());
  double su = 0.0, su_l = 0.0, su_l2 = 0.0;
  for (double lx : d.ln_x) {
    const double l = lx - a;
    const double u = std::exp(k * l);
    su += u;
    su_l += u * l;
    su_l2 += u * l * l;
  }
  double sp = 0.0, sp_l = 0.0, sq_t = 0.0, sq_t_l = 0.0, sq_t_l2 = 0.0;
  for (double lc : d.ln_c) {
    const double l = lc - a;
    const double t = std::exp(k * l);
    const double p = Phi(t), q = PhiSlope(t);
    sp += p;
    sp_l += p * l;
    sq_t += q * t;
    sq_t_l += q * t * l;
    sq_t_l2 += q * t * l * l;
  }
  Derivatives r;
  r.sum_u = su;
  r.sum_phi = sp;
  r.score_k = n / k - n * a + d.sum_ln_x - su_l + sp_l;
  r.score_a = k * (su - sp - n);
  r.h_kk = -n / (k * k) - su_l2 + sq_t_l2;
  r.h_aa = k * k * (sq_t - su);
  r.h_ka = -n + su + k * su_l - sp - k * sq_t_l;
  return r;
}

// a(k): the root of sum u - sum phi(t) - n, which decreases in a. Without
// calms it is ln(mean y^k) / k exactly; with them the root lies below that.
double SolveLogScale(const LogData& d, double k) {
  double sum = 0.0;
  for (double lx : d.ln_x) sum += std::exp(k * lx);
  const double closed = std::log(sum / static_cast<double>(d.ln_x.size())) / k;
  if (d.ln_c.empty()) return closed;
  double hi = closed, lo = closed - std::log(2.0) / k;
  auto value = [&](double a) {
    const Derivatives r = Evaluate(d, k, a);
    return r.sum_u - r.sum_phi - static_cast<double>(d.ln_x.size());
  };
  for (int i = 0; i < kMaxIterations && value(lo) < 0.0; ++i) lo -= (hi - lo);
  double a = 0.5 * (lo + hi);
  for (int i = 0; i < kMaxIterations; ++i) {
    const Derivatives r = Evaluate(d, k, a);
    const double g = r.sum_u - r.sum_phi - static_cast<double>(d.ln_x.size());
    (g > 0.0 ? lo : hi) = a;
    double next = a - g / (r.h_aa / k);  // dg/da = h_aa / k
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    const bool done = std::fabs(next - a) <= 1e-15 || hi - lo <= 1e-15;
    a = next;
    if (done) break;
  }
  return a;
}

// Starting value: the spread of ln V of a Weibull is pi / (k sqrt 6).
double StartingShape(const LogData& d) {
  const double n = static_cast<double>(d.ln_x.size());
  const double mean = d.sum_ln_x / n;
  double ss = 0.0;
  for (double l : d.ln_x) ss += (l - mean) * (l - mean);
  return kPi / (std::sqrt(6.0) * std::sqrt(ss / n));
}

// The profile score S(k) = dl/dk at (k, a(k)) and its slope
// dS/dk = h_kk - h_ka^2 / h_aa (implicit differentiation).
struct ProfileScore {
  double score = 0.0, slope = 0.0, a = 0.0;
  Derivatives at;
};

ProfileScore Profile(const LogData& d, double k) {
  ProfileScore p;
  p.a = SolveLogScale(d, k);
  p.at = Evaluate(d, k, p.a);
  p.score = p.at.score_k;
  p.slope = p.at.h_kk - p.at.h_ka * p.at.h_ka / p.at.h_aa;
  return p;
}

}  // namespace

bool CanFitWeibull(const std::vector<double>& speeds_ms,
                   const std::vector<double>& censored_below_ms) {
  if (speeds_ms.size() < 2) return false;
  for (double x : speeds_ms) {
    if (!std::isfinite(x) || !(x > 0.0)) return false;
  }
  for (double c : censored_below_ms) {
    if (!std::isfinite(c) || !(c > 0.0)) return false;
  }
  const auto [lo, hi] = std::minmax_element(speeds_ms.begin(), speeds_ms.end());
  return *lo < *hi;
}

namespace {

// The root of the profile score S(k), which falls from + to - through it:
// Newton steps from `start`, inside a bracket widened around it until S
// changes sign; a step that would leave the bracket bisects instead.
double SolveShape(const LogData& d, double start, int* iterations,
                  ProfileScore* at_root) {
  ProfileScore p = Profile(d, start);
  double lo = start, hi = start;
  if (p.score > 0.0) {
    do hi *= 1.25;
    while (hi < 1e6 && Profile(d, hi).score > 0.0);
  } else {
    do lo /= 1.25;
    while (lo > 1e-6 && Profile(d, lo).score < 0.0);
  }
  double k = start;
  for (*iterations = 1; *iterations <= kMaxIterations; ++*iterations) {
    (p.score > 0.0 ? lo : hi) = k;
    double next = k - p.score / p.slope;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    const bool done = std::fabs(next - k) <= kRelativeTolerance * next ||
                      hi - lo <= kRelativeTolerance * next;
    k = next;
    p = Profile(d, k);
    if (done) break;
  }
  *at_root = p;
  return k;
}

}  // namespace

WeibullFit FitWeibullMle(const std::vector<double>& speeds_ms,
                         const std::vector<double>& censored_below_ms) {
  WeibullFit fit;
  // The complete-sample root (cheap: a(k) in closed form) starts the
  // censored solve, which it is close to when calms are few.
  const LogData complete = ToLogs(speeds_ms, {});
  ProfileScore p;
  double k = SolveShape(complete, StartingShape(complete), &fit.iterations, &p);
  const LogData d = ToLogs(speeds_ms, censored_below_ms);
  if (!censored_below_ms.empty()) {
    int more = 0;
    k = SolveShape(d, k, &more, &p);
    fit.iterations += more;
  }
  fit.n = static_cast<int64_t>(speeds_ms.size());
  fit.censored = static_cast<int64_t>(censored_below_ms.size());
  fit.weibull.shape = k;
  fit.weibull.scale_ms = std::exp(p.a + d.ln_max);
  // Inverse of the observed information -H in (k, a); Var(A) = A^2 Var(a).
  const double det = p.at.h_kk * p.at.h_aa - p.at.h_ka * p.at.h_ka;
  fit.se_shape = std::sqrt(-p.at.h_aa / det);
  fit.se_scale_ms = fit.weibull.scale_ms * std::sqrt(-p.at.h_kk / det);
  fit.log_likelihood = WeibullLogLikelihood(speeds_ms, censored_below_ms, fit.weibull);
  return fit;
}

double WeibullProfileEquation(const std::vector<double>& speeds_ms, double shape) {
  const LogData d = ToLogs(speeds_ms, {});
  double s0 = 0.0, s1 = 0.0;
  for (double l : d.ln_x) {
    const double w = std::exp(shape * l);
    s0 += w;
    s1 += w * l;
  }
  return s1 / s0 - 1.0 / shape - d.sum_ln_x / static_cast<double>(d.ln_x.size());
}

double WeibullLogLikelihood(const std::vector<double>& speeds_ms,
                            const std::vector<double>& censored_below_ms,
                            const Weibull& w) {
  const double k = w.shape, a = std::log(w.scale_ms);
  double sum_ln = 0.0, sum_pow = 0.0, sum_censored = 0.0;
  for (double x : speeds_ms) {
    sum_ln += std::log(x);
    sum_pow += std::exp(k * (std::log(x) - a));
  }
  for (double c : censored_below_ms) {
    sum_censored += std::log(-std::expm1(-std::exp(k * (std::log(c) - a))));
  }
  const double n = static_cast<double>(speeds_ms.size());
  return n * std::log(k) - n * k * a + (k - 1.0) * sum_ln - sum_pow + sum_censored;
}

double KolmogorovSmirnovDistance(std::vector<double> speeds_ms, const Weibull& w) {
  std::sort(speeds_ms.begin(), speeds_ms.end());
  const double n = static_cast<double>(speeds_ms.size());
  double d = 0.0;
  // The empirical CDF steps from i/n to (i+1)/n at the i-th smallest value;
  // with ties, the largest gaps are still among these differences.
  for (std::size_t i = 0; i < speeds_ms.size(); ++i) {
    const double f = WeibullCdf(w, speeds_ms[i]);
    d = std::max({d, static_cast<double>(i + 1) / n - f, f - static_cast<double>(i) / n});
  }
  return d;
}

}  // namespace planner
