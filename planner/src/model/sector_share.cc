#include "model/sector_share.h"

#include <cmath>

namespace planner {

WindShare WindShareInSectors(const SiteModel& site,
                             const std::vector<AngleRange>& ranges) {
  const double width = SectorWidthDeg(site);
  WindShare share;
  double total_energy = 0.0;
  for (std::size_t i = 0; i < site.sectors.size(); ++i) {
    const Sector& s = site.sectors[i];
    // Sector i is centred on i * width (sector 0 on north).
    const double from = static_cast<double>(i) * width - width / 2.0;
    const double covered = AngleOverlapDeg(ranges, from, width) / width;
    // E[V^3] of a Weibull: A^3 Gamma(1 + 3/k) (wind-energy handbooks).
    const double energy = s.frequency * std::pow(s.weibull.scale_ms, 3.0) *
                          std::tgamma(1.0 + 3.0 / s.weibull.shape);
    share.time += s.frequency * covered;
    share.energy += energy * covered;
    total_energy += energy;
  }
  if (total_energy > 0.0) share.energy /= total_energy;
  return share;
}

}  // namespace planner
