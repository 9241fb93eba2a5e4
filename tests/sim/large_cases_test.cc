// Large and odd cases: a 1,000-cell matrix, a 10-year horizon, a single
// sector, zero availability. Each must load, simulate in bounded memory and
// give a plain answer (never a hang); the counts are checked against
// Boost.Math's Weibull distribution, the outside reference.
#include <gtest/gtest.h>

#include <boost/math/distributions/chi_squared.hpp>
#include <boost/math/distributions/weibull.hpp>
#include <cmath>
#include <numeric>
#include <string>
#include <vector>

#include "io/reader_test_util.h"
#include "planner/forecast.h"
#include "planner/forecast_report.h"
#include "planner/plan_reader.h"
#include "planner/reachability.h"
#include "planner/simulation.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

using testing_plans::SingleCellPlan;

// Probability that a Weibull(A, k) speed falls in [lo, hi) (Boost.Math cdf).
double BinProbability(double a_ms, double k, double lo, double hi) {
  const boost::math::weibull_distribution<double> w(k, a_ms);
  return boost::math::cdf(w, hi) - boost::math::cdf(w, lo);
}

// `plan` with its one production cell replaced by `n` equal wind bins from
// lo_ms to hi_ms, each needing `required` records.
void SplitIntoBins(Plan* plan, int n, double lo_ms, double hi_ms, int required) {
  CaptureMatrix& m = plan->matrix;
  m.cells.clear();
  StateGrid grid;
  const double width = (hi_ms - lo_ms) / n;
  for (int i = 0; i < n; ++i) {
    Cell c;
    c.wind_ms = {lo_ms + i * width, i + 1 == n ? hi_ms : lo_ms + (i + 1) * width};
    c.required = required;
    grid.wind_bins_ms.push_back(c.wind_ms);
    grid.cell_index.push_back(i);
    m.cells.push_back(c);
  }
  m.grids = {grid};
}

TEST(LargeCasesTest, ReaderAcceptsAThousandBinsAndFourThousandCells) {
  const std::string text =
      "name: Fine bins\n"
      "site_model: coastal-ridge.yaml\n"
      "campaign: {start: 2027-03-01, deadline: 2028-03-01}\n"
      "turbine: {name: T1, cut_in_ms: 0.5, rated_ms: 11, cut_out_ms: 25.5}\n"
      "capture_matrix:\n"
      "  production:\n"
      "    wind_bins_ms: {from: 0.5, to: 25.5, width: 0.025}\n"
      "    ti_bins_pct: [0, 8, 12, 16, 30]\n"
      "    min_records: 1\n";
  const Plan plan = reader_test::ParseTestPlan(text);
  ASSERT_EQ(plan.matrix.cells.size(), 4000u);
  EXPECT_EQ(plan.matrix.grids[0].wind_bins_ms.size(), 1000u);
  EXPECT_DOUBLE_EQ(plan.matrix.grids[0].wind_bins_ms.back().hi, 25.5);
  EXPECT_TRUE(FindUnreachableCells(plan).cells.empty());
  // One bin more is refused with a message (the limit is 1,000 bins).
  EXPECT_NE(
      reader_test::TestPlanError(reader_test::Replace(text, "to: 25.5", "to: 25.525"))
          .find("at most 1000"),
      std::string::npos);
}

