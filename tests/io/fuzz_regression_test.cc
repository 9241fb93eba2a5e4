// Regression tests for problems found while fuzzing the readers
// (tests/fuzz/, DEVELOPERS.md "Fuzzing") and while reviewing them for it.
// Each input once crashed, hung or was silently misread; each must now give
// an InputError with a clear message, or read correctly.
#include <gtest/gtest.h>

#include <sstream>
#include <string>

#include "io/met_csv_reader.h"
#include "io/reader_test_util.h"
#include "planner/plan_reader.h"

namespace planner {
namespace {

using reader_test::ErrorOf;
using reader_test::TestPlanError;

const std::string kPlanHead = reader_test::PlanHead("Fuzz regression") +
                              "capture_matrix:\n"
                              "  production: {wind_bins_ms: [4, 8], min_records: 10}\n";

// Found by fuzz_site_model: a ',' where a value should start made the YAML
// library produce empty documents forever (memory grew until the process
// died). Now it is a syntax error at the ','.
TEST(FuzzRegressionTest, StrayCommaIsASyntaxErrorNotAHang) {
  EXPECT_EQ(ErrorOf([] { ParseSiteModel(",\n", "site.yaml"); }),
            "site.yaml:1:1: invalid YAML: unexpected ','; a value cannot start here");
  // The input the fuzzer saved (a mutated seed), as it was.
  const std::string found =
      ",name: Table with fixed TI\n"
      "sectors:\n"
      "  - {frequenc05:.y ,pct: 10, ti_stlawd_pct: 0}\n";
  EXPECT_EQ(ErrorOf([&] { ParseSiteModel(found, "site.yaml"); }),
            "site.yaml:1:1: invalid YAML: unexpected ','; a value cannot start here");
  EXPECT_EQ(TestPlanError(",\n" + kPlanHead),
            "plan.yaml:1:1: invalid YAML: unexpected ','; a value cannot start here");
}

// A second document is still found where it starts, and a trailing "---" is
// still harmless (the document walk replaced the library's own).
TEST(FuzzRegressionTest, DocumentsAreStillCountedAsBefore) {
  EXPECT_EQ(TestPlanError(kPlanHead + "---\n"), "(no error)");
  EXPECT_EQ(TestPlanError(kPlanHead + "---\n---\n"), "(no error)");
  EXPECT_EQ(
      TestPlanError(kPlanHead + "---\nname: Second\n"),
      "plan.yaml:8:1: a second YAML document starts here; a file holds exactly one");
  EXPECT_EQ(
      ErrorOf([] { ParseSiteModel("", "site.yaml"); }),
      "site.yaml: expected a mapping, got nothing; valid fields: name, description, "
      "sectors, sector_persistence, wind_persistence_h, monthly_factors, "
      "hourly_factors, interannual_std, mean_speed_uncertainty_pct, turbulence");
}

// The simulation keeps the curtailment rules in force as bits of a 32-bit
// mask; rules after the 32nd were silently ignored.
TEST(FuzzRegressionTest, MoreThan32CurtailmentRulesAreRejected) {
  auto rules = [](int n) {
    std::string text = "curtailment:\n";
    for (int i = 0; i < n; ++i) {
      text += "  - {name: rule " + std::to_string(i) + ", months: [" +
              std::to_string(i % 12 + 1) + "], action: stop}\n";
    }
    return text;
  };
  EXPECT_EQ(TestPlanError(kPlanHead + rules(32)), "(no error)");
  EXPECT_EQ(TestPlanError(kPlanHead + rules(33)),
            "plan.yaml:8:3: curtailment: 33 rules given; at most 32 are allowed");
}

// A device without an end (or without a size) was read until memory ran out;
// devices and pipes are now refused before they are opened.
TEST(FuzzRegressionTest, PlanFromAnEndlessDeviceIsRefused) {
  EXPECT_EQ(ErrorOf([] { LoadPlan("/dev/zero"); }),
            "/dev/zero: cannot open plan file: it is a character device; fillcast reads "
            "regular files only (save the data to a file first)");
}

TEST(FuzzRegressionTest, MetCsvFromAnEndlessDeviceIsRefused) {
  EXPECT_EQ(ErrorOf([] { LoadMetCsv("/dev/zero", MetCsvOptions{}); }),
            "/dev/zero: cannot open met data file: it is a character device; fillcast "
            "reads regular files only (save the data to a file first)");
}

// A very long line still stops at 1 MiB (a regular file this time).
TEST(FuzzRegressionTest, MetCsvWithAnEndlessLineStopsAt1MiB) {
  std::istringstream in(std::string((1 << 20) + 10, '7'));
  EXPECT_EQ(ErrorOf([&] { ReadMetCsv(in, "mast.csv", MetCsvOptions{}); }),
            "mast.csv:1: line is longer than 1 MiB; expected a CSV file of met data, "
            "one record per line");
}

// The line reader that replaced std::getline keeps what getline kept: NUL
// bytes inside a line, a last line without a line end, empty lines.
TEST(FuzzRegressionTest, MetCsvLinesReadAsBefore) {
  std::istringstream in(std::string("timestamp,speed_ms\n\n2024-01-01 00:00,5\n") +
                        std::string("2024-01-01 00:10,6\x00x\n", 21) +
                        "2024-01-01 00:20,7");
  const MetSeries s = ReadMetCsv(in, "mast.csv", MetCsvOptions{});
  ASSERT_EQ(s.records.size(), 2u);
  EXPECT_DOUBLE_EQ(s.records[0].speed_ms, 5.0);
  EXPECT_DOUBLE_EQ(s.records[1].speed_ms, 7.0);
  EXPECT_EQ(s.read.rows_read, 3);
  EXPECT_EQ(s.read.dropped[static_cast<int>(DropReason::kSpeedNonNumeric)], 1);
}

}  // namespace
}  // namespace planner
