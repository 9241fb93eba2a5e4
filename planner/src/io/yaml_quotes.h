// A check that every quoted YAML value is closed on the line where it opens.
//
// YAML lets a quoted value run over several lines, so a forgotten closing
// quote silently swallows the lines below it (up to the next quote) into the
// value, and the YAML library's complaint, if any, points far from the cause.
// fillcast's YAML files (plans, site models) hold no multi-line values, so a
// quote that does not close on its line is reported where it opens.
#ifndef PLANNER_IO_YAML_QUOTES_H_
#define PLANNER_IO_YAML_QUOTES_H_

#include <string>

namespace planner {
namespace io {

// Throws InputError "file:line:column: unterminated quote: ..." at the first
// quote (' or ") that starts a value and is not closed on its line. Quotes
// inside plain text (O'Brien), in comments and in block scalars (| and >)
// are left alone.
void CheckQuotesClose(const std::string& text, const std::string& file_name);

}  // namespace io
}  // namespace planner

#endif  // PLANNER_IO_YAML_QUOTES_H_
