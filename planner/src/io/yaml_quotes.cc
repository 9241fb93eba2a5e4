#include "io/yaml_quotes.h"

#include <cstddef>

#include "planner/error.h"

namespace planner {
namespace io {

namespace {

bool IsBlank(char c) { return c == ' ' || c == '\t'; }

// Offset just past the quote closing the one at `open`, or npos if the line
// ends first. In "..." a backslash escapes the next character; in '...' a
// doubled '' stands for one quote.
std::size_t CloseOf(const std::string& line, std::size_t open) {
  const char quote = line[open];
  for (std::size_t i = open + 1; i < line.size(); ++i) {
    if (quote == '"' && line[i] == '\\') {
      ++i;
    } else if (line[i] == quote) {
      if (quote == '\'' && i + 1 < line.size() && line[i + 1] == '\'') {
        ++i;
      } else {
        return i + 1;
      }
    }
  }
  return std::string::npos;
}

// True if the rest of the line after `at` is a block scalar's header ("|",
// ">-", "|2" ...), maybe followed by a comment.
bool BlockHeader(const std::string& line, std::size_t at) {
  if (at >= line.size() || (line[at] != '|' && line[at] != '>')) return false;
  std::size_t i = at + 1;
  while (i < line.size() &&
         (line[i] == '+' || line[i] == '-' || (line[i] >= '1' && line[i] <= '9'))) {
    ++i;
  }
  while (i < line.size() && IsBlank(line[i])) ++i;
  return i == line.size() || line[i] == '#';
}

class QuoteScan {
 public:
  explicit QuoteScan(const std::string& file) : file_(file) {}

  void Line(const std::string& line, int line_no) {
    std::size_t indent = 0;
    while (indent < line.size() && line[indent] == ' ') ++indent;
    if (block_indent_ >= 0) {
      if (indent >= line.size() || static_cast<int>(indent) > block_indent_) return;
      block_indent_ = -1;
    }
    bool start = true;  // a value may start here
    for (std::size_t i = indent; i < line.size(); ++i) {
      const char c = line[i];
      if (IsBlank(c)) continue;
      if (c == '#' && (i == 0 || IsBlank(line[i - 1]))) return;  // comment
      if (start && (c == '"' || c == '\'')) {
        const std::size_t close = CloseOf(line, i);
        if (close == std::string::npos) Unterminated(c, line_no, i);
        i = close - 1;
        start = false;
      } else if (start && BlockHeader(line, i)) {
        block_indent_ = static_cast<int>(indent);
        return;
      } else if (c == '[' || c == '{') {
        ++flow_depth_;
        start = true;
      } else if (c == ']' || c == '}') {
        if (flow_depth_ > 0) --flow_depth_;
        start = false;
      } else if (c == ',' && flow_depth_ > 0) {
        start = true;
      } else if ((c == '-' || c == '?' || c == ':') &&
                 (i + 1 == line.size() || IsBlank(line[i + 1]))) {
        start = true;  // a list item, a complex key or a value follows
      } else {
        start = false;  // plain text: a quote inside it is just a character
      }
    }
  }

 private:
  [[noreturn]] void Unterminated(char quote, int line_no, std::size_t column) const {
    const std::string q(1, quote);
    ThrowAt(SourceLocation{file_, line_no, static_cast<int>(column) + 1}, "",
            "unterminated quote: the " + q +
                " that opens this value is not closed on "
                "this line; close it with " +
                q +
                " before the end of the line (a quoted "
                "value may not run over several lines)");
  }

  std::string file_;
  int flow_depth_ = 0;
  int block_indent_ = -1;  // indentation of a block scalar's key, -1 if none
};

}  // namespace

void CheckQuotesClose(const std::string& text, const std::string& file_name) {
  QuoteScan scan(file_name);
  int line_no = 0;
  std::size_t begin = 0;
  while (begin <= text.size()) {
    std::size_t end = text.find('\n', begin);
    if (end == std::string::npos) end = text.size();
    std::string line = text.substr(begin, end - begin);
    if (!line.empty() && line.back() == '\r') line.pop_back();
    scan.Line(line, ++line_no);
    begin = end + 1;
  }
}

}  // namespace io
}  // namespace planner
