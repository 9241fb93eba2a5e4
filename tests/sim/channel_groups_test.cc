// Load-channel groups (sim/channel_groups.h): each group an alternating
// renewal process with an optional recalibration after each repair, and
// their effect on what a record counts in a run.
#include <gtest/gtest.h>

#include <cmath>
#include <cstdint>
#include <vector>

#include "planner/calendar.h"
#include "planner/simulation.h"
#include "sim/channel_groups.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

ChannelGroup Group(const char* name, double mtbf_h, double mttr_h) {
  ChannelGroup g;
  g.name = name;
  g.failures = testing_plans::Outages(mtbf_h, mttr_h);
  return g;
}

struct Walked {
  double up_share = 0;  // of the steps, group 0 counting
  double se = 0;        // batch-means standard error of up_share
  int64_t repairs = 0;  // repairs of group 0 seen
};

// Walks one group over `days`, each step with the given mean wind and crew,
// and the share of steps it counts, with its standard error from 50 batches
// (long against an up-and-down cycle).
Walked Walk(const ChannelGroupLaw& law, int64_t days, double speed_ms, bool crew,
            uint64_t seed) {
  const std::vector<ChannelGroupLaw> laws = {law};
  const std::vector<uint8_t> months(days, 0);
  ChannelGroups groups(laws, {MakeRunEngine(seed, 0)}, months.data(), days);
  const int64_t steps = days * kStepsPerDay;
  const int batches = 50;
  std::vector<double> batch_up(batches, 0.0);
  Walked w;
  uint32_t before = 0;
  for (int64_t step = 0; step < steps; ++step) {
    if (step >= groups.NextChangeStep() || step == 0) groups.UpdateAt(step);
    const uint32_t down = groups.down();
    if ((before & 1u) && !(down & 1u)) ++w.repairs;
    before = down;
    batch_up[step * batches / steps] += down == 0;
    if (groups.recalibrating()) groups.Observe(speed_ms, crew);
  }
  double sum = 0, sum2 = 0;
  for (double& b : batch_up) {
    b /= static_cast<double>(steps / batches);
    sum += b, sum2 += b * b;
  }
  w.up_share = sum / batches;
  w.se = std::sqrt((sum2 / batches - w.up_share * w.up_share) / (batches - 1));
  return w;
}

// Without recalibration a group counts MTBF / (MTBF + MTTR) of the time
// (renewal-reward theorem; reliability-engineering textbooks, e.g.
// Birolini, Reliability Engineering; from memory), within 4 standard errors.
TEST(ChannelGroupsTest, AvailabilityIsMtbfOverCycle) {
  const ChannelGroupLaw law = MakeChannelGroupLaw(Group("blade", 300, 40));
  const Walked w = Walk(law, 40 * 365, 20.0, false, 5);
  const double expected = 300.0 / 340.0;
  EXPECT_NEAR(w.up_share, expected, 4.0 * w.se);
  EXPECT_LT(w.se, 0.01);  // the check has power
}

// A recalibration that needs 30 h of wind below 6 m/s, in wind that is
// always below it and with the crew needed and present. The channels' own
// failure clock runs from the repair (a group may fail again while it is
// being recalibrated), so per cycle a group with exponential up times U
// counts max(U - r, 0), of mean MTBF exp(-r / MTBF): the share counted is
// MTBF exp(-r / MTBF) / (MTBF + MTTR) (renewal-reward theorem, as above;
// exact for the model), within 4 standard errors.
TEST(ChannelGroupsTest, RecalibrationTakesItsHoursFromEachUpTime) {
  ChannelGroup g = Group("blade", 300, 40);
  g.recalibration = Recalibration{true, 30.0, 6.0, true};
  const ChannelGroupLaw law = MakeChannelGroupLaw(g);
  EXPECT_EQ(law.recalibration_steps, 180);
  const Walked w = Walk(law, 40 * 365, 4.0, true, 5);
  EXPECT_NEAR(w.up_share, 300.0 * std::exp(-30.0 / 300.0) / 340.0, 4.0 * w.se);
  EXPECT_LT(w.se, 0.01);
  // Same seed without the recalibration: the same failures and repairs, and
  // more time counted.
  const Walked plain = Walk(MakeChannelGroupLaw(Group("blade", 300, 40)), 40 * 365, 4.0,
                            true, 5);
  EXPECT_GT(plain.up_share, w.up_share + 4.0 * w.se);
}

