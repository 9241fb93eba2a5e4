// Disturbed sectors of IEC 61400-12-1 Annex A and the valid sector that
// remains. The check values are those of DESIGN.md, computed from the
// published formula alpha = 1.3 arctan(2.5 D/L + 0.15) + 10 degrees.
#include "planner/disturbed_sector.h"

#include <gtest/gtest.h>

#include <cmath>
#include <vector>

namespace planner {
namespace {

constexpr double kTolDeg = 0.05;  // the check values are rounded to 0.1 deg

NeighbourTurbine Neighbour(const char* name, double bearing_deg, double distance_m,
                           double diameter_m) {
  NeighbourTurbine n;
  n.name = name;
  n.bearing_deg = bearing_deg;
  n.distance_m = distance_m;
  n.rotor_diameter_m = diameter_m;
  return n;
}

void ExpectRange(const AngleRange& r, double from_deg, double to_deg) {
  EXPECT_NEAR(r.from_deg, from_deg, 1e-9);
  EXPECT_NEAR(r.to_deg, to_deg, 1e-9);
}

TEST(DisturbedSectorTest, WidthMatchesAnnexACheckValues) {
  // IEC 61400-12-1 Annex A formula; values computed from it (DESIGN.md).
  EXPECT_NEAR(DisturbedSectorWidthDeg(2.0), 80.8, kTolDeg);
  EXPECT_NEAR(DisturbedSectorWidthDeg(4.0), 59.1, kTolDeg);
  EXPECT_NEAR(DisturbedSectorWidthDeg(10.0), 38.3, kTolDeg);
  EXPECT_NEAR(DisturbedSectorWidthDeg(20.0), 30.0, kTolDeg);
}

TEST(DisturbedSectorTest, SectorIsCentredOnTheBearingWithTheFormulaWidth) {
  SiteLayout layout;
  layout.neighbours.push_back(Neighbour("WTG-A", 90, 400, 100));  // L/D 4
  const std::vector<DisturbedSector> s = DisturbedSectors(layout);
  ASSERT_EQ(s.size(), 1u);
  EXPECT_NEAR(AngleRangeWidth(s[0].range), 59.1, kTolDeg);
  EXPECT_NEAR((s[0].range.from_deg + s[0].range.to_deg) / 2.0, 90.0, 1e-9);
  EXPECT_EQ(s[0].reason, "wake of WTG-A (L/D 4.0)");
  EXPECT_EQ(s[0].note, "");
}

TEST(DisturbedSectorTest, NeighbourNearNorthGivesASectorThroughNorth) {
  SiteLayout layout;
  layout.neighbours.push_back(Neighbour("WTG-N", 5, 400, 100));  // L/D 4, 59.1 deg
  const double half = DisturbedSectorWidthDeg(4.0) / 2.0;
  const std::vector<DisturbedSector> s = DisturbedSectors(layout);
  ASSERT_EQ(s.size(), 1u);
  ExpectRange(s[0].range, 360.0 + 5.0 - half, 5.0 + half);  // about 335.5 to 34.5
  EXPECT_TRUE(AngleRangeContains(s[0].range, 0.0));
  EXPECT_TRUE(AngleRangeContains(s[0].range, 340.0));
  EXPECT_FALSE(AngleRangeContains(s[0].range, 40.0));
  // The valid sector is the rest of the circle, one range from 34.5 to 335.5.
  const std::vector<AngleRange> valid = ValidSectorsFromLayout(layout, {{0, 360}});
  ASSERT_EQ(valid.size(), 1u);
  ExpectRange(valid[0], 5.0 + half, 360.0 + 5.0 - half);
}

TEST(DisturbedSectorTest, OverlappingSectorsMergeAndTheRestWrapsThroughNorth) {
  SiteLayout layout;
  layout.neighbours.push_back(Neighbour("WTG-1", 90, 400, 100));   // 60.45 .. 119.55
  layout.neighbours.push_back(Neighbour("WTG-2", 110, 400, 100));  // 80.45 .. 139.55
  const double half = DisturbedSectorWidthDeg(4.0) / 2.0;
  const std::vector<AngleRange> valid = ValidSectorsFromLayout(layout, {{0, 360}});
  // circle minus [90 - half, 110 + half]: a single range through north.
  ASSERT_EQ(valid.size(), 1u);
  ExpectRange(valid[0], 110.0 + half, 90.0 - half);
  EXPECT_NEAR(AngleRangeWidth(valid[0]), 360.0 - 20.0 - 2.0 * half, 1e-9);
}

TEST(DisturbedSectorTest, ValidIsTheCircleMinusEveryDisturbedSector) {
  SiteLayout layout;
  layout.neighbours.push_back(Neighbour("WTG-1", 90, 1000, 100));  // L/D 10: 38.3
  layout.neighbours.push_back(Neighbour("WTG-2", 270, 200, 100));  // L/D 2: 80.8
  const double a = DisturbedSectorWidthDeg(10.0) / 2.0;
  const double b = DisturbedSectorWidthDeg(2.0) / 2.0;
  const std::vector<AngleRange> valid = ValidSectorsFromLayout(layout, {{0, 360}});
  ASSERT_EQ(valid.size(), 2u);  // sorted by start; the one through north last
  ExpectRange(valid[0], 90.0 + a, 270.0 - b);
  ExpectRange(valid[1], 270.0 + b, 90.0 - a);
  EXPECT_NEAR(AngleOverlapDeg(valid, 0, 360), 360.0 - 2.0 * a - 2.0 * b, 1e-9);
}

TEST(DisturbedSectorTest, ValidIsIntersectedWithThePlansOwnSectors) {
  SiteLayout layout;
  layout.neighbours.push_back(Neighbour("WTG-N", 0, 1000, 100));  // 340.85 .. 19.15
  const double half = DisturbedSectorWidthDeg(10.0) / 2.0;
  const std::vector<AngleRange> allowed = {{200, 300}, {350, 40}};
  const std::vector<AngleRange> valid = ValidSectorsFromLayout(layout, allowed);
  ASSERT_EQ(valid.size(), 2u);
  ExpectRange(valid[0], half, 40.0);
  ExpectRange(valid[1], 200.0, 300.0);
}

TEST(DisturbedSectorTest, ManualExclusionsAreRemovedAndListedLast) {
  SiteLayout layout;
  layout.exclusions.push_back({170, 190});
  layout.neighbours.push_back(Neighbour("WTG-1", 90, 400, 100));
  const std::vector<DisturbedSector> s = DisturbedSectors(layout);
  ASSERT_EQ(s.size(), 2u);
  EXPECT_EQ(s[1].reason, "manual exclusion");
  ExpectRange(s[1].range, 170, 190);
  const std::vector<AngleRange> valid = ValidSectorsFromLayout(layout, {{0, 360}});
  ASSERT_EQ(valid.size(), 2u);
  EXPECT_NEAR(valid[0].to_deg, 170.0, 1e-9);
  EXPECT_NEAR(valid[1].from_deg, 190.0, 1e-9);
}

TEST(DisturbedSectorTest, EverythingDisturbedLeavesNothing) {
  SiteLayout layout;
  layout.exclusions.push_back({0, 200});
  layout.exclusions.push_back({190, 10});
  EXPECT_TRUE(ValidSectorsFromLayout(layout, {{0, 360}}).empty());
  // And an empty layout leaves the allowed sectors as they are, merged.
  const std::vector<AngleRange> valid =
      ValidSectorsFromLayout(SiteLayout{}, {{350, 20}, {10, 30}});
  ASSERT_EQ(valid.size(), 1u);
  ExpectRange(valid[0], 350, 30);
}

TEST(DisturbedSectorTest, ObstacleUsesItsEquivalentRotorDiameter) {
  // D_e = 2 h w / (h + w): IEC 61400-12-1 Annex A (formula from memory).
  // 10 m high, 30 m wide: D_e = 600 / 40 = 15 m; at 60 m L/D_e = 4 -> 59.1 deg.
  Obstacle o;
  o.name = "shed";
  o.bearing_deg = 180;
  o.distance_m = 60;
  o.height_m = 10;
  o.width_m = 30;
  EXPECT_DOUBLE_EQ(ObstacleEquivalentDiameterM(o), 15.0);
  SiteLayout layout;
  layout.obstacles.push_back(o);
  const std::vector<DisturbedSector> s = DisturbedSectors(layout);
  ASSERT_EQ(s.size(), 1u);
  EXPECT_NEAR(AngleRangeWidth(s[0].range), 59.1, kTolDeg);
  EXPECT_EQ(s[0].reason, "obstacle shed (L/D_e 4.0, D_e 15.0 m)");
  // A square face has D_e equal to its side (property of the formula).
  o.width_m = 10;
  EXPECT_DOUBLE_EQ(ObstacleEquivalentDiameterM(o), 10.0);
}

TEST(DisturbedSectorTest, CloserThanTwoDiametersExtendsTheFormulaAndSaysSo) {
  // L/D 1: the formula gives 1.3 arctan(2.65) + 10 = 100.1 deg, wider than the
  // 80.8 deg at L/D 2 (fillcast's rule, docs/methods.md).
  SiteLayout layout;
  layout.neighbours.push_back(Neighbour("WTG-C", 45, 100, 100));
  const std::vector<DisturbedSector> s = DisturbedSectors(layout);
  ASSERT_EQ(s.size(), 1u);
  const double width = AngleRangeWidth(s[0].range);
  EXPECT_NEAR(width, 1.3 * std::atan(2.65) * 180.0 / M_PI + 10.0, 1e-9);
  EXPECT_GT(width, DisturbedSectorWidthDeg(2.0));
  EXPECT_EQ(s[0].note,
            "L/D below 2, closer than the formula's range: formula extended (wider than "
            "at 2); agree this sector with the certification body");
}

TEST(DisturbedSectorTest, BeyondTwentyDiametersNothingIsExcludedButItIsReported) {
  // fillcast's rule (docs/methods.md): Annex A does not ask for a neighbour
  // beyond 20 D to be excluded (from memory).
  SiteLayout layout;
  layout.neighbours.push_back(Neighbour("WTG-F", 300, 2500, 100));  // L/D 25
  const std::vector<DisturbedSector> s = DisturbedSectors(layout);
  ASSERT_EQ(s.size(), 1u);
  EXPECT_DOUBLE_EQ(AngleRangeWidth(s[0].range), 0.0);
  EXPECT_EQ(s[0].reason, "wake of WTG-F (L/D 25.0)");
  EXPECT_EQ(s[0].note, "L/D above 20, beyond the formula's range: not excluded");
  const std::vector<AngleRange> valid = ValidSectorsFromLayout(layout, {{0, 360}});
  ASSERT_EQ(valid.size(), 1u);
  ExpectRange(valid[0], 0, 360);
  // Exactly 20 is inside the range: excluded with the 30.0 deg of the table.
  layout.neighbours[0].distance_m = 2000;
  EXPECT_NEAR(AngleRangeWidth(DisturbedSectors(layout)[0].range), 30.0, kTolDeg);
}

}  // namespace
}  // namespace planner
