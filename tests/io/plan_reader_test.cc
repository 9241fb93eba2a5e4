// Plan reader: parsed values and defaults, every rejected input with its
// exact message, the site-model reference, and the shipped demo plan. The
// capture_matrix section has its own tests (capture_matrix_reader_test.cc).
#include "planner/plan_reader.h"

#include <gtest/gtest.h>
#include <unistd.h>

#include <filesystem>
#include <fstream>
#include <string>
#include <vector>

#include "io/reader_test_util.h"

namespace planner {
namespace {

using reader_test::ErrorOf;
using reader_test::Replace;
using reader_test::SourcePath;

const char kFile[] = "plan.yaml";

// Eight lines; the bad-input cases below edit one piece of it. The site model
// is the shipped coastal ridge (base_dir is site-models/).
const std::string kBasePlan = reader_test::BasePlan("Test plan");

std::string BaseDir() { return SourcePath("site-models"); }

Plan Parse(const std::string& text) { return ParsePlan(text, kFile, BaseDir()); }

std::string PlanError(const std::string& text) {
  return ErrorOf([&] { Parse(text); });
}

TEST(PlanReaderTest, MinimalPlanGetsDocumentedDefaults) {
  const Plan plan = Parse(kBasePlan);
  EXPECT_EQ(plan.name, "Test plan");
  EXPECT_EQ(plan.source_file, "plan.yaml");
  EXPECT_EQ(plan.site_file, BaseDir() + "/coastal-ridge.yaml");
  EXPECT_EQ(plan.site.name, "Coastal ridge");
  EXPECT_TRUE(plan.start == (Date{2027, 3, 1}));
  EXPECT_TRUE(plan.deadline == (Date{2028, 3, 1}));
  EXPECT_EQ(plan.horizon_weeks, 156);
  EXPECT_EQ(plan.turbine.name, "T1");
  EXPECT_DOUBLE_EQ(plan.turbine.cut_in_ms, 3.0);
  EXPECT_DOUBLE_EQ(plan.turbine.rated_ms, 11.0);
  EXPECT_DOUBLE_EQ(plan.turbine.cut_out_ms, 25.0);
  EXPECT_DOUBLE_EQ(plan.turbine.restart_ms, 22.0);  // cut_out_ms - 3
  EXPECT_DOUBLE_EQ(plan.turbine.rated_power_kw, 0.0);
  ASSERT_EQ(plan.valid_sectors.size(), 1u);
  EXPECT_DOUBLE_EQ(plan.valid_sectors[0].from_deg, 0.0);
  EXPECT_DOUBLE_EQ(plan.valid_sectors[0].to_deg, 360.0);
  EXPECT_DOUBLE_EQ(plan.turbine_outages.mtbf_h, 0.0);
  EXPECT_DOUBLE_EQ(plan.daq_outages.mtbf_h, 0.0);
  EXPECT_FALSE(plan.parked_counts_during_outage);
  EXPECT_DOUBLE_EQ(plan.quality_reject_fraction, 0.0);
  EXPECT_EQ(plan.matrix.cells.size(), 4u);
}

TEST(PlanReaderTest, ReadsEveryOptionalField) {
  const std::string text =
      Replace(kBasePlan, "cut_out_ms: 25}",
              "cut_out_ms: 25, restart_ms: 20, rated_power_kw: 4200,\n"
              "          rotor_diameter_m: 150, hub_height_m: 110}\n"
              "valid_sectors_deg: [[300, 60], [120, 200]]\n"
              "outages:\n"
              "  turbine: {mtbf_h: 400, mttr_h: 36}\n"
              "  data_acquisition: {mtbf_h: 900, mttr_h: 24}\n"
              "  parked_counts_during_outage: true\n"
              "quality_reject_fraction: 0.03");
  const Plan plan = Parse(Replace(text, "2028-03-01}", "2028-03-01, horizon_weeks: 60}"));
  EXPECT_EQ(plan.horizon_weeks, 60);
  EXPECT_DOUBLE_EQ(plan.turbine.restart_ms, 20.0);
  EXPECT_DOUBLE_EQ(plan.turbine.rated_power_kw, 4200.0);
  EXPECT_DOUBLE_EQ(plan.turbine.rotor_diameter_m, 150.0);
  EXPECT_DOUBLE_EQ(plan.turbine.hub_height_m, 110.0);
  ASSERT_EQ(plan.valid_sectors.size(), 2u);
  EXPECT_DOUBLE_EQ(plan.valid_sectors[0].from_deg, 300.0);  // wraps through north
  EXPECT_DOUBLE_EQ(plan.valid_sectors[0].to_deg, 60.0);
  EXPECT_DOUBLE_EQ(plan.valid_sectors[1].from_deg, 120.0);
  EXPECT_DOUBLE_EQ(plan.valid_sectors[1].to_deg, 200.0);
  EXPECT_DOUBLE_EQ(plan.turbine_outages.mtbf_h, 400.0);
  EXPECT_DOUBLE_EQ(plan.turbine_outages.mttr_h, 36.0);
  EXPECT_DOUBLE_EQ(plan.daq_outages.mtbf_h, 900.0);
  EXPECT_DOUBLE_EQ(plan.daq_outages.mttr_h, 24.0);
  EXPECT_TRUE(plan.parked_counts_during_outage);
  EXPECT_DOUBLE_EQ(plan.quality_reject_fraction, 0.03);
}

TEST(PlanReaderTest, ReadsTheCost) {
  const Plan plan =
      Parse(kBasePlan + "cost: {weekly: 18500, mobilisation: 240000, currency: GBP}\n");
  EXPECT_DOUBLE_EQ(plan.cost.weekly, 18500.0);
  EXPECT_DOUBLE_EQ(plan.cost.mobilisation, 240000.0);
  EXPECT_EQ(plan.cost.currency, "GBP");
  const Plan no_cost = Parse(kBasePlan);
  EXPECT_DOUBLE_EQ(no_cost.cost.weekly, 0.0);
  EXPECT_EQ(no_cost.cost.currency, "EUR");
}

TEST(PlanReaderTest, ComponentThatNeverFailsMayHaveNoRepairTime) {
  const Plan plan = Parse(kBasePlan + "outages: {turbine: {mtbf_h: 0, mttr_h: 0}}\n");
  EXPECT_DOUBLE_EQ(plan.turbine_outages.mtbf_h, 0.0);
}

TEST(PlanReaderTest, HorizonMayEndExactlyOnTheDeadline) {
  // 2027-03-01 + 52 weeks (364 days) = 2028-02-28.
  const Plan plan = Parse(Replace(kBasePlan, "deadline: 2028-03-01",
                                  "deadline: 2028-02-28, horizon_weeks: 52"));
  EXPECT_EQ(plan.horizon_weeks, 52);
}

struct BadPlan {
  const char* name;
  std::string text;
  std::string message;
};

const std::string kPlanFields =
    "valid fields: name, site_model, weather, campaign, turbine, valid_sectors_deg, "
    "layout, "
    "outages, curtailment, manual_tests, quality_reject_fraction, capture_matrix, cost, "
    "planned_changes";
const std::string kTurbineFields =
    "valid fields: name, rated_power_kw, rotor_diameter_m, hub_height_m, cut_in_ms, "
    "rated_ms, cut_out_ms, restart_ms, restart_wait_min, shutdown_rules, storm_control";
const std::string kRestartRule =
    "must be above cut_in_ms (3) and at most cut_out_ms (25)";

std::vector<BadPlan> BadPlans() {
  const std::string& b = kBasePlan;
  return {
      {"currency not a code", b + "cost: {weekly: 1000, currency: euros}\n",
       "plan.yaml:9:32: cost.currency: 'euros' is not a currency code; expected three "
       "capital letters such as EUR, GBP or USD"},
      // The '{' on line 3 is never closed; yaml-cpp notices at the ':' after
      // "turbine" on line 4 (the text after "invalid YAML:" is its own).
      {"syntax error", Replace(b, "2028-03-01}", "2028-03-01"),
       "plan.yaml:4:8: invalid YAML: end of map flow not found"},
      {"unknown field, prefix", b + "quality_reject: 0.03\n",
       "plan.yaml:9:1: quality_reject: unknown field (did you mean "
       "'quality_reject_fraction'?); " +
           kPlanFields},
      {"unknown turbine field", Replace(b, "cut_in_ms: 3", "cut_in: 3"),
       "plan.yaml:4:21: turbine.cut_in: unknown field (did you mean 'cut_in_ms'?); " +
           kTurbineFields},
      {"duplicate key in a flow mapping", Replace(b, "name: T1,", "name: T1, name: T2,"),
       "plan.yaml:4:21: turbine.name: given twice (first at line 4); give each field "
       "once"},
      {"missing campaign",
       Replace(b, "campaign: {start: 2027-03-01, deadline: 2028-03-01}\n", ""),
       "plan.yaml:1:1: campaign: required field is missing"},
      {"missing capture matrix", b.substr(0, b.find("capture_matrix")),
       "plan.yaml:1:1: capture_matrix: required field is missing"},
      {"missing turbine name", Replace(b, "name: T1, ", ""),
       "plan.yaml:4:10: turbine.name: required field is missing"},
      {"cut-in above cut-out", Replace(b, "cut_in_ms: 3", "cut_in_ms: 30"),
       "plan.yaml:4:32: turbine.cut_in_ms: 30 must be below cut_out_ms (25)"},
      {"cut-in equals cut-out", Replace(b, "cut_in_ms: 3", "cut_in_ms: 25"),
       "plan.yaml:4:32: turbine.cut_in_ms: 25 must be below cut_out_ms (25)"},
      {"negative cut-in", Replace(b, "cut_in_ms: 3", "cut_in_ms: -1"),
       "plan.yaml:4:32: turbine.cut_in_ms: -1 is out of range; must be above 0 and at "
       "most "
       "50 m/s"},
      {"cut-in not a number", Replace(b, "cut_in_ms: 3", "cut_in_ms: abc"),
       "plan.yaml:4:32: turbine.cut_in_ms: expected a number, got 'abc'"},
      {"rated below cut-in", Replace(b, "rated_ms: 11", "rated_ms: 2"),
       "plan.yaml:4:45: turbine.rated_ms: 2 " + kRestartRule},
      {"restart above cut-out",
       Replace(b, "cut_out_ms: 25}", "cut_out_ms: 25, restart_ms: 26}"),
       "plan.yaml:4:77: turbine.restart_ms: 26 " + kRestartRule},
      {"restart at cut-in",
       Replace(b, "cut_out_ms: 25}", "cut_out_ms: 25, restart_ms: 3}"),
       "plan.yaml:4:77: turbine.restart_ms: 3 " + kRestartRule},
      {"default restart below cut-in",
       Replace(Replace(b, "cut_out_ms: 25", "cut_out_ms: 5"), "rated_ms: 11",
               "rated_ms: 4"),
       "plan.yaml:4:10: turbine.restart_ms: the default cut_out_ms - 3 = 2 must be above "
       "cut_in_ms (3) and at most cut_out_ms (5)"},
      {"deadline equals start", Replace(b, "2028-03-01", "2027-03-01"),
       "plan.yaml:3:41: campaign.deadline: 2027-03-01 is not after the start "
       "(2027-03-01); "
       "the deadline must be later"},
      {"deadline before start", Replace(b, "2028-03-01", "2026-12-24"),
       "plan.yaml:3:41: campaign.deadline: 2026-12-24 is not after the start "
       "(2027-03-01); "
       "the deadline must be later"},
      {"impossible date", Replace(b, "2027-03-01", "2027-02-30"),
       "plan.yaml:3:19: campaign.start: 2027-02-30 is not a valid date; expected "
       "YYYY-MM-DD, a real calendar date in the years 1900 to 2200"},
      {"date as a list", Replace(b, "start: 2027-03-01", "start: [2027, 3, 1]"),
       "plan.yaml:3:19: campaign.start: expected a date YYYY-MM-DD, got a list of 3 "
       "items"},
      // 2027-03-01 to 2028-03-01 is 366 days (2028 is a leap year): 52.3 weeks.
      {"horizon before deadline",
       Replace(b, "2028-03-01}", "2028-03-01, horizon_weeks: 40}"),
       "plan.yaml:3:68: campaign.horizon_weeks: 40 weeks end before the deadline (52.3 "
       "weeks after the start); must be at least 53"},
      // 2027-03-01 to 2031-01-01 is 366 + 365 + 365 + 306 = 1402 days: 200.3 weeks.
      {"default horizon before deadline", Replace(b, "2028-03-01", "2031-01-01"),
       "plan.yaml:3:11: campaign.horizon_weeks: the default 156 weeks end before the "
       "deadline (200.3 weeks after the start); must be at least 201"},
      {"fractional horizon", Replace(b, "2028-03-01}", "2028-03-01, horizon_weeks: 2.5}"),
       "plan.yaml:3:68: campaign.horizon_weeks: expected a whole number, got '2.5'"},
      {"zero horizon", Replace(b, "2028-03-01}", "2028-03-01, horizon_weeks: 0}"),
       "plan.yaml:3:68: campaign.horizon_weeks: 0 is out of range; must be at least 1 "
       "and at "
       "most 1040 weeks"},
      {"angle above 360", b + "valid_sectors_deg: [[300, 400]]\n",
       "plan.yaml:9:27: valid_sectors_deg[0][1]: 400 is out of range; must be at least 0 "
       "and "
       "at most 360 degrees"},
      {"sector starting at 360", b + "valid_sectors_deg: [[360, 20]]\n",
       "plan.yaml:9:22: valid_sectors_deg[0][0]: 360 is out of range; must be at least 0 "
       "and "
       "below 360 degrees"},
      {"negative angle", b + "valid_sectors_deg: [[-10, 20]]\n",
       "plan.yaml:9:22: valid_sectors_deg[0][0]: -10 is out of range; must be at least 0 "
       "and "
       "below 360 degrees"},
      {"empty sector", b + "valid_sectors_deg: [[40, 40]]\n",
       "plan.yaml:9:21: valid_sectors_deg[0]: [40, 40] is an empty sector; a sector runs "
       "clockwise from the first angle to the second (write [0, 360] for the full "
       "circle)"},
      {"no sectors", b + "valid_sectors_deg: []\n",
       "plan.yaml:9:20: valid_sectors_deg: is empty; give at least one [from, to] "
       "sector, or "
       "leave the field out for the full circle"},
      {"sector of three angles", b + "valid_sectors_deg: [[10, 20, 30]]\n",
       "plan.yaml:9:21: valid_sectors_deg[0]: expected a pair [from, to], got a list of "
       "3 "
       "items"},
      {"quality fraction of 1", b + "quality_reject_fraction: 1\n",
       "plan.yaml:9:26: quality_reject_fraction: 1 is out of range; must be at least 0 "
       "and "
       "below 1"},
      {"negative MTBF", b + "outages: {turbine: {mtbf_h: -1, mttr_h: 36}}\n",
       "plan.yaml:9:29: outages.turbine.mtbf_h: -1 is out of range; must be at least 0 "
       "and at "
       "most 1000000 h"},
      {"no repair time", b + "outages: {data_acquisition: {mtbf_h: 900, mttr_h: 0}}\n",
       "plan.yaml:9:51: outages.data_acquisition.mttr_h: 0 must be above 0 when mtbf_h "
       "is "
       "above 0 (a repair takes time); set mtbf_h to 0 for no outages"},
      {"yes is not a boolean", b + "outages: {parked_counts_during_outage: yes}\n",
       "plan.yaml:9:40: outages.parked_counts_during_outage: expected true or false, got "
       "'yes'"},
      {"site model as a list", Replace(b, "coastal-ridge.yaml", "[a]"),
       "plan.yaml:2:13: site_model: expected text, got a list of 1 item"},
  };
}

TEST(PlanReaderTest, RejectsBadInputWithExactMessages) {
  for (const BadPlan& c : BadPlans()) {
    SCOPED_TRACE(c.name);
    EXPECT_EQ(PlanError(c.text), c.message);
  }
}

TEST(PlanReaderTest, MissingPlanFileIsNamed) {
  EXPECT_EQ(ErrorOf([] { LoadPlan("no/such/plan.yaml"); }),
            "no/such/plan.yaml: cannot open plan file: no such file");
}

TEST(PlanReaderTest, MissingSiteModelIsReportedWhereThePlanNamesIt) {
  const std::string text =
      Replace(kBasePlan, "coastal-ridge.yaml", "../nowhere/site.yaml");
  EXPECT_EQ(
      PlanError(text),
      "plan.yaml:2:13: site_model: '../nowhere/site.yaml' is not a file (looked for '" +
          SourcePath("nowhere/site.yaml") +
          "'); give a path relative to the plan's folder");
}

// A scratch folder holding a plan and a faulty site model next to it.
class PlanFolder {
 public:
  PlanFolder() {
    // Unique per test and process: ctest may run tests in parallel.
    const std::string test =
        ::testing::UnitTest::GetInstance()->current_test_info()->name();
    dir_ = std::filesystem::temp_directory_path() /
           ("fillcast-" + test + "-" + std::to_string(::getpid()));
    std::filesystem::create_directories(dir_);
  }
  ~PlanFolder() { std::filesystem::remove_all(dir_); }
  std::string Write(const std::string& name, const std::string& text) {
    const std::filesystem::path path = dir_ / name;
    std::ofstream(path) << text;
    return path.string();
  }

