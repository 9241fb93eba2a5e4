// What the site crew does to the turbine, as the run loop asks it: manual
// tests (an emergency stop, a grid-loss test ...) and park tests that fill
// parked cells at mid wind speeds. The loop asks only while the crew is on
// site, the turbine produces normally and the record would be valid, and
// only while a cell that a crew action can fill is short
// (CompiledModel::manual_test_cell); the unit keeps when each action was
// last done. No random draws: the crew acts at the first opportunity.
#ifndef PLANNER_SIM_CREW_ACTIONS_H_
#define PLANNER_SIM_CREW_ACTIONS_H_

#include <cstdint>
#include <vector>

#include "sim/compiled_model.h"

namespace planner {

struct CrewAction {
  enum class Kind { kNone, kTest, kPark };
  Kind kind = Kind::kNone;
  int event_type = -1;     // kTest: index into CompiledModel::events
  int cell = -1;           // kTest: its event cell at this wind
  int64_t park_steps = 0;  // kPark: records the park lasts, from the next one
};

class CrewActions {
 public:
  explicit CrewActions(const CompiledModel& m);

  // The action for the record at `step` with mean wind speed_ms: the first
  // manual test whose dates and interval allow it, whose wind window holds
  // and whose event cell at this wind is short; else the first park test
  // likewise, with a parked cell at this wind short. counts: per cell, the
  // run's counts. The action found is marked as done at `step`.
  CrewAction Next(double speed_ms, int64_t step, const uint32_t* counts);

 private:
  bool ParkedCellShort(double speed_ms, const uint32_t* counts) const;

  const CompiledModel& m_;
  std::vector<int64_t> last_test_;  // per manual test: step it was last done
  std::vector<int64_t> last_park_;  // per park test
};

}  // namespace planner

#endif  // PLANNER_SIM_CREW_ACTIONS_H_
