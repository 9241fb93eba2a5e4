#include "planner/forecast_accumulator.h"

#include <cmath>
#include <limits>

#include "planner/calendar.h"
#include "sim/forecast_parts.h"
#include "sim/value_histogram.h"

namespace planner {
namespace {

bool ByDeadline(int64_t step, int64_t deadline_steps) {
  return step >= 0 && step <= deadline_steps;
}

double Share(long count, long total) {
  return total > 0 ? static_cast<double>(count) / static_cast<double>(total) : 0.0;
}

// Quantile p of a histogram of steps, in weeks.
QuantileEstimate WeeksQuantile(const ValueHistogram& steps, double p) {
  return EstimateQuantile(
      steps.total(),
      [&](long rank) -> std::optional<double> {
        const std::optional<double> step = steps.AtRank(rank);
        if (!step) return std::nullopt;
        return *step / kStepsPerWeek;
      },
      p);
}

// Type-1 order statistic of a histogram of counts (0 when empty).
double CountQuantile(const ValueHistogram& counts, double p) {
  return EstimateQuantile(
             counts.total(), [&](long rank) { return counts.AtRank(rank); }, p)
      .value.value_or(0.0);
}

struct CellTally {
  explicit CellTally(size_t max_buckets) : counts(max_buckets), full(max_buckets) {}
  ValueHistogram counts;  // valid records at the deadline
  ValueHistogram full;    // step the cell reached its minimum (-1 = never)
  uint64_t count_sum = 0;
  long full_by_deadline = 0, last = 0, not_full = 0;
};

}  // namespace

struct ForecastAccumulator::State {
  State(const CaptureMatrix& m, int64_t deadline, int64_t horizon, double relaxed)
      : matrix(&m),
        deadline_steps(deadline),
        horizon_steps(horizon),
        relaxed_share(relaxed),
        // One bucket per step up to the horizon: never merged, so exact.
        completion(static_cast<size_t>(std::max<int64_t>(horizon, 0)) + 1),
        sensitivity(m, kCellBuckets),
        fill_curve(m, horizon) {
    cells.reserve(m.cells.size());
    for (size_t c = 0; c < m.cells.size(); ++c) cells.emplace_back(kCellBuckets);
  }

  const CaptureMatrix* matrix;
  int64_t deadline_steps, horizon_steps;
  double relaxed_share;

