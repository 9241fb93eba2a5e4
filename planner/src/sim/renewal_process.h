// Alternating renewal process: up time, repair time, up time, ... Used for
// turbine and data-acquisition outages. Long-run share of up time is
// MTBF / (MTBF + MTTR) (reliability-engineering textbook result, e.g.
// Birolini, Reliability Engineering; from memory).
//
// Times are kept in 10-minute steps as doubles; the state flips at the first
// step whose start is at or past the change time. Each process draws from its
// own engine so that its draws never shift the weather's stream.
#ifndef PLANNER_SIM_RENEWAL_PROCESS_H_
#define PLANNER_SIM_RENEWAL_PROCESS_H_

#include <cmath>
#include <cstdint>

#include "planner/random_stream.h"

namespace planner {

struct RenewalLaw {
  bool enabled = false;       // false: always up
  double mean_up_steps = 0;   // MTBF in steps
  double mean_down_steps = 0; // MTTR in steps
};

class RenewalProcess {
 public:
  RenewalProcess(const RenewalLaw& law, Engine* engine) : law_(law), engine_(engine) {
    if (law_.enabled) next_change_ = Draw(law_.mean_up_steps);
  }

  // State during step `step` (0-based), advancing as needed. Steps must be
  // visited in increasing order.
  bool UpAt(int64_t step) {
    while (law_.enabled && static_cast<double>(step) >= next_change_) {
      up_ = !up_;
      next_change_ += Draw(up_ ? law_.mean_up_steps : law_.mean_down_steps);
    }
    return up_;
  }

  // First step at which UpAt may change (a huge value when disabled).
  int64_t NextChangeStep() const {
    if (!law_.enabled || next_change_ > 9.0e18) return INT64_MAX;
    return static_cast<int64_t>(std::ceil(next_change_));
  }

 private:
  // Exponential with the given mean.
  double Draw(double mean) {
    return -mean * std::log1p(-UniformDouble(*engine_));
  }

  RenewalLaw law_;
  Engine* engine_;
  bool up_ = true;
  double next_change_ = 0.0;
};

}  // namespace planner

#endif  // PLANNER_SIM_RENEWAL_PROCESS_H_
