// Planned changes that reset the counts of cells at 00:00 of a date
// (plan.planned_changes): exact properties of the run loop.
#include <gtest/gtest.h>

#include <vector>

#include "planner/calendar.h"
#include "planner/simulation.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

constexpr int kChangeDay = 10;
constexpr int64_t kChangeStep = kChangeDay * kStepsPerDay;

// The cell's count at the end is the number of records it counted from the
// change on: every record before the change is forgotten (record by record,
// through the traced loop), and the fast loop agrees.
TEST(PlannedChangeTest, OnlyRecordsFromTheChangeOnCount) {
  Plan plan = testing_plans::SingleCellPlan(8.0, 2.0, 4.0, 12.0, 1000000, 20, 4);
  plan.planned_changes = {{"controller update", AddDays(plan.start, kChangeDay), {0}}};
  const Simulator sim(plan);
  for (uint64_t run = 0; run < 3; ++run) {
    RunResult traced, fast;
    std::vector<TracedRecord> records;
    sim.Trace(2, run, &traced, &records);
    sim.Run(2, run, &fast);
    uint32_t before = 0, after = 0;
    for (const TracedRecord& r : records) {
      if (r.cell != 0) continue;
      (r.step < kChangeStep ? before : after) += 1;
    }
    ASSERT_GT(before, 100u);
    EXPECT_EQ(traced.count_at_end[0], after);
    EXPECT_EQ(fast.count_at_end, traced.count_at_end);
    EXPECT_EQ(fast.count_at_deadline, traced.count_at_deadline);
  }
}

// A cell full before the change is open again: it fills again after it, and
// the matrix completes only then. A change dated after completion undoes
// nothing (the same runs as without it: the reset draws no random number).
TEST(PlannedChangeTest, FullCellsFillAgainUnlessTheMatrixWasComplete) {
  Plan plan = testing_plans::ThreeCellPlan();
  const Simulator plain(plan);
  plan.planned_changes = {{"sensor exchange", AddDays(plan.start, kChangeDay), {0}}};
  const Simulator changed(plan);
  int refilled = 0;
  for (uint64_t run = 0; run < 40; ++run) {
    RunResult a, b;
    plain.Run(4, run, &a);
    changed.Run(4, run, &b);
    if (a.completion_step >= 0 && a.completion_step <= kChangeStep) {
      EXPECT_EQ(b.completion_step, a.completion_step) << "run " << run;
      continue;
    }
    if (a.full_step[0] >= 0 && a.full_step[0] <= kChangeStep) {
      ASSERT_GE(b.full_step[0], 0) << "run " << run;
      EXPECT_GT(b.full_step[0], kChangeStep) << "run " << run;
      if (b.completion_step >= 0) EXPECT_GE(b.completion_step, b.full_step[0]);
      ++refilled;
    }
  }
  EXPECT_GT(refilled, 5);
}

}  // namespace
}  // namespace planner
