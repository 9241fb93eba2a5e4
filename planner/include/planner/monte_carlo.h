// Many simulated campaigns over a thread pool. Run i always uses the stream
// (seed, i) and lands in slot i, so results are identical for any thread
// count.
//
// Memory: the commands run in chunks of kChunkRuns runs; each chunk is
// handed to a fold (a ForecastAccumulator, planner/forecast_accumulator.h)
// in run order and then reused, so at most kChunkRuns results per simulator
// are held at a time, whatever options.runs is.
#ifndef PLANNER_MONTE_CARLO_H_
#define PLANNER_MONTE_CARLO_H_

#include <cstdint>
#include <functional>
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

// Runs per chunk of RunMonteCarloInChunks.
inline constexpr int kChunkRuns = 2048;

// chunk[s][j] is run first_run + j of simulator s; every chunk but the last
// holds kChunkRuns runs of each simulator.
using ChunkFold = std::function<void(uint64_t first_run,
                                     const std::vector<std::vector<RunResult>>& chunk)>;

// Runs options.runs campaigns of each simulator (run i of every simulator on
// stream (seed, i): common random numbers) in chunks, calling fold once per
// chunk, in run order, from the calling thread. Progress counts the runs of
// all simulators; Finish is called at the end.
void RunMonteCarloInChunks(const std::vector<const Simulator*>& sims,
                           const MonteCarloOptions& options, ProgressSink* progress,
                           const ChunkFold& fold);

// Runs options.runs campaigns; result[i] is run first_run + i. Holds every
// run: for tests and small run counts (the commands fold chunks instead).
std::vector<RunResult> RunMonteCarlo(const Simulator& sim,
                                     const MonteCarloOptions& options,
                                     ProgressSink* progress);

// Runs until the 95 % confidence interval of the completion-time quantile p
// (e.g. 0.8) is at most target_weeks wide, or max_runs is reached. Starts with
// options.runs and doubles the count each round (runs already made are kept:
// run i is always the same campaign, so the result equals one batch of the
// final size). Every run is passed to fold, in run order, chunk by chunk
// (chunk[0] of ChunkFold); the interval is read from exact counts of
// completion steps, so memory does not grow with the runs. Incomplete runs
// count as +infinity; an interval that reaches them is infinitely wide.
struct PrecisionResult {
  long runs = 0;              // runs made and folded
  double ci_width_weeks = 0;  // width reached (+infinity if unbounded)
  bool target_met = false;
  int rounds = 0;
};
PrecisionResult RunToPrecision(const Simulator& sim, const MonteCarloOptions& options,
                               double quantile, double target_weeks, int max_runs,
                               ProgressSink* progress, const ChunkFold& fold);

// Threads actually used for `requested` (0 = hardware concurrency, >= 1).
int EffectiveThreads(int requested);

}  // namespace planner

#endif  // PLANNER_MONTE_CARLO_H_
