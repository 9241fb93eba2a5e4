#include "planner/disturbed_sector.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <utility>

namespace planner {
namespace {

constexpr double kPi = 3.14159265358979323846;
// Annex A's formula is given for 2 <= L/D <= 20.
constexpr double kMinRatio = 2.0;
constexpr double kMaxRatio = 20.0;
// Pieces narrower than this (rounding left-overs) are dropped.
constexpr double kMinPieceDeg = 1e-9;

using Interval = std::pair<double, double>;  // [first, second] within [0, 360]

double Wrap360(double deg) {
  const double r = std::fmod(deg, 360.0);
  return r < 0.0 ? r + 360.0 : r;
}

std::string Ratio(double x) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.1f", x);
  return buf;
}

// Sorted, merged intervals covering the union of `ranges`.
std::vector<Interval> UnionOf(const std::vector<AngleRange>& ranges) {
  std::vector<Interval> pieces;
  for (const AngleRange& r : ranges) {
    const double width = AngleRangeWidth(r);
    if (width <= 0.0) continue;
    const double from = width >= 360.0 ? 0.0 : Wrap360(r.from_deg);
    if (from + width <= 360.0) {
      pieces.push_back({from, from + width});
    } else {
      pieces.push_back({from, 360.0});
      pieces.push_back({0.0, from + width - 360.0});
    }
  }
  std::sort(pieces.begin(), pieces.end());
  std::vector<Interval> merged;
  for (const Interval& p : pieces) {
    if (!merged.empty() && p.first <= merged.back().second) {
      merged.back().second = std::max(merged.back().second, p.second);
    } else {
      merged.push_back(p);
    }
  }
  return merged;
}

// a minus b; both sorted and merged.
std::vector<Interval> Subtract(const std::vector<Interval>& a,
                               const std::vector<Interval>& b) {
  std::vector<Interval> out;
  for (Interval piece : a) {
    for (const Interval& cut : b) {
      if (cut.second <= piece.first || cut.first >= piece.second) continue;
      if (cut.first > piece.first) out.push_back({piece.first, cut.first});
      piece.first = std::max(piece.first, cut.second);
      if (piece.first >= piece.second) break;
    }
    if (piece.second - piece.first > kMinPieceDeg) out.push_back(piece);
  }
  out.erase(std::remove_if(
                out.begin(), out.end(),
                [](const Interval& p) { return p.second - p.first <= kMinPieceDeg; }),
            out.end());
  return out;
}

// Back to ranges: a piece ending at 360 and one starting at 0 are one range
// through north (it sorts by its start, so it comes last).
std::vector<AngleRange> ToRanges(const std::vector<Interval>& pieces) {
  std::vector<AngleRange> ranges;
  if (pieces.size() == 1 && pieces[0].first <= 0.0 && pieces[0].second >= 360.0) {
    return {AngleRange{0.0, 360.0}};
  }
  const bool wraps =
      pieces.size() >= 2 && pieces.front().first <= 0.0 && pieces.back().second >= 360.0;
  const std::size_t first = wraps ? 1 : 0;
  const std::size_t last = wraps ? pieces.size() - 1 : pieces.size();
  for (std::size_t i = first; i < last; ++i) {
    ranges.push_back(AngleRange{pieces[i].first, pieces[i].second});
  }
  if (wraps) ranges.push_back(AngleRange{pieces.back().first, pieces.front().second});
  return ranges;
}

// The sector of something of (equivalent) rotor diameter d_m at distance_m on
// bearing_deg, with the range rules of docs/methods.md ("Valid sector from the
// layout"): below L/D 2 the formula is extended (wider than at 2), above 20
// nothing is excluded (an empty range that still carries its reason).
DisturbedSector SectorAround(const std::string& reason_prefix, const char* ratio_name,
                             double bearing_deg, double distance_m, double d_m) {
  const double ratio = distance_m / d_m;
  DisturbedSector s;
  s.reason = reason_prefix + " (" + ratio_name + " " + Ratio(ratio) + ")";
  const double bearing = Wrap360(bearing_deg);
  if (ratio > kMaxRatio) {
    s.range = AngleRange{bearing, bearing};
    s.note =
        std::string(ratio_name) + " above 20, beyond the formula's range: not excluded";
    return s;
  }
  const double alpha = DisturbedSectorWidthDeg(ratio);
  s.range = AngleRange{Wrap360(bearing - alpha / 2.0), Wrap360(bearing + alpha / 2.0)};
  if (ratio < kMinRatio) {
    s.note = std::string(ratio_name) +
             " below 2, closer than the formula's range: formula extended (wider "
             "than at 2); agree this sector with the certification body";
  }
  return s;
}

}  // namespace

