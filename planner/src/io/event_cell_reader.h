// Reading capture_matrix.events (docs/plan.md#event-cells): cells that count
// transient events (start-ups, normal stops, manual tests) by wind speed.
#ifndef PLANNER_IO_EVENT_CELL_READER_H_
#define PLANNER_IO_EVENT_CELL_READER_H_

#include "io/yaml_fields.h"
#include "planner/capture_matrix.h"
#include "planner/plan.h"

namespace planner {
namespace io {

// Appends one cell per entry of `f` to matrix->cells (after the record cells)
// and the event types used to matrix->event_types, in first-seen order. An
// event names start_up, normal_stop or a test of plan.manual_tests; cells of
// one event type must not overlap in wind speed; a cell must be able to fill
// (a start-up lies in the production range, a test in its wind window).
void ReadEventCells(const Field& f, const Plan& plan, CaptureMatrix* matrix);

}  // namespace io
}  // namespace planner

#endif  // PLANNER_IO_EVENT_CELL_READER_H_
