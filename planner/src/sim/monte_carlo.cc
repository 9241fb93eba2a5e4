#include "planner/monte_carlo.h"

#include <algorithm>
#include <atomic>
#include <limits>
#include <mutex>
#include <thread>

#include "planner/forecast.h"
#include "planner/quantile.h"

namespace planner {

int EffectiveThreads(int requested) {
  if (requested > 0) return requested;
  const unsigned hw = std::thread::hardware_concurrency();
  return hw == 0 ? 1 : static_cast<int>(hw);
}

std::vector<RunResult> RunMonteCarlo(const Simulator& sim,
                                     const MonteCarloOptions& options,
                                     ProgressSink* progress) {
  std::vector<RunResult> results(static_cast<size_t>(options.runs));
  std::atomic<long> next{0};
  long done = 0;
  std::mutex progress_mutex;
  const long total = options.runs;
  auto worker = [&]() {
    for (long i = next++; i < total; i = next++) {
      const uint64_t run = static_cast<uint64_t>(options.first_run + i);
      if (options.state != nullptr) {
        sim.Run(options.seed, run, *options.state, &results[i]);
      } else {
        sim.Run(options.seed, run, &results[i]);
      }
      if (progress != nullptr) {
        std::lock_guard<std::mutex> lock(progress_mutex);
        progress->Update(++done, total);
      }
    }
  };
  const int threads = std::min<long>(EffectiveThreads(options.threads), total);
  std::vector<std::thread> pool;
  for (int t = 1; t < threads; ++t) pool.emplace_back(worker);
  worker();
  for (std::thread& t : pool) t.join();
  if (progress != nullptr) progress->Finish();
  return results;
}

namespace {

double CompletionCiWidth(const std::vector<RunResult>& runs, double quantile) {
  std::vector<double> weeks;
  weeks.reserve(runs.size());
  for (const RunResult& r : runs) {
    weeks.push_back(r.completion_step < 0 ? std::numeric_limits<double>::infinity()
                                          : StepsToWeeks(r.completion_step));
  }
  std::sort(weeks.begin(), weeks.end());
  const QuantileEstimate q = EstimateQuantile(weeks, quantile);
  if (!q.ci_lo || !q.ci_hi) return std::numeric_limits<double>::infinity();
  return *q.ci_hi - *q.ci_lo;
}

}  // namespace

PrecisionResult RunToPrecision(const Simulator& sim, const MonteCarloOptions& options,
                               double quantile, double target_weeks, int max_runs,
                               ProgressSink* progress) {
  PrecisionResult result;
  MonteCarloOptions batch = options;
  batch.first_run = options.first_run;
  batch.runs = std::min(options.runs, max_runs);
  for (;;) {
    std::vector<RunResult> more = RunMonteCarlo(sim, batch, progress);
    for (RunResult& r : more) result.runs.push_back(std::move(r));
    ++result.rounds;
    result.ci_width_weeks = CompletionCiWidth(result.runs, quantile);
    result.target_met = result.ci_width_weeks <= target_weeks;
    const int have = static_cast<int>(result.runs.size());
    if (result.target_met || have >= max_runs) return result;
    batch.first_run = options.first_run + have;
    batch.runs = std::min(have, max_runs - have);
  }
}

}  // namespace planner
