#include "io/met_csv_reader.h"

#include <algorithm>
#include <cctype>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <functional>
#include <limits>
#include <map>

#include "io/csv_lines.h"
#include "io/input_file.h"
#include "planner/calendar.h"
#include "planner/error.h"

namespace planner {
namespace {

constexpr int kExamplesPerReason = 3;
constexpr std::size_t kMaxQuotedChars = 40;
constexpr std::size_t kMaxListedColumns = 20;
constexpr int64_t kSecondsPerDay = 86400;
// Rows of met data are short; a line longer than this is the wrong file (or a
// device such as /dev/zero, which has no line ends at all).
const char kTimestampFormats[] =
    "YYYY-MM-DD, YYYY-MM-DD HH:MM[:SS] or YYYY-MM-DDTHH:MM[:SS] (years 1900 to 2200)";
const double kNaN = std::numeric_limits<double>::quiet_NaN();

// Usual column names, compared without regard to case.
const std::vector<std::string> kTimeNames = {"timestamp", "time", "date", "datetime",
                                             "date_time"};
const std::vector<std::string> kSpeedNames = {
    "speed",      "speed_ms",      "speed_kn",      "speed_knots",
    "wind_speed", "wind_speed_ms", "wind_speed_kn", "wind_speed_knots"};
const std::vector<std::string> kStdNames = {
    "std",          "std_ms",          "std_kn", "speed_std", "speed_std_ms",
    "speed_std_kn", "speed_std_knots", "sigma",  "sigma_ms"};
const std::vector<std::string> kDirectionNames = {"direction", "direction_deg", "dir",
                                                  "wind_direction", "wind_direction_deg"};

// One column the reader looks for.
struct Role {
  const char* option;  // the CLI flag that names it, used as the field
  const char* what;    // "speed"
  const std::vector<std::string>* usual;
  bool required;
};
const Role kTimeRole{"--time", "time", &kTimeNames, true};
const Role kSpeedRole{"--speed", "speed", &kSpeedNames, true};
const Role kStdRole{"--std", "standard deviation", &kStdNames, false};
const Role kDirectionRole{"--direction", "direction", &kDirectionNames, false};

std::string Lower(std::string s) {
  for (char& c : s) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return s;
}

std::string Trim(const std::string& s) {
  const std::size_t first = s.find_first_not_of(" \t\r");
  if (first == std::string::npos) return "";
  return s.substr(first, s.find_last_not_of(" \t\r") - first + 1);
}

std::string Join(const std::vector<std::string>& words) {
  std::string out;
  for (const std::string& w : words) out += (out.empty() ? "" : ", ") + w;
  return out;
}

// The header's columns for a message, shortened when there are many.
std::string ColumnList(const std::vector<std::string>& header) {
  if (header.size() <= kMaxListedColumns) return Join(header);
  const std::vector<std::string> head(header.begin(), header.begin() + kMaxListedColumns);
  return Join(head) + ", ... (" + std::to_string(header.size()) + " columns)";
}

std::string Quoted(const std::string& text) {
  if (text.size() <= kMaxQuotedChars) return "'" + text + "'";
  return "'" + text.substr(0, kMaxQuotedChars) + "...'";
}

std::string Fixed(double x, int decimals) {
  char buf[40];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, x);
  return buf;
}

// ---- cells ---------------------------------------------------------------

enum class CellKind { kNumber, kMissing, kNaN, kText };

CellKind ParseCell(const std::string& cell, double* x) {
  const std::string lower = Lower(cell);
  if (lower.empty() || lower == "na" || lower == "n/a" || lower == "null" ||
      lower == "none" || lower == "-") {
    return CellKind::kMissing;
  }
  if (lower == "nan" || lower == "-nan" || lower == "+nan") return CellKind::kNaN;
  // Plain decimals only: no hex, no infinities, no units.
  if (cell.find_first_not_of("0123456789+-.eE") != std::string::npos) {
    return CellKind::kText;
  }
  const char* first = cell.data();
  if (*first == '+') ++first;
  const char* last = cell.data() + cell.size();
  const auto result = std::from_chars(first, last, *x);
  if (result.ec != std::errc() || result.ptr != last || !std::isfinite(*x)) {
    return CellKind::kText;
  }
  return CellKind::kNumber;
}

// ---- units ---------------------------------------------------------------

struct UnitHint {
  bool ms = false;
  bool knots = false;
};

// What a column or file name says about its unit: "speed_ms", "m/s", "mps"
// mean m/s; "kn", "kt", "kts", "knot", "knots" as a word mean knots.
UnitHint HintOf(const std::string& name) {
  const std::string lower = Lower(name);
  UnitHint hint;
  hint.ms = lower.find("m/s") != std::string::npos;
  std::string word;
  for (std::size_t i = 0; i <= lower.size(); ++i) {
    const bool alnum =
        i < lower.size() && std::isalnum(static_cast<unsigned char>(lower[i]));
    if (alnum) {
      word += lower[i];
      continue;
    }
    if (word == "ms" || word == "mps") hint.ms = true;
    if (word == "kn" || word == "kt" || word == "kts" || word == "knot" ||
        word == "knots") {
      hint.knots = true;
    }
    word.clear();
  }
  return hint;
}

bool Decided(const UnitHint& h) { return h.ms != h.knots; }
SpeedUnit UnitOf(const UnitHint& h) {
  return h.knots ? SpeedUnit::kKnots : SpeedUnit::kMetresPerSecond;
}

// ---- the parser ----------------------------------------------------------

class Parser {
 public:
  Parser(const std::string& file, const MetCsvOptions& options)
      : file_(file), options_(options) {}

