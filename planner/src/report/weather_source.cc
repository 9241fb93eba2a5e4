#include "planner/weather_source.h"

#include <filesystem>

#include "io/met_csv_reader.h"
#include "report/report_numbers.h"

namespace planner {
namespace {

std::string FileName(const std::string& path) {
  return std::filesystem::path(path).filename().string();
}

}  // namespace

std::string WeatherSourceText(const Plan& plan) {
  if (!plan.replay) {
    return "site model '" + plan.site.name +
           "' (parametric: Weibull per sector, persistence, seasons)";
  }
  const WeatherReplay& r = *plan.replay;
  std::string out = "replay of measured series '" + FileName(r.series_file) + "' (" +
                    FormatTimestamp(r.read.first_time_s, false) + " to " +
                    FormatTimestamp(r.read.last_time_s, false) + ", step " +
                    FormatStep(r.read.step_s) +
                    "): " + (r.options.block_days == 1 ? "whole days" : "whole weeks") +
                    " drawn within " + std::to_string(r.options.season_window_days) +
                    " days of the calendar date";
  if (r.options.speed_factor != 1.0)
    out += StringPrintf(", speeds x %.3g", r.options.speed_factor);
  if (r.records_per_day < 144) {
    out += "; each measured record stands for " +
           std::to_string(144 / r.records_per_day) +
           " ten-minute records, so their spread is understated";
  }
  return out;
}

nlohmann::json WeatherSourceJson(const Plan& plan) {
  if (!plan.replay) return {{"source", "site_model"}, {"site_model", plan.site_file}};
  const WeatherReplay& r = *plan.replay;
  return {{"source", "replay"},
          {"series", r.series_file},
          {"first", FormatTimestamp(r.read.first_time_s, true)},
          {"last", FormatTimestamp(r.read.last_time_s, true)},
          {"step_s", r.read.step_s},
          {"block_days", r.options.block_days},
          {"season_window_days", r.options.season_window_days},
          {"speed_factor", r.options.speed_factor},
          {"usable_blocks", r.usable_blocks},
          {"measured_ti", r.read.std_column.empty() ? false : true}};
}

}  // namespace planner
