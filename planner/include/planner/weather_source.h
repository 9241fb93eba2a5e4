// Where a forecast's weather came from, said the same way in every report:
// the site model's parametric weather, or a replay of a measured series.
#ifndef PLANNER_WEATHER_SOURCE_H_
#define PLANNER_WEATHER_SOURCE_H_

#include <nlohmann/json.hpp>
#include <string>

#include "planner/plan.h"

namespace planner {

// One sentence, e.g. "site model 'Coastal ridge' (parametric: Weibull per
// sector, persistence, seasons)" or "replay of measured series 'mast.csv'
// (2019-01-01 to 2021-12-31, 10-minute records): 7-day blocks drawn within
// 30 days of the calendar date".
std::string WeatherSourceText(const Plan& plan);

// The JSON object of the `weather` key (docs/output.md).
nlohmann::json WeatherSourceJson(const Plan& plan);

}  // namespace planner

#endif  // PLANNER_WEATHER_SOURCE_H_
