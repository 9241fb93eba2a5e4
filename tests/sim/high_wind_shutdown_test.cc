// High-wind stops and restarts in the run loop (sim/high_wind_shutdown.h):
// stops on short-term averages drawn with the probability of the exceedance
// model for each record's own mean and TI, the restart wait, storm control,
// and the traced and fast loops agreeing with all of them in use.
#include <gtest/gtest.h>

#include <cmath>
#include <vector>

#include "model/short_term_exceedance.h"
#include "planner/simulation.h"
#include "sim/compiled_model.h"
#include "sim/high_wind_shutdown.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

using testing_plans::SingleCellPlan;

// A windy site (Weibull A 14 m/s, k 2, wind persistence 6 h), IEC NTM class A
// turbulence, cut-in 3, cut-out 25, restart 20 m/s, a production cell that
// never fills, four weeks.
Plan WindyPlan() {
  Plan plan = SingleCellPlan(14.0, 2.0, 3.0, 25.0, 1000000, 7, 4);
  plan.site.wind_persistence_h = 6;
  plan.site.turbulence.kind = TurbulenceModel::Kind::kIecNtm;
  plan.site.turbulence.i_ref = 0.16;
  plan.turbine.cut_in_ms = 3.0;
  plan.turbine.rated_ms = 11.0;
  plan.turbine.cut_out_ms = 25.0;
  plan.turbine.restart_ms = 20.0;
  return plan;
}

std::vector<TracedRecord> Records(const Plan& plan, uint64_t run) {
  const Simulator sim(plan);
  RunResult result;
  std::vector<TracedRecord> records;
  sim.Trace(11, run, &result, &records);
  return records;
}

bool Producing(const TracedRecord& r) { return r.state != OperatingState::kParked; }

// Every record in which the turbine ran before (so it was not stopped) at a
// speed from the trip floor to cut-out must have had its TI drawn, and the
// number of stops among them must be the sum of the exceedance model's
// probabilities for those records, within the Poisson-binomial standard
// error (exact property of the sampling; the model itself is checked against
// a direct simulation in tests/model/short_term_exceedance_test.cc).
TEST(HighWindShutdownTest, StopsComeWithTheModelsProbabilityForEachRecord) {
  Plan plan = WindyPlan();
  plan.turbine.shutdown_rules = {{3.0, 28.0}};
  const CompiledModel model = CompileModel(plan);
  const double floor_ms = model.shutdown.trip_floor_ms;
  ASSERT_LT(floor_ms, 20.0);  // the gust rule reaches well below cut-out
  RecordSpectrum spectrum;     // no hub height: L_1u = 340.2 m (hub >= 60 m)
  double expected = 0, variance = 0;
  int stops = 0, candidates = 0;
  for (uint64_t run = 0; run < 24; ++run) {
    const std::vector<TracedRecord> records = Records(plan, run);
    for (size_t i = 1; i < records.size(); ++i) {
      const TracedRecord& r = records[i];
      if (!Producing(records[i - 1]) || r.speed_ms < floor_ms || r.speed_ms >= 25.0)
        continue;
      ASSERT_FALSE(std::isnan(r.ti)) << "record " << r.step << " has no TI";
      spectrum.mean_speed_ms = r.speed_ms;
      const double p =
          ShortTermExceedanceProbability(spectrum, r.ti * r.speed_ms, 3.0, 28.0);
      expected += p;
      variance += p * (1 - p);
      stops += !Producing(r);
      ++candidates;
    }
  }
  ASSERT_GT(candidates, 10000);
  ASSERT_GT(expected, 1000.0);
  EXPECT_NEAR(stops, expected, 4.0 * std::sqrt(variance));
}

