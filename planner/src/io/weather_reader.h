// Reading the weather section of a plan (docs/plan.md#weather): the site
// model's parametric weather (the default) or a replay of a measured series.
#ifndef PLANNER_IO_WEATHER_READER_H_
#define PLANNER_IO_WEATHER_READER_H_

#include <string>

#include "io/yaml_fields.h"
#include "planner/plan.h"

namespace planner {
namespace io {

// Reads `f` into plan->replay (left null for source site_model). The series
// path is relative to base_dir (the plan's folder); the series is read with
// the measured-data CSV reader, and every day of the year must have a usable
// measured block within the season window.
void ReadWeather(const Field& f, const std::string& base_dir, Plan* plan);

}  // namespace io
}  // namespace planner

#endif  // PLANNER_IO_WEATHER_READER_H_
