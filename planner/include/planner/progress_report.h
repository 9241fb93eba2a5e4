// Writing a progress forecast (fillcast progress) for people (aligned plain
// text with units) and for programs (JSON, keys in docs/output.md), and the
// history of stored progress forecasts. Formats: docs/progress.md.
#ifndef PLANNER_PROGRESS_REPORT_H_
#define PLANNER_PROGRESS_REPORT_H_

#include <string>
#include <vector>

#include "planner/campaign_log.h"
#include "planner/plan.h"
#include "planner/progress_forecast.h"

namespace planner {

struct ProgressReportContext {
  std::string tool_version;
  int threads = 1;
  std::string log_path;     // the campaign log
  int64_t log_records = 0;  // records in it (all dates)
  int thin_cell_rows = 10;  // rows in the table of cells thin even when extended
};

// Plain-text summary for the terminal (at most 100 columns), ending with the
// cautions.
std::string FormatProgressText(const Plan& plan, const ProgressSummary& s,
                               const ProgressReportContext& ctx);

// JSON document (pretty-printed, 2-space indent); "kind": "progress".
std::string FormatProgressJson(const Plan& plan, const ProgressSummary& s,
                               const ProgressReportContext& ctx);

// The capture matrix as logged: per state a grid of count / minimum, then the
// event cells (part of the text summary; also used on its own).
std::string FormatLoggedMatrixText(const Plan& plan, const std::vector<uint32_t>& counts);

// The stored progress forecasts as a table by as-of date.
std::string FormatProgressHistoryText(const Plan& plan,
                                      const std::vector<StoredProgress>& history,
                                      const ProgressReportContext& ctx);

// The same as JSON ("kind": "progress_history").
std::string FormatProgressHistoryJson(const Plan& plan,
                                      const std::vector<StoredProgress>& history,
                                      const ProgressReportContext& ctx);

// The latest stored result of each as-of date (the one the chart draws), in
// date order.
std::vector<StoredProgress> LatestPerAsOf(const std::vector<StoredProgress>& history);

}  // namespace planner

#endif  // PLANNER_PROGRESS_REPORT_H_