  // How messages name a setting: the fit-site flag ("--speed"), or under a
  // plan's field prefix the plan field ("weather.columns.speed").
  std::string Name(const std::string& option) const {
    if (options_.field_prefix.empty() || option.empty()) return option;
    if (option == "--units") return options_.field_prefix + ".units";
    return options_.field_prefix + ".columns." + option.substr(2);
  }

  void ReadHeader(const std::string& line, int64_t line_no);
  void ReadRow(const std::string& line, int64_t line_no);
  MetSeries Finish();

 private:
  int FindColumn(const std::string& requested, const Role& role) const;
  void ResolveUnits();
  [[noreturn]] void FailHeader(const std::string& field,
                               const std::string& message) const {
    ThrowAt(SourceLocation{file_, header_line_, 0}, field, message);
  }
  void Drop(DropReason reason, int64_t line_no, const std::string& detail);
  bool AcceptTime(const std::vector<std::string>& cells, int64_t time_s, int64_t line_no);
  bool ReadSpeed(const std::string& cell, int64_t line_no, double* speed_ms);
  bool ReadDirection(const std::string& cell, int64_t line_no, double* direction_deg);
  std::string CellsKey(const std::vector<std::string>& cells) const;
  std::string Column(int index) const { return "column '" + header_[index] + "'"; }
  void ComputeGrid();

