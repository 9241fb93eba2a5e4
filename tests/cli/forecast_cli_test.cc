// End-to-end: the real fillcast binary on the demo plan and on bad input
// (the way Ninja's output tests run the real program).
#include <gtest/gtest.h>

#include <cstdio>
#include <filesystem>
#include <fstream>
#include <nlohmann/json.hpp>
#include <sstream>
#include <string>

#include "cli/cli_runner.h"

namespace {

namespace fs = std::filesystem;
using fillcast_test::Outcome;
using fillcast_test::ReadJson;
using fillcast_test::RunFillcast;

std::string Demo() { return fillcast_test::SourcePath("demo-site/plan.yaml"); }
fs::path TempDir() { return fillcast_test::TempDir("cli-test"); }

TEST(ForecastCliTest, DemoForecastPrintsSummaryAndCautions) {
  const Outcome o = RunFillcast("forecast " + Demo() + " --runs 200 --seed 3");
  ASSERT_EQ(o.exit_code, 0) << o.output;
  EXPECT_NE(o.output.find("P90"), std::string::npos) << o.output;
  EXPECT_NE(o.output.find("weeks"), std::string::npos);
  EXPECT_NE(o.output.find("Cautions"), std::string::npos);
  EXPECT_NE(o.output.find("estimate"), std::string::npos);
  // The demo plan uses all four processes that can hold a campaign up.
  EXPECT_NE(o.output.find("What holds the campaign up"), std::string::npos);
  EXPECT_NE(o.output.find("icing episodes"), std::string::npos);
  const Outcome quick =
      RunFillcast("forecast " + Demo() + " --runs 200 --seed 3 --no-explain");
  ASSERT_EQ(quick.exit_code, 0) << quick.output;
  EXPECT_EQ(quick.output.find("What holds the campaign up"), std::string::npos);
}

TEST(ForecastCliTest, SameSeedSameJsonForOneAndTwoThreads) {
  const fs::path dir = TempDir();
  const Outcome a =
      RunFillcast("forecast " + Demo() + " --runs 300 --seed 11 --threads 1 " +
                  "--quiet --json " + (dir / "one.json").string());
  const Outcome b =
      RunFillcast("forecast " + Demo() + " --runs 300 --seed 11 --threads 2 " +
                  "--quiet --json " + (dir / "two.json").string());
  ASSERT_EQ(a.exit_code, 0) << a.output;
  ASSERT_EQ(b.exit_code, 0) << b.output;
  nlohmann::json one = ReadJson(dir / "one.json");
  nlohmann::json two = ReadJson(dir / "two.json");
  // Only the reported thread count may differ.
  one.erase("threads");
  two.erase("threads");
  EXPECT_EQ(one.dump(), two.dump());
  EXPECT_EQ(one["runs"], 300);
  ASSERT_EQ(one["hold_ups"].size(), 4u);
  EXPECT_EQ(one["hold_ups"][0]["process"], "short_term_stops");
  EXPECT_EQ(one["seed"], 11);
  fs::remove_all(dir);
}

TEST(ForecastCliTest, RefusesToOverwriteAFileItDidNotWrite) {
  const fs::path dir = TempDir();
  const fs::path precious = dir / "notes.json";
  std::ofstream(precious) << "{\"my\": \"notes\"}\n";
  const Outcome o = RunFillcast("forecast " + Demo() + " --runs 20 --quiet --json " +
                                precious.string());
  EXPECT_EQ(o.exit_code, 2);
  EXPECT_NE(o.output.find("was not written by fillcast"), std::string::npos) << o.output;
  std::ifstream in(precious);
  std::stringstream kept;
  kept << in.rdbuf();
  EXPECT_EQ(kept.str(), "{\"my\": \"notes\"}\n");
  // Its own output it replaces without asking.
  const fs::path ours = dir / "ours.json";
  ASSERT_EQ(
      RunFillcast("forecast " + Demo() + " --runs 20 --quiet --json " + ours.string())
          .exit_code,
      0);
  EXPECT_EQ(
      RunFillcast("forecast " + Demo() + " --runs 20 --quiet --json " + ours.string())
          .exit_code,
      0);
  fs::remove_all(dir);
}

struct BadFlagCase {
  std::string args;
  std::string message;
};

void PrintTo(const BadFlagCase& c, std::ostream* os) { *os << "fillcast " << c.args; }

class ForecastCliBadInputTest : public ::testing::TestWithParam<BadFlagCase> {};

// Every input error, option parsing included, exits with status 2.
TEST_P(ForecastCliBadInputTest, ExitsNonZeroWithClearMessage) {
  const BadFlagCase& c = GetParam();
  const Outcome o = RunFillcast(c.args);
  EXPECT_EQ(o.exit_code, 2) << o.output;
  EXPECT_NE(o.output.find(c.message), std::string::npos) << o.output;
}

INSTANTIATE_TEST_SUITE_P(
    Flags, ForecastCliBadInputTest,
    ::testing::Values(
        BadFlagCase{"forecast " + Demo() + " --runs 0",
                    "--runs: '0' is invalid; expected a whole number from 1 to 10000000"},
        BadFlagCase{
            "forecast " + Demo() + " --runs -5",
            "--runs: '-5' is invalid; expected a whole number from 1 to 10000000"},
        BadFlagCase{"forecast " + Demo() + " --threads -1",
                    "--threads: '-1' is invalid; expected 0 (all cores)"},
        BadFlagCase{
            "forecast " + Demo() + " --runs many",
            "--runs: 'many' is invalid; expected a whole number from 1 to 10000000"},
        BadFlagCase{
            "forecast " + Demo() + " --runs 1e3",
            "--runs: '1e3' is invalid; expected a whole number from 1 to 10000000"},
        BadFlagCase{"forecast " + Demo() + " --seed -1",
                    "--seed: '-1' is invalid; expected a whole number from 0 to "
                    "18446744073709551615"},
        // Non-finite numbers once switched --precision off silently (status 0).
        BadFlagCase{"forecast " + Demo() + " --precision nan",
                    "--precision: 'nan' is invalid; expected a width in weeks above 0"},
        BadFlagCase{"forecast " + Demo() + " --precision inf",
                    "--precision: 'inf' is invalid; expected a width in weeks above 0"},
        BadFlagCase{"forecast " + Demo() + " --relax nan",
                    "--relax: 'nan' is invalid; expected a share above 0 and below 1"},
        BadFlagCase{"forecast " + Demo() + " --max-runs 2.5",
                    "--max-runs: '2.5' is invalid; expected a whole number from --runs"},
        BadFlagCase{"start-sweep " + Demo() + " --months 0x10",
                    "--months: '0x10' is invalid; expected a whole number from 1 to 36"},
        BadFlagCase{"fit-site x.csv -o y.yaml --calm-ms -inf",
                    "--calm-ms: '-inf' is invalid; expected a speed above 0"},
        BadFlagCase{"log add " + Demo() + " x.csv --utc-offset NaN",
                    "--utc-offset: 'NaN' is invalid; expected hours from -14 to 14"},
        BadFlagCase{
            "forecast " + Demo() + " --bogus",
            "The following argument was not expected: --bogus (see fillcast --help)"},
        BadFlagCase{"forecast /nonexistent/plan.yaml", "/nonexistent/plan.yaml"},
        BadFlagCase{"forecast", "plan is required"},
        BadFlagCase{"forecast " + Demo() + " --relax 1.5",
                    "--relax: '1.5' is invalid; expected a share above 0 and below 1"},
        BadFlagCase{"forecast " + Demo() + " --precision 1 --precision-of p99",
                    "--precision-of: 'p99' is invalid; expected p50, p80 or p90"},
        BadFlagCase{
            "frobnicate",
            "'frobnicate' is not a fillcast command; expected one of: forecast"}));

TEST(ForecastCliTest, VersionAndHelp) {
  const Outcome v = RunFillcast("--version");
  EXPECT_EQ(v.exit_code, 0);
  EXPECT_NE(v.output.find("fillcast " FILLCAST_VERSION), std::string::npos) << v.output;
  const Outcome h = RunFillcast("forecast --help");
  EXPECT_EQ(h.exit_code, 0);
  for (const char* flag : {"--runs", "--seed", "--threads", "--json", "--quiet"}) {
    EXPECT_NE(h.output.find(flag), std::string::npos) << flag;
  }
}

}  // namespace

