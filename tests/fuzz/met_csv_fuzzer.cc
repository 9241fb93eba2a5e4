// Fuzz target: the measured-data CSV reader (ReadMetCsv) and, when the file
// reads, the site fit that fit-site runs on it (FitSite). The first input
// byte picks the options (units, file name for the unit hint, sectors, calm
// threshold, TI bin width), the rest is the file.
#include <cstdlib>
#include <sstream>

#include "fuzz_common.h"
#include "io/met_csv_reader.h"
#include "planner/error.h"
#include "planner/site_fit.h"

namespace {

planner::SiteFitOptions OptionsFrom(uint8_t b, std::string* file_name) {
  static const char* const kFiles[] = {"mast.csv", "mast_knots.csv", "mast-ms.csv",
                                       "wind.csv"};
  static const planner::SpeedUnit kUnits[] = {
      planner::SpeedUnit::kAuto, planner::SpeedUnit::kMetresPerSecond,
      planner::SpeedUnit::kKnots, planner::SpeedUnit::kAuto};
  static const int kSectors[] = {12, 1, 4, 36};
  planner::SiteFitOptions o;
  *file_name = kFiles[b & 3];
  o.csv.units = kUnits[(b >> 2) & 3];
  o.sectors = kSectors[(b >> 4) & 3];
  o.calm_ms = (b & 0x40) ? 0.5 : 3.0;
  o.ti_bin_ms = (b & 0x80) ? 1.0 : 0.1;
  o.ti_min_count = 2;
  o.persistence_lag_h = 24;
  o.name = "Fuzzed site";
  return o;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const uint8_t* data, size_t size) {
  if (size == 0) return 0;
  std::string file_name;
  const planner::SiteFitOptions options = OptionsFrom(data[0], &file_name);
  std::istringstream in(fillcast_fuzz::AsText(data + 1, size - 1));
  planner::MetSeries series;
  try {
    series = planner::ReadMetCsv(in, file_name, options.csv);
  } catch (const planner::InputError&) {
    return 0;  // bad input, reported as such: the expected outcome
  }
  if (series.records.size() < 2) std::abort();  // the reader promises two
  if (series.read.rows_kept != static_cast<int64_t>(series.records.size())) std::abort();
  try {
    planner::FitSite(series, options);
  } catch (const planner::InputError&) {
    // e.g. too few records in a sector: reported as such.
  }
  return 0;
}
