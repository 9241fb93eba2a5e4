// The stochastic pieces of the weather, each small enough to test alone:
//  * SectorChain: direction sector Markov chain. Each step keeps its sector
//    with probability r, else draws one from the sector frequencies; the
//    stationary distribution is then exactly the frequencies.
//  * LatentAr1: standard-normal AR(1), z' = phi z + sqrt(1 - phi^2) e with
//    phi = exp(-step / tau); lag-k autocorrelation phi^k (Brown, Katz &
//    Murphy 1984, J. Climate Appl. Meteor.; from memory).
//  * SpeedTransform: z -> (-ln(1 - Phi(z)))^(1/k), the standard-normal to
//    unit-scale Weibull map, tabulated on a fine grid of z with linear
//    interpolation (relative error below 1e-4 for speeds above 1 % of A,
//    absolute error below 1e-6 A under it; z clamped to [-8, 8], a range
//    left with probability 1e-15).
#ifndef PLANNER_SIM_WEATHER_PROCESS_H_
#define PLANNER_SIM_WEATHER_PROCESS_H_

#include <algorithm>
#include <cmath>
#include <vector>

#include "sim/alias_table.h"

namespace planner {

// phi for a time scale tau_h (hours) at 10-minute steps; 0 when tau_h == 0.
inline double Ar1Phi(double tau_h) {
  return tau_h > 0.0 ? std::exp(-(1.0 / 6.0) / tau_h) : 0.0;
}

struct LatentAr1 {
  double phi = 0.0;
  double innovation = 1.0;  // sqrt(1 - phi^2)
  explicit LatentAr1(double tau_h = 0.0)
      : phi(Ar1Phi(tau_h)), innovation(std::sqrt(1.0 - phi * phi)) {}
  double Next(double z, double e) const { return phi * z + innovation * e; }
};

// Advances a standard-normal AR(1) by k steps at once, exactly:
// x_{t+k} | x_t ~ N(phi^k x_t, 1 - phi^{2k}) (Gaussian AR(1) property; Box &
// Jenkins). Used for TI's latent series, which is only needed at records that
// reach a TI-binned cell: one normal per such record instead of per step.
class Ar1Skipper {
 public:
  static constexpr int kTable = 1024;  // k below this from tables, above via exp

  explicit Ar1Skipper(double tau_h = 0.0);
  // e ~ N(0, 1); k >= 0.
  double Advance(double x, int64_t k, double e) const {
    if (k < kTable) return jump_[k].keep * x + jump_[k].fresh * e;
    const double p = std::exp(static_cast<double>(k) * log_phi_);
    return p * x + std::sqrt(1.0 - p * p) * e;
  }

 private:
  double log_phi_ = -HUGE_VAL;
  struct Jump {
    double keep = 0;   // phi^k
    double fresh = 0;  // sqrt(1 - phi^2k)
  };
  std::vector<Jump> jump_;
};

struct SectorChain {
  double keep_probability = 0.0;
  AliasTable frequencies;
  // u_keep, u_draw uniform in [0, 1).
  int Next(int sector, double u_keep, double u_draw) const {
    return u_keep < keep_probability ? sector : frequencies.Draw(u_draw);
  }
};

class SpeedTransform {
 public:
  static constexpr double kZMin = -8.0;
  static constexpr double kZMax = 8.0;
  static constexpr int kIntervals = 2048;

  SpeedTransform() = default;
  explicit SpeedTransform(double weibull_k);

  // Unit-scale Weibull quantile of Phi(z); multiply by A for m/s.
  double operator()(double z) const {
    const double x = std::min(std::max((z - kZMin) * kInvStep, 0.0), kIntervals - 1e-9);
    const int i = static_cast<int>(x);
    const double f = x - i;
    return nodes_[i].value + f * nodes_[i].slope;
  }

  // The exact map, for building the table and for tests.
  static double Exact(double z, double weibull_k);

 private:
  static constexpr double kInvStep = kIntervals / (kZMax - kZMin);
  // Per grid point: the value and the difference to the next point (the
  // interpolation's two loads side by side).
  struct Node {
    double value = 0;
    double slope = 0;
  };
  std::vector<Node> nodes_;
};

}  // namespace planner

#endif  // PLANNER_SIM_WEATHER_PROCESS_H_
