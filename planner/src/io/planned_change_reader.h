// Reading the planned_changes section of a plan (docs/plan.md#planned_changes):
// changes on a date that reset the counts of the cells they name.
#ifndef PLANNER_IO_PLANNED_CHANGE_READER_H_
#define PLANNER_IO_PLANNED_CHANGE_READER_H_

#include <vector>

#include "io/yaml_fields.h"
#include "planner/plan.h"

namespace planner {
namespace io {

// The changes of `f` (a non-empty list), sorted by date. Needs the plan's
// campaign and capture matrix read before.
std::vector<PlannedChange> ReadPlannedChanges(const Field& f, const Plan& plan);

}  // namespace io
}  // namespace planner

#endif  // PLANNER_IO_PLANNED_CHANGE_READER_H_
