// The turbine's high-wind stops and restarts, record by record: the cut-out
// on the 10-minute mean with its restart speed and wait, stops on short-term
// averages (a 3 s gust, a 30 s mean) and the storm-control band.
//
// A stop on a short-term average comes in a record with the probability that
// the average reaches its threshold somewhere in the record
// (model/short_term_exceedance.h), from the record's mean speed and standard
// deviation (TI x mean); with several rules, the largest of their
// probabilities (exact when one rule's exceedance implies the others'; see
// docs/methods.md). The record in which the turbine stops is not a
// production record (as at cut-out).
//
// The run loop keeps ShutdownLimits in registers and asks the unit only for
// records at or above attention_ms and while the turbine is stopped; in every
// other record the turbine runs as far as high wind goes.
#ifndef PLANNER_SIM_HIGH_WIND_SHUTDOWN_H_
#define PLANNER_SIM_HIGH_WIND_SHUTDOWN_H_

#include <cmath>
#include <vector>

#include "model/short_term_exceedance.h"
#include "planner/plan.h"
#include "planner/random_stream.h"

namespace planner {

class TiLaw;

// A short-term rule's moving-average statistics on a speed grid.
struct ShortTermRuleTable {
  double averaging_s = 3;
  double threshold_ms = 35;
  std::vector<MovingAverageMoments> at_speed;  // at grid_lo_ms + i x kGridStepMs
};

// The turbine's shutdown behaviour compiled for the run loop.
struct ShutdownTables {
  double cut_out_ms = 25;  // stops when the 10-minute mean reaches it
  double restart_ms = 22;  // restarts below it ...
  int restart_wait_steps = 0;  // ... after this many records below it
  double storm_from_ms = HUGE_VAL;  // reduced mode from here up to cut_out_ms
  // Below this speed a record's trip probability, averaged over the site's
  // TI law at its speed, is under kTripNegligible: no record is drawn there
  // (the expected number of stops left out is below 1e-7 per record).
  double trip_floor_ms = HUGE_VAL;
  std::vector<ShortTermRuleTable> rules;
  double grid_lo_ms = 0;  // the speed grid: grid_lo_ms + i x kGridStepMs
  // Per grid speed: the lowest ln TI at which the trip probability reaches
  // kTripNegligible there and at the next grid speed (the probability grows
  // with sigma and, below the thresholds, with the speed), +infinity if none.
  std::vector<double> log_ti_floor;

  // The lowest speed at which a record may need more than the plain
  // "running" answer: min(cut_out_ms, trip_floor_ms, storm_from_ms).
  double attention_ms() const;
  // P(some short-term rule stops the turbine in a record of mean speed_ms
  // and standard deviation sigma_ms); 0 without rules.
  double TripProbability(double speed_ms, double sigma_ms) const;
  // Whether a record of this mean and ln TI may stop the turbine with a
  // probability of kTripNegligible or more (a few operations; false lets the
  // loop skip the probability and its random draw).
  bool MayTripAt(double speed_ms, double log_ti) const {
    const double g = (speed_ms - grid_lo_ms) * (1.0 / kGridStepMs);
    const size_t i = g <= 0 ? 0 : static_cast<size_t>(g);
    return i < log_ti_floor.size() && log_ti >= log_ti_floor[i];
  }
  static constexpr double kGridStepMs = 0.1;
};

inline constexpr double kTripNegligible = 1e-7;

// The tables for turbine t; ti_law gives the TI that sets the trip floor.
// length_scale_m: the Kaimal L_1u (from the hub height).
ShutdownTables CompileShutdown(const TurbineSpec& t, const TiLaw& ti_law,
                               double length_scale_m);

// The per-step state: whether the turbine is stopped is the loop's (it keeps
// it in a register); the unit holds the restart wait and its random stream.
class HighWindShutdown {
 public:
  HighWindShutdown(const ShutdownTables& tables, Engine engine)
      : t_(tables), engine_(engine) {}

  // Whether a short-term rule could stop the turbine in this record: it runs
  // (was not stopped; may_run: available and not stopped by curtailment) at
  // a speed from the trip floor up to cut-out. Then Next needs the record's
  // standard deviation.
  bool MayTrip(bool was_stopped, double speed_ms, bool may_run) const {
    return !was_stopped && may_run && speed_ms >= t_.trip_floor_ms &&
           speed_ms < t_.cut_out_ms;
  }
  // Whether the turbine is stopped for high wind in this record, given
  // whether it was in the record before. log_ti (the record's ln TI) is used
  // only where MayTrip holds.
  bool Next(bool was_stopped, double speed_ms, bool may_run, double log_ti);

 private:
  const ShutdownTables& t_;
  Engine engine_;
  int below_restart_ = 0;  // records below restart_ms since the stop
};

}  // namespace planner

#endif  // PLANNER_SIM_HIGH_WIND_SHUTDOWN_H_
