// Forecasting the rest of a running campaign from its log: a full matrix
// needs nothing more, a log written from a simulated campaign gives back the
// simulator's counts, and what extending buys matches the binomial law.
#include "planner/progress_forecast.h"

#include <gtest/gtest.h>
#include <unistd.h>

#include <boost/math/distributions/binomial.hpp>
#include <cmath>
#include <filesystem>
#include <sstream>

#include "io/records_csv_reader.h"
#include "io/traced_log.h"
#include "planner/campaign_log.h"
#include "planner/plan_reader.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

namespace fs = std::filesystem;

MonteCarloOptions Options(int runs, int threads = 0) {
  MonteCarloOptions mc;
  mc.runs = runs;
  mc.seed = 2024;
  mc.threads = threads;
  return mc;
}

TEST(ProgressForecastTest, FullMatrixForecastsZeroRemainingWeeks) {
  const Plan plan = testing_plans::SingleCellPlan(8.0, 2.0, 6.0, 9.0, 40, 60, 20);
  std::vector<LoggedRecord> records;
  for (int i = 0; i < 50; ++i) {  // 50 valid records in the cell on the first day
    LoggedRecord r;
    r.time_s = DateTime(plan.start) + i * kRecordSeconds;
    r.speed_ms = 7.0;
    r.speed_std_ms = 0.7;
    r.direction_deg = 200;
    r.state = LoggedState::kProduction;
    records.push_back(r);
  }
  const Date as_of = AddDays(plan.start, 10);
  const LoggedCounts logged = CountLoggedRecords(plan, records, as_of);
  ASSERT_EQ(logged.counts[0], 50u);
  const ProgressSummary s = ForecastProgress(plan, logged, as_of, Options(50), nullptr);
  EXPECT_TRUE(s.already_complete);
  ASSERT_TRUE(s.remaining_p50 && s.remaining_p80 && s.remaining_p90);
  EXPECT_EQ(*s.remaining_p50, 0.0);
  EXPECT_EQ(*s.remaining_p80, 0.0);
  EXPECT_EQ(*s.remaining_p90, 0.0);
  EXPECT_EQ(s.p_by_planned_end, 1.0);
  // The 40th record ends at 06:40 of the first day.
  EXPECT_EQ(*logged.complete_time_s, DateTime(plan.start) + 40 * kRecordSeconds);
  for (const ExtensionRow& e : s.extensions) {
    EXPECT_EQ(e.p_complete, 1.0);
    EXPECT_TRUE(e.uncertain.empty());
  }
}

// Writes the trace as a real log would hold it (records with the acquisition
// down absent), reads it back through the CSV reader and the SQLite log, and
// places it in the matrix: every count equals the simulated run's.
void ExpectRoundTrip(const Plan& plan, uint64_t seed, uint64_t run) {
  const Simulator sim(plan);
  RunResult result;
  std::vector<TracedRecord> trace;
  sim.Trace(seed, run, &result, &trace);
  const std::string csv = fillcast_test::TracedLogCsv(plan, trace, {});
  std::istringstream in(csv);
  const RecordsFile file = ReadRecordsCsv(in, "traced.csv", {});
  const fs::path dir = fs::temp_directory_path() /
                       ("fillcast-roundtrip-" + std::to_string(::getpid()) + "-" +
                        std::to_string(seed) + "-" + std::to_string(run));
  fs::remove_all(dir);
  fs::create_directories(dir);
  std::vector<LoggedRecord> records;
  {
    CampaignLog log((dir / "log.sqlite").string(), true);
    const IngestReport r = log.Ingest("traced.csv", file.rows, {});
    EXPECT_EQ(r.conflicting, 0);
    records = log.Records();
  }
  fs::remove_all(dir);
  int64_t daq_up = 0;
  for (const TracedRecord& t : trace) daq_up += t.daq_up;
  EXPECT_EQ(static_cast<int64_t>(records.size()), daq_up);
  EXPECT_LT(daq_up, result.simulated_steps);  // some records are missing, as in life
  const int64_t days = (result.simulated_steps + kStepsPerDay - 1) / kStepsPerDay;
  const LoggedCounts c = CountLoggedRecords(plan, records, AddDays(plan.start, days));
  EXPECT_EQ(c.missing_values, 0);
  EXPECT_EQ(c.counts, result.count_at_end);
  EXPECT_GT(c.counted_events, 0);
}

Plan ShortDemoPlan() {
  Plan plan = LoadPlan(std::string(FILLCAST_SOURCE_DIR) + "/demo-site/plan.yaml");
  plan.horizon_weeks = 16;
  plan.deadline = AddDays(plan.start, 7 * 16);
  return plan;
}

