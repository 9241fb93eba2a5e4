// Episodes such as icing as the run loop walks through them: starts at
// random with a rate that depends on the month (a Poisson process with a
// piecewise-constant rate: a start comes where the integrated rate since the
// end of the last episode reaches a unit-exponential draw), each lasting a
// drawn time. While one lasts the turbine is stopped, its records are
// invalid, or both (EpisodeModel). Whole stretches of records go, not
// records drawn one by one.
//
// Per step the loop asks nothing: like the outage processes, InAt is called
// at the steps where the state may change (NextChangeStep). Each episode
// kind draws from its own engine.
#ifndef PLANNER_SIM_EPISODE_PROCESS_H_
#define PLANNER_SIM_EPISODE_PROCESS_H_

#include <array>
#include <cstdint>

#include "planner/plan.h"
#include "planner/random_stream.h"
#include "sim/renewal_process.h"

namespace planner {

struct EpisodeLaw {
  std::array<double, 12> starts_per_step{};  // rate by month, per 10-minute step
  DurationSampler duration;                  // in steps
  bool stops_turbine = true;
  bool invalidates_records = true;
};

// The law of `m` (per-month starts -> per-step rates, hours -> steps).
EpisodeLaw MakeEpisodeLaw(const EpisodeModel& m);

class EpisodeProcess {
 public:
  // day_month: month index (0..11) of each of `days` campaign days; must
  // outlive this object, as must law.
  EpisodeProcess(const EpisodeLaw& law, Engine engine, const uint8_t* day_month,
                 int64_t days);

  // Whether an episode lasts during `step`. Steps must not decrease.
  bool InAt(int64_t step) {
    while (static_cast<double>(step) >= next_change_) Flip();
    return in_;
  }
  // First step at which InAt may change (INT64_MAX: never again).
  int64_t NextChangeStep() const {
    return next_change_ > 9.0e18 ? INT64_MAX
                                 : static_cast<int64_t>(std::ceil(next_change_));
  }
  const EpisodeLaw& law() const { return law_; }

 private:
  void Flip();
  // The first start at or after `from` (in steps), +infinity if none before
  // the last campaign day ends.
  double NextStart(double from);

  const EpisodeLaw& law_;
  Engine engine_;
  const uint8_t* day_month_;
  int64_t days_;
  bool in_ = false;
  double next_change_ = 0.0;
};

}  // namespace planner

#endif  // PLANNER_SIM_EPISODE_PROCESS_H_
