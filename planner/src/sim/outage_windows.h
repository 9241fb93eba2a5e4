// Fixed planned-outage windows as the run loop walks through them: is a step
// inside one, and when does that next change.
#ifndef PLANNER_SIM_OUTAGE_WINDOWS_H_
#define PLANNER_SIM_OUTAGE_WINDOWS_H_

#include <cstdint>
#include <vector>

#include "sim/compiled_model.h"

namespace planner {

class OutageWindows {
 public:
  // windows: sorted, non-overlapping; must outlive this object.
  explicit OutageWindows(const std::vector<StepInterval>& windows) : w_(windows) {}

  // Whether `step` lies in a window. Steps must not decrease.
  bool InAt(int64_t step) {
    while (i_ < w_.size() && w_[i_].to <= step) ++i_;
    if (i_ == w_.size()) {
      next_ = INT64_MAX;
      return false;
    }
    const bool inside = w_[i_].from <= step;
    next_ = inside ? w_[i_].to : w_[i_].from;
    return inside;
  }
  // First step at which InAt may change, after the last call.
  int64_t NextChangeStep() const { return next_; }

 private:
  const std::vector<StepInterval>& w_;
  size_t i_ = 0;
  int64_t next_ = 0;
};

}  // namespace planner

#endif  // PLANNER_SIM_OUTAGE_WINDOWS_H_
