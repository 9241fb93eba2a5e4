// Parts of ForecastAccumulator that read a whole run at a time: what relaxing
// each cell buys, and the fill-over-time curve. Internal to the library.
#ifndef PLANNER_SIM_FORECAST_PARTS_H_
#define PLANNER_SIM_FORECAST_PARTS_H_

#include <cstdint>
#include <vector>

#include "planner/forecast.h"
#include "sim/value_histogram.h"

namespace planner {

// CellForecast::saved_*: per required cell, the completion step of each run
// with the cell made optional (the latest fill of the other required cells)
// and with its minimum relaxed (the later of that and the cell's relaxed
// fill), as histograms of max_buckets each.
class SensitivityTally {
 public:
  SensitivityTally(const CaptureMatrix& matrix, size_t max_buckets);
  void Add(const RunResult& run);
  // Fills s->cells[*].saved_* (s->p50 and s->p80 must be set).
  void Summarize(ForecastSummary* s) const;
  size_t MemoryBytes() const;

 private:
  const CaptureMatrix* matrix_;
  bool only_cell_;  // one required cell: without it nothing is needed
  std::vector<ValueHistogram> optional_, relaxed_;  // per cell (empty if optional)
};

// ForecastSummary::fill_curve: per week from 0 to the horizon, how many runs
// had 0, 1, ... required cells full at the week's start (exact counts).
class FillCurveTally {
 public:
  FillCurveTally(const CaptureMatrix& matrix, int64_t horizon_steps);
  void Add(const RunResult& run);
  // Fills s->fill_curve: weeks 0 to the last simulated week.
  void Summarize(ForecastSummary* s) const;
  size_t MemoryBytes() const;

 private:
  const CaptureMatrix* matrix_;
  int required_;
  int64_t weeks_;  // rows - 1
  long runs_ = 0;
  int64_t last_step_ = 0;
  std::vector<uint32_t> runs_by_full_;  // [week * (required_ + 1) + cells full]
  std::vector<int64_t> fills_;          // scratch for one run
};

}  // namespace planner

#endif  // PLANNER_SIM_FORECAST_PARTS_H_
