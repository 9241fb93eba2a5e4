// Turbulence: the standard deviation of the wind speed within a 10-minute
// record, sigma_u, given the record's mean speed V. Turbulence intensity is
// TI = sigma_u / V.
//
// sigma_u given V is lognormal. Two ways to set its mean and standard
// deviation:
//  * IEC 61400-1 ed.3 normal turbulence model (NTM): mean I_ref (0.75 V + 3.8
//    m/s), standard deviation 1.4 m/s x I_ref, so that the 90 % quantile is
//    the representative value I_ref (0.75 V + 5.6 m/s) (the 5.6 and I_ref are
//    published in the standard; the mean/std split is from memory). I_ref =
//    0.18 / 0.16 / 0.14 / 0.12 for classes A+ / A / B / C.
//  * A measured table: mean and standard deviation of TI per wind-speed bin.
#ifndef PLANNER_TURBULENCE_H_
#define PLANNER_TURBULENCE_H_

#include <string>
#include <vector>

namespace planner {

struct TiTableRow {
  double wind_lo_ms = 0.0;  // bin [lo, hi), m/s
  double wind_hi_ms = 0.0;
  double ti_mean = 0.0;  // mean TI in the bin, fraction (0.12 = 12 %)
  double ti_std = 0.0;   // standard deviation of TI in the bin, fraction
};

struct TurbulenceModel {
  enum class Kind { kIecNtm, kTable };
  Kind kind = Kind::kIecNtm;
  double i_ref = 0.16;            // NTM reference intensity (class A default).
  std::vector<TiTableRow> table;  // kTable: sorted, non-overlapping bins.
  // Time scale of TI's own persistence in hours (0 = independent records).
  double persistence_h = 0.0;
};

// I_ref for an IEC 61400-1 class name "A+", "A", "B", "C"; negative if unknown.
double IecReferenceIntensity(const std::string& turbulence_class);

// Mean and standard deviation of sigma_u (m/s) at mean speed speed_ms > 0.
// For a table model, outside the table the nearest row is used.
struct SigmaMoments {
  double mean_ms = 0.0;
  double std_ms = 0.0;
};
SigmaMoments SigmaMomentsAt(const TurbulenceModel& model, double speed_ms);

// Parameters (mu, s) of the lognormal TI = exp(mu + s x), x ~ N(0,1), that
// has the moments above divided by speed_ms.
struct LogNormalParams {
  double mu = 0.0;
  double s = 0.0;
};
LogNormalParams TiLogNormalAt(const TurbulenceModel& model, double speed_ms);

// Lognormal (mu, s) with the given mean > 0 and standard deviation >= 0:
// s^2 = ln(1 + (std/mean)^2), mu = ln(mean) - s^2 / 2.
LogNormalParams LogNormalFromMoments(double mean, double std);

}  // namespace planner

#endif  // PLANNER_TURBULENCE_H_
