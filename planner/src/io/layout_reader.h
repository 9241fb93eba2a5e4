// Reading the layout section of a plan (docs/plan.md#layout): the turbine
// under test's position, neighbouring turbines, obstacles and manual
// exclusions, from which the valid measurement sectors follow
// (planner/disturbed_sector.h).
#ifndef PLANNER_IO_LAYOUT_READER_H_
#define PLANNER_IO_LAYOUT_READER_H_

#include "io/yaml_fields.h"
#include "planner/plan.h"

namespace planner {
namespace io {

// Fills plan->layout and replaces plan->valid_sectors (as read from
// valid_sectors_deg, or the full circle) by what the layout leaves of them.
// `sectors_given` says whether valid_sectors_deg was written (for messages).
// plan->turbine must be read already (name and rotor diameter of the turbine
// under test). Throws InputError at `f` if nothing is left.
void ReadLayout(const Field& f, bool sectors_given, Plan* plan);

}  // namespace io
}  // namespace planner

#endif  // PLANNER_IO_LAYOUT_READER_H_