// Without short-term rules no record below cut-out stops a running turbine.
TEST(HighWindShutdownTest, WithoutRulesOnlyTheTenMinuteMeanStops) {
  const Plan plan = WindyPlan();
  EXPECT_EQ(CompileModel(plan).shutdown.attention_ms(), 25.0);
  int stops_above = 0;
  for (uint64_t run = 0; run < 3; ++run) {
    const std::vector<TracedRecord> records = Records(plan, run);
    for (size_t i = 1; i < records.size(); ++i) {
      if (!Producing(records[i - 1]) || Producing(records[i]) ||
          records[i].speed_ms < plan.turbine.cut_in_ms)
        continue;
      EXPECT_GE(records[i].speed_ms, 25.0) << "record " << records[i].step;
      ++stops_above;
    }
  }
  EXPECT_GT(stops_above, 10);
}

// After a stop the turbine restarts in the first record that ends wait
// records in a row below the restart speed (the record itself included), and
// not before (exact property, record by record).
TEST(HighWindShutdownTest, RestartWaitsTheGivenRecordsBelowTheRestartSpeed) {
  Plan plan = WindyPlan();
  plan.turbine.restart_wait_min = 25;  // three records
  constexpr int kWait = 3;
  int restarts = 0;
  for (uint64_t run = 0; run < 4; ++run) {
    const std::vector<TracedRecord> records = Records(plan, run);
    int below = 0;  // records below restart in a row while stopped
    bool stopped = false;
    for (const TracedRecord& r : records) {
      if (r.speed_ms < plan.turbine.cut_in_ms) {  // stopped or not: cannot tell
        stopped = false, below = 0;
        continue;
      }
      if (!stopped) {
        stopped = !Producing(r);
        if (stopped) EXPECT_GE(r.speed_ms, 25.0) << "record " << r.step;
        continue;
      }
      below = r.speed_ms < 20.0 ? below + 1 : 0;
      const bool should_run = r.speed_ms < 25.0 && below > kWait;
      EXPECT_EQ(Producing(r), should_run) << "record " << r.step;
      if (should_run) ++restarts, stopped = false, below = 0;
    }
  }
  EXPECT_GT(restarts, 5);
}

// Storm control: the turbine runs on in the reduced state from from_ms up to
// the 10-minute stop and in the normal state below it; it never produces at
// or above the stop.
TEST(HighWindShutdownTest, StormControlRunsReducedInItsBand) {
  Plan plan = WindyPlan();
  plan.turbine.storm_control_from_ms = 22.0;
  plan.turbine.cut_out_ms = 28.0;
  int reduced = 0;
  for (uint64_t run = 0; run < 3; ++run) {
    for (const TracedRecord& r : Records(plan, run)) {
      if (!Producing(r)) continue;
      EXPECT_LT(r.speed_ms, 28.0) << "record " << r.step;
      EXPECT_EQ(r.state == OperatingState::kReduced, r.speed_ms >= 22.0)
          << "record " << r.step;
      reduced += r.state == OperatingState::kReduced;
    }
  }
  EXPECT_GT(reduced, 100);
}

// The tabulated trip probability against the exceedance model computed
// directly, between grid speeds (linear interpolation of the moments).
TEST(HighWindShutdownTest, TabulatedProbabilityFollowsTheModel) {
  Plan plan = WindyPlan();
  plan.turbine.shutdown_rules = {{30.0, 27.0}, {3.0, 31.0}};
  const CompiledModel model = CompileModel(plan);
  RecordSpectrum spectrum;
  for (double v = 12.03; v < 25.0; v += 0.77) {
    for (double ti : {0.08, 0.15, 0.25}) {
      spectrum.mean_speed_ms = v;
      const double sigma = ti * v;
      const double direct =
          std::max(ShortTermExceedanceProbability(spectrum, sigma, 30.0, 27.0),
                   ShortTermExceedanceProbability(spectrum, sigma, 3.0, 31.0));
      EXPECT_NEAR(model.shutdown.TripProbability(v, sigma), direct,
                  1e-3 * direct + 1e-9)
          << "at " << v << " m/s, TI " << ti;
    }
  }
}

}  // namespace
}  // namespace planner
