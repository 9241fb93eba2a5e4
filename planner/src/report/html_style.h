// The style sheet of the HTML report, inlined into every page so the file
// needs nothing else to display or print. Screen and print (A4) rules; no
// dark backgrounds; the chart classes used by report/svg_chart.h,
// report/report_charts.h and report/matrix_grid.h.
#ifndef PLANNER_REPORT_HTML_STYLE_H_
#define PLANNER_REPORT_HTML_STYLE_H_

namespace planner {

// The CSS text, without <style> tags.
const char* HtmlReportStyle();

}  // namespace planner

#endif  // PLANNER_REPORT_HTML_STYLE_H_
