// Unreachable cells (planner/reachability.h): each rule of the static check
// with its exact sentence, the near misses it must not report, and agreement
// with the simulation itself: a cell reported unreachable gets no record in
// any simulated run, and its reachable neighbour does.
#include "planner/reachability.h"

#include <gtest/gtest.h>

#include <string>
#include <vector>

#include "io/reader_test_util.h"
#include "planner/simulation.h"

namespace planner {
namespace {

using reader_test::ParseTestPlan;
using reader_test::Replace;

// Site: the shipped estuary flats (12 sectors, IEC turbulence). The lines
// marked below are edited by the cases.
const std::string kBase =
    "name: Reachability\n"
    "site_model: estuary-flats.yaml\n"
    "campaign: {start: 2027-01-01, deadline: 2027-02-01, horizon_weeks: 8}\n"
    "turbine: {name: T1, cut_in_ms: 3, rated_ms: 11, cut_out_ms: 25, restart_ms: 22}\n"
    "#EXTRA\n"
    "capture_matrix:\n"
    "  production:\n"
    "    wind_bins_ms: [4, 6, 8]\n"
    "    min_records: 2\n"
    "#CELLS\n";

std::vector<std::string> Reasons(const std::string& text) {
  std::vector<std::string> out;
  for (const UnreachableCell& u : FindUnreachableCells(ParseTestPlan(text)).cells) {
    out.push_back(u.reason);
  }
  return out;
}

std::string With(const std::string& extra, const std::string& cells) {
  return Replace(Replace(kBase, "#EXTRA", extra), "#CELLS", cells);
}

TEST(ReachabilityTest, OrdinaryPlanHasNoUnreachableCell) {
  const Reachability r = FindUnreachableCells(ParseTestPlan(kBase));
  EXPECT_TRUE(r.cells.empty());
  EXPECT_TRUE(r.CanComplete());
  EXPECT_EQ(UnreachableAdvice(r), "");
}

TEST(ReachabilityTest, ShippedDemoPlansHaveNoUnreachableCell) {
  for (const char* plan : {"demo-site/plan.yaml", "demo-site/plan-estuary.yaml"}) {
    SCOPED_TRACE(plan);
    EXPECT_TRUE(
        FindUnreachableCells(LoadPlan(reader_test::SourcePath(plan))).cells.empty());
  }
}

// Parked records come below cut-in, from restart_ms up after a high-wind
// stop, under a stop rule, or during outages that count (docs/plan.md,
// "turbine" and "outages"); mid-range wind with an available turbine is
// production.
TEST(ReachabilityTest, ParkedCellInMidRangeWindIsReported) {
  const std::string text = With("",
                                "  parked:\n    wind_bins_ms: [[10, 12], [23, 24]]\n"
                                "    min_records: 1\n");
  const std::vector<std::string> reasons = Reasons(text);
  ASSERT_EQ(reasons.size(), 1u);
  EXPECT_EQ(reasons[0],
            "Cell parked 10-12 m/s can never fill: a record is parked only below cut-in "
            "(3 m/s), from the restart speed (22 m/s) up after a high-wind stop, while a "
            "curtailment stop rule applies, during a park test (manual_tests.parking), or "
            "during a turbine outage with "
            "outages.parked_counts_during_outage: true; none of these can happen at "
            "10-12 m/s, where an available turbine produces.");
  const Reachability r = FindUnreachableCells(ParseTestPlan(text));
  EXPECT_EQ(r.cells[0].cell, 2);  // after the two production cells
  EXPECT_TRUE(r.cells[0].required);
  EXPECT_EQ(r.required_unreachable, 1);
  EXPECT_EQ(UnreachableAdvice(r),
            "The capture matrix cannot complete as planned: no simulated run can "
            "complete, and each runs to the horizon. Make the cell optional, remove it "
            "(min_records: 0), or change the plan so that it can fill.");
}

TEST(ReachabilityTest, ParkedCellBecomesReachableByStopRuleOrCountedOutages) {
  const std::string cells =
      "  parked:\n    wind_bins_ms: [[10, 12]]\n    min_records: 1\n";
  // A stop rule at some time of the year is enough.
  EXPECT_TRUE(
      Reasons(With("curtailment:\n  - {name: bats, months: [7], wind_ms: [0, 11], "
                   "action: stop}",
                   cells))
          .empty());
  // A park test by the crew (manual_tests.parking).
  EXPECT_TRUE(Reasons(With("manual_tests:\n  parking:\n    - {name: park, wind_ms: [8, 14], "
                           "hours: 2}",
                           cells))
                  .empty());
  // Random turbine outages whose records count as parked.
  EXPECT_TRUE(Reasons(With("outages:\n  turbine: {mtbf_h: 400, mttr_h: 36}\n"
                           "  parked_counts_during_outage: true",
                           cells))
                  .empty());
  // Outages whose records do not count leave it unreachable.
  EXPECT_EQ(Reasons(With("outages:\n  turbine: {mtbf_h: 400, mttr_h: 36}", cells)).size(),
            1u);
}

// A normal stop is production ending with the turbine available: wind below
// cut-in, at cut-out, or a stop rule (docs/plan.md, "Event cells").
TEST(ReachabilityTest, NormalStopInMidRangeWindIsReported) {
  const std::string events =
      "  events:\n"
      "    - {event: normal_stop, wind_ms: [10, 14], min_records: 1}\n"
      "    - {event: normal_stop, wind_ms: [0, 3], min_records: 1}\n"
      "    - {event: normal_stop, wind_ms: [24, 26], min_records: 1, optional: true}\n";
  const std::vector<std::string> reasons = Reasons(With("", events));
  ASSERT_EQ(reasons.size(), 1u);
  EXPECT_EQ(reasons[0],
            "Cell event normal_stop 10-14 m/s can never fill: a normal stop happens only "
            "when the wind drops below cut-in (3 m/s), reaches cut-out (25 m/s) or a "
            "curtailment stop rule starts to apply, and none of these can happen at "
            "10-14 m/s.");
  // With a stop rule reaching into 10-14 m/s at night, it can.
  EXPECT_TRUE(
      Reasons(With("curtailment:\n  - {name: noise, hours: [22, 6], wind_ms: [8, 11], "
                   "action: stop}",
                   events))
          .empty());
}

TEST(ReachabilityTest, ManualTestCellBelowCutInIsReported) {
  const std::string extra =
      "manual_tests:\n  tests:\n    - {name: emergency_stop, wind_ms: [1, 5]}";
  const std::string events =
      "  events:\n"
      "    - {event: emergency_stop, wind_ms: [1, 3], min_records: 1}\n"
      "    - {event: emergency_stop, wind_ms: [3, 5], min_records: 1}\n";
  const std::vector<std::string> reasons = Reasons(With(extra, events));
  ASSERT_EQ(reasons.size(), 1u);
  EXPECT_EQ(reasons[0],
            "Cell event emergency_stop 1-3 m/s can never fill: manual test "
            "emergency_stop is done only while the turbine produces normally (from "
            "cut-in, 3 m/s, to cut-out, 25 m/s, with no curtailment rule in force) and "
            "the wind is in its window 1-5 m/s; no speed of 1-3 m/s meets both.");
}

TEST(ReachabilityTest, CurtailmentInForceAtAllTimesIsReported) {
  // Every month, every hour, every direction: 5-8 m/s never produces
  // normally; the rule with months [1..11] leaves December.
  const std::string always =
      "curtailment:\n  - {name: permit, wind_ms: [5, 9], action: stop}\n"
      "  - {name: dusk, months: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11], wind_ms: [3, 5], "
      "action: stop}";
  const std::string cells = "  parked:\n    wind_bins_ms: [[5, 6]]\n    min_records: 1\n";
  const std::vector<std::string> reasons = Reasons(With(always, cells));
  ASSERT_EQ(reasons.size(), 1u);
  EXPECT_EQ(reasons[0],
            "Cell production 6-8 m/s can never fill: curtailment rule 'permit' holds in "
            "every month, at every hour and from every valid direction and stops or "
            "reduces the turbine at 6-8 m/s, so it never produces normally there.");
}

TEST(ReachabilityTest, DirectionLimitedRuleCountsOnlyWhenItCoversTheValidSectors) {
  const std::string rule =
      "valid_sectors_deg: [[180, 300]]\n"
      "curtailment:\n  - {name: wake, directions_deg: [[170, 310]], wind_ms: [4, 6], "
      "action: reduce}";
  ASSERT_EQ(Reasons(With(rule, "")).size(), 1u);  // production 4-6 m/s
  const std::string partial = Replace(rule, "[[170, 310]]", "[[170, 290]]");
  EXPECT_TRUE(Reasons(With(partial, "")).empty());
}

TEST(ReachabilityTest, TurbulenceTableWithoutSpreadRulesOutOtherTiBins) {
  const std::string text =
      Replace(With("", ""), "    wind_bins_ms: [4, 6, 8]\n",
              "    wind_bins_ms: [[4, 5.5], [6.5, 8]]\n    ti_bins_pct: [0, 10, 20]\n");
  // The site model gets a fixed TI per wind bin: 15 % up to 5 m/s, 8 % from
  // 7 m/s; between them the nearer row (docs/site-model.md), so 15 % below
  // 6 m/s and 8 % above.
  Plan plan = ParseTestPlan(text);
  plan.site.turbulence.kind = TurbulenceModel::Kind::kTable;
  plan.site.turbulence.table = {{0, 5, 0.15, 0.0}, {7, 9, 0.08, 0.0}};
  std::vector<std::string> reasons;
  for (const UnreachableCell& u : FindUnreachableCells(plan).cells) {
    reasons.push_back(u.reason);
  }
  ASSERT_EQ(reasons.size(), 2u);
  EXPECT_EQ(reasons[0],
            "Cell production 4-5.5 m/s TI 0-10 % can never fill: the site's turbulence "
            "table gives a TI of exactly 15 % at these wind speeds (ti_std_pct: 0), "
            "never 0-10 %.");
  EXPECT_EQ(reasons[1],
            "Cell production 6.5-8 m/s TI 10-20 % can never fill: the site's turbulence "
            "table gives a TI of exactly 8 % at these wind speeds (ti_std_pct: 0), never "
            "10-20 %.");
  // Any spread makes every TI possible (a lognormal has all of (0, inf)).
  plan.site.turbulence.table[0].ti_std = 0.01;
  plan.site.turbulence.table[1].ti_std = 0.01;
  EXPECT_TRUE(FindUnreachableCells(plan).cells.empty());
}

TEST(ReachabilityTest, PlannedOutagesOverTheWholeHorizon) {
  const std::string daq =
      "outages:\n  planned:\n    - {name: no logger, from: 2026-12-01, to: 2027-02-01, "
      "turbine: false, data_acquisition: true}\n"
      "    - {name: late logger, from: 2027-02-01, to: 2027-03-01, turbine: false, "
      "data_acquisition: true}";
  const std::vector<std::string> reasons = Reasons(With(daq, ""));
  ASSERT_EQ(reasons.size(), 2u);
  EXPECT_EQ(reasons[0],
            "Cell production 4-6 m/s can never fill: the data acquisition is out of "
            "service for the whole simulated time (planned outages), so no record or "
            "event counts.");
  // One day short of the 8-week horizon (2027-02-26): not reported.
  EXPECT_TRUE(
      Reasons(With(Replace(daq, "to: 2027-03-01", "to: 2027-02-25"), "")).empty());

  const std::string turbine =
      "outages:\n  planned:\n    - {name: retrofit, from: 2027-01-01, to: 2027-04-01}";
  const std::string parked =
      "  parked:\n    wind_bins_ms: [[0, 3]]\n    min_records: 1\n";
  const std::vector<std::string> down = Reasons(With(turbine, parked));
  ASSERT_EQ(down.size(), 3u);
  EXPECT_EQ(down[0],
            "Cell production 4-6 m/s can never fill: the turbine is out of service for "
            "the whole simulated time (planned outages), so it never produces.");
  EXPECT_EQ(down[2],
            "Cell parked 0-3 m/s can never fill: the turbine is out of service for the "
            "whole simulated time (planned outages), and records during outages count "
            "only with outages.parked_counts_during_outage: true.");
  EXPECT_EQ(
      Reasons(With(turbine + "\n  parked_counts_during_outage: true", parked)).size(),
      2u);
}

// The check against the simulation: over many runs the unreachable cell gets
// no record at all, while the reachable cells next to it do.
TEST(ReachabilityTest, SimulationNeverCountsAReportedCell) {
  const std::string text = With(
      "manual_tests:\n  tests:\n    - {name: grid_loss, wind_ms: [2, 8], "
      "min_interval_h: 1}",
      "  parked:\n    wind_bins_ms: [[2, 3], [10, 12]]\n    min_records: 100000\n"
      "  events:\n"
      "    - {event: normal_stop, wind_ms: [2, 3], min_records: 100000}\n"
      "    - {event: normal_stop, wind_ms: [8, 12], min_records: 100000}\n"
      "    - {event: grid_loss, wind_ms: [2, 3], min_records: 100000}\n"
      "    - {event: grid_loss, wind_ms: [3, 8], min_records: 100000}\n");
  const Plan plan = ParseTestPlan(text);
  const Reachability r = FindUnreachableCells(plan);
  std::vector<bool> unreachable(plan.matrix.cells.size(), false);
  for (const UnreachableCell& u : r.cells)
    unreachable[static_cast<size_t>(u.cell)] = true;
  ASSERT_EQ(r.cells.size(), 3u);  // parked 10-12, normal_stop 8-12, grid_loss 2-3

  const Simulator sim(plan);
  std::vector<uint64_t> totals(plan.matrix.cells.size(), 0);
  for (uint64_t run = 0; run < 20; ++run) {
    RunResult result;
    sim.Run(7, run, &result);
    for (size_t c = 0; c < totals.size(); ++c) totals[c] += result.count_at_end[c];
  }
  for (size_t c = 0; c < totals.size(); ++c) {
    SCOPED_TRACE(CellLabel(plan.matrix, plan.matrix.cells[c]));
    if (unreachable[c]) {
      EXPECT_EQ(totals[c], 0u);
    } else {
      EXPECT_GT(totals[c], 0u);
    }
  }
}

}  // namespace
}  // namespace planner
