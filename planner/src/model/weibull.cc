#include "planner/weibull.h"

#include <cmath>

namespace planner {

double WeibullCdf(const Weibull& w, double speed_ms) {
  if (speed_ms <= 0.0) return 0.0;
  return -std::expm1(-std::pow(speed_ms / w.scale_ms, w.shape));
}

double WeibullQuantile(const Weibull& w, double p) {
  if (p <= 0.0) return 0.0;
  return w.scale_ms * std::pow(-std::log1p(-p), 1.0 / w.shape);
}

double WeibullMean(const Weibull& w) {
  return w.scale_ms * std::tgamma(1.0 + 1.0 / w.shape);
}

double WeibullBinProbability(const Weibull& w, double lo_ms, double hi_ms) {
  if (hi_ms <= lo_ms) return 0.0;
  return WeibullCdf(w, hi_ms) - WeibullCdf(w, lo_ms);
}

}  // namespace planner
