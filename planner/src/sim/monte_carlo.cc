#include "planner/monte_carlo.h"

#include <algorithm>
#include <atomic>
#include <mutex>
#include <thread>

namespace planner {

int EffectiveThreads(int requested) {
  if (requested > 0) return requested;
  const unsigned hw = std::thread::hardware_concurrency();
  return hw == 0 ? 1 : static_cast<int>(hw);
}

std::vector<RunResult> RunMonteCarlo(const Simulator& sim, const MonteCarloOptions& options,
                                     ProgressSink* progress) {
  std::vector<RunResult> results(static_cast<size_t>(options.runs));
  std::atomic<long> next{0};
  long done = 0;
  std::mutex progress_mutex;
  const long total = options.runs;
  auto worker = [&]() {
    for (long i = next++; i < total; i = next++) {
      sim.Run(options.seed, static_cast<uint64_t>(options.first_run + i), &results[i]);
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

}  // namespace planner
