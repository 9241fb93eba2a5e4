// Disturbed sectors of IEC 61400-12-1 Annex A and the valid sector that
// remains, seen from the met mast and from the turbine under test. The check
// values are those of DESIGN.md, computed from the published formula
// alpha = 1.3 arctan(2.5 D/L + 0.15) + 10 degrees; positions use exact
// 3-4-5 triangles (Pythagoras), so distances and bearings are known exactly.
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

// --- Seen from the turbine under test as well as from the mast ---

constexpr double kRad = M_PI / 180.0;

// Bearing and distance from the mast of a point `east_m`, `north_m` from it.
PolarPosition FromMast(double east_m, double north_m) {
  double bearing = std::atan2(east_m, north_m) / kRad;
  if (bearing < 0.0) bearing += 360.0;
  return PolarPosition{bearing, std::hypot(east_m, north_m)};
}

// The turbine under test 300 m due east of the mast (3 D with D = 100 m).
SiteLayout LayoutWithTurbineEast() {
  SiteLayout layout;
  layout.turbine_under_test = TurbineUnderTest{"TUT", 90.0, 300.0, 100.0};
  return layout;
}

NeighbourTurbine NeighbourAt(const char* name, double east_m, double north_m) {
  const PolarPosition p = FromMast(east_m, north_m);
  return Neighbour(name, p.bearing_deg, p.distance_m, 100.0);
}

std::vector<DisturbedSector> SeenFromOnly(const std::vector<DisturbedSector>& all,
                                          Viewpoint view) {
  std::vector<DisturbedSector> out;
  for (const DisturbedSector& s : all) {
    if (s.seen_from == view && s.kind != DisturbanceKind::kExclusion) out.push_back(s);
  }
  return out;
}

TEST(DisturbedSectorTest, SeenFromTurnsPositionsAroundExactly) {
  // From 300 m east of the origin to 400 m north of it: 300 m west and 400 m
  // north, 500 m (3-4-5), bearing 360 - atan(3/4) = 323.13 deg; back again the
  // bearing differs by 180 deg and the distance is the same.
  const PolarPosition east{90.0, 300.0};
  const PolarPosition north{0.0, 400.0};
  const PolarPosition there = SeenFrom(east, north);
  EXPECT_NEAR(there.distance_m, 500.0, 1e-9);
  EXPECT_NEAR(there.bearing_deg, 360.0 - std::atan(0.75) / kRad, 1e-9);
  const PolarPosition back = SeenFrom(north, east);
  EXPECT_NEAR(back.distance_m, 500.0, 1e-9);
  EXPECT_NEAR(back.bearing_deg, there.bearing_deg - 180.0, 1e-9);
  // From the origin itself nothing changes.
  const PolarPosition same = SeenFrom(PolarPosition{}, east);
  EXPECT_NEAR(same.bearing_deg, 90.0, 1e-9);
  EXPECT_NEAR(same.distance_m, 300.0, 1e-9);
}

TEST(DisturbedSectorTest, TurbineUnderTestWakesTheMastButNotItself) {
  // 300 m at D 100: L/D 3, the Annex A width, centred on bearing 90 deg.
  const SiteLayout layout = LayoutWithTurbineEast();
  const std::vector<DisturbedSector> s = DisturbedSectors(layout);
  ASSERT_EQ(s.size(), 1u);  // nothing seen from the turbine: it does not disturb itself
  EXPECT_EQ(s[0].kind, DisturbanceKind::kTurbineUnderTest);
  EXPECT_EQ(s[0].seen_from, Viewpoint::kMast);
  EXPECT_EQ(s[0].reason, "wake of the turbine under test TUT (L/D 3.0)");
  EXPECT_NEAR(AngleRangeWidth(s[0].range), DisturbedSectorWidthDeg(3.0), 1e-9);
  EXPECT_NEAR((s[0].range.from_deg + s[0].range.to_deg) / 2.0, 90.0, 1e-9);
  // At 400 m (L/D 4) the width is the published check value.
  SiteLayout four = layout;
  four.turbine_under_test->distance_m = 400.0;
  EXPECT_NEAR(AngleRangeWidth(DisturbedSectors(four)[0].range), 59.1, kTolDeg);
}

TEST(DisturbedSectorTest,
     NeighbourWithinTwentyDiametersOfTheTurbineOnlyDisturbsTheTurbine) {
  // 1199.4 m east and 1599.2 m south of the turbine: 1999 m from it (3-4-5
  // x 399.8), L/D 19.99, on bearing 180 - atan(3/4) = 143.13 deg. From the
  // mast it is 1499.4 m east and 1599.2 m south: 2192.2 m, L/D 21.9, beyond
  // the formula's range, so the mast sees no sector (docs/methods.md).
  SiteLayout layout = LayoutWithTurbineEast();
  layout.neighbours.push_back(NeighbourAt("WTG-SE", 300.0 + 1199.4, -1599.2));
  const std::vector<DisturbedSector> all = DisturbedSectors(layout);
  const std::vector<DisturbedSector> mast = SeenFromOnly(all, Viewpoint::kMast);
  const std::vector<DisturbedSector> tut =
      SeenFromOnly(all, Viewpoint::kTurbineUnderTest);
  ASSERT_EQ(mast.size(), 2u);  // the turbine under test's wake, the neighbour
  EXPECT_DOUBLE_EQ(AngleRangeWidth(mast[1].range), 0.0);
  EXPECT_EQ(mast[1].reason, "wake of WTG-SE (L/D 21.9)");
  ASSERT_EQ(tut.size(), 1u);
  EXPECT_EQ(tut[0].reason, "wake of WTG-SE (L/D 20.0)");
  EXPECT_EQ(tut[0].kind, DisturbanceKind::kNeighbour);
  EXPECT_NEAR(AngleRangeWidth(tut[0].range), 30.0, kTolDeg);  // Annex A, L/D 20
  const double centre = 180.0 - std::atan(0.75) / kRad;
  EXPECT_NEAR((tut[0].range.from_deg + tut[0].range.to_deg) / 2.0, centre, 1e-9);
  // The valid sector is what both views leave.
  const double a = DisturbedSectorWidthDeg(3.0) / 2.0;
  const double b = AngleRangeWidth(tut[0].range) / 2.0;
  const std::vector<AngleRange> valid = ValidSectorsFromLayout(layout, {{0, 360}});
  ASSERT_EQ(valid.size(), 2u);
  ExpectRange(valid[0], 90.0 + a, centre - b);
  ExpectRange(valid[1], centre + b, 90.0 - a);
}

