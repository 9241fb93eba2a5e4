#include "planner/error.h"

namespace planner {

std::string FormatLocated(const SourceLocation& where, const std::string& field,
                          const std::string& message) {
  std::string out = where.file;
  if (where.line > 0) {
    // A position without a file name still reads as one, like a compiler's
    // "<stdin>:3:1".
    if (out.empty()) out = "<input>";
    out += ":" + std::to_string(where.line);
    if (where.column > 0) out += ":" + std::to_string(where.column);
  }
  if (!out.empty()) out += ": ";
  if (!field.empty()) out += field + ": ";
  return out + message;
}

void ThrowAt(const SourceLocation& where, const std::string& field,
             const std::string& message) {
  throw InputError(FormatLocated(where, field, message));
}

}  // namespace planner
