// Site-model writer (io/site_model_writer.h): what it writes is read back by
// the site-model reader (docs/site-model.md) to the same model, it carries
// fillcast's mark and the caution, and a fitted model's comments say where
// it came from.
#include "io/site_model_writer.h"

#include <gtest/gtest.h>

#include <cmath>
#include <filesystem>
#include <fstream>
#include <string>

#include "cli/output_file.h"
#include "io/reader_test_util.h"
#include "planner/plan_reader.h"

namespace planner {
namespace {

// Numbers are written to 6 significant digits: relative rounding at most
// 5e-6. Frequencies and month and hour factors are renormalised by the
// reader, which adds at most the same again (their sum or weighted mean is
// off by at most 5e-6 relative): 1e-5 for those.
void ExpectClose(double a, double b, const std::string& what, double tolerance = 5e-6) {
  EXPECT_NEAR(a, b, tolerance * std::fabs(b) + 1e-12) << what;
}

void ExpectSameModel(const SiteModel& a, const SiteModel& b) {
  EXPECT_EQ(a.name, b.name);
  EXPECT_EQ(a.description, b.description);
  ASSERT_EQ(a.sectors.size(), b.sectors.size());
  for (std::size_t i = 0; i < a.sectors.size(); ++i) {
    ExpectClose(a.sectors[i].frequency, b.sectors[i].frequency, "frequency", 1e-5);
    ExpectClose(a.sectors[i].weibull.scale_ms, b.sectors[i].weibull.scale_ms, "A");
    ExpectClose(a.sectors[i].weibull.shape, b.sectors[i].weibull.shape, "k");
  }
  ExpectClose(a.sector_persistence, b.sector_persistence, "sector_persistence");
  ExpectClose(a.wind_persistence_h, b.wind_persistence_h, "wind_persistence_h");
  for (int m = 0; m < 12; ++m) {
    ExpectClose(a.monthly_factors[m], b.monthly_factors[m], "month", 1e-5);
  }
  for (int h = 0; h < 24; ++h) {
    ExpectClose(a.hourly_factors[h], b.hourly_factors[h], "hour", 1e-5);
  }
  ExpectClose(a.interannual_std, b.interannual_std, "interannual_std");
  const TurbulenceModel &ta = a.turbulence, &tb = b.turbulence;
  EXPECT_EQ(ta.kind, tb.kind);
  ExpectClose(ta.i_ref, tb.i_ref, "i_ref");
  ExpectClose(ta.persistence_h, tb.persistence_h, "persistence_h");
  ASSERT_EQ(ta.table.size(), tb.table.size());
  for (std::size_t i = 0; i < ta.table.size(); ++i) {
    ExpectClose(ta.table[i].wind_lo_ms, tb.table[i].wind_lo_ms, "lo");
    ExpectClose(ta.table[i].wind_hi_ms, tb.table[i].wind_hi_ms, "hi");
    ExpectClose(ta.table[i].ti_mean, tb.table[i].ti_mean, "ti_mean");
    ExpectClose(ta.table[i].ti_std, tb.table[i].ti_std, "ti_std");
  }
}

SiteModel RoundTrip(const SiteModel& site) {
  return ParseSiteModel(FormatSiteModelYaml(site, {"a comment"}), "written.yaml");
}

// The shipped models use every field the format has (table and IEC
// turbulence, month and hour factors).
TEST(SiteModelWriterTest, ShippedSiteModelsReadBackUnchanged) {
  for (const char* name : {"coastal-ridge.yaml", "inland-forest-edge.yaml"}) {
    const SiteModel site = LoadSiteModel(reader_test::SourcePath("site-models/") + name);
    ExpectSameModel(RoundTrip(site), site);
  }
}

TEST(SiteModelWriterTest, OddNamesAndAnIRefOutsideTheClassesReadBack) {
  SiteModel site;
  site.name = "Ridge: \"north\" mast #2";
  site.description = "Back\\slash, colon: and\nnew line";
  site.sectors = {Sector{0.25, Weibull{6.123456789, 1.75}},
                  Sector{0.75, Weibull{9.5, 2.4}}};
  site.turbulence.kind = TurbulenceModel::Kind::kIecNtm;
  site.turbulence.i_ref = 0.137;
  site.turbulence.persistence_h = 2.5;
  site.wind_persistence_h = 0.0;
  site.monthly_factors[0] = 1.3;  // the reader renormalises; compare after one pass
  const SiteModel once = RoundTrip(site);
  ExpectSameModel(RoundTrip(once), once);
  EXPECT_EQ(once.name, site.name);
  EXPECT_EQ(once.description, site.description);
  ExpectClose(once.sectors[0].weibull.scale_ms, 6.123456789, "A");
  ExpectClose(once.turbulence.i_ref, 0.137, "i_ref");
}

TEST(SiteModelWriterTest, StartsWithFillcastsMarkAndTheComments) {
  SiteModel site;
  site.name = "Flat";
  site.sectors = {Sector{1.0, Weibull{8.0, 2.0}}};
  const std::string text = FormatSiteModelYaml(site, {"Fitted from x.csv."});
  EXPECT_EQ(text.rfind("# generator=fillcast " FILLCAST_VERSION
                       " fillcast-seal:0000000000000000\n# Fitted from x.csv.\n",
                       0),
            0u)
      << text;
  EXPECT_NE(text.find("  class: \"A\"\n"), std::string::npos) << text;  // I_ref 0.16
  // Written as every output file is (cli/output_file.h), it carries a valid
  // seal, so a new fit may replace it without --force; the unsealed text
  // (or the file edited) would not.
  const auto path = std::filesystem::temp_directory_path() / "fillcast-writer-mark.yaml";
  std::filesystem::remove(path);
  WriteOutputFile(path.string(), text, false, {}, "-o");
  EXPECT_TRUE(WrittenByFillcast(path.string()));
  std::ofstream(path, std::ios::app) << "# my note\n";
  EXPECT_FALSE(WrittenByFillcast(path.string()));
  std::ofstream(path) << text;
  EXPECT_FALSE(WrittenByFillcast(path.string()));
  std::filesystem::remove(path);
}

TEST(SiteModelWriterTest, FittedModelCommentsNameTheSourceAndTheCaution) {
  FitReport r;
  r.read.file = "masts/north.csv";
  r.read.time_column = "timestamp";
  r.read.speed_column = "ws";
  r.read.direction_column = "wd";
  r.read.units = SpeedUnit::kKnots;
  r.read.units_source = "declared with --units";
  r.read.step_s = 600;
  r.read.first_time_s = 1709251200;       // 2024-03-01 00:00 (timegm)
  r.read.last_time_s = 1740787200 - 600;  // 2025-02-28 23:50
  r.read.rows_read = 52600;
  r.read.rows_kept = 52500;
  r.read.dropped[0] = 100;
  r.calms = 42;
  r.calm_ms = 0.5;
  r.persistence_lag_h = 24;
  r.warnings = {"Something to know."};
  const std::vector<std::string> c = FittedModelComments(r);
  ASSERT_EQ(c.size(), 6u);
  EXPECT_EQ(c[0], "Fitted by fillcast fit-site from masts/north.csv.");
  EXPECT_EQ(c[1],
            "Columns: time 'timestamp', speed 'ws' (knots, declared with --units), no "
            "standard deviation, direction 'wd'.");
  EXPECT_EQ(
      c[2],
      "Data: 2024-03-01 00:00 to 2025-02-28 23:50, step 10 min; 52600 rows read, 52500 "
      "kept, 100 dropped; 42 calms (below 0.5 m/s), censored in the Weibull fit.");
  EXPECT_EQ(c[4], "Warning: Something to know.");
  EXPECT_EQ(
      c[5].rfind("Caution: a fitted site model is an estimate from the measured period, "
                 "not a promise about future wind.",
                 0),
      0u);
}

}  // namespace
}  // namespace planner
