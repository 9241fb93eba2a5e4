#include "sim/day_weather.h"

#include <algorithm>

#include "sim/ziggurat_normal.h"

namespace planner {
namespace {

// The two 16-bit decisions of a step's weather draw.
inline uint32_t KeepBits(uint64_t r) { return static_cast<uint32_t>(r >> 32) & 0xFFFFu; }
inline uint32_t QualityBits(uint64_t r) { return static_cast<uint32_t>(r >> 48); }

// A new draw of the sector (even of the same one) is a new direction in it,
// from step k of the day on. Both uniforms come from one 64-bit word.
[[gnu::noinline, gnu::cold]] void NewSector(const CompiledModel& m, uint64_t bits, int k,
                                            DirectionChange& change, WeatherState& ws) {
  change.k = k;
  change.sector = m.sector_chain.frequencies.Draw(HighUniform(bits));
  change.direction_u = LowUniform(bits);
  ws.sector_scale_ms = m.sector_scale_ms[change.sector];
  ws.transform = &m.speed_transform[change.sector];
}

// Replay: the measured record of `slot` from step k of the day on.
void ReplaySlot(const CompiledModel& m, int64_t slot, int k, DirectionChange* changes,
                int& count, WeatherState& ws) {
  const WeatherReplay& r = *m.replay;
  ws.replay_slot = slot;
  ws.replay_speed_ms = r.speed_ms[slot];
  ws.measured_log_ti = r.log_ti[slot];
  const float direction = r.direction_deg[slot];
  if (r.has_direction && direction != ws.replay_direction_deg) {
    ws.replay_direction_deg = direction;
    changes[count] = DirectionOfDegrees(m, direction);
    changes[count++].k = k;
  }
}

// Replay: the first measured day of the block that starts at simulated `day`,
// drawn uniformly from the pool of that day of the year.
int64_t DrawReplayBlock(const CompiledModel& m, int64_t day, Engine& e) {
  const std::vector<int32_t>& pool = m.replay->pool[m.day_of_year[day]];
  const auto pick = static_cast<size_t>(UniformDouble(e) * pool.size());
  return pool[std::min(pick, pool.size() - 1)];
}

}  // namespace

void FillWeather(const CompiledModel& m, double day_scale, DayWeather& w,
                 WeatherState& ws, Engine& weather) {
  Engine e = weather;  // a local copy stays in registers
  const uint32_t keep_threshold = m.keep_threshold;
  const uint32_t reject_threshold = m.reject_threshold;
  const LatentAr1 ar1 = m.wind_ar1;
  double z = ws.z;
  const SpeedTransform* transform = ws.transform;
  int changes = 0;
  for (int hour = 0, k = 0; hour < 24; ++hour) {
    const double hour_scale = day_scale * m.hourly_factors[hour];
    double speed_scale = ws.sector_scale_ms * hour_scale;
    for (int i = 0; i < kStepsPerHour; ++i, ++k) {
      const uint64_t r = e();
      if (KeepBits(r) >= keep_threshold) {
        NewSector(m, SplitMix64(r), k, w.changes[changes++], ws);
        speed_scale = ws.sector_scale_ms * hour_scale;
        transform = ws.transform;
      }
      z = ar1.Next(z, ZigguratNormal::FromWord(static_cast<uint32_t>(r)));
      w.speed_ms[k] = speed_scale * (*transform)(z);
      w.quality_ok[k] = QualityBits(r) >= reject_threshold;
    }
  }
  w.changes[changes] = DirectionChange();
  ws.z = z;
  weather = e;
}

void FillReplay(const CompiledModel& m, int64_t day, int64_t first_day, DayWeather& w,
                WeatherState& ws, Engine& weather, Engine& blocks) {
  const int64_t block_days = m.replay->options.block_days;
  const int64_t per_day = m.replay->records_per_day;
  if (day == first_day || day % block_days == 0)
    ws.block_start = DrawReplayBlock(m, day - day % block_days, blocks);
  const int64_t day_slot = (ws.block_start + day % block_days) * per_day;
  int changes = 0;
  for (int k = 0; k < kStepsPerDay; ++k) {
    const uint64_t r = weather();
    const int64_t slot = day_slot + k * per_day / kStepsPerDay;
    if (slot != ws.replay_slot) ReplaySlot(m, slot, k, w.changes, changes, ws);
    w.speed_ms[k] = ws.replay_speed_ms;
    w.measured_log_ti[k] = ws.measured_log_ti;
    w.quality_ok[k] = QualityBits(r) >= m.reject_threshold;
  }
  w.changes[changes] = DirectionChange();
}

DirectionChange DirectionOfDegrees(const CompiledModel& m, double direction_deg) {
  const int sectors = static_cast<int>(m.sector_scale_ms.size());
  const double shifted =
      std::fmod(direction_deg / m.sector_width_deg + 0.5 + 10.0 * sectors,
                static_cast<double>(sectors));
  DirectionChange d;
  d.sector = std::min(sectors - 1, static_cast<int>(shifted));
  d.direction_u = shifted - d.sector;
  return d;
}

}  // namespace planner
