// The CSV exports read back with an RFC 4180 parser written here: one row per
// cell with the summary's numbers exactly, quoting of labels with commas and
// quotes, and the completion curve as the empirical distribution function.
#include <gtest/gtest.h>

#include <cstdlib>
#include <limits>
#include <string>
#include <vector>

#include "planner/report_files.h"
#include "report/report_test_data.h"

namespace planner {
namespace {

using report_test::TestContext;
using report_test::TestPlan;
using report_test::TestSummary;

using Row = std::vector<std::string>;

// Records of an RFC 4180 document (section 2: fields separated by commas,
// records by CRLF; a field in double quotes may hold commas, CRLF and doubled
// quotes). Lines starting with '#' before the header are skipped as comments.
std::vector<Row> ParseCsv(const std::string& text, std::vector<std::string>* comments) {
  std::vector<Row> rows;
  size_t i = 0;
  while (i < text.size() && text[i] == '#') {
    const size_t end = text.find("\r\n", i);
    comments->push_back(text.substr(i, end - i));
    i = end + 2;
  }
  Row row;
  std::string field;
  bool quoted = false, any = false;
  for (; i < text.size(); ++i) {
    const char ch = text[i];
    any = true;
    if (quoted) {
      if (ch == '"' && i + 1 < text.size() && text[i + 1] == '"') {
        field += '"';
        ++i;
      } else if (ch == '"') {
        quoted = false;
      } else {
        field += ch;
      }
    } else if (ch == '"') {
      quoted = true;
    } else if (ch == ',') {
      row.push_back(field);
      field.clear();
    } else if (ch == '\r' && i + 1 < text.size() && text[i + 1] == '\n') {
      row.push_back(field);
      rows.push_back(row);
      row.clear();
      field.clear();
      any = false;
      ++i;
    } else {
      field += ch;
    }
  }
  if (any) {
    row.push_back(field);
    rows.push_back(row);
  }
  return rows;
}

double Number(const std::string& field) {
  char* end = nullptr;
  const double x = std::strtod(field.c_str(), &end);
  EXPECT_EQ(*end, '\0') << "not a number: " << field;
  return x;
}

size_t Column(const Row& header, const std::string& name) {
  for (size_t i = 0; i < header.size(); ++i) {
    if (header[i] == name) return i;
  }
  ADD_FAILURE() << "no column " << name;
  return 0;
}

TEST(CsvExportTest, CellTableHasOneRowPerCellWithTheSummarysNumbers) {
  const Plan plan = TestPlan();
  const ForecastSummary s = TestSummary(plan);
  std::vector<std::string> comments;
  const std::vector<Row> rows =
      ParseCsv(FormatCellsCsv(plan, s, TestContext()), &comments);
  ASSERT_EQ(comments.size(), 1u);
  EXPECT_EQ(comments[0], "# generator=fillcast 9.8.7 fillcast-seal:0000000000000000");
  ASSERT_EQ(rows.size(), s.cells.size() + 1);
  const Row& h = rows[0];
  for (const Row& r : rows) EXPECT_EQ(r.size(), h.size());

  for (size_t k = 0; k < s.cells.size(); ++k) {
    SCOPED_TRACE(k);
    const Row& r = rows[k + 1];
    const CellForecast& c = s.cells[k];
    EXPECT_EQ(Number(r[Column(h, "index")]), c.index);
    EXPECT_EQ(r[Column(h, "label")], CellLabel(plan.matrix, c.cell));
    EXPECT_EQ(Number(r[Column(h, "wind_lo_ms")]), c.cell.wind_ms.lo);
    EXPECT_EQ(Number(r[Column(h, "wind_hi_ms")]), c.cell.wind_ms.hi);
    EXPECT_EQ(Number(r[Column(h, "required")]), c.cell.required);
    EXPECT_EQ(r[Column(h, "optional")], c.cell.optional ? "true" : "false");
    // Exactly equal: the numbers are written so that they read back unchanged.
    EXPECT_EQ(Number(r[Column(h, "count_mean")]), c.count_mean);
    EXPECT_EQ(Number(r[Column(h, "count_p10")]), c.count_p10);
    EXPECT_EQ(Number(r[Column(h, "count_p50")]), c.count_p50);
    EXPECT_EQ(Number(r[Column(h, "count_p90")]), c.count_p90);
    EXPECT_EQ(Number(r[Column(h, "p_full_by_deadline")]), c.p_full_by_deadline);
    EXPECT_EQ(Number(r[Column(h, "p_last_to_fill")]), c.p_last_to_fill);
    if (c.weeks_to_full_p50) {
      EXPECT_EQ(Number(r[Column(h, "weeks_to_full_p50")]), *c.weeks_to_full_p50);
    } else {
      EXPECT_EQ(r[Column(h, "weeks_to_full_p50")], "");  // not reached
    }
  }
  // Kinds, states, TI bins and the savings of the bottleneck cell.
  EXPECT_EQ(rows[1][Column(h, "kind")], "records");
  EXPECT_EQ(rows[1][Column(h, "state")], "production");
  EXPECT_EQ(rows[1][Column(h, "ti_hi_pct")], "10");
  EXPECT_EQ(rows[4][Column(h, "state")], "parked");
  EXPECT_EQ(rows[4][Column(h, "ti_lo_pct")], "");  // not binned
  EXPECT_EQ(rows[5][Column(h, "kind")], "event");
  EXPECT_EQ(rows[5][Column(h, "event")], "grid loss, manual <test>");
  EXPECT_EQ(Number(rows[3][Column(h, "saved_p80_if_optional_weeks")]), 1.5);
  EXPECT_EQ(rows[1][Column(h, "saved_p80_if_optional_weeks")], "");
  EXPECT_EQ(Number(rows[1][Column(h, "relaxed_share")]), 0.8);
}

TEST(CsvExportTest, QuotesFieldsWithCommasAndQuotesAsRfc4180Asks) {
  Plan plan = TestPlan();
  plan.matrix.event_types[0] = "grid loss, \"manual\"";
  const ForecastSummary s = TestSummary(plan);
  const std::string csv = FormatCellsCsv(plan, s, TestContext());
  // RFC 4180 section 2, rules 6 and 7: enclosed in quotes, quotes doubled.
  EXPECT_NE(csv.find(",\"event grid loss, \"\"manual\"\" 8-16 m/s\",event,event,"
                     "\"grid loss, \"\"manual\"\"\","),
            std::string::npos)
      << csv;
  std::vector<std::string> comments;
  const std::vector<Row> rows = ParseCsv(csv, &comments);
  ASSERT_EQ(rows.size(), 6u);
  EXPECT_EQ(rows[5][1], "event grid loss, \"manual\" 8-16 m/s");
  EXPECT_EQ(rows[5].size(), rows[0].size());
  // Records end with CRLF (RFC 4180 section 2, rule 1).
  EXPECT_EQ(csv.substr(csv.size() - 2), "\r\n");
}

TEST(CsvExportTest, CompletionCurveIsTheEmpiricalDistributionFunction) {
  ForecastSummary s;
  // Five runs completing at 1.5, 2, 2, 3.25 weeks and never.
  s.runs = 5;
  s.completion_counts = {{1.5, 1}, {2.0, 2}, {3.25, 1}};
  std::vector<std::string> comments;
  const std::vector<Row> rows =
      ParseCsv(FormatCompletionCurveCsv(s, TestContext()), &comments);
  ASSERT_EQ(comments.size(), 1u);
  EXPECT_EQ(comments[0], "# generator=fillcast 9.8.7 fillcast-seal:0000000000000000");
  // One row per distinct completion time; share = runs done by then / all
  // runs, so the incomplete run keeps the curve below 1 (computed by hand).
  const std::vector<Row> expected = {{"week", "runs_complete", "share_complete"},
                                     {"1.5", "1", "0.2"},
                                     {"2", "3", "0.6"},
                                     {"3.25", "4", "0.8"}};
  EXPECT_EQ(rows, expected);
}

TEST(CsvExportTest, CurveOfTheSharedSummaryMatchesItsQuantiles) {
  const Plan plan = TestPlan();
  const ForecastSummary s = TestSummary(plan);
  std::vector<std::string> comments;
  const std::vector<Row> rows =
      ParseCsv(FormatCompletionCurveCsv(s, TestContext()), &comments);
  ASSERT_EQ(rows.size(), 10u);  // header + nine completed runs
  // The P50 (order statistic ceil(10 x 0.5) = 5) is the week where the share
  // first reaches 0.5.
  for (size_t i = 1; i < rows.size(); ++i) {
    if (Number(rows[i][2]) >= 0.5) {
      EXPECT_EQ(Number(rows[i][0]), *s.p50.value);
      break;
    }
  }
  EXPECT_EQ(Number(rows.back()[2]), 0.9);
}

}  // namespace
}  // namespace planner
