#include "io/records_csv_reader.h"

#include <algorithm>
#include <cctype>
#include <charconv>
#include <cmath>
#include <filesystem>
#include <fstream>
#include <limits>

#include "io/csv_lines.h"
#include "io/input_file.h"
#include "io/met_csv_reader.h"
#include "planner/error.h"
#include "planner/site_fit.h"

namespace planner {
namespace {

constexpr std::size_t kMaxQuotedChars = 40;
const double kNaN = std::numeric_limits<double>::quiet_NaN();
const char kTimestampFormats[] =
    "YYYY-MM-DD HH:MM[:SS] or YYYY-MM-DDTHH:MM[:SS] (years 1900 to 2200) on the "
    "10-minute grid";
const char kStateWords[] = "production, parked, reduced, outage";
const char kQualityWords[] = "ok, 1, true (passed) or rejected, 0, false (failed)";

struct Role {
  const char* option;  // the flag that names the column
  const char* what;
  std::vector<std::string> usual;
  bool required;
};
const Role kTime{"--time", "time", {"timestamp", "time", "datetime", "date_time"}, true};
const Role kSpeed{"--speed",
                  "speed",
                  {"speed_ms", "speed", "wind_speed", "wind_speed_ms", "mean_speed_ms"},
                  true};
const Role kStd{"--std",
                "standard deviation",
                {"speed_std_ms", "std_ms", "std", "speed_std", "sigma_ms"},
                true};
const Role kDirection{"--direction",
                      "direction",
                      {"direction_deg", "direction", "dir", "wind_direction"},
                      true};
const Role kState{"--state", "state", {"state", "operating_state"}, true};
const Role kQuality{"--quality", "quality", {"quality", "quality_flag", "flag"}, true};
const Role kEvent{"--event", "event", {"event"}, false};
const Role kChannelsDown{"--channels-down", "channels-down", {"channels_down"}, false};

std::string Lower(std::string s) {
  for (char& c : s) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return s;
}

std::string Join(const std::vector<std::string>& words) {
  std::string out;
  for (const std::string& w : words) out += (out.empty() ? "" : ", ") + w;
  return out;
}

std::string Quoted(const std::string& text) {
  if (text.empty()) return "empty cell";
  if (text.size() <= kMaxQuotedChars) return "'" + text + "'";
  return "'" + text.substr(0, kMaxQuotedChars) + "...'";
}

bool IsMissing(const std::string& cell) {
  const std::string lower = Lower(cell);
  return lower.empty() || lower == "na" || lower == "n/a" || lower == "null" ||
         lower == "-" || lower == "nan";
}

// Plain decimals only (no hex, infinities or units).
bool ParseNumber(const std::string& cell, double* x) {
  if (cell.empty() || cell.find_first_not_of("0123456789+-.eE") != std::string::npos)
    return false;
  const char* first = cell.data() + (cell[0] == '+' ? 1 : 0);
  const char* last = cell.data() + cell.size();
  const auto result = std::from_chars(first, last, *x);
  return result.ec == std::errc() && result.ptr == last && std::isfinite(*x);
}

bool IsEventName(const std::string& s) {
  if (s.empty() || s.size() > 64) return false;
  return std::all_of(s.begin(), s.end(), [](char c) {
    return std::isalnum(static_cast<unsigned char>(c)) || c == '_' || c == '-';
  });
}

class Parser {
 public:
  Parser(const std::string& file, const RecordsCsvOptions& options) : options_(options) {
    out_.file = file;
  }
  void ReadHeader(const std::string& line, int64_t line_no);
  void ReadRow(const std::string& line, int64_t line_no);
  RecordsFile Finish();

 private:
  int Find(const std::string& requested, const Role& role) const;
  // Records a problem with cell `col` of line `line_no`.
  void Problem(int64_t line_no, int col, const std::string& value,
               const std::string& message);
  bool Number(const std::vector<std::string>& cells, int col, int64_t line_no, double lo,
              double hi, const char* valid, double* x, bool* missing);
  bool Timestamp(const std::string& cell, int col, int64_t line_no, int64_t* time_s);
  bool ChannelsDown(const std::string& cell, int64_t line_no, std::string* names);

