// End-to-end: compare and start-sweep on the real binary.
#include <gtest/gtest.h>

#include "cli/cli_runner.h"

namespace {

using fillcast_test::Outcome;
using fillcast_test::ReadJson;
using fillcast_test::RunFillcast;
using fillcast_test::SourcePath;

// A plan compared with itself must come out identical: same streams, same
// answer, and a paired difference of exactly zero (common random numbers).
TEST(DecisionCliTest, PlanComparedWithItselfHasZeroPairedDifference) {
  const auto dir = fillcast_test::TempDir("compare");
  const std::string demo = SourcePath("demo-site/plan.yaml");
  const Outcome o =
      RunFillcast("compare " + demo + " " + demo + " --runs 150 --quiet --json " +
                  (dir / "c.json").string());
  ASSERT_EQ(o.exit_code, 0) << o.output;
  const nlohmann::json j = ReadJson(dir / "c.json");
  ASSERT_EQ(j["scenarios"].size(), 2u);
  EXPECT_EQ(j["scenarios"][0]["p80"], j["scenarios"][1]["p80"]);
  EXPECT_EQ(j["paired_difference"]["mean_weeks_b_minus_a"], 0.0);
  EXPECT_EQ(j["paired_difference"]["p_a_sooner"], 0.0);
  EXPECT_EQ(j["tool"]["name"], "fillcast");
  std::filesystem::remove_all(dir);
}

TEST(DecisionCliTest, CompareNeedsTwoPlansAndAKnownRanking) {
  const std::string demo = SourcePath("demo-site/plan.yaml");
  Outcome o = RunFillcast("compare " + demo);
  EXPECT_EQ(o.exit_code, 2);
  EXPECT_NE(o.output.find("compare: 1 plan given; expected two or more plans to compare"),
            std::string::npos)
      << o.output;
  o = RunFillcast("compare " + demo + " " + demo + " --rank-by fastest");
  EXPECT_EQ(o.exit_code, 2);
  EXPECT_NE(
      o.output.find("--rank-by: 'fastest' is invalid; expected p50, p80, p90 or cost"),
      std::string::npos)
      << o.output;
}

// The sweep's row for the plan's own start month equals a forecast of the
// plan itself with the same runs and seed (when the plan starts on the 1st).
TEST(DecisionCliTest, StartSweepRowOfTheOwnStartMatchesTheForecast) {
  const auto dir = fillcast_test::TempDir("sweep");
  const std::string demo = SourcePath("demo-site/plan.yaml");
  ASSERT_EQ(RunFillcast("start-sweep " + demo +
                        " --months 2 --runs 120 --seed 5 --quiet --json " +
                        (dir / "s.json").string())
                .exit_code,
            0);
  ASSERT_EQ(RunFillcast("forecast " + demo + " --runs 120 --seed 5 --quiet --json " +
                        (dir / "f.json").string())
                .exit_code,
            0);
  const nlohmann::json s = ReadJson(dir / "s.json");
  const nlohmann::json f = ReadJson(dir / "f.json");
  ASSERT_EQ(s["starts"].size(), 2u);
  EXPECT_EQ(s["starts"][0]["start"], f["plan"]["start"]);
  EXPECT_EQ(s["starts"][0]["p80"]["weeks"], f["completion_weeks"]["p80"]);
  EXPECT_EQ(s["starts"][0]["p_complete_by_deadline"], f["p_complete_by_deadline"]);
  EXPECT_NE(s["starts"][1]["start"], s["starts"][0]["start"]);
  std::filesystem::remove_all(dir);
}

}  // namespace
