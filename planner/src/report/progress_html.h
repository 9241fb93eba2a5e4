// The progress section of the HTML report (fillcast progress --report): the
// matrix as logged, what extending buys, the cells thin even then, and a
// chart and table of the stored progress forecasts. The rest of the page is
// the forecast of the remainder, drawn like any forecast.
#ifndef PLANNER_REPORT_PROGRESS_HTML_H_
#define PLANNER_REPORT_PROGRESS_HTML_H_

#include <string>
#include <vector>

#include "planner/campaign_log.h"
#include "planner/report_files.h"

namespace planner {

// "" when in.progress is null.
std::string ProgressHtmlSection(const HtmlReportInput& in);

// P50 / P80 / P90 done-by dates of the stored forecasts (latest per as-of
// date) against the as-of date, both in weeks from the plan's start, with the
// planned end as a line; "" when nothing is stored.
std::string ProgressHistorySvg(const std::vector<StoredProgress>& latest,
                               const Date& start, const Date& planned_end);

}  // namespace planner

#endif  // PLANNER_REPORT_PROGRESS_HTML_H_
