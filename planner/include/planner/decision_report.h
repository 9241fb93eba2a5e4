// Writing comparisons and start-date sweeps for people (aligned text with
// units) and programs (JSON, keys in docs/output.md).
#ifndef PLANNER_DECISION_REPORT_H_
#define PLANNER_DECISION_REPORT_H_

#include <string>
#include <vector>

#include "planner/decision.h"
#include "planner/forecast_report.h"

namespace planner {

std::string FormatComparisonText(const Comparison& c, const ReportContext& ctx);
std::string FormatComparisonJson(const Comparison& c, const ReportContext& ctx);

std::string FormatStartSweepText(const Plan& plan, const std::vector<StartSweepRow>& rows,
                                 const ReportContext& ctx, long runs, uint64_t seed);
std::string FormatStartSweepJson(const Plan& plan, const std::vector<StartSweepRow>& rows,
                                 const ReportContext& ctx, long runs, uint64_t seed);

}  // namespace planner

#endif  // PLANNER_DECISION_REPORT_H_
