// One simulated campaign, 10 minutes at a time. The core of fillcast: plain
// structs in, plain structs out; no I/O, no clock, no globals, no exceptions
// (the plan is validated before a Simulator is built).
//
// Per step (see docs/methods.md for sources):
//  1. direction: sector Markov chain (keep with probability r, else draw from
//     the sector frequencies);
//  2. speed: latent standard-normal AR(1) z' = phi z + sqrt(1 - phi^2) e,
//     phi = exp(-10 min / tau), mapped to the sector's Weibull scaled by the
//     month, hour and year factors: v = A f (-ln(1 - Phi(z)))^(1/k)
//     (Brown, Katz & Murphy 1984, normal-transform AR method);
//  3. turbulence: TI lognormal given v, with its own latent AR(1);
//  4. turbine and data-acquisition outages: alternating renewal processes;
//  5. operating state with cut-out hysteresis; valid sector; quality filter;
//  6. the record goes into its cell; completion when every required cell is
//     full.
// A run stops at the later of completion and the deadline, or at the horizon.
#ifndef PLANNER_SIMULATION_H_
#define PLANNER_SIMULATION_H_

#include <cstdint>
#include <memory>
#include <vector>

#include "planner/plan.h"

namespace planner {

// What one run leaves behind (per-run summary; no per-step history).
struct RunResult {
  // Records elapsed from the start when the last required cell filled
  // (completion at the end of that record), or -1 if not within the horizon.
  int64_t completion_step = -1;
  // Cell that filled last (the bottleneck of this run), -1 if incomplete.
  int last_cell = -1;
  // Per cell: valid records at the deadline.
  std::vector<uint32_t> count_at_deadline;
  // Per cell: records elapsed when the cell reached its minimum, -1 if not
  // while the run was simulated.
  std::vector<int64_t> full_step;
  // Per cell: valid records when the run stopped.
  std::vector<uint32_t> count_at_end;
  // Per cell: records elapsed when the cell reached the relaxed minimum
  // (SimulationOptions::relaxed_share of its minimum, at least 1), -1 if not.
  std::vector<int64_t> relaxed_full_step;
  int64_t simulated_steps = 0;
  // Diagnostics over the simulated steps (for tests and reports).
  int64_t turbine_up_steps = 0;
  int64_t daq_up_steps = 0;
  int64_t channels_up_steps = 0;  // every load-channel group up (all if none)
  int64_t valid_sector_steps = 0;
  int64_t curtailed_steps = 0;  // steps with a curtailment rule in force
  double speed_sum_ms = 0;      // sum of the simulated mean wind speeds
};

// One simulated 10-minute record, for tests that rebuild a campaign log from
// a simulated campaign (Simulator::Trace). Not used by forecasts.
struct TracedRecord {
  int64_t step = 0;          // 0-based record index from the plan's start
  double speed_ms = 0;       // mean wind speed
  double direction_deg = 0;  // wind direction
  double ti = 0;             // TI (fraction) where the simulation drew it, else NaN
  OperatingState state = OperatingState::kParked;
  bool turbine_up = true, daq_up = true, sector_ok = true;
  uint32_t channels_down = 0;  // load-channel groups down (bit g: group g)
  bool quality_ok = true;    // passed the data-quality check
  bool valid = true;         // acquisition up, valid sector, quality passed
  bool manual_test = false;  // a manual test was done in this record
  int cell = -1;             // record cell it counted for, -1 if none
  // Transient event in this record (index into CaptureMatrix::event_types:
  // a start-up, a normal stop or a manual test), -1 if none; and the event
  // cell it counted for, -1 if it did not count (record not valid, or no
  // event cell at this wind speed).
  int event_type = -1;
  int event_cell = -1;
};

struct CompiledModel;  // lookup tables built once per plan (sim/compiled_model.h)

// Where a forecast starts when the campaign is under way: the records and
// events counted so far and the latest measured conditions. The simulation
// then starts at 00:00 of the as-of day (elapsed_days after the plan's start),
// with the calendar where it is, the counts as given, and the weather started
// from the latest logged wind speed and direction (its latent normal is the
// normal score of that speed under the sector's Weibull).
struct CampaignState {
  int64_t elapsed_days = 0;      // >= 0; below the horizon
  std::vector<uint32_t> counts;  // per cell, so far (empty = all zero)
  bool has_last_wind = false;
  double last_speed_ms = 0;       // latest logged 10-minute mean speed
  double last_direction_deg = 0;  // and its direction
};

struct SimulationOptions {
  // Share of each cell's minimum whose reaching time is also recorded, for
  // "what if this minimum were lowered" (0 < share <= 1). Default 0.8.
  double relaxed_share = 0.8;
  // Draw the site model's uncertainty (SiteModel::mean_speed_uncertainty_pct)
  // per run; false: the site model taken as exact, for the split of the
  // spread into weather and site model.
  bool site_uncertainty = true;
};

class Simulator {
 public:
  // plan must have been validated (readers do this).
  explicit Simulator(const Plan& plan, const SimulationOptions& options = {});
  ~Simulator();
  Simulator(const Simulator&) = delete;
  Simulator& operator=(const Simulator&) = delete;

  // Simulates run `run_index` of master seed `seed` into *out (reusing its
  // buffers). Thread-safe: may be called concurrently.
  void Run(uint64_t seed, uint64_t run_index, RunResult* out) const;
  // The same as Run, also returning every simulated record (tests only: a
  // per-step history, so short horizons only). Results equal Run's.
  void Trace(uint64_t seed, uint64_t run_index, RunResult* out,
             std::vector<TracedRecord>* records) const;
  // The same, continuing a campaign from `state` (see CampaignState). Steps
  // and weeks still count from the plan's start; a cell already full in
  // `state` has full_step = the as-of step.
  void Run(uint64_t seed, uint64_t run_index, const CampaignState& state,
           RunResult* out) const;
  // Trace's counterpart for a continued campaign: the records from the as-of
  // day on (tests only).
  void Trace(uint64_t seed, uint64_t run_index, const CampaignState& state,
             RunResult* out, std::vector<TracedRecord>* records) const;

  int cell_count() const;
  int64_t deadline_steps() const;
  int64_t horizon_steps() const;
  double relaxed_share() const;

 private:
  std::unique_ptr<const CompiledModel> model_;
};

}  // namespace planner

#endif  // PLANNER_SIMULATION_H_
