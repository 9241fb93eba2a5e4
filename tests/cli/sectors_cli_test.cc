// End-to-end: the real fillcast binary's sectors command on the demo plan and
// on small plans whose answers follow by hand from IEC 61400-12-1 Annex A and
// the shipped coastal-ridge site model.
#include <gtest/gtest.h>
#include <unistd.h>

#include <boost/math/distributions/weibull.hpp>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <nlohmann/json.hpp>
#include <sstream>
#include <string>

#include "cli/cli_runner.h"

namespace {

namespace fs = std::filesystem;

using fillcast_test::Outcome;
using fillcast_test::RunFillcast;

std::string Demo() { return std::string(FILLCAST_SOURCE_DIR) + "/demo-site/plan.yaml"; }

// A scratch folder per test; its plans use the shipped coastal-ridge site.
class Scratch {
 public:
  Scratch() {
    const std::string test =
        ::testing::UnitTest::GetInstance()->current_test_info()->name();
    dir_ = fs::temp_directory_path() /
           ("fillcast-sectors-" + test + "-" + std::to_string(::getpid()));
    fs::create_directories(dir_);
  }
  ~Scratch() { fs::remove_all(dir_); }
  // `turbine_extra` adds keys to the turbine, e.g. ", rotor_diameter_m: 100".
  std::string Plan(const std::string& extra, const std::string& turbine_extra = "") {
    const std::string text =
        "name: Sector check\n"
        "site_model: " +
        std::string(FILLCAST_SOURCE_DIR) +
        "/site-models/coastal-ridge.yaml\n"
        "campaign: {start: 2027-03-01, deadline: 2028-03-01}\n"
        "turbine: {name: T1, cut_in_ms: 3, rated_ms: 11, cut_out_ms: 25" +
        turbine_extra +
        "}\n"
        "capture_matrix: {production: {wind_bins_ms: [4, 5], min_records: 1}}\n" +
        extra;
    return Write("plan.yaml", text);
  }
  std::string Write(const std::string& name, const std::string& text) {
    std::ofstream(dir_ / name) << text;
    return (dir_ / name).string();
  }
  std::string Path(const std::string& name) const { return (dir_ / name).string(); }

 private:
  fs::path dir_;
};

// alpha = 1.3 arctan(2.5 D/L + 0.15) + 10 deg (IEC 61400-12-1 Annex A).
double AnnexAWidthDeg(double l_over_d) {
  return 1.3 * std::atan(2.5 / l_over_d + 0.15) * 180.0 / M_PI + 10.0;
}

std::string Fixed1(double x) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.1f", x);
  return buf;
}

TEST(SectorsCliTest, DemoListsEachDisturbedSectorAndTheValidSectors) {
  const Outcome o = RunFillcast("sectors " + Demo());
  ASSERT_EQ(o.exit_code, 0) << o.output;
  // The turbine under test at 2.5 D and the neighbour, by the Annex A formula.
  EXPECT_NE(o.output.find("wake of the turbine under test QT-150 (invented prototype) "
                          "(L/D 2.5)"),
            std::string::npos)
      << o.output;
  EXPECT_NE(o.output.find(Fixed1(AnnexAWidthDeg(2.5))), std::string::npos);
  EXPECT_NE(o.output.find("wake of WTG-N1"), std::string::npos);
  EXPECT_NE(o.output.find("obstacle farm buildings"), std::string::npos);
  // Both views: the demo checks its sectors from the QT-150 too.
  EXPECT_NE(o.output.find("Seen from the met mast"), std::string::npos);
  EXPECT_NE(o.output.find("Seen from the turbine under test, QT-150"), std::string::npos);
  EXPECT_NE(o.output.find("Manual exclusions"), std::string::npos);
  EXPECT_NE(o.output.find("Valid sectors"), std::string::npos);
  EXPECT_NE(o.output.find("Cautions"), std::string::npos);
  EXPECT_NE(o.output.find("certification body"), std::string::npos);
}

