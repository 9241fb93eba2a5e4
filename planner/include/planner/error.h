// The one error type of fillcast.
//
// Every problem with what a user gave us (a file, a field, a flag) is reported
// by throwing InputError. Its message names where the problem is (file, line,
// column where known), the field, the offending value and what would be valid,
// in the style
//
//   plan.yaml:12:14: turbine.cut_in_ms: 30 must be below cut_out_ms (25)
//
// Only main() catches it, prints it to stderr and exits non-zero. The
// simulation core never throws: everything is validated before it starts.
#ifndef PLANNER_ERROR_H_
#define PLANNER_ERROR_H_

#include <stdexcept>
#include <string>

namespace planner {

class InputError : public std::runtime_error {
 public:
  explicit InputError(const std::string& message) : std::runtime_error(message) {}
};

// Where in an input a value came from. line and column are 1-based; 0 means
// unknown (then only the file is named).
struct SourceLocation {
  std::string file;
  int line = 0;
  int column = 0;
};

// "file:line:col: field: message" (parts that are unknown are left out).
std::string FormatLocated(const SourceLocation& where, const std::string& field,
                          const std::string& message);

// Throws InputError with FormatLocated(where, field, message).
[[noreturn]] void ThrowAt(const SourceLocation& where, const std::string& field,
                          const std::string& message);

}  // namespace planner

#endif  // PLANNER_ERROR_H_
