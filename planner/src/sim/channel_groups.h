// The load-channel groups of the measurement system (blade, tower, drive
// train ...) as the run loop walks through them. Each group fails and is
// repaired as an alternating renewal process of its own (renewal_process.h,
// its own engine); after a repair a group may wait for a recalibration that
// needs a stretch of light wind and, if the plan says so, the crew on site.
// A record counts for a cell only while every group the cell needs is up
// (Cell::channels).
//
// Per step the loop asks nothing while no group waits for a recalibration:
// failures and repairs come at the steps NextChangeStep names, like the
// other outage processes. While one waits, the loop hands it each record's
// mean wind and the crew's presence (Observe).
#ifndef PLANNER_SIM_CHANNEL_GROUPS_H_
#define PLANNER_SIM_CHANNEL_GROUPS_H_

#include <cstdint>
#include <vector>

#include "planner/plan.h"
#include "planner/random_stream.h"
#include "sim/renewal_process.h"

namespace planner {

struct ChannelGroupLaw {
  RenewalLaw failures;
  bool recalibrate = false;   // a repair is followed by a recalibration
  int recalibration_steps = 0;  // records in a row the conditions must hold
  double recalibration_below_ms = 0;
  bool recalibration_needs_crew = true;
};

// The law of `g` (hours -> steps).
ChannelGroupLaw MakeChannelGroupLaw(const ChannelGroup& g);

class ChannelGroups {
 public:
  // engines: one per law, each group's own stream. laws and day_month must
  // outlive this object.
  ChannelGroups(const std::vector<ChannelGroupLaw>& laws, std::vector<Engine> engines,
                const uint8_t* day_month, int64_t days);
  ChannelGroups(const ChannelGroups&) = delete;
  ChannelGroups& operator=(const ChannelGroups&) = delete;

  // Failures and repairs by `step`; steps must not decrease. A repaired group
  // that needs a recalibration stays down until Observe sees it done.
  void UpdateAt(int64_t step);
  // First step at which UpdateAt may change a group (INT64_MAX: never).
  int64_t NextChangeStep() const;
  // Bit g set: group g's records do not count (failed or not recalibrated).
  uint32_t down() const { return failed_ | waiting_; }
  // Some repaired group waits for its recalibration.
  bool recalibrating() const { return waiting_ != 0; }
  // One record while recalibrating(): its 10-minute mean wind and whether the
  // crew is on site. True when a group's recalibration is done (down() then
  // changed).
  bool Observe(double speed_ms, bool crew_here);

 private:
  const std::vector<ChannelGroupLaw>& laws_;
  std::vector<Engine> engines_;  // never resized: processes_ point into it
  std::vector<RenewalProcess> processes_;
  std::vector<int> calm_steps_;  // per group: records in a row that qualify
  uint32_t failed_ = 0;
  uint32_t waiting_ = 0;
};

}  // namespace planner

#endif  // PLANNER_SIM_CHANNEL_GROUPS_H_
