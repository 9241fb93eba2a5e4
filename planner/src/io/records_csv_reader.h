// Reading a campaign's logged 10-minute statistics from CSV for
// `fillcast log add` (format: docs/progress.md).
//
//   timestamp,speed_ms,speed_std_ms,direction_deg,state,quality,event
//   2027-03-01 00:00,7.42,0.81,236,production,ok,
//
// Blank lines and lines starting with '#' (comments) are skipped anywhere.
// Columns are found by the names in RecordsCsvOptions, or by usual names when
// those are empty. Speeds and standard deviations are in m/s, directions in
// degrees (0-360, where the wind comes from). Timestamps mark the start of the
// 10-minute period (or its end, with stamp_at_end) and must fall on the
// 10-minute grid.
//
// What is allowed and what stops the ingest:
//  * A missing value (empty, NA, N/A, null, -, NaN) in the speed, standard
//    deviation or direction is kept as "not logged": the record is logged but
//    cannot count for a cell that needs the value.
//  * Every other problem in a row (a timestamp that is not one or is off the
//    10-minute grid, a number that is not one or is out of range, a state or
//    quality flag outside the vocabulary, a malformed event name, a wrong
//    number of cells) stops the ingest before anything is written: the whole
//    file is read first and InputError lists the first problems, each as
//    "file:line:column: column 'name': 'value' is ...; valid: ...", then how
//    many rows had problems.
//  * A file that cannot be read, or a header without a needed column, stops it
//    too.
#ifndef PLANNER_IO_RECORDS_CSV_READER_H_
#define PLANNER_IO_RECORDS_CSV_READER_H_

#include <istream>
#include <string>
#include <vector>

#include "planner/campaign_log.h"

namespace planner {

struct RecordsCsvOptions {
  // Column names; "" = a usual name (docs/progress.md lists them).
  std::string time_column, speed_column, std_column, direction_column;
  std::string state_column, quality_column;
  std::string event_column;   // optional column: "" = a column named "event", if any
  // Optional column of load-channel groups down: "" = a column named
  // "channels_down", if any.
  std::string channels_down_column;
  bool stamp_at_end = false;  // timestamps mark the end of the period
  double utc_offset_h = 0;    // timestamps are written in UTC + this many hours
};

// Rows listed in the error message before the count of the rest.
inline constexpr int kMaxListedRowProblems = 10;

struct RecordsFile {
  std::string file;
  std::vector<LoggedRow> rows;  // in file order
  int64_t missing_values = 0;   // rows with a missing speed, std or direction
  // The columns used ("" for the event column when there is none).
  std::string time_column, speed_column, std_column, direction_column, state_column,
      quality_column, event_column, channels_down_column;
};

RecordsFile ReadRecordsCsv(std::istream& in, const std::string& file_name,
                           const RecordsCsvOptions& options);
RecordsFile LoadRecordsCsv(const std::string& path, const RecordsCsvOptions& options);

}  // namespace planner

#endif  // PLANNER_IO_RECORDS_CSV_READER_H_