  std::string file_;
  MetCsvOptions options_;
  std::vector<std::string> header_;
  int header_line_ = 1;
  int time_col_ = -1, speed_col_ = -1, std_col_ = -1, dir_col_ = -1;
  double to_ms_ = 1.0;
  // Every timestamp accepted so far, strictly increasing, with a digest of the
  // row's mapped cells (to tell identical from conflicting duplicates).
  struct Seen {
    int64_t time_s;
    std::size_t cells_hash;
    int64_t line_no;
  };
  std::vector<Seen> seen_;
  std::array<int, kDropReasonCount> examples_{};
  MetSeries series_;
};

int Parser::FindColumn(const std::string& requested, const Role& role) const {
  std::vector<int> hits;
  for (std::size_t i = 0; i < header_.size(); ++i) {
    const std::string name = Lower(header_[i]);
    const bool hit = requested.empty() ? std::find(role.usual->begin(), role.usual->end(),
                                                   name) != role.usual->end()
                                       : header_[i] == requested;
    if (hit) hits.push_back(static_cast<int>(i));
  }
  if (hits.size() > 1) {
    if (!requested.empty()) {
      FailHeader(Name(role.option), Quoted(requested) + " names columns " +
                                        std::to_string(hits[0] + 1) + " and " +
                                        std::to_string(hits[1] + 1) +
                                        " of the header; column names must be unique");
    }
    FailHeader(Name(role.option), "not given, and columns '" + header_[hits[0]] +
                                      "' and '" + header_[hits[1]] +
                                      "' both have usual " + role.what +
                                      " names; choose one with " + Name(role.option));
  }
  if (hits.empty() && !requested.empty()) {
    FailHeader(Name(role.option),
               Quoted(requested) +
                   " is not a column of the header; columns: " + ColumnList(header_));
  }
  if (hits.empty() && role.required) {
    FailHeader(Name(role.option),
               std::string("not given, and no column has a usual ") + role.what +
                   " name (" + Join(*role.usual) + "); columns: " + ColumnList(header_) +
                   "; name the " + role.what + " column with " + Name(role.option));
  }
  return hits.empty() ? -1 : hits[0];
}

void Parser::ReadHeader(const std::string& line, int64_t line_no) {
  header_line_ = static_cast<int>(line_no);
  header_ = SplitCsvLine(line, SourceLocation{file_, static_cast<int>(line_no), 0});
  if (header_.size() == 1 && line.find_first_of(";\t") != std::string::npos) {
    FailHeader("", "header " + Quoted(Trim(line)) +
                       " has one column; columns must be separated by commas");
  }
  time_col_ = FindColumn(options_.time_column, kTimeRole);
  speed_col_ = FindColumn(options_.speed_column, kSpeedRole);
  std_col_ = FindColumn(options_.std_column, kStdRole);
  dir_col_ = FindColumn(options_.direction_column, kDirectionRole);
  const std::vector<std::pair<int, const Role*>> used = {{time_col_, &kTimeRole},
                                                         {speed_col_, &kSpeedRole},
                                                         {std_col_, &kStdRole},
                                                         {dir_col_, &kDirectionRole}};
  for (std::size_t i = 0; i < used.size(); ++i) {
    for (std::size_t j = 0; j < i; ++j) {
      if (used[i].first >= 0 && used[i].first == used[j].first) {
        FailHeader(Name(used[i].second->option),
                   Quoted(header_[used[i].first]) + " is already the " +
                       used[j].second->what + " column; choose another column");
      }
    }
  }
  MetReadReport& r = series_.read;
  r.file = file_;
  r.time_column = header_[time_col_];
  r.speed_column = header_[speed_col_];
  r.std_column = std_col_ >= 0 ? header_[std_col_] : "";
  r.direction_column = dir_col_ >= 0 ? header_[dir_col_] : "";
  ResolveUnits();
}

void Parser::ResolveUnits() {
  MetReadReport& r = series_.read;
  const std::string speed_name = header_[speed_col_];
  if (options_.units != SpeedUnit::kAuto) {
    r.units = options_.units;
    r.units_source = "declared with --units";
  } else {
    const UnitHint column = HintOf(speed_name);
    const std::string base = std::filesystem::path(file_).filename().string();
    const UnitHint file = HintOf(base);
    if (Decided(column)) {
      r.units = UnitOf(column);
      r.units_source = "from the column name '" + speed_name + "'";
    } else if (!column.ms && !column.knots && Decided(file)) {
      r.units = UnitOf(file);
      r.units_source = "from the file name '" + base + "'";
    } else {
      FailHeader(Name("--units"),
                 "cannot tell the unit of speed column " + Quoted(speed_name) +
                     " from its name or the file name; " +
                     (options_.field_prefix.empty()
                          ? std::string("pass --units ms or --units knots")
                          : "set " + Name("--units") + " to ms or knots"));
    }
  }
  if (std_col_ >= 0) {
    const UnitHint std_hint = HintOf(header_[std_col_]);
    if (Decided(std_hint) && UnitOf(std_hint) != r.units) {
      FailHeader(Name("--std"), "column " + Quoted(header_[std_col_]) + " is in " +
                                    SpeedUnitName(UnitOf(std_hint)) +
                                    " but the speed is in " + SpeedUnitName(r.units) +
                                    "; both must be in one unit (set it with " +
                                    Name("--units") + ")");
    }
  }
  to_ms_ = r.units == SpeedUnit::kKnots ? kMetresPerSecondPerKnot : 1.0;
}

void Parser::Drop(DropReason reason, int64_t line_no, const std::string& detail) {
  const int i = static_cast<int>(reason);
  ++series_.read.dropped[i];
  if (examples_[i]++ < kExamplesPerReason) {
    series_.read.examples.push_back(
        FormatLocated(SourceLocation{file_, static_cast<int>(line_no), 0}, "", detail));
  }
}

std::string Parser::CellsKey(const std::vector<std::string>& cells) const {
  std::string key;
  for (int col : {speed_col_, std_col_, dir_col_}) {
    if (col < 0) continue;
    double x = 0.0;
    if (ParseCell(cells[col], &x) == CellKind::kNumber) {
      char buf[32];
      std::snprintf(buf, sizeof buf, "%.17g", x);
      key += buf;
    } else {
      key += cells[col];
    }
    key += '\x1f';
  }
  return key;
}

bool Parser::AcceptTime(const std::vector<std::string>& cells, int64_t time_s,
                        int64_t line_no) {
  const std::size_t hash = std::hash<std::string>()(CellsKey(cells));
  const auto at = std::lower_bound(seen_.begin(), seen_.end(), time_s,
                                   [](const Seen& s, int64_t t) { return s.time_s < t; });
  const std::string where = Column(time_col_) + ": " + Quoted(cells[time_col_]);
  if (at != seen_.end() && at->time_s == time_s) {
    const bool same = at->cells_hash == hash;
    Drop(same ? DropReason::kDuplicateIdentical : DropReason::kDuplicateConflicting,
         line_no,
         where + " repeats the timestamp of line " + std::to_string(at->line_no) +
             (same ? " with the same values" : " with other values") +
             "; the first row is kept");
    return false;
  }
  if (at != seen_.end()) {
    const int64_t last_s = seen_.back().time_s;
    Drop(DropReason::kOutOfOrder, line_no,
         where + " is earlier than " +
             FormatTimestamp(last_s, last_s % kSecondsPerDay != 0) + " (line " +
             std::to_string(seen_.back().line_no) + "); rows must be in time order");
    return false;
  }
  seen_.push_back(Seen{time_s, hash, line_no});
  return true;
}

bool Parser::ReadSpeed(const std::string& cell, int64_t line_no, double* speed_ms) {
  const std::string where = Column(speed_col_) + ": ";
  double x = 0.0;
  switch (ParseCell(cell, &x)) {
    case CellKind::kMissing:
      Drop(DropReason::kSpeedMissing, line_no,
           where + (cell.empty() ? std::string("empty cell") : Quoted(cell)) +
               " is a missing value");
      return false;
    case CellKind::kNaN:
      Drop(DropReason::kSpeedNaN, line_no, where + Quoted(cell) + " is not a number");
      return false;
    case CellKind::kText:
      Drop(DropReason::kSpeedNonNumeric, line_no,
           where + Quoted(cell) + " is not a number; expected a speed in " +
               SpeedUnitName(series_.read.units));
      return false;
    case CellKind::kNumber:
      break;
  }
  if (x < 0.0) {
    Drop(DropReason::kSpeedNegative, line_no,
         where + Quoted(cell) + " is negative; a speed is at least 0");
    return false;
  }
  *speed_ms = x * to_ms_;
  if (*speed_ms > kMaxSpeedMs) {
    const std::string as_ms = to_ms_ == 1.0 ? "" : " (" + Fixed(*speed_ms, 1) + " m/s)";
    Drop(DropReason::kSpeedTooHigh, line_no,
         where + Quoted(cell) + as_ms + " is above the limit of 75 m/s");
    return false;
  }
  return true;
}

bool Parser::ReadDirection(const std::string& cell, int64_t line_no,
                           double* direction_deg) {
  double x = 0.0;
  const CellKind kind = ParseCell(cell, &x);
  if (kind == CellKind::kNumber && x >= 0.0 && x <= 360.0) {
    *direction_deg = x == 360.0 ? 0.0 : x;
    return true;
  }
  const std::string value = cell.empty() ? std::string("empty cell") : Quoted(cell);
  Drop(
      DropReason::kDirectionInvalid, line_no,
      Column(dir_col_) + ": " + value +
          (kind == CellKind::kNumber ? " is outside 0 to 360 degrees"
                                     : " is not a direction; expected 0 to 360 degrees"));
  return false;
}

void Parser::ReadRow(const std::string& line, int64_t line_no) {
  ++series_.read.rows_read;
  const std::vector<std::string> cells =
      SplitCsvLine(line, SourceLocation{file_, static_cast<int>(line_no), 0});
  if (cells.size() != header_.size()) {
    Drop(DropReason::kCellCount, line_no,
         std::to_string(cells.size()) + " cells; the header has " +
             std::to_string(header_.size()));
    return;
  }
  const std::optional<int64_t> time_s = ParseTimestamp(cells[time_col_]);
  if (!time_s) {
    Drop(DropReason::kBadTimestamp, line_no,
         Column(time_col_) + ": " + Quoted(cells[time_col_]) +
             " is not a timestamp; valid: " + kTimestampFormats);
    return;
  }
  if (!AcceptTime(cells, *time_s, line_no)) return;
  MetRecord record;
  record.time_s = *time_s;
  if (!ReadSpeed(cells[speed_col_], line_no, &record.speed_ms)) return;
  record.direction_deg = kNaN;
  if (dir_col_ >= 0 && !ReadDirection(cells[dir_col_], line_no, &record.direction_deg)) {
    return;
  }
  record.speed_std_ms = kNaN;
  if (std_col_ >= 0) {
    double x = 0.0;
    if (ParseCell(cells[std_col_], &x) == CellKind::kNumber && x >= 0.0 &&
        x * to_ms_ <= kMaxSpeedMs) {
      record.speed_std_ms = x * to_ms_;
    } else {
      ++series_.read.std_unusable;
    }
  }
  series_.records.push_back(record);
}

// Step, gaps and off-grid records, from the accepted timestamps.
void Parser::ComputeGrid() {
  MetReadReport& r = series_.read;
  std::map<int64_t, int64_t> spacing;
  for (std::size_t i = 1; i < seen_.size(); ++i) {
    ++spacing[seen_[i].time_s - seen_[i - 1].time_s];
  }
  int64_t best = 0;
  for (const auto& [step, count] : spacing) {
    if (count > best) {
      best = count;
      r.step_s = step;
    }
  }
  for (std::size_t i = 1; i < seen_.size(); ++i) {
    const int64_t diff = seen_[i].time_s - seen_[i - 1].time_s;
    if (diff > r.step_s) {
      ++r.gaps;
      r.missing_steps += diff / r.step_s - (diff % r.step_s == 0 ? 1 : 0);
    }
  }
  r.first_time_s = series_.records.front().time_s;
  r.last_time_s = series_.records.back().time_s;
  for (const MetRecord& rec : series_.records) {
    if ((rec.time_s - r.first_time_s) % r.step_s != 0) ++r.off_grid;
  }
}

MetSeries Parser::Finish() {
  MetReadReport& r = series_.read;
  r.rows_kept = static_cast<int64_t>(series_.records.size());
  const SourceLocation where{file_, 0, 0};
  std::string reasons;
  for (int i = 0; i < kDropReasonCount; ++i) {
    if (r.dropped[i] == 0) continue;
    reasons += (reasons.empty() ? "" : ", ") +
               std::string(DropReasonText(static_cast<DropReason>(i))) + ": " +
               std::to_string(r.dropped[i]);
  }
  const std::string first = r.examples.empty() ? "" : "; first: " + r.examples.front();
  const std::string sort_hint = r.dropped[static_cast<int>(DropReason::kOutOfOrder)] > 0
                                    ? "; sort the file by its timestamps, oldest first"
                                    : "";
  if (r.rows_kept == 0) {
    ThrowAt(where, "",
            "no usable rows: " + std::to_string(r.rows_read) + " read" +
                (reasons.empty() ? "" : ", all dropped (" + reasons + ")") + first +
                sort_hint);
  }
  if (r.rows_kept < 2) {
    ThrowAt(where, "",
            "only " + std::to_string(r.rows_kept) + " usable row of " +
                std::to_string(r.rows_read) +
                " read; at least 2 are needed to find the " + "time step" +
                (reasons.empty() ? "" : "; dropped: " + reasons) + first + sort_hint);
  }
  ComputeGrid();
  return std::move(series_);
}

}  // namespace