TEST(ProgressForecastTest, LogOfASimulatedCampaignReproducesItsCounts) {
  ExpectRoundTrip(ShortDemoPlan(), 11, 2);
  ExpectRoundTrip(ShortDemoPlan(), 5, 0);
}

TEST(ProgressForecastTest, RoundTripHoldsWhenParkedCountsDuringOutages) {
  Plan plan = ShortDemoPlan();
  plan.parked_counts_during_outage = true;
  ExpectRoundTrip(plan, 11, 3);
}

// One cell of probability p per record, independent records (tau = 0), c
// records logged of n: the campaign is complete by the end of the m-th record
// after the as-of date when at least n - c of those m records fall in the
// cell, a binomial(m, p) count (reference: Boost.Math binomial_distribution).
// p from the Weibull CDF F(v) = 1 - exp(-(v/A)^k) (any wind-energy handbook).
TEST(ProgressForecastTest, ExtensionSharesFollowTheBinomialLaw) {
  const double a = 8.0, k = 2.0, lo = 6.0, hi = 9.0;
  const Plan plan = testing_plans::SingleCellPlan(a, k, lo, hi, 1500, 2, 7);
  const double p = std::exp(-std::pow(lo / a, k)) - std::exp(-std::pow(hi / a, k));
  LoggedCounts logged;
  logged.counts = {300};
  const Date as_of = AddDays(plan.start, 1);
  const int runs = 2000;
  const ProgressSummary s = ForecastProgress(plan, logged, as_of, Options(runs), nullptr);
  const boost::math::binomial_distribution<double> at_4_weeks(
      kStepsPerDay + 4 * kStepsPerWeek, p);
  const double need = 1500 - 300;
  const double expected_deadline = 0.0;  // 144 records to the deadline, 1,200 needed
  const double expected_4 = boost::math::cdf(complement(at_4_weeks, need - 1));
  ASSERT_GT(expected_4, 0.2);  // a share in the middle, where the check is sharp
  ASSERT_LT(expected_4, 0.8);
  auto tolerance = [runs](double q) {  // 4 Monte-Carlo standard errors
    return 4.0 * std::sqrt(std::max(q * (1 - q), 1e-4) / runs);
  };
  EXPECT_NEAR(s.p_by_planned_end, expected_deadline, tolerance(expected_deadline));
  ASSERT_EQ(s.extensions.size(), 4u);
  EXPECT_EQ(s.extensions[0].weeks, 4);
  EXPECT_EQ(s.extensions[0].end, AddDays(plan.deadline, 28));
  EXPECT_NEAR(s.extensions[0].p_complete, expected_4, tolerance(expected_4));
  EXPECT_FALSE(s.extensions[0].beyond_horizon);
  EXPECT_TRUE(s.extensions[3].beyond_horizon);  // +26 weeks is past the 7-week horizon
  // The cell is the campaign: thin exactly when the campaign is unlikely.
  EXPECT_EQ(s.extensions[0].thin.empty(), s.extensions[0].p_complete >= kThinBelow);
  EXPECT_NEAR(s.as_of_weeks, 1.0 / 7.0, 1e-12);
}

TEST(ProgressForecastTest, SameSeedSameAnswerForAnyThreadCount) {
  const Plan plan = testing_plans::SingleCellPlan(8.0, 2.0, 6.0, 9.0, 400, 7, 6);
  LoggedCounts logged;
  logged.counts = {100};
  logged.has_last_wind = true;
  logged.last_speed_ms = 12.0;
  logged.last_direction_deg = 90.0;
  const Date as_of = AddDays(plan.start, 2);
  const ProgressSummary one =
      ForecastProgress(plan, logged, as_of, Options(64, 1), nullptr);
  const ProgressSummary two =
      ForecastProgress(plan, logged, as_of, Options(64, 2), nullptr);
  ASSERT_EQ(one.forecast.completion_counts.size(), two.forecast.completion_counts.size());
  for (size_t i = 0; i < one.forecast.completion_counts.size(); ++i) {
    EXPECT_EQ(one.forecast.completion_counts[i].weeks,
              two.forecast.completion_counts[i].weeks);
    EXPECT_EQ(one.forecast.completion_counts[i].runs,
              two.forecast.completion_counts[i].runs);
  }
  EXPECT_EQ(one.extensions[1].p_complete, two.extensions[1].p_complete);
}

}  // namespace
}  // namespace planner
