// Reading the outages section of a plan (docs/plan.md#outages): the turbine's
// and the data acquisition's up and repair times, and planned outages.
#ifndef PLANNER_IO_OUTAGE_READER_H_
#define PLANNER_IO_OUTAGE_READER_H_

#include "io/yaml_fields.h"
#include "planner/plan.h"

namespace planner {
namespace io {

// Fills plan->turbine_outages, daq_outages, planned_outages and
// parked_counts_during_outage from `f` (the outages mapping).
void ReadOutages(const Field& f, Plan* plan);

}  // namespace io
}  // namespace planner

#endif  // PLANNER_IO_OUTAGE_READER_H_