  long runs = 0;
  ValueHistogram completion;  // completion steps, -1 = not complete
  long by_deadline = 0;
  double weeks_sum = 0;  // completed runs, in run order
  std::vector<CellTally> cells;
  // Sums of simulated time, in run order.
  double simulated = 0, turbine_up = 0, daq_up = 0, valid_sector = 0, curtailed = 0;
  double channels_up = 0;
  double speed_sum = 0;
  SensitivityTally sensitivity;
  FillCurveTally fill_curve;
};

ForecastAccumulator::ForecastAccumulator(const CaptureMatrix& matrix,
                                         int64_t deadline_steps, int64_t horizon_steps,
                                         double relaxed_share)
    : state_(std::make_unique<State>(matrix, deadline_steps, horizon_steps,
                                     relaxed_share)) {}
ForecastAccumulator::~ForecastAccumulator() = default;
ForecastAccumulator::ForecastAccumulator(ForecastAccumulator&&) noexcept = default;
ForecastAccumulator& ForecastAccumulator::operator=(ForecastAccumulator&&) noexcept =
    default;

long ForecastAccumulator::runs() const { return state_->runs; }

void ForecastAccumulator::Add(const RunResult& r) {
  State& st = *state_;
  ++st.runs;
  st.completion.Add(r.completion_step);
  if (ByDeadline(r.completion_step, st.deadline_steps)) ++st.by_deadline;
  if (r.completion_step >= 0) st.weeks_sum += StepsToWeeks(r.completion_step);

  for (size_t i = 0; i < st.cells.size(); ++i) {
    CellTally& c = st.cells[i];
    const uint32_t count = i < r.count_at_deadline.size() ? r.count_at_deadline[i] : 0;
    const int64_t full = i < r.full_step.size() ? r.full_step[i] : -1;
    c.counts.Add(count);
    c.count_sum += count;
    c.full.Add(full);
    if (ByDeadline(full, st.deadline_steps)) ++c.full_by_deadline;
    if (r.last_cell == static_cast<int>(i)) ++c.last;
    if (full < 0) ++c.not_full;
  }

  st.simulated += static_cast<double>(r.simulated_steps);
  st.turbine_up += static_cast<double>(r.turbine_up_steps);
  st.daq_up += static_cast<double>(r.daq_up_steps);
  st.channels_up += static_cast<double>(r.channels_up_steps);
  st.valid_sector += static_cast<double>(r.valid_sector_steps);
  st.curtailed += static_cast<double>(r.curtailed_steps);
  st.speed_sum += r.speed_sum_ms;

  st.sensitivity.Add(r);
  st.fill_curve.Add(r);
}

namespace {

void SummarizeCompletion(const ValueHistogram& completion, double weeks_sum,
                         ForecastSummary* s) {
  const long n = completion.total();
  const long incomplete = completion.never();
  s->p_incomplete_at_horizon = Share(incomplete, n);
  if (n > 0 && incomplete == 0) {
    const double mean = weeks_sum / static_cast<double>(n);
    s->mean_weeks = mean;
    if (n > 1) {
      double ss = 0.0;
      for (const auto& [step, runs] : completion.buckets()) {
        const double d = StepsToWeeks(step) - mean;
        ss += static_cast<double>(runs) * (d * d);
      }
      const double sd = std::sqrt(ss / static_cast<double>(n - 1));
      s->mean_se_weeks = sd / std::sqrt(static_cast<double>(n));
    }
  }
  for (const auto& [step, runs] : completion.buckets()) {
    s->completion_counts.push_back({StepsToWeeks(step), static_cast<long>(runs)});
  }
  s->p10.p = 0.10;
  s->p50.p = 0.50;
  s->p80.p = 0.80;
  s->p90.p = 0.90;
  if (n > 0) {
    s->p10 = WeeksQuantile(completion, 0.10);
    s->p50 = WeeksQuantile(completion, 0.50);
    s->p80 = WeeksQuantile(completion, 0.80);
    s->p90 = WeeksQuantile(completion, 0.90);
  }
}

CellForecast SummarizeCell(const CaptureMatrix& matrix, int index, const CellTally& t,
                           long n) {
  CellForecast c;
  c.index = index;
  c.cell = matrix.cells[static_cast<size_t>(index)];
  c.count_mean = n > 0 ? static_cast<double>(t.count_sum) / static_cast<double>(n) : 0.0;
  c.count_p10 = CountQuantile(t.counts, 0.10);
  c.count_p50 = CountQuantile(t.counts, 0.50);
  c.count_p90 = CountQuantile(t.counts, 0.90);
  c.p_full_by_deadline = Share(t.full_by_deadline, n);
  if (n > 0) {
    c.weeks_to_full_p50 = WeeksQuantile(t.full, 0.50).value;
    c.weeks_to_full_p90 = WeeksQuantile(t.full, 0.90).value;
  }
  c.p_last_to_fill = Share(t.last, n);
  c.p_not_full_at_end = Share(t.not_full, n);
  return c;
}

}  // namespace

ForecastSummary ForecastAccumulator::Summary(uint64_t seed) const {
  const State& st = *state_;
  ForecastSummary s;
  s.runs = st.runs;
  s.seed = seed;
  s.deadline_weeks = StepsToWeeks(st.deadline_steps);
  s.horizon_weeks = StepsToWeeks(st.horizon_steps);

  s.p_complete_by_deadline = Share(st.by_deadline, st.runs);
  SummarizeCompletion(st.completion, st.weeks_sum, &s);

  s.cells.reserve(st.cells.size());
  double best = 0.0;
  for (int i = 0; i < static_cast<int>(st.cells.size()); ++i) {
    s.cells.push_back(
        SummarizeCell(*st.matrix, i, st.cells[static_cast<size_t>(i)], st.runs));
    // Strictly greater: on a tie the first cell in matrix order wins.
    if (s.cells.back().p_last_to_fill > best) {
      best = s.cells.back().p_last_to_fill;
      s.bottleneck_cell = i;
    }
  }

  // Ratios of sums: shares of all simulated time, so long runs weigh more.
  if (st.simulated > 0) {
    s.turbine_availability = st.turbine_up / st.simulated;
    s.daq_availability = st.daq_up / st.simulated;
    s.channels_availability = st.channels_up / st.simulated;
    s.valid_sector_share = st.valid_sector / st.simulated;
    s.curtailed_share = st.curtailed / st.simulated;
    s.mean_speed_ms = st.speed_sum / st.simulated;
  }
  s.relaxed_share = st.relaxed_share;
  st.sensitivity.Summarize(&s);
  st.fill_curve.Summarize(&s);
  return s;
}

size_t ForecastAccumulator::MemoryBytes() const {
  const State& st = *state_;
  size_t bytes = sizeof(State) + st.completion.MemoryBytes() +
                 st.sensitivity.MemoryBytes() + st.fill_curve.MemoryBytes();
  for (const CellTally& c : st.cells) {
    bytes += sizeof(CellTally) - 2 * sizeof(ValueHistogram) + c.counts.MemoryBytes() +
             c.full.MemoryBytes();
  }
  return bytes;
}

}  // namespace planner