 private:
  std::filesystem::path dir_;
};

TEST(PlanReaderTest, ErrorsInTheSiteModelNameTheSiteFile) {
  PlanFolder folder;
  const std::string site = folder.Write("bad-site.yaml", "name: x\nsectors: []\n");
  const std::string plan = folder.Write(
      "plan.yaml", Replace(kBasePlan, "coastal-ridge.yaml", "bad-site.yaml"));
  EXPECT_EQ(ErrorOf([&] { LoadPlan(plan); }),
            site +
                ":2:10: sectors: is empty; give one entry per direction sector, the "
                "first centred on north");
}

TEST(PlanReaderTest, LoadPlanResolvesTheSiteNextToThePlan) {
  PlanFolder folder;
  std::ifstream shipped(SourcePath("site-models/inland-forest-edge.yaml"));
  const std::string site_text((std::istreambuf_iterator<char>(shipped)),
                              std::istreambuf_iterator<char>());
  const std::string site = folder.Write("site.yaml", site_text);
  const std::string plan =
      folder.Write("plan.yaml", Replace(kBasePlan, "coastal-ridge.yaml", "site.yaml"));
  const Plan loaded = LoadPlan(plan);
  EXPECT_EQ(loaded.site.name, "Inland forest edge");
  EXPECT_EQ(loaded.site_file, site);
  EXPECT_EQ(loaded.source_file, plan);
}

TEST(PlanReaderTest, ShippedDemoPlanLoads) {
  const Plan plan = LoadPlan(SourcePath("demo-site/plan.yaml"));
  EXPECT_NE(plan.name.find("invented"), std::string::npos);
  EXPECT_EQ(plan.site.name, "Coastal ridge");
  EXPECT_TRUE(plan.start == (Date{2027, 3, 1}));
  EXPECT_GT(DaysBetween(plan.start, plan.deadline), 300);
  EXPECT_EQ(plan.horizon_weeks, 156);
  EXPECT_LT(plan.turbine.cut_in_ms, plan.turbine.restart_ms);
  EXPECT_LE(plan.turbine.restart_ms, plan.turbine.cut_out_ms);
  EXPECT_GT(plan.turbine_outages.mtbf_h, 0.0);
  EXPECT_GT(plan.daq_outages.mtbf_h, 0.0);
  ASSERT_EQ(plan.matrix.grids.size(), 2u);
  EXPECT_EQ(plan.matrix.grids[0].state, OperatingState::kProduction);
  EXPECT_EQ(plan.matrix.grids[1].state, OperatingState::kParked);
  int required = 0;
  for (const Cell& c : plan.matrix.cells) required += c.optional ? 0 : 1;
  EXPECT_GT(required, 0);
  // The realism features are used (issue 3): a layout that narrows the valid
  // sector, outage laws, a planned outage, curtailment, manual tests, events.
  EXPECT_FALSE(plan.layout.neighbours.empty());
  EXPECT_LT(AngleOverlapDeg(plan.valid_sectors, 0, 360), 360.0);
  EXPECT_GT(AngleOverlapDeg(plan.valid_sectors, 0, 360), 90.0);
  EXPECT_NE(plan.turbine_outages.up_law.kind, DurationLaw::Kind::kExponential);
  EXPECT_FALSE(plan.planned_outages.empty());
  EXPECT_FALSE(plan.curtailment.empty());
  EXPECT_FALSE(plan.manual_tests.empty());
  EXPECT_FALSE(plan.matrix.event_types.empty());
}

}  // namespace
}  // namespace planner
