#include "planner/site_fit.h"

#include <algorithm>
#include <boost/math/distributions/normal.hpp>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <map>

#include "model/weibull_fit.h"
#include "planner/calendar.h"
#include "planner/error.h"
#include "planner/turbulence.h"

namespace planner {
namespace {

constexpr int kDaysInMonth[12] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
const char* const kMonthNames[12] = {"Jan", "Feb", "Mar", "Apr", "May", "Jun",
                                     "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"};
constexpr int64_t kSecondsPerDay = 86400;
constexpr double kStepSeconds = 600.0;  // the simulation's 10-minute step
// Below this many records above the calm threshold a sector is not fitted.
constexpr int64_t kMinSectorRecords = 10;
// Below this the standard error of k exceeds 5 % even for independent
// records (sqrt(0.608 / 250) = 0.049).
constexpr int64_t kFewSectorRecords = 250;
constexpr double kPoorFitKs = 0.05;  // our rule of thumb, docs/fit-site.md
// Kolmogorov distribution's 5 % critical value times sqrt(n) (from memory).
constexpr double kKolmogorov5Pct = 1.36;
constexpr double kFewMonthDays = 28.0;  // less than four weeks of a month
// Below this many years the month factors absorb enough of the weather to
// bias k and tau noticeably (docs/fit-site.md).
constexpr double kFewYears = 3.0;
constexpr int64_t kFewHourRecords = 30;
constexpr int64_t kMinPairs = 30;   // below: a parameter is not fitted
constexpr int64_t kFewPairs = 100;  // below: fitted, with a warning
constexpr double kMaxPersistenceH = 8760.0;
constexpr double kMaxSectorPersistence = 0.9999;
constexpr double kMinLatentP = 1e-9;  // z = Phi^-1(p) stays within about +-6

std::string Num(double x, const char* format = "%g") {
  char buf[40];
  std::snprintf(buf, sizeof buf, format, x);
  return buf;
}

std::string Fixed(double x, int decimals) {
  char buf[40];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, x);
  return buf;
}

[[noreturn]] void FailOption(const std::string& option, const std::string& message) {
  ThrowAt(SourceLocation{}, option, message);
}

void CheckRange(const char* option, double x, double lo, double hi, const char* unit) {
  if (!(x >= lo && x <= hi)) {
    FailOption(option, Num(x) + " is out of range; must be at least " + Num(lo) +
                           " and at most " + Num(hi) + unit);
  }
}

void ValidateOptions(const SiteFitOptions& o) {
  CheckRange("--sectors", o.sectors, 1, 72, "");
  if (!(o.calm_ms > 0.0 && o.calm_ms <= 3.0)) {
    FailOption("--calm-ms",
               Num(o.calm_ms) + " is out of range; must be above 0 and at most 3 m/s");
  }
  CheckRange("--ti-bin-ms", o.ti_bin_ms, 0.1, 5.0, " m/s");
  if (o.ti_min_count < 2) {
    FailOption("--ti-min-count",
               std::to_string(o.ti_min_count) + " is out of range; must be at least 2");
  }
  CheckRange("--persistence-lag-h", o.persistence_lag_h, 0.1, 720.0, " h");
  if (!(IecReferenceIntensity(o.ti_class) > 0.0)) {
    FailOption("--ti-class",
               "'" + o.ti_class +
                   "' is not an IEC 61400-1 turbulence class; valid: A+, A, B, C");
  }
  if (o.name.empty()) FailOption("--name", "is empty; give the site model a name");
}

// Per record: calendar month, hour of day, sector and whether it is calm.
struct RecordInfo {
  int month = 0;  // 0..11
  int hour = 0;   // 0..23
  int sector = 0;
  bool calm = false;
};

int SectorOf(double direction_deg, int sectors) {
  const double width = 360.0 / sectors;
  const int i = static_cast<int>(std::floor((direction_deg + 0.5 * width) / width));
  return i % sectors;
}

std::vector<RecordInfo> Classify(const MetSeries& series, int sectors, double calm_ms) {
  std::vector<RecordInfo> info;
  info.reserve(series.records.size());
  for (const MetRecord& r : series.records) {
    RecordInfo i;
    int64_t days = r.time_s / kSecondsPerDay;
    if (r.time_s % kSecondsPerDay < 0) --days;
    i.month = CivilFromDays(days).month - 1;
    i.hour = static_cast<int>((r.time_s - days * kSecondsPerDay) / 3600);
    i.sector = std::isnan(r.direction_deg) ? 0 : SectorOf(r.direction_deg, sectors);
    i.calm = r.speed_ms < calm_ms;  // calm_ms > 0, so a speed of 0 is a calm
    info.push_back(i);
  }
  return info;
}

std::string SectorLabel(const FitReport& report, std::size_t s) {
  if (report.sectors.size() == 1) return "all directions";
  const SectorFit& f = report.sectors[s];
  return "sector " + std::to_string(s) + " (" + Num(f.from_deg) + "-" + Num(f.to_deg) +
         " deg)";
}

// Month factors: mean speed per calendar month over the day-weighted mean of
// the monthly means, then normalised exactly as the site-model reader does.
void FitMonthly(const MetSeries& series, const std::vector<RecordInfo>& info,
                FitReport* report) {
  std::array<double, 12> sum{};
  for (std::size_t i = 0; i < info.size(); ++i) {
    sum[info[i].month] += series.records[i].speed_ms;
    ++report->month_records[info[i].month];
  }
  double weighted = 0.0, days = 0.0;
  for (int m = 0; m < 12; ++m) {
    if (report->month_records[m] == 0) continue;
    weighted += kDaysInMonth[m] * sum[m] / report->month_records[m];
    days += kDaysInMonth[m];
  }
  std::array<double, 12>& f = report->site.monthly_factors;
  std::string missing, thin;
  for (int m = 0; m < 12; ++m) {
    const int64_t n = report->month_records[m];
    f[m] = n == 0 ? 1.0 : (sum[m] / n) / (weighted / days);
    const double covered_days =
        static_cast<double>(n * report->read.step_s) / kSecondsPerDay;
    if (n == 0) {
      missing += (missing.empty() ? "" : ", ") + std::string(kMonthNames[m]);
    } else if (covered_days < kFewMonthDays) {
      thin += (thin.empty() ? "" : ", ") + std::string(kMonthNames[m]) + " (" +
              Fixed(covered_days, 1) + " days)";
    }
  }
  double norm = 0.0;
  for (int m = 0; m < 12; ++m) norm += kDaysInMonth[m] * f[m] / 365.0;
  for (double& x : f) x /= norm;
  if (!missing.empty()) {
    report->warnings.push_back("Monthly factors: no data for " + missing +
                               "; their factors are set to 1.");
  }
  if (!thin.empty()) {
    report->warnings.push_back("Monthly factors: less than four weeks of data for " +
                               thin + "; those factors are uncertain.");
  }
  const MetReadReport& d = report->read;
  const double years = static_cast<double>(d.last_time_s - d.first_time_s + d.step_s) /
                       (365.0 * kSecondsPerDay);
  if (years < kFewYears) {
    report->warnings.push_back(
        "Monthly factors from " + Fixed(years, 1) +
        " years of data also hold that period's month-to-month weather: k comes out high "
        "and wind_persistence_h short (with one year of hourly data, tau = 30 h and k = "
        "2.1: k by 4 to 5 % and tau by 13 to 16 % in our simulations; "
        "docs/fit-site.md).");
  }
}

// Hour-of-day factors on the speeds with the month taken out; only for steps
// shorter than a day.
void FitHourly(const MetSeries& series, const std::vector<RecordInfo>& info,
               FitReport* report) {
  std::array<double, 24>& f = report->site.hourly_factors;
  f.fill(1.0);
  if (report->read.step_s >= kSecondsPerDay) {
    report->notes.push_back(
        "The step is a day or more: no hour-of-day factors can be fitted; they are all "
        "1.");
    return;
  }
  report->hourly_fitted = true;
  std::array<double, 24> sum{};
  for (std::size_t i = 0; i < info.size(); ++i) {
    sum[info[i].hour] +=
        series.records[i].speed_ms / report->site.monthly_factors[info[i].month];
    ++report->hour_records[info[i].hour];
  }
  double mean_of_means = 0.0;
  int hours = 0;
  for (int h = 0; h < 24; ++h) {
    if (report->hour_records[h] == 0) continue;
    mean_of_means += sum[h] / report->hour_records[h];
    ++hours;
  }
  mean_of_means /= hours;
  std::string thin;
  for (int h = 0; h < 24; ++h) {
    const int64_t n = report->hour_records[h];
    f[h] = n == 0 ? 1.0 : sum[h] / n / mean_of_means;
    if (n < kFewHourRecords) thin += (thin.empty() ? "" : ", ") + Num(h, "%02.0f");
  }
  double total = 0.0;
  for (double x : f) total += x;
  for (double& x : f) x *= 24.0 / total;
  if (!thin.empty()) {
    report->warnings.push_back("Hour-of-day factors: fewer than " +
                               std::to_string(kFewHourRecords) + " records for hours " +
                               thin + "; those factors are uncertain (no data: 1).");
  }
}

// The factor the simulation puts on A for record i.
double SeasonFactor(const FitReport& report, const RecordInfo& info) {
  return report.site.monthly_factors[info.month] * report.site.hourly_factors[info.hour];
}

void FitSectors(const MetSeries& series, const std::vector<RecordInfo>& info, int sectors,
                double calm_ms, FitReport* report) {
  // Per sector: observed speeds and calm thresholds, both divided by the
  // record's season factor, and every record's value for the KS distance.
  std::vector<std::vector<double>> observed(sectors), below(sectors), all(sectors);
  std::vector<double> raw_sum(sectors, 0.0);
  report->sectors.assign(sectors, SectorFit{});
  for (std::size_t i = 0; i < info.size(); ++i) {
    const int s = info[i].sector;
    const double season = SeasonFactor(*report, info[i]);
    const double v = series.records[i].speed_ms;
    all[s].push_back(v / season);
    if (info[i].calm) {
      ++report->sectors[s].calms;
      below[s].push_back(calm_ms / season);
    } else {
      observed[s].push_back(v / season);
      raw_sum[s] += v;
    }
  }
  const double width = 360.0 / sectors;
  const SourceLocation where{series.read.file, 0, 0};
  for (int s = 0; s < sectors; ++s) {
    SectorFit& f = report->sectors[s];
    f.from_deg = sectors == 1 ? 0.0 : std::fmod(s * width - 0.5 * width + 360.0, 360.0);
    f.to_deg = sectors == 1 ? 360.0 : s * width + 0.5 * width;
    f.n = static_cast<int64_t>(observed[s].size());
    const std::string label = SectorLabel(*report, s);
    if (f.n < kMinSectorRecords) {
      ThrowAt(
          where, "",
          label + " has " + std::to_string(f.n) +
              " records above the calm threshold; at least " +
              std::to_string(kMinSectorRecords) +
              " are needed to fit a Weibull; use fewer sectors (--sectors) or more data");
    }
    if (!CanFitWeibull(observed[s], below[s])) {
      ThrowAt(
          where, "",
          label + ": all " + std::to_string(f.n) +
              " speeds above the calm threshold are equal; a Weibull cannot be fitted");
    }
    const WeibullFit fit = FitWeibullMle(observed[s], below[s]);
    f.weibull = fit.weibull;
    f.se_scale_ms = fit.se_scale_ms;
    f.se_shape = fit.se_shape;
    f.data_mean_ms = raw_sum[s] / f.n;
    f.frequency =
        static_cast<double>(f.n + f.calms) / static_cast<double>(report->records);
    f.ks_distance = KolmogorovSmirnovDistance(all[s], f.weibull);
    if (f.weibull.scale_ms > 30.0 || f.weibull.shape > kMaxWeibullShape ||
        f.weibull.shape < kMinWeibullShape) {
      ThrowAt(
          where, "",
          label + ": the fitted Weibull (A = " + Fixed(f.weibull.scale_ms, 2) +
              " m/s, k = " + Fixed(f.weibull.shape, 2) +
              ") is outside the site model's limits (A at most 30 m/s, k from 1 to 20); "
              "check the units: speeds were read as " +
              SpeedUnitName(series.read.units) + " (" + series.read.units_source + ")");
    }
    if (f.n < kFewSectorRecords) {
      report->warnings.push_back(
          "Weibull, " + label + ": only " + std::to_string(f.n) +
          " records above the calm threshold; A and k are uncertain (standard error of k "
          "about " +
          Fixed(100.0 * f.se_shape / f.weibull.shape, 0) +
          " % even if the records were independent).");
    }
    report->site.sectors.push_back(Sector{f.frequency, f.weibull});
  }
}

// A sector fits poorly when its KS distance exceeds both our rule of thumb
// and what chance explains: the Kolmogorov 5 % critical value 1.36 / sqrt(n)
// with n the effective number of independent records, n dt / (2 tau) for an
// AR(1) with time scale tau (a mean's variance grows by about 2 tau / dt).
void WarnPoorFits(FitReport* report) {
  const double dt_h = static_cast<double>(report->read.step_s) / 3600.0;
  const double tau_h = report->site.wind_persistence_h;
  for (std::size_t s = 0; s < report->sectors.size(); ++s) {
    const SectorFit& f = report->sectors[s];
    const double n = static_cast<double>(f.n + f.calms);
    const double n_eff = report->tau_fitted && tau_h > 0.0
                             ? std::clamp(n * dt_h / (2.0 * tau_h), 1.0, n)
                             : n;
    const double chance = kKolmogorov5Pct / std::sqrt(n_eff);
    if (f.ks_distance <= std::max(kPoorFitKs, chance)) continue;
    report->warnings.push_back(
        "Weibull, " + SectorLabel(*report, s) + ": poor fit, KS distance " +
        Fixed(100.0 * f.ks_distance, 1) +
        " % (largest gap between the measured and the fitted distribution; chance alone "
        "explains up to about " +
        Fixed(100.0 * chance, 1) + " % with this much data).");
  }
}

// z = Phi^-1(F(v)) with the record's sector Weibull and season factor. A calm
// only says "below the threshold": it gets the middle of that tail, F(c)/2.
double LatentNormal(const FitReport& report, const MetRecord& r, const RecordInfo& info,
                    double calm_ms) {
  const Weibull& w = report.site.sectors[info.sector].weibull;
  const double season = SeasonFactor(report, info);
  const double p = info.calm ? 0.5 * WeibullCdf(w, calm_ms / season)
                             : WeibullCdf(w, r.speed_ms / season);
  static const boost::math::normal_distribution<double> kStandardNormal;
  return boost::math::quantile(kStandardNormal,
                               std::clamp(p, kMinLatentP, 1.0 - kMinLatentP));
}

// Pearson correlation of the pairs (i, j) of records exactly lag_s apart.
struct LagCorrelation {
  int64_t pairs = 0;
  double r = 0.0;
};

LagCorrelation CorrelateAtLag(const MetSeries& series, const std::vector<double>& z,
                              int64_t lag_s) {
  double sx = 0, sy = 0, sxx = 0, syy = 0, sxy = 0;
  LagCorrelation c;
  std::size_t j = 0;
  const std::vector<MetRecord>& recs = series.records;
  for (std::size_t i = 0; i < recs.size(); ++i) {
    const int64_t target = recs[i].time_s + lag_s;
    while (j < recs.size() && recs[j].time_s < target) ++j;
    if (j == recs.size()) break;
    if (recs[j].time_s != target) continue;
    ++c.pairs;
    sx += z[i];
    sy += z[j];
    sxx += z[i] * z[i];
    syy += z[j] * z[j];
    sxy += z[i] * z[j];
  }
  if (c.pairs < 2) return c;
  const double n = static_cast<double>(c.pairs);
  const double cov = sxy - sx * sy / n;
  const double vx = sxx - sx * sx / n, vy = syy - sy * sy / n;
  c.r = vx > 0.0 && vy > 0.0 ? cov / std::sqrt(vx * vy) : 0.0;
  return c;
}

void FitPersistence(const MetSeries& series, const std::vector<RecordInfo>& info,
                    double calm_ms, double lag_h, FitReport* report) {
  const int64_t step_s = report->read.step_s;
  const int64_t lag_steps = std::max<int64_t>(1, std::llround(lag_h * 3600.0 / step_s));
  const int64_t lag_s = lag_steps * step_s;
  report->persistence_lag_h = static_cast<double>(lag_s) / 3600.0;
  std::vector<double> z(info.size());
  for (std::size_t i = 0; i < info.size(); ++i) {
    z[i] = LatentNormal(*report, series.records[i], info[i], calm_ms);
  }
  const LagCorrelation c = CorrelateAtLag(series, z, lag_s);
  report->persistence_pairs = c.pairs;
  report->persistence_r = c.r;
  const std::string lag = Num(report->persistence_lag_h) + " h";
  if (c.pairs < kMinPairs) {
    report->warnings.push_back("Persistence: only " + std::to_string(c.pairs) +
                               " record pairs " + lag +
                               " apart; wind_persistence_h is left at the default " +
                               Num(report->site.wind_persistence_h) + " h.");
    return;
  }
  report->tau_fitted = true;
  if (c.r <= 0.0) {
    report->site.wind_persistence_h = 0.0;
    report->warnings.push_back("Persistence: autocorrelation " + Fixed(c.r, 3) + " at " +
                               lag +
                               " is not positive; wind_persistence_h is set to 0 "
                               "(independent records).");
    return;
  }
  const double tau_h = -report->persistence_lag_h / std::log(c.r);
  report->site.wind_persistence_h = std::min(tau_h, kMaxPersistenceH);
  if (!(tau_h <= kMaxPersistenceH)) {
    report->warnings.push_back("Persistence: autocorrelation " + Fixed(c.r, 4) + " at " +
                               lag + " means tau above a year; capped at 8760 h.");
  }
  if (c.pairs < kFewPairs) {
    report->warnings.push_back("Persistence: only " + std::to_string(c.pairs) +
                               " record pairs " + lag + " apart; tau is uncertain.");
  }
}

// Sector persistence per 10-minute step from how often consecutive
// (non-calm) records stay in their sector. In the sector Markov chain the
// chance to be in the same sector n steps later is q + (1 - q) f_s with
// q = r^n, so the share staying is q + (1 - q) sum f^2.
void FitSectorPersistence(const MetSeries& series, const std::vector<RecordInfo>& info,
                          FitReport* report) {
  if (report->sectors.size() < 2) {
    report->notes.push_back("One sector: sector_persistence is not fitted (default " +
                            Num(report->site.sector_persistence) +
                            " kept; it has no effect).");
    return;
  }
  const int64_t step_s = report->read.step_s;
  int64_t pairs = 0, stays = 0;
  for (std::size_t i = 1; i < info.size(); ++i) {
    if (series.records[i].time_s - series.records[i - 1].time_s != step_s) continue;
    if (info[i].calm || info[i - 1].calm) continue;
    ++pairs;
    if (info[i].sector == info[i - 1].sector) ++stays;
  }
  report->sector_pairs = pairs;
  if (pairs < kFewPairs) {
    report->warnings.push_back("Sector persistence: only " + std::to_string(pairs) +
                               " consecutive record pairs; sector_persistence is left at "
                               "the default " +
                               Num(report->site.sector_persistence) + ".");
    return;
  }
  report->sector_persistence_fitted = true;
  report->sector_stay_share = static_cast<double>(stays) / static_cast<double>(pairs);
  double sum_f2 = 0.0;
  for (const Sector& s : report->site.sectors) sum_f2 += s.frequency * s.frequency;
  const double q = (report->sector_stay_share - sum_f2) / (1.0 - sum_f2);
  const double steps = static_cast<double>(step_s) / kStepSeconds;
  const double r = q <= 0.0 ? 0.0 : std::pow(q, 1.0 / steps);
  report->site.sector_persistence = std::min(r, kMaxSectorPersistence);
}

void UseIecTurbulence(const std::string& ti_class, const std::string& why,
                      FitReport* report) {
  report->ti_from_data = false;
  report->site.turbulence.kind = TurbulenceModel::Kind::kIecNtm;
  report->site.turbulence.i_ref = IecReferenceIntensity(ti_class);
  report->warnings.push_back(why +
                             ": turbulence is the IEC 61400-1 normal turbulence "
                             "model, class " +
                             ti_class + " (not measured; --ti-class chooses the class).");
}

// Mean and standard deviation of TI = sigma_u / V per wind bin, from the
// non-calm records that have a usable standard deviation.
void FitTurbulence(const MetSeries& series, const std::vector<RecordInfo>& info,
                   const SiteFitOptions& options, FitReport* report) {
  report->site.turbulence = TurbulenceModel{};
  if (series.read.std_column.empty()) {
    UseIecTurbulence(options.ti_class, "No standard-deviation column", report);
    return;
  }
  std::map<int64_t, std::vector<double>> bins;
  for (std::size_t i = 0; i < info.size(); ++i) {
    const MetRecord& r = series.records[i];
    if (info[i].calm || std::isnan(r.speed_std_ms)) continue;
    bins[static_cast<int64_t>(std::floor(r.speed_ms / options.ti_bin_ms))].push_back(
        r.speed_std_ms / r.speed_ms);
  }
  for (const auto& [index, ti] : bins) {
    TiBinFit b;
    b.lo_ms = index * options.ti_bin_ms;
    b.hi_ms = (index + 1) * options.ti_bin_ms;
    b.n = static_cast<int64_t>(ti.size());
    double sum = 0.0, ss = 0.0;
    for (double x : ti) sum += x;
    b.ti_mean = sum / b.n;
    for (double x : ti) ss += (x - b.ti_mean) * (x - b.ti_mean);
    b.ti_std = b.n > 1 ? std::sqrt(ss / (b.n - 1)) : 0.0;
    b.used = b.n >= options.ti_min_count && b.ti_mean > 0.0 && b.ti_mean <= 1.0 &&
             b.ti_std <= 1.0;
    report->ti_bins.push_back(b);
    if (b.used) {
      report->site.turbulence.table.push_back(
          TiTableRow{b.lo_ms, b.hi_ms, b.ti_mean, b.ti_std});
    }
  }
  if (report->site.turbulence.table.empty()) {
    UseIecTurbulence(options.ti_class,
                     "No wind bin has " + std::to_string(options.ti_min_count) +
                         " records with a usable standard deviation",
                     report);
    return;
  }
  report->ti_from_data = true;
  report->site.turbulence.kind = TurbulenceModel::Kind::kTable;
  const std::size_t left_out =
      report->ti_bins.size() - report->site.turbulence.table.size();
  if (left_out > 0) {
    report->notes.push_back(
        "TI table: " + std::to_string(left_out) + " wind bins with fewer than " +
        std::to_string(options.ti_min_count) +
        " records (or a mean TI of 0 or above 100 %) are left out; the simulation uses "
        "the nearest row there.");
  }
}

std::string DefaultDescription(const MetSeries& series) {
  const MetReadReport& r = series.read;
  auto date = [](int64_t time_s) {
    return FormatDate(
        CivilFromDays(time_s / kSecondsPerDay - (time_s % kSecondsPerDay < 0 ? 1 : 0)));
  };
  return "Fitted by fillcast fit-site from " +
         std::filesystem::path(r.file).filename().string() + " (speed column '" +
         r.speed_column + "'), " + date(r.first_time_s) + " to " + date(r.last_time_s) +
         ". An estimate from the measured period, not a promise about future wind.";
}

}  // namespace

