// Writing a forecast for people (aligned plain text with units) and for
// programs (JSON with the keys documented in docs/output.md).
#ifndef PLANNER_FORECAST_REPORT_H_
#define PLANNER_FORECAST_REPORT_H_

#include <string>

#include "planner/forecast.h"
#include "planner/plan.h"

namespace planner {

struct ReportContext {
  std::string tool_version;
  int threads = 1;
  int thin_cell_rows = 10;  // rows in the thin-cell table
  // Set when runs were added until a quantile's 95 % interval was narrow
  // enough (--precision): what was asked and what was reached.
  bool precision_used = false;
  double precision_quantile = 0.8;
  double precision_target_weeks = 0;
  double precision_width_weeks = 0;  // +infinity when the interval is open
  bool precision_met = false;
};

// Plain-text summary for the terminal, ending with the cautions.
std::string FormatForecastText(const Plan& plan, const ForecastSummary& s,
                               const ReportContext& ctx);

// JSON document (pretty-printed, 2-space indent).
std::string FormatForecastJson(const Plan& plan, const ForecastSummary& s,
                               const ReportContext& ctx);

}  // namespace planner

#endif  // PLANNER_FORECAST_REPORT_H_
