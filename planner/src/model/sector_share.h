// How much of a site's wind comes from given direction ranges: the share of
// its 10-minute records (time) and of its wind energy (the mean of V^3, to
// which the power in the wind is proportional).
//
// Directions are taken as uniform within each site sector, as the simulation
// does (docs/methods.md), so a range covering half of a sector gets half of
// that sector's records. Month, hour and year factors scale every sector's A
// alike, so they cancel in both shares.
#ifndef PLANNER_MODEL_SECTOR_SHARE_H_
#define PLANNER_MODEL_SECTOR_SHARE_H_

#include <vector>

#include "planner/angle_range.h"
#include "planner/site_model.h"

namespace planner {

struct WindShare {
  double time = 0.0;    // share of records, [0, 1]
  double energy = 0.0;  // share of the energy: sum of f A^3 Gamma(1 + 3/k) covered
};

// Overlapping ranges count once. site.sectors must not be empty.
WindShare WindShareInSectors(const SiteModel& site,
                             const std::vector<AngleRange>& ranges);

}  // namespace planner

#endif  // PLANNER_MODEL_SECTOR_SHARE_H_
