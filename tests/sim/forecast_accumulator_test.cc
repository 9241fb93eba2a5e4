// The streaming summary against the plain one: order statistics read from a
// fully sorted vector of every run (std::sort as the reference, and the
// type-1 sample quantile X_(ceil(n p)) of planner/quantile.h, Hyndman & Fan
// 1996, definition 1; from memory), and its memory against the bound its
// header states.
#include "planner/forecast_accumulator.h"

#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <limits>

#include "planner/monte_carlo.h"
#include "planner/quantile.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();

using testing_plans::ThreeCellPlan;

double Weeks(int64_t step) { return step < 0 ? kInf : step / 1008.0; }

// X_(ceil(n p)) of a sorted sample, nullopt where it is +infinity.
std::optional<double> TypeOne(const std::vector<double>& sorted, double p) {
  const size_t rank = static_cast<size_t>(std::ceil(sorted.size() * p - 1e-9));
  const double x = sorted[std::max<size_t>(rank, 1) - 1];
  if (std::isinf(x)) return std::nullopt;
  return x;
}

TEST(ForecastAccumulatorTest, QuantilesEqualThoseOfTheFullSortedVector) {
  const Plan plan = ThreeCellPlan();
  const Simulator sim(plan);
  MonteCarloOptions mc;
  mc.runs = 1500;
  mc.seed = 31;
  const std::vector<RunResult> runs = RunMonteCarlo(sim, mc, nullptr);
  ForecastAccumulator acc(plan.matrix, sim.deadline_steps(), sim.horizon_steps());
  for (const RunResult& r : runs) acc.Add(r);
  const ForecastSummary s = acc.Summary(31);

  std::vector<double> weeks;
  for (const RunResult& r : runs) weeks.push_back(Weeks(r.completion_step));
  std::sort(weeks.begin(), weeks.end());
  ASSERT_TRUE(std::isfinite(weeks[weeks.size() / 2]));  // the test needs completions
  const std::pair<double, const QuantileEstimate*> quantiles[] = {
      {0.1, &s.p10}, {0.5, &s.p50}, {0.8, &s.p80}, {0.9, &s.p90}};
  for (const auto& [p, q] : quantiles) {
    const QuantileEstimate full = EstimateQuantile(weeks, p);
    EXPECT_EQ(q->value, full.value) << p;
    EXPECT_EQ(q->ci_lo, full.ci_lo) << p;
    EXPECT_EQ(q->ci_hi, full.ci_hi) << p;
    EXPECT_EQ(q->value, TypeOne(weeks, p)) << p;
  }
  // The completion curve holds every run that completed, at its time.
  long counted = 0;
  for (const CompletionCount& c : s.completion_counts) {
    EXPECT_EQ(c.runs, std::count(weeks.begin(), weeks.end(), c.weeks)) << c.weeks;
    counted += c.runs;
  }
  EXPECT_EQ(counted, std::count_if(weeks.begin(), weeks.end(),
                                   [](double w) { return std::isfinite(w); }));

  for (size_t c = 0; c < plan.matrix.cells.size(); ++c) {
    std::vector<double> full, counts;
    for (const RunResult& r : runs) {
      full.push_back(Weeks(r.full_step[c]));
      counts.push_back(r.count_at_deadline[c]);
    }
    std::sort(full.begin(), full.end());
    std::sort(counts.begin(), counts.end());
    EXPECT_EQ(s.cells[c].weeks_to_full_p50, TypeOne(full, 0.5)) << c;
    EXPECT_EQ(s.cells[c].weeks_to_full_p90, TypeOne(full, 0.9)) << c;
    EXPECT_EQ(s.cells[c].count_p10, TypeOne(counts, 0.1).value()) << c;
    EXPECT_EQ(s.cells[c].count_p50, TypeOne(counts, 0.5).value()) << c;
    EXPECT_EQ(s.cells[c].count_p90, TypeOne(counts, 0.9).value()) << c;
  }
}

TEST(ForecastAccumulatorTest, ChunkedRunsGiveTheSameAnswerForAnyThreadCount) {
  // Two and a half chunks, so that the chunk boundaries are crossed.
  const Plan plan = testing_plans::SingleCellPlan(8.0, 2.0, 11.0, 13.0, 30, 1, 2);
  const Simulator sim(plan);
  MonteCarloOptions mc;
  mc.runs = kChunkRuns * 5 / 2;
  mc.seed = 8;
  ForecastSummary by_threads[2];
  for (int t = 1; t <= 2; ++t) {
    mc.threads = t;
    ForecastAccumulator acc(plan.matrix, sim.deadline_steps(), sim.horizon_steps());
    RunMonteCarloInChunks({&sim}, mc, nullptr,
                          [&](uint64_t, const std::vector<std::vector<RunResult>>& c) {
                            for (const RunResult& r : c[0]) acc.Add(r);
                          });
    by_threads[t - 1] = acc.Summary(mc.seed);
  }
  const ForecastSummary one =
      SummarizeForecast(plan.matrix, sim.deadline_steps(), sim.horizon_steps(),
                        RunMonteCarlo(sim, mc, nullptr), mc.seed);
  for (const ForecastSummary& s : by_threads) {
    EXPECT_EQ(s.runs, mc.runs);
    EXPECT_EQ(s.mean_weeks, one.mean_weeks);  // bit for bit: sums in run order
    EXPECT_EQ(s.mean_se_weeks, one.mean_se_weeks);
    EXPECT_EQ(s.p80.value, one.p80.value);
    EXPECT_EQ(s.mean_speed_ms, one.mean_speed_ms);
    EXPECT_EQ(s.cells[0].count_mean, one.cells[0].count_mean);
  }
}

TEST(ForecastAccumulatorTest, MemoryDoesNotGrowWithRunsAndStaysUnderItsBound) {
  const Plan plan = ThreeCellPlan();
  const Simulator sim(plan);
  MonteCarloOptions mc;
  mc.runs = 8 * kChunkRuns;
  mc.seed = 5;
  ForecastAccumulator acc(plan.matrix, sim.deadline_steps(), sim.horizon_steps());
  std::vector<size_t> bytes;  // after each chunk
  RunMonteCarloInChunks({&sim}, mc, nullptr,
                        [&](uint64_t, const std::vector<std::vector<RunResult>>& c) {
                          for (const RunResult& r : c[0]) acc.Add(r);
                          bytes.push_back(acc.MemoryBytes());
                        });
  ASSERT_EQ(bytes.size(), 8u);
  // The bound stated in forecast_accumulator.h, for this plan.
  const size_t cells = plan.matrix.cells.size();
  const size_t weeks = static_cast<size_t>(plan.horizon_weeks);
  const size_t bound =
      16 * (static_cast<size_t>(sim.horizon_steps()) + 1025) +
      cells * (4 * 16 * (ForecastAccumulator::kCellBuckets + 1024) + 512) +
      4 * (weeks + 2) * (cells + 1) + 4096;
  for (size_t b : bytes) EXPECT_LE(b, bound);
  // Past the first chunks only distinct values add entries, and these are
  // bounded by the horizon: the last four chunks add less than the first.
  EXPECT_LT(bytes[7] - bytes[3], bytes[0]);
}

}  // namespace
}  // namespace planner