TEST(SectorsCliTest, ShowsWhyEachSectorIsOutFromTheMastAndFromTheTurbine) {
  Scratch s;
  // Mast at the origin, turbine 300 m east (D 100 m: L/D 3 on the mast,
  // centred on 90). WTG-SE is 1199.4 m east and 1599.2 m south of the turbine
  // (3-4-5: 1999 m, L/D 19.99, bearing 180 - atan(3/4) = 143.13 deg, about the
  // 30.0 deg Annex A gives at L/D 20) and 2192.2 m from the mast (L/D 21.9:
  // no sector). WTG-SW mirrors it about the mast: 1999 m from the mast on
  // 216.87 deg, 2192.2 m from the turbine.
  const std::string plan = s.Plan(
      "layout:\n"
      "  mast: {x_m: 0, y_m: 0}\n"
      "  turbine_under_test: {x_m: 300, y_m: 0}\n"
      "  neighbours:\n"
      "    - {name: WTG-SE, x_m: 1499.4, y_m: -1599.2, rotor_diameter_m: 100}\n"
      "    - {name: WTG-SW, x_m: -1199.4, y_m: -1599.2, rotor_diameter_m: 100}\n",
      ", rotor_diameter_m: 100");  // for the turbine's wake on the mast
  const Outcome o = RunFillcast("sectors " + plan + " --json " + s.Path("out.json"));
  ASSERT_EQ(o.exit_code, 0) << o.output;
  const std::size_t mast = o.output.find("Seen from the met mast");
  const std::size_t turbine = o.output.find(
      "Seen from the turbine under test, T1 (300.0 m "
      "from the mast on bearing 90.0 deg");
  ASSERT_NE(mast, std::string::npos) << o.output;
  ASSERT_NE(turbine, std::string::npos) << o.output;
  ASSERT_LT(mast, turbine);
  const std::string mast_view = o.output.substr(mast, turbine - mast);
  const std::string turbine_view = o.output.substr(turbine);
  EXPECT_NE(mast_view.find("wake of the turbine under test T1 (L/D 3.0)"),
            std::string::npos);
  EXPECT_NE(mast_view.find("wake of WTG-SE (L/D 21.9)"), std::string::npos);
  EXPECT_NE(mast_view.find("wake of WTG-SW (L/D 20.0)"), std::string::npos);
  EXPECT_NE(turbine_view.find("wake of WTG-SE (L/D 20.0)"), std::string::npos);
  EXPECT_NE(turbine_view.find("wake of WTG-SW (L/D 21.9)"), std::string::npos);
  // Centres and widths, as printed (one decimal).
  const double c_se = 180.0 - std::atan(0.75) * 180.0 / M_PI;
  const double c_sw = 180.0 + std::atan(0.75) * 180.0 / M_PI;
  const double w = AnnexAWidthDeg(19.99);
  EXPECT_NEAR(w, 30.0, 0.05);  // Annex A check value at L/D 20
  EXPECT_NE(turbine_view.find(Fixed1(c_se - w / 2) + "  " + Fixed1(c_se + w / 2)),
            std::string::npos)
      << turbine_view;
  EXPECT_NE(mast_view.find(Fixed1(c_sw - w / 2) + "  " + Fixed1(c_sw + w / 2)),
            std::string::npos)
      << mast_view;

  std::ifstream in(s.Path("out.json"));
  const nlohmann::json j = nlohmann::json::parse(in);
  EXPECT_EQ(j["turbine_under_test"]["name"], "T1");
  EXPECT_NEAR(j["turbine_under_test"]["bearing_from_mast_deg"].get<double>(), 90.0, 1e-9);
  EXPECT_NEAR(j["turbine_under_test"]["distance_from_mast_m"].get<double>(), 300.0, 1e-9);
  ASSERT_EQ(j["disturbed_sectors"].size(),
            5u);  // 1 + 2 from the mast, 2 from the turbine
  const nlohmann::json& d = j["disturbed_sectors"];
  EXPECT_EQ(d[0]["kind"], "turbine_under_test");
  EXPECT_EQ(d[0]["seen_from"], "mast");
  EXPECT_NEAR(d[0]["width_deg"].get<double>(), AnnexAWidthDeg(3.0), 1e-9);
  EXPECT_EQ(d[1]["seen_from"], "mast");
  EXPECT_FALSE(d[1]["excluded"].get<bool>());  // WTG-SE from the mast
  EXPECT_TRUE(d[2]["excluded"].get<bool>());   // WTG-SW from the mast
  EXPECT_EQ(d[3]["seen_from"], "turbine_under_test");
  EXPECT_TRUE(d[3]["excluded"].get<bool>());  // WTG-SE from the turbine
  EXPECT_EQ(d[4]["seen_from"], "turbine_under_test");
  EXPECT_FALSE(d[4]["excluded"].get<bool>());  // WTG-SW from the turbine
  // Valid: the circle minus the three sectors that exclude something.
  EXPECT_NEAR(j["valid_total"]["width_deg"].get<double>(),
              360.0 - AnnexAWidthDeg(3.0) - d[2]["width_deg"].get<double>() -
                  d[3]["width_deg"].get<double>(),
              1e-9);
}

