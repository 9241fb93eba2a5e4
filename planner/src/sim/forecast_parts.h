// Parts of SummarizeForecast that read whole runs: what relaxing each cell
// buys, and the fill-over-time curve. Internal to the library.
#ifndef PLANNER_SIM_FORECAST_PARTS_H_
#define PLANNER_SIM_FORECAST_PARTS_H_

#include <vector>

#include "planner/forecast.h"

namespace planner {

// Fills CellForecast::saved_* from the same runs: each run's completion with
// the cell made optional is the latest fill of the other required cells; with
// its minimum relaxed, the later of that and the cell's relaxed fill.
void SummarizeSensitivity(const CaptureMatrix& matrix, const std::vector<RunResult>& runs,
                          ForecastSummary* s);

// Fills ForecastSummary::fill_curve: per week, P10/P50/P90 over the runs of the
// share of required cells full.
void SummarizeFillCurve(const CaptureMatrix& matrix, const std::vector<RunResult>& runs,
                        ForecastSummary* s);

}  // namespace planner

#endif  // PLANNER_SIM_FORECAST_PARTS_H_
