// Fitting a site model (planner/site_model.h) to measured wind data.
//
// Input is a measured series: one record per time step from a met mast or a
// lidar (10-minute, hourly or daily means), read from CSV by
// planner/src/io/met_csv_reader.h, which reports every row it drops and why.
// FitSite() turns it into a SiteModel and a FitReport saying how each
// parameter was estimated and where the data are too thin for it. The user
// guide, with the estimators and their sources, is docs/fit-site.md.
//
// Estimators (details in docs/fit-site.md):
//  * Calms (speed below calm_ms) are kept: they count in the mean, the
//    monthly and hourly factors and the sector frequencies. In the Weibull
//    fit each calm is a left-censored record: only "below calm_ms" is used,
//    not its value (leaving calms out would bias k and A upwards).
//  * Month factors: mean speed per calendar month over the mean of the months,
//    day-weighted over a 365-day year as the site-model reader normalises
//    them. Hour-of-day factors likewise, only for sub-daily steps.
//  * Weibull A and k per sector: maximum likelihood on the speeds divided by
//    their month and hour factors (the simulation multiplies A by them again),
//    calms censored as above.
//    Goodness of fit: the Kolmogorov-Smirnov distance between the data's
//    empirical distribution and the fitted Weibull.
//  * Persistence tau: each speed is mapped to z = Phi^-1(F(v)) with its
//    sector's fitted Weibull; r = lag-L autocorrelation of z, tau = -L / ln r
//    (the normal-transform AR(1) of the simulation, inverted).
//  * TI table: mean and standard deviation of sigma_u / V per wind bin.
#ifndef PLANNER_SITE_FIT_H_
#define PLANNER_SITE_FIT_H_

#include <array>
#include <cstdint>
#include <string>
#include <vector>

#include "planner/site_model.h"
#include "planner/weibull.h"

namespace planner {

// Unit of the speed and standard-deviation columns.
enum class SpeedUnit {
  kAuto,             // read it from the column name, else from the file name
  kMetresPerSecond,  // m/s
  kKnots,            // 1 kn = 1852 m / 3600 s = 0.514444 m/s (exact by definition)
};

inline constexpr double kMetresPerSecondPerKnot = 1852.0 / 3600.0;

// "m/s", "knots" ("auto" for kAuto).
const char* SpeedUnitName(SpeedUnit unit);

// How to read a measured-data CSV. Empty column names mean "look for a usual
// name" (docs/fit-site.md lists them); an optional column that is not found
// is simply not used.
struct MetCsvOptions {
  std::string time_column;             // required; usual names: timestamp, time, date...
  std::string speed_column;            // required: mean wind speed of each record
  std::string std_column;              // optional: its standard deviation (for TI)
  std::string direction_column;        // optional: direction the wind comes from, deg
  SpeedUnit units = SpeedUnit::kAuto;  // of speed and std alike
  // Empty: messages name the fit-site flags (--speed, --units). A plan's
  // section (e.g. "weather"): they name its fields (weather.columns.speed,
  // weather.units).
  std::string field_prefix;
};

// One usable record of a measured series, in SI units.
struct MetRecord {
  // Seconds since 1970-01-01 00:00 of the timestamp as written (no time
  // zone: hours are whatever the file uses, ideally local standard time).
  int64_t time_s = 0;
  double speed_ms = 0.0;       // mean speed, >= 0 and <= kMaxSpeedMs
  double speed_std_ms = 0.0;   // standard deviation; NaN when not given or unusable
  double direction_deg = 0.0;  // [0, 360); NaN when there is no direction column
};

// A 10-minute mean above this is an instrument or logging error (the limit is
// ours; range checks of this kind are common practice in data screening).
inline constexpr double kMaxSpeedMs = 75.0;

// Why a row of the file was not used. Every dropped row has exactly one.
enum class DropReason {
  kBadTimestamp,          // not one of the accepted timestamp formats
  kCellCount,             // fewer or more cells than the header has
  kDuplicateIdentical,    // same timestamp as an earlier row, same values
  kDuplicateConflicting,  // same timestamp as an earlier row, other values
  kOutOfOrder,            // earlier than the row before it (file not sorted)
  kSpeedMissing,          // empty, NA, N/A, null or -
  kSpeedNaN,              // NaN (any case)
  kSpeedNonNumeric,       // text that is not a number
  kSpeedNegative,         // below 0
  kSpeedTooHigh,          // above kMaxSpeedMs (after unit conversion)
  kDirectionInvalid,      // direction column given but missing, not a number,
                          // or outside 0 to 360 degrees
};
inline constexpr int kDropReasonCount = 11;

// Short description for reports ("duplicate timestamp, other values").
const char* DropReasonText(DropReason reason);

// What the reader did with the file.
struct MetReadReport {
  std::string file;
  // Columns actually used ("" for an optional column that is not used).
  std::string time_column, speed_column, std_column, direction_column;
  SpeedUnit units = SpeedUnit::kMetresPerSecond;  // never kAuto once read
  std::string units_source;  // "declared with --units", "from the column name"...