TEST(SectorsCliTest, SharesFollowTheSiteSectorFrequencies) {
  Scratch s;
  // Allowed 195-315 (the 210, 240, 270 and 300 sectors of coastal-ridge.yaml),
  // minus the exclusion 285-315: 195-285 remains, sectors 210, 240 and 270,
  // frequencies 0.13 + 0.16 + 0.14 = 0.43 (read from the site file).
  const std::string plan =
      s.Plan("valid_sectors_deg: [[195, 315]]\nlayout: {exclusions_deg: [[285, 315]]}\n");
  const Outcome o = RunFillcast("sectors " + plan + " --json " + s.Path("out.json"));
  ASSERT_EQ(o.exit_code, 0) << o.output;
  EXPECT_NE(o.output.find("  195.0  285.0   90.0   43.0"), std::string::npos) << o.output;
  // What valid_sectors_deg alone leaves out: 315 round to 195.
  EXPECT_NE(o.output.find("Outside valid_sectors_deg"), std::string::npos);
  EXPECT_NE(o.output.find("  315.0  195.0  240.0"), std::string::npos);

  std::ifstream in(s.Path("out.json"));
  const nlohmann::json j = nlohmann::json::parse(in);
  EXPECT_EQ(j["tool"]["name"], "fillcast");
  ASSERT_EQ(j["valid_sectors"].size(), 1u);
  EXPECT_DOUBLE_EQ(j["valid_sectors"][0]["from_deg"].get<double>(), 195.0);
  EXPECT_DOUBLE_EQ(j["valid_sectors"][0]["to_deg"].get<double>(), 285.0);
  EXPECT_NEAR(j["valid_total"]["time_share"].get<double>(), 0.43, 1e-9);
  // Energy: frequency x E[V^3] per sector, E[V^3] from Boost.Math's Weibull
  // moments (m^3 + 3 m s^2 + skewness s^3); A and k from coastal-ridge.yaml.
  const double freq[12] = {0.05, 0.04, 0.04, 0.05, 0.05, 0.06,
                           0.09, 0.13, 0.16, 0.14, 0.10, 0.09};
  const double a[12] = {8.6, 7.9, 7.6, 8.2, 8.4, 9.0, 10.1, 10.8, 11.2, 10.9, 10.0, 9.2};
  const double k[12] = {2.0, 2.0, 1.9, 2.0, 2.1, 2.1, 2.2, 2.3, 2.4, 2.3, 2.2, 2.1};
  double total = 0.0;
  double valid = 0.0;
  for (int i = 0; i < 12; ++i) {
    const boost::math::weibull_distribution<> w(k[i], a[i]);
    const double m = boost::math::mean(w);
    const double sd = boost::math::standard_deviation(w);
    const double e =
        freq[i] * (m * m * m + 3 * m * sd * sd + boost::math::skewness(w) * sd * sd * sd);
    total += e;
    if (i >= 7 && i <= 9) valid += e;
  }
  EXPECT_NEAR(j["valid_total"]["energy_share"].get<double>(), valid / total, 1e-9);
  ASSERT_EQ(j["exclusions"].size(), 1u);
  EXPECT_EQ(j["cautions"].size(), 3u);
}

