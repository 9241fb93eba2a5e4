// The curtailment and manual_tests sections of a plan: parsed rules, crew and
// tests, and every rejected input with its exact message.
#include <gtest/gtest.h>

#include <array>
#include <string>
#include <vector>

#include "io/reader_test_util.h"
#include "planner/plan_reader.h"

namespace planner {
namespace {

using reader_test::ErrorOf;
using reader_test::Replace;
using reader_test::SourcePath;

// Eight lines; the section under test follows from line 9.
const std::string kBase = reader_test::BasePlan("Curtailment test");

// Lines 9-14.
const std::string kRule =
    "curtailment:\n"
    "  - name: bats\n"
    "    months: [6, 7, 8]\n"
    "    hours: [21, 5]\n"
    "    wind_ms: [0, 6]\n"
    "    action: stop\n";

// Lines 9-17.
const std::string kTests =
    "manual_tests:\n"
    "  crew:\n"
    "    weekdays: [mon, tue, wed, thu]\n"
    "    hours: [7, 15]\n"
    "  tests:\n"
    "    - name: emergency_stop\n"
    "      wind_ms: [10, 14]\n"
    "      min_interval_h: 24\n"
    "    - {name: grid_loss, wind_ms: [8, 16]}\n";

const auto& Parse = reader_test::ParseTestPlan;
const auto& PlanError = reader_test::TestPlanError;

TEST(CurtailmentReaderTest, ReadsRulesWithTheirConditions) {
  const Plan plan = Parse(kBase + kRule +
                          "  - {name: noise, hours: [22, 6], directions_deg: [[60, 120], "
                          "[350, 10]], action: reduce}\n");
  ASSERT_EQ(plan.curtailment.size(), 2u);
  const CurtailmentRule& bats = plan.curtailment[0];
  EXPECT_EQ(bats.name, "bats");
  EXPECT_EQ(bats.months, (std::vector<int>{6, 7, 8}));
  EXPECT_EQ(bats.hours.from_hour, 21);  // wraps past midnight
  EXPECT_EQ(bats.hours.to_hour, 5);
  EXPECT_DOUBLE_EQ(bats.wind_lo_ms, 0.0);
  EXPECT_DOUBLE_EQ(bats.wind_hi_ms, 6.0);
  EXPECT_TRUE(bats.directions.empty());
  EXPECT_EQ(bats.action, CurtailmentRule::Action::kStop);
  const CurtailmentRule& noise = plan.curtailment[1];
  EXPECT_TRUE(noise.months.empty());  // every month
  EXPECT_EQ(noise.hours.from_hour, 22);
  EXPECT_EQ(noise.hours.to_hour, 6);
  EXPECT_DOUBLE_EQ(noise.wind_lo_ms, 0.0);  // any wind
  EXPECT_GE(noise.wind_hi_ms, 1e9);
  ASSERT_EQ(noise.directions.size(), 2u);
  EXPECT_DOUBLE_EQ(noise.directions[1].from_deg, 350.0);
  EXPECT_DOUBLE_EQ(noise.directions[1].to_deg, 10.0);
  EXPECT_EQ(noise.action, CurtailmentRule::Action::kReduce);
}

TEST(CurtailmentReaderTest, NoCurtailmentAndTheDefaultCrew) {
  const Plan plan = Parse(kBase);
  EXPECT_TRUE(plan.curtailment.empty());
  EXPECT_TRUE(plan.manual_tests.empty());
  // Monday to Friday, 8 to 16 h (the documented default).
  EXPECT_EQ(plan.crew.weekdays,
            (std::array<bool, 7>{false, true, true, true, true, true, false}));
  EXPECT_EQ(plan.crew.hours.from_hour, 8);
  EXPECT_EQ(plan.crew.hours.to_hour, 16);
}

TEST(ManualTestReaderTest, ReadsCrewAndTests) {
  const Plan plan = Parse(kBase + kTests);
  EXPECT_EQ(plan.crew.weekdays, (std::array<bool, 7>{false, true, true, true, true, false,
                                                     false}));  // Sun..Sat
  EXPECT_EQ(plan.crew.hours.from_hour, 7);
  EXPECT_EQ(plan.crew.hours.to_hour, 15);
  ASSERT_EQ(plan.manual_tests.size(), 2u);
  EXPECT_EQ(plan.manual_tests[0].name, "emergency_stop");
  EXPECT_DOUBLE_EQ(plan.manual_tests[0].wind_lo_ms, 10.0);
  EXPECT_DOUBLE_EQ(plan.manual_tests[0].wind_hi_ms, 14.0);
  EXPECT_DOUBLE_EQ(plan.manual_tests[0].min_interval_h, 24.0);
  EXPECT_EQ(plan.manual_tests[1].name, "grid_loss");
  EXPECT_DOUBLE_EQ(plan.manual_tests[1].min_interval_h, 4.0);  // default
}

TEST(ManualTestReaderTest, CrewMayBeLeftOutAndWorkWeekends) {
  const Plan plan =
      Parse(Replace(Replace(kBase + kTests, "[mon, tue, wed, thu]", "[sat, sun]"),
                    "    hours: [7, 15]\n", ""));
  EXPECT_EQ(plan.crew.weekdays,
            (std::array<bool, 7>{true, false, false, false, false, false, true}));
  EXPECT_EQ(plan.crew.hours.from_hour, 8);
  const Plan no_crew =
      Parse(kBase + "manual_tests:\n  tests: [{name: t1, wind_ms: [4, 30]}]\n");
  EXPECT_EQ(no_crew.crew.hours.to_hour, 16);
  ASSERT_EQ(no_crew.manual_tests.size(), 1u);
}

using reader_test::BadInput;

const char kEmptyWindow[] =
    " is an empty window; hours run from the first to the second and may wrap past "
    "midnight ([22, 6]); write [0, 24] for the whole day";

std::vector<BadInput> BadCurtailment() {
  const std::string r = kBase + kRule;
  return {
      {"month 13", Replace(r, "[6, 7, 8]", "[6, 7, 13]"),
       "plan.yaml:11:20: curtailment[0].months[2]: 13 is out of range; must be at least "
       "1 "
       "and at most 12"},
      {"month twice", Replace(r, "[6, 7, 8]", "[6, 7, 7]"),
       "plan.yaml:11:20: curtailment[0].months[2]: 7 is given twice; give each month "
       "once"},
      {"no months", Replace(r, "[6, 7, 8]", "[]"),
       "plan.yaml:11:13: curtailment[0].months: is empty; give months 1 to 12, or leave "
       "the field out for every month"},
      {"hour 24 as a start", Replace(r, "[21, 5]", "[24, 5]"),
       "plan.yaml:12:13: curtailment[0].hours[0]: 24 is out of range; must be at least 0 "
       "and at most 23 h"},
      {"hour 0 as an end", Replace(r, "[21, 5]", "[21, 0]"),
       "plan.yaml:12:17: curtailment[0].hours[1]: 0 is out of range; must be at least 1 "
       "and at most 24 h"},
      {"empty hour window", Replace(r, "[21, 5]", "[5, 5]"),
       std::string("plan.yaml:12:12: curtailment[0].hours: [5, 5]") + kEmptyWindow},
      {"half hours", Replace(r, "[21, 5]", "[21.5, 5]"),
       "plan.yaml:12:13: curtailment[0].hours[0]: expected a whole number, got '21.5'"},
      {"hours as one number", Replace(r, "[21, 5]", "21"),
       "plan.yaml:12:12: curtailment[0].hours: expected a pair [from, to], got '21'"},
      {"empty wind range", Replace(r, "[0, 6]", "[6, 0]"),
       "plan.yaml:13:14: curtailment[0].wind_ms: [6, 0] is an empty range; lo must be "
       "below hi"},
      {"negative wind", Replace(r, "[0, 6]", "[-1, 6]"),
       "plan.yaml:13:15: curtailment[0].wind_ms[0]: -1 is out of range; must be at least "
       "0 m/s"},
      {"unknown action", Replace(r, "action: stop", "action: halt"),
       "plan.yaml:14:13: curtailment[0].action: 'halt' is not an action; valid: stop, "
       "reduce"},
      {"no action", Replace(r, "    action: stop\n", ""),
       "plan.yaml:10:5: curtailment[0].action: required field is missing"},
      {"no condition", kBase + "curtailment:\n  - {name: always, action: stop}\n",
       "plan.yaml:10:5: curtailment[0]: has no condition, so it would hold for the whole "
       "campaign; give months, hours, wind_ms or directions_deg"},
      {"name repeated", r + "  - {name: bats, hours: [0, 4], action: stop}\n",
       "plan.yaml:15:12: curtailment[1].name: 'bats' is already the name of "
       "curtailment[0]; give each curtailment rule its own name"},
      {"no directions", r + "    directions_deg: []\n",
       "plan.yaml:15:21: curtailment[0].directions_deg: is empty; give at least one "
       "[from, to] sector, or leave the field out for every direction"},
      {"empty direction sector", r + "    directions_deg: [[90, 90]]\n",
       "plan.yaml:15:22: curtailment[0].directions_deg[0]: [90, 90] is an empty sector; "
       "a sector runs clockwise from the first angle to the second (write [0, 360] for "
       "the full circle)"},
      {"misspelt key", Replace(r, "months:", "month:"),
       "plan.yaml:11:5: curtailment[0].month: unknown field (did you mean 'months'?); "
       "valid fields: name, months, hours, wind_ms, directions_deg, action"},
      {"rules as a mapping", kBase + "curtailment: {name: bats}\n",
       "plan.yaml:9:14: curtailment: expected a list, got a mapping"},
      {"no rules", kBase + "curtailment: []\n",
       "plan.yaml:9:14: curtailment: is empty; give at least one rule, or leave the "
       "field "
       "out"},
  };
}

TEST(CurtailmentReaderTest, RejectsBadInputWithExactMessages) {
  reader_test::ExpectMessages(BadCurtailment(), PlanError);
}

std::vector<BadInput> BadManualTests() {
  const std::string t = kBase + kTests;
  return {
      {"weekday spelt out", Replace(t, "[mon,", "[monday,"),
       "plan.yaml:11:16: manual_tests.crew.weekdays[0]: 'monday' is not a weekday; "
       "valid: mon, tue, wed, thu, fri, sat, sun"},
      {"weekday twice", Replace(t, "wed, thu]", "wed, mon]"),
       "plan.yaml:11:31: manual_tests.crew.weekdays[3]: mon is given twice; give each "
       "day once"},
      {"no weekdays", Replace(t, "[mon, tue, wed, thu]", "[]"),
       "plan.yaml:11:15: manual_tests.crew.weekdays: is empty; give the days the crew is "
       "on site, e.g. [mon, tue, wed, thu, fri]"},
      {"empty crew hours", Replace(t, "[7, 15]", "[8, 8]"),
       std::string("plan.yaml:12:12: manual_tests.crew.hours: [8, 8]") + kEmptyWindow},
      {"capital letter in a name",
       Replace(t, "name: emergency_stop", "name: Emergency_stop"),
       "plan.yaml:14:13: manual_tests.tests[0].name: 'Emergency_stop' is not a valid "
       "event name; use lowercase letters, digits and _, starting with a letter (e.g. "
       "emergency_stop)"},
      {"space in a name", Replace(t, "name: emergency_stop", "name: emergency stop"),
       "plan.yaml:14:13: manual_tests.tests[0].name: 'emergency stop' is not a valid "
       "event name; use lowercase letters, digits and _, starting with a letter (e.g. "
       "emergency_stop)"},
      {"natural event name", Replace(t, "name: emergency_stop", "name: start_up"),
       "plan.yaml:14:13: manual_tests.tests[0].name: 'start_up' is a natural event type "
       "(start_up, normal_stop); give the manual test another name"},
      {"name repeated", Replace(t, "name: grid_loss", "name: emergency_stop"),
       "plan.yaml:17:14: manual_tests.tests[1].name: 'emergency_stop' is already the "
       "name of manual_tests.tests[0]; give each manual test its own name"},
      {"wind window above cut-out", Replace(t, "[10, 14]", "[26, 30]"),
       "plan.yaml:15:16: manual_tests.tests[0].wind_ms: [26, 30] lies outside "
       "turbine.cut_in_ms to cut_out_ms (3-25 m/s); a test is done while the turbine "
       "produces, so it could never be done"},
      {"no wind window", Replace(t, "      wind_ms: [10, 14]\n", ""),
       "plan.yaml:14:7: manual_tests.tests[0].wind_ms: required field is missing"},
      {"zero interval", Replace(t, "min_interval_h: 24", "min_interval_h: 0"),
       "plan.yaml:16:23: manual_tests.tests[0].min_interval_h: 0 is out of range; must "
       "be above 0 and at most 8760 h"},
      {"no tests", kBase + "manual_tests:\n  crew: {hours: [8, 16]}\n",
       "plan.yaml:10:3: manual_tests: has neither tests nor parking; give at least one of "
       "them"},
      {"empty tests", kBase + "manual_tests:\n  tests: []\n",
       "plan.yaml:10:10: manual_tests.tests: is empty; give at least one test"},
  };
}

TEST(ManualTestReaderTest, RejectsBadInputWithExactMessages) {
  reader_test::ExpectMessages(BadManualTests(), PlanError);
}

// Lines 9-20: a test with a lead time and a date window, and a park test.
const std::string kDated =
    "manual_tests:\n"
    "  tests:\n"
    "    - name: emergency_stop\n"
    "      wind_ms: [10, 14]\n"
    "      lead_time_days: 60\n"
    "      from: 2027-04-01\n"
    "      to: 2027-10-01\n"
    "  parking:\n"
    "    - name: park_mid_wind\n"
    "      wind_ms: [6, 18]\n"
    "      hours: 3\n"
    "      min_interval_h: 48\n";

TEST(ManualTestReaderTest, ReadsDatesAndParkTests) {
  const Plan plan = Parse(kBase + kDated);
  ASSERT_EQ(plan.manual_tests.size(), 1u);
  const ActionDates& d = plan.manual_tests[0].dates;
  EXPECT_EQ(d.lead_time_days, 60);
  ASSERT_TRUE(d.from && d.to);
  EXPECT_EQ(FormatDate(*d.from), "2027-04-01");
  EXPECT_EQ(FormatDate(*d.to), "2027-10-01");
  ASSERT_EQ(plan.crew_parking.size(), 1u);
  const CrewParking& p = plan.crew_parking[0];
  EXPECT_EQ(p.name, "park_mid_wind");
  EXPECT_DOUBLE_EQ(p.wind_lo_ms, 6);
  EXPECT_DOUBLE_EQ(p.wind_hi_ms, 18);
  EXPECT_DOUBLE_EQ(p.hours, 3);
  EXPECT_DOUBLE_EQ(p.min_interval_h, 48);
  EXPECT_EQ(p.dates.lead_time_days, 0);
  EXPECT_FALSE(p.dates.from);
}

TEST(ManualTestReaderTest, RejectsBadDatesAndParkTestsWithExactMessages) {
  const std::string t = kBase + kDated;
  reader_test::ExpectMessages(
      {
          // Start 2027-03-01 plus 60 days is 2027-04-30: a window that closes
          // before then holds no day.
          {"window before the lead time", Replace(t, "to: 2027-10-01", "to: 2027-04-20"),
           "plan.yaml:15:11: manual_tests.tests[0].to: 2027-04-20 is not after the first "
           "day the action may be done (2027-04-30: the later of from and the campaign's "
           "start plus lead_time_days); the window would hold no day"},
          {"negative lead time", Replace(t, "lead_time_days: 60", "lead_time_days: -1"),
           "plan.yaml:13:23: manual_tests.tests[0].lead_time_days: -1 is out of range; "
           "must be at least 0 and at most 3650 days"},
          {"park outside production",
           Replace(t, "wind_ms: [6, 18]", "wind_ms: [0, 2]"),
           "plan.yaml:18:16: manual_tests.parking[0].wind_ms: [0, 2] lies outside "
           "turbine.cut_in_ms to cut_out_ms (3-25 m/s); the crew parks a producing "
           "turbine, so it could never be done"},
          {"park without hours", Replace(t, "      hours: 3\n", ""),
           "plan.yaml:17:7: manual_tests.parking[0].hours: required field is missing"},
          {"park too long", Replace(t, "hours: 3", "hours: 30"),
           "plan.yaml:19:14: manual_tests.parking[0].hours: 30 is out of range; must be "
           "above 0 and at most 24 h"},
          {"empty parking", kBase + "manual_tests:\n  parking: []\n",
           "plan.yaml:10:12: manual_tests.parking: is empty; give at least one park test"},
      },
      PlanError);
}

}  // namespace
}  // namespace planner
