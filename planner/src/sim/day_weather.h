// A day of a run's weather, made in a tight loop of its own before the
// turbine and the records of the day are worked out from it (the weather does
// not depend on the turbine or the records): the mean wind speed and the
// quality check of each 10-minute record, and the direction changes.
//
// Parametric weather (docs/methods.md): one 64-bit draw of the run's weather
// stream per step. Its low 32 bits make the wind speed's normal innovation
// (ZigguratNormal::FromWord), bits 32-47 decide whether the sector is drawn
// anew (SplitMix64 of the draw then supplies the new sector and the direction
// in it), bits 48-63 are the quality check's.
//
// Replayed weather: blocks of measured days (WeatherReplay), each drawn from
// its own stream; the weather stream still gives one draw per step, for the
// quality check alone.
#ifndef PLANNER_SIM_DAY_WEATHER_H_
#define PLANNER_SIM_DAY_WEATHER_H_

#include <cmath>
#include <cstdint>

#include "planner/calendar.h"
#include "planner/random_stream.h"
#include "sim/compiled_model.h"

namespace planner {

// The weather's own state between days.
struct WeatherState {
  double z = 0;  // latent wind-speed normal
  double sector_scale_ms = 0;
  const SpeedTransform* transform = nullptr;
  // Replay: the slot of the measured series in use, its speed and direction,
  // and its ln TI (NaN: none measured; TI then comes from the TI model).
  int64_t replay_slot = -1;
  double replay_speed_ms = 0;
  float replay_direction_deg = -1;
  double measured_log_ti = NAN;
  int64_t block_start = 0;  // replay: measured day of the current block's first day
};

// A new direction from step `k` of a day on.
struct DirectionChange {
  int k = kStepsPerDay;  // kStepsPerDay ends a day's list
  int sector = 0;
  double direction_u = 0;  // position within the sector, [0, 1)
};

struct DayWeather {
  double speed_ms[kStepsPerDay];
  bool quality_ok[kStepsPerDay];  // the record passes the quality check
  double measured_log_ti[kStepsPerDay];  // replay only (NaN: none measured)
  DirectionChange changes[kStepsPerDay + 1];  // in step order, then the end mark
};

// Uniforms in [0, 1) from the high and the low 32 bits of a draw.
inline double HighUniform(uint64_t r) { return static_cast<double>(r >> 32) * 0x1.0p-32; }
inline double LowUniform(uint64_t r) {
  return static_cast<double>(r & 0xFFFFFFFFULL) * 0x1.0p-32;
}

// A day of the parametric weather into w, advancing ws and the run's weather
// stream e. day_scale: the day's month factor times its campaign year's.
void FillWeather(const CompiledModel& m, double day_scale, DayWeather& w,
                 WeatherState& ws, Engine& e);

// A day of replayed weather (m.replay set): blocks of block_days from the
// plan's start, a new block drawn from `blocks` on the run's first day and at
// every block start; a step's measured record is the one that covers it.
void FillReplay(const CompiledModel& m, int64_t day, int64_t first_day, DayWeather& w,
                WeatherState& ws, Engine& weather, Engine& blocks);

// The sector and the position in it of a direction in degrees (k unset).
DirectionChange DirectionOfDegrees(const CompiledModel& m, double direction_deg);

}  // namespace planner

#endif  // PLANNER_SIM_DAY_WEATHER_H_
