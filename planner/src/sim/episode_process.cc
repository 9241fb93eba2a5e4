#include "sim/episode_process.h"

#include <cmath>

#include "planner/calendar.h"
#include "sim/ziggurat_normal.h"

namespace planner {
namespace {

// Mean days per month of the Gregorian calendar (February 28.2425).
constexpr std::array<double, 12> kMonthDays = {31, 28.2425, 31, 30, 31, 30,
                                               31, 31,      30, 31, 30, 31};

}  // namespace

EpisodeLaw MakeEpisodeLaw(const EpisodeModel& m) {
  EpisodeLaw law;
  for (int i = 0; i < 12; ++i) {
    law.starts_per_step[i] = m.starts_per_month[i] / (kMonthDays[i] * kStepsPerDay);
  }
  law.duration = DurationSampler(m.duration_law, m.mean_h * kStepsPerHour);
  law.stops_turbine = m.stops_turbine;
  law.invalidates_records = m.invalidates_records;
  return law;
}

EpisodeProcess::EpisodeProcess(const EpisodeLaw& law, Engine engine,
                               const uint8_t* day_month, int64_t days)
    : law_(law), engine_(engine), day_month_(day_month), days_(days) {
  next_change_ = NextStart(0.0);
}

double EpisodeProcess::NextStart(double from) {
  double hazard = -std::log1p(-UniformDouble(engine_));  // unit exponential
  for (int64_t day = static_cast<int64_t>(from) / kStepsPerDay; day < days_; ++day) {
    const double rate = law_.starts_per_step[day_month_[day]];
    const double day_end = static_cast<double>((day + 1) * kStepsPerDay);
    const double span = day_end - from;
    if (rate * span >= hazard) return from + hazard / rate;
    hazard -= rate * span;
    from = day_end;
  }
  return HUGE_VAL;
}

// One uniform and one normal per duration, whatever the law (as the outage
// processes), so that changing the law never shifts later draws.
void EpisodeProcess::Flip() {
  if (!in_) {
    in_ = true;
    const ZigguratNormal normal;
    const double u = UniformDouble(engine_);
    next_change_ += law_.duration.Draw(u, normal(engine_));
  } else {
    in_ = false;
    next_change_ = NextStart(next_change_);
  }
}

}  // namespace planner