TEST(DisturbedSectorTest, NeighbourWithinTwentyDiametersOfTheMastOnlyDisturbsTheMast) {
  // The mirror image: 1199.4 m west and 1599.2 m south of the mast (1999 m,
  // L/D 19.99, bearing 180 + atan(3/4) = 216.87 deg); from the turbine 1499.4 m
  // west, 2192.2 m, L/D 21.9: no sector.
  SiteLayout layout = LayoutWithTurbineEast();
  layout.neighbours.push_back(NeighbourAt("WTG-SW", -1199.4, -1599.2));
  const std::vector<DisturbedSector> all = DisturbedSectors(layout);
  const std::vector<DisturbedSector> mast = SeenFromOnly(all, Viewpoint::kMast);
  const std::vector<DisturbedSector> tut =
      SeenFromOnly(all, Viewpoint::kTurbineUnderTest);
  ASSERT_EQ(mast.size(), 2u);
  EXPECT_NEAR(AngleRangeWidth(mast[1].range), 30.0, kTolDeg);  // Annex A, L/D 20
  EXPECT_NEAR((mast[1].range.from_deg + mast[1].range.to_deg) / 2.0,
              180.0 + std::atan(0.75) / kRad, 1e-9);
  ASSERT_EQ(tut.size(), 1u);
  EXPECT_DOUBLE_EQ(AngleRangeWidth(tut[0].range), 0.0);
  EXPECT_EQ(tut[0].reason, "wake of WTG-SW (L/D 21.9)");
  EXPECT_EQ(tut[0].note, "L/D above 20, beyond the formula's range: not excluded");
}

TEST(DisturbedSectorTest, ObstacleIsCheckedFromTheTurbineAtItsOwnDistance) {
  // A 10 m x 30 m shed (D_e 15 m, IEC 61400-12-1 Annex A, formula from
  // memory) 60 m north of a turbine that stands 200 m north of the mast: from
  // the turbine L/D_e 4 (59.1 deg, Annex A check value) centred on 0 deg; from
  // the mast 260 m, L/D_e 17.3.
  SiteLayout layout;
  layout.turbine_under_test = TurbineUnderTest{"TUT", 0.0, 200.0, 100.0};
  Obstacle o;
  o.name = "shed";
  o.bearing_deg = 0.0;
  o.distance_m = 260.0;
  o.height_m = 10.0;
  o.width_m = 30.0;
  layout.obstacles.push_back(o);
  const std::vector<DisturbedSector> tut =
      SeenFromOnly(DisturbedSectors(layout), Viewpoint::kTurbineUnderTest);
  ASSERT_EQ(tut.size(), 1u);
  EXPECT_EQ(tut[0].reason, "obstacle shed (L/D_e 4.0, D_e 15.0 m)");
  EXPECT_EQ(tut[0].kind, DisturbanceKind::kObstacle);
  EXPECT_NEAR(AngleRangeWidth(tut[0].range), 59.1, kTolDeg);
  EXPECT_TRUE(AngleRangeContains(tut[0].range, 0.0));
  EXPECT_NEAR(tut[0].range.to_deg, DisturbedSectorWidthDeg(4.0) / 2.0, 1e-9);
  const std::vector<DisturbedSector> mast =
      SeenFromOnly(DisturbedSectors(layout), Viewpoint::kMast);
  ASSERT_EQ(mast.size(), 2u);
  EXPECT_NEAR(AngleRangeWidth(mast[1].range), DisturbedSectorWidthDeg(260.0 / 15.0),
              1e-9);
}

TEST(DisturbedSectorTest, WithoutTheTurbineUnderTestOnlyTheMastViewIsMade) {
  // The layout as before the turbine's position was given: one entry per item,
  // all seen from the mast, exactly as the single-view sectors.
  SiteLayout layout;
  layout.neighbours.push_back(Neighbour("WTG-1", 90, 400, 100));
  layout.exclusions.push_back({170, 190});
  const std::vector<DisturbedSector> s = DisturbedSectors(layout);
  ASSERT_EQ(s.size(), 2u);
  EXPECT_EQ(s[0].seen_from, Viewpoint::kMast);
  EXPECT_EQ(s[0].kind, DisturbanceKind::kNeighbour);
  EXPECT_EQ(s[1].kind, DisturbanceKind::kExclusion);
}

}  // namespace
}  // namespace planner
