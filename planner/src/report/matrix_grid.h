// The capture matrix drawn as grids for the HTML report: one grid per
// operating state, rows = wind-speed bins, columns = TI bins. Each cell is
// coloured by its probability of being full by the deadline
// (report/colour_scale.h) and shows its expected count at the deadline over
// its minimum, and that probability in percent. Optional cells carry a dashed
// inner border; the bottleneck cell (most often last to fill) a heavy outline.
#ifndef PLANNER_REPORT_MATRIX_GRID_H_
#define PLANNER_REPORT_MATRIX_GRID_H_

#include <string>

#include "planner/capture_matrix.h"
#include "planner/forecast.h"

namespace planner {

// Colour bar and the meaning of the cell text and borders.
std::string MatrixLegendSvg();

// One state's grid; cells are looked up in s.cells by matrix index.
std::string StateGridSvg(const CaptureMatrix& m, const StateGrid& g,
                         const ForecastSummary& s);

}  // namespace planner

#endif  // PLANNER_REPORT_MATRIX_GRID_H_
