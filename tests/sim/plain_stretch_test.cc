// The forecast loop takes a shorter path through stretches in which no
// curtailment rule is in force and the outage and direction states hold
// (PlainStretch in sim/simulation.cc); the traced loop, used to rebuild
// campaign logs, never takes it and works every record in full (Step). Same
// seed, same run: every result must agree exactly. The plans exercise every
// feature that the shorter path leaves out or hands back: curtailment in
// force, manual tests with the crew on site, production starts and stops,
// turbine and acquisition outages, planned outages, parked records counted
// during outages, replayed weather, a campaign continued from a log.
#include <gtest/gtest.h>

#include <memory>
#include <string>
#include <vector>

#include "io/met_csv_reader.h"
#include "model/irish_wind_data.h"
#include "planner/calendar.h"
#include "planner/plan_reader.h"
#include "planner/replay.h"
#include "planner/simulation.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

Plan DemoPlan(const std::string& file) {
  Plan plan = LoadPlan(std::string(FILLCAST_SOURCE_DIR) + "/demo-site/" + file);
  plan.horizon_weeks = 60;  // long enough for summer curtailment and a winter
  return plan;
}

// state: continue a campaign from it (null: from the plan's start).
void ExpectSameRuns(const Plan& plan, const std::string& what,
                    const CampaignState* state = nullptr) {
  const Simulator sim(plan);
  for (uint64_t seed : {1u, 7u}) {
    for (uint64_t run = 0; run < 4; ++run) {
      RunResult fast, full;
      std::vector<TracedRecord> records;
      if (state != nullptr) {
        sim.Run(seed, run, *state, &fast);
        sim.Trace(seed, run, *state, &full, &records);
      } else {
        sim.Run(seed, run, &fast);
        sim.Trace(seed, run, &full, &records);
      }
      const std::string where =
          what + ", seed " + std::to_string(seed) + ", run " + std::to_string(run);
      EXPECT_EQ(fast.completion_step, full.completion_step) << where;
      EXPECT_EQ(fast.last_cell, full.last_cell) << where;
      EXPECT_EQ(fast.count_at_deadline, full.count_at_deadline) << where;
      EXPECT_EQ(fast.count_at_end, full.count_at_end) << where;
      EXPECT_EQ(fast.full_step, full.full_step) << where;
      EXPECT_EQ(fast.relaxed_full_step, full.relaxed_full_step) << where;
      EXPECT_EQ(fast.simulated_steps, full.simulated_steps) << where;
      EXPECT_EQ(fast.turbine_up_steps, full.turbine_up_steps) << where;
      EXPECT_EQ(fast.daq_up_steps, full.daq_up_steps) << where;
      EXPECT_EQ(fast.channels_up_steps, full.channels_up_steps) << where;
      EXPECT_EQ(fast.valid_sector_steps, full.valid_sector_steps) << where;
      EXPECT_EQ(fast.curtailed_steps, full.curtailed_steps) << where;
      // The same sums in the same order: equal to the last bit.
      EXPECT_EQ(fast.speed_sum_ms, full.speed_sum_ms) << where;
    }
  }
}

TEST(PlainStretchTest, DemoPlanRunsAgreeWithTheFullLoop) {
  const Plan plan = DemoPlan("plan.yaml");
  ASSERT_FALSE(plan.curtailment.empty());
  ExpectSameRuns(plan, "demo plan");
}

TEST(PlainStretchTest, SecondDemoPlanRunsAgreeWithTheFullLoop) {
  ExpectSameRuns(DemoPlan("plan-estuary.yaml"), "estuary plan");
}

// Stops on short-term averages, a restart wait and storm control: records at
// or above the shutdown unit's attention speed and those while the turbine
// is stopped go to the full step from the shorter path; both loops must draw
// the same stops.
TEST(PlainStretchTest, HighWindShutdownAgreesWithTheFullLoop) {
  Plan plan = DemoPlan("plan.yaml");
  plan.turbine.shutdown_rules = {{30.0, 27.0}, {3.0, 31.0}};
  plan.turbine.restart_wait_min = 30;
  ExpectSameRuns(plan, "short-term shutdown rules and restart wait");
  plan.turbine.storm_control_from_ms = plan.turbine.cut_out_ms - 3.0;
  ExpectSameRuns(plan, "and storm control");
}

// Episodes (icing) that stop the turbine or make records invalid: outage-like
// state changes at their own steps; parked records counted during them too.
TEST(PlainStretchTest, EpisodesAgreeWithTheFullLoop) {
  Plan plan = DemoPlan("plan.yaml");
  ASSERT_FALSE(plan.episodes.empty());
  plan.episodes[0].starts_per_month.fill(3.0);  // episodes all year round
  ExpectSameRuns(plan, "episodes all year");
  plan.episodes[0].stops_turbine = false;
  plan.parked_counts_during_outage = true;
  ExpectSameRuns(plan, "invalidating episodes, parked counts during outages");
}

// Parked records counted while the turbine is out: those stretches take the
// full path; the ones around them the shorter one.
TEST(PlainStretchTest, ParkedCountsDuringOutagesAgreeWithTheFullLoop) {
  Plan plan = DemoPlan("plan.yaml");
  plan.parked_counts_during_outage = true;
  ExpectSameRuns(plan, "parked counts during outages");
}

// Parked records counted during long turbine outages, in the only cell: the
// matrix mostly completes while the turbine is down, and the run must stop
// at that record (the deadline has passed) whichever loop counts it.
TEST(PlainStretchTest, CompletionDuringAnOutageAgreesWithTheFullLoop) {
  Plan plan = testing_plans::SingleCellPlan(8.0, 2.0, 0.0, 60.0, 300);
  plan.matrix.cells[0].state = OperatingState::kParked;
  plan.matrix.grids[0].state = OperatingState::kParked;
  plan.turbine_outages = testing_plans::Outages(20, 40);
  plan.parked_counts_during_outage = true;
  // Persistent direction and wind, so that stretches are long.
  plan.site.sector_persistence = 0.99;
  plan.site.wind_persistence_h = 12;
  ExpectSameRuns(plan, "completion during an outage");
}

// A campaign continued from logged counts and the latest wind, half-way
// through its first summer (curtailment in force at night), with some cells
// full already and others part-way.
TEST(PlainStretchTest, ContinuedCampaignAgreesWithTheFullLoop) {
  const Plan plan = DemoPlan("plan.yaml");
  CampaignState state;
  state.elapsed_days = 120;
  const int cells = Simulator(plan).cell_count();
  for (int c = 0; c < cells; ++c) state.counts.push_back(static_cast<uint32_t>(c % 12));
  state.has_last_wind = true;
  state.last_speed_ms = 9.5;
  state.last_direction_deg = 250;
  ExpectSameRuns(plan, "continued campaign", &state);
}

// Replayed weather (the open Irish daily data, tests/data/irish-daily-wind)
// goes through the same two loops.
TEST(PlainStretchTest, ReplayedWeatherAgreesWithTheFullLoop) {
  MetCsvOptions csv;
  csv.time_column = "date";
  csv.speed_column = "MAL";
  csv.units = SpeedUnit::kKnots;
  ReplayOptions options;
  Plan plan = DemoPlan("plan.yaml");
  plan.replay = std::make_shared<const WeatherReplay>(
      BuildWeatherReplay(LoadMetCsv(irish_wind::SpeedsFile(), csv), options));
  ExpectSameRuns(plan, "replayed weather");
}

}  // namespace
}  // namespace planner
