// A small plan and a forecast summary written by hand, shared by the tests of
// the HTML report and the CSV exports. Names carry characters that must be
// escaped or quoted (<, &, ", and a comma).
#ifndef FILLCAST_TESTS_REPORT_REPORT_TEST_DATA_H_
#define FILLCAST_TESTS_REPORT_REPORT_TEST_DATA_H_

#include <cmath>
#include <limits>
#include <optional>

#include "planner/forecast.h"
#include "planner/forecast_report.h"
#include "planner/plan.h"

namespace planner {
namespace report_test {

inline Cell RecordCell(OperatingState state, Bin wind, std::optional<Bin> ti,
                       int required, bool optional) {
  Cell c;
  c.state = state;
  c.wind_ms = wind;
  c.ti_binned = ti.has_value();
  if (ti) c.ti_pct = *ti;
  c.required = required;
  c.optional = optional;
  return c;
}

// Production: wind bins 4-5 and 5-6 m/s x TI bins 0-10 and 10-20 %, one grid
// position without a cell; parked: 25-30 m/s without TI bins; one event cell.
inline Plan TestPlan() {
  Plan p;
  p.name = "Ridge <North> & \"Vale\" campaign";
  p.source_file = "plans/ridge & vale.yaml";
  p.site.name = "Vale <invented>";
  p.site_file = "sites/vale.yaml";
  p.turbine.name = "VX-90 (invented)";
  p.start = Date{2025, 4, 1};
  p.deadline = Date{2025, 6, 10};  // 70 days = 10 weeks
  p.horizon_weeks = 20;

  CaptureMatrix& m = p.matrix;
  m.cells = {
      RecordCell(OperatingState::kProduction, {4, 5}, Bin{0, 10}, 10, false),
      RecordCell(OperatingState::kProduction, {4, 5}, Bin{10, 20}, 10, true),
      RecordCell(OperatingState::kProduction, {5, 6}, Bin{0, 10}, 8, false),
      RecordCell(OperatingState::kParked, {25, 30}, std::nullopt, 3, false),
  };
  Cell event;
  event.event = 0;
  event.wind_ms = {8, 16};
  event.required = 2;
  m.cells.push_back(event);
  m.event_types = {"grid loss, manual <test>"};

  StateGrid production;
  production.state = OperatingState::kProduction;
  production.wind_bins_ms = {{4, 5}, {5, 6}};
  production.ti_bins_pct = {{0, 10}, {10, 20}};
  production.cell_index = {0, 1, 2, -1};
  StateGrid parked;
  parked.state = OperatingState::kParked;
  parked.wind_bins_ms = {{25, 30}};
  parked.cell_index = {3};
  m.grids = {production, parked};
  return p;
}

inline QuantileEstimate Q(double p, std::optional<double> v, std::optional<double> lo,
                          std::optional<double> hi) {
  QuantileEstimate q;
  q.p = p;
  q.value = v;
  q.ci_lo = lo;
  q.ci_hi = hi;
  return q;
}

inline CellForecast Forecast(const Plan& plan, int index, double mean, double p10,
                             double p50, double p90, double p_full,
                             std::optional<double> weeks50, double p_last) {
  CellForecast c;
  c.index = index;
  c.cell = plan.matrix.cells[static_cast<size_t>(index)];
  c.count_mean = mean;
  c.count_p10 = p10;
  c.count_p50 = p50;
  c.count_p90 = p90;
  c.p_full_by_deadline = p_full;
  c.weeks_to_full_p50 = weeks50;
  c.p_last_to_fill = p_last;
  return c;
}

// Ten runs, one of them incomplete at the horizon.
inline ForecastSummary TestSummary(const Plan& plan) {
  ForecastSummary s;
  s.runs = 10;
  s.seed = 4242;
  s.deadline_weeks = 10;
  s.horizon_weeks = 20;
  // Nine distinct completion times and one run incomplete at the horizon.
  s.completion_counts = {{3.5, 1}, {5.1, 1},  {6.0, 1},  {7.25, 1}, {9.01, 1},
                         {9.5, 1}, {11.0, 1}, {12.0, 1}, {12.5, 1}};
  s.p10 = Q(0.1, 3.5, std::nullopt, 6.0);
  s.p50 = Q(0.5, 9.01, 5.1, 12.0);
  s.p80 = Q(0.8, 12.0, 9.01, std::nullopt);
  s.p90 = Q(0.9, 12.5, 9.5, std::nullopt);
  s.p_complete_by_deadline = 0.6;
  s.p_incomplete_at_horizon = 0.1;

  s.cells = {
      Forecast(plan, 0, 14.25, 8, 14, 21, 0.7, 6.5, 0.1),
      Forecast(plan, 1, 6.5, 2, 6, 11, 0.3, std::nullopt, 0.0),
      Forecast(plan, 2, 7.75, 3, 8, 12, 0.45, 10.5, 0.6),
      Forecast(plan, 3, 40.0, 22, 39, 61, 0.98, 2.0, 0.0),
      Forecast(plan, 4, 2.5, 1, 2, 4, 0.8, 5.0, 0.2),
  };
  s.cells[2].saved_p50_if_optional = 0.75;
  s.cells[2].saved_p80_if_optional = 1.5;
  s.bottleneck_cell = 2;

  for (int w = 0; w <= 20; ++w) {
    const double x = w / 20.0;
    s.fill_curve.push_back(
        {static_cast<double>(w), 0.8 * x * x, 0.9 * std::sqrt(x), std::sqrt(x)});
  }
  s.turbine_availability = 0.91;
  s.daq_availability = 0.97;
  s.valid_sector_share = 0.62;
  s.mean_speed_ms = 7.4;
  return s;
}

inline ReportContext TestContext() {
  ReportContext ctx;
  ctx.tool_version = "9.8.7";
  ctx.threads = 2;
  return ctx;
}

}  // namespace report_test
}  // namespace planner

#endif  // FILLCAST_TESTS_REPORT_REPORT_TEST_DATA_H_
