#include "planner/forecast.h"

#include <algorithm>
#include <limits>

#include "planner/forecast_accumulator.h"

namespace planner {
namespace {
constexpr double kInf = std::numeric_limits<double>::infinity();
}  // namespace

ForecastSummary SummarizeForecast(const CaptureMatrix& matrix, int64_t deadline_steps,
                                  int64_t horizon_steps,
                                  const std::vector<RunResult>& runs, uint64_t seed,
                                  double relaxed_share) {
  ForecastAccumulator acc(matrix, deadline_steps, horizon_steps, relaxed_share);
  for (const RunResult& r : runs) acc.Add(r);
  return acc.Summary(seed);
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
