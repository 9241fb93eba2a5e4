#include "planner/monte_carlo.h"

#include <algorithm>
#include <atomic>
#include <limits>
#include <mutex>
#include <thread>

#include "planner/calendar.h"
#include "planner/forecast.h"
#include "planner/quantile.h"
#include "sim/value_histogram.h"

namespace planner {

int EffectiveThreads(int requested) {
  if (requested > 0) return requested;
  const unsigned hw = std::thread::hardware_concurrency();
  return hw == 0 ? 1 : static_cast<int>(hw);
}

namespace {

// Shared progress count over the chunks of one call.
struct ProgressCount {
  ProgressSink* sink = nullptr;
  std::mutex mutex;
  long done = 0;
  long total = 0;
};

// Runs [first, first + count) of every simulator into chunk[s][0..count).
void RunChunk(const std::vector<const Simulator*>& sims, const MonteCarloOptions& options,
              uint64_t first, long count, std::vector<std::vector<RunResult>>* chunk,
              ProgressCount* progress) {
  const long jobs = count * static_cast<long>(sims.size());
  std::atomic<long> next{0};
  auto worker = [&]() {
    for (long t = next++; t < jobs; t = next++) {
      const size_t s = static_cast<size_t>(t / count);
      const long j = t % count;
      RunResult* out = &(*chunk)[s][static_cast<size_t>(j)];
      const uint64_t run = first + static_cast<uint64_t>(j);
      if (options.state != nullptr) {
        sims[s]->Run(options.seed, run, *options.state, out);
      } else {
        sims[s]->Run(options.seed, run, out);
      }
      if (progress->sink != nullptr) {
        std::lock_guard<std::mutex> lock(progress->mutex);
        progress->sink->Update(++progress->done, progress->total);
      }
    }
  };
  const int threads =
      static_cast<int>(std::min<long>(EffectiveThreads(options.threads), jobs));
  std::vector<std::thread> pool;
  for (int t = 1; t < threads; ++t) pool.emplace_back(worker);
  worker();
  for (std::thread& t : pool) t.join();
}

}  // namespace

void RunMonteCarloInChunks(const std::vector<const Simulator*>& sims,
                           const MonteCarloOptions& options, ProgressSink* progress,
                           const ChunkFold& fold) {
  ProgressCount count;
  count.sink = progress;
  count.total = static_cast<long>(options.runs) * static_cast<long>(sims.size());
  // The chunk's results are reused from one chunk to the next (their
  // per-cell buffers too), so memory stays at one chunk.
  std::vector<std::vector<RunResult>> chunk(sims.size());
  for (long done = 0; done < options.runs;) {
    const long n = std::min<long>(kChunkRuns, options.runs - done);
    for (std::vector<RunResult>& c : chunk) c.resize(static_cast<size_t>(n));
    const uint64_t first = static_cast<uint64_t>(options.first_run + done);
    RunChunk(sims, options, first, n, &chunk, &count);
    fold(first, chunk);
    done += n;
  }
  if (progress != nullptr) progress->Finish();
}

std::vector<RunResult> RunMonteCarlo(const Simulator& sim,
                                     const MonteCarloOptions& options,
                                     ProgressSink* progress) {
  std::vector<RunResult> results;
  results.reserve(static_cast<size_t>(std::max(options.runs, 0)));
  RunMonteCarloInChunks({&sim}, options, progress,
                        [&](uint64_t, const std::vector<std::vector<RunResult>>& chunk) {
                          results.insert(results.end(), chunk[0].begin(), chunk[0].end());
                        });
  return results;
}

namespace {

double CompletionCiWidth(const ValueHistogram& steps, double quantile) {
  const QuantileEstimate q = EstimateQuantile(
      steps.total(),
      [&](long rank) -> std::optional<double> {
        const std::optional<double> step = steps.AtRank(rank);
        if (!step) return std::nullopt;
        return *step / kStepsPerWeek;
      },
      quantile);
  if (!q.ci_lo || !q.ci_hi) return std::numeric_limits<double>::infinity();
  return *q.ci_hi - *q.ci_lo;
}

}  // namespace

PrecisionResult RunToPrecision(const Simulator& sim, const MonteCarloOptions& options,
                               double quantile, double target_weeks, int max_runs,
                               ProgressSink* progress, const ChunkFold& fold) {
  PrecisionResult result;
  // One bucket per step up to the horizon: exact counts of completion steps.
  ValueHistogram completion(static_cast<size_t>(sim.horizon_steps()) + 1);
  MonteCarloOptions batch = options;
  batch.runs = std::min(options.runs, max_runs);
  for (;;) {
    RunMonteCarloInChunks(
        {&sim}, batch, progress,
        [&](uint64_t first, const std::vector<std::vector<RunResult>>& c) {
          for (const RunResult& r : c[0]) completion.Add(r.completion_step);
          fold(first, c);
        });
    ++result.rounds;
    result.runs = completion.total();
    result.ci_width_weeks = CompletionCiWidth(completion, quantile);
    result.target_met = result.ci_width_weeks <= target_weeks;
    const int have = static_cast<int>(result.runs);
    if (result.target_met || have >= max_runs) return result;
    batch.first_run = options.first_run + have;
    batch.runs = std::min(have, max_runs - have);
  }
}

}  // namespace planner
