// The HTML report as a string: self-contained (nothing fetched from a
// network), the key figures a manager reads, escaping of everything that
// comes from a user's file, and sections that appear only when given.
#include <gtest/gtest.h>

#include <cmath>
#include <ctime>
#include <string>

#include "planner/decision.h"
#include "planner/report_files.h"
#include "report/cautions.h"
#include "report/html_escape.h"
#include "report/report_test_data.h"

namespace planner {
namespace {

using report_test::TestContext;
using report_test::TestPlan;
using report_test::TestSummary;

size_t Count(const std::string& text, const std::string& what) {
  size_t n = 0;
  for (size_t pos = text.find(what); pos != std::string::npos;
       pos = text.find(what, pos + what.size())) {
    ++n;
  }
  return n;
}

bool Has(const std::string& text, const std::string& what) {
  return text.find(what) != std::string::npos;
}

// Done-by date of docs/output.md (start + ceil(7 w) days), computed with the
// C library's calendar rather than fillcast's: timegm normalises the day of
// the month past the month's end.
std::string DoneByWithLibc(int year, int month, int day, double weeks) {
  std::tm t{};
  t.tm_year = year - 1900;
  t.tm_mon = month - 1;
  t.tm_mday = day + static_cast<int>(std::ceil(7.0 * weeks - 1e-9));
  t.tm_hour = 12;
  const std::time_t when = timegm(&t);
  std::tm out{};
  gmtime_r(&when, &out);
  char buf[16];
  std::strftime(buf, sizeof buf, "%Y-%m-%d", &out);
  return buf;
}

struct Report {
  Plan plan = TestPlan();
  ForecastSummary summary = TestSummary(plan);
  HtmlReportInput Input() const {
    HtmlReportInput in;
    in.plan = &plan;
    in.forecast = &summary;
    in.context = TestContext();
    in.command_line = "fillcast forecast 'plans/ridge & vale.yaml' --runs 10 --seed 4242";
    return in;
  }
  std::string Html() const { return FormatHtmlReport(Input()); }
};

TEST(HtmlReportTest, IsSelfContained) {
  const std::string html = Report().Html();
  EXPECT_EQ(html.rfind("<!DOCTYPE html>", 0), 0u);
  EXPECT_TRUE(Has(html, "<meta charset=\"utf-8\">"));
  // Nothing that a browser would fetch: no links, scripts, images, frames,
  // style imports or fonts.
  for (const char* bad : {"http://", "https://", "<script", "<link", "<img", "<iframe",
                          "@import", "@font-face", "url(", "src=", "href="}) {
    SCOPED_TRACE(bad);
    EXPECT_FALSE(Has(html, bad));
  }
  // And the page forbids itself every fetch and script.
  EXPECT_TRUE(Has(html, "Content-Security-Policy\" content=\"default-src 'none';"));
}

TEST(HtmlReportTest, CarriesTheGeneratorMarkAndVersion) {
  const std::string html = Report().Html();
  // cli/output_file.h replaces only files that carry this mark.
  EXPECT_TRUE(Has(html, "<meta name=\"generator\" content=\"fillcast 9.8.7\">"));
  EXPECT_TRUE(Has(html, "Forecast by fillcast 9.8.7"));
}

TEST(HtmlReportTest, ElementsAreBalanced) {
  const std::string html = Report().Html();
  for (const char* tag : {"section", "svg", "table", "figure", "tr", "g", "text", "ul"}) {
    SCOPED_TRACE(tag);
    const std::string open = std::string("<") + tag;
    // "<g" also starts nothing else in this page; "<t" tags are matched whole.
    const size_t opened = Count(html, open + " ") + Count(html, open + ">");
    EXPECT_EQ(opened, Count(html, std::string("</") + tag + ">"));
    EXPECT_GT(opened, 0u);
  }
}

TEST(HtmlReportTest, SummaryShowsDoneByDatesOfP50P80P90) {
  const Report r;
  const std::string html = r.Html();
  // Start 2025-04-01; P50 9.01 weeks = 63.07 days -> day 64 (2025-06-04),
  // P80 12 weeks = 84 days (2025-06-24), P90 12.5 weeks = 87.5 days -> 88.
  EXPECT_EQ(DoneByWithLibc(2025, 4, 1, 9.01), "2025-06-04");
  for (const double weeks : {9.01, 12.0, 12.5}) {
    const std::string date = DoneByWithLibc(2025, 4, 1, weeks);
    SCOPED_TRACE(date);
    EXPECT_TRUE(Has(html, "<p class=\"key-date\">" + date + "</p>"));
  }
  EXPECT_TRUE(Has(html, "9.0 weeks (95 % CI 5.1\u201312.0)"));
  EXPECT_TRUE(Has(html, "12.0 weeks (95 % CI from 9.0)"));
}

TEST(HtmlReportTest, SummaryShowsDeadlineProbabilityBottleneckAndIncompleteShare) {
  const Report r;
  const std::string html = r.Html();
  EXPECT_TRUE(Has(html, "(2025-06-10): <b>60.0 %</b> of the simulated campaigns"));
  EXPECT_TRUE(Has(html, HtmlEscape(BottleneckSentence(r.plan.matrix, r.summary))));
  EXPECT_TRUE(
      Has(html, "10.0 % of the runs were not complete within the 20-week horizon"));
}

TEST(HtmlReportTest, NotReachedQuantileIsSaidInWords) {
  Report r;
  r.summary.p90 = report_test::Q(0.9, std::nullopt, 9.5, std::nullopt);
  const std::string html = r.Html();
  EXPECT_TRUE(Has(html, "<p class=\"key-date\">not reached</p>"));
  EXPECT_TRUE(Has(html, "beyond the 20-week horizon"));
  EXPECT_FALSE(Has(html, "P90: 12.5 weeks"));  // no marker on the curve
  EXPECT_TRUE(Has(html, "P80: 12.0 weeks, 2025-06-24"));
}

TEST(HtmlReportTest, CostAtP50AndP80OnlyWithAWeeklyCost) {
  Report r;
  EXPECT_TRUE(Has(r.Html(), "the plan gives no weekly cost"));
  EXPECT_FALSE(Has(r.Html(), "Cost EUR"));
  r.plan.cost.weekly = 12500;
  r.plan.cost.mobilisation = 40000;
  r.plan.cost.currency = "EUR";
  const std::string html = r.Html();
  // weekly x weeks + mobilisation: 12,500 x 9.01 + 40,000 = 152,625 at P50;
  // 12,500 x 12 + 40,000 = 190,000 at P80 (design brief's cost model).
  EXPECT_TRUE(Has(html, "at P50 EUR 152,625; at P80 EUR 190,000"));
  EXPECT_TRUE(Has(html, "<p class=\"key-cost\">Cost EUR 152,625</p>"));
}

TEST(HtmlReportTest, ShowsEveryCaution) {
  const std::string html = Report().Html();
  EXPECT_TRUE(Has(html, "<h2>Cautions</h2>"));
  for (const std::string& c : StandardCautions()) {
    SCOPED_TRACE(c);
    EXPECT_TRUE(Has(html, "<li>" + HtmlEscape(c) + "</li>"));
  }
}

TEST(HtmlReportTest, EscapesEverythingFromTheUsersFiles) {
  Report r;
  r.plan.turbine.name = "T<1> & 'two'";
  const std::string html = r.Html();
  EXPECT_TRUE(Has(html, "<h1>Ridge &lt;North&gt; &amp; &quot;Vale&quot; campaign</h1>"));
  EXPECT_TRUE(Has(html, "Vale &lt;invented&gt;"));
  EXPECT_TRUE(Has(html, "T&lt;1&gt; &amp; &#39;two&#39;"));
  EXPECT_TRUE(Has(html, "plans/ridge &amp; vale.yaml"));
  EXPECT_TRUE(Has(html, "grid loss, manual &lt;test&gt;"));
  for (const char* raw : {"<North>", "<invented>", "<test>", "T<1>", "ridge & vale"}) {
    SCOPED_TRACE(raw);
    EXPECT_FALSE(Has(html, raw));
  }
}

TEST(HtmlReportTest, MatrixGridShowsExpectedOverRequiredForEveryRecordCell) {
  const Report r;
  const std::string html = r.Html();
  EXPECT_TRUE(Has(html, ">14.2 / 10<") || Has(html, ">14.3 / 10<"));  // 14.25
  EXPECT_TRUE(Has(html, ">6.5 / 10<"));
  EXPECT_TRUE(Has(html, ">7.8 / 8<") || Has(html, ">7.7 / 8<"));  // 7.75
  EXPECT_TRUE(Has(html, ">40.0 / 3<"));
  EXPECT_TRUE(Has(html, ">70 %<"));
  EXPECT_TRUE(Has(html, ">98 %<"));
  EXPECT_EQ(Count(html, ">no cell<"), 1u);              // 5-6 m/s, TI 10-20 %
  EXPECT_EQ(Count(html, "class=\"optional-mark"), 2u);  // the cell and the legend
  EXPECT_EQ(Count(html, "class=\"bottleneck\""), 2u);   // the cell and the legend
  EXPECT_TRUE(Has(html, "TI not binned"));
  EXPECT_EQ(Count(html, "<tr class=\"bottleneck-row\">"),
            1u);  // in the thin-cell table              // the parked grid
  // The event cell is a table row, not a grid cell.
  EXPECT_TRUE(Has(html, "<h3>Event cells</h3>"));
  EXPECT_TRUE(Has(html, "<td class=\"label\">8\u201316 m/s</td>"));
}

TEST(HtmlReportTest, ChartsAreInlineSvgWithLabelledAxes) {
  const std::string html = Report().Html();
  EXPECT_EQ(Count(html, "<svg "), 5u);  // curve, legend, two grids, fill
  EXPECT_TRUE(Has(html, ">Weeks from the start<"));
  EXPECT_TRUE(Has(html, ">Campaigns complete, % of runs<"));
  EXPECT_TRUE(Has(html, ">Required cells full, %<"));
  EXPECT_TRUE(Has(html, ">Deadline 2025-06-10<"));
  EXPECT_TRUE(Has(html, ">P50: 9.0 weeks, 2025-06-04<"));
}

TEST(HtmlReportTest, EmptyCurvesAreSaidInWords) {
  Report r;
  r.summary.fill_curve.clear();
  r.summary.completion_counts.clear();
  r.summary.runs = 0;
  const std::string html = r.Html();
  EXPECT_TRUE(Has(html, "No runs to draw."));
  EXPECT_TRUE(Has(html, "Not available for this result."));
  EXPECT_EQ(Count(html, "<svg "), 3u);
}

TEST(HtmlReportTest, SweepAndComparisonOnlyWhenGiven) {
  const Report r;
  std::string html = r.Html();
  EXPECT_FALSE(Has(html, "id=\"start-sweep\""));
  EXPECT_FALSE(Has(html, "id=\"comparison\""));

  HtmlReportInput in = r.Input();
  StartSweepRow row;
  row.start = Date{2025, 9, 1};
  row.deadline = Date{2025, 11, 10};
  row.p50 = report_test::Q(0.5, 8.0, 7.0, 9.0);
  row.p80 = report_test::Q(0.8, 11.0, 10.0, 12.0);
  row.p90 = report_test::Q(0.9, std::nullopt, 12.0, std::nullopt);
  row.p_complete_by_deadline = 0.7;
  in.start_sweep = {row};

  Comparison cmp;
  ScenarioResult a;
  a.name = "Ridge <A>";
  a.file = "a.yaml";
  a.summary = r.summary;
  ScenarioResult b = a;
  b.name = "Vale & B";
  b.file = "b.yaml";
  cmp.ranked = {a, b};
  PairedDifference d;
  d.a = a.name;
  d.b = b.name;
  d.pairs = 9;
  d.mean_weeks = 2.5;
  d.se_weeks = 0.4;
  d.p_a_sooner = 0.7;
  cmp.best_two = d;
  in.comparison = &cmp;

  html = FormatHtmlReport(in);
  EXPECT_TRUE(Has(html, "id=\"start-sweep\""));
  EXPECT_TRUE(Has(html, "<td>2025-09-01</td><td>2025-11-10</td>"));
  // 2025-09-01 + 8 weeks = 2025-10-27; 11 weeks = 2025-11-17.
  EXPECT_TRUE(Has(html, "<td>2025-10-27</td>"));
  EXPECT_TRUE(Has(html, "<td>2025-11-17</td>"));
  EXPECT_TRUE(Has(html, ">Weeks to completion<"));
  EXPECT_TRUE(Has(html, "id=\"comparison\""));
  EXPECT_TRUE(Has(html, "Ridge &lt;A&gt;"));
  EXPECT_TRUE(Has(html, "Vale &amp; B takes 2.5 weeks longer than Ridge &lt;A&gt;"));
  EXPECT_TRUE(Has(html, "(standard error 0.4 weeks), over the 9 runs"));
  EXPECT_FALSE(Has(html, "Cost at P50"));  // no cost model in either scenario
  EXPECT_EQ(Count(html, "<svg "), 7u);
}

TEST(HtmlReportTest, ComparisonWithoutPairsSaysSo) {
  const Report r;
  HtmlReportInput in = r.Input();
  Comparison cmp;
  ScenarioResult a;
  a.name = "A";
  a.summary = r.summary;
  a.cost.weekly = 1000;
  a.cost_p50 = 9010;
  a.expected_cost = 9500;
  a.expected_cost_is_lower_bound = true;
  cmp.ranked = {a};
  PairedDifference d;
  d.a = "A";
  d.b = "B";
  cmp.best_two = d;
  in.comparison = &cmp;
  const std::string html = FormatHtmlReport(in);
  EXPECT_TRUE(Has(html, "no run completed under both A and B"));
  EXPECT_TRUE(Has(html, "<td class=\"num\">EUR 9,010</td>"));
  EXPECT_TRUE(Has(html, "<td class=\"num\">at least EUR 9,500</td>"));
}

TEST(HtmlReportTest, InputsNameFilesRunsSeedAndCommand) {
  const std::string html = Report().Html();
  EXPECT_TRUE(Has(html, "<tr><th>Seed</th><td>4242</td></tr>"));
  EXPECT_TRUE(Has(html, "<tr><th>Runs</th><td>10</td></tr>"));
  EXPECT_TRUE(Has(html, "<code>sites/vale.yaml</code>"));
  EXPECT_TRUE(Has(html, "--runs 10 --seed 4242"));
  EXPECT_TRUE(Has(html, "5 cells, 4 required"));
}

TEST(HtmlReportTest, PrintsWithoutDarkBackgroundsAndWithPageBreaks) {
  const std::string html = Report().Html();
  EXPECT_TRUE(Has(html, "@media print"));
  EXPECT_TRUE(Has(html, "section.page { break-before: page; }"));
  EXPECT_TRUE(Has(html, "background: #fff;"));
}

}  // namespace
}  // namespace planner

namespace planner {
namespace {

// "What holds the campaign up" appears only when the forecast carries it,
// with one row per process switched off (label escaped, weeks saved), and the
// text summary has the same rows.
TEST(HtmlReportTest, HoldUpsSectionOnlyWithHoldUps) {
  Report r;
  EXPECT_EQ(r.Html().find("id=\"hold-ups\""), std::string::npos);
  HoldUp h;
  h.key = "episode:icing";
  h.label = "icing <episodes>";
  h.p80.value = 40.0;
  h.p50.value = 30.0;
  h.p80_saved_weeks = 2.5;
  h.p_complete_by_deadline = 0.4;
  r.summary.hold_ups = {h};
  const std::string html = r.Html();
  EXPECT_NE(html.find("id=\"hold-ups\""), std::string::npos);
  EXPECT_NE(html.find("icing &lt;episodes&gt;"), std::string::npos);
  EXPECT_NE(html.find(">2.5<"), std::string::npos);
  const std::string text = FormatForecastText(r.plan, r.summary, TestContext());
  EXPECT_NE(text.find("What holds the campaign up"), std::string::npos);
  EXPECT_NE(text.find("icing <episodes>"), std::string::npos);
}

}  // namespace
}  // namespace planner
