#include "sim/renewal_process.h"

#include "planner/calendar.h"
#include "sim/ziggurat_normal.h"

namespace planner {

DurationSampler::DurationSampler(const DurationLaw& law, double mean)
    : kind(law.kind), mean_steps(mean) {
  if (kind == DurationLaw::Kind::kWeibull) {
    inverse_shape = 1.0 / law.shape;
    weibull_scale_steps = mean / std::tgamma(1.0 + inverse_shape);
  } else if (kind == DurationLaw::Kind::kLognormal) {
    log_sigma = law.shape;
    log_mu = std::log(mean) - 0.5 * log_sigma * log_sigma;
  }
}

double DurationSampler::Draw(double u, double n) const {
  switch (kind) {
    case DurationLaw::Kind::kExponential:
      return -mean_steps * std::log1p(-u);
    case DurationLaw::Kind::kWeibull:
      return weibull_scale_steps * std::pow(-std::log1p(-u), inverse_shape);
    case DurationLaw::Kind::kLognormal:
      return std::exp(log_mu + log_sigma * n);
  }
  return mean_steps;
}

double DurationSampler::Mean() const {
  switch (kind) {
    case DurationLaw::Kind::kExponential:
      return mean_steps;
    case DurationLaw::Kind::kWeibull:
      return weibull_scale_steps * std::tgamma(1.0 + inverse_shape);
    case DurationLaw::Kind::kLognormal:
      return std::exp(log_mu + 0.5 * log_sigma * log_sigma);
  }
  return mean_steps;
}

RenewalLaw MakeRenewalLaw(const OutageModel& m) {
  RenewalLaw law;
  law.enabled = m.mtbf_h > 0.0 && m.mttr_h > 0.0;
  law.up = DurationSampler(m.up_law, m.mtbf_h * kStepsPerHour);
  law.down = DurationSampler(m.repair_law, m.mttr_h * kStepsPerHour);
  law.repair_month_factors = m.repair_month_factors;
  return law;
}

RenewalProcess::RenewalProcess(const RenewalLaw& law, Engine* engine,
                               const uint8_t* day_month, int64_t days)
    : law_(law), engine_(engine), day_month_(day_month), days_(days) {
  if (law_.enabled) {
    const ZigguratNormal normal;
    const double u = UniformDouble(*engine_);
    next_change_ = law_.up.Draw(u, normal(*engine_));
  }
}

double RenewalProcess::RepairFactorAt(double step) const {
  if (day_month_ == nullptr || days_ == 0) return 1.0;
  int64_t day = static_cast<int64_t>(step) / kStepsPerDay;
  if (day >= days_) day = days_ - 1;
  if (day < 0) day = 0;
  return law_.repair_month_factors[day_month_[day]];
}

// Draws the next duration (one uniform and one normal per flip, whatever the
// law, so that changing the law never shifts later draws of the stream).
void RenewalProcess::Flip() {
  up_ = !up_;
  const ZigguratNormal normal;
  const double u = UniformDouble(*engine_);
  const double n = normal(*engine_);
  if (up_) {
    next_change_ += law_.up.Draw(u, n);
  } else {
    next_change_ += law_.down.Draw(u, n) * RepairFactorAt(next_change_);
  }
}

}  // namespace planner
