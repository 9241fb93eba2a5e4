#include <algorithm>

#include "planner/calendar.h"
#include "sim/forecast_parts.h"

namespace planner {
namespace {

// Per run: the two latest fills among required cells and the unfilled ones.
struct RunFills {
  int64_t latest = -1, second = -1;
  int latest_cell = -1;
  int unfilled = 0;        // required cells never full while simulated
  int unfilled_cell = -1;  // one of them
};

RunFills Fills(const CaptureMatrix& m, const RunResult& r) {
  RunFills f;
  for (size_t c = 0; c < m.cells.size() && c < r.full_step.size(); ++c) {
    if (m.cells[c].optional) continue;
    const int64_t step = r.full_step[c];
    if (step < 0) {
      ++f.unfilled;
      f.unfilled_cell = static_cast<int>(c);
    } else if (step > f.latest) {
      f.second = f.latest;
      f.latest = step;
      f.latest_cell = static_cast<int>(c);
    } else if (step > f.second) {
      f.second = step;
    }
  }
  return f;
}

std::optional<double> Saved(const QuantileEstimate& before, const ValueHistogram& after,
                            double p) {
  const QuantileEstimate q = EstimateQuantile(
      after.total(),
      [&](long rank) -> std::optional<double> {
        const std::optional<double> step = after.AtRank(rank);
        if (!step) return std::nullopt;
        return *step / kStepsPerWeek;
      },
      p);
  if (!before.value || !q.value) return std::nullopt;
  return *before.value - *q.value;
}

}  // namespace

SensitivityTally::SensitivityTally(const CaptureMatrix& m, size_t max_buckets)
    : matrix_(&m), only_cell_(RequiredCellCount(m) == 1) {
  optional_.reserve(m.cells.size());
  relaxed_.reserve(m.cells.size());
  for (const Cell& c : m.cells) {
    // Optional cells save nothing: a histogram that keeps nothing.
    optional_.emplace_back(c.optional ? 2 : max_buckets);
    relaxed_.emplace_back(c.optional ? 2 : max_buckets);
  }
}

void SensitivityTally::Add(const RunResult& run) {
  const CaptureMatrix& m = *matrix_;
  const RunFills f = Fills(m, run);
  for (size_t c = 0; c < m.cells.size(); ++c) {
    if (m.cells[c].optional) continue;
    const int cell = static_cast<int>(c);
    const int64_t own = c < run.full_step.size() ? run.full_step[c] : -1;
    const int unfilled_others = f.unfilled - (own < 0 ? 1 : 0);
    // Latest fill among the other required cells.
    const int64_t others = only_cell_ ? 0 : (f.latest_cell == cell ? f.second : f.latest);
    const int64_t without = unfilled_others > 0 ? -1 : others;
    const int64_t relaxed_own =
        run.relaxed_full_step.size() > c ? run.relaxed_full_step[c] : own;
    const int64_t relaxed =
        (without < 0 || relaxed_own < 0) ? -1 : std::max(without, relaxed_own);
    optional_[c].Add(without);
    relaxed_[c].Add(relaxed);
  }
}

void SensitivityTally::Summarize(ForecastSummary* s) const {
  const CaptureMatrix& m = *matrix_;
  if (s->runs == 0) return;
  for (size_t c = 0; c < m.cells.size(); ++c) {
    CellForecast& cf = s->cells[c];
    if (m.cells[c].optional) {
      cf.saved_p50_if_optional = cf.saved_p80_if_optional = 0.0;
      cf.saved_p50_if_relaxed = cf.saved_p80_if_relaxed = 0.0;
      continue;
    }
    cf.saved_p50_if_optional = Saved(s->p50, optional_[c], 0.5);
    cf.saved_p80_if_optional = Saved(s->p80, optional_[c], 0.8);
    cf.saved_p50_if_relaxed = Saved(s->p50, relaxed_[c], 0.5);
    cf.saved_p80_if_relaxed = Saved(s->p80, relaxed_[c], 0.8);
  }
}

size_t SensitivityTally::MemoryBytes() const {
  size_t bytes = sizeof(*this);
  for (const ValueHistogram& h : optional_) bytes += h.MemoryBytes();
  for (const ValueHistogram& h : relaxed_) bytes += h.MemoryBytes();
  return bytes;
}

FillCurveTally::FillCurveTally(const CaptureMatrix& m, int64_t horizon_steps)
    : matrix_(&m),
      required_(RequiredCellCount(m)),
      weeks_((std::max<int64_t>(horizon_steps, 0) + kStepsPerWeek - 1) / kStepsPerWeek) {
  if (required_ > 0) {
    runs_by_full_.assign(static_cast<size_t>((weeks_ + 1) * (required_ + 1)), 0);
  }
}

void FillCurveTally::Add(const RunResult& run) {
  ++runs_;
  last_step_ = std::max(last_step_, run.simulated_steps);
  if (required_ == 0) return;
  const CaptureMatrix& m = *matrix_;
  fills_.clear();
  for (size_t c = 0; c < m.cells.size() && c < run.full_step.size(); ++c) {
    if (!m.cells[c].optional && run.full_step[c] >= 0) fills_.push_back(run.full_step[c]);
  }
  std::sort(fills_.begin(), fills_.end());
  size_t full = 0;  // cells full by the start of week w (fills at or before it)
  for (int64_t w = 0; w <= weeks_; ++w) {
    while (full < fills_.size() && fills_[full] <= w * kStepsPerWeek) ++full;
    ++runs_by_full_[static_cast<size_t>(w * (required_ + 1)) + full];
  }
}

void FillCurveTally::Summarize(ForecastSummary* s) const {
  if (runs_ == 0 || required_ == 0) return;
  const int64_t weeks =
      std::min(weeks_, (last_step_ + kStepsPerWeek - 1) / kStepsPerWeek);
  for (int64_t w = 0; w <= weeks; ++w) {
    const uint32_t* row = &runs_by_full_[static_cast<size_t>(w * (required_ + 1))];
    auto share_at = [&](long rank) -> std::optional<double> {
      long seen = 0;
      for (int k = 0; k <= required_; ++k) {
        seen += row[k];
        if (seen >= rank) return static_cast<double>(k) / required_;
      }
      return std::nullopt;
    };
    FillPoint point;
    point.week = static_cast<double>(w);
    point.p10 = EstimateQuantile(runs_, share_at, 0.1).value.value_or(0.0);
    point.p50 = EstimateQuantile(runs_, share_at, 0.5).value.value_or(0.0);
    point.p90 = EstimateQuantile(runs_, share_at, 0.9).value.value_or(0.0);
    s->fill_curve.push_back(point);
  }
}

size_t FillCurveTally::MemoryBytes() const {
  return sizeof(*this) + runs_by_full_.capacity() * sizeof(uint32_t) +
         fills_.capacity() * sizeof(int64_t);
}

}  // namespace planner
