#include "planner/progress_forecast.h"

#include <algorithm>

#include "planner/forecast_accumulator.h"

namespace planner {
namespace {

std::optional<double> Remaining(const QuantileEstimate& q, double as_of_weeks) {
  if (!q.value) return std::nullopt;
  return std::max(0.0, *q.value - as_of_weeks);
}

// The runs folded one at a time: the forecast, and per extension the runs
// complete and the runs with each cell full by its end.
class ProgressTally {
 public:
  ProgressTally(const Plan& plan, const Date& as_of, double relaxed_share)
      : plan_(&plan),
        forecast_(plan.matrix, DeadlineSteps(plan), HorizonSteps(plan), relaxed_share) {
    as_of_steps_ = DaysBetween(plan.start, as_of) * kStepsPerDay;
    passed_ = DaysBetween(plan.deadline, as_of) > 0;
    base_ = passed_ ? as_of : plan.deadline;
    const int64_t base_steps = passed_ ? as_of_steps_ : DeadlineSteps(plan);
    for (int weeks : kExtensionWeeks) {
      end_steps_.push_back(base_steps + static_cast<int64_t>(weeks) * kStepsPerWeek);
    }
    complete_.assign(end_steps_.size(), 0);
    full_.assign(end_steps_.size() * plan.matrix.cells.size(), 0);
  }

  void Add(const RunResult& r) {
    forecast_.Add(r);
    const size_t cells = plan_->matrix.cells.size();
    for (size_t e = 0; e < end_steps_.size(); ++e) {
      const int64_t end = end_steps_[e];
      complete_[e] += r.completion_step >= 0 && r.completion_step <= end;
      for (size_t c = 0; c < cells && c < r.full_step.size(); ++c) {
        full_[e * cells + c] += r.full_step[c] >= 0 && r.full_step[c] <= end;
      }
    }
  }

  ProgressSummary Summary(const LoggedCounts& logged, const Date& as_of,
                          uint64_t seed) const;

 private:
  ExtensionRow Extension(size_t e) const;

  const Plan* plan_;
  ForecastAccumulator forecast_;
  int64_t as_of_steps_ = 0;
  bool passed_ = false;  // the planned end is before the as-of date
  Date base_;
  std::vector<int64_t> end_steps_;  // per extension
  std::vector<long> complete_;      // per extension
  std::vector<long> full_;          // [extension * cells + cell]
};

ExtensionRow ProgressTally::Extension(size_t e) const {
  const Plan& plan = *plan_;
  ExtensionRow row;
  row.weeks = kExtensionWeeks[e];
  row.end = AddDays(base_, 7 * static_cast<int64_t>(row.weeks));
  row.beyond_horizon = end_steps_[e] > HorizonSteps(plan);
  const double n = static_cast<double>(std::max<long>(forecast_.runs(), 1));
  row.p_complete = complete_[e] / n;
  const std::vector<Cell>& cells = plan.matrix.cells;
  for (size_t c = 0; c < cells.size(); ++c) {
    if (cells[c].optional) continue;
    const long full = full_[e * cells.size() + c];
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

ProgressSummary ProgressTally::Summary(const LoggedCounts& logged, const Date& as_of,
                                       uint64_t seed) const {
  const Plan& plan = *plan_;
  ProgressSummary s;
  s.as_of = as_of;
  s.as_of_weeks = StepsToWeeks(as_of_steps_);
  s.logged = logged;
  s.already_complete = MatrixFull(plan.matrix, logged.counts);
  s.forecast = forecast_.Summary(seed);
  s.p_by_planned_end = s.forecast.p_complete_by_deadline;
  if (s.already_complete && logged.complete_time_s) {
    s.p_by_planned_end = *logged.complete_time_s <= DateTime(plan.deadline) ? 1.0 : 0.0;
  }
  s.remaining_p50 = Remaining(s.forecast.p50, s.as_of_weeks);
  s.remaining_p80 = Remaining(s.forecast.p80, s.as_of_weeks);
  s.remaining_p90 = Remaining(s.forecast.p90, s.as_of_weeks);
  s.extension_base = base_;
  for (size_t e = 0; e < end_steps_.size(); ++e) s.extensions.push_back(Extension(e));
  return s;
}

}  // namespace

ProgressSummary SummarizeProgress(const Plan& plan, const LoggedCounts& logged,
                                  const Date& as_of, const std::vector<RunResult>& runs,
                                  uint64_t seed, double relaxed_share) {
  ProgressTally tally(plan, as_of, relaxed_share);
  for (const RunResult& r : runs) tally.Add(r);
  return tally.Summary(logged, as_of, seed);
}

ProgressSummary ForecastProgress(const Plan& plan, const LoggedCounts& logged,
                                 const Date& as_of, MonteCarloOptions options,
                                 ProgressSink* progress) {
  const Simulator sim(plan);
  const CampaignState state = MakeCampaignState(plan, logged, as_of);
  options.state = &state;
  // The runs are folded chunk by chunk and discarded: memory does not grow
  // with the number of runs.
  ProgressTally tally(plan, as_of, sim.relaxed_share());
  RunMonteCarloInChunks({&sim}, options, progress,
                        [&tally](uint64_t, const std::vector<std::vector<RunResult>>& c) {
                          for (const RunResult& r : c[0]) tally.Add(r);
                        });
  return tally.Summary(logged, as_of, options.seed);
}

}  // namespace planner
