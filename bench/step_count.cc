// Simulates a few runs of a plan on one thread and prints how many 10-minute
// steps they simulated, so that an instruction count taken with callgrind
// can be divided by it (docs/performance.md):
//   valgrind --tool=callgrind build/bench/fillcast_step_count demo-site/plan.yaml 10
#include <cstdio>
#include <cstdlib>

#include "planner/error.h"
#include "planner/plan_reader.h"
#include "planner/simulation.h"

int main(int argc, char** argv) {
  if (argc != 3) {
    std::fprintf(stderr, "usage: fillcast_step_count PLAN.yaml RUNS\n");
    return 2;
  }
  try {
    const planner::Simulator sim(planner::LoadPlan(argv[1]));
    const long runs = std::strtol(argv[2], nullptr, 10);
    planner::RunResult result;
    long long steps = 0;
    for (long run = 0; run < runs; ++run) {
      sim.Run(1, static_cast<uint64_t>(run), &result);
      steps += result.simulated_steps;
    }
    std::printf("%lld simulated steps in %ld runs\n", steps, runs);
  } catch (const planner::InputError& e) {
    std::fprintf(stderr, "%s\n", e.what());
    return 2;
  }
  return 0;
}