  int64_t rows_read = 0;  // data rows (blank lines are not rows)
  int64_t rows_kept = 0;  // == records.size()
  std::array<int64_t, kDropReasonCount> dropped{};  // per DropReason
  // The first few dropped rows of each reason, "file:line: column 'x': ...".
  std::vector<std::string> examples;
  // Kept records whose standard deviation is missing, not a number, negative
  // or above kMaxSpeedMs: they are used for everything but the TI table.
  int64_t std_unusable = 0;

  // Time grid: the step is the most common spacing of consecutive timestamps
  // (over rows with a valid, new, in-order timestamp).
  int64_t step_s = 0;
  int64_t gaps = 0;           // places where one or more steps have no row
  int64_t missing_steps = 0;  // steps with no row, summed over the gaps
  int64_t off_grid = 0;       // kept records not a whole number of steps after
                              // the first (kept and used; a sign of an
                              // irregular step)
  int64_t first_time_s = 0, last_time_s = 0;  // of the kept records

  int64_t DroppedTotal() const;
};

struct MetSeries {
  std::vector<MetRecord> records;  // sorted by time, unique timestamps
  MetReadReport read;
};

// Options of the fit. The CLI flags of `fillcast fit-site` fill them.
struct SiteFitOptions {
  MetCsvOptions csv;
  int sectors = 12;        // direction sectors, 1 to 72 (1 when no direction)
  double calm_ms = 0.5;    // speeds below this are calms, m/s, above 0 and <= 3
  double ti_bin_ms = 1.0;  // width of the TI table's wind bins, m/s, 0.1 to 5
  int ti_min_count = 30;   // records a TI bin needs to enter the table, >= 2
  // Lag at which the persistence is measured, hours (rounded to whole steps,
  // at least one step). A day matches the synoptic time scale that storms and
  // calm spells have; at a 10-minute lag the short-term fluctuations would
  // dominate. 0.1 to 720 h. Default 24.
  double persistence_lag_h = 24.0;
  // IEC 61400-1 class used when the data give no standard deviation.
  std::string ti_class = "A";
  std::string name;         // site model name; required
  std::string description;  // free text; empty = a generated one
};

// The fit of one direction sector.
struct SectorFit {
  double from_deg = 0.0, to_deg = 0.0;  // clockwise, from may exceed to (north)
  int64_t n = 0;              // records at or above the calm threshold (observed)
  int64_t calms = 0;          // calm records in this sector (censored in the fit)
  double frequency = 0.0;     // (n + calms) / all kept records
  Weibull weibull;            // of the speeds divided by month and hour factors
  double se_scale_ms = 0.0;   // asymptotic standard errors (observed information)
  double se_shape = 0.0;      // for independent records; autocorrelated: larger
  double data_mean_ms = 0.0;  // sample mean of the sector's non-calm speeds
  double ks_distance = 0.0;   // sup |F_n - F| over all the sector's records
                              // (divided by their factors), 0 to 1
};

// One row of the fitted TI table, or a bin left out of it.
struct TiBinFit {
  double lo_ms = 0.0, hi_ms = 0.0;
  int64_t n = 0;
  double ti_mean = 0.0, ti_std = 0.0;  // fractions
  bool used = false;                   // false: too few records or implausible TI
};

struct FitReport {
  MetReadReport read;
  SiteModel site;  // the result, valid for the site-model reader

  int64_t records = 0;  // kept records used by the fit
  int64_t calms = 0;    // of which below the calm threshold (or exactly 0)
  double calm_ms = 0.0;
  double sample_mean_ms = 0.0;  // mean of all kept speeds, calms included
  double model_mean_ms = 0.0;   // SiteMeanSpeed(site)
  bool has_direction = false;
  std::vector<SectorFit> sectors;

  std::array<int64_t, 12> month_records{};  // records per calendar month
  bool hourly_fitted = false;               // false for steps of a day or more
  std::array<int64_t, 24> hour_records{};

  double persistence_lag_h = 0.0;  // lag actually used (whole steps)
  int64_t persistence_pairs = 0;   // record pairs exactly that lag apart
  double persistence_r = 0.0;      // their autocorrelation of z
  bool tau_fitted = false;         // false: default kept (too few pairs)

  bool sector_persistence_fitted = false;
  int64_t sector_pairs = 0;        // consecutive non-calm pairs one step apart
  double sector_stay_share = 0.0;  // share of them in the same sector

  bool ti_from_data = false;  // false: IEC model of options.ti_class
  std::vector<TiBinFit> ti_bins;

  // Things the user must know: parameters the data are too short for, poor
  // fits, defaults that were kept. Full sentences.
  std::vector<std::string> warnings;
  // How things were done where there was a choice (e.g. "daily data: no
  // hour-of-day factors"). Full sentences.
  std::vector<std::string> notes;
};

// Fits a site model to `series` (records sorted by time with unique
// timestamps and a known step, as LoadMetCsv returns them). Throws
// InputError (naming the option or the file) for invalid options, fewer than
// 2 records, a sector with fewer than 10 records above the calm threshold, or
// a result outside the site model's limits (e.g. A above 30 m/s, which usually
// means wrong units).
FitReport FitSite(const MetSeries& series, const SiteFitOptions& options);

}  // namespace planner

#endif  // PLANNER_SITE_FIT_H_
