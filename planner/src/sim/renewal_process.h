// Alternating renewal process: up time, repair time, up time, ... Used for
// turbine and data-acquisition outages. Long-run share of up time is
// MTBF / (MTBF + MTTR) whatever the laws (renewal-reward theorem;
// reliability-engineering textbooks, e.g. Birolini, Reliability Engineering;
// from memory). Up and repair times are exponential, Weibull or lognormal,
// each given by its mean; a repair that starts in month m lasts its drawn
// time x the month's repair-access factor.
//
// Times are kept in 10-minute steps as doubles; the state flips at the first
// step whose start is at or past the change time. Each process draws from its
// own engine so that its draws never shift the weather's stream.
#ifndef PLANNER_SIM_RENEWAL_PROCESS_H_
#define PLANNER_SIM_RENEWAL_PROCESS_H_

#include <array>
#include <cmath>
#include <cstdint>
#include <vector>

#include "planner/plan.h"
#include "planner/random_stream.h"

namespace planner {

// A duration law ready to draw from: mean in steps plus the law's parameters.
struct DurationSampler {
  DurationLaw::Kind kind = DurationLaw::Kind::kExponential;
  double mean_steps = 0;
  double weibull_scale_steps = 0;    // mean / Gamma(1 + 1/k)
  double inverse_shape = 1;          // 1/k (Weibull)
  double log_mu = 0, log_sigma = 0;  // lognormal: mu = ln mean - sigma^2/2

  DurationSampler() = default;
  DurationSampler(const DurationLaw& law, double mean_steps);
  // u uniform in [0, 1), n standard normal (used by the lognormal only).
  double Draw(double u, double n) const;
  // The law's mean in steps (for tests: equals mean_steps).
  double Mean() const;
};

struct RenewalLaw {
  bool enabled = false;  // false: always up
  DurationSampler up;    // mean = MTBF
  DurationSampler down;  // mean = MTTR
  std::array<double, 12> repair_month_factors{1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1};
};

// law from an OutageModel (hours -> steps).
RenewalLaw MakeRenewalLaw(const OutageModel& m);

class RenewalProcess {
 public:
  // day_month: month index (0..11) of each campaign day, for repair factors;
  // may be null when all factors are 1.
  RenewalProcess(const RenewalLaw& law, Engine* engine, const uint8_t* day_month,
                 int64_t days);

  // State during step `step` (0-based), advancing as needed. Steps must be
  // visited in increasing order.
  bool UpAt(int64_t step) {
    while (law_.enabled && static_cast<double>(step) >= next_change_) Flip();
    return up_;
  }

  // First step at which UpAt may change (a huge value when disabled).
  int64_t NextChangeStep() const {
    if (!law_.enabled || next_change_ > 9.0e18) return INT64_MAX;
    return static_cast<int64_t>(std::ceil(next_change_));
  }

 private:
  void Flip();
  double RepairFactorAt(double step) const;

  const RenewalLaw& law_;
  Engine* engine_;
  const uint8_t* day_month_;
  int64_t days_;
  bool up_ = true;
  double next_change_ = 0.0;
};

}  // namespace planner

#endif  // PLANNER_SIM_RENEWAL_PROCESS_H_
