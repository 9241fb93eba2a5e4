// Site-model reader: parsed values, defaults, normalisation, every rejected
// input with its exact message, and the shipped site models.
#include <gtest/gtest.h>

#include <boost/math/distributions/weibull.hpp>
#include <string>
#include <vector>

#include "io/reader_test_util.h"
#include "planner/error.h"
#include "planner/plan_reader.h"

namespace planner {
namespace {

using reader_test::ErrorOf;
using reader_test::Replace;

const char kFile[] = "site.yaml";

// Five lines; the bad-input cases below edit one piece of it.
const std::string kBaseSite =
    "name: Test site\n"
    "sectors:\n"
    "  - {frequency: 0.5, weibull_a_ms: 8, weibull_k: 2}\n"
    "  - {frequency: 0.5, weibull_a_ms: 9, weibull_k: 2.2}\n"
    "turbulence: {model: iec-ntm, class: A}\n";

std::string SiteError(const std::string& text) {
  return ErrorOf([&] { ParseSiteModel(text, kFile); });
}

std::string ShippedPath(const std::string& name) {
  return reader_test::SourcePath("site-models/" + name);
}

TEST(SiteModelReaderTest, MinimalModelGetsDocumentedDefaults) {
  const SiteModel site = ParseSiteModel(kBaseSite, kFile);
  EXPECT_EQ(site.name, "Test site");
  EXPECT_EQ(site.description, "");
  ASSERT_EQ(site.sectors.size(), 2u);
  EXPECT_DOUBLE_EQ(site.sectors[1].frequency, 0.5);
  EXPECT_DOUBLE_EQ(site.sectors[1].weibull.scale_ms, 9.0);
  EXPECT_DOUBLE_EQ(site.sectors[1].weibull.shape, 2.2);
  EXPECT_DOUBLE_EQ(site.sector_persistence, 0.97);
  EXPECT_DOUBLE_EQ(site.wind_persistence_h, 36.0);
  for (double f : site.monthly_factors) EXPECT_DOUBLE_EQ(f, 1.0);
  for (double f : site.hourly_factors) EXPECT_DOUBLE_EQ(f, 1.0);
  EXPECT_DOUBLE_EQ(site.interannual_std, 0.0);
  EXPECT_DOUBLE_EQ(site.mean_speed_uncertainty_pct, 0.0);
  EXPECT_EQ(site.turbulence.kind, TurbulenceModel::Kind::kIecNtm);
  EXPECT_DOUBLE_EQ(site.turbulence.persistence_h, 0.0);
}

TEST(SiteModelReaderTest, ReadsEveryOptionalField) {
  const std::string text = kBaseSite +
                           "description: Invented\n"
                           "sector_persistence: 0.9\n"
                           "wind_persistence_h: 24\n"
                           "interannual_std: 0.05\n"
                           "mean_speed_uncertainty_pct: 6\n";
  const SiteModel site = ParseSiteModel(text, kFile);
  EXPECT_EQ(site.description, "Invented");
  EXPECT_DOUBLE_EQ(site.sector_persistence, 0.9);
  EXPECT_DOUBLE_EQ(site.wind_persistence_h, 24.0);
  EXPECT_DOUBLE_EQ(site.interannual_std, 0.05);
  EXPECT_DOUBLE_EQ(site.mean_speed_uncertainty_pct, 6.0);
}

TEST(SiteModelReaderTest, RescalesFrequenciesWithinToleranceToSumOne) {
  const std::string text = Replace(kBaseSite, "frequency: 0.5, weibull_a_ms: 8",
                                   "frequency: 0.504, weibull_a_ms: 8");
  const SiteModel site = ParseSiteModel(text, kFile);
  EXPECT_DOUBLE_EQ(site.sectors[0].frequency + site.sectors[1].frequency, 1.0);
  EXPECT_DOUBLE_EQ(site.sectors[0].frequency / site.sectors[1].frequency, 0.504 / 0.5);
}

// Month lengths of the Gregorian calendar in a common year (365 days).
TEST(SiteModelReaderTest, MonthlyFactorsAreNormalisedToADayWeightedMeanOfOne) {
  const std::string text =
      kBaseSite + "monthly_factors: [2, 2, 2, 1, 1, 1, 1, 1, 1, 1, 1, 1]\n";
  const SiteModel site = ParseSiteModel(text, kFile);
  const double days[12] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
  double weighted = 0.0;
  for (int m = 0; m < 12; ++m) weighted += days[m] * site.monthly_factors[m];
  EXPECT_NEAR(weighted / 365.0, 1.0, 1e-12);
  // January to March (90 days) at 2, the other 275 days at 1: mean 455 / 365.
  EXPECT_NEAR(site.monthly_factors[0], 2.0 * 365.0 / 455.0, 1e-12);
  EXPECT_NEAR(site.monthly_factors[11], 365.0 / 455.0, 1e-12);
}

TEST(SiteModelReaderTest, HourlyFactorsAreNormalisedToAMeanOfOne) {
  std::string list = "[3";
  for (int h = 1; h < 24; ++h) list += ", 1";
  const SiteModel site =
      ParseSiteModel(kBaseSite + "hourly_factors: " + list + "]\n", kFile);
  EXPECT_NEAR(site.hourly_factors[0], 3.0 * 24.0 / 26.0, 1e-12);
  EXPECT_NEAR(site.hourly_factors[23], 24.0 / 26.0, 1e-12);
}

// I_ref per class: IEC 61400-1 ed.3 table 1 (A, B, C) and ed.4 (A+).
TEST(SiteModelReaderTest, TurbulenceClassSetsPublishedReferenceIntensity) {
  const std::vector<std::pair<std::string, double>> classes = {
      {"A+", 0.18}, {"A", 0.16}, {"B", 0.14}, {"C", 0.12}};
  for (const auto& [name, i_ref] : classes) {
    const std::string text = Replace(kBaseSite, "class: A", "class: " + name);
    EXPECT_DOUBLE_EQ(ParseSiteModel(text, kFile).turbulence.i_ref, i_ref) << name;
  }
}

TEST(SiteModelReaderTest, ReadsReferenceIntensityAndPersistence) {
  const std::string text =
      Replace(kBaseSite, "class: A", "i_ref: 0.13, persistence_h: 2");
  const SiteModel site = ParseSiteModel(text, kFile);
  EXPECT_DOUBLE_EQ(site.turbulence.i_ref, 0.13);
  EXPECT_DOUBLE_EQ(site.turbulence.persistence_h, 2.0);
}

TEST(SiteModelReaderTest, ReadsTiTableInPercentAsFractions) {
  const std::string text =
      Replace(kBaseSite, "turbulence: {model: iec-ntm, class: A}\n",
              "turbulence:\n"
              "  model: table\n"
              "  rows:\n"
              "    - {wind_ms: [0, 5], ti_mean_pct: 15, ti_std_pct: 5}\n"
              "    - {wind_ms: [6, 30], ti_mean_pct: 9.5, ti_std_pct: 2}\n");
  const TurbulenceModel model = ParseSiteModel(text, kFile).turbulence;
  EXPECT_EQ(model.kind, TurbulenceModel::Kind::kTable);
  ASSERT_EQ(model.table.size(), 2u);
  EXPECT_DOUBLE_EQ(model.table[0].wind_lo_ms, 0.0);
  EXPECT_DOUBLE_EQ(model.table[0].wind_hi_ms, 5.0);
  EXPECT_DOUBLE_EQ(model.table[0].ti_mean, 0.15);
  EXPECT_DOUBLE_EQ(model.table[0].ti_std, 0.05);
  EXPECT_DOUBLE_EQ(model.table[1].wind_lo_ms, 6.0);  // gaps are allowed
  EXPECT_DOUBLE_EQ(model.table[1].ti_mean, 0.095);
}

struct BadSite {
  const char* name;
  std::string text;
  std::string message;
};

const std::string kValidFields =
    "valid fields: name, description, sectors, sector_persistence, wind_persistence_h, "
    "monthly_factors, hourly_factors, interannual_std, mean_speed_uncertainty_pct, "
    "turbulence";

std::vector<BadSite> BadSites() {
  const std::string& b = kBaseSite;
  const std::string table =
      "turbulence:\n  model: table\n  rows:\n"
      "    - {wind_ms: [4, 6], ti_mean_pct: 12, ti_std_pct: 3}\n";
  const std::string with_table =
      Replace(b, "turbulence: {model: iec-ntm, class: A}\n", table);
  return {
      // The '}' at line 4, column 42 closes a '['; the text after "invalid
      // YAML:" is yaml-cpp's own.
      {"syntax error",
       Replace(b, "{frequency: 0.5, weibull_a_ms: 9", "[frequency: 0.5, x: 9"),
       "site.yaml:4:42: invalid YAML: illegal flow end"},
      {"root not a mapping", "just text\n",
       "site.yaml:1:1: expected a mapping, got 'just text'; " + kValidFields},
      {"empty document", "",
       "site.yaml: expected a mapping, got nothing; " + kValidFields},
      {"second document", b + "---\nname: other\n",
       "site.yaml:7:1: a second YAML document starts here; a file holds exactly one"},
      {"unknown key", b + "windpersistence_h: 30\n",
       "site.yaml:6:1: windpersistence_h: unknown field (did you mean "
       "'wind_persistence_h'?); " +
           kValidFields},
      {"duplicate key", b + "name: Other\n",
       "site.yaml:6:1: name: given twice (first at line 1); give each field once"},
      {"missing name", Replace(b, "name: Test site\n", ""),
       "site.yaml:1:1: name: required field is missing"},
      {"empty name", Replace(b, "name: Test site", "name: ''"),
       "site.yaml:1:7: name: is empty; give a name (shown in reports)"},
      {"missing turbulence", Replace(b, "turbulence: {model: iec-ntm, class: A}\n", ""),
       "site.yaml:1:1: turbulence: required field is missing"},
      {"sectors not a list",
       "name: x\nsectors: 5\nturbulence: {model: iec-ntm, class: A}\n",
       "site.yaml:2:10: sectors: expected a list, got '5'"},
      {"empty sectors", "name: x\nsectors: []\nturbulence: {model: iec-ntm, class: A}\n",
       "site.yaml:2:10: sectors: is empty; give one entry per direction sector, the "
       "first "
       "centred on north"},
      {"sector field misspelt", Replace(b, "weibull_a_ms: 8", "weibull_a: 8"),
       "site.yaml:3:22: sectors[0].weibull_a: unknown field (did you mean "
       "'weibull_a_ms'?); valid fields: frequency, weibull_a_ms, weibull_k"},
      {"weibull A not a number", Replace(b, "weibull_a_ms: 8", "weibull_a_ms: abc"),
       "site.yaml:3:36: sectors[0].weibull_a_ms: expected a number, got 'abc'"},
      {"weibull A infinite", Replace(b, "weibull_a_ms: 8", "weibull_a_ms: .inf"),
       "site.yaml:3:36: sectors[0].weibull_a_ms: expected a number, got '.inf'"},
      {"weibull A zero", Replace(b, "weibull_a_ms: 8", "weibull_a_ms: 0"),
       "site.yaml:3:36: sectors[0].weibull_a_ms: 0 is out of range; must be above 0 and "
       "at most 30 m/s"},
      {"weibull k negative", Replace(b, "weibull_k: 2.2", "weibull_k: -1"),
       "site.yaml:4:50: sectors[1].weibull_k: -1 is out of range; must be at least 1 and "
       "at most 20"},
      // A shape near 0 would put the mean wind at millions of m/s
      // (A * Gamma(1 + 1/k), Gamma(11) = 3,628,800 for k = 0.1).
      {"weibull k near zero", Replace(b, "weibull_k: 2.2", "weibull_k: 0.1"),
       "site.yaml:4:50: sectors[1].weibull_k: 0.1 is out of range; must be at least 1 "
       "and "
       "at most 20"},
      {"weibull k too large", Replace(b, "weibull_k: 2.2", "weibull_k: 25"),
       "site.yaml:4:50: sectors[1].weibull_k: 25 is out of range; must be at least 1 and "
       "at most 20"},
      {"missing weibull k", Replace(b, ", weibull_k: 2}", "}"),
       "site.yaml:3:5: sectors[0].weibull_k: required field is missing"},
      {"negative frequency",
       Replace(b, "frequency: 0.5, weibull_a_ms: 8", "frequency: -0.5, weibull_a_ms: 8"),
       "site.yaml:3:17: sectors[0].frequency: -0.5 is out of range; must be above 0 and "
       "at "
       "most 1"},
      {"frequencies do not sum to 1",
       Replace(b, "frequency: 0.5, weibull_a_ms: 9", "frequency: 0.4, weibull_a_ms: 9"),
       "site.yaml:3:3: sectors: frequencies sum to 0.9; they must sum to 1 (within "
       "0.005)"},
      {"persistence of 1", b + "sector_persistence: 1\n",
       "site.yaml:6:21: sector_persistence: 1 is out of range; must be at least 0 and "
       "below 1"},
      {"negative wind persistence", b + "wind_persistence_h: -5\n",
       "site.yaml:6:21: wind_persistence_h: -5 is out of range; must be at least 0 and "
       "at "
       "most 8760 h"},
      {"mean-wind uncertainty too large", b + "mean_speed_uncertainty_pct: 40\n",
       "site.yaml:6:29: mean_speed_uncertainty_pct: 40 is out of range; must be at least 0 "
       "and at most 30 %"},
      {"interannual too large", b + "interannual_std: 0.6\n",
       "site.yaml:6:18: interannual_std: 0.6 is out of range; must be at least 0 and at "
       "most 0.5"},
      {"eleven monthly factors",
       b + "monthly_factors: [1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1]\n",
       "site.yaml:6:18: monthly_factors: 11 values given; expected 12 (January to "
       "December)"},
      {"zero monthly factor",
       b + "monthly_factors: [1, 1, 1, 1, 1, 0, 1, 1, 1, 1, 1, 1]\n",
       "site.yaml:6:34: monthly_factors[5]: 0 is out of range; must be above 0 and at "
       "most "
       "10"},
      {"monthly factors not a list", b + "monthly_factors: 1\n",
       "site.yaml:6:18: monthly_factors: expected a list, got '1'"},
      {"two hourly factors", b + "hourly_factors: [1, 2]\n",
       "site.yaml:6:17: hourly_factors: 2 values given; expected 24 (hours 00 to 23)"},
      {"unknown turbulence model", Replace(b, "model: iec-ntm", "model: kaimal"),
       "site.yaml:5:21: turbulence.model: 'kaimal' is not a turbulence model; valid: "
       "iec-ntm, table"},
      {"unknown turbulence class", Replace(b, "class: A", "class: D"),
       "site.yaml:5:37: turbulence.class: 'D' is not an IEC 61400-1 turbulence class; "
       "valid: A+, A, B, C"},
      {"class and i_ref", Replace(b, "class: A", "class: A, i_ref: 0.1"),
       "site.yaml:5:47: turbulence.i_ref: given together with class; give either class "
       "or "
       "i_ref"},
      {"neither class nor i_ref", Replace(b, ", class: A", ""),
       "site.yaml:5:13: turbulence: gives neither class nor i_ref; give one (class: A+, "
       "A, "
       "B or C; or i_ref in (0, 0.5])"},
      {"i_ref too large", Replace(b, "class: A", "i_ref: 0.6"),
       "site.yaml:5:37: turbulence.i_ref: 0.6 is out of range; must be above 0 and at "
       "most "
       "0.5"},
      {"rows with the NTM", Replace(b, "class: A", "class: A, rows: []"),
       "site.yaml:5:40: turbulence.rows: unknown field for model 'iec-ntm'; valid "
       "fields: "
       "model, class, i_ref, persistence_h"},
      {"negative TI persistence", Replace(b, "class: A", "class: A, persistence_h: -1"),
       "site.yaml:5:55: turbulence.persistence_h: -1 is out of range; must be at least 0 "
       "and at most 8760 h"},
      {"class with a table",
       Replace(with_table, "  model: table\n", "  model: table\n  class: A\n"),
       "site.yaml:7:3: turbulence.class: unknown field for model 'table'; valid fields: "
       "model, rows, persistence_h"},
      {"table without rows",
       Replace(with_table,
               "  rows:\n    - {wind_ms: [4, 6], "
               "ti_mean_pct: 12, ti_std_pct: 3}\n",
               ""),
       "site.yaml:6:3: turbulence.rows: required field is missing"},
      {"empty table row bin", Replace(with_table, "[4, 6]", "[6, 6]"),
       "site.yaml:8:17: turbulence.rows[0].wind_ms: [6, 6] is an empty bin; lo must be "
       "below hi"},
      {"table rows overlap",
       with_table + "    - {wind_ms: [5, 8], ti_mean_pct: 10, ti_std_pct: 3}\n",
       "site.yaml:9:17: turbulence.rows[1].wind_ms: [5, 8] overlaps or comes before the "
       "previous row [4, 6]; rows must be sorted by wind speed and must not overlap"},
      {"table TI mean zero", Replace(with_table, "ti_mean_pct: 12", "ti_mean_pct: 0"),
       "site.yaml:8:38: turbulence.rows[0].ti_mean_pct: 0 is out of range; must be above "
       "0 "
       "and at most 100 %"},
      {"table wind as number", Replace(with_table, "[4, 6]", "4"),
       "site.yaml:8:17: turbulence.rows[0].wind_ms: expected a pair [lo, hi], got '4'"},
  };
}

TEST(SiteModelReaderTest, RejectsBadInputWithExactMessages) {
  for (const BadSite& c : BadSites()) {
    SCOPED_TRACE(c.name);
    EXPECT_EQ(SiteError(c.text), c.message);
  }
}

// A plan's path where a site model belongs (a plan's site_model naming a
// plan) is said in those words, not as a list of unknown fields.
TEST(SiteModelReaderTest, APlanReadAsASiteModelSaysSo) {
  EXPECT_EQ(
      ErrorOf([] { LoadSiteModel(reader_test::SourcePath("demo-site/plan.yaml")); }),
      reader_test::SourcePath("demo-site/plan.yaml") +
          ": is a campaign plan (it has 'campaign'), not a site model; a site model "
          "has 'sectors' and 'turbulence' (docs/site-model.md), and a plan names it "
          "in its site_model field");
}

TEST(SiteModelReaderTest, ASiteModelReadAsAPlanSaysSo) {
  EXPECT_EQ(
      ErrorOf(
          [] { LoadPlan(reader_test::SourcePath("site-models/coastal-ridge.yaml")); }),
      reader_test::SourcePath("site-models/coastal-ridge.yaml") +
          ": is a site model (it has 'sectors' and no 'campaign' or 'capture_matrix'), "
          "not a campaign plan; give the plan here and name this file in the plan's "
          "site_model field (docs/plan.md)");
}

TEST(SiteModelReaderTest, MissingFileIsNamed) {
  EXPECT_EQ(ErrorOf([] { LoadSiteModel("no/such/site.yaml"); }),
            "no/such/site.yaml: cannot open site model file: no such file");
}

TEST(SiteModelReaderTest, ErrorsInAFileNameThatFile) {
  const std::string path = ShippedPath("..");
  EXPECT_EQ(ErrorOf([&] { LoadSiteModel(path); }),
            path + ": cannot open site model file: it is a folder");
}

// Long-run mean = sum_i f_i A_i Gamma(1 + 1/k_i), because the month and hour
// factors average to 1 (Weibull mean: any wind-energy handbook; Boost.Math is
// the reference). The shipped files promise "about 8.8 m/s" and "about 6 m/s".
double MixtureMean(const SiteModel& site) {
  double mean = 0.0;
  for (const Sector& s : site.sectors) {
    const boost::math::weibull_distribution<double> w(s.weibull.shape,
                                                      s.weibull.scale_ms);
    mean += s.frequency * boost::math::mean(w);
  }
  return mean;
}

TEST(SiteModelReaderTest, ShippedCoastalRidgeLoadsAndMatchesItsDescription) {
  const SiteModel site = LoadSiteModel(ShippedPath("coastal-ridge.yaml"));
  EXPECT_NE(site.description.find("Invented"), std::string::npos);
  EXPECT_EQ(site.sectors.size(), 12u);
  EXPECT_NEAR(MixtureMean(site), 8.75, 0.25);
  EXPECT_EQ(site.turbulence.kind, TurbulenceModel::Kind::kTable);
  // Winter windier than summer.
  EXPECT_GT(site.monthly_factors[0], 1.2 * site.monthly_factors[6]);
}

TEST(SiteModelReaderTest, ShippedInlandForestEdgeLoadsAndMatchesItsDescription) {
  const SiteModel site = LoadSiteModel(ShippedPath("inland-forest-edge.yaml"));
  EXPECT_NE(site.description.find("Invented"), std::string::npos);
  EXPECT_EQ(site.sectors.size(), 12u);
  EXPECT_NEAR(MixtureMean(site), 6.0, 0.3);
  EXPECT_EQ(site.turbulence.kind, TurbulenceModel::Kind::kIecNtm);
  EXPECT_DOUBLE_EQ(site.turbulence.i_ref, 0.16);  // class A, IEC 61400-1
}

}  // namespace
}  // namespace planner
