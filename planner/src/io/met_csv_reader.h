// Reading measured wind data (met mast or lidar) from CSV for fit-site.
//
// The file has a header row naming its columns, then one row per record:
//
//   timestamp,speed_ms,speed_std_ms,direction_deg
//   2024-03-01 00:00,7.42,0.81,236
//
// Columns are found by the names in MetCsvOptions, or by usual names when
// those are empty (docs/fit-site.md lists both). Timestamps are YYYY-MM-DD,
// YYYY-MM-DD HH:MM[:SS] or YYYY-MM-DDTHH:MM[:SS]. Speeds in knots are
// converted with 1 kn = 1852/3600 m/s (exact by definition).
//
// Problems with single rows never stop the reading: the row is dropped and
// counted under its DropReason, and the first few of each reason are quoted
// in MetReadReport::examples as "file:line: column 'x': value problem". What
// makes the whole file unusable throws InputError naming the file, the line,
// the column and what would be valid: a file that cannot be opened, a
// missing required column, a unit that cannot be told, no usable rows.
#ifndef PLANNER_IO_MET_CSV_READER_H_
#define PLANNER_IO_MET_CSV_READER_H_

#include <cstdint>
#include <istream>
#include <optional>
#include <string>
#include <vector>

#include "planner/error.h"
#include "planner/site_fit.h"

namespace planner {

// Reads the CSV file at `path` (see above).
MetSeries LoadMetCsv(const std::string& path, const MetCsvOptions& options);

// The same from a stream; `file_name` is used in messages and, with
// SpeedUnit::kAuto, to find the unit when the column name does not give it.
MetSeries ReadMetCsv(std::istream& in, const std::string& file_name,
                     const MetCsvOptions& options);

// Seconds since 1970-01-01 00:00 for "YYYY-MM-DD", "YYYY-MM-DD HH:MM[:SS]" or
// "YYYY-MM-DDTHH:MM[:SS]" (a real calendar date, hours 00-23); nullopt
// otherwise.
std::optional<int64_t> ParseTimestamp(const std::string& text);

// "YYYY-MM-DD", or "YYYY-MM-DD HH:MM" when with_time (":SS" added if the
// seconds are not 0).
std::string FormatTimestamp(int64_t time_s, bool with_time);

// A step as people say it: "10 min", "1 h", "1 day", "90 s".
std::string FormatStep(int64_t step_s);

// The cells of one CSV line: comma-separated, "double-quoted" cells with ""
// for a quote inside; spaces around each cell's text are trimmed (inside the
// quotes too: no value we read has meaningful outer spaces). A quote that is
// not closed on the line, or text after a closing quote, throws InputError at
// `where` (file and line) and the quote's column: a cell never runs on into
// the next line or silently loses text.
std::vector<std::string> SplitCsvLine(const std::string& line,
                                      const SourceLocation& where = {});

}  // namespace planner

#endif  // PLANNER_IO_MET_CSV_READER_H_