// 1,000 cells of 0.025 m/s from 0.5 to 25.5 m/s, independent records: the
// summed counts of each cell over all simulated records must match the
// Weibull bin probability x records (Boost.Math), judged by Pearson's
// chi-square over the cells with an expected count of at least 5.
TEST(LargeCasesTest, ThousandCellCountsMatchWeibullBinProbabilities) {
  const double a_ms = 8.0, k = 2.0;
  Plan plan = SingleCellPlan(a_ms, k, 4, 5, 1, /*deadline_days=*/28, /*horizon_weeks=*/4);
  SplitIntoBins(&plan, 1000, 0.5, 25.5, 1000000);  // never full: run to the horizon
  const Simulator sim(plan);
  const int runs = 10;
  std::vector<double> total(1000, 0.0);
  double records = 0;
  for (int run = 0; run < runs; ++run) {
    RunResult r;
    sim.Run(424242, static_cast<uint64_t>(run), &r);
    ASSERT_EQ(r.count_at_end.size(), 1000u);
    EXPECT_EQ(r.completion_step, -1);
    EXPECT_EQ(r.simulated_steps, 4 * 1008);
    records += static_cast<double>(r.simulated_steps);
    for (int c = 0; c < 1000; ++c) total[c] += r.count_at_end[c];
  }
  double chi2 = 0, in_range = 0, expected_in_range = 0;
  int df = -1;  // cells used, minus one
  for (int c = 0; c < 1000; ++c) {
    const Bin& b = plan.matrix.cells[c].wind_ms;
    const double expected = records * BinProbability(a_ms, k, b.lo, b.hi);
    in_range += total[c];
    expected_in_range += expected;
    if (expected < 5) continue;
    chi2 += (total[c] - expected) * (total[c] - expected) / expected;
    ++df;
  }
  ASSERT_GT(df, 500);
  const boost::math::chi_squared_distribution<double> ref(df);
  EXPECT_GT(chi2, boost::math::quantile(ref, 1e-4));
  EXPECT_LT(chi2, boost::math::quantile(ref, 1 - 1e-4));
  // All records in 0.5-25.5 m/s: binomial, within 5 standard deviations.
  const double p = expected_in_range / records;
  EXPECT_NEAR(in_range, expected_in_range, 5 * std::sqrt(records * p * (1 - p)));
}

// With every cell needing one record, a run completes when the last cell
// fills; completion, last cell and each cell's full step agree.
TEST(LargeCasesTest, ThousandCellCompletionIsTheLastCellToFill) {
  Plan plan = SingleCellPlan(8.0, 2.0, 4, 5, 1, 7, 52);
  SplitIntoBins(&plan, 1000, 4.0, 14.0, 1);  // 0.01 m/s bins
  const Simulator sim(plan);
  for (uint64_t run = 0; run < 5; ++run) {
    RunResult r;
    sim.Run(99, run, &r);
    ASSERT_GE(r.completion_step, 1000);  // at least one record per cell
    int64_t last_full = -1;
    int last_cell = -1;
    for (int c = 0; c < 1000; ++c) {
      ASSERT_GE(r.full_step[c], 1);
      ASSERT_GE(r.count_at_end[c], 1u);
      if (r.full_step[c] > last_full) last_full = r.full_step[c], last_cell = c;
    }
    EXPECT_EQ(r.completion_step, last_full);
    EXPECT_EQ(r.last_cell, last_cell);
    // The run stops at the later of completion and the deadline.
    EXPECT_EQ(r.simulated_steps, std::max<int64_t>(r.completion_step, 7 * 144));
  }
}

// A 10-year horizon: a run keeps per-cell summaries only, so its result has
// the same size as for one week; the count over 10 years is binomial with
// the Weibull bin probability (Boost.Math).
TEST(LargeCasesTest, TenYearHorizonKeepsPerCellSummariesOnly) {
  const double a_ms = 8.0, k = 2.0;
  Plan long_plan = SingleCellPlan(a_ms, k, 8, 9, 10000000, 3650, 522);
  Plan short_plan = SingleCellPlan(a_ms, k, 8, 9, 10000000, 7, 1);
  SplitIntoBins(&long_plan, 3, 8, 11, 10000000);
  SplitIntoBins(&short_plan, 3, 8, 11, 10000000);
  RunResult long_run, short_run;
  Simulator(long_plan).Run(5, 0, &long_run);
  Simulator(short_plan).Run(5, 0, &short_run);
  EXPECT_EQ(long_run.simulated_steps, 522 * 1008);
  EXPECT_EQ(long_run.completion_step, -1);
  for (const auto* r : {&long_run, &short_run}) {
    EXPECT_EQ(r->count_at_deadline.size(), 3u);
    EXPECT_EQ(r->count_at_end.size(), 3u);
    EXPECT_EQ(r->full_step.size(), 3u);
    EXPECT_EQ(r->relaxed_full_step.size(), 3u);
  }
  const double n = 522 * 1008;
  const double p = BinProbability(a_ms, k, 8, 9);
  EXPECT_NEAR(long_run.count_at_end[0], n * p, 5 * std::sqrt(n * p * (1 - p)));
  // The summary's curve has one point per simulated week: it grows with the
  // horizon by design (522 weeks: 523 points), the runs do not.
  const ForecastSummary s = SummarizeForecast(long_plan.matrix, DeadlineSteps(long_plan),
                                              HorizonSteps(long_plan), {long_run}, 5);
  EXPECT_EQ(s.fill_curve.size(), 523u);
  EXPECT_DOUBLE_EQ(s.p_incomplete_at_horizon, 1.0);
  EXPECT_DOUBLE_EQ(s.cells[0].p_not_full_at_end, 1.0);
}