  RecordsCsvOptions options_;
  RecordsFile out_;
  std::vector<std::string> header_;
  int header_line_ = 1;
  int time_ = -1, speed_ = -1, std_ = -1, dir_ = -1, state_ = -1, quality_ = -1,
      event_ = -1, channels_ = -1;
  std::vector<std::string> problems_;
  int64_t problem_rows_ = 0;
  int64_t last_problem_line_ = 0;
};

int Parser::Find(const std::string& requested, const Role& role) const {
  std::vector<int> hits;
  for (std::size_t i = 0; i < header_.size(); ++i) {
    const bool hit = requested.empty() ? std::find(role.usual.begin(), role.usual.end(),
                                                   Lower(header_[i])) != role.usual.end()
                                       : header_[i] == requested;
    if (hit) hits.push_back(static_cast<int>(i));
  }
  const SourceLocation where{out_.file, header_line_, 0};
  if (hits.size() > 1) {
    ThrowAt(where, role.option,
            "columns '" + header_[hits[0]] + "' and '" + header_[hits[1]] +
                "' both match; name the " + role.what + " column with " + role.option);
  }
  if (hits.empty() && !requested.empty()) {
    ThrowAt(
        where, role.option,
        "'" + requested + "' is not a column of the header; columns: " + Join(header_));
  }
  if (hits.empty() && role.required) {
    ThrowAt(where, role.option,
            std::string("not given, and no column has a usual ") + role.what + " name (" +
                Join(role.usual) + "); columns: " + Join(header_) + "; name the " +
                role.what + " column with " + role.option);
  }
  return hits.empty() ? -1 : hits[0];
}

void Parser::ReadHeader(const std::string& line, int64_t line_no) {
  header_line_ = static_cast<int>(line_no);
  header_ = SplitCsvLine(line, SourceLocation{out_.file, static_cast<int>(line_no), 0});
  time_ = Find(options_.time_column, kTime);
  speed_ = Find(options_.speed_column, kSpeed);
  std_ = Find(options_.std_column, kStd);
  dir_ = Find(options_.direction_column, kDirection);
  state_ = Find(options_.state_column, kState);
  quality_ = Find(options_.quality_column, kQuality);
  event_ = Find(options_.event_column, kEvent);
  channels_ = Find(options_.channels_down_column, kChannelsDown);
  const std::pair<int, const Role*> used[] = {
      {time_, &kTime},   {speed_, &kSpeed},     {std_, &kStd},
      {dir_, &kDirection}, {state_, &kState}, {quality_, &kQuality},
      {event_, &kEvent}, {channels_, &kChannelsDown}};
  for (std::size_t i = 0; i < std::size(used); ++i) {
    for (std::size_t j = 0; j < i; ++j) {
      if (used[i].first >= 0 && used[i].first == used[j].first) {
        ThrowAt(SourceLocation{out_.file, header_line_, 0}, used[i].second->option,
                "'" + header_[used[i].first] + "' is already the " +
                    used[j].second->what + " column; choose another column");
      }
    }
  }
  out_.time_column = header_[time_];
  out_.speed_column = header_[speed_];
  out_.std_column = header_[std_];
  out_.direction_column = header_[dir_];
  out_.state_column = header_[state_];
  out_.quality_column = header_[quality_];
  out_.event_column = event_ >= 0 ? header_[event_] : "";
  out_.channels_down_column = channels_ >= 0 ? header_[channels_] : "";
}

void Parser::Problem(int64_t line_no, int col, const std::string& value,
                     const std::string& message) {
  if (line_no != last_problem_line_) ++problem_rows_;
  last_problem_line_ = line_no;
  if (static_cast<int>(problems_.size()) >= kMaxListedRowProblems) return;
  const SourceLocation where{out_.file, static_cast<int>(line_no), col + 1};
  problems_.push_back(FormatLocated(where, "column '" + header_[col] + "'",
                                    Quoted(value) + " " + message));
}

bool Parser::Number(const std::vector<std::string>& cells, int col, int64_t line_no,
                    double lo, double hi, const char* valid, double* x, bool* missing) {
  const std::string& cell = cells[col];
  if (IsMissing(cell)) {
    *x = kNaN;
    *missing = true;
    return true;
  }
  if (!ParseNumber(cell, x)) {
    Problem(line_no, col, cell, std::string("is not a number; valid: ") + valid);
  } else if (*x < lo || *x > hi) {
    Problem(line_no, col, cell, std::string("is out of range; valid: ") + valid);
  } else {
    return true;
  }
  return false;
}

bool Parser::Timestamp(const std::string& cell, int col, int64_t line_no,
                       int64_t* time_s) {
  const std::optional<int64_t> t = ParseTimestamp(cell);
  if (!t || cell.size() == 10) {
    Problem(line_no, col, cell,
            std::string("is not a timestamp; valid: ") + kTimestampFormats);
    return false;
  }
  const int64_t offset_s = std::llround(options_.utc_offset_h * 3600.0);
  *time_s = *t - offset_s - (options_.stamp_at_end ? kRecordSeconds : 0);
  if (*t % kRecordSeconds != 0) {
    Problem(line_no, col, cell,
            std::string("is not on the 10-minute grid; valid: ") + kTimestampFormats +
                " (minutes 00, 10, ..., 50 and seconds 00)");
    return false;
  }
  return true;
}

void Parser::ReadRow(const std::string& line, int64_t line_no) {
  const std::vector<std::string> cells =
      SplitCsvLine(line, SourceLocation{out_.file, static_cast<int>(line_no), 0});
  if (cells.size() != header_.size()) {
    if (line_no != last_problem_line_) ++problem_rows_;
    last_problem_line_ = line_no;
    if (static_cast<int>(problems_.size()) < kMaxListedRowProblems) {
      problems_.push_back(
          FormatLocated(SourceLocation{out_.file, static_cast<int>(line_no), 0}, "",
                        std::to_string(cells.size()) + " cells; the header has " +
                            std::to_string(header_.size())));
    }
    return;
  }
  LoggedRow row;
  row.line = line_no;
  LoggedRecord& r = row.record;
  bool ok = Timestamp(cells[time_], time_, line_no, &r.time_s);
  bool missing = false;
  ok &= Number(cells, speed_, line_no, 0.0, kMaxSpeedMs, "a mean speed from 0 to 75 m/s",
               &r.speed_ms, &missing);
  ok &= Number(cells, std_, line_no, 0.0, kMaxSpeedMs,
               "a standard deviation from 0 to 75 m/s", &r.speed_std_ms, &missing);
  ok &= Number(cells, dir_, line_no, 0.0, 360.0, "a direction from 0 to 360 degrees",
               &r.direction_deg, &missing);
  if (r.direction_deg == 360.0) r.direction_deg = 0.0;
  const std::optional<LoggedState> state = ParseLoggedState(Lower(cells[state_]));
  if (state) {
    r.state = *state;
  } else {
    Problem(line_no, state_, cells[state_],
            std::string("is not an operating state; valid: ") + kStateWords);
    ok = false;
  }
  const std::string flag = Lower(cells[quality_]);
  if (flag == "ok" || flag == "1" || flag == "true") {
    r.quality_ok = true;
  } else if (flag == "rejected" || flag == "0" || flag == "false") {
    r.quality_ok = false;
  } else {
    Problem(line_no, quality_, cells[quality_],
            std::string("is not a quality flag; valid: ") + kQualityWords);
    ok = false;
  }
  if (event_ >= 0) {
    const std::string& e = cells[event_];
    if (e.empty() || e == "-" || Lower(e) == "none") {
      r.event.clear();
    } else if (IsEventName(e)) {
      r.event = e;
    } else {
      Problem(line_no, event_, e,
              "is not an event name; valid: empty or none, or a name of letters, "
              "digits, '_' and '-' (start_up, normal_stop or a manual test of the "
              "plan)");
      ok = false;
    }
  }
  if (channels_ >= 0) ok &= ChannelsDown(cells[channels_], line_no, &r.channels_down);
  if (!ok) return;
  out_.missing_values += missing ? 1 : 0;
  out_.rows.push_back(std::move(row));
}

// Group names separated by ';' or spaces; empty, "-" or "none" for none.
// Stored joined by ";".
bool Parser::ChannelsDown(const std::string& cell, int64_t line_no, std::string* names) {
  names->clear();
  if (cell.empty() || cell == "-" || Lower(cell) == "none") return true;
  std::string word;
  auto flush = [&]() {
    if (word.empty()) return true;
    if (!IsEventName(word)) return false;
    *names += (names->empty() ? "" : ";") + word;
    word.clear();
    return true;
  };
  bool ok = true;
  for (const char c : cell) {
    if (c == ';' || c == ' ') {
      ok = ok && flush();
    } else {
      word += c;
    }
  }
  ok = ok && flush();
  if (!ok) {
    Problem(line_no, channels_, cell,
            "is not a list of load-channel groups; valid: empty or none, or names of "
            "letters, digits, '_' and '-' separated by ';' (groups of the plan's "
            "outages.channel_groups)");
  }
  return ok;
}

RecordsFile Parser::Finish() {
  if (problem_rows_ == 0) return std::move(out_);
  std::string message;
  for (const std::string& p : problems_) message += (message.empty() ? "" : "\n") + p;
  message += "\n" + out_.file + ": " + std::to_string(problem_rows_) +
             (problem_rows_ == 1 ? " row has" : " rows have") +
             " problems; nothing was added to the log";
  throw InputError(message);
}

}  // namespace

RecordsFile ReadRecordsCsv(std::istream& in, const std::string& file_name,
                           const RecordsCsvOptions& options) {
  Parser parser(file_name, options);
  io::FeedCsvLines(in, file_name, true, "a CSV file of campaign records",
                   "10-minute record", parser);
  return parser.Finish();
}

RecordsFile LoadRecordsCsv(const std::string& path, const RecordsCsvOptions& options) {
  const SourceLocation where{path, 0, 0};
  io::CheckInputFile(path, "records");
  std::ifstream in(path, std::ios::binary);
  if (!in) ThrowAt(where, "", "cannot open records file: not readable");
  return ReadRecordsCsv(in, path, options);
}

}  // namespace planner
