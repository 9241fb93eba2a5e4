// The plan's weather section (docs/plan.md#weather): defaults, and one clear
// message per mistake.
#include <gtest/gtest.h>

#include <filesystem>
#include <fstream>

#include "io/reader_test_util.h"
#include "planner/plan_reader.h"
#include "planner/weather_source.h"

namespace planner {
namespace {

using reader_test::ParseTestPlan;
using reader_test::Replace;
using reader_test::SourcePath;
using reader_test::TestPlanError;

const std::string kPlan =
    reader_test::BasePlan("Test plan") +
    "weather:\n"
    "  source: replay\n"
    "  series: SERIES\n"
    "  columns: {time: date, speed: MAL}\n"
    "  units: knots\n";

std::string IrishPlan() {
  return Replace(kPlan, "SERIES",
                 SourcePath("tests/data/irish-daily-wind/daily_mean_wind_knots.csv"));
}

TEST(WeatherReaderTest, ReplayPlanCarriesTheSeriesAndSaysSo) {
  const Plan plan = ParseTestPlan(IrishPlan());
  ASSERT_NE(plan.replay, nullptr);
  EXPECT_EQ(plan.replay->options.block_days, 7);  // documented default: week
  EXPECT_EQ(plan.replay->options.season_window_days, 30);
  EXPECT_EQ(plan.replay->records_per_day, 1);
  EXPECT_EQ(PlanInputFiles(plan).size(), 3u);
  EXPECT_EQ(WeatherSourceJson(plan)["source"], "replay");
  EXPECT_NE(WeatherSourceText(plan).find("whole weeks drawn within 30 days"),
            std::string::npos)
      << WeatherSourceText(plan);
  const Plan parametric = ParseTestPlan(kPlan.substr(0, kPlan.find("weather:")));
  EXPECT_EQ(parametric.replay, nullptr);
  EXPECT_EQ(WeatherSourceJson(parametric)["source"], "site_model");
}

// One message per mistake, naming file, line, column, field, the value and
// what is valid.
TEST(WeatherReaderTest, MistakesGiveLocatedMessages) {
  const std::string irish = IrishPlan();
  const std::string weather_at = irish.substr(0, irish.find("weather:"));
  const std::vector<reader_test::BadInput> cases = {
      {"unknown source", Replace(irish, "source: replay", "source: measured"),
       "plan.yaml:10:11: weather.source: 'measured' is not a weather source; expected "
       "site_model or replay"},
      {"replay without series", weather_at + "weather: {source: replay}\n",
       "plan.yaml:9:10: weather.series: required field is missing"},
      {"site_model with replay fields",
       weather_at + "weather: {source: site_model, block: day}\n",
       "plan.yaml:9:31: weather.block: unknown field for source 'site_model'; valid "
       "fields: source"},
      {"block", Replace(irish, "units: knots", "units: knots\n  block: fortnight"),
       "plan.yaml:14:10: weather.block: 'fortnight' is not a block length; expected day "
       "or week"},
      {"units", Replace(irish, "units: knots", "units: kmh"),
       "plan.yaml:13:10: weather.units: 'kmh' is not a unit; expected auto, ms or knots"},
      {"window",
       Replace(irish, "units: knots", "units: knots\n  season_window_days: 200"),
       "plan.yaml:14:23: weather.season_window_days: 200 is out of range; must be at "
       "least 0 and at most 182 days"},
      {"speed factor", Replace(irish, "units: knots", "units: knots\n  speed_factor: 3"),
       "plan.yaml:14:17: weather.speed_factor: 3 is out of range; must be at least 0.5 "
       "and at most 2"},
      {"no direction, restricted sectors",
       Replace(irish,
               "capture_matrix:", "valid_sectors_deg: [[200, 300]]\ncapture_matrix:"),
       "plan.yaml:12:11: weather.series: '" +
           SourcePath("tests/data/irish-daily-wind/daily_mean_wind_knots.csv") +
           "' has no direction column, but the plan's valid measurement sectors do not "
           "cover the full circle; name the direction column with "
           "weather.columns.direction"},
  };
  reader_test::ExpectMessages(cases, TestPlanError);
}

// A missing file and a column the CSV does not have are reported at the plan
// and at the CSV's header respectively, with the plan's field names.
TEST(WeatherReaderTest, SeriesFileAndColumnsAreChecked) {
  const std::string file =
      SourcePath("tests/data/irish-daily-wind/daily_mean_wind_knots.csv");
  EXPECT_EQ(TestPlanError(Replace(IrishPlan(), file, "nowhere.csv")),
            "plan.yaml:11:11: weather.series: 'nowhere.csv' is not a file (looked for '" +
                SourcePath("site-models/nowhere.csv") +
                "'); give a path relative to the plan's folder");
  EXPECT_EQ(TestPlanError(Replace(IrishPlan(), "speed: MAL", "speed: XYZ")),
            file +
                ":1: weather.columns.speed: 'XYZ' is not a column of the header; "
                "columns: date, RPT, VAL, ROS, KIL, SHA, BIR, DUB, CLA, MUL, CLO, BEL, "
                "MAL");
}

// Two months of data cannot supply every season: the message says which days
// of the year have no block, what the series covers and what to change.
TEST(WeatherReaderTest, ShortSeriesNamesTheUncoveredSeason) {
  const std::filesystem::path dir =
      std::filesystem::temp_directory_path() / "fillcast-weather-reader-test";
  std::filesystem::create_directories(dir);
  {
    std::ofstream out(dir / "short.csv");
    out << "date,speed_ms,direction\n";
    for (int i = 0; i < 61; ++i) {  // 1 March to 30 April 2020
      const int month = i < 31 ? 3 : 4, day = i < 31 ? i + 1 : i - 30;
      out << "2020-0" << month << "-" << (day < 10 ? "0" : "") << day << "," << 5 + i % 7
          << "," << (i * 37) % 360 << "\n";
    }
  }
  const std::string text = Replace(
      IrishPlan(), SourcePath("tests/data/irish-daily-wind/daily_mean_wind_knots.csv"),
      (dir / "short.csv").string());
  const std::string message =
      TestPlanError(Replace(Replace(text, "  columns: {time: date, speed: MAL}\n", ""),
                            "units: knots", "units: ms"));
  // Blocks of 7 days start from 1 March to 24 April (55 days); within 30 days
  // of them lie 30 January to 24 May: 115 days of the year, 250 without.
  EXPECT_EQ(message,
            "plan.yaml:11:11: weather.series: no usable 7-day block of '" +
                (dir / "short.csv").string() +
                "' starts within 30 days of 1 Jan, 2 Jan, 3 Jan, ... (250 days of the "
                "year); the series runs from 2020-03-01 to 2020-04-30 with 55 usable "
                "blocks (at least 90 % of their records present). Widen "
                "season_window_days (at most 182), use block: day, or give a longer "
                "series");
  std::filesystem::remove_all(dir);
}

}  // namespace
}  // namespace planner