// The conditions must hold: in wind always above below_ms, or without the
// crew when it is needed, a repaired group never counts again.
TEST(ChannelGroupsTest, RecalibrationWaitsForItsConditions) {
  ChannelGroup g = Group("blade", 100, 10);
  g.recalibration = Recalibration{true, 2.0, 6.0, true};
  const ChannelGroupLaw law = MakeChannelGroupLaw(g);
  const Walked windy = Walk(law, 200, 9.0, true, 3);
  EXPECT_EQ(windy.repairs, 0);
  const Walked no_crew = Walk(law, 200, 3.0, false, 3);
  EXPECT_EQ(no_crew.repairs, 0);
  g.recalibration.crew = false;
  const Walked crew_free = Walk(MakeChannelGroupLaw(g), 200, 3.0, false, 3);
  EXPECT_GT(crew_free.repairs, 5);
}

// Two production cells; the 6-8 m/s cell needs both groups, the 12-14 m/s
// cell only "tower". In traced runs a record counts for a cell only while
// the groups that cell needs are up; with only "blade" down the tower-only
// cell still counts; the shorter loop agrees with the traced one.
TEST(ChannelGroupsTest, ARecordCountsOnlyWhileItsCellsGroupsAreUp) {
  Plan plan = testing_plans::ThreeCellPlan();
  plan.turbine_outages = OutageModel{};
  plan.channel_groups = {Group("blade", 200, 30), Group("tower", 500, 20)};
  plan.channel_groups[0].recalibration = Recalibration{true, 2.0, 7.0, false};
  plan.matrix.cells[1].channels = 0b10;  // tower only
  for (Cell& c : plan.matrix.cells) c.required = 100000;  // never full
  const Simulator sim(plan);
  RunResult traced, fast;
  std::vector<TracedRecord> records;
  int64_t counted_with_blade_down = 0, lost_to_channels = 0;
  for (uint64_t run = 0; run < 3; ++run) {
    sim.Trace(11, run, &traced, &records);
    for (const TracedRecord& r : records) {
      if (r.cell >= 0) {
        const uint32_t needs = r.cell == 1 ? 0b10u : 0b11u;
        EXPECT_EQ(r.channels_down & needs, 0u) << "record " << r.step;
        counted_with_blade_down += r.channels_down == 0b01u;
      }
      lost_to_channels += r.cell < 0 && r.valid && r.channels_down != 0 &&
                          r.speed_ms >= 6 && r.speed_ms < 8 && r.turbine_up;
    }
    sim.Run(11, run, &fast);
    EXPECT_EQ(fast.count_at_end, traced.count_at_end) << "run " << run;
    EXPECT_EQ(fast.channels_up_steps, traced.channels_up_steps) << "run " << run;
  }
  EXPECT_GT(counted_with_blade_down, 0);
  EXPECT_GT(lost_to_channels, 0);
}

// The share of time every group counts, summed by the loop, equals the
// share of traced records with no group down.
TEST(ChannelGroupsTest, LoopCountsTheTimeEveryGroupIsUp) {
  Plan plan = testing_plans::ThreeCellPlan();
  plan.channel_groups = {Group("blade", 150, 30)};
  plan.channel_groups[0].recalibration = Recalibration{true, 1.0, 8.0, true};
  const Simulator sim(plan);
  RunResult result;
  std::vector<TracedRecord> records;
  sim.Trace(4, 0, &result, &records);
  int64_t up = 0;
  for (const TracedRecord& r : records) up += r.channels_down == 0;
  EXPECT_EQ(result.channels_up_steps, up);
  EXPECT_LT(up, static_cast<int64_t>(records.size()));
}

}  // namespace
}  // namespace planner