const char* SpeedUnitName(SpeedUnit unit) {
  switch (unit) {
    case SpeedUnit::kAuto:
      return "auto";
    case SpeedUnit::kMetresPerSecond:
      return "m/s";
    case SpeedUnit::kKnots:
      return "knots";
  }
  return "?";
}

const char* DropReasonText(DropReason reason) {
  switch (reason) {
    case DropReason::kBadTimestamp:
      return "timestamp not valid";
    case DropReason::kCellCount:
      return "wrong number of cells";
    case DropReason::kDuplicateIdentical:
      return "duplicate timestamp, same values";
    case DropReason::kDuplicateConflicting:
      return "duplicate timestamp, other values";
    case DropReason::kOutOfOrder:
      return "timestamp out of order";
    case DropReason::kSpeedMissing:
      return "speed missing";
    case DropReason::kSpeedNaN:
      return "speed NaN";
    case DropReason::kSpeedNonNumeric:
      return "speed not a number";
    case DropReason::kSpeedNegative:
      return "speed negative";
    case DropReason::kSpeedTooHigh:
      return "speed above 75 m/s";
    case DropReason::kDirectionInvalid:
      return "direction missing or invalid";
  }
  return "?";
}

int64_t MetReadReport::DroppedTotal() const {
  int64_t total = 0;
  for (int64_t n : dropped) total += n;
  return total;
}

