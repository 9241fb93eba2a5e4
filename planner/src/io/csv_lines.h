// The line loop shared by the CSV readers (measured data, campaign records):
// a UTF-8 byte-order mark is dropped, blank lines (and, if asked, comment
// lines starting with '#') are skipped, the first remaining line goes to the
// parser's ReadHeader and the others to ReadRow, and a line longer than 1 MiB
// is an error instead of a read that goes on forever.
#ifndef PLANNER_IO_CSV_LINES_H_
#define PLANNER_IO_CSV_LINES_H_

#include <cstdint>
#include <istream>
#include <string>
#include <vector>

#include "planner/error.h"

namespace planner {
namespace io {

inline constexpr std::size_t kMaxCsvLineBytes = 1 << 20;

// The next line of `in` into *line (without its '\n'); false at the end.
// Throws InputError at file:line_no when the line exceeds kMaxCsvLineBytes;
// `expected` says what the file should hold ("a CSV file of met data").
bool ReadCappedLine(std::istream& in, std::vector<char>& buffer, std::string* line,
                    const std::string& file, int64_t line_no,
                    const std::string& expected);

// Throws InputError at file:line_no:column if `line` holds a carriage return
// (CR) that does not end it: the file's lines then end in CR only (an old
// Mac format), which would otherwise read as one long line.
void CheckNoLoneCarriageReturn(const std::string& line, const std::string& file,
                               int64_t line_no);

// Feeds the lines of `in` to parser.ReadHeader(line, line_no) and
// parser.ReadRow(line, line_no) as described above. Throws InputError
// "<file>: is empty; expected a header row naming the columns, then one row
// per <row_noun>" when no header line was found.
template <typename Parser>
void FeedCsvLines(std::istream& in, const std::string& file_name, bool skip_comments,
                  const std::string& expected, const std::string& row_noun,
                  Parser& parser) {
  std::string line;
  std::vector<char> buffer(kMaxCsvLineBytes + 2);
  int64_t line_no = 0;
  bool have_header = false;
  while (ReadCappedLine(in, buffer, &line, file_name, line_no + 1, expected)) {
    ++line_no;
    if (line_no == 1 && line.compare(0, 3, "\xEF\xBB\xBF") == 0) line.erase(0, 3);
    CheckNoLoneCarriageReturn(line, file_name, line_no);
    const std::size_t first = line.find_first_not_of(" \t\r");
    if (first == std::string::npos) continue;  // blank line
    if (skip_comments && line[first] == '#') continue;
    if (!have_header) {
      parser.ReadHeader(line, line_no);
      have_header = true;
    } else {
      parser.ReadRow(line, line_no);
    }
  }
  if (!have_header) {
    ThrowAt(SourceLocation{file_name, 0, 0}, "",
            "is empty; expected a header row naming the columns, then one row per " +
                row_noun);
  }
}

}  // namespace io
}  // namespace planner

#endif  // PLANNER_IO_CSV_LINES_H_
