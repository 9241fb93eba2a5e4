#include "io/weather_reader.h"

#include <filesystem>
#include <memory>

#include "io/met_csv_reader.h"
#include "planner/error.h"
#include "planner/replay.h"

namespace planner {
namespace io {
namespace {

namespace fs = std::filesystem;

const std::vector<std::string> kSourceFields = {"source"};
const std::vector<std::string> kReplayFields = {
    "source",      "series", "columns", "units", "block", "season_window_days",
    "speed_factor"};
const std::vector<std::string> kWeatherFields = kReplayFields;
const std::vector<std::string> kColumnFields = {"time", "speed", "std", "direction"};

SpeedUnit ReadUnits(const FieldMap& m) {
  const std::optional<Field> f = m.Find("units");
  if (!f) return SpeedUnit::kAuto;
  const std::string text = AsText(*f);
  if (text == "auto") return SpeedUnit::kAuto;
  if (text == "ms") return SpeedUnit::kMetresPerSecond;
  if (text == "knots") return SpeedUnit::kKnots;
  Fail(*f, "'" + text + "' is not a unit; expected auto, ms or knots");
}

int ReadBlockDays(const FieldMap& m) {
  const std::optional<Field> f = m.Find("block");
  if (!f) return 7;
  const std::string text = AsText(*f);
  if (text == "week") return 7;
  if (text == "day") return 1;
  Fail(*f, "'" + text + "' is not a block length; expected day or week");
}

std::string ResolveSeries(const Field& f, const std::string& base_dir) {
  const std::string given = AsText(f);
  if (given.empty()) Fail(f, "is empty; give the path of a measured-data CSV file");
  const fs::path resolved = base_dir.empty()
                                ? fs::path(given)
                                : (fs::path(base_dir) / given).lexically_normal();
  std::error_code ec;
  if (!fs::is_regular_file(resolved, ec)) {
    Fail(f, "'" + given + "' is not a file (looked for '" + resolved.string() +
                "'); give a path relative to the plan's folder");
  }
  return resolved.string();
}

// "14 Feb, 15 Feb, ... (40 days)".
std::string DayList(const std::vector<std::string>& days) {
  std::string out;
  for (size_t i = 0; i < days.size() && i < 3; ++i) out += (i ? ", " : "") + days[i];
  if (days.size() > 3)
    out += ", ... (" + std::to_string(days.size()) + " days of the year)";
  return out;
}

// A series without directions can stand only for a plan in which nothing
// depends on the direction.
void RequireNoDirection(const Plan& plan, const Field& series) {
  const bool full_circle = plan.valid_sectors.size() == 1 &&
                           plan.valid_sectors[0].from_deg == 0.0 &&
                           plan.valid_sectors[0].to_deg == 360.0;
  bool by_direction = false;
  for (const CurtailmentRule& c : plan.curtailment)
    by_direction = by_direction || !c.directions.empty();
  if (full_circle && !by_direction) return;
  Fail(series, "'" + AsText(series) + "' has no direction column, but the plan's " +
                   (full_circle ? std::string("curtailment depends on the direction")
                                : std::string("valid measurement sectors do not cover "
                                              "the full circle")) +
                   "; name the direction column with weather.columns.direction");
}

}  // namespace

void ReadWeather(const Field& f, const std::string& base_dir, Plan* plan) {
  const std::string peeked = PeekText(f, "source");
  const bool replay = peeked == "replay";
  const FieldMap m(f, peeked == "site_model" ? kSourceFields : kWeatherFields,
                   peeked == "site_model" || replay ? "for source '" + peeked + "'" : "");
  const Field source = m.Get("source");
  const std::string name = AsText(source);
  if (name == "site_model") return;
  if (!replay) {
    Fail(source, "'" + name + "' is not a weather source; expected site_model or replay");
  }
  MetCsvOptions csv;
  csv.field_prefix = "weather";
  if (const auto c = m.Find("columns")) {
    const FieldMap cm(*c, kColumnFields);
    csv.time_column = ReadText(cm, "time", "");
    csv.speed_column = ReadText(cm, "speed", "");
    csv.std_column = ReadText(cm, "std", "");
    csv.direction_column = ReadText(cm, "direction", "");
  }
  csv.units = ReadUnits(m);
  ReplayOptions options;
  options.block_days = ReadBlockDays(m);
  options.season_window_days =
      ReadWholeNumber(m, "season_window_days", Interval("[]", 0, 182, "days"), 30);
  options.speed_factor = ReadNumber(m, "speed_factor", Interval("[]", 0.5, 2.0), 1.0);
  const Field series_field = m.Get("series");
  const std::string path = ResolveSeries(series_field, base_dir);
  auto built =
      std::make_shared<WeatherReplay>(BuildWeatherReplay(LoadMetCsv(path, csv), options));
  built->series_file = path;
  if (!built->has_direction) RequireNoDirection(*plan, series_field);
  const std::vector<std::string> empty = built->EmptyPoolDays();
  if (!empty.empty()) {
    const std::optional<Field> window = m.Find("season_window_days");
    const Field at = window ? *window : series_field;
    Fail(at, "no usable " + std::to_string(options.block_days) + "-day block of '" +
                 AsText(series_field) + "' starts within " +
                 std::to_string(options.season_window_days) + " days of " +
                 DayList(empty) + "; the series runs from " +
                 FormatTimestamp(built->read.first_time_s, false) + " to " +
                 FormatTimestamp(built->read.last_time_s, false) + " with " +
                 std::to_string(built->usable_blocks) +
                 " usable blocks (at least 90 % of their records present). Widen "
                 "season_window_days (at most 182), use block: day, or give a longer "
                 "series");
  }
  plan->replay = std::move(built);
}

}  // namespace io
}  // namespace planner
