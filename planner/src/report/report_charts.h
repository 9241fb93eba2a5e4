// The charts of the HTML report, as inline SVG (report/svg_chart.h): the
// completion-time curve, the fill of the matrix over time, the start-date
// sweep and the scenario comparison. Each returns "" when it has nothing to
// draw; the page then says so in words.
#ifndef PLANNER_REPORT_REPORT_CHARTS_H_
#define PLANNER_REPORT_REPORT_CHARTS_H_

#include <string>
#include <vector>

#include "planner/calendar.h"
#include "planner/decision.h"
#include "planner/forecast.h"

namespace planner {

// Share of runs complete (y, 0-100 %) against weeks from the start (x): the
// empirical distribution function of s.completion_counts, with vertical
// markers at P50, P80, P90 (labelled with weeks and done-by date) and at the
// deadline. Incomplete runs never complete, so the curve tops out at
// 1 - p_incomplete_at_horizon.
std::string CompletionCurveSvg(const ForecastSummary& s, const Date& start,
                               const Date& deadline);

// Share of required cells full (y) against weeks (x): the median over the
// runs as a line and the P10-P90 range as a band (s.fill_curve), with the
// deadline marked.
std::string FillCurveSvg(const ForecastSummary& s, const Date& deadline);

// P50 / P80 / P90 weeks to completion for each start date of a sweep, with
// the deadline's distance from the start as a reference line.
std::string StartSweepSvg(const std::vector<StartSweepRow>& rows, double deadline_weeks);

// One row per ranked scenario: the range from P50 to P90 weeks, P80 marked.
std::string ComparisonSvg(const Comparison& c);

}  // namespace planner

#endif  // PLANNER_REPORT_REPORT_CHARTS_H_
