// Simulation speed on the demo plan: simulated 10-minute steps per second,
// for one core and for the thread pool. Run (see docs/performance.md):
//   build/bench/fillcast_bench --benchmark_counters_tabular=true
#include <benchmark/benchmark.h>

#include <string>

#include "planner/monte_carlo.h"
#include "planner/plan_reader.h"
#include "planner/simulation.h"

namespace {

const planner::Plan& DemoPlan() {
  static const planner::Plan plan =
      planner::LoadPlan(std::string(FILLCAST_SOURCE_DIR) + "/demo-site/plan.yaml");
  return plan;
}

// One campaign after another on one core.
void BM_SingleCoreRuns(benchmark::State& state) {
  const planner::Simulator sim(DemoPlan());
  planner::RunResult result;
  uint64_t run = 0;
  int64_t steps = 0;
  for (auto _ : state) {
    sim.Run(1, run++, &result);
    steps += result.simulated_steps;
  }
  state.counters["steps_per_s"] =
      benchmark::Counter(static_cast<double>(steps), benchmark::Counter::kIsRate);
}
BENCHMARK(BM_SingleCoreRuns)->Unit(benchmark::kMillisecond)->MinTime(2.0);

// The Monte-Carlo driver with 1 and 2 worker threads: wall-clock rate, so the
// ratio of the two is the thread scaling.
void BM_MonteCarloThreads(benchmark::State& state) {
  const planner::Simulator sim(DemoPlan());
  planner::MonteCarloOptions mc;
  mc.runs = 64;
  mc.threads = static_cast<int>(state.range(0));
  int64_t steps = 0;
  for (auto _ : state) {
    const auto results = planner::RunMonteCarlo(sim, mc, nullptr);
    for (const auto& r : results) steps += r.simulated_steps;
    mc.seed++;
  }
  state.counters["steps_per_s"] =
      benchmark::Counter(static_cast<double>(steps), benchmark::Counter::kIsRate);
}
BENCHMARK(BM_MonteCarloThreads)
    ->Arg(1)
    ->Arg(2)
    ->Unit(benchmark::kMillisecond)
    ->UseRealTime();

}  // namespace

BENCHMARK_MAIN();