namespace {

// --precision adds runs (doubling) until the interval is narrow enough, and
// says so in the JSON; the runs it ends with are a power-of-two multiple of
// --runs.
TEST(ForecastCliTest, PrecisionAddsRunsUntilTheIntervalIsNarrow) {
  const auto dir = fillcast_test::TempDir("precision");
  const fillcast_test::Outcome o = fillcast_test::RunFillcast(
      "forecast " + fillcast_test::SourcePath("demo-site/plan.yaml") +
      " --runs 50 --precision 4 --precision-of p50 --no-explain --quiet --json " +
      (dir / "p.json").string());
  ASSERT_EQ(o.exit_code, 0) << o.output;
  const nlohmann::json j = fillcast_test::ReadJson(dir / "p.json");
  EXPECT_EQ(j["precision"]["met"], true);
  EXPECT_LE(j["precision"]["ci95_width_weeks"].get<double>(), 4.0);
  const auto& ci = j["completion_weeks"]["ci95"]["p50"];
  EXPECT_NEAR(ci[1].get<double>() - ci[0].get<double>(),
              j["precision"]["ci95_width_weeks"].get<double>(), 1e-9);
  const long runs = j["runs"].get<long>();
  EXPECT_EQ(runs % 50, 0);
  EXPECT_EQ((runs / 50) & (runs / 50 - 1), 0);  // 50 x 2^k
  std::filesystem::remove_all(dir);
}

}  // namespace
