// Aggregation of runs into the forecast. These are exact counting properties,
// so the runs are written by hand with numbers whose shares, means and order
// statistics can be checked on paper; the order statistic is X_(ceil(n p))
// (Hyndman & Fan 1996, definition 1; from memory) and the binomial ranks of
// its interval are worked out by hand where they are used.
#include "planner/forecast.h"

#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <vector>

namespace planner {
namespace {

constexpr int64_t kWeek = 1008;  // 10-minute records per week (common practice)
constexpr int64_t kDeadline = 10 * kWeek;
constexpr int64_t kHorizon = 30 * kWeek;

CaptureMatrix ThreeCellMatrix() {
  CaptureMatrix m;
  Cell low;  // 0: production 4-5 m/s, any TI, 10 records
  low.state = OperatingState::kProduction;
  low.wind_ms = {4, 5};
  low.required = 10;
  Cell mid;  // 1: production 12-13 m/s, TI 12-16 %, 5 records
  mid.state = OperatingState::kProduction;
  mid.wind_ms = {12, 13};
  mid.ti_binned = true;
  mid.ti_pct = {12, 16};
  mid.required = 5;
  Cell storm;  // 2: parked 25-26 m/s, 3 records, optional
  storm.state = OperatingState::kParked;
  storm.wind_ms = {25, 26};
  storm.required = 3;
  storm.optional = true;
  m.cells = {low, mid, storm};
  return m;
}

// Ten consistent runs. Runs 0-5 complete in weeks 5-10 (run 5 exactly at the
// deadline), runs 6 and 7 in weeks 11 and 12, runs 8 and 9 never.
std::vector<RunResult> TenRuns() {
  const int64_t completion[10] = {5 * kWeek, 6 * kWeek,  7 * kWeek,  8 * kWeek,
                                  9 * kWeek, 10 * kWeek, 11 * kWeek, 12 * kWeek,
                                  -1,        -1};
  const int last[10] = {1, 1, 0, 1, 1, 0, 0, 1, -1, -1};
  const uint32_t count[3][10] = {{12, 15, 10, 20, 11, 13, 9, 14, 4, 0},
                                 {5, 6, 7, 5, 9, 5, 8, 3, 2, 1},
                                 {0, 0, 0, 0, 0, 0, 0, 0, 1, 3}};
  const int64_t full[3][10] = {
      {4000, 3000, 7056, 2016, 9000, 10080, 11088, 8000, 25000, -1},
      {5040, 6048, 5000, 8064, 9072, 6000, 9500, 12096, -1, -1},
      {-1, -1, -1, -1, -1, -1, -1, -1, -1, 9999}};
  std::vector<RunResult> runs(10);
  for (int i = 0; i < 10; ++i) {
    RunResult& r = runs[static_cast<size_t>(i)];
    r.completion_step = completion[i];
    r.last_cell = last[i];
    for (int c = 0; c < 3; ++c) {
      r.count_at_deadline.push_back(count[c][i]);
      r.count_at_end.push_back(count[c][i]);
      r.full_step.push_back(full[c][i]);
    }
    // A run stops at the later of completion and deadline, or at the horizon.
    r.simulated_steps =
        r.completion_step < 0 ? kHorizon : std::max(r.completion_step, kDeadline);
    r.turbine_up_steps = i < 8 ? r.simulated_steps : 0;
    r.daq_up_steps = r.simulated_steps - kWeek;
    r.valid_sector_steps = r.simulated_steps * 3 / 4;
  }
  return runs;
}

TEST(ForecastTest, CompletionSharesAndQuantilesWithCensoredRuns) {
  const ForecastSummary s =
      SummarizeForecast(ThreeCellMatrix(), kDeadline, kHorizon, TenRuns(), 77);
  EXPECT_EQ(s.runs, 10);
  EXPECT_EQ(s.seed, 77u);
  EXPECT_DOUBLE_EQ(s.deadline_weeks, 10.0);
  EXPECT_DOUBLE_EQ(s.horizon_weeks, 30.0);

  EXPECT_DOUBLE_EQ(s.p_complete_by_deadline, 0.6);  // weeks 5..10, deadline included
  EXPECT_DOUBLE_EQ(s.p_incomplete_at_horizon, 0.2);
  EXPECT_FALSE(s.mean_weeks.has_value());  // two runs never finished
  EXPECT_FALSE(s.mean_se_weeks.has_value());

  // Sorted weeks: 5 6 7 8 9 10 11 12 inf inf.
  EXPECT_DOUBLE_EQ(s.p10.p, 0.1);
  EXPECT_DOUBLE_EQ(s.p50.p, 0.5);
  EXPECT_DOUBLE_EQ(s.p80.p, 0.8);
  EXPECT_DOUBLE_EQ(s.p90.p, 0.9);
  EXPECT_EQ(s.p10.value, 5.0);            // X_(1)
  EXPECT_EQ(s.p50.value, 9.0);            // X_(5)
  EXPECT_EQ(s.p80.value, 12.0);           // X_(8)
  EXPECT_FALSE(s.p90.value.has_value());  // X_(9) = inf

  // Bin(10, 1/2): F(1) = 11/1024 <= 0.025 < F(2) = 56/1024, so l = 2;
  // F(7) = 968/1024 < 0.975 <= F(8) = 1013/1024, so u = 9 (X_(9) = inf).
  EXPECT_EQ(s.p50.ci_lo, 6.0);
  EXPECT_FALSE(s.p50.ci_hi.has_value());
  // Bin(10, 0.1): F(0) = 0.9^10 = 0.349 > 0.025, so no lower bound;
  // F(2) = 0.930 < 0.975 <= F(3) = 0.987, so u = 4 (X_(4) = 8 weeks).
  EXPECT_FALSE(s.p10.ci_lo.has_value());
  EXPECT_EQ(s.p10.ci_hi, 8.0);
}

TEST(ForecastTest, CellCountsFullSharesAndWeeksToFull) {
  const ForecastSummary s =
      SummarizeForecast(ThreeCellMatrix(), kDeadline, kHorizon, TenRuns(), 1);
  ASSERT_EQ(s.cells.size(), 3u);
  for (int i = 0; i < 3; ++i) EXPECT_EQ(s.cells[static_cast<size_t>(i)].index, i);

  const CellForecast& low = s.cells[0];
  EXPECT_EQ(low.cell.required, 10);
  // Counts sorted: 0 4 9 10 11 12 13 14 15 20; sum 108.
  EXPECT_DOUBLE_EQ(low.count_mean, 10.8);
  EXPECT_DOUBLE_EQ(low.count_p10, 0);
  EXPECT_DOUBLE_EQ(low.count_p50, 11);
  EXPECT_DOUBLE_EQ(low.count_p90, 15);
  // Full by the deadline in runs 0-5 and 7 (run 5 exactly at it; run 6 one
  // week late).
  EXPECT_DOUBLE_EQ(low.p_full_by_deadline, 0.7);
  // Full steps sorted: 2016 3000 4000 7056 8000 9000 10080 11088 25000 inf.
  ASSERT_TRUE(low.weeks_to_full_p50 && low.weeks_to_full_p90);
  EXPECT_DOUBLE_EQ(*low.weeks_to_full_p50, 8000.0 / 1008.0);
  EXPECT_DOUBLE_EQ(*low.weeks_to_full_p90, 25000.0 / 1008.0);
  EXPECT_DOUBLE_EQ(low.p_last_to_fill, 0.3);

  const CellForecast& mid = s.cells[1];
  // Counts sorted: 1 2 3 5 5 5 6 7 8 9; sum 51.
  EXPECT_DOUBLE_EQ(mid.count_mean, 5.1);
  EXPECT_DOUBLE_EQ(mid.count_p10, 1);
  EXPECT_DOUBLE_EQ(mid.count_p50, 5);
  EXPECT_DOUBLE_EQ(mid.count_p90, 8);
  EXPECT_DOUBLE_EQ(mid.p_full_by_deadline, 0.7);
  // Full steps sorted: 5000 5040 6000 6048 8064 9072 9500 12096 inf inf.
  EXPECT_EQ(mid.weeks_to_full_p50, 8.0);
  EXPECT_FALSE(mid.weeks_to_full_p90.has_value());
  EXPECT_DOUBLE_EQ(mid.p_last_to_fill, 0.5);

  const CellForecast& storm = s.cells[2];
  EXPECT_TRUE(storm.cell.optional);
  EXPECT_DOUBLE_EQ(storm.count_mean, 0.4);
  EXPECT_DOUBLE_EQ(storm.count_p50, 0);
  EXPECT_DOUBLE_EQ(storm.count_p90, 1);
  EXPECT_DOUBLE_EQ(storm.p_full_by_deadline, 0.1);
  EXPECT_FALSE(storm.weeks_to_full_p50.has_value());  // full in one run of ten
  EXPECT_FALSE(storm.weeks_to_full_p90.has_value());
  EXPECT_DOUBLE_EQ(storm.p_last_to_fill, 0.0);

  EXPECT_EQ(s.bottleneck_cell, 1);  // last in 5 of 10 runs
}

TEST(ForecastTest, AvailabilityIsShareOfAllSimulatedTime) {
  const ForecastSummary s =
      SummarizeForecast(ThreeCellMatrix(), kDeadline, kHorizon, TenRuns(), 1);
  // Simulated: six runs of 10 weeks, one of 11, one of 12, two of 30 = 143
  // weeks. The turbine was up in the first eight runs only (83 weeks): a
  // ratio of sums, not the mean of per-run ratios (which would be 0.8).
  EXPECT_DOUBLE_EQ(s.turbine_availability, 83.0 / 143.0);
  EXPECT_DOUBLE_EQ(s.daq_availability, (143.0 - 10.0) / 143.0);
  EXPECT_DOUBLE_EQ(s.valid_sector_share, 0.75);
}

TEST(ForecastTest, MeanAndStandardErrorWhenEveryRunCompletes) {
  std::vector<RunResult> runs(10);
  for (int i = 0; i < 10; ++i) {
    runs[static_cast<size_t>(i)].completion_step = (i + 1) * kWeek;  // weeks 1..10
    runs[static_cast<size_t>(i)].last_cell = 0;
  }
  CaptureMatrix m;
  m.cells.resize(1);
  m.cells[0].required = 1;
  const ForecastSummary s = SummarizeForecast(m, kDeadline, kHorizon, runs, 1);
  // Mean 5.5; sample variance sum (k - 5.5)^2 / 9 = 82.5 / 9; se = s / sqrt(n)
  // (textbook standard error of a mean).
  ASSERT_TRUE(s.mean_weeks && s.mean_se_weeks);
  EXPECT_DOUBLE_EQ(*s.mean_weeks, 5.5);
  EXPECT_NEAR(*s.mean_se_weeks, std::sqrt(82.5 / 9.0 / 10.0), 1e-12);
  EXPECT_DOUBLE_EQ(s.p_complete_by_deadline, 1.0);
  EXPECT_DOUBLE_EQ(s.p_incomplete_at_horizon, 0.0);
  EXPECT_EQ(s.p90.value, 9.0);
  // Runs without per-cell vectors count as empty cells, never full.
  EXPECT_DOUBLE_EQ(s.cells[0].count_mean, 0.0);
  EXPECT_DOUBLE_EQ(s.cells[0].p_full_by_deadline, 0.0);
  EXPECT_DOUBLE_EQ(s.cells[0].p_last_to_fill, 1.0);
  EXPECT_EQ(s.bottleneck_cell, 0);
}

TEST(ForecastTest, NoCompletedRunMeansNoBottleneck) {
  std::vector<RunResult> runs = TenRuns();
  for (RunResult& r : runs) {
    r.completion_step = -1;
    r.last_cell = -1;
  }
  const ForecastSummary s =
      SummarizeForecast(ThreeCellMatrix(), kDeadline, kHorizon, runs, 1);
  EXPECT_EQ(s.bottleneck_cell, -1);
  EXPECT_DOUBLE_EQ(s.p_incomplete_at_horizon, 1.0);
  EXPECT_DOUBLE_EQ(s.p_complete_by_deadline, 0.0);
  EXPECT_FALSE(s.p10.value || s.p50.value || s.p80.value || s.p90.value);
  EXPECT_FALSE(s.p10.ci_hi.has_value());
  for (const CellForecast& c : s.cells) EXPECT_DOUBLE_EQ(c.p_last_to_fill, 0.0);
}

TEST(ForecastTest, NoRunsGiveAnEmptySummary) {
  const ForecastSummary s =
      SummarizeForecast(ThreeCellMatrix(), kDeadline, kHorizon, {}, 3);
  EXPECT_EQ(s.runs, 0);
  EXPECT_EQ(s.bottleneck_cell, -1);
  EXPECT_FALSE(s.p50.value.has_value());
  EXPECT_FALSE(s.mean_weeks.has_value());
  ASSERT_EQ(s.cells.size(), 3u);
  EXPECT_DOUBLE_EQ(s.cells[0].count_mean, 0.0);
  EXPECT_DOUBLE_EQ(s.turbine_availability, 0.0);
}

TEST(ForecastTest, ThinnestCellsOrderTiesAndOptionalCells) {
  const ForecastSummary s =
      SummarizeForecast(ThreeCellMatrix(), kDeadline, kHorizon, TenRuns(), 1);
  // Cells 0 and 1 are both full by the deadline in 70 % of runs; cell 1 has the
  // lower expected share of its minimum (5.1 / 5 = 1.02 < 10.8 / 10 = 1.08).
  std::vector<const CellForecast*> thin = ThinnestCells(s, 10, false);
  ASSERT_EQ(thin.size(), 2u);
  EXPECT_EQ(thin[0]->index, 1);
  EXPECT_EQ(thin[1]->index, 0);

  thin = ThinnestCells(s, 10, true);  // the optional cell (10 %) comes first
  ASSERT_EQ(thin.size(), 3u);
  EXPECT_EQ(thin[0]->index, 2);
  EXPECT_EQ(thin[1]->index, 1);
  EXPECT_EQ(thin[2]->index, 0);

  thin = ThinnestCells(s, 1, false);
  ASSERT_EQ(thin.size(), 1u);
  EXPECT_EQ(thin[0]->index, 1);
  EXPECT_TRUE(ThinnestCells(s, 0, true).empty());

  // Pointers refer to the summary's own cells.
  EXPECT_EQ(ThinnestCells(s, 1, true)[0], &s.cells[2]);
}

TEST(ForecastTest, ThinnestCellsPutLowerFullShareFirst) {
  ForecastSummary s;
  s.cells.resize(4);
  const double p_full[4] = {0.9, 0.2, 0.5, 0.2};
  const double mean[4] = {5, 8, 1, 2};
  for (int i = 0; i < 4; ++i) {
    CellForecast& c = s.cells[static_cast<size_t>(i)];
    c.index = i;
    c.cell.required = 10;
    c.p_full_by_deadline = p_full[i];
    c.count_mean = mean[i];
  }
  const std::vector<const CellForecast*> thin = ThinnestCells(s, 4, false);
  ASSERT_EQ(thin.size(), 4u);
  EXPECT_EQ(thin[0]->index, 3);  // 0.2, 2 of 10
  EXPECT_EQ(thin[1]->index, 1);  // 0.2, 8 of 10
  EXPECT_EQ(thin[2]->index, 2);  // 0.5
  EXPECT_EQ(thin[3]->index, 0);  // 0.9
}

}  // namespace
}  // namespace planner
