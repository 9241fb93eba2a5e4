// Escaping text for HTML and SVG. Every string that comes from a user's file
// (plan and site names, paths, event names, scenario names, the command line)
// goes through HtmlEscape before it is written into a report.
#ifndef PLANNER_REPORT_HTML_ESCAPE_H_
#define PLANNER_REPORT_HTML_ESCAPE_H_

#include <string>

namespace planner {

// Replaces & < > " ' by character references; safe in element text and in
// double- or single-quoted attribute values.
std::string HtmlEscape(const std::string& text);

}  // namespace planner

#endif  // PLANNER_REPORT_HTML_ESCAPE_H_
