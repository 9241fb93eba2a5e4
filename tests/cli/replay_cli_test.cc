// fillcast forecast with a plan that replays measured weather (the open Irish
// daily-wind data): the reports say which weather was used.
#include <gtest/gtest.h>

#include <fstream>

#include "cli/cli_runner.h"

namespace planner {
namespace {

using fillcast_test::ReadJson;
using fillcast_test::RunFillcast;
using fillcast_test::SourcePath;
using fillcast_test::TempDir;

TEST(ReplayCliTest, ForecastSaysItReplayedTheMeasuredSeries) {
  const std::filesystem::path dir = TempDir("replay-cli");
  const std::string series =
      SourcePath("tests/data/irish-daily-wind/daily_mean_wind_knots.csv");
  {
    std::ofstream plan(dir / "plan.yaml");
    plan << "name: Replay plan\n"
            "site_model: "
         << SourcePath("site-models/coastal-ridge.yaml")
         << "\n"
            "campaign: {start: 2027-03-01, deadline: 2027-09-01}\n"
            "turbine: {name: T1, cut_in_ms: 3, rated_ms: 11, cut_out_ms: 25}\n"
            "weather:\n"
            "  source: replay\n"
            "  series: "
         << series
         << "\n"
            "  columns: {time: date, speed: MAL}\n"
            "  units: knots\n"
            "capture_matrix:\n"
            "  production:\n"
            "    wind_bins_ms: {from: 4, to: 12, width: 2}\n"
            "    min_records: 500\n";
  }
  const auto out = RunFillcast("forecast " + (dir / "plan.yaml").string() +
                               " --runs 40 --json " + (dir / "f.json").string());
  ASSERT_EQ(out.exit_code, 0) << out.output;
  EXPECT_NE(out.output.find("Weather:   replay of measured series "
                            "'daily_mean_wind_knots.csv' (1961-01-01 to 1978-12-31"),
            std::string::npos)
      << out.output;
  EXPECT_NE(out.output.find("whole weeks drawn within 30 days"), std::string::npos)
      << out.output;
  // Daily data stand for 144 records each: the report says the spread is
  // understated.
  EXPECT_NE(out.output.find("spread is understated"), std::string::npos) << out.output;
  const nlohmann::json j = ReadJson(dir / "f.json");
  EXPECT_EQ(j["weather"]["source"], "replay");
  EXPECT_EQ(j["weather"]["step_s"], 86400);
  EXPECT_EQ(j["weather"]["block_days"], 7);
  EXPECT_EQ(j["weather"]["series"], series);
  // The series is an input: --json may not overwrite it.
  const auto refused = RunFillcast("forecast " + (dir / "plan.yaml").string() +
                                   " --runs 5 --quiet --json " + series);
  EXPECT_NE(refused.exit_code, 0);
  std::filesystem::remove_all(dir);
}

}  // namespace
}  // namespace planner
