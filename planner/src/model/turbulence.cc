#include "planner/turbulence.h"

#include <algorithm>
#include <cmath>

namespace planner {

double IecReferenceIntensity(const std::string& turbulence_class) {
  // IEC 61400-1 ed.3 (A+ added in ed.4): I_ref per turbulence category.
  if (turbulence_class == "A+") return 0.18;
  if (turbulence_class == "A") return 0.16;
  if (turbulence_class == "B") return 0.14;
  if (turbulence_class == "C") return 0.12;
  return -1.0;
}

SigmaMoments SigmaMomentsAt(const TurbulenceModel& model, double speed_ms) {
  if (model.kind == TurbulenceModel::Kind::kIecNtm) {
    return {model.i_ref * (0.75 * speed_ms + 3.8), 1.4 * model.i_ref};
  }
  const std::vector<TiTableRow>& rows = model.table;
  auto it =
      std::upper_bound(rows.begin(), rows.end(), speed_ms,
                       [](double v, const TiTableRow& r) { return v < r.wind_lo_ms; });
  const TiTableRow& row = (it == rows.begin()) ? rows.front() : *(it - 1);
  // Between two rows with a gap, or beyond the last row, use the nearest row.
  const TiTableRow* best = &row;
  if (speed_ms >= row.wind_hi_ms && it != rows.end() &&
      (it->wind_lo_ms - speed_ms) < (speed_ms - row.wind_hi_ms)) {
    best = &*it;
  }
  return {best->ti_mean * speed_ms, best->ti_std * speed_ms};
}

LogNormalParams LogNormalFromMoments(double mean, double std) {
  const double cv = std / mean;
  const double s2 = std::log1p(cv * cv);
  return {std::log(mean) - 0.5 * s2, std::sqrt(s2)};
}

LogNormalParams TiLogNormalAt(const TurbulenceModel& model, double speed_ms) {
  const SigmaMoments m = SigmaMomentsAt(model, speed_ms);
  return LogNormalFromMoments(m.mean_ms / speed_ms, m.std_ms / speed_ms);
}

}  // namespace planner
