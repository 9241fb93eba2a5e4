// Replay of measured weather (planner/replay.h) on the open Irish daily-wind
// data (tests/data/irish-daily-wind, source in its README): the tables, and
// the weather a replayed campaign sees, checked against the data themselves
// as read by the test's own code (tests/model/irish_wind_data.h).
#include "planner/replay.h"

#include <gtest/gtest.h>

#include <cmath>
#include <numeric>
#include <string>
#include <vector>

#include "io/met_csv_reader.h"
#include "model/irish_wind_data.h"
#include "planner/monte_carlo.h"
#include "planner/plan_reader.h"
#include "planner/simulation.h"

namespace planner {
namespace {

MetSeries Station(const std::string& code) {
  MetCsvOptions csv;
  csv.time_column = "date";
  csv.speed_column = code;
  csv.units = SpeedUnit::kKnots;
  return LoadMetCsv(irish_wind::SpeedsFile(), csv);
}

// The data cover 1961-01-01 to 1978-12-31 (README): 18 New Year's Days, and
// 18 days of 28 February plus the 29 Februaries of 1964, 1968, 1972 and 1976
// (leap years by the Gregorian rule).
TEST(ReplayTest, TablesAndSeasonalPoolsFollowTheCalendar) {
  ReplayOptions options;
  options.block_days = 1;
  options.season_window_days = 0;
  const WeatherReplay r = BuildWeatherReplay(Station("MAL"), options);
  EXPECT_EQ(r.records_per_day, 1);
  EXPECT_EQ(r.days, 6574);
  EXPECT_FALSE(r.has_direction);
  EXPECT_EQ(r.usable_blocks, 6574);
  EXPECT_EQ(r.pool[0].size(), 18u);    // 1 January
  EXPECT_EQ(r.pool[58].size(), 22u);   // 28 February (and the 29ths)
  EXPECT_EQ(r.pool[364].size(), 18u);  // 31 December
  EXPECT_TRUE(r.EmptyPoolDays().empty());
  // Speeds are the data's, in m/s (1 kn = 1852/3600 m/s).
  const std::vector<double> mal = irish_wind::SpeedsMs("MAL");
  for (size_t i : {size_t{0}, size_t{1000}, size_t{6573}})
    EXPECT_NEAR(r.speed_ms[i], mal[i], 1e-5 * mal[i] + 1e-6) << i;

  // Week blocks need seven days inside the data: the last six days start none.
  options.block_days = 7;
  options.season_window_days = 3;
  const WeatherReplay w = BuildWeatherReplay(Station("MAL"), options);
  EXPECT_EQ(w.usable_blocks, 6574 - 6);
  // Within +-3 days of 1 January (29 December to 4 January): 7 days in each
  // of the 18 years' calendars, less 29-31 December 1978, whose blocks would
  // run past the end of the data.
  EXPECT_EQ(w.pool[0].size(), 18u * 7 - 3);
}

// A plan over the Irish data, all directions valid, with a cell that cannot
// fill so that every run simulates the whole horizon.
Plan ReplayPlan(const std::string& start, const std::string& deadline, int horizon_weeks,
                const std::string& block, int window) {
  const std::string text =
      "name: Replay test\n"
      "site_model: coastal-ridge.yaml\n"
      "campaign: {start: " +
      start + ", deadline: " + deadline +
      ", horizon_weeks: " + std::to_string(horizon_weeks) +
      "}\n"
      "turbine: {name: T1, cut_in_ms: 3, rated_ms: 11, cut_out_ms: 25}\n"
      "weather:\n"
      "  source: replay\n"
      "  series: " +
      irish_wind::SpeedsFile() +
      "\n"
      "  columns: {time: date, speed: MAL}\n"
      "  units: knots\n"
      "  block: " +
      block +
      "\n"
      "  season_window_days: " +
      std::to_string(window) +
      "\n"
      "capture_matrix:\n"
      "  production:\n"
      "    wind_bins_ms: {from: 4, to: 5, width: 1}\n"
      "    min_records: 1000000\n";
  return ParsePlan(text, "plan.yaml", std::string(FILLCAST_SOURCE_DIR) + "/site-models");
}

// Mean replayed speed per run, and its mean and standard error over runs.
struct MeanOverRuns {
  double mean = 0, se = 0;
};
MeanOverRuns ReplayedMean(const Plan& plan, int runs) {
  const Simulator sim(plan);
  MonteCarloOptions mc;
  mc.runs = runs;
  mc.seed = 1961;
  mc.threads = 2;
  const std::vector<RunResult> results = RunMonteCarlo(sim, mc, nullptr);
  std::vector<double> means;
  for (const RunResult& r : results) {
    EXPECT_EQ(r.simulated_steps, sim.horizon_steps());
    means.push_back(r.speed_sum_ms / r.simulated_steps);
  }
  const double m = std::accumulate(means.begin(), means.end(), 0.0) / runs;
  double ss = 0;
  for (double x : means) ss += (x - m) * (x - m);
  return {m, std::sqrt(ss / (runs - 1) / runs)};
}

// With day blocks and a window of half a year every measured day is equally
// likely for every simulated day, so the replayed mean speed estimates the
// data's mean (4 Monte-Carlo standard errors).
TEST(ReplayTest, WholeYearWindowReplaysTheDataMean) {
  const std::vector<double> mal = irish_wind::SpeedsMs("MAL");
  const double data_mean = std::accumulate(mal.begin(), mal.end(), 0.0) / mal.size();
  const MeanOverRuns m =
      ReplayedMean(ReplayPlan("2027-01-01", "2027-12-31", 52, "day", 182), 200);
  EXPECT_GT(m.se, 0.0);
  EXPECT_NEAR(m.mean, data_mean, 4 * m.se);
}

// Day of a 365-day year from month and day (the test's own table).
int YearDay(int month, int day) {
  static const int start[] = {0, 31, 59, 90, 120, 151, 181, 212, 243, 273, 304, 334};
  return start[month - 1] + std::min(day, month == 2 ? 28 : 31) - 1;
}

// The season survives: over 5 weeks from 1 January (or 1 July), with day
// blocks within 15 days of the date, the replayed mean is the mean of the
// measured days within 15 days of each simulated date, computed here from the
// data. The two seasons differ by far more than the tolerance.
TEST(ReplayTest, SeasonalWindowKeepsTheSeason) {
  const std::vector<double> mal = irish_wind::SpeedsMs("MAL");
  const std::vector<irish_wind::MonthDay> dates = irish_wind::Dates();
  ASSERT_EQ(mal.size(), dates.size());
  auto expected = [&](int month0) {
    double sum = 0;
    for (int d = 0; d < 35; ++d) {
      const int target = (YearDay(month0, 1) + d) % 365;
      double pool_sum = 0;
      int n = 0;
      for (size_t i = 0; i < mal.size(); ++i) {
        const int diff = std::abs(YearDay(dates[i].month, dates[i].day) - target);
        if (std::min(diff, 365 - diff) <= 15) pool_sum += mal[i], ++n;
      }
      sum += pool_sum / n;
    }
    return sum / 35;
  };
  const double january = expected(1), july = expected(7);
  const MeanOverRuns jan =
      ReplayedMean(ReplayPlan("2027-01-01", "2027-02-05", 5, "day", 15), 400);
  const MeanOverRuns jul =
      ReplayedMean(ReplayPlan("2027-07-01", "2027-08-05", 5, "day", 15), 400);
  EXPECT_NEAR(jan.mean, january, 4 * jan.se);
  EXPECT_NEAR(jul.mean, july, 4 * jul.se);
  EXPECT_GT(january - july, 10 * (jan.se + jul.se));
}

// Week blocks keep the measured order inside a block: consecutive replayed
// days are consecutive measured days, so the day-to-day correlation of the
// data survives within the week.
TEST(ReplayTest, WeekBlocksReplayConsecutiveDays) {
  const Plan plan = ReplayPlan("2027-01-04", "2027-02-01", 4, "week", 30);
  const Simulator sim(plan);
  RunResult out;
  std::vector<TracedRecord> records;
  sim.Trace(5, 3, &out, &records);
  ASSERT_EQ(records.size(), 28u * 144);
  const std::vector<double> mal = irish_wind::SpeedsMs("MAL");
  // Each simulated week is 7 measured days in order: find the first day's
  // value in the data and check the next six follow it.
  for (int week = 0; week < 4; ++week) {
    std::vector<double> days;
    for (int d = 0; d < 7; ++d) days.push_back(records[(week * 7 + d) * 144].speed_ms);
    bool found = false;
    for (size_t i = 0; i + 7 <= mal.size() && !found; ++i) {
      bool all = true;
      for (int d = 0; d < 7 && all; ++d)
        all = std::abs(mal[i + d] - days[d]) < 1e-5 * mal[i + d] + 1e-6;
      found = all;
    }
    EXPECT_TRUE(found) << "week " << week;
    // Constant within each day (daily data): every record of a day is the same.
    EXPECT_EQ(records[week * 7 * 144].speed_ms, records[week * 7 * 144 + 143].speed_ms);
  }
}

}  // namespace
}  // namespace planner
