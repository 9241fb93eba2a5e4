#include "sim/weather_process.h"

namespace planner {

double SpeedTransform::Exact(double z, double weibull_k) {
  // 1 - Phi(z) = erfc(z / sqrt 2) / 2, computed without cancellation.
  const double upper_tail = 0.5 * std::erfc(z / std::sqrt(2.0));
  return std::pow(-std::log(upper_tail), 1.0 / weibull_k);
}

SpeedTransform::SpeedTransform(double weibull_k) : nodes_(kIntervals) {
  double value = Exact(kZMin, weibull_k);
  for (int i = 0; i < kIntervals; ++i) {
    const double next = Exact(kZMin + (i + 1) / kInvStep, weibull_k);
    nodes_[i] = {value, next - value};
    value = next;
  }
}

Ar1Skipper::Ar1Skipper(double tau_h) : jump_(kTable) {
  const double phi = Ar1Phi(tau_h);
  if (phi > 0.0) log_phi_ = std::log(phi);
  for (int k = 0; k < kTable; ++k) {
    const double p = k == 0 ? 1.0 : (phi > 0.0 ? std::exp(k * log_phi_) : 0.0);
    jump_[k].keep = p;
    jump_[k].fresh = std::sqrt(1.0 - p * p);
  }
}

}  // namespace planner
