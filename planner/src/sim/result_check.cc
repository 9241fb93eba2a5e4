#include "planner/result_check.h"

#include <cmath>
#include <cstdio>
#include <optional>

namespace planner {

namespace {

std::string Num(double x) {
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%.6g", x);
  return buffer;
}

class Checker {
 public:
  explicit Checker(double horizon_weeks) : horizon_weeks_(horizon_weeks) {}

  void Range(const std::string& what, double x, double lo, double hi,
             const std::string& expected) {
    if (!(std::isfinite(x) && x >= lo && x <= hi)) {
      problems_.push_back(what + ": " + Num(x) + " (expected " + expected + ")");
    }
  }
  void Share(const std::string& what, double x) { Range(what, x, 0.0, 1.0, "0 to 1"); }
  void Weeks(const std::string& what, const std::optional<double>& x) {
    // A tenth of a week of slack: a week is counted from whole records.
    if (x) Range(what, *x, 0.0, horizon_weeks_ + 0.1, "0 to the horizon in weeks");
  }
  void Count(const std::string& what, double x) {
    Range(what, x, 0.0, HUGE_VAL, "a count >= 0");
  }
  void Finite(const std::string& what, const std::optional<double>& x) {
    if (x) Range(what, *x, -HUGE_VAL, HUGE_VAL, "a finite number");
  }
  void Quantile(const std::string& what, const QuantileEstimate& q) {
    Weeks(what, q.value);
    Weeks(what + " interval from", q.ci_lo);
    Weeks(what + " interval to", q.ci_hi);
  }
  std::vector<std::string> Problems() { return std::move(problems_); }

 private:
  double horizon_weeks_;
  std::vector<std::string> problems_;
};

}  // namespace

std::vector<std::string> ImplausibleNumbers(const ForecastSummary& s) {
  Checker c(s.horizon_weeks);
  c.Range("horizon", s.horizon_weeks, 0.0, HUGE_VAL, "weeks >= 0");
  c.Range("deadline", s.deadline_weeks, 0.0, HUGE_VAL, "weeks >= 0");
  c.Weeks("mean weeks to completion", s.mean_weeks);
  c.Finite("standard error of the mean", s.mean_se_weeks);
  c.Quantile("P10", s.p10);
  c.Quantile("P50", s.p50);
  c.Quantile("P80", s.p80);
  c.Quantile("P90", s.p90);
  c.Share("chance of completion by the deadline", s.p_complete_by_deadline);
  c.Share("share incomplete at the horizon", s.p_incomplete_at_horizon);
  c.Share("turbine availability", s.turbine_availability);
  c.Share("data acquisition availability", s.daq_availability);
  c.Share("load-channel availability", s.channels_availability);
  c.Share("share of wind from a valid sector", s.valid_sector_share);
  c.Share("share of time curtailed", s.curtailed_share);
  c.Range("mean wind speed at hub", s.mean_speed_ms, 0.0, kMaxMeanSpeedMs,
          "0 to " + Num(kMaxMeanSpeedMs) + " m/s");
  for (const CellForecast& cell : s.cells) {
    const std::string at = "cell " + std::to_string(cell.index + 1) + ", ";
    c.Count(at + "mean count", cell.count_mean);
    c.Count(at + "count P10", cell.count_p10);
    c.Count(at + "count P50", cell.count_p50);
    c.Count(at + "count P90", cell.count_p90);
    c.Share(at + "chance full by the deadline", cell.p_full_by_deadline);
    c.Share(at + "chance of filling last", cell.p_last_to_fill);
    c.Share(at + "chance not full at the end", cell.p_not_full_at_end);
    c.Weeks(at + "weeks to full P50", cell.weeks_to_full_p50);
    c.Weeks(at + "weeks to full P90", cell.weeks_to_full_p90);
    c.Finite(at + "saved if optional, P50", cell.saved_p50_if_optional);
    c.Finite(at + "saved if optional, P80", cell.saved_p80_if_optional);
    c.Finite(at + "saved if relaxed, P50", cell.saved_p50_if_relaxed);
    c.Finite(at + "saved if relaxed, P80", cell.saved_p80_if_relaxed);
  }
  for (const FillPoint& point : s.fill_curve) {
    c.Range("completion curve week", point.week, 0.0, s.horizon_weeks + 1.0,
            "0 to the horizon in weeks");
    c.Share("completion curve share", point.p10);
    c.Share("completion curve share", point.p50);
    c.Share("completion curve share", point.p90);
  }
  return c.Problems();
}

}  // namespace planner
