#include "io/layout_reader.h"

#include <cmath>
#include <cstdio>
#include <optional>
#include <string>
#include <vector>

#include "io/plan_fields.h"
#include "planner/disturbed_sector.h"

namespace planner {
namespace io {
namespace {

const std::vector<std::string> kLayoutFields = {
    "mast", "turbine_under_test", "neighbours", "obstacles", "exclusions_deg"};
const std::vector<std::string> kPointFields = {"x_m", "y_m"};
const std::vector<std::string> kTurbineUnderTestFields = {"bearing_deg", "distance_m",
                                                          "x_m", "y_m"};
const std::vector<std::string> kNeighbourFields = {
    "name", "bearing_deg", "distance_m", "x_m", "y_m", "rotor_diameter_m"};
const std::vector<std::string> kObstacleFields = {
    "name", "bearing_deg", "distance_m", "x_m", "y_m", "height_m", "width_m"};

constexpr double kPi = 3.14159265358979323846;
const Limits kCoordinate = Interval("[]", -1e6, 1e6, "m");

struct Point {
  double x_m = 0.0;  // east
  double y_m = 0.0;  // north
};

struct Position {
  double bearing_deg = 0.0;
  double distance_m = 0.0;
};

Point ReadPoint(const Field& f) {
  const FieldMap m(f, kPointFields);
  return Point{ReadNumber(m, "x_m", kCoordinate), ReadNumber(m, "y_m", kCoordinate)};
}

// Either bearing_deg and distance_m, or x_m and y_m relative to the mast.
Position ReadPosition(const FieldMap& m, const std::optional<Point>& mast) {
  const bool polar = m.Has("bearing_deg") || m.Has("distance_m");
  const bool cartesian = m.Has("x_m") || m.Has("y_m");
  if (polar && cartesian) {
    const Field at = m.Has("x_m") ? m.Get("x_m") : m.Get("y_m");
    Fail(at, std::string("given together with ") +
                 (m.Has("bearing_deg") ? "bearing_deg" : "distance_m") +
                 "; give the position either as bearing_deg and distance_m, or as x_m "
                 "and y_m");
  }
  if (polar) {
    return Position{ReadNumber(m, "bearing_deg", Interval("[)", 0, 360, "degrees")),
                    ReadNumber(m, "distance_m", Interval("(]", 0, 1e5, "m"))};
  }
  if (!cartesian) {
    Fail(m.self(),
         "has no position; give bearing_deg and distance_m, or x_m and y_m (with "
         "layout.mast)");
  }
  const Point p{ReadNumber(m, "x_m", kCoordinate), ReadNumber(m, "y_m", kCoordinate)};
  if (!mast) {
    Fail(m.self(),
         "gives x_m and y_m but layout.mast is missing; give the measurement point as "
         "mast: {x_m, y_m} (x east, y north)");
  }
  const double dx = p.x_m - mast->x_m;
  const double dy = p.y_m - mast->y_m;
  const double distance = std::hypot(dx, dy);
  if (distance < 0.01) {
    Fail(m.self(), "is at the measurement point (layout.mast); check the coordinates");
  }
  // Clockwise from north: atan2(east, north).
  double bearing = std::atan2(dx, dy) * 180.0 / kPi;
  if (bearing < 0.0) bearing += 360.0;
  if (bearing >= 360.0) bearing = 0.0;
  return Position{bearing, distance};
}

// One decimal, as in the sectors command.
std::string Degrees(double x) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.1f", x);
  return buf;
}

// Distance from the turbine under test to an item at bearing/distance from
// the mast.
double FromTurbineM(const TurbineUnderTest& tut, double bearing_deg, double distance_m) {
  return SeenFrom(PolarPosition{tut.bearing_deg, tut.distance_m},
                  PolarPosition{bearing_deg, distance_m})
      .distance_m;
}

// The turbine under test's position (like a neighbour's); its name and rotor
// diameter come from the plan's turbine section.
TurbineUnderTest ReadTurbineUnderTest(const Field& f, const std::optional<Point>& mast,
                                      const TurbineSpec& turbine) {
  const FieldMap m(f, kTurbineUnderTestFields);
  const Position p = ReadPosition(m, mast);
  if (turbine.rotor_diameter_m <= 0.0) {
    Fail(f,
         "needs the rotor diameter of the turbine under test for its wake on the "
         "mast; give turbine.rotor_diameter_m");
  }
  return TurbineUnderTest{turbine.name, p.bearing_deg, p.distance_m,
                          turbine.rotor_diameter_m};
}

NeighbourTurbine ReadNeighbour(const Field& f, const std::optional<Point>& mast,
                               const std::optional<TurbineUnderTest>& tut,
                               NameSet* names) {
  const FieldMap m(f, kNeighbourFields);
  NeighbourTurbine n;
  n.name = names->Read(m);
  const Position p = ReadPosition(m, mast);
  n.bearing_deg = p.bearing_deg;
  n.distance_m = p.distance_m;
  n.rotor_diameter_m = ReadNumber(m, "rotor_diameter_m", Interval("(]", 0, 500, "m"));
  if (!tut) return n;
  // Rotors closer than their radii together would collide: the same turbine.
  const double apart_m = FromTurbineM(*tut, n.bearing_deg, n.distance_m);
  const double radii_m = (n.rotor_diameter_m + tut->rotor_diameter_m) / 2.0;
  if (apart_m < radii_m) {
    Fail(f, "is " + Degrees(apart_m) +
                " m from layout.turbine_under_test, closer than their rotor radii "
                "together (" +
                Degrees(radii_m) +
                " m), so it is the turbine under test itself; its wake on the mast "
                "follows from turbine_under_test, remove this neighbour");
  }
  return n;
}

Obstacle ReadObstacle(const Field& f, const std::optional<Point>& mast,
                      const std::optional<TurbineUnderTest>& tut, NameSet* names) {
  const FieldMap m(f, kObstacleFields);
  Obstacle o;
  o.name = names->Read(m);
  const Position p = ReadPosition(m, mast);
  o.bearing_deg = p.bearing_deg;
  o.distance_m = p.distance_m;
  o.height_m = ReadNumber(m, "height_m", Interval("(]", 0, 1000, "m"));
  o.width_m = ReadNumber(m, "width_m", Interval("(]", 0, 10000, "m"));
  if (tut && FromTurbineM(*tut, o.bearing_deg, o.distance_m) < 0.01) {
    Fail(f,
         "is at the turbine under test (layout.turbine_under_test); check the "
         "positions");
  }
  return o;
}

std::vector<Field> NonEmptyList(const Field& f, const std::string& what) {
  std::vector<Field> items = AsList(f);
  if (items.empty())
    Fail(f, "is empty; give at least one " + what + ", or leave the field out");
  return items;
}

SiteLayout ReadSiteLayout(const Field& f, const TurbineSpec& turbine) {
  const FieldMap m(f, kLayoutFields);
  if (!m.Has("turbine_under_test") && !m.Has("neighbours") && !m.Has("obstacles") &&
      !m.Has("exclusions_deg")) {
    Fail(f,
         "gives nothing to exclude; give turbine_under_test, neighbours, obstacles or "
         "exclusions_deg");
  }
  std::optional<Point> mast;
  if (const auto point = m.Find("mast")) mast = ReadPoint(*point);
  SiteLayout layout;
  if (const auto tut = m.Find("turbine_under_test")) {
    layout.turbine_under_test = ReadTurbineUnderTest(*tut, mast, turbine);
  }
  const std::optional<TurbineUnderTest>& tut = layout.turbine_under_test;
  NameSet names("neighbour or obstacle");
  if (const auto list = m.Find("neighbours")) {
    for (const Field& item : NonEmptyList(*list, "neighbour")) {
      layout.neighbours.push_back(ReadNeighbour(item, mast, tut, &names));
    }
  }
  if (const auto list = m.Find("obstacles")) {
    for (const Field& item : NonEmptyList(*list, "obstacle")) {
      layout.obstacles.push_back(ReadObstacle(item, mast, tut, &names));
    }
  }
  if (const auto list = m.Find("exclusions_deg")) {
    layout.exclusions = ReadAngleRanges(*list, "leave the field out");
  }
  return layout;
}

}  // namespace

void ReadLayout(const Field& f, bool sectors_given, Plan* plan) {
  plan->layout = ReadSiteLayout(f, plan->turbine);
  plan->sectors_as_written = plan->valid_sectors;
  plan->valid_sectors = ValidSectorsFromLayout(plan->layout, plan->valid_sectors);
  if (!plan->valid_sectors.empty()) return;
  std::string sectors;
  for (const DisturbedSector& s : DisturbedSectors(plan->layout)) {
    if (AngleRangeWidth(s.range) <= 0.0) continue;
    const char* view = s.seen_from == Viewpoint::kTurbineUnderTest
                           ? " seen from the turbine under test"
                           : "";
    sectors += (sectors.empty() ? "" : ", ") + s.reason + view + " " +
               Degrees(s.range.from_deg) + "-" + Degrees(s.range.to_deg) + " deg";
  }
  Fail(f,
       "leaves no valid sector: " + sectors + " cover " +
           (sectors_given ? "every direction of valid_sectors_deg" : "the whole circle") +
           ", so no record could count; check bearings, distances and exclusions");
}

}  // namespace io
}  // namespace planner
