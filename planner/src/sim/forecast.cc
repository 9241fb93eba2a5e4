#include "planner/forecast.h"

#include <algorithm>
#include <cmath>
#include <limits>

#include "sim/forecast_parts.h"

namespace planner {
namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();

// Step of an event, or -1 for "did not happen", in weeks (+inf for -1).
double WeeksOrInf(int64_t step) { return step < 0 ? kInf : StepsToWeeks(step); }

bool ByDeadline(int64_t step, int64_t deadline_steps) {
  return step >= 0 && step <= deadline_steps;
}

double Share(long count, long total) {
  return total > 0 ? static_cast<double>(count) / static_cast<double>(total) : 0.0;
}

void SummarizeCompletion(const std::vector<RunResult>& runs, int64_t deadline_steps,
                         ForecastSummary* s) {
  const long n = static_cast<long>(runs.size());
  std::vector<double> weeks;
  weeks.reserve(runs.size());
  long by_deadline = 0, incomplete = 0;
  for (const RunResult& r : runs) {
    weeks.push_back(WeeksOrInf(r.completion_step));
    if (ByDeadline(r.completion_step, deadline_steps)) ++by_deadline;
    if (r.completion_step < 0) ++incomplete;
  }
  s->p_complete_by_deadline = Share(by_deadline, n);
  s->p_incomplete_at_horizon = Share(incomplete, n);

  if (n > 0 && incomplete == 0) {
    double sum = 0.0;
    for (double w : weeks) sum += w;
    const double mean = sum / static_cast<double>(n);
    s->mean_weeks = mean;
    if (n > 1) {
      double ss = 0.0;
      for (double w : weeks) ss += (w - mean) * (w - mean);
      const double sd = std::sqrt(ss / static_cast<double>(n - 1));
      s->mean_se_weeks = sd / std::sqrt(static_cast<double>(n));
    }
  }

  std::sort(weeks.begin(), weeks.end());
  s->completion_weeks = weeks;
  s->p10.p = 0.10;
  s->p50.p = 0.50;
  s->p80.p = 0.80;
  s->p90.p = 0.90;
  if (n > 0) {
    s->p10 = EstimateQuantile(weeks, 0.10);
    s->p50 = EstimateQuantile(weeks, 0.50);
    s->p80 = EstimateQuantile(weeks, 0.80);
    s->p90 = EstimateQuantile(weeks, 0.90);
  }
}

// Type-1 order statistic of a sorted, finite sample (0 for an empty one).
double OrderQuantile(const std::vector<double>& sorted, double p) {
  if (sorted.empty()) return 0.0;
  return EstimateQuantile(sorted, p).value.value_or(0.0);
}

CellForecast SummarizeCell(const CaptureMatrix& matrix, int index, int64_t deadline_steps,
                           const std::vector<RunResult>& runs) {
  CellForecast c;
  c.index = index;
  c.cell = matrix.cells[static_cast<size_t>(index)];
  const long n = static_cast<long>(runs.size());
  const size_t i = static_cast<size_t>(index);

  std::vector<double> counts, full_weeks;
  counts.reserve(runs.size());
  full_weeks.reserve(runs.size());
  long full_by_deadline = 0, last = 0, not_full = 0;
  double sum = 0.0;
  for (const RunResult& r : runs) {
    // Runs shorter than the matrix (should not happen) count as empty cells.
    const double count = i < r.count_at_deadline.size() ? r.count_at_deadline[i] : 0.0;
    const int64_t full = i < r.full_step.size() ? r.full_step[i] : -1;
    counts.push_back(count);
    sum += count;
    full_weeks.push_back(WeeksOrInf(full));
    if (ByDeadline(full, deadline_steps)) ++full_by_deadline;
    if (r.last_cell == index) ++last;
    if (full < 0) ++not_full;
  }
  std::sort(counts.begin(), counts.end());
  std::sort(full_weeks.begin(), full_weeks.end());

  c.count_mean = n > 0 ? sum / static_cast<double>(n) : 0.0;
  c.count_p10 = OrderQuantile(counts, 0.10);
  c.count_p50 = OrderQuantile(counts, 0.50);
  c.count_p90 = OrderQuantile(counts, 0.90);
  c.p_full_by_deadline = Share(full_by_deadline, n);
  if (n > 0) {
    c.weeks_to_full_p50 = EstimateQuantile(full_weeks, 0.50).value;
    c.weeks_to_full_p90 = EstimateQuantile(full_weeks, 0.90).value;
  }
  c.p_last_to_fill = Share(last, n);
  c.p_not_full_at_end = Share(not_full, n);
  return c;
}

void SummarizeDiagnostics(const std::vector<RunResult>& runs, ForecastSummary* s) {
  // Ratios of sums: shares of all simulated time, so long runs weigh more.
  double simulated = 0, turbine_up = 0, daq_up = 0, valid_sector = 0, curtailed = 0;
  double speed_sum = 0;
  for (const RunResult& r : runs) {
    simulated += static_cast<double>(r.simulated_steps);
    turbine_up += static_cast<double>(r.turbine_up_steps);
    daq_up += static_cast<double>(r.daq_up_steps);
    valid_sector += static_cast<double>(r.valid_sector_steps);
    curtailed += static_cast<double>(r.curtailed_steps);
    speed_sum += r.speed_sum_ms;
  }
  if (simulated > 0) {
    s->turbine_availability = turbine_up / simulated;
    s->daq_availability = daq_up / simulated;
    s->valid_sector_share = valid_sector / simulated;
    s->curtailed_share = curtailed / simulated;
    s->mean_speed_ms = speed_sum / simulated;
  }
}

}  // namespace

