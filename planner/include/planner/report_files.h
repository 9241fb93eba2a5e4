// The report a manager reads (one self-contained HTML file) and CSV exports
// for people who continue in their own tools. Formats: docs/output.md.
#ifndef PLANNER_REPORT_FILES_H_
#define PLANNER_REPORT_FILES_H_

#include <string>
#include <vector>

#include "planner/decision.h"
#include "planner/forecast.h"
#include "planner/forecast_report.h"
#include "planner/plan.h"

namespace planner {

struct ProgressSummary;
struct StoredProgress;

// The progress section of a report (fillcast progress --report).
struct ProgressHtml {
  const ProgressSummary* summary = nullptr;  // required
  std::vector<StoredProgress> history;       // stored forecasts, for the chart
  std::string log_path;
};

struct HtmlReportInput {
  const Plan* plan = nullptr;                 // required
  const ForecastSummary* forecast = nullptr;  // required
  std::vector<StartSweepRow> start_sweep;     // optional section
  const Comparison* comparison = nullptr;     // optional section
  const ProgressHtml* progress = nullptr;     // optional section (progress)
  ReportContext context;
  std::string command_line;  // how the report was made (inputs and seed)
};

// One HTML file: no network access needed, inline SVG charts, prints to PDF.
// Carries <meta name="generator" content="fillcast ..."> (see
// cli/output_file.h, which only replaces files that carry it).
std::string FormatHtmlReport(const HtmlReportInput& in);

// One row per cell: label, kind, state, event, bins, required, count quantiles,
// P(full), weeks to full, P(last), savings. First line a "# generator=fillcast"
// comment, then a header row.
std::string FormatCellsCsv(const Plan& plan, const ForecastSummary& s,
                           const ReportContext& ctx);

// The completion-time curve: week, share of runs complete by then.
std::string FormatCompletionCurveCsv(const ForecastSummary& s, const ReportContext& ctx);

}  // namespace planner

#endif  // PLANNER_REPORT_FILES_H_
