#include "planner/angle_range.h"

#include <algorithm>
#include <cmath>
#include <utility>

namespace planner {
namespace {

double Wrap360(double deg) {
  double r = std::fmod(deg, 360.0);
  return r < 0.0 ? r + 360.0 : r;
}

// Splits a range into at most two non-wrapping intervals within [0, 360].
void Unwrap(const AngleRange& r, std::vector<std::pair<double, double>>* out) {
  const double width = AngleRangeWidth(r);
  if (width <= 0.0) return;
  const double from = Wrap360(r.from_deg);
  if (from + width <= 360.0) {
    out->push_back({from, from + width});
  } else {
    out->push_back({from, 360.0});
    out->push_back({0.0, from + width - 360.0});
  }
}

}  // namespace

double AngleRangeWidth(const AngleRange& r) {
  if (r.to_deg - r.from_deg >= 360.0) return 360.0;
  if (r.from_deg == 0.0 && r.to_deg == 360.0) return 360.0;
  return Wrap360(r.to_deg - r.from_deg);
}

bool AngleRangeContains(const AngleRange& r, double direction_deg) {
  const double width = AngleRangeWidth(r);
  return Wrap360(direction_deg - r.from_deg) < width;
}

double AngleOverlapDeg(const std::vector<AngleRange>& ranges, double from_deg,
                       double width_deg) {
  std::vector<std::pair<double, double>> covered;
  for (const AngleRange& r : ranges) Unwrap(r, &covered);
  std::sort(covered.begin(), covered.end());
  // Merge the union, then intersect with the query (itself unwrapped).
  std::vector<std::pair<double, double>> merged;
  for (const auto& iv : covered) {
    if (!merged.empty() && iv.first <= merged.back().second) {
      merged.back().second = std::max(merged.back().second, iv.second);
    } else {
      merged.push_back(iv);
    }
  }
  std::vector<std::pair<double, double>> query;
  Unwrap(AngleRange{Wrap360(from_deg), Wrap360(from_deg) + width_deg}, &query);
  double total = 0.0;
  for (const auto& q : query) {
    for (const auto& m : merged) {
      total += std::max(0.0, std::min(q.second, m.second) - std::max(q.first, m.first));
    }
  }
  return total;
}

}  // namespace planner
