// Valid measurement sector from the layout around the measurement: the
// sectors disturbed by the wakes of neighbouring turbines and by obstacles
// are removed (IEC 61400-12-1, Annex A), as are manual exclusions.
//
// Disturbed sector of a neighbour at distance L with rotor diameter D:
//   alpha = 1.3 arctan(2.5 D/L + 0.15) + 10 degrees, centred on its bearing,
// defined for 2 <= L/D <= 20 (Annex A). Check values computed from the
// formula: L/D = 2 -> 80.8 deg, 4 -> 59.1, 10 -> 38.3, 20 -> 30.0.
// See docs/methods.md for what fillcast does outside that range and for
// obstacles (through their equivalent rotor diameter).
//
// When the layout gives the turbine under test's position, every neighbour and
// obstacle is checked twice, from the met mast and from the turbine under test
// (the load standard refers to Annex A for both), and the turbine under test's
// own wake on the mast is added; the valid sector is what both views leave.
// The turbine under test does not disturb itself, and the mast is not an
// obstacle for the turbine (docs/methods.md: a slender mast's equivalent
// diameter puts it far beyond L/D 20).
#ifndef PLANNER_DISTURBED_SECTOR_H_
#define PLANNER_DISTURBED_SECTOR_H_

#include <optional>
#include <string>
#include <vector>

#include "planner/angle_range.h"

namespace planner {

// Positions are seen from the point whose inflow is measured (the met mast,
// or the turbine under test for a nacelle-based measurement).
struct NeighbourTurbine {
  std::string name;
  double bearing_deg = 0.0;  // direction to it, clockwise from north
  double distance_m = 0.0;   // > 0
  double rotor_diameter_m = 0.0;
};

struct Obstacle {
  std::string name;
  double bearing_deg = 0.0;
  double distance_m = 0.0;
  double height_m = 0.0;
  double width_m = 0.0;
};

// The turbine under test, seen from the mast like the neighbours.
struct TurbineUnderTest {
  std::string name;               // the plan's turbine.name
  double bearing_deg = 0.0;       // direction to it from the mast, clockwise from north
  double distance_m = 0.0;        // from the mast, > 0
  double rotor_diameter_m = 0.0;  // the plan's turbine.rotor_diameter_m, > 0
};

struct SiteLayout {
  std::vector<NeighbourTurbine> neighbours;
  std::vector<Obstacle> obstacles;
  std::vector<AngleRange> exclusions;  // manual, e.g. a terrain feature
  // Set: sectors are checked from the mast and from the turbine under test.
  // Unset (default): from the mast only.
  std::optional<TurbineUnderTest> turbine_under_test;
  bool empty() const {
    return neighbours.empty() && obstacles.empty() && exclusions.empty() &&
           !turbine_under_test;
  }
};

// Where a disturbed sector is seen from.
enum class Viewpoint { kMast, kTurbineUnderTest };

// What disturbs it.
enum class DisturbanceKind { kNeighbour, kObstacle, kTurbineUnderTest, kExclusion };

struct DisturbedSector {
  std::string reason;  // e.g. "wake of WTG-2 (L/D 3.5)"
  AngleRange range;
  // Set when the formula's range 2 <= L/D <= 20 was left; says what was done.
  std::string note;
  Viewpoint seen_from = Viewpoint::kMast;  // manual exclusions: kMast
  DisturbanceKind kind = DisturbanceKind::kExclusion;
};

// Bearing (clockwise from north, [0, 360)) and distance of `to` seen from
// `from`, both given as bearing and distance from a common origin (the mast).
struct PolarPosition {
  double bearing_deg = 0.0;
  double distance_m = 0.0;
};
PolarPosition SeenFrom(const PolarPosition& from, const PolarPosition& to);

// alpha in degrees for distance / diameter ratio l_over_d (the formula as
// published, for any positive ratio; callers apply the range rules).
double DisturbedSectorWidthDeg(double l_over_d);

// Equivalent rotor diameter of an obstacle of height h and width w, used in
// place of D in the formula: D_e = 2 h w / (h + w) (IEC 61400-12-1 Annex A;
// formula from memory).
double ObstacleEquivalentDiameterM(const Obstacle& o);

// Every disturbed sector of the layout, in the order: seen from the mast (the
// turbine under test if given, neighbours, obstacles), seen from the turbine
// under test if given (neighbours, obstacles), manual exclusions. One entry
// per item and view; an item beyond L/D 20 keeps its entry with an empty
// range (from == to) and a note, so that it can be reported.
std::vector<DisturbedSector> DisturbedSectors(const SiteLayout& layout);

// What remains of `allowed` (default: the full circle) after removing every
// disturbed sector; sorted by start, non-overlapping.
std::vector<AngleRange> ValidSectorsFromLayout(const SiteLayout& layout,
                                               const std::vector<AngleRange>& allowed);

// The same without the sectors seen from the turbine under test: the mast's
// view alone (the turbine's own wake on the mast still removed).
std::vector<AngleRange> ValidSectorsSeenFromMast(const SiteLayout& layout,
                                                 const std::vector<AngleRange>& allowed);

}  // namespace planner

#endif  // PLANNER_DISTURBED_SECTOR_H_
