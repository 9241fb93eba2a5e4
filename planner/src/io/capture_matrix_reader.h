// Reading the capture_matrix section of a plan (docs/plan.md).
#ifndef PLANNER_IO_CAPTURE_MATRIX_READER_H_
#define PLANNER_IO_CAPTURE_MATRIX_READER_H_

#include "io/yaml_fields.h"
#include "planner/capture_matrix.h"
#include "planner/plan.h"

namespace planner {
namespace io {

// Builds the matrix from `f` (the capture_matrix mapping): the production
// grid first (wind-major, TI-minor), then the parked grid. Throws InputError
// for bad bins, overrides that match no cell, production cells outside the
// turbine's cut_in..cut_out range, and a matrix without a required cell.
CaptureMatrix ReadCaptureMatrix(const Field& f, const TurbineSpec& turbine);

}  // namespace io
}  // namespace planner

#endif  // PLANNER_IO_CAPTURE_MATRIX_READER_H_
