// Many simulated campaigns over a thread pool. Run i always uses the stream
// (seed, i) and lands in slot i, so results are identical for any thread
// count.
#ifndef PLANNER_MONTE_CARLO_H_
#define PLANNER_MONTE_CARLO_H_

#include <cstdint>
#include <vector>

#include "planner/progress.h"
#include "planner/simulation.h"

namespace planner {

struct MonteCarloOptions {
  int runs = 2000;    // number of simulated campaigns, >= 1
  uint64_t seed = 1;  // master seed
  int threads = 0;    // worker threads; 0 = all hardware threads
  int first_run = 0;  // index of the first run (to extend a set of runs)
  // Continue a running campaign from this state (progress); null = from the
  // plan's start. Not owned; must outlive the call.
  const CampaignState* state = nullptr;
};

// Runs options.runs campaigns; result[i] is run first_run + i.
std::vector<RunResult> RunMonteCarlo(const Simulator& sim,
                                     const MonteCarloOptions& options,
                                     ProgressSink* progress);

// Runs until the 95 % confidence interval of the completion-time quantile p
// (e.g. 0.8) is at most target_weeks wide, or max_runs is reached. Starts with
// options.runs and doubles the count each round (runs already made are kept:
// run i is always the same campaign, so the result equals one batch of the
// final size). Incomplete runs count as +infinity; an interval that reaches
// them is infinitely wide.
struct PrecisionResult {
  std::vector<RunResult> runs;
  double ci_width_weeks = 0;  // width reached (+infinity if unbounded)
  bool target_met = false;
  int rounds = 0;
};
PrecisionResult RunToPrecision(const Simulator& sim, const MonteCarloOptions& options,
                               double quantile, double target_weeks, int max_runs,
                               ProgressSink* progress);

// Threads actually used for `requested` (0 = hardware concurrency, >= 1).
int EffectiveThreads(int requested);

}  // namespace planner

#endif  // PLANNER_MONTE_CARLO_H_
