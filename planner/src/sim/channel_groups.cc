#include "sim/channel_groups.h"

#include <algorithm>
#include <cmath>

#include "planner/calendar.h"

namespace planner {

ChannelGroupLaw MakeChannelGroupLaw(const ChannelGroup& g) {
  ChannelGroupLaw law;
  law.failures = MakeRenewalLaw(g.failures);
  const Recalibration& r = g.recalibration;
  law.recalibrate = r.needed;
  law.recalibration_steps =
      std::max(1, static_cast<int>(std::ceil(r.hours * kStepsPerHour - 1e-9)));
  law.recalibration_below_ms = r.below_ms;
  law.recalibration_needs_crew = r.crew;
  return law;
}

ChannelGroups::ChannelGroups(const std::vector<ChannelGroupLaw>& laws,
                             std::vector<Engine> engines, const uint8_t* day_month,
                             int64_t days)
    : laws_(laws), engines_(std::move(engines)), calm_steps_(laws.size(), 0) {
  processes_.reserve(laws_.size());
  for (size_t g = 0; g < laws_.size(); ++g)
    processes_.emplace_back(laws_[g].failures, &engines_[g], day_month, days);
}

void ChannelGroups::UpdateAt(int64_t step) {
  for (size_t g = 0; g < processes_.size(); ++g) {
    const uint32_t bit = 1u << g;
    if (!processes_[g].UpAt(step)) {
      failed_ |= bit;
    } else if (failed_ & bit) {  // repaired
      failed_ &= ~bit;
      if (laws_[g].recalibrate) {
        waiting_ |= bit;
        calm_steps_[g] = 0;
      }
    }
  }
}

int64_t ChannelGroups::NextChangeStep() const {
  int64_t next = INT64_MAX;
  for (const RenewalProcess& p : processes_) next = std::min(next, p.NextChangeStep());
  return next;
}

bool ChannelGroups::Observe(double speed_ms, bool crew_here) {
  bool done = false;
  for (uint32_t rest = waiting_ & ~failed_; rest != 0; rest &= rest - 1) {
    const int g = __builtin_ctz(rest);
    const ChannelGroupLaw& law = laws_[g];
    const bool calm = speed_ms < law.recalibration_below_ms &&
                      (crew_here || !law.recalibration_needs_crew);
    calm_steps_[g] = calm ? calm_steps_[g] + 1 : 0;
    if (calm_steps_[g] >= law.recalibration_steps) {
      waiting_ &= ~(1u << g);
      done = true;
    }
  }
  return done;
}

}  // namespace planner