std::vector<std::string> SplitCsvLine(const std::string& line,
                                      const SourceLocation& where) {
  std::vector<std::string> cells;
  std::string cell;
  bool quoted = false, was_quoted = false;
  std::size_t open = 0;  // where the quoted cell opened
  auto fail = [&](std::size_t column, const std::string& message) {
    ThrowAt(SourceLocation{where.file, where.line, static_cast<int>(column) + 1}, "",
            message);
  };
  for (std::size_t i = 0; i <= line.size(); ++i) {
    const char c = i < line.size() ? line[i] : ',';
    if (quoted) {
      if (i == line.size()) {
        fail(open,
             "unterminated quote: the \" that opens this cell is not closed on this "
             "line; close it with \" (a quote inside a cell is written \"\"; cells "
             "holding line breaks are not read)");
      }
      if (c == '"' && i + 1 < line.size() && line[i + 1] == '"') {
        cell += '"';
        ++i;
      } else if (c == '"') {
        quoted = false;
      } else {
        cell += c;
      }
    } else if (c == ',') {
      cells.push_back(Trim(cell));
      cell.clear();
      was_quoted = false;
    } else if (c == '"' && Trim(cell).empty() && !was_quoted) {
      cell.clear();
      quoted = was_quoted = true;
      open = i;
    } else if (was_quoted && c != ' ' && c != '\t' && c != '\r') {
      fail(i,
           "text after the closing quote of a cell; a quoted cell ends at its closing "
           "\" (write a quote inside it as \"\")");
    } else if (!was_quoted) {
      cell += c;
    }
  }
  return cells;
}

