// Share of a site's records and wind energy in given direction ranges.
#include "model/sector_share.h"

#include <gtest/gtest.h>

#include <boost/math/distributions/weibull.hpp>
#include <cmath>

namespace planner {
namespace {

// Four 90-degree sectors centred on N, E, S, W.
SiteModel FourSectors() {
  SiteModel site;
  const double freq[4] = {0.1, 0.2, 0.3, 0.4};
  const double a[4] = {6.0, 8.0, 10.0, 12.0};
  const double k[4] = {1.8, 2.0, 2.2, 2.6};
  for (int i = 0; i < 4; ++i) {
    Sector s;
    s.frequency = freq[i];
    s.weibull.scale_ms = a[i];
    s.weibull.shape = k[i];
    site.sectors.push_back(s);
  }
  return site;
}

// E[V^3] from Boost.Math's mean, variance and skewness of the Weibull:
// E[X^3] = m^3 + 3 m s^2 + g s^3 (moment identity), an independent route to
// the A^3 Gamma(1 + 3/k) the code uses.
double ThirdMoment(double a, double k) {
  const boost::math::weibull_distribution<> w(k, a);
  const double m = boost::math::mean(w);
  const double s = boost::math::standard_deviation(w);
  return m * m * m + 3.0 * m * s * s + boost::math::skewness(w) * s * s * s;
}

TEST(SectorShareTest, WholeSectorsGiveTheirFrequencies) {
  const SiteModel site = FourSectors();
  // East sector is 45..135, south 135..225.
  EXPECT_NEAR(WindShareInSectors(site, {{45, 225}}).time, 0.5, 1e-12);
  EXPECT_NEAR(WindShareInSectors(site, {{0, 360}}).time, 1.0, 1e-12);
  EXPECT_NEAR(WindShareInSectors(site, {{0, 360}}).energy, 1.0, 1e-12);
  // The north sector wraps: 315..45.
  EXPECT_NEAR(WindShareInSectors(site, {{315, 45}}).time, 0.1, 1e-12);
}

TEST(SectorShareTest, DirectionIsUniformWithinASectorAndOverlapsCountOnce) {
  const SiteModel site = FourSectors();
  // Half of north (0..45) and a quarter of west (270..292.5), with 280..290
  // given twice.
  const WindShare s = WindShareInSectors(site, {{0, 45}, {270, 292.5}, {280, 290}});
  EXPECT_NEAR(s.time, 0.5 * 0.1 + 0.25 * 0.4, 1e-12);
}

TEST(SectorShareTest, EnergyShareWeighsSectorsByTheMeanCubeOfTheSpeed) {
  const SiteModel site = FourSectors();
  double total = 0.0;
  double west = 0.0;
  for (int i = 0; i < 4; ++i) {
    const Sector& s = site.sectors[i];
    const double e = s.frequency * ThirdMoment(s.weibull.scale_ms, s.weibull.shape);
    total += e;
    if (i == 3) west = e;
  }
  const WindShare s = WindShareInSectors(site, {{225, 315}});
  EXPECT_NEAR(s.time, 0.4, 1e-12);
  EXPECT_NEAR(s.energy, west / total, 1e-9);
  EXPECT_GT(s.energy, s.time);  // the windiest sector holds more energy than time
}

}  // namespace
}  // namespace planner
