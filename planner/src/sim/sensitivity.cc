#include <algorithm>
#include <limits>

#include "planner/calendar.h"
#include "sim/forecast_parts.h"

namespace planner {
namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();

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

double Weeks(int64_t step) { return step < 0 ? kInf : StepsToWeeks(step); }

std::optional<double> Saved(const QuantileEstimate& before,
                            const std::vector<double>& after, double p) {
  const QuantileEstimate q = EstimateQuantile(after, p);
  if (!before.value || !q.value) return std::nullopt;
  return *before.value - *q.value;
}

}  // namespace

void SummarizeSensitivity(const CaptureMatrix& m, const std::vector<RunResult>& runs,
                          ForecastSummary* s) {
  if (runs.empty()) return;
  std::vector<RunFills> fills;
  for (const RunResult& r : runs) fills.push_back(Fills(m, r));
  std::vector<double> optional_weeks(runs.size()), relaxed_weeks(runs.size());
  const bool only_cell = RequiredCellCount(m) == 1;  // without it nothing is needed
  for (size_t c = 0; c < m.cells.size(); ++c) {
    CellForecast& cf = s->cells[c];
    if (m.cells[c].optional) {
      cf.saved_p50_if_optional = cf.saved_p80_if_optional = 0.0;
      cf.saved_p50_if_relaxed = cf.saved_p80_if_relaxed = 0.0;
      continue;
    }
    const int cell = static_cast<int>(c);
    for (size_t i = 0; i < runs.size(); ++i) {
      const RunFills& f = fills[i];
      const int64_t own = c < runs[i].full_step.size() ? runs[i].full_step[c] : -1;
      const int unfilled_others = f.unfilled - (own < 0 ? 1 : 0);
      // Latest fill among the other required cells.
      const int64_t others =
          only_cell ? 0 : (f.latest_cell == cell ? f.second : f.latest);
      const int64_t without = unfilled_others > 0 ? -1 : others;
      const int64_t relaxed_own =
          runs[i].relaxed_full_step.size() > c ? runs[i].relaxed_full_step[c] : own;
      const int64_t relaxed =
          (without < 0 || relaxed_own < 0) ? -1 : std::max(without, relaxed_own);
      optional_weeks[i] = Weeks(without);
      relaxed_weeks[i] = Weeks(relaxed);
    }
    std::sort(optional_weeks.begin(), optional_weeks.end());
    std::sort(relaxed_weeks.begin(), relaxed_weeks.end());
    cf.saved_p50_if_optional = Saved(s->p50, optional_weeks, 0.5);
    cf.saved_p80_if_optional = Saved(s->p80, optional_weeks, 0.8);
    cf.saved_p50_if_relaxed = Saved(s->p50, relaxed_weeks, 0.5);
    cf.saved_p80_if_relaxed = Saved(s->p80, relaxed_weeks, 0.8);
  }
}

void SummarizeFillCurve(const CaptureMatrix& m, const std::vector<RunResult>& runs,
                        ForecastSummary* s) {
  const int required = RequiredCellCount(m);
  if (runs.empty() || required == 0) return;
  int64_t last_step = 0;
  std::vector<std::vector<int64_t>> fills(runs.size());
  for (size_t i = 0; i < runs.size(); ++i) {
    last_step = std::max(last_step, runs[i].simulated_steps);
    for (size_t c = 0; c < m.cells.size() && c < runs[i].full_step.size(); ++c) {
      if (!m.cells[c].optional && runs[i].full_step[c] >= 0) {
        fills[i].push_back(runs[i].full_step[c]);
      }
    }
    std::sort(fills[i].begin(), fills[i].end());
  }
  const int64_t weeks = (last_step + kStepsPerWeek - 1) / kStepsPerWeek;
  std::vector<double> shares(runs.size());
  for (int64_t w = 0; w <= weeks; ++w) {
    for (size_t i = 0; i < runs.size(); ++i) {
      const auto full =
          std::upper_bound(fills[i].begin(), fills[i].end(), w * kStepsPerWeek) -
          fills[i].begin();
      shares[i] = static_cast<double>(full) / required;
    }
    std::sort(shares.begin(), shares.end());
    FillPoint point;
    point.week = static_cast<double>(w);
    point.p10 = EstimateQuantile(shares, 0.1).value.value_or(0.0);
    point.p50 = EstimateQuantile(shares, 0.5).value.value_or(0.0);
    point.p90 = EstimateQuantile(shares, 0.9).value.value_or(0.0);
    s->fill_curve.push_back(point);
  }
}

}  // namespace planner
