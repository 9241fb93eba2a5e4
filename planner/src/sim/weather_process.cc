#include "sim/weather_process.h"

namespace planner {

double SpeedTransform::Exact(double z, double weibull_k) {
  // 1 - Phi(z) = erfc(z / sqrt 2) / 2, computed without cancellation.
  const double upper_tail = 0.5 * std::erfc(z / std::sqrt(2.0));
  return std::pow(-std::log(upper_tail), 1.0 / weibull_k);
}

SpeedTransform::SpeedTransform(double weibull_k) : table_(kIntervals + 1) {
  for (int i = 0; i <= kIntervals; ++i) {
    table_[i] = Exact(kZMin + i / kInvStep, weibull_k);
  }
}

}  // namespace planner
