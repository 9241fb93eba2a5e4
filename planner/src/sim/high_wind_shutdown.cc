#include "sim/high_wind_shutdown.h"

#include <algorithm>

#include "sim/compiled_model.h"

namespace planner {
namespace {

constexpr double kRecordS = 600.0;
constexpr double kGridStepMs = ShutdownTables::kGridStepMs;
// ln TI searched for the floors: TI from 0.1 % to 300 %.
constexpr double kLowestLogTi = -6.9, kHighestLogTi = 1.1;

// The lowest ln TI at which a record at speed_ms trips with probability
// kTripNegligible or more (bisection; p grows with sigma), +inf if none.
double LogTiFloor(const ShutdownTables& s, double speed_ms) {
  const auto p = [&](double log_ti) {
    return s.TripProbability(speed_ms, speed_ms * std::exp(log_ti));
  };
  if (p(kHighestLogTi) < kTripNegligible) return HUGE_VAL;
  double lo = kLowestLogTi, hi = kHighestLogTi;
  if (p(lo) >= kTripNegligible) return -HUGE_VAL;
  for (int i = 0; i < 50; ++i) {
    const double mid = 0.5 * (lo + hi);
    (p(mid) >= kTripNegligible ? hi : lo) = mid;
  }
  return lo;
}

// The trip probability at speed_ms averaged over the TI law there (the
// latent normal x on [-8, 8], midpoint rule with steps of 0.05).
double MeanTripProbability(const ShutdownTables& s, const TiLaw& ti_law,
                           double speed_ms) {
  constexpr double kStep = 0.05;
  double mean = 0.0;
  for (double x = -8.0 + 0.5 * kStep; x < 8.0; x += kStep) {
    const double sigma = speed_ms * std::exp(ti_law.LogSample(speed_ms, x));
    mean += s.TripProbability(speed_ms, sigma) * std::exp(-0.5 * x * x);
  }
  return mean * kStep / std::sqrt(2.0 * M_PI);
}

}  // namespace

double ShutdownTables::attention_ms() const {
  return std::min({cut_out_ms, trip_floor_ms, storm_from_ms});
}

double ShutdownTables::TripProbability(double speed_ms, double sigma_ms) const {
  if (rules.empty()) return 0.0;
  const double g = std::clamp((speed_ms - grid_lo_ms) / kGridStepMs, 0.0,
                              static_cast<double>(rules[0].at_speed.size() - 1));
  const size_t i = std::min(static_cast<size_t>(g), rules[0].at_speed.size() - 2);
  const double f = g - static_cast<double>(i);
  double p = 0.0;
  for (const ShortTermRuleTable& r : rules) {
    const MovingAverageMoments& a = r.at_speed[i];
    const MovingAverageMoments& b = r.at_speed[i + 1];
    const MovingAverageMoments m{a.sigma_ratio + f * (b.sigma_ratio - a.sigma_ratio),
                                 a.zero_upcrossing_hz +
                                     f * (b.zero_upcrossing_hz - a.zero_upcrossing_hz)};
    p = std::max(p, ExceedanceFromMoments(m, speed_ms, sigma_ms, kRecordS, r.threshold_ms));
  }
  return p;
}

ShutdownTables CompileShutdown(const TurbineSpec& t, const TiLaw& ti_law,
                               double length_scale_m) {
  ShutdownTables s;
  s.cut_out_ms = t.cut_out_ms;
  s.restart_ms = t.restart_ms;
  s.restart_wait_steps = static_cast<int>(std::ceil(t.restart_wait_min / 10.0 - 1e-9));
  if (t.storm_control_from_ms > 0) s.storm_from_ms = t.storm_control_from_ms;
  if (t.shutdown_rules.empty()) return s;
  s.grid_lo_ms = t.cut_in_ms;
  const int points =
      std::max(2, static_cast<int>(std::ceil((t.cut_out_ms - t.cut_in_ms) / kGridStepMs)) + 1);
  for (const ShortTermShutdown& rule : t.shutdown_rules) {
    ShortTermRuleTable table{rule.averaging_s, rule.threshold_ms, {}};
    for (int i = 0; i < points; ++i) {
      RecordSpectrum spectrum;
      spectrum.mean_speed_ms = s.grid_lo_ms + i * kGridStepMs;
      spectrum.length_scale_m = length_scale_m;
      spectrum.record_s = kRecordS;
      table.at_speed.push_back(MovingAverageMomentsOf(spectrum, rule.averaging_s));
    }
    s.rules.push_back(std::move(table));
  }
  // The trip floor: scanning down from cut-out, the first grid speed at
  // which a record's trip probability, averaged over the TI law there, falls
  // below kTripNegligible (the probability grows with the speed).
  s.trip_floor_ms = t.cut_out_ms;
  for (int i = points - 1; i >= 0; --i) {
    const double v = s.grid_lo_ms + i * kGridStepMs;
    if (v >= t.cut_out_ms) continue;
    if (MeanTripProbability(s, ti_law, v) < kTripNegligible) break;
    s.trip_floor_ms = v;
  }
  for (int i = 0; i < points; ++i) {
    s.log_ti_floor.push_back(LogTiFloor(s, s.grid_lo_ms + i * kGridStepMs));
  }
  for (int i = 0; i + 1 < points; ++i) {
    s.log_ti_floor[i] = std::min(s.log_ti_floor[i], s.log_ti_floor[i + 1]);
  }
  return s;
}

bool HighWindShutdown::Next(bool was_stopped, double speed_ms, bool may_run,
                            double log_ti) {
  if (speed_ms >= t_.cut_out_ms) {
    below_restart_ = 0;
    return true;
  }
  if (was_stopped) {
    if (speed_ms >= t_.restart_ms) {
      below_restart_ = 0;
      return true;
    }
    if (++below_restart_ <= t_.restart_wait_steps) return true;
    below_restart_ = 0;  // restarts
    return false;
  }
  if (!MayTrip(was_stopped, speed_ms, may_run) || !t_.MayTripAt(speed_ms, log_ti))
    return false;
  return UniformDouble(engine_) < t_.TripProbability(speed_ms, speed_ms * std::exp(log_ti));
}

}  // namespace planner
