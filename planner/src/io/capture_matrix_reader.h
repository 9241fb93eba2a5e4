// Reading the capture_matrix section of a plan (docs/plan.md).
#ifndef PLANNER_IO_CAPTURE_MATRIX_READER_H_
#define PLANNER_IO_CAPTURE_MATRIX_READER_H_

#include "io/yaml_fields.h"
#include "planner/capture_matrix.h"
#include "planner/plan.h"

namespace planner {
namespace io {

// Builds the matrix from `f` (the capture_matrix mapping): the production
// grid first (wind-major, TI-minor), then the parked grid, the reduced grid,
// and last the event cells. Throws InputError for bad bins, overrides that
// match no cell, production or reduced cells outside the turbine's
// cut_in..cut_out range, reduced cells without a reduce rule, bad event cells
// (event_cell_reader.h), and a matrix without a required cell. Reads
// plan.turbine, plan.curtailment and plan.manual_tests, which must be read
// first.
CaptureMatrix ReadCaptureMatrix(const Field& f, const Plan& plan);

}  // namespace io
}  // namespace planner

#endif  // PLANNER_IO_CAPTURE_MATRIX_READER_H_