std::optional<int64_t> ParseTimestamp(const std::string& text) {
  const std::size_t n = text.size();
  if (n != 10 && n != 16 && n != 19) return std::nullopt;
  const std::optional<Date> date = ParseDate(text.substr(0, 10));
  if (!date) return std::nullopt;
  int64_t seconds = 0;
  if (n > 10) {
    if (text[10] != ' ' && text[10] != 'T') return std::nullopt;
    if (text[13] != ':' || (n == 19 && text[16] != ':')) return std::nullopt;
    auto two = [&](std::size_t at, int limit, int* out) {
      if (!std::isdigit(static_cast<unsigned char>(text[at])) ||
          !std::isdigit(static_cast<unsigned char>(text[at + 1]))) {
        return false;
      }
      *out = (text[at] - '0') * 10 + (text[at + 1] - '0');
      return *out < limit;
    };
    int hh = 0, mm = 0, ss = 0;
    if (!two(11, 24, &hh) || !two(14, 60, &mm)) return std::nullopt;
    if (n == 19 && !two(17, 60, &ss)) return std::nullopt;
    seconds = hh * 3600 + mm * 60 + ss;
  }
  return DaysFromCivil(*date) * kSecondsPerDay + seconds;
}

std::string FormatTimestamp(int64_t time_s, bool with_time) {
  int64_t days = time_s / kSecondsPerDay;
  int64_t rest = time_s % kSecondsPerDay;
  if (rest < 0) {
    rest += kSecondsPerDay;
    --days;
  }
  std::string out = FormatDate(CivilFromDays(days));
  if (!with_time) return out;
  char buf[16];
  std::snprintf(buf, sizeof buf, " %02d:%02d", static_cast<int>(rest / 3600),
                static_cast<int>(rest / 60 % 60));
  out += buf;
  if (rest % 60 != 0) {
    std::snprintf(buf, sizeof buf, ":%02d", static_cast<int>(rest % 60));
    out += buf;
  }
  return out;
}

std::string FormatStep(int64_t step_s) {
  if (step_s % kSecondsPerDay == 0) {
    const int64_t d = step_s / kSecondsPerDay;
    return std::to_string(d) + (d == 1 ? " day" : " days");
  }
  if (step_s % 3600 == 0) return std::to_string(step_s / 3600) + " h";
  if (step_s % 60 == 0) return std::to_string(step_s / 60) + " min";
  return std::to_string(step_s) + " s";
}

MetSeries ReadMetCsv(std::istream& in, const std::string& file_name,
                     const MetCsvOptions& options) {
  Parser parser(file_name, options);
  io::FeedCsvLines(in, file_name, false, "a CSV file of met data", "record", parser);
  return parser.Finish();
}

MetSeries LoadMetCsv(const std::string& path, const MetCsvOptions& options) {
  const SourceLocation where{path, 0, 0};
  io::CheckInputFile(path, "met data");
  std::ifstream in(path, std::ios::binary);
  if (!in) ThrowAt(where, "", "cannot open met data file: not readable");
  return ReadMetCsv(in, path, options);
}

}  // namespace planner