TEST(SectorsCliTest, OutsideTheFormulasRangeIsReportedWithANote) {
  Scratch s;
  // L/D 1 is extended (wider than at L/D 2); L/D 25 is not excluded.
  const std::string plan = s.Plan(
      "layout:\n"
      "  neighbours:\n"
      "    - {name: NEAR, bearing_deg: 90, distance_m: 100, rotor_diameter_m: 100}\n"
      "    - {name: FAR, bearing_deg: 270, distance_m: 2500, rotor_diameter_m: 100}\n");
  const Outcome o = RunFillcast("sectors " + plan + " --json " + s.Path("out.json"));
  ASSERT_EQ(o.exit_code, 0) << o.output;
  EXPECT_NE(o.output.find("note: L/D below 2"), std::string::npos) << o.output;
  EXPECT_NE(o.output.find("note: L/D above 20, beyond the formula's range: not excluded"),
            std::string::npos);
  std::ifstream in(s.Path("out.json"));
  const nlohmann::json j = nlohmann::json::parse(in);
  ASSERT_EQ(j["disturbed_sectors"].size(), 2u);
  EXPECT_TRUE(j["disturbed_sectors"][0]["excluded"].get<bool>());
  EXPECT_NEAR(j["disturbed_sectors"][0]["width_deg"].get<double>(), AnnexAWidthDeg(1.0),
              1e-9);
  EXPECT_FALSE(j["disturbed_sectors"][1]["excluded"].get<bool>());
  EXPECT_EQ(j["disturbed_sectors"][1]["kind"], "neighbour");
  // The valid sector is the circle minus the near neighbour's sector alone.
  EXPECT_NEAR(j["valid_total"]["width_deg"].get<double>(), 360.0 - AnnexAWidthDeg(1.0),
              1e-9);
}

TEST(SectorsCliTest, BadLayoutIsReportedWithFileLineAndField) {
  Scratch s;
  const std::string plan = s.Plan("layout: {exclusions_deg: [[0, 360]]}\n");
  const Outcome o = RunFillcast("sectors " + plan);
  EXPECT_EQ(o.exit_code, 2);
  EXPECT_NE(o.output.find(plan + ":6:9: layout: leaves no valid sector"),
            std::string::npos)
      << o.output;
}

TEST(SectorsCliTest, RefusesToOverwriteAFileItDidNotWrite) {
  Scratch s;
  const std::string precious = s.Write("notes.json", "{\"my\": \"notes\"}\n");
  const Outcome o = RunFillcast("sectors " + Demo() + " --json " + precious);
  EXPECT_EQ(o.exit_code, 2);
  EXPECT_NE(o.output.find("was not written by fillcast"), std::string::npos) << o.output;
  std::ifstream in(precious);
  std::stringstream kept;
  kept << in.rdbuf();
  EXPECT_EQ(kept.str(), "{\"my\": \"notes\"}\n");
  EXPECT_EQ(
      RunFillcast("sectors " + Demo() + " --json " + precious + " --force").exit_code, 0);
}

TEST(SectorsCliTest, MissingPlanIsAnError) {
  const Outcome none = RunFillcast("sectors");
  EXPECT_NE(none.exit_code, 0);
  EXPECT_NE(none.output.find("plan is required"), std::string::npos) << none.output;
  const Outcome missing = RunFillcast("sectors /nonexistent/plan.yaml");
  EXPECT_EQ(missing.exit_code, 2);
  EXPECT_NE(missing.output.find("/nonexistent/plan.yaml: cannot open plan file"),
            std::string::npos)
      << missing.output;
}

}  // namespace
