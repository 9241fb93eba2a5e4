// The written forecast: JSON keys that scripts rely on (docs/output.md), the
// labelled rows of the terminal summary, and the cautions.
#include "planner/forecast_report.h"

#include <gtest/gtest.h>

#include <algorithm>
#include <nlohmann/json.hpp>
#include <sstream>
#include <string>

#include "report/cautions.h"

namespace planner {
namespace {

using nlohmann::json;

Plan TestPlan() {
  Plan p;
  p.name = "Brackenfold prototype campaign";
  p.site.name = "Brackenfold Moor (invented)";
  p.turbine.name = "TX-140 prototype (invented)";
  p.start = Date{2025, 4, 1};
  p.deadline = Date{2025, 6, 10};  // 70 days = 10 weeks
  p.horizon_weeks = 30;
  return p;
}

Cell MakeCell(OperatingState state, double lo, double hi, int required, bool optional) {
  Cell c;
  c.state = state;
  c.wind_ms = {lo, hi};
  c.required = required;
  c.optional = optional;
  return c;
}

QuantileEstimate Q(double p, std::optional<double> v, std::optional<double> lo,
                   std::optional<double> hi) {
  QuantileEstimate q;
  q.p = p;
  q.value = v;
  q.ci_lo = lo;
  q.ci_hi = hi;
  return q;
}

// A summary written by hand: some runs incomplete, so P90 and the mean are
// not reached.
ForecastSummary TestSummary() {
  ForecastSummary s;
  s.runs = 400;
  s.seed = 12345;
  s.deadline_weeks = 10;
  s.horizon_weeks = 30;
  s.p10 = Q(0.1, 5.1, 4.9, 5.3);
  s.p50 = Q(0.5, 9.0, 8.5, 9.6);
  s.p80 = Q(0.8, 12.0, 11.2, std::nullopt);
  s.p90 = Q(0.9, std::nullopt, 13.0, std::nullopt);
  s.p_complete_by_deadline = 0.55;
  s.p_incomplete_at_horizon = 0.12;

  CellForecast low;
  low.index = 0;
  low.cell = MakeCell(OperatingState::kProduction, 4, 5, 10, false);
  low.count_mean = 10.8;
  low.count_p10 = 3;
  low.count_p50 = 11;
  low.count_p90 = 15;
  low.p_full_by_deadline = 0.7;
  low.weeks_to_full_p50 = 7.5;
  low.weeks_to_full_p90 = 24.8;
  low.p_last_to_fill = 0.3;

  CellForecast mid;
  mid.index = 1;
  mid.cell = MakeCell(OperatingState::kProduction, 12, 13, 5, false);
  mid.cell.ti_binned = true;
  mid.cell.ti_pct = {12, 16};
  mid.count_mean = 5.1;
  mid.count_p10 = 1;
  mid.count_p50 = 5;
  mid.count_p90 = 8;
  mid.p_full_by_deadline = 0.45;
  mid.weeks_to_full_p50 = 8.0;
  mid.p_last_to_fill = 0.58;

  CellForecast storm;
  storm.index = 2;
  storm.cell = MakeCell(OperatingState::kParked, 25, 26, 3, true);
  storm.count_mean = 0.4;
  storm.count_p90 = 1;
  storm.p_full_by_deadline = 0.1;

  s.cells = {low, mid, storm};
  s.bottleneck_cell = 1;
  s.turbine_availability = 0.9523;
  s.daq_availability = 0.981;
  s.valid_sector_share = 0.643;
  return s;
}

ReportContext TestContext() {
  ReportContext ctx;
  ctx.tool_version = "9.8.7";
  ctx.threads = 2;
  return ctx;
}

bool IsNumberOrNull(const json& j) { return j.is_number() || j.is_null(); }

bool IsInterval(const json& j) {
  return j.is_array() && j.size() == 2 && IsNumberOrNull(j[0]) && IsNumberOrNull(j[1]);
}

// Collapses runs of whitespace so wrapped text can be searched for sentences.
std::string Squeeze(const std::string& text) {
  std::istringstream in(text);
  std::string word, out;
  while (in >> word) out += (out.empty() ? "" : " ") + word;
  return out;
}

TEST(ForecastReportJsonTest, HasEveryDocumentedKeyWithItsType) {
  const json j =
      json::parse(FormatForecastJson(TestPlan(), TestSummary(), TestContext()));

  EXPECT_EQ(j.at("runs"), 400);
  EXPECT_TRUE(j.at("runs").is_number_integer());
  EXPECT_EQ(j.at("seed"), 12345u);
  EXPECT_EQ(j.at("tool").at("name"), "fillcast");
  EXPECT_EQ(j.at("tool").at("version"), "9.8.7");
  EXPECT_EQ(j.at("plan").at("name"), "Brackenfold prototype campaign");
  EXPECT_EQ(j.at("plan").at("site"), "Brackenfold Moor (invented)");
  EXPECT_EQ(j.at("plan").at("start"), "2025-04-01");
  EXPECT_EQ(j.at("plan").at("deadline"), "2025-06-10");
  EXPECT_EQ(j.at("plan").at("horizon_weeks"), 30.0);
  EXPECT_EQ(j.at("deadline_weeks"), 10.0);

  const json& cw = j.at("completion_weeks");
  EXPECT_TRUE(cw.at("mean").is_null());  // not every run completed
  EXPECT_TRUE(cw.at("mean_se").is_null());
  EXPECT_DOUBLE_EQ(cw.at("p10").get<double>(), 5.1);
  EXPECT_DOUBLE_EQ(cw.at("p50").get<double>(), 9.0);
  EXPECT_DOUBLE_EQ(cw.at("p80").get<double>(), 12.0);
  EXPECT_TRUE(cw.at("p90").is_null());
  for (const char* key : {"p10", "p50", "p80", "p90"}) {
    SCOPED_TRACE(key);
    EXPECT_TRUE(IsInterval(cw.at("ci95").at(key)));
  }
  EXPECT_DOUBLE_EQ(cw.at("ci95").at("p50")[0].get<double>(), 8.5);
  EXPECT_DOUBLE_EQ(cw.at("ci95").at("p50")[1].get<double>(), 9.6);
  EXPECT_TRUE(cw.at("ci95").at("p80")[1].is_null());
  EXPECT_DOUBLE_EQ(cw.at("ci95").at("p90")[0].get<double>(), 13.0);

  EXPECT_DOUBLE_EQ(j.at("p_complete_by_deadline").get<double>(), 0.55);
  EXPECT_DOUBLE_EQ(j.at("p_incomplete_at_horizon").get<double>(), 0.12);

  const json& cells = j.at("cells");
  ASSERT_TRUE(cells.is_array());
  ASSERT_EQ(cells.size(), 3u);
  for (const json& c : cells) {
    EXPECT_TRUE(c.at("state") == "production" || c.at("state") == "parked");
    EXPECT_TRUE(IsInterval(c.at("wind_ms")));
    EXPECT_TRUE(c.at("ti").is_null() || IsInterval(c.at("ti")));
    EXPECT_TRUE(c.at("required").is_number_integer());
    EXPECT_TRUE(c.at("optional").is_boolean());
    for (const char* key : {"mean", "p10", "p50", "p90"}) {
      EXPECT_TRUE(c.at("count_at_deadline").at(key).is_number());
    }
    EXPECT_TRUE(c.at("p_full_by_deadline").is_number());
    EXPECT_TRUE(IsNumberOrNull(c.at("weeks_to_full").at("p50")));
    EXPECT_TRUE(IsNumberOrNull(c.at("weeks_to_full").at("p90")));
    EXPECT_TRUE(c.at("p_last_to_fill").is_number());
    EXPECT_TRUE(c.at("label").is_string());
  }
  EXPECT_EQ(cells[0].at("state"), "production");
  EXPECT_EQ(cells[0].at("wind_ms"), json::array({4.0, 5.0}));
  EXPECT_TRUE(cells[0].at("ti").is_null());
  EXPECT_EQ(cells[0].at("required"), 10);
  EXPECT_EQ(cells[0].at("optional"), false);
  EXPECT_DOUBLE_EQ(cells[0].at("count_at_deadline").at("mean").get<double>(), 10.8);
  EXPECT_DOUBLE_EQ(cells[0].at("count_at_deadline").at("p90").get<double>(), 15.0);
  EXPECT_DOUBLE_EQ(cells[0].at("weeks_to_full").at("p90").get<double>(), 24.8);
  EXPECT_EQ(cells[1].at("ti"), json::array({12.0, 16.0}));
  EXPECT_TRUE(cells[1].at("weeks_to_full").at("p90").is_null());
  EXPECT_DOUBLE_EQ(cells[1].at("p_last_to_fill").get<double>(), 0.58);
  EXPECT_EQ(cells[2].at("state"), "parked");
  EXPECT_EQ(cells[2].at("optional"), true);
  EXPECT_TRUE(cells[2].at("weeks_to_full").at("p50").is_null());

  EXPECT_EQ(j.at("bottleneck").at("cell"), 1);
  EXPECT_EQ(j.at("bottleneck").at("label"), CellLabel(TestSummary().cells[1].cell));
  EXPECT_DOUBLE_EQ(j.at("diagnostics").at("turbine_availability").get<double>(), 0.9523);
  EXPECT_DOUBLE_EQ(j.at("diagnostics").at("daq_availability").get<double>(), 0.981);
  EXPECT_DOUBLE_EQ(j.at("diagnostics").at("valid_sector_share").get<double>(), 0.643);

  ASSERT_TRUE(j.at("cautions").is_array());
  EXPECT_EQ(j.at("cautions").get<std::vector<std::string>>(), StandardCautions());
  EXPECT_TRUE(j.at("notes").is_array());
}

TEST(ForecastReportJsonTest, CompletionDatesRoundUpToWholeDays) {
  const json j =
      json::parse(FormatForecastJson(TestPlan(), TestSummary(), TestContext()));
  const json& d = j.at("completion_dates");
  // Counted on the calendar from 2025-04-01 (April has 30 days, May 31):
  // 5.1 weeks = 35.7 days -> 36 days -> 2025-05-07;
  // 9 weeks = 63 days -> 2025-06-03; 12 weeks = 84 days -> 2025-06-24.
  EXPECT_EQ(d.at("p10"), "2025-05-07");
  EXPECT_EQ(d.at("p50"), "2025-06-03");
  EXPECT_EQ(d.at("p80"), "2025-06-24");
  EXPECT_TRUE(d.at("p90").is_null());
}

TEST(ForecastReportJsonTest, MeanAndBottleneckWhenDefinedOrNot) {
  ForecastSummary s = TestSummary();
  s.mean_weeks = 9.25;
  s.mean_se_weeks = 0.125;
  s.bottleneck_cell = -1;
  const json j = json::parse(FormatForecastJson(TestPlan(), s, TestContext()));
  EXPECT_DOUBLE_EQ(j.at("completion_weeks").at("mean").get<double>(), 9.25);
  EXPECT_DOUBLE_EQ(j.at("completion_weeks").at("mean_se").get<double>(), 0.125);
  EXPECT_TRUE(j.at("bottleneck").is_null());
}

TEST(ForecastReportTextTest, HasLabelledRowsDatesAndCautions) {
  const std::string text = FormatForecastText(TestPlan(), TestSummary(), TestContext());
  const std::string flat = Squeeze(text);

  EXPECT_NE(flat.find("Brackenfold prototype campaign"), std::string::npos);
  EXPECT_NE(flat.find("Brackenfold Moor (invented)"), std::string::npos);
  EXPECT_NE(flat.find("2025-04-01"), std::string::npos);
  EXPECT_NE(flat.find("Deadline: 2025-06-10"), std::string::npos);
  EXPECT_NE(flat.find("400 (seed 12345, 2 threads)"), std::string::npos);

  // Rows: label, weeks, 95 % CI, done-by date.
  EXPECT_NE(flat.find("P10 5.1 4.9 - 5.3 2025-05-07"), std::string::npos) << text;
  EXPECT_NE(flat.find("P50 9.0 8.5 - 9.6 2025-06-03"), std::string::npos) << text;
  EXPECT_NE(flat.find("P80 12.0 from 11.2 2025-06-24"), std::string::npos) << text;
  EXPECT_NE(flat.find("P90 not reached from 13.0"), std::string::npos) << text;
  EXPECT_NE(flat.find("mean none"), std::string::npos) << text;
  EXPECT_NE(flat.find("Complete by the deadline (2025-06-10): 55.0 % of runs"),
            std::string::npos)
      << text;
  EXPECT_NE(flat.find("Not complete within the horizon (30 weeks): 12.0 % of runs"),
            std::string::npos)
      << text;

  // Thin cells: required cells only, cell 1 (45 %) before cell 0 (70 %).
  const std::string mid = CellLabel(TestSummary().cells[1].cell);
  const std::string low = CellLabel(TestSummary().cells[0].cell);
  const std::string storm = CellLabel(TestSummary().cells[2].cell);
  const size_t mid_row = flat.find(mid + " 5 5.1 1-8 45.0 % 8.0");
  const size_t low_row = flat.find(low + " 10 10.8 3-15 70.0 % 7.5");
  ASSERT_NE(mid_row, std::string::npos) << text;
  ASSERT_NE(low_row, std::string::npos) << text;
  EXPECT_LT(mid_row, low_row);
  EXPECT_EQ(flat.find(storm), std::string::npos);  // optional cell left out
  EXPECT_NE(flat.find("Counts are valid 10-minute records (events: counted events); "
                      "weeks count from the start."),
            std::string::npos);

  EXPECT_NE(flat.find("The campaign waits mostly on " + mid +
                      " (last to fill in 58 % of runs)"),
            std::string::npos)
      << text;
  EXPECT_NE(flat.find("Turbine available: 95.2 %"), std::string::npos) << text;
  EXPECT_NE(flat.find("Data acquisition available: 98.1 %"), std::string::npos);
  EXPECT_NE(flat.find("Wind from a valid sector: 64.3 %"), std::string::npos);
  // 12 % of runs incomplete and fewer than 1,000 runs: both noted.
  EXPECT_NE(flat.find("12.0 % of runs did not complete within the 30-week horizon"),
            std::string::npos)
      << text;
  EXPECT_NE(flat.find("Only 400 runs"), std::string::npos);

  // The cautions close the report, every one of them.
  const size_t cautions = flat.find("Cautions");
  ASSERT_NE(cautions, std::string::npos);
  for (const std::string& c : StandardCautions()) {
    EXPECT_NE(flat.find(c, cautions), std::string::npos) << c;
  }
}

// The turbine's high-wind rules and the episodes are named in the header
// when the plan has them, and the header is as before when it has none.
TEST(ForecastReportTextTest, HeaderNamesHighWindRulesAndEpisodes) {
  const std::string plain = Squeeze(FormatForecastText(TestPlan(), TestSummary(), TestContext()));
  EXPECT_EQ(plain.find("High wind:"), std::string::npos);
  EXPECT_EQ(plain.find("Episodes:"), std::string::npos);

  Plan plan = TestPlan();
  plan.turbine.cut_out_ms = 25;
  plan.turbine.restart_ms = 22;
  plan.turbine.restart_wait_min = 20;
  plan.turbine.shutdown_rules = {{30, 28}, {3, 33}};
  EpisodeModel icing;
  icing.name = "icing";
  icing.starts_per_month = {1.5, 1.2, 0.6, 0.1, 0, 0, 0, 0, 0, 0.1, 0.5, 1.2};
  icing.mean_h = 30;
  plan.episodes = {icing};
  const std::string flat = Squeeze(FormatForecastText(plan, TestSummary(), TestContext()));
  EXPECT_NE(flat.find("High wind: stops at 25 m/s (10-minute mean), 28 m/s (30 s mean), "
                      "33 m/s (3 s mean); restarts below 22 m/s after 20 min"),
            std::string::npos)
      << flat;
  EXPECT_NE(flat.find("Episodes: icing (stops the turbine, records invalid): 5.2 a year, "
                      "mean 30 h"),
            std::string::npos)
      << flat;
  plan.turbine.storm_control_from_ms = 22;
  plan.turbine.cut_out_ms = 30;
  EXPECT_NE(Squeeze(FormatForecastText(plan, TestSummary(), TestContext()))
                .find("High wind: storm control (reduced) from 22 m/s; stops at 30 m/s"),
            std::string::npos);
}

TEST(ForecastReportTextTest, StandardCautionsSayWhatTheRulesAsk) {
  const std::string all = Squeeze([] {
    std::string s;
    for (const std::string& c : StandardCautions()) s += c + " ";
    return s;
  }());
  EXPECT_NE(all.find("not a promise"), std::string::npos);
  EXPECT_NE(all.find("certification body"), std::string::npos);
  EXPECT_NE(all.find("current edition of the standards"), std::string::npos);
  EXPECT_NE(all.find("local safety rules"), std::string::npos);
  EXPECT_NE(all.find("qualified people"), std::string::npos);
}

TEST(ForecastReportTextTest, LinesFitInHundredColumns) {
  Plan plan = TestPlan();
  plan.name = std::string(30, 'x') + " " + std::string(60, 'y') + " " +
              std::string(40, 'z');  // long names are wrapped
  ForecastSummary s = TestSummary();
  s.cells[1].cell.wind_ms = {12.25, 13.75};
  s.cells[1].cell.ti_pct = {12.5, 16.25};
  const std::string text = FormatForecastText(plan, s, TestContext());
  std::istringstream in(text);
  std::string line;
  int lines = 0;
  while (std::getline(in, line)) {
    ++lines;
    EXPECT_LE(line.size(), 100u) << line;
  }
  EXPECT_GT(lines, 20);
}

TEST(ForecastReportTextTest, NoBottleneckAndMeanWithStandardError) {
  ForecastSummary s = TestSummary();
  s.bottleneck_cell = -1;
  s.mean_weeks = 9.3;
  s.mean_se_weeks = 0.14;
  s.p_incomplete_at_horizon = 0;
  s.runs = 2000;
  const std::string flat = Squeeze(FormatForecastText(TestPlan(), s, TestContext()));
  EXPECT_NE(
      flat.find("No run completed within the horizon, so no single cell can be named"),
      std::string::npos);
  // 9.3 weeks = 65.1 days -> 66 days after 2025-04-01.
  EXPECT_NE(flat.find("mean 9.3 +/- 0.1 (1 s.e.) 2025-06-06"), std::string::npos) << flat;
  EXPECT_EQ(flat.find("Only 2000 runs"), std::string::npos);
  EXPECT_EQ(flat.find("did not complete within"), std::string::npos);
}

}  // namespace
}  // namespace planner
