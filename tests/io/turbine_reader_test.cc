// The turbine section of a plan: the restart wait, shutdown rules on
// short-term averages and storm control, and every rejected input with its
// exact message.
#include <gtest/gtest.h>

#include <string>
#include <vector>

#include "io/reader_test_util.h"
#include "planner/reachability.h"
#include "planner/plan_reader.h"

namespace planner {
namespace {

using reader_test::BadInput;
using reader_test::ExpectMessages;
using reader_test::ParseTestPlan;
using reader_test::Replace;
using reader_test::TestPlanError;

// The turbine on lines 4-14, the matrix from line 15.
const std::string kPlan =
    "name: Turbine test\n"
    "site_model: coastal-ridge.yaml\n"
    "campaign: {start: 2027-03-01, deadline: 2028-03-01}\n"
    "turbine:\n"
    "  name: T1\n"
    "  cut_in_ms: 3\n"
    "  rated_ms: 11\n"
    "  cut_out_ms: 25\n"
    "  restart_ms: 20\n"
    "  restart_wait_min: 25\n"
    "  hub_height_m: 110\n"
    "  shutdown_rules:\n"
    "    - {averaging_s: 30, threshold_ms: 28}\n"
    "    - {averaging_s: 3, threshold_ms: 32}\n"
    "capture_matrix:\n"
    "  production:\n"
    "    wind_bins_ms: {from: 4, to: 8, width: 1}\n"
    "    min_records: 10\n";

const std::string kStorm = Replace(kPlan, "  cut_out_ms: 25\n",
                                   "  storm_control: {from_ms: 24, to_ms: 30}\n");

TEST(TurbineReaderTest, ReadsRestartWaitAndShutdownRules) {
  const Plan plan = ParseTestPlan(kPlan);
  const TurbineSpec& t = plan.turbine;
  EXPECT_DOUBLE_EQ(t.restart_wait_min, 25.0);
  ASSERT_EQ(t.shutdown_rules.size(), 2u);
  EXPECT_DOUBLE_EQ(t.shutdown_rules[0].averaging_s, 30.0);
  EXPECT_DOUBLE_EQ(t.shutdown_rules[0].threshold_ms, 28.0);
  EXPECT_DOUBLE_EQ(t.shutdown_rules[1].averaging_s, 3.0);
  EXPECT_DOUBLE_EQ(t.shutdown_rules[1].threshold_ms, 32.0);
  EXPECT_DOUBLE_EQ(t.storm_control_from_ms, 0.0);
}

TEST(TurbineReaderTest, DefaultsKeepTheCutOutOnTheTenMinuteMeanAlone) {
  const Plan plan = ParseTestPlan(reader_test::BasePlan("Defaults"));
  EXPECT_DOUBLE_EQ(plan.turbine.restart_wait_min, 0.0);
  EXPECT_TRUE(plan.turbine.shutdown_rules.empty());
  EXPECT_DOUBLE_EQ(plan.turbine.storm_control_from_ms, 0.0);
}

TEST(TurbineReaderTest, StormControlSetsTheTenMinuteStop) {
  const Plan plan = ParseTestPlan(kStorm);
  EXPECT_DOUBLE_EQ(plan.turbine.storm_control_from_ms, 24.0);
  EXPECT_DOUBLE_EQ(plan.turbine.cut_out_ms, 30.0);
  EXPECT_DOUBLE_EQ(plan.turbine.restart_ms, 20.0);
}

TEST(TurbineReaderTest, StormControlAllowsReducedCellsInItsBand) {
  const std::string reduced =
      "  reduced:\n"
      "    wind_bins_ms: {from: 24, to: 30, width: 2}\n"
      "    min_records: 5\n";
  const Plan plan = ParseTestPlan(kStorm + reduced);
  EXPECT_TRUE(FindUnreachableCells(plan).cells.empty());
  // Without storm control no record is ever reduced.
  EXPECT_EQ(TestPlanError(kPlan + reduced),
            "plan.yaml:20:5: capture_matrix.reduced: no curtailment rule has action: "
            "reduce and the turbine has no storm_control, so no record is ever in "
            "reduced mode and these cells could never fill; add such a rule or "
            "storm_control, or remove reduced");
}

TEST(TurbineReaderTest, RejectsBadInputWithExactMessages) {
  const std::string& p = kPlan;
  const std::vector<BadInput> cases = {
      {"averaging of a whole record",
       Replace(p, "averaging_s: 30,", "averaging_s: 600,"),
       "plan.yaml:13:21: turbine.shutdown_rules[0].averaging_s: 600 is out of range; "
       "must be at least 1 and below 600 s"},
      {"averaging below a second", Replace(p, "averaging_s: 3,", "averaging_s: 0.5,"),
       "plan.yaml:14:21: turbine.shutdown_rules[1].averaging_s: 0.5 is out of range; "
       "must be at least 1 and below 600 s"},
      {"averaging time twice", Replace(p, "averaging_s: 3,", "averaging_s: 30,"),
       "plan.yaml:14:21: turbine.shutdown_rules[1].averaging_s: 30 s is given twice; "
       "give each averaging time once"},
      {"threshold at the restart speed",
       Replace(p, "threshold_ms: 32", "threshold_ms: 20"),
       "plan.yaml:14:38: turbine.shutdown_rules[1].threshold_ms: 20 must be above "
       "restart_ms (20); a lower threshold would stop the turbine in records in which "
       "it restarts"},
      {"rule without threshold", Replace(p, ", threshold_ms: 32}", "}"),
       "plan.yaml:14:7: turbine.shutdown_rules[1].threshold_ms: required field is "
       "missing"},
      {"empty rule list",
       Replace(p,
               "    - {averaging_s: 30, threshold_ms: 28}\n"
               "    - {averaging_s: 3, threshold_ms: 32}\n",
               "    []\n"),
       "plan.yaml:13:5: turbine.shutdown_rules: is empty; give at least one rule, or "
       "leave the field out (the turbine then stops on the 10-minute mean alone)"},
      {"negative wait", Replace(p, "restart_wait_min: 25", "restart_wait_min: -10"),
       "plan.yaml:10:21: turbine.restart_wait_min: -10 is out of range; must be at "
       "least 0 and at most 1440 min"},
      {"storm control with cut-out",
       Replace(p, "  cut_out_ms: 25\n",
               "  cut_out_ms: 25\n  storm_control: {from_ms: 24, to_ms: 30}\n"),
       "plan.yaml:8:15: turbine.cut_out_ms: 25 is given with storm_control, whose "
       "to_ms is where the turbine stops on the 10-minute mean; remove cut_out_ms"},
      {"storm band upside down", Replace(kStorm, "to_ms: 30", "to_ms: 22"),
       "plan.yaml:8:39: turbine.storm_control.to_ms: 22 must be above from_ms (24)"},
      {"storm band from below cut-in", Replace(kStorm, "from_ms: 24", "from_ms: 2"),
       "plan.yaml:8:28: turbine.storm_control.from_ms: 2 must be above cut_in_ms (3)"},
      {"storm control without its end", Replace(kStorm, ", to_ms: 30", ""),
       "plan.yaml:8:18: turbine.storm_control.to_ms: required field is missing"},
      {"restart above the storm stop", Replace(kStorm, "restart_ms: 20", "restart_ms: 31"),
       "plan.yaml:9:15: turbine.restart_ms: 31 must be above cut_in_ms (3) and at most "
       "to_ms (30)"},
  };
  ExpectMessages(cases, TestPlanError);
}

}  // namespace
}  // namespace planner