// The docs' smallest site model has one sector covering the whole circle;
// directions inside it are spread evenly, so a valid sector of 90 degrees
// receives a quarter of the records (geometry), binomial with independent
// directions.
TEST(LargeCasesTest, SingleSectorSiteLoadsAndSimulates) {
  const SiteModel site = ParseSiteModel(
      "name: Flat test site\n"
      "sectors:\n"
      "  - {frequency: 1, weibull_a_ms: 8, weibull_k: 2}\n"
      "sector_persistence: 0\n"
      "turbulence: {model: iec-ntm, class: A}\n",
      "site.yaml");
  ASSERT_EQ(site.sectors.size(), 1u);
  EXPECT_DOUBLE_EQ(SectorWidthDeg(site), 360.0);
  Plan plan = SingleCellPlan(8, 2, 4, 5, 1000000, 28, 4);
  plan.site = site;
  plan.valid_sectors = {AngleRange{10.0, 100.0}};
  RunResult r;
  Simulator(plan).Run(11, 0, &r);
  const double n = static_cast<double>(r.simulated_steps);
  EXPECT_NEAR(r.valid_sector_steps, 0.25 * n, 5 * std::sqrt(n * 0.25 * 0.75));
  EXPECT_TRUE(FindUnreachableCells(plan).cells.empty());
}

// The data acquisition down for the whole horizon: no record can count. The
// plan says so before simulating, and the runs end at the horizon with
// nothing counted instead of hanging.
TEST(LargeCasesTest, ZeroAvailabilityGivesAPlainAnswer) {
  Plan plan = SingleCellPlan(8, 2, 4, 5, 10, 28, 8);
  plan.planned_outages = {
      PlannedOutage{"logger away", plan.start, AddDays(plan.start, 56), false, true}};
  const Reachability reach = FindUnreachableCells(plan);
  ASSERT_EQ(reach.cells.size(), 1u);
  EXPECT_FALSE(reach.CanComplete());

  const Simulator sim(plan);
  std::vector<RunResult> runs(4);
  for (size_t i = 0; i < runs.size(); ++i) sim.Run(3, i, &runs[i]);
  for (const RunResult& r : runs) {
    EXPECT_EQ(r.completion_step, -1);
    EXPECT_EQ(r.count_at_end[0], 0u);
    EXPECT_EQ(r.daq_up_steps, 0);
    EXPECT_EQ(r.simulated_steps, 8 * 1008);
  }
  const ForecastSummary s =
      SummarizeForecast(plan.matrix, sim.deadline_steps(), sim.horizon_steps(), runs, 3);
  ReportContext ctx;
  // The text wraps long sentences: compare with its line breaks and
  // indentation made single spaces.
  std::string text;
  for (const char c : FormatForecastText(plan, s, ctx)) {
    const char d = c == '\n' ? ' ' : c;
    if (!(d == ' ' && !text.empty() && text.back() == ' ')) text += d;
  }
  EXPECT_NE(text.find("Cells that can never fill"), std::string::npos) << text;
  EXPECT_NE(text.find("No run completed within the 8-week horizon. Required cells still "
                      "short of their minimum at the horizon: production 4-5 m/s (in "
                      "every run)."),
            std::string::npos)
      << text;
}

// A turbine that is almost never available (MTBF 1 h, MTTR 100,000 h):
// nearly every run ends at the horizon, quickly, with the availability the
// renewal process gives (here: the first up time, then one repair longer
// than the horizon).
TEST(LargeCasesTest, NearlyZeroTurbineAvailabilityEndsAtTheHorizon) {
  Plan plan = SingleCellPlan(8, 2, 4, 5, 50, 28, 8);
  plan.turbine_outages = testing_plans::Outages(1.0, 100000.0);
  const Simulator sim(plan);
  int incomplete = 0;
  for (uint64_t run = 0; run < 20; ++run) {
    RunResult r;
    sim.Run(17, run, &r);
    incomplete += r.completion_step < 0 ? 1 : 0;
    EXPECT_LE(r.turbine_up_steps, r.simulated_steps);
    EXPECT_LT(r.count_at_end[0], 50u);
  }
  EXPECT_EQ(incomplete, 20);
}

}  // namespace
}  // namespace planner
