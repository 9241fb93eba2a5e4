// The summary of many runs built one run at a time: each run is folded in and
// can then be discarded, so memory does not grow with the number of runs
// (docs/performance.md, "Memory"). SummarizeForecast (planner/forecast.h) is
// this accumulator fed from a vector.
//
// What is exact and what is within what (docs/methods.md, "Summarising the
// runs"):
//  - Completion: counts of runs per completion step (a whole number of
//    records up to the horizon), so the mean, the quantiles P10..P90 and
//    their order-statistic confidence intervals (planner/quantile.h), the
//    shares by the deadline and at the horizon and the completion curve are
//    exact, whatever the number of runs.
//  - Per cell (counts at the deadline, weeks to full, what relaxing it saves):
//    exact while a cell has seen at most
//    kCellBuckets distinct values (always for up to kCellBuckets runs). Past
//    that, values share buckets of 2, 4, ... records or steps, and a
//    quantile is the middle of its bucket: within (width - 1) / 2 of the
//    exact one. With kCellBuckets = 16,384 and at most 1,040 weeks
//    (1,048,320 steps) of horizon, the width is at most 64 steps, so a
//    weeks figure is within 0.031 week (printed to 0.1) and a count within
//    31.5 records (only for cells whose counts spread over more than 16,384
//    values).
//  - Shares (probabilities), means of counts and the fill curve (runs per
//    number of required cells full, week by week): exact.
// Runs must be added in run order for floating-point sums to repeat exactly
// (same seed, same answer for any thread count).
#ifndef PLANNER_FORECAST_ACCUMULATOR_H_
#define PLANNER_FORECAST_ACCUMULATOR_H_

#include <cstddef>
#include <cstdint>
#include <memory>

#include "planner/capture_matrix.h"
#include "planner/forecast.h"
#include "planner/simulation.h"

namespace planner {

class ForecastAccumulator {
 public:
  // Most distinct values a per-cell distribution keeps before it merges
  // neighbours (see above).
  static constexpr size_t kCellBuckets = 16384;

  // matrix must outlive the accumulator. 0 < relaxed_share <= 1 (see
  // CellForecast::saved_*_if_relaxed).
  ForecastAccumulator(const CaptureMatrix& matrix, int64_t deadline_steps,
                      int64_t horizon_steps, double relaxed_share = 0.8);
  ~ForecastAccumulator();
  ForecastAccumulator(ForecastAccumulator&&) noexcept;
  ForecastAccumulator& operator=(ForecastAccumulator&&) noexcept;

  // Folds one run in. Runs shorter than the matrix (should not happen) count
  // as empty cells.
  void Add(const RunResult& run);

  long runs() const;

  // The summary of the runs added so far.
  ForecastSummary Summary(uint64_t seed) const;

  // Bytes held now. Never more than
  //   16 x (horizon_steps + 1025) for the completion counts
  // + 4 x 16 x (kCellBuckets + 1024) per cell
  // + 4 x (horizon weeks + 2) x (required cells + 1) for the fill curve
  // plus a few hundred bytes per cell, whatever the number of runs.
  size_t MemoryBytes() const;

 private:
  struct State;
  std::unique_ptr<State> state_;
};

}  // namespace planner

#endif  // PLANNER_FORECAST_ACCUMULATOR_H_
