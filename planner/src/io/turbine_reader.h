// Reading the turbine section of a plan (docs/plan.md#turbine): its speeds,
// restart rule, shutdown rules on short-term averages and storm control.
#ifndef PLANNER_IO_TURBINE_READER_H_
#define PLANNER_IO_TURBINE_READER_H_

#include "io/yaml_fields.h"
#include "planner/plan.h"

namespace planner {
namespace io {

// The highest wind speed a plan may name, m/s.
inline constexpr double kMaxWindSpeedMs = 50.0;
// At most this many shutdown rules on short-term averages.
inline constexpr int kMaxShutdownRules = 8;

TurbineSpec ReadTurbine(const Field& f);

}  // namespace io
}  // namespace planner

#endif  // PLANNER_IO_TURBINE_READER_H_
