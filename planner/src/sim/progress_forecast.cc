#include "planner/progress_forecast.h"

#include <algorithm>

namespace planner {
namespace {

std::optional<double> Remaining(const QuantileEstimate& q, double as_of_weeks) {
  if (!q.value) return std::nullopt;
  return std::max(0.0, *q.value - as_of_weeks);
}

ExtensionRow Extension(const Plan& plan, const std::vector<RunResult>& runs,
                       int64_t base_steps, const Date& base, int weeks,
                       int64_t horizon_steps) {
  ExtensionRow row;
  row.weeks = weeks;
  row.end = AddDays(base, 7 * static_cast<int64_t>(weeks));
  const int64_t end_steps = base_steps + static_cast<int64_t>(weeks) * kStepsPerWeek;
  row.beyond_horizon = end_steps > horizon_steps;
  const double n = static_cast<double>(std::max<size_t>(runs.size(), 1));
  long complete = 0;
  for (const RunResult& r : runs) {
    complete += r.completion_step >= 0 && r.completion_step <= end_steps;
  }
  row.p_complete = complete / n;
  const std::vector<Cell>& cells = plan.matrix.cells;
  for (size_t c = 0; c < cells.size(); ++c) {
    if (cells[c].optional) continue;
    long full = 0;
    for (const RunResult& r : runs) {
      full += r.full_step[c] >= 0 && r.full_step[c] <= end_steps;
    }
    if (full / n < 1.0) row.uncertain.push_back({static_cast<int>(c), full / n});
  }
  std::stable_sort(
      row.uncertain.begin(), row.uncertain.end(),
      [](const CellAtDate& a, const CellAtDate& b) { return a.p_full < b.p_full; });
  for (const CellAtDate& c : row.uncertain) {
    if (c.p_full < kThinBelow) row.thin.push_back(c);
  }
  return row;
}

}  // namespace

ProgressSummary SummarizeProgress(const Plan& plan, const LoggedCounts& logged,
                                  const Date& as_of, const std::vector<RunResult>& runs,
                                  uint64_t seed, double relaxed_share) {
  ProgressSummary s;
  s.as_of = as_of;
  const int64_t as_of_steps = DaysBetween(plan.start, as_of) * kStepsPerDay;
  s.as_of_weeks = StepsToWeeks(as_of_steps);
  s.logged = logged;
  s.already_complete = MatrixFull(plan.matrix, logged.counts);
  s.forecast = SummarizeForecast(plan.matrix, DeadlineSteps(plan), HorizonSteps(plan),
                                 runs, seed, relaxed_share);
  s.p_by_planned_end = s.forecast.p_complete_by_deadline;
  if (s.already_complete && logged.complete_time_s) {
    s.p_by_planned_end = *logged.complete_time_s <= DateTime(plan.deadline) ? 1.0 : 0.0;
  }
  s.remaining_p50 = Remaining(s.forecast.p50, s.as_of_weeks);
  s.remaining_p80 = Remaining(s.forecast.p80, s.as_of_weeks);
  s.remaining_p90 = Remaining(s.forecast.p90, s.as_of_weeks);
  const bool passed = DaysBetween(plan.deadline, as_of) > 0;
  s.extension_base = passed ? as_of : plan.deadline;
  const int64_t base_steps = passed ? as_of_steps : DeadlineSteps(plan);
  for (int weeks : kExtensionWeeks) {
    s.extensions.push_back(
        Extension(plan, runs, base_steps, s.extension_base, weeks, HorizonSteps(plan)));
  }
  return s;
}

ProgressSummary ForecastProgress(const Plan& plan, const LoggedCounts& logged,
                                 const Date& as_of, MonteCarloOptions options,
                                 ProgressSink* progress) {
  const Simulator sim(plan);
  const CampaignState state = MakeCampaignState(plan, logged, as_of);
  options.state = &state;
  const std::vector<RunResult> runs = RunMonteCarlo(sim, options, progress);
  return SummarizeProgress(plan, logged, as_of, runs, options.seed, sim.relaxed_share());
}

}  // namespace planner