ForecastSummary SummarizeForecast(const CaptureMatrix& matrix, int64_t deadline_steps,
                                  int64_t horizon_steps,
                                  const std::vector<RunResult>& runs, uint64_t seed,
                                  double relaxed_share) {
  ForecastSummary s;
  s.runs = static_cast<long>(runs.size());
  s.seed = seed;
  s.deadline_weeks = StepsToWeeks(deadline_steps);
  s.horizon_weeks = StepsToWeeks(horizon_steps);

  SummarizeCompletion(runs, deadline_steps, &s);

  s.cells.reserve(matrix.cells.size());
  double best = 0.0;
  for (int i = 0; i < static_cast<int>(matrix.cells.size()); ++i) {
    s.cells.push_back(SummarizeCell(matrix, i, deadline_steps, runs));
    // Strictly greater: on a tie the first cell in matrix order wins.
    if (s.cells.back().p_last_to_fill > best) {
      best = s.cells.back().p_last_to_fill;
      s.bottleneck_cell = i;
    }
  }

  SummarizeDiagnostics(runs, &s);
  s.relaxed_share = relaxed_share;
  SummarizeSensitivity(matrix, runs, &s);
  SummarizeFillCurve(matrix, runs, &s);
  return s;
}

std::vector<const CellForecast*> ThinnestCells(const ForecastSummary& s, int limit,
                                               bool include_optional) {
  std::vector<const CellForecast*> out;
  for (const CellForecast& c : s.cells) {
    if (c.cell.optional && !include_optional) continue;
    out.push_back(&c);
  }
  auto fill_share = [](const CellForecast* c) {
    return c->cell.required > 0 ? c->count_mean / c->cell.required : kInf;
  };
  // Stable: cells that tie on both keys keep matrix order.
  std::stable_sort(out.begin(), out.end(),
                   [&](const CellForecast* a, const CellForecast* b) {
                     if (a->p_full_by_deadline != b->p_full_by_deadline) {
                       return a->p_full_by_deadline < b->p_full_by_deadline;
                     }
                     return fill_share(a) < fill_share(b);
                   });
  if (limit >= 0 && out.size() > static_cast<size_t>(limit)) {
    out.resize(static_cast<size_t>(limit));
  }
  return out;
}

}  // namespace planner
