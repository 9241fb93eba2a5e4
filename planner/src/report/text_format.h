// Small text helpers of the plain-text writers: percentages, weeks and intervals, done-by
// dates, word wrapping.
#ifndef PLANNER_REPORT_TEXT_FORMAT_H_
#define PLANNER_REPORT_TEXT_FORMAT_H_

#include <optional>
#include <string>

#include "planner/calendar.h"
#include "planner/plan.h"
#include "planner/quantile.h"
#include "report/report_numbers.h"

namespace planner {

inline constexpr int kTextWidth = 100;  // terminal text is at most this wide

// printf into a string: StringPrintf from report/report_numbers.h.

// Whole numbers without decimals, others with one.
std::string Compact(double x);
// "12.3 %".
std::string Percent(double share);
// DoneByDate (report_numbers.h) formatted, or "" when not reached.
std::string DoneBy(const Date& start, const std::optional<double>& weeks);
// Weeks right-aligned in `width`, or "not reached".
std::string WeeksText(const std::optional<double>& weeks, int width);
// "34.8 - 37.5", "up to 9.0", "from 3.1" or "not available".
std::string CiRangeText(const QuantileEstimate& q);
// Word-wraps text to kTextWidth; the first line starts with `first`, the
// others with as many spaces. Ends with a newline.
std::string Wrap(const std::string& first, const std::string& text);
// Cuts a label to `width` characters with "..." when longer.
std::string FitLabel(std::string label, size_t width);
// The header lines every text report opens with: plan, site, weather,
// (when named) turbine, and when the plan has them its high-wind rules and
// episodes; labels padded to `label_width` ("  Plan:" + spaces).
std::string PlanHeaderLines(const Plan& plan, size_t label_width);
// "stops at 25 m/s (10-minute mean), 28 m/s (30 s mean); restarts below
// 22 m/s after 20 min", or "" when the turbine has no shutdown rule, restart
// wait or storm control (cut-out and restart alone).
std::string HighWindText(const TurbineSpec& t);
// "icing (stops the turbine, records invalid): 5.3 a year, mean 30 h", one
// per episode joined by "; ", or "" without episodes.
std::string EpisodesText(const Plan& plan);
// "blade: up 96.9 %, then 2 h below 6 m/s with the crew to recalibrate;
// tower: up 99.4 %", the long-run share of each load-channel group's repair
// cycle it is up (MTBF / (MTBF + MTTR)), or "" without groups.
std::string ChannelGroupsText(const Plan& plan);

}  // namespace planner

#endif  // PLANNER_REPORT_TEXT_FORMAT_H_
