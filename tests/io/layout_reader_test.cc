// The layout section of a plan: neighbours by bearing or by coordinates,
// obstacles, exclusions, the valid sectors that follow, and every rejected
// input with its exact message.
#include <gtest/gtest.h>

#include <cmath>
#include <string>
#include <vector>

#include "io/reader_test_util.h"
#include "planner/disturbed_sector.h"
#include "planner/plan_reader.h"

namespace planner {
namespace {

using reader_test::ErrorOf;
using reader_test::Replace;
using reader_test::SourcePath;

// Eight lines; the layout follows from line 9.
const std::string kBase = reader_test::BasePlan("Layout test");

// Lines 9-14.
const std::string kNeighbour =
    "layout:\n"
    "  neighbours:\n"
    "    - name: WTG-A\n"
    "      bearing_deg: 90\n"
    "      distance_m: 400\n"
    "      rotor_diameter_m: 100\n";

const auto& Parse = reader_test::ParseTestPlan;
const auto& PlanError = reader_test::TestPlanError;

void ExpectRange(const AngleRange& r, double from_deg, double to_deg) {
  EXPECT_NEAR(r.from_deg, from_deg, 1e-9);
  EXPECT_NEAR(r.to_deg, to_deg, 1e-9);
}

TEST(LayoutReaderTest, ReadsEveryKindOfItemAndRemovesItsSectors) {
  const Plan plan = Parse(
      kBase +
      "layout:\n"
      "  mast: {x_m: 1000, y_m: 2000}\n"
      "  neighbours:\n"
      "    - {name: WTG-A, bearing_deg: 90, distance_m: 400, rotor_diameter_m: 100}\n"
      "    - {name: WTG-B, x_m: 1000, y_m: 1000, rotor_diameter_m: 100}\n"
      "  obstacles:\n"
      "    - {name: shed, bearing_deg: 300, distance_m: 60, height_m: 10, width_m: 30}\n"
      "  exclusions_deg: [[20, 40]]\n");
  const SiteLayout& l = plan.layout;
  ASSERT_EQ(l.neighbours.size(), 2u);
  EXPECT_EQ(l.neighbours[0].name, "WTG-A");
  EXPECT_DOUBLE_EQ(l.neighbours[0].bearing_deg, 90.0);
  EXPECT_DOUBLE_EQ(l.neighbours[0].distance_m, 400.0);
  EXPECT_DOUBLE_EQ(l.neighbours[0].rotor_diameter_m, 100.0);
  // 1000 m due south of the mast.
  EXPECT_NEAR(l.neighbours[1].bearing_deg, 180.0, 1e-9);
  EXPECT_NEAR(l.neighbours[1].distance_m, 1000.0, 1e-9);
  ASSERT_EQ(l.obstacles.size(), 1u);
  EXPECT_EQ(l.obstacles[0].name, "shed");
  EXPECT_DOUBLE_EQ(l.obstacles[0].height_m, 10.0);
  EXPECT_DOUBLE_EQ(l.obstacles[0].width_m, 30.0);
  ASSERT_EQ(l.exclusions.size(), 1u);
  ExpectRange(l.exclusions[0], 20, 40);
  // L/D 4 (half-width a), L/D 10 (b), the shed at L/D_e 4 (a), and 20-40:
  // IEC 61400-12-1 Annex A formula, check values 59.1 and 38.3 deg (DESIGN.md).
  const double a = DisturbedSectorWidthDeg(4.0) / 2.0;
  const double b = DisturbedSectorWidthDeg(10.0) / 2.0;
  EXPECT_NEAR(2 * a, 59.1, 0.05);
  EXPECT_NEAR(2 * b, 38.3, 0.05);
  ASSERT_EQ(plan.valid_sectors.size(), 4u);
  ExpectRange(plan.valid_sectors[0], 40, 90 - a);
  ExpectRange(plan.valid_sectors[1], 90 + a, 180 - b);
  ExpectRange(plan.valid_sectors[2], 180 + b, 300 - a);
  ExpectRange(plan.valid_sectors[3], 300 + a, 20);  // through north
}

TEST(LayoutReaderTest, CoordinatesGiveBearingClockwiseFromNorth) {
  // 300 m east and 400 m north of the mast: 500 m away (3-4-5 triangle), on
  // bearing atan(300 / 400) = 36.87 deg; 300 m west and 400 m south: 216.87 deg.
  const Plan plan =
      Parse(kBase +
            "layout:\n"
            "  mast: {x_m: -100, y_m: 50}\n"
            "  neighbours:\n"
            "    - {name: NE, x_m: 200, y_m: 450, rotor_diameter_m: 10}\n"
            "    - {name: SW, x_m: -400, y_m: -350, rotor_diameter_m: 10}\n");
  ASSERT_EQ(plan.layout.neighbours.size(), 2u);
  EXPECT_NEAR(plan.layout.neighbours[0].distance_m, 500.0, 1e-9);
  EXPECT_NEAR(plan.layout.neighbours[0].bearing_deg, 36.869898, 1e-6);
  EXPECT_NEAR(plan.layout.neighbours[1].distance_m, 500.0, 1e-9);
  EXPECT_NEAR(plan.layout.neighbours[1].bearing_deg, 216.869898, 1e-6);
}

TEST(LayoutReaderTest, LayoutNarrowsThePlansOwnSectors) {
  const Plan plan =
      Parse(kBase + "valid_sectors_deg: [[180, 270]]\n" +
            "layout: {neighbours: [{name: S, bearing_deg: 180, distance_m: 1000, "
            "rotor_diameter_m: 100}]}\n");
  const double b = DisturbedSectorWidthDeg(10.0) / 2.0;
  ASSERT_EQ(plan.valid_sectors.size(), 1u);
  ExpectRange(plan.valid_sectors[0], 180 + b, 270);
}

// The base plan with the turbine's rotor diameter (line 4), which the turbine
// under test needs.
const std::string kBaseWithRotor =
    Replace(kBase, "cut_out_ms: 25}", "cut_out_ms: 25, rotor_diameter_m: 100}");

TEST(LayoutReaderTest, TurbineUnderTestIsPlacedLikeANeighbourAndNamedFromTheTurbine) {
  // 300 m east and 400 m north of the mast: 500 m on bearing atan(3/4) =
  // 36.87 deg (3-4-5 triangle); as bearing and distance, the same.
  for (const std::string& position :
       {std::string("{x_m: 400, y_m: 600}"),
        std::string("{bearing_deg: 36.86989764584402, distance_m: 500}")}) {
    const Plan plan = Parse(kBaseWithRotor +
                            "layout:\n"
                            "  mast: {x_m: 100, y_m: 200}\n"
                            "  turbine_under_test: " +
                            position + "\n");
    ASSERT_TRUE(plan.layout.turbine_under_test.has_value()) << position;
    const TurbineUnderTest& t = *plan.layout.turbine_under_test;
    EXPECT_EQ(t.name, "T1");
    EXPECT_DOUBLE_EQ(t.rotor_diameter_m, 100.0);
    EXPECT_NEAR(t.distance_m, 500.0, 1e-9);
    EXPECT_NEAR(t.bearing_deg, std::atan(0.75) * 180.0 / M_PI, 1e-9);
    // Its wake on the mast at L/D 5 is the only disturbed sector (Annex A).
    const double half = DisturbedSectorWidthDeg(5.0) / 2.0;
    ASSERT_EQ(plan.valid_sectors.size(), 1u);
    ExpectRange(plan.valid_sectors[0], t.bearing_deg + half, t.bearing_deg - half);
  }
}

TEST(LayoutReaderTest, NeighboursAreCheckedFromTheTurbineUnderTestToo) {
  // Turbine 300 m east of the mast; WTG-S 400 m due south of the turbine
  // (L/D 4: 59.1 deg, Annex A check value, centred on 180) and 500 m from the
  // mast (3-4-5: L/D 5, centred on 180 - atan(3/4) = 143.13 deg).
  const Plan plan =
      Parse(kBaseWithRotor +
            "layout:\n"
            "  mast: {x_m: 0, y_m: 0}\n"
            "  turbine_under_test: {x_m: 300, y_m: 0}\n"
            "  neighbours:\n"
            "    - {name: WTG-S, x_m: 300, y_m: -400, rotor_diameter_m: 100}\n");
  const double t = DisturbedSectorWidthDeg(3.0) / 2.0;  // the turbine's wake on the mast
  const double m = DisturbedSectorWidthDeg(5.0) / 2.0;  // WTG-S from the mast
  const double u = DisturbedSectorWidthDeg(4.0) / 2.0;  // WTG-S from the turbine
  EXPECT_NEAR(2 * u, 59.1, 0.05);
  const double b = 180.0 - std::atan(0.75) * 180.0 / M_PI;
  // 90 + t = 124.0 lies inside WTG-S's mast sector (b - m = 118.9), so one
  // disturbed stretch runs from 90 - t to 180 + u.
  ASSERT_LT(b - m, 90 + t);
  ASSERT_EQ(plan.valid_sectors.size(), 1u);
  ExpectRange(plan.valid_sectors[0], 180 + u, 90 - t);
}

TEST(LayoutReaderTest, TurbineUnderTestAloneGivesTheSectorsOfListingItAsANeighbour) {
  // Opting in with nothing else seen from the turbine changes nothing: the
  // turbine's wake on the mast is the neighbour entry plans used before, so
  // the valid sectors (and hence the forecast) are exactly the same. The shed
  // (D_e 15 m) is 60 m from the mast straight behind it, 310 m from the
  // turbine: L/D_e 20.7, beyond the formula's range from the turbine.
  const std::string rest =
      "  obstacles:\n"
      "    - {name: shed, bearing_deg: 240, distance_m: 60, height_m: 10, width_m: 30}\n"
      "  exclusions_deg: [[150, 190]]\n";
  const Plan as_neighbour =
      Parse(kBaseWithRotor +
            "layout:\n  neighbours:\n    - {name: T1, bearing_deg: 60, distance_m: 250, "
            "rotor_diameter_m: 100}\n" +
            rest);
  const Plan as_turbine =
      Parse(kBaseWithRotor +
            "layout:\n  turbine_under_test: {bearing_deg: 60, distance_m: 250}\n" + rest);
  ASSERT_EQ(as_turbine.valid_sectors.size(), as_neighbour.valid_sectors.size());
  for (std::size_t i = 0; i < as_turbine.valid_sectors.size(); ++i) {
    EXPECT_EQ(as_turbine.valid_sectors[i].from_deg,
              as_neighbour.valid_sectors[i].from_deg);
    EXPECT_EQ(as_turbine.valid_sectors[i].to_deg, as_neighbour.valid_sectors[i].to_deg);
  }
}

TEST(LayoutReaderTest, NoLayoutKeepsTheWrittenSectors) {
  const Plan plan = Parse(kBase + "valid_sectors_deg: [[300, 60]]\n");
  EXPECT_TRUE(plan.layout.empty());
  ASSERT_EQ(plan.valid_sectors.size(), 1u);
  ExpectRange(plan.valid_sectors[0], 300, 60);
}

using reader_test::BadInput;

const std::string kNeighbour0 = "layout.neighbours[0]";

std::vector<BadInput> BadInputs() {
  const std::string n = kBase + kNeighbour;
  const std::string polar = "      bearing_deg: 90\n      distance_m: 400\n";
  return {
      {"bearing and coordinates", n + "      x_m: 5\n",
       "plan.yaml:15:12: " + kNeighbour0 +
           ".x_m: given together with bearing_deg; give the position either as "
           "bearing_deg and distance_m, or as x_m and y_m"},
      {"no position", Replace(n, polar, ""),
       "plan.yaml:11:7: " + kNeighbour0 +
           ": has no position; give bearing_deg and distance_m, or x_m and y_m (with "
           "layout.mast)"},
      {"bearing without distance", Replace(n, "      distance_m: 400\n", ""),
       "plan.yaml:11:7: " + kNeighbour0 + ".distance_m: required field is missing"},
      {"bearing of 360", Replace(n, "bearing_deg: 90", "bearing_deg: 360"),
       "plan.yaml:12:20: " + kNeighbour0 +
           ".bearing_deg: 360 is out of range; must be at least 0 and below 360 degrees"},
      {"distance of 0", Replace(n, "distance_m: 400", "distance_m: 0"),
       "plan.yaml:13:19: " + kNeighbour0 +
           ".distance_m: 0 is out of range; must be above 0 and at most 100000 m"},
      {"rotor of 0", Replace(n, "rotor_diameter_m: 100", "rotor_diameter_m: 0"),
       "plan.yaml:14:25: " + kNeighbour0 +
           ".rotor_diameter_m: 0 is out of range; must be above 0 and at most 500 m"},
      {"coordinates without a mast", Replace(n, polar, "      x_m: 100\n      y_m: 0\n"),
       "plan.yaml:11:7: " + kNeighbour0 +
           ": gives x_m and y_m but layout.mast is missing; give the measurement point "
           "as mast: {x_m, y_m} (x east, y north)"},
      {"x without y", Replace(n, polar, "      x_m: 100\n"),
       "plan.yaml:11:7: " + kNeighbour0 + ".y_m: required field is missing"},
      {"neighbour on the mast",
       Replace(Replace(n, polar, "      x_m: 100\n      y_m: 0\n"), "layout:\n",
               "layout:\n  mast: {x_m: 100, y_m: 0}\n"),
       "plan.yaml:12:7: " + kNeighbour0 +
           ": is at the measurement point (layout.mast); check the coordinates"},
      {"mast key misspelt", Replace(n, "layout:\n", "layout:\n  mast: {x: 1, y_m: 0}\n"),
       "plan.yaml:10:10: layout.mast.x: unknown field (did you mean 'x_m'?); valid "
       "fields: x_m, y_m"},
      {"name used twice",
       n + "  obstacles:\n"
           "    - {name: WTG-A, bearing_deg: 10, distance_m: 50, height_m: 8, width_m: "
           "20}\n",
       "plan.yaml:16:14: layout.obstacles[0].name: 'WTG-A' is already the name of "
       "layout.neighbours[0]; give each neighbour or obstacle its own name"},
      {"obstacle of no height",
       n + "  obstacles:\n"
           "    - {name: shed, bearing_deg: 10, distance_m: 50, height_m: 0, width_m: "
           "20}\n",
       "plan.yaml:16:63: layout.obstacles[0].height_m: 0 is out of range; must be above "
       "0 "
       "and at most 1000 m"},
      {"obstacle without width",
       n + "  obstacles:\n    - {name: shed, bearing_deg: 10, distance_m: 50, height_m: "
           "8}\n",
       "plan.yaml:16:7: layout.obstacles[0].width_m: required field is missing"},
      {"unknown neighbour key", Replace(n, "rotor_diameter_m", "diameter_m"),
       "plan.yaml:14:7: " + kNeighbour0 +
           ".diameter_m: unknown field; valid fields: name, bearing_deg, distance_m, "
           "x_m, y_m, rotor_diameter_m"},
      {"empty layout", kBase + "layout: {}\n",
       "plan.yaml:9:9: layout: gives nothing to exclude; give turbine_under_test, "
       "neighbours, obstacles or exclusions_deg"},
      {"turbine under test without a rotor diameter",
       kBase + "layout:\n  turbine_under_test: {bearing_deg: 60, distance_m: 300}\n",
       "plan.yaml:10:23: layout.turbine_under_test: needs the rotor diameter of the "
       "turbine under test for its wake on the mast; give turbine.rotor_diameter_m"},
      {"turbine under test without a position",
       kBaseWithRotor + "layout:\n  turbine_under_test: {}\n",
       "plan.yaml:10:23: layout.turbine_under_test: has no position; give bearing_deg "
       "and distance_m, or x_m and y_m (with layout.mast)"},
      {"turbine under test on the mast",
       kBaseWithRotor +
           "layout:\n  mast: {x_m: 5, y_m: 5}\n  turbine_under_test: {x_m: 5, y_m: 5}\n",
       "plan.yaml:11:23: layout.turbine_under_test: is at the measurement point "
       "(layout.mast); check the coordinates"},
      {"rotor diameter given under turbine_under_test",
       kBaseWithRotor +
           "layout:\n  turbine_under_test: {bearing_deg: 60, distance_m: 300, "
           "rotor_diameter_m: 100}\n",
       "plan.yaml:10:58: layout.turbine_under_test.rotor_diameter_m: unknown field; "
       "valid fields: bearing_deg, distance_m, x_m, y_m"},
      // 10 m apart, rotor radii 50 + 50 m: the same turbine listed twice.
      {"turbine under test also listed as a neighbour",
       kBaseWithRotor +
           "layout:\n  turbine_under_test: {bearing_deg: 90, distance_m: 300}\n"
           "  neighbours:\n"
           "    - {name: TUT, bearing_deg: 90, distance_m: 310, rotor_diameter_m: 100}\n",
       "plan.yaml:12:7: " + kNeighbour0 +
           ": is 10.0 m from layout.turbine_under_test, closer than their rotor radii "
           "together (100.0 m), so it is the turbine under test itself; its wake on the "
           "mast follows from turbine_under_test, remove this neighbour"},
      {"obstacle at the turbine under test",
       kBaseWithRotor +
           "layout:\n  turbine_under_test: {bearing_deg: 90, distance_m: 300}\n"
           "  obstacles:\n"
           "    - {name: hut, bearing_deg: 90, distance_m: 300, height_m: 3, width_m: "
           "4}\n",
       "plan.yaml:12:7: layout.obstacles[0]: is at the turbine under test "
       "(layout.turbine_under_test); check the positions"},
      {"no neighbours", kBase + "layout:\n  neighbours: []\n",
       "plan.yaml:10:15: layout.neighbours: is empty; give at least one neighbour, or "
       "leave the field out"},
      {"empty exclusion", kBase + "layout:\n  exclusions_deg: [[10, 10]]\n",
       "plan.yaml:10:20: layout.exclusions_deg[0]: [10, 10] is an empty sector; a sector "
       "runs clockwise from the first angle to the second (write [0, 360] for the full "
       "circle)"},
      {"nothing left of the circle",
       kBase + "layout:\n  exclusions_deg: [[0, 200], [190, 10]]\n",
       "plan.yaml:10:3: layout: leaves no valid sector: manual exclusion 0.0-200.0 deg, "
       "manual exclusion 190.0-10.0 deg cover the whole circle, so no record could "
       "count; check bearings, distances and exclusions"},
      // L/D 2: 80.8 deg around 125, i.e. 84.6-165.4 (IEC 61400-12-1 Annex A).
      {"nothing left of the written sectors",
       kBase + "valid_sectors_deg: [[100, 150]]\nlayout:\n  neighbours:\n" +
           "    - {name: WTG-A, bearing_deg: 125, distance_m: 200, rotor_diameter_m: "
           "100}\n",
       "plan.yaml:11:3: layout: leaves no valid sector: wake of WTG-A (L/D 2.0) "
       "84.6-165.4 deg cover every direction of valid_sectors_deg, so no record could "
       "count; check bearings, distances and exclusions"},
      // The turbine 300 m north of the mast, WTG-A 200 m east of the turbine:
      // seen from the turbine L/D 2, 80.8 deg centred on 90 (Annex A check
      // value), which covers 80-100; from the mast WTG-A is at 360.6 m on
      // bearing atan(2/3) = 33.7 deg and the turbine's own wake is centred on 0.
      {"nothing left from the turbine under test",
       kBaseWithRotor + "valid_sectors_deg: [[80, 100]]\nlayout:\n" +
           "  mast: {x_m: 0, y_m: 0}\n"
           "  turbine_under_test: {x_m: 0, y_m: 300}\n"
           "  neighbours:\n"
           "    - {name: WTG-A, x_m: 200, y_m: 300, rotor_diameter_m: 100}\n",
       "plan.yaml:11:3: layout: leaves no valid sector: wake of the turbine under test "
       "T1 (L/D 3.0) 326.1-33.9 deg, wake of WTG-A (L/D 3.6) 2.6-64.8 deg, wake of "
       "WTG-A (L/D 2.0) seen from the turbine under test 49.6-130.4 deg cover every "
       "direction of valid_sectors_deg, so no record could count; check bearings, "
       "distances and exclusions"},
  };
}

TEST(LayoutReaderTest, RejectsBadInputWithExactMessages) {
  reader_test::ExpectMessages(BadInputs(), PlanError);
}

}  // namespace
}  // namespace planner
