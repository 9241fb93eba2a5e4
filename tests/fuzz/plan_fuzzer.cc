// Fuzz target: the plan reader (ParsePlan) with base_dir = the repository's
// site-models/, so that a `site_model:` line such as coastal-ridge.yaml or
// ../site-models/coastal-ridge.yaml resolves. A plan that loads is then
// checked for unreachable cells and simulated for one short run: a plan that
// loads must be safe to simulate (docs/plan.md).
#include <algorithm>
#include <cstdlib>

#include "fuzz_common.h"
#include "planner/calendar.h"
#include "planner/error.h"
#include "planner/plan_reader.h"
#include "planner/reachability.h"
#include "planner/simulation.h"

extern "C" int LLVMFuzzerTestOneInput(const uint8_t* data, size_t size) {
  planner::Plan plan;
  try {
    plan = planner::ParsePlan(fillcast_fuzz::AsText(data, size), "plan.yaml",
                              FILLCAST_SOURCE_DIR "/site-models");
  } catch (const planner::InputError&) {
    return 0;  // bad input, reported as such: the expected outcome
  }
  const planner::Reachability reach = planner::FindUnreachableCells(plan);
  for (const planner::UnreachableCell& u : reach.cells) {
    if (u.cell < 0 || u.cell >= static_cast<int>(plan.matrix.cells.size())) std::abort();
    if (u.reason.empty()) std::abort();
  }
  // One run of at most two weeks keeps each input fast.
  const int64_t days =
      std::min<int64_t>(planner::DaysBetween(plan.start, plan.deadline), 14);
  plan.deadline = planner::AddDays(plan.start, days);
  plan.horizon_weeks = 2;
  const planner::Simulator sim(plan);
  planner::RunResult result;
  sim.Run(20270301, 0, &result);
  if (result.count_at_end.size() != plan.matrix.cells.size()) std::abort();
  return 0;
}
