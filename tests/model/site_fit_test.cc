// Fitting a site model (planner/site_fit.h).
//  * Real open data (tests/data/irish-daily-wind, README there): each
//    station's fitted mean speed equals the mean published with the data.
//  * Synthetic series drawn with Boost.Random from a known model (the
//    simulation's own normal-transform AR(1), month and hour factors, sector
//    Markov chain, lognormal TI): the fit gives the parameters back within
//    4 standard errors of the mean over replicates (fixed seeds; the
//    standard errors come from the replicates themselves, which accounts for
//    the autocorrelation).
//  * Warnings, defaults and errors, messages word for word.
#include "planner/site_fit.h"

#include <gtest/gtest.h>

#include <boost/math/distributions/normal.hpp>
#include <boost/math/distributions/weibull.hpp>
#include <boost/random/lognormal_distribution.hpp>
#include <boost/random/mersenne_twister.hpp>
#include <boost/random/normal_distribution.hpp>
#include <boost/random/uniform_01.hpp>
#include <boost/random/weibull_distribution.hpp>
#include <cmath>
#include <ctime>
#include <functional>
#include <limits>
#include <string>
#include <vector>

#include "io/met_csv_reader.h"
#include "io/reader_test_util.h"
#include "model/irish_wind_data.h"

namespace planner {
namespace {

using reader_test::ErrorOf;

// True if `list` holds `item` (the warnings and notes are full sentences).
bool Holds(const std::vector<std::string>& list, const std::string& item) {
  for (const std::string& x : list) {
    if (x == item) return true;
  }
  return false;
}

bool Has(const std::string& text, const std::string& part) {
  return text.find(part) != std::string::npos;
}

const double kNaN = std::numeric_limits<double>::quiet_NaN();
constexpr int kDaysInMonth[12] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};

// ---- real data --------------------------------------------------------------

FitReport FitStation(const std::string& code) {
  SiteFitOptions options;
  options.csv.speed_column = code;
  options.name = code;
  return FitSite(LoadMetCsv(irish_wind::SpeedsFile(), options.csv), options);
}

double PublishedMean(const std::string& code) {
  for (const irish_wind::Station& s : irish_wind::Stations()) {
    if (s.code == code) return s.published_mean_ms;
  }
  return kNaN;
}

double PlainMean(const std::vector<double>& x) {
  double sum = 0.0;
  for (double v : x) sum += v;
  return sum / static_cast<double>(x.size());
}

class IrishStationSiteFitTest : public ::testing::TestWithParam<const char*> {};

// The README of the data set: each column's mean x 0.514444 equals the
// published MeanWind to 0.01 m/s; the published values are rounded to 0.01,
// so the tolerance is 0.01 + 0.005 m/s. (Needed: DUB misses 0.01 by 0.0001;
// KIL, 3.2442 vs 3.25, is within 0.01.)
TEST_P(IrishStationSiteFitTest, FittedMeanSpeedMatchesThePublishedMean) {
  const FitReport r = FitStation(GetParam());
  EXPECT_EQ(r.read.units, SpeedUnit::kKnots);  // found in the file name
  EXPECT_EQ(r.read.rows_kept, 6574);           // README: 6,574 days
  EXPECT_EQ(r.read.DroppedTotal(), 0);
  EXPECT_EQ(r.read.step_s, 86400);
  EXPECT_EQ(r.read.gaps, 0);
  EXPECT_NEAR(r.sample_mean_ms, PublishedMean(GetParam()), 0.015);
  const double plain = PlainMean(irish_wind::SpeedsMs(GetParam()));
  EXPECT_NEAR(r.sample_mean_ms, plain, 1e-12 * plain);
}

INSTANTIATE_TEST_SUITE_P(IrishDailyWind, IrishStationSiteFitTest,
                         ::testing::Values("RPT", "VAL", "ROS", "KIL", "SHA", "BIR",
                                           "DUB", "MUL", "CLO", "BEL", "MAL"));

// The one exception, a discrepancy of the source itself (see the data's
// README): Claremorris's column averages 4.370 m/s, 0.05 above the
// published 4.32. Our mean is the column's mean.
TEST(IrishDailyWindTest, ClaremorrisColumnDoesNotReproduceItsPublishedMean) {
  const FitReport r = FitStation("CLA");
  const double plain = PlainMean(irish_wind::SpeedsMs("CLA"));
  EXPECT_NEAR(r.sample_mean_ms, plain, 1e-12 * plain);
  EXPECT_GT(r.sample_mean_ms - PublishedMean("CLA"), 0.04);
}

// Daily data without directions: one sector, no hour factors, both said.
TEST(IrishDailyWindTest, DailyDataGiveOneSectorAndNoHourFactors) {
  const FitReport r = FitStation("MAL");
  ASSERT_EQ(r.site.sectors.size(), 1u);
  EXPECT_DOUBLE_EQ(r.site.sectors[0].frequency, 1.0);
  EXPECT_FALSE(r.hourly_fitted);
  for (double f : r.site.hourly_factors) EXPECT_DOUBLE_EQ(f, 1.0);
  EXPECT_TRUE(Holds(r.notes, "No direction column: one sector covering all directions."));
  EXPECT_TRUE(Holds(r.notes,
                    "The step is a day or more: no hour-of-day "
                    "factors can be fitted; they are all 1."));
  EXPECT_EQ(r.sectors[0].n + r.sectors[0].calms, 6574);
  int64_t calm_days = 0;  // counted here from the column itself
  for (double v : irish_wind::SpeedsMs("MAL")) calm_days += v < 0.5 ? 1 : 0;
  EXPECT_EQ(r.calms, calm_days);
  EXPECT_EQ(r.sectors[0].calms, calm_days);
  // Month factors average 1 over the year, day-weighted (docs/site-model.md).
  double weighted = 0.0;
  for (int m = 0; m < 12; ++m) weighted += kDaysInMonth[m] * r.site.monthly_factors[m];
  EXPECT_NEAR(weighted / 365.0, 1.0, 1e-12);
}

// ---- synthetic series ---------------------------------------------------------

// Seconds since 1970 of 00:00 on a date (C library's timegm as reference).
int64_t Midnight(int year, int month, int day) {
  std::tm t{};
  t.tm_year = year - 1900;
  t.tm_mon = month - 1;
  t.tm_mday = day;
  return static_cast<int64_t>(timegm(&t));
}

MetSeries MakeSeries(std::vector<MetRecord> records, int64_t step_s, bool with_std,
                     bool with_direction) {
  MetSeries s;
  s.read.file = "synthetic.csv";
  s.read.time_column = "timestamp";
  s.read.speed_column = "speed_ms";
  s.read.std_column = with_std ? "speed_std_ms" : "";
  s.read.direction_column = with_direction ? "direction_deg" : "";
  s.read.units = SpeedUnit::kMetresPerSecond;
  s.read.units_source = "declared with --units";
  s.read.rows_read = s.read.rows_kept = static_cast<int64_t>(records.size());
  s.read.step_s = step_s;
  s.read.first_time_s = records.front().time_s;
  s.read.last_time_s = records.back().time_s;
  s.records = std::move(records);
  return s;
}

SiteFitOptions Options() {
  SiteFitOptions o;
  o.name = "Synthetic";
  return o;
}

// Mean and standard error of the mean over replicates.
struct Replicates {
  std::vector<double> values;
  void Add(double x) { values.push_back(x); }
  double Mean() const { return PlainMean(values); }
  double StandardError() const {
    const double m = Mean(), n = static_cast<double>(values.size());
    double ss = 0.0;
    for (double x : values) ss += (x - m) * (x - m);
    return std::sqrt(ss / (n - 1.0) / n);
  }
};

#define EXPECT_RECOVERED(replicates, truth)                                     \
  EXPECT_NEAR((replicates).Mean(), (truth), 4.0 * (replicates).StandardError()) \
      << "standard error " << (replicates).StandardError()

// The simulation's weather model (docs/methods.md): latent AR(1)
// z' = phi z + sqrt(1 - phi^2) e, phi = exp(-step / tau), mapped through
// v = A f_month f_hour (-ln(1 - Phi(z)))^(1/k), i.e. the Weibull quantile at
// Phi(z) (Boost.Math), with normals from Boost.Random.
struct TrueClimate {
  double a_ms = 8.0, k = 2.1, tau_h = 30.0;
  std::array<double, 12> month{};
  std::array<double, 24> hour{};
};

TrueClimate SeasonalClimate() {
  TrueClimate c;
  const double pi = 3.14159265358979323846;
  double weighted = 0.0;
  for (int m = 0; m < 12; ++m) {
    c.month[m] = 1.0 + 0.2 * std::cos(2.0 * pi * m / 12.0);  // windy winters
    weighted += kDaysInMonth[m] * c.month[m];
  }
  for (double& f : c.month) f /= weighted / 365.0;  // day-weighted mean 1
  for (int h = 0; h < 24; ++h)
    c.hour[h] = 1.0 + 0.06 * std::sin(2.0 * pi * (h - 9) / 24.0);
  return c;  // hour factors average exactly 1 over the day
}

std::vector<MetRecord> DrawClimate(const TrueClimate& c, int64_t start_s, int64_t step_s,
                                   int count, uint32_t seed) {
  boost::random::mt19937 engine(seed);
  boost::random::normal_distribution<double> normal;
  const boost::math::normal_distribution<double> phi_dist;
  const double phi = std::exp(-static_cast<double>(step_s) / 3600.0 / c.tau_h);
  double z = normal(engine);
  std::vector<MetRecord> records(count);
  for (int i = 0; i < count; ++i) {
    MetRecord& r = records[i];
    r.time_s = start_s + i * step_s;
    const std::time_t t = static_cast<std::time_t>(r.time_s);
    std::tm parts{};
    gmtime_r(&t, &parts);
    const double scale = c.a_ms * c.month[parts.tm_mon] * c.hour[parts.tm_hour];
    const boost::math::weibull_distribution<double> w(c.k, scale);
    const double upper = boost::math::cdf(boost::math::complement(phi_dist, z));
    r.speed_ms = boost::math::quantile(boost::math::complement(w, upper));
    r.speed_std_ms = kNaN;
    r.direction_deg = kNaN;
    z = phi * z + std::sqrt(1.0 - phi * phi) * normal(engine);
  }
  return records;
}

// Twenty 30-year daily series (the model sampled once a day: the same
// Weibull marginals, lag-1-day correlation exp(-24 h / tau)): A, k, tau and
// the month factors come back (mean over replicates within 4 standard
// errors). A long record is needed: see the next test.
TEST(SiteFitTest, RecoversWeibullPersistenceAndMonthsOfAKnownClimate) {
  TrueClimate truth = SeasonalClimate();
  truth.hour.fill(1.0);
  const int replicates = 20, days = 30 * 365;
  Replicates a, k, tau;
  std::array<Replicates, 12> month;
  for (int rep = 0; rep < replicates; ++rep) {
    const MetSeries s =
        MakeSeries(DrawClimate(truth, Midnight(1990, 1, 1), 86400, days, 500u + rep),
                   86400, false, false);
    const FitReport r = FitSite(s, Options());
    ASSERT_TRUE(r.tau_fitted);
    a.Add(r.site.sectors[0].weibull.scale_ms);
    k.Add(r.site.sectors[0].weibull.shape);
    tau.Add(r.site.wind_persistence_h);
    for (int m = 0; m < 12; ++m) month[m].Add(r.site.monthly_factors[m]);
  }
  EXPECT_RECOVERED(a, truth.a_ms);
  EXPECT_RECOVERED(k, truth.k);
  EXPECT_RECOVERED(tau, truth.tau_h);
  for (int m = 0; m < 12; ++m)
    EXPECT_RECOVERED(month[m], truth.month[m]) << "month " << m;
}

// One year of hourly data: the hour and month factors come back, and the
// fit warns that a short record biases k and tau (the month factors then
// also hold that year's month-to-month weather; docs/fit-site.md).
TEST(SiteFitTest, RecoversHourAndMonthFactorsFromOneYearAndWarnsAboutItsLength) {
  const TrueClimate truth = SeasonalClimate();
  const int replicates = 10;
  std::array<Replicates, 12> month;
  std::array<Replicates, 24> hour;
  for (int rep = 0; rep < replicates; ++rep) {
    const MetSeries s =
        MakeSeries(DrawClimate(truth, Midnight(2021, 1, 1), 3600, 8760, 700u + rep), 3600,
                   false, false);
    const FitReport r = FitSite(s, Options());
    ASSERT_TRUE(r.hourly_fitted);
    for (int m = 0; m < 12; ++m) month[m].Add(r.site.monthly_factors[m]);
    for (int h = 0; h < 24; ++h) hour[h].Add(r.site.hourly_factors[h]);
    bool warned = false;
    for (const std::string& w : r.warnings) {
      warned =
          warned || w.rfind("Monthly factors from 1.0 years of data also hold", 0) == 0;
    }
    EXPECT_TRUE(warned);
  }
  for (int m = 0; m < 12; ++m)
    EXPECT_RECOVERED(month[m], truth.month[m]) << "month " << m;
  for (int h = 0; h < 24; ++h) EXPECT_RECOVERED(hour[h], truth.hour[h]) << "hour " << h;
}

// Four 90-degree sectors with their own frequency and Weibull; directions
// from the simulation's sector Markov chain (stay with probability r per
// 10-minute step, else draw from the frequencies), uniform inside the
// sector; speeds independent (Boost.Random weibull_distribution).
struct SectorTruth {
  double frequency, a_ms, k;
};
const std::vector<SectorTruth> kSectors = {
    {0.1, 6.0, 1.8}, {0.2, 7.0, 2.0}, {0.3, 9.0, 2.3}, {0.4, 10.0, 2.5}};
constexpr double kSectorPersistence = 0.97;

std::vector<MetRecord> DrawSectors(int count, uint32_t seed) {
  boost::random::mt19937 engine(seed);
  boost::random::uniform_01<double> uniform;
  auto draw_sector = [&] {
    double u = uniform(engine);
    for (std::size_t s = 0; s < kSectors.size(); ++s) {
      if ((u -= kSectors[s].frequency) < 0.0) return static_cast<int>(s);
    }
    return static_cast<int>(kSectors.size()) - 1;
  };
  int sector = draw_sector();
  double direction = 0.0;
  std::vector<MetRecord> records(count);
  for (int i = 0; i < count; ++i) {
    if (i == 0 || uniform(engine) >= kSectorPersistence) {
      sector = draw_sector();
      direction = std::fmod(sector * 90.0 - 45.0 + 90.0 * uniform(engine) + 360.0, 360.0);
    }
    boost::random::weibull_distribution<double> speed(kSectors[sector].k,
                                                      kSectors[sector].a_ms);
    records[i].time_s = Midnight(2022, 1, 1) + 600LL * i;
    records[i].speed_ms = speed(engine);
    records[i].speed_std_ms = kNaN;
    records[i].direction_deg = direction;
  }
  return records;
}

TEST(SiteFitTest, RecoversSectorFrequenciesWeibullsAndSectorPersistence) {
  const int replicates = 20, steps = 20000;
  std::vector<Replicates> freq(4), a(4), k(4);
  Replicates r_stay;
  for (int rep = 0; rep < replicates; ++rep) {
    SiteFitOptions options = Options();
    options.sectors = 4;
    const FitReport r =
        FitSite(MakeSeries(DrawSectors(steps, 900u + rep), 600, false, true), options);
    ASSERT_EQ(r.site.sectors.size(), 4u);
    ASSERT_TRUE(r.sector_persistence_fitted);
    for (int s = 0; s < 4; ++s) {
      freq[s].Add(r.site.sectors[s].frequency);
      a[s].Add(r.site.sectors[s].weibull.scale_ms);
      k[s].Add(r.site.sectors[s].weibull.shape);
    }
    r_stay.Add(r.site.sector_persistence);
  }
  for (int s = 0; s < 4; ++s) {
    EXPECT_RECOVERED(freq[s], kSectors[s].frequency) << "sector " << s;
    EXPECT_RECOVERED(a[s], kSectors[s].a_ms) << "sector " << s;
    EXPECT_RECOVERED(k[s], kSectors[s].k) << "sector " << s;
  }
  EXPECT_RECOVERED(r_stay, kSectorPersistence);
}

// TI = sigma_u / V lognormal with mean 12 % and standard deviation 3 % at
// every speed (moments to parameters: s^2 = ln(1 + cv^2), mu = ln m - s^2/2,
// textbook). Each bin's mean TI is within 4 standard errors (sd / sqrt n) and
// its standard deviation within 4 standard errors of a sample standard
// deviation, sd / 2 x sqrt(2 / (n - 1) + excess kurtosis / n) (textbook).
TEST(SiteFitTest, TiTableHasTheMeanAndSpreadOfTiPerWindBin) {
  const double ti_mean = 0.12, ti_sd = 0.03, n_records = 20000;
  const double s2 = std::log(1.0 + (ti_sd / ti_mean) * (ti_sd / ti_mean));
  boost::random::mt19937 engine(31337u);
  boost::random::weibull_distribution<double> speed(2.0, 8.0);
  boost::random::lognormal_distribution<double> ti(std::log(ti_mean) - s2 / 2.0,
                                                   std::sqrt(s2));
  std::vector<MetRecord> records(static_cast<std::size_t>(n_records));
  for (std::size_t i = 0; i < records.size(); ++i) {
    records[i].time_s = Midnight(2023, 5, 1) + 600LL * static_cast<int64_t>(i);
    records[i].speed_ms = speed(engine);
    records[i].speed_std_ms = ti(engine) * records[i].speed_ms;
    records[i].direction_deg = kNaN;
  }
  const FitReport r = FitSite(MakeSeries(records, 600, true, false), Options());
  ASSERT_TRUE(r.ti_from_data);
  ASSERT_EQ(r.site.turbulence.kind, TurbulenceModel::Kind::kTable);
  const double w = std::exp(s2);
  const double excess_kurtosis =
      w * w * w * w + 2 * w * w * w + 3 * w * w - 6;  // lognormal
  std::size_t row = 0;
  for (const TiBinFit& b : r.ti_bins) {
    EXPECT_EQ(b.used, b.n >= 30) << b.lo_ms;  // the default minimum count
    if (!b.used) continue;
    const double n = static_cast<double>(b.n);
    EXPECT_NEAR(b.ti_mean, ti_mean, 4.0 * ti_sd / std::sqrt(n)) << b.lo_ms;
    EXPECT_NEAR(b.ti_std, ti_sd,
                4.0 * ti_sd / 2.0 * std::sqrt(2.0 / (n - 1.0) + excess_kurtosis / n))
        << b.lo_ms;
    ASSERT_LT(row, r.site.turbulence.table.size());
    EXPECT_DOUBLE_EQ(r.site.turbulence.table[row].wind_lo_ms, b.lo_ms);
    EXPECT_DOUBLE_EQ(r.site.turbulence.table[row].ti_mean, b.ti_mean);
    EXPECT_DOUBLE_EQ(b.hi_ms - b.lo_ms, 1.0);  // default 1 m/s bins
    ++row;
  }
  EXPECT_EQ(row, r.site.turbulence.table.size());
  EXPECT_GT(row, 10u);
}

// ---- calms, warnings, errors ------------------------------------------------

std::vector<MetRecord> Daily(const std::vector<double>& speeds_ms) {
  std::vector<MetRecord> records;
  for (std::size_t i = 0; i < speeds_ms.size(); ++i) {
    records.push_back(MetRecord{Midnight(2020, 1, 1) + 86400LL * static_cast<int64_t>(i),
                                speeds_ms[i], kNaN, kNaN});
  }
  return records;
}

TEST(SiteFitTest, CalmsAreCountedKeptInTheMeanAndCensoredInTheFit) {
  std::vector<double> speeds;
  for (int i = 0; i < 400; ++i) speeds.push_back(i % 40 == 0 ? 0.0 : 2.0 + (i * 7 % 13));
  speeds[5] = 0.3;
  const FitReport r = FitSite(MakeSeries(Daily(speeds), 86400, false, false), Options());
  EXPECT_EQ(r.calms, 11);  // ten zeros and 0.3, all below 0.5 m/s
  EXPECT_EQ(r.sectors[0].calms, 11);
  EXPECT_EQ(r.sectors[0].n, 389);
  EXPECT_DOUBLE_EQ(r.site.sectors[0].frequency, 1.0);
  EXPECT_NEAR(r.sample_mean_ms, PlainMean(speeds), 1e-12);
}

TEST(SiteFitTest, ShortSeriesKeepsDefaultsAndSaysWhy) {
  std::vector<double> speeds;
  for (int i = 0; i < 20; ++i) speeds.push_back(3.0 + (i * 5 % 11));
  const FitReport r = FitSite(MakeSeries(Daily(speeds), 86400, false, false), Options());
  EXPECT_FALSE(r.tau_fitted);
  EXPECT_DOUBLE_EQ(r.site.wind_persistence_h, 36.0);  // SiteModel's default
  EXPECT_EQ(r.persistence_pairs, 19);
  EXPECT_TRUE(Holds(r.warnings,
                    "Persistence: only 19 record pairs 24 h apart; "
                    "wind_persistence_h is left at the default 36 h."));
  EXPECT_TRUE(Holds(r.warnings,
                    "The data cover less than a year: the Weibulls and "
                    "monthly factors reflect only the months measured."));
  EXPECT_TRUE(Holds(r.warnings,
                    "Monthly factors: no data for Feb, Mar, Apr, May, Jun, "
                    "Jul, Aug, Sep, Oct, Nov, Dec; their factors are set to 1."));
  bool weibull_warning = false;
  for (const std::string& w : r.warnings) {
    weibull_warning =
        weibull_warning || w.find(
                               "Weibull, all directions: only 20 records above the calm "
                               "threshold; A and k are uncertain") == 0;
  }
  EXPECT_TRUE(weibull_warning);
}

// Speeds alternating between calm-ish and windy days: the lag-1-day
// autocorrelation is negative, so there is no persistence to fit.
TEST(SiteFitTest, NegativeAutocorrelationGivesNoPersistenceWithAWarning) {
  std::vector<double> speeds;
  for (int i = 0; i < 200; ++i)
    speeds.push_back((i % 2 == 0 ? 3.0 : 9.0) + 0.1 * (i % 7));
  const FitReport r = FitSite(MakeSeries(Daily(speeds), 86400, false, false), Options());
  EXPECT_TRUE(r.tau_fitted);
  EXPECT_LT(r.persistence_r, 0.0);
  EXPECT_DOUBLE_EQ(r.site.wind_persistence_h, 0.0);
  bool said = false;
  for (const std::string& w : r.warnings) {
    said = said || (w.find("Persistence: autocorrelation -") == 0 &&
                    w.find(" at 24 h is not positive; wind_persistence_h is set to 0 "
                           "(independent records).") != std::string::npos);
  }
  EXPECT_TRUE(said);
}

bool WarnsOfPoorFit(const FitReport& r) {
  for (const std::string& w : r.warnings) {
    if (w.rfind("Weibull, all directions: poor fit, KS distance ", 0) == 0) return true;
  }
  return false;
}

// Independent daily values: a Weibull sample (Boost.Random) fits; a mixture
// of two narrow normal clusters (3 and 12 m/s) does not, and is flagged.
TEST(SiteFitTest, PoorFitIsFlaggedOnlyBeyondWhatChanceExplains) {
  boost::random::mt19937 engine(2718u);
  boost::random::weibull_distribution<double> weibull(2.0, 8.0);
  boost::random::normal_distribution<double> normal;
  std::vector<double> good, bad;
  for (int i = 0; i < 2000; ++i) {
    good.push_back(weibull(engine));
    bad.push_back(std::fabs((i % 2 == 0 ? 3.0 : 12.0) + 0.5 * normal(engine)));
  }
  EXPECT_FALSE(
      WarnsOfPoorFit(FitSite(MakeSeries(Daily(good), 86400, false, false), Options())));
  EXPECT_TRUE(
      WarnsOfPoorFit(FitSite(MakeSeries(Daily(bad), 86400, false, false), Options())));
}

TEST(SiteFitTest, SectorWithTooFewRecordsIsAnInputError) {
  std::vector<MetRecord> records = DrawSectors(200, 1u);
  for (MetRecord& r : records) r.direction_deg = 10.0;  // all from the north
  SiteFitOptions options = Options();
  options.sectors = 4;
  EXPECT_EQ(
      ErrorOf([&] { FitSite(MakeSeries(records, 600, false, true), options); }),
      "synthetic.csv: sector 1 (45-135 deg) has 0 records above the calm threshold; "
      "at least 10 are needed to fit a Weibull; use fewer sectors (--sectors) or more "
      "data");
}

// Speeds far above any site's (here in km/h declared as m/s) end in a
// Weibull outside the site model's limits, and the message points at units.
TEST(SiteFitTest, ImplausibleWeibullPointsAtTheUnits) {
  std::vector<double> speeds;
  for (int i = 0; i < 100; ++i) speeds.push_back(40.0 + (i * 7 % 19));
  const std::string message = ErrorOf(
      [&] { FitSite(MakeSeries(Daily(speeds), 86400, false, false), Options()); });
  EXPECT_TRUE(Has(message, "synthetic.csv: all directions: the fitted Weibull (A = "));
  EXPECT_TRUE(Has(message,
                  ") is outside the site model's limits (A at most 30 m/s, k from 1 "
                  "to 20); check the units: speeds were read as m/s (declared with "
                  "--units)"));
}

struct OptionCase {
  std::function<void(SiteFitOptions&)> edit;
  std::string message;
};

TEST(SiteFitTest, InvalidOptionsAreInputErrorsNamingTheOption) {
  const std::vector<OptionCase> cases = {
      {[](SiteFitOptions& o) { o.sectors = 0; },
       "--sectors: 0 is out of range; must be at least 1 and at most 72"},
      {[](SiteFitOptions& o) { o.sectors = 73; },
       "--sectors: 73 is out of range; must be at least 1 and at most 72"},
      {[](SiteFitOptions& o) { o.calm_ms = 0.0; },
       "--calm-ms: 0 is out of range; must be above 0 and at most 3 m/s"},
      {[](SiteFitOptions& o) { o.ti_bin_ms = 0.0; },
       "--ti-bin-ms: 0 is out of range; must be at least 0.1 and at most 5 m/s"},
      {[](SiteFitOptions& o) { o.ti_min_count = 1; },
       "--ti-min-count: 1 is out of range; must be at least 2"},
      {[](SiteFitOptions& o) { o.persistence_lag_h = 1000; },
       "--persistence-lag-h: 1000 is out of range; must be at least 0.1 and at most 720 "
       "h"},
      {[](SiteFitOptions& o) { o.ti_class = "D"; },
       "--ti-class: 'D' is not an IEC 61400-1 turbulence class; valid: A+, A, B, C"},
      {[](SiteFitOptions& o) { o.name = ""; },
       "--name: is empty; give the site model a name"},
  };
  const MetSeries series =
      MakeSeries(Daily({5, 6, 7, 8, 9, 4, 3, 6, 7, 8, 9, 5}), 86400, false, false);
  for (const OptionCase& c : cases) {
    SiteFitOptions options = Options();
    c.edit(options);
    EXPECT_EQ(ErrorOf([&] { FitSite(series, options); }), c.message);
  }
}

}  // namespace
}  // namespace planner
