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
       "plan.yaml:9:9: layout: gives nothing to exclude; give neighbours, obstacles or "
       "exclusions_deg"},
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
  };
}

TEST(LayoutReaderTest, RejectsBadInputWithExactMessages) {
  reader_test::ExpectMessages(BadInputs(), PlanError);
}

}  // namespace
}  // namespace planner
