#include "planner/site_model.h"

namespace planner {

double SiteMeanSpeed(const SiteModel& site) {
  // Month and hour factors average 1 (the reader normalises them), so the
  // annual mean is the frequency-weighted mean of the sector Weibulls.
  double mean = 0.0;
  for (const Sector& s : site.sectors) mean += s.frequency * WeibullMean(s.weibull);
  return mean;
}

}  // namespace planner