double DisturbedSectorWidthDeg(double l_over_d) {
  return 1.3 * std::atan(2.5 / l_over_d + 0.15) * 180.0 / kPi + 10.0;
}

double ObstacleEquivalentDiameterM(const Obstacle& o) {
  return 2.0 * o.height_m * o.width_m / (o.height_m + o.width_m);
}

PolarPosition SeenFrom(const PolarPosition& from, const PolarPosition& to) {
  const double rad = kPi / 180.0;
  const double east = to.distance_m * std::sin(to.bearing_deg * rad) -
                      from.distance_m * std::sin(from.bearing_deg * rad);
  const double north = to.distance_m * std::cos(to.bearing_deg * rad) -
                       from.distance_m * std::cos(from.bearing_deg * rad);
  // Clockwise from north: atan2(east, north).
  double bearing = std::atan2(east, north) / rad;
  if (bearing < 0.0) bearing += 360.0;
  if (bearing >= 360.0) bearing = 0.0;
  return PolarPosition{bearing, std::hypot(east, north)};
}

namespace {

// The neighbours and obstacles seen from `at` (the mast: the origin).
void AddViewOf(const SiteLayout& layout, Viewpoint view, const PolarPosition& at,
               std::vector<DisturbedSector>* sectors) {
  const auto place = [&](double bearing_deg, double distance_m) {
    if (view == Viewpoint::kMast) return PolarPosition{bearing_deg, distance_m};
    return SeenFrom(at, PolarPosition{bearing_deg, distance_m});
  };
  for (const NeighbourTurbine& n : layout.neighbours) {
    const PolarPosition p = place(n.bearing_deg, n.distance_m);
    DisturbedSector s = SectorAround("wake of " + n.name, "L/D", p.bearing_deg,
                                     p.distance_m, n.rotor_diameter_m);
    s.seen_from = view;
    s.kind = DisturbanceKind::kNeighbour;
    sectors->push_back(s);
  }
  for (const Obstacle& o : layout.obstacles) {
    const PolarPosition p = place(o.bearing_deg, o.distance_m);
    const double d_e = ObstacleEquivalentDiameterM(o);
    char diameter[48];
    std::snprintf(diameter, sizeof diameter, ", D_e %.1f m", d_e);
    DisturbedSector s =
        SectorAround("obstacle " + o.name, "L/D_e", p.bearing_deg, p.distance_m, d_e);
    s.reason.insert(s.reason.size() - 1, diameter);
    s.seen_from = view;
    s.kind = DisturbanceKind::kObstacle;
    sectors->push_back(s);
  }
}

}  // namespace

std::vector<DisturbedSector> DisturbedSectors(const SiteLayout& layout) {
  std::vector<DisturbedSector> sectors;
  const std::optional<TurbineUnderTest>& tut = layout.turbine_under_test;
  if (tut) {
    DisturbedSector s =
        SectorAround("wake of the turbine under test " + tut->name, "L/D",
                     tut->bearing_deg, tut->distance_m, tut->rotor_diameter_m);
    s.kind = DisturbanceKind::kTurbineUnderTest;
    sectors.push_back(s);
  }
  AddViewOf(layout, Viewpoint::kMast, PolarPosition{}, &sectors);
  if (tut) {
    AddViewOf(layout, Viewpoint::kTurbineUnderTest,
              PolarPosition{tut->bearing_deg, tut->distance_m}, &sectors);
  }
  for (const AngleRange& r : layout.exclusions) {
    sectors.push_back(DisturbedSector{"manual exclusion", r, "", Viewpoint::kMast,
                                      DisturbanceKind::kExclusion});
  }
  return sectors;
}

namespace {

std::vector<AngleRange> Remaining(const SiteLayout& layout,
                                  const std::vector<AngleRange>& allowed,
                                  bool turbine_view) {
  std::vector<AngleRange> disturbed;
  for (const DisturbedSector& s : DisturbedSectors(layout)) {
    if (turbine_view || s.seen_from != Viewpoint::kTurbineUnderTest)
      disturbed.push_back(s.range);
  }
  return ToRanges(Subtract(UnionOf(allowed), UnionOf(disturbed)));
}

}  // namespace

std::vector<AngleRange> ValidSectorsFromLayout(const SiteLayout& layout,
                                               const std::vector<AngleRange>& allowed) {
  return Remaining(layout, allowed, true);
}

std::vector<AngleRange> ValidSectorsSeenFromMast(const SiteLayout& layout,
                                                 const std::vector<AngleRange>& allowed) {
  return Remaining(layout, allowed, false);
}

}  // namespace planner
