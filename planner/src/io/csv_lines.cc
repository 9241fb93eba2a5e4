#include "io/csv_lines.h"

namespace planner {
namespace io {

bool ReadCappedLine(std::istream& in, std::vector<char>& buffer, std::string* line,
                    const std::string& file, int64_t line_no,
                    const std::string& expected) {
  in.getline(buffer.data(), static_cast<std::streamsize>(buffer.size()));
  const std::size_t n = static_cast<std::size_t>(in.gcount());
  if (in.fail() && !in.eof() && n + 1 >= buffer.size()) {
    ThrowAt(SourceLocation{file, static_cast<int>(line_no), 0}, "",
            "line is longer than 1 MiB; expected " + expected + ", one record per line");
  }
  if (n == 0 && in.fail()) return false;
  // getline counts the '\n' it consumed but does not store it.
  line->assign(buffer.data(), in.eof() ? n : n - 1);
  return true;
}

void CheckNoLoneCarriageReturn(const std::string& line, const std::string& file,
                               int64_t line_no) {
  const std::size_t cr = line.find('\r');
  if (cr == std::string::npos || cr + 1 == line.size()) return;
  ThrowAt(SourceLocation{file, static_cast<int>(line_no), static_cast<int>(cr) + 1}, "",
          "a carriage return (CR) inside the line: the file's lines end in CR only (an "
          "old Mac format); save it with LF or CR LF line ends");
}

}  // namespace io
}  // namespace planner
