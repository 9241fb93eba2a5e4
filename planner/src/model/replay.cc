#include "planner/replay.h"

#include <cmath>
#include <limits>

#include "planner/calendar.h"
#include "planner/error.h"

namespace planner {
namespace {

constexpr int64_t kSecondsPerDay = 86400;
constexpr double kMinTiSpeedMs = 0.5;  // below: TI is not meaningful
const char* const kMonths[] = {"Jan", "Feb", "Mar", "Apr", "May", "Jun",
                               "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"};
constexpr int kMonthStart[] = {0, 31, 59, 90, 120, 151, 181, 212, 243, 273, 304, 334};

int64_t FloorDiv(int64_t a, int64_t b) {
  return a / b - ((a % b != 0) && ((a < 0) != (b < 0)));
}

// Circular distance between two days of a 365-day year.
int YearDistance(int a, int b) {
  const int d = std::abs(a - b);
  return std::min(d, 365 - d);
}

}  // namespace

int DayOfYear365(int64_t days_since_epoch) {
  const Date d = CivilFromDays(days_since_epoch);
  const int day = std::min(d.day, d.month == 2 ? 28 : 31);
  return kMonthStart[d.month - 1] + day - 1;
}

std::vector<std::string> WeatherReplay::EmptyPoolDays() const {
  std::vector<std::string> out;
  for (int m = 0; m < 12; ++m) {
    const int end = m == 11 ? 365 : kMonthStart[m + 1];
    for (int doy = kMonthStart[m]; doy < end; ++doy) {
      if (pool[doy].empty())
        out.push_back(std::to_string(doy - kMonthStart[m] + 1) + " " + kMonths[m]);
    }
  }
  return out;
}

WeatherReplay BuildWeatherReplay(const MetSeries& series, const ReplayOptions& options) {
  WeatherReplay r;
  r.read = series.read;
  r.options = options;
  const std::string& file = series.read.file;
  const int64_t step_s = series.read.step_s;
  if (series.records.size() < 2 || step_s <= 0) {
    throw InputError(file + ": replay needs a measured series of at least two records");
  }
  if (step_s > kSecondsPerDay || kSecondsPerDay % step_s != 0) {
    throw InputError(file +
                     ": replay needs a step that divides a day (10 minutes, "
                     "hourly, daily...); the series' step is " +
                     std::to_string(step_s) + " s");
  }
  r.records_per_day = static_cast<int>(kSecondsPerDay / step_s);
  r.has_direction = !series.read.direction_column.empty();
  r.first_day = FloorDiv(series.records.front().time_s, kSecondsPerDay);
  const int64_t last_day = FloorDiv(series.records.back().time_s, kSecondsPerDay);
  r.days = last_day - r.first_day + 1;
  const size_t slots = static_cast<size_t>(r.days) * r.records_per_day;
  const float nan = std::numeric_limits<float>::quiet_NaN();
  r.speed_ms.assign(slots, nan);
  r.direction_deg.assign(slots, nan);
  r.log_ti.assign(slots, nan);
  r.measured.assign(slots, 0);
  for (const MetRecord& rec : series.records) {
    const int64_t offset = rec.time_s - r.first_day * kSecondsPerDay;
    if (offset % step_s != 0) continue;  // off the grid (reported by the reader)
    const size_t i = static_cast<size_t>(offset / step_s);
    if (i >= slots) continue;
    const double speed = rec.speed_ms * options.speed_factor;
    r.speed_ms[i] = static_cast<float>(speed);
    r.direction_deg[i] = static_cast<float>(rec.direction_deg);
    if (std::isfinite(rec.speed_std_ms) && rec.speed_std_ms > 0 &&
        rec.speed_ms >= kMinTiSpeedMs) {
      r.log_ti[i] = static_cast<float>(std::log(rec.speed_std_ms / rec.speed_ms));
    }
    r.measured[i] = 1;
  }
  // Gaps: repeat the last measured record (the first ones take the first).
  size_t first_measured = 0;
  while (!r.measured[first_measured]) ++first_measured;
  for (size_t i = 0; i < slots; ++i) {
    if (r.measured[i]) continue;
    const size_t from = i < first_measured ? first_measured : i - 1;
    r.speed_ms[i] = r.speed_ms[from];
    r.direction_deg[i] = r.direction_deg[from];
    r.log_ti[i] = r.log_ti[from];
  }
  // Usable block starts, and the pool of each day of the year.
  const int64_t block_slots = int64_t{options.block_days} * r.records_per_day;
  std::vector<int64_t> present(slots + 1, 0);  // prefix sums of measured
  for (size_t i = 0; i < slots; ++i) present[i + 1] = present[i] + r.measured[i];
  r.pool.assign(365, {});
  std::vector<int> start_doy;
  std::vector<int32_t> starts;
  for (int64_t d = 0; d + options.block_days <= r.days; ++d) {
    const int64_t from = d * r.records_per_day;
    const int64_t have = present[from + block_slots] - present[from];
    if (static_cast<double>(have) < options.min_coverage * block_slots) continue;
    starts.push_back(static_cast<int32_t>(d));
    start_doy.push_back(DayOfYear365(r.first_day + d));
  }
  r.usable_blocks = static_cast<int64_t>(starts.size());
  for (int doy = 0; doy < 365; ++doy) {
    for (size_t b = 0; b < starts.size(); ++b) {
      if (YearDistance(doy, start_doy[b]) <= options.season_window_days)
        r.pool[doy].push_back(starts[b]);
    }
  }
  return r;
}

}  // namespace planner