FitReport FitSite(const MetSeries& series, const SiteFitOptions& options) {
  ValidateOptions(options);
  if (series.records.size() < 2 || series.read.step_s <= 0) {
    ThrowAt(SourceLocation{series.read.file, 0, 0}, "",
            std::to_string(series.records.size()) +
                " usable rows and no time step; at least 2 rows are needed to fit");
  }
  FitReport report;
  report.read = series.read;
  report.calm_ms = options.calm_ms;
  report.records = static_cast<int64_t>(series.records.size());
  report.has_direction = !series.read.direction_column.empty();
  const int sectors = report.has_direction ? options.sectors : 1;
  if (!report.has_direction) {
    report.notes.push_back("No direction column: one sector covering all directions.");
  }
  const std::vector<RecordInfo> info = Classify(series, sectors, options.calm_ms);
  double sum = 0.0;
  for (std::size_t i = 0; i < info.size(); ++i) {
    sum += series.records[i].speed_ms;
    if (info[i].calm) ++report.calms;
  }
  report.sample_mean_ms = sum / static_cast<double>(report.records);
  const MetReadReport& d = series.read;
  if (d.last_time_s - d.first_time_s + d.step_s < 365 * kSecondsPerDay) {
    report.warnings.push_back(
        "The data cover less than a year: the Weibulls and monthly factors reflect only "
        "the months measured.");
  }
  report.site.name = options.name;
  report.site.description =
      options.description.empty() ? DefaultDescription(series) : options.description;
  FitMonthly(series, info, &report);
  FitHourly(series, info, &report);
  FitSectors(series, info, sectors, options.calm_ms, &report);
  FitPersistence(series, info, options.calm_ms, options.persistence_lag_h, &report);
  WarnPoorFits(&report);
  FitSectorPersistence(series, info, &report);
  FitTurbulence(series, info, options, &report);
  report.notes.push_back(
      "interannual_std is not fitted: 0 (every simulated year alike).");
  report.model_mean_ms = SiteMeanSpeed(report.site);
  return report;
}

}  // namespace planner
