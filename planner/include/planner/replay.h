// Replay of measured weather: a block bootstrap of whole days or weeks of a
// measured series that keeps the season (docs/methods.md, "Replay").
//
// Each block of the simulated campaign (days 0..b-1, b..2b-1, ... counted
// from the start, b = 1 or 7 days) takes the records of a block of b whole
// measured days, drawn uniformly from the measured blocks whose first day
// lies within +-window calendar days of the simulated block's first day (day
// of the year, circularly, Feb 29 counting as Feb 28). This is the moving
// block bootstrap (Kunsch 1989, Ann. Statist.; from memory) restricted to a
// seasonal window so that the annual cycle survives, as in seasonal block
// resampling of weather series. Within a block the measured days follow in
// order, so the diurnal cycle and the persistence up to the block length are
// those measured; between blocks it is broken.
#ifndef PLANNER_REPLAY_H_
#define PLANNER_REPLAY_H_

#include <cstdint>
#include <string>
#include <vector>

#include "planner/site_fit.h"

namespace planner {

struct ReplayOptions {
  int block_days = 7;           // 1 (day) or 7 (week)
  int season_window_days = 30;  // 0 to 182
  double speed_factor = 1.0;    // multiplies every measured speed (e.g. to hub height)
  // A measured block is usable when at least this share of its records is
  // present; missing records inside it repeat the last one before them.
  double min_coverage = 0.9;
};

// The measured series laid out for replay: per measured day (from the first
// record's day) a fixed number of records, gaps filled as above.
struct WeatherReplay {
  std::string series_file;  // as resolved from the plan
  MetReadReport read;       // what the CSV reader did (rows, drops, step)
  ReplayOptions options;

  int records_per_day = 0;  // 86400 s / the series' step
  // false: the series has no direction column; direction_deg is NaN and the
  // plan must not depend on the direction (full-circle valid sector, no
  // curtailment by direction).
  bool has_direction = true;
  int64_t days = 0;       // measured days covered (first to last record)
  int64_t first_day = 0;  // days since 1970-01-01 of the first record's day
  // Per record slot (days x records_per_day): speed in m/s (speed_factor
  // applied), direction in degrees, ln TI (NaN where the series has no
  // usable standard deviation or the speed is below 0.5 m/s), and whether the
  // slot held a measured record (false: filled).
  std::vector<float> speed_ms, direction_deg, log_ti;
  std::vector<uint8_t> measured;
  // Per day of a 365-day year (0 = 1 Jan; 29 Feb counts as 28 Feb): the
  // measured days (index from first_day) where a usable block may start.
  std::vector<std::vector<int32_t>> pool;
  int64_t usable_blocks = 0;  // distinct usable block starts

  // Days of the year with an empty pool, as "14 Feb" strings (for messages).
  std::vector<std::string> EmptyPoolDays() const;
};

// Day of a 365-day year, 0 = 1 January, for days since 1970-01-01.
int DayOfYear365(int64_t days_since_epoch);

// Builds the replay tables. The series must have a step that divides a day
// (10 minutes, hourly, daily...); throws InputError
// naming `series.read.file` otherwise. Empty pools are not an error here (the
// plan reader reports them against the plan's fields).
WeatherReplay BuildWeatherReplay(const MetSeries& series, const ReplayOptions& options);

}  // namespace planner

#endif  // PLANNER_REPLAY_H_
