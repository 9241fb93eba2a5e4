// A site's wind climate at hub height, as the simulation needs it.
//
// Direction sectors of equal width, sector i centred on i * 360 / n degrees
// (sector 0 centred on north). Each has its frequency and its Weibull. Month
// and hour-of-day factors scale the Weibull A; a random factor per simulated
// year adds inter-annual variability. See docs/site-model.md for the YAML.
#ifndef PLANNER_SITE_MODEL_H_
#define PLANNER_SITE_MODEL_H_

#include <array>
#include <string>
#include <vector>

#include "planner/turbulence.h"
#include "planner/weibull.h"

namespace planner {

// The Weibull shapes a site model may hold. 10-minute mean wind speeds have k
// of about 1.2 to 4 (common practice); below 1 the Weibull's mean exceeds
// its scale A and grows without bound as k falls (A * Gamma(1 + 1/k)), which
// is no wind climate.
inline constexpr double kMinWeibullShape = 1.0;
inline constexpr double kMaxWeibullShape = 20.0;

struct Sector {
  double frequency = 0.0;  // share of time the wind comes from it, (0, 1]
  Weibull weibull;         // at hub height, annual
};

struct SiteModel {
  std::string name;             // shown in reports
  std::string description;      // free text (e.g. "invented, illustrative")
  std::vector<Sector> sectors;  // >= 1; frequencies sum to 1

  // Probability per 10-minute step that the wind stays in its sector
  // (otherwise a new sector is drawn from the frequencies, which may be the
  // same one). 0 = independent directions. Default 0.97.
  double sector_persistence = 0.97;

  // Time scale tau of the wind-speed persistence, hours. The latent normal
  // AR(1) has phi = exp(-(10 min) / tau). 0 = independent records.
  double wind_persistence_h = 36.0;

  // Factors on A per calendar month (Jan..Dec); the reader normalises them to
  // a day-weighted average of 1 over a 365-day year, so they move wind between
  // seasons without changing the annual mean. Default all 1.
  std::array<double, 12> monthly_factors{1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1};

  // Factors on A per hour of day (00..23); normalised to average 1. Default 1.
  std::array<double, 24> hourly_factors{};

  // Standard deviation of a lognormal factor on A with mean 1, drawn once per
  // simulated campaign year. 0 = every year alike. Default 0.
  double interannual_std = 0.0;

  // Standard uncertainty (one standard deviation) of the long-term mean wind
  // speed, percent of it, e.g. from a resource assessment. When above 0 each
  // simulated campaign draws one lognormal factor with mean 1 and this
  // standard deviation on every A (hierarchical Monte Carlo), so that the
  // forecast's spread holds what the site model does not know. Default 0:
  // the site model taken as exact.
  double mean_speed_uncertainty_pct = 0.0;

  TurbulenceModel turbulence;

  SiteModel() { hourly_factors.fill(1.0); }
};

// Width of each sector in degrees.
inline double SectorWidthDeg(const SiteModel& site) {
  return 360.0 / static_cast<double>(site.sectors.size());
}

// Long-run mean wind speed over the year (m/s), from sectors and factors.
double SiteMeanSpeed(const SiteModel& site);

}  // namespace planner

#endif  // PLANNER_SITE_MODEL_H_
