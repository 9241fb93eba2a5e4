#include "io/yaml_fields.h"

#include <yaml-cpp/eventhandler.h>

#include <algorithm>
#include <cctype>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <sstream>

#include "io/input_file.h"
#include "io/yaml_quotes.h"

namespace planner {
namespace io {
namespace {

namespace fs = std::filesystem;

// Inputs are a few kilobytes; anything this large is the wrong file.
constexpr std::uintmax_t kMaxInputBytes = 16u << 20;
constexpr std::size_t kMaxQuotedChars = 40;

// yaml-cpp marks are 0-based and -1 when unknown; ours are 1-based, 0 unknown.
SourceLocation LocationOf(const YAML::Mark& mark, const std::string& file) {
  SourceLocation where{file, 0, 0};
  if (mark.line >= 0) {
    where.line = mark.line + 1;
    where.column = mark.column + 1;
  }
  return where;
}

// Where a node was written; `fallback` for nothing (a null value's mark points
// past it, at the next token) and for nodes without a mark.
SourceLocation NodeLocation(const YAML::Node& node, const SourceLocation& fallback) {
  if (!node.IsDefined() || node.IsNull()) return fallback;
  SourceLocation where = LocationOf(node.Mark(), fallback.file);
  return where.line > 0 ? where : fallback;
}

std::size_t EditDistance(const std::string& a, const std::string& b) {
  std::vector<std::size_t> row(b.size() + 1);
  for (std::size_t j = 0; j <= b.size(); ++j) row[j] = j;
  for (std::size_t i = 1; i <= a.size(); ++i) {
    std::size_t diagonal = row[0];
    row[0] = i;
    for (std::size_t j = 1; j <= b.size(); ++j) {
      const std::size_t above = row[j];
      const std::size_t substitute = diagonal + (a[i - 1] == b[j - 1] ? 0 : 1);
      row[j] = std::min({above + 1, row[j - 1] + 1, substitute});
      diagonal = above;
    }
  }
  return row[b.size()];
}

// The allowed key a misspelt one most likely meant, or "" if none is close.
std::string Suggest(const std::string& key, const std::vector<std::string>& allowed) {
  std::string best;
  std::size_t best_distance = 4;  // suggest within 3 edits (e.g. a missing "_ms")
  for (const std::string& candidate : allowed) {
    // A key that is the start of a valid one ("quality_reject") counts as close.
    const bool prefix = key.size() >= 4 && candidate.compare(0, key.size(), key) == 0;
    const std::size_t d = prefix ? 1 : EditDistance(key, candidate);
    if (d < best_distance) {
      best = candidate;
      best_distance = d;
    }
  }
  return best;
}

std::string UnknownFieldMessage(const std::string& key,
                                const std::vector<std::string>& allowed,
                                const std::string& context) {
  std::string message = "unknown field";
  if (!context.empty()) message += " " + context;
  const std::string suggestion = Suggest(key, allowed);
  if (!suggestion.empty()) message += " (did you mean '" + suggestion + "'?)";
  return message + "; valid fields: " + JoinWords(allowed);
}

bool ParseDecimal(const std::string& text, double* x) {
  // Plain decimal notation only: no hex, no inf or nan spellings.
  if (text.empty() || text.find_first_not_of("0123456789+-.eE") != std::string::npos) {
    return false;
  }
  const char* first = text.data();
  if (*first == '+') ++first;  // from_chars rejects a leading '+'
  const char* last = text.data() + text.size();
  const auto result = std::from_chars(first, last, *x);
  return result.ec == std::errc() && result.ptr == last && std::isfinite(*x);
}

// What ParseDocument needs to know of each YAML document in a text: where it
// starts and where its first value is, if it has one (a document holding
// nothing, as after a trailing "---", has only a null).
class DocumentScan : public YAML::EventHandler {
 public:
  YAML::Mark start, value;
  bool has_value = false;

  void OnDocumentStart(const YAML::Mark& mark) override {
    start = value = mark;
    has_value = false;
  }
  void OnDocumentEnd() override {}
  void OnNull(const YAML::Mark&, YAML::anchor_t) override {}
  void OnAlias(const YAML::Mark& mark, YAML::anchor_t) override { Value(mark); }
  void OnScalar(const YAML::Mark& mark, const std::string&, YAML::anchor_t,
                const std::string&) override {
    Value(mark);
  }
  void OnSequenceStart(const YAML::Mark& mark, const std::string&, YAML::anchor_t,
                       YAML::EmitterStyle::value) override {
    Value(mark);
  }
  void OnSequenceEnd() override {}
  void OnMapStart(const YAML::Mark& mark, const std::string&, YAML::anchor_t,
                  YAML::EmitterStyle::value) override {
    Value(mark);
  }
  void OnMapEnd() override {}

 private:
  void Value(const YAML::Mark& mark) {
    if (!has_value) value = mark;
    has_value = true;
  }
};

// The character at a mark, for a message: "','" or "byte 0x1b".
std::string CharacterAt(const std::string& text, const YAML::Mark& mark) {
  if (mark.pos < 0 || static_cast<std::size_t>(mark.pos) >= text.size()) return "the end";
  const unsigned char c = static_cast<unsigned char>(text[mark.pos]);
  if (c >= 0x20 && c < 0x7f) return "'" + std::string(1, static_cast<char>(c)) + "'";
  char buffer[16];
  std::snprintf(buffer, sizeof buffer, "byte 0x%02x", c);
  return buffer;
}

// " (line N indents with a tab; YAML indents with spaces only)" for the first
// line whose indentation holds a tab, "" if none: a tab is the usual cause of
// the YAML library's less telling messages.
std::string TabHint(const std::string& text) {
  int line = 1;
  bool indent = true;
  for (const char c : text) {
    if (c == '\n') {
      ++line;
      indent = true;
    } else if (indent && c == '\t') {
      return " (line " + std::to_string(line) +
             " indents with a tab; YAML indents with spaces only)";
    } else if (c != ' ') {
      indent = false;
    }
  }
  return "";
}

// Checks that `text` holds at most one YAML document with a value. The
// YAML library's own loop over documents never ends on some invalid input
// (a stray ',' outside [ ] and { } yields empty documents without moving on),
// so the documents are walked here, and a document that starts where the
// one before started is reported as the syntax error it is.
void CheckSingleDocument(const std::string& text, const std::string& file_name) {
  std::istringstream in(text);
  YAML::Parser parser(in);
  DocumentScan scan;
  int documents = 0;
  int previous_start = -1;
  while (parser.HandleNextDocument(scan)) {
    if (!scan.has_value && scan.start.pos == previous_start) {
      ThrowAt(LocationOf(scan.start, file_name), "",
              "invalid YAML: unexpected " + CharacterAt(text, scan.start) +
                  "; a value cannot start here");
    }
    if (documents > 0 && scan.has_value) {
      ThrowAt(LocationOf(scan.value, file_name), "",
              "a second YAML document starts here; a file holds exactly one");
    }
    previous_start = scan.start.pos;
    ++documents;
  }
}

std::string NumberTypeError(const Field& f) {
  return "expected a number, got " + Describe(f.node);
}

}  // namespace

std::string ReadInputFile(const std::string& path, const std::string& what) {
  std::error_code ec;
  const SourceLocation where{path, 0, 0};
  CheckInputFile(path, what);
  const std::uintmax_t size = fs::file_size(path, ec);
  if (!ec && size > kMaxInputBytes) {
    ThrowAt(where, "",
            "is " + std::to_string(size) + " bytes; a " + what +
                " file is a small YAML text (at most 16 MiB)");
  }
  std::ifstream in(path, std::ios::binary);
  if (!in) ThrowAt(where, "", "cannot open " + what + " file: not readable");
  // Read at most one chunk past the limit: a device or pipe that never ends
  // (such as /dev/zero) has no size to check beforehand.
  std::string text;
  char chunk[1 << 16];
  while (text.size() <= kMaxInputBytes && in.read(chunk, sizeof chunk).gcount() > 0) {
    text.append(chunk, static_cast<std::size_t>(in.gcount()));
  }
  if (text.size() > kMaxInputBytes) {
    ThrowAt(
        where, "",
        "is more than 16 MiB; a " + what + " file is a small YAML text (at most 16 MiB)");
  }
  return text;
}

Field ParseDocument(const std::string& text, const std::string& file_name) {
  YAML::Node document;
  try {
    CheckQuotesClose(text, file_name);
    CheckSingleDocument(text, file_name);  // a trailing "---" is harmless
    document = YAML::Load(text);
  } catch (const YAML::Exception& e) {
    ThrowAt(LocationOf(e.mark, file_name), "", "invalid YAML: " + e.msg + TabHint(text));
  }
  const SourceLocation file_only{file_name, 0, 0};
  Field root{document, "", file_only};
  root.where = NodeLocation(root.node, file_only);
  return root;
}

bool HasField(const Field& f, const std::string& key) {
  if (!f.node.IsMap()) return false;
  for (auto it = f.node.begin(); it != f.node.end(); ++it) {
    if (it->first.IsScalar() && it->first.Scalar() == key) return true;
  }
  return false;
}

void Fail(const Field& f, const std::string& message) {
  ThrowAt(f.where, f.path, message);
}

std::string Describe(const YAML::Node& node) {
  if (!node.IsDefined() || node.IsNull()) return "nothing";
  if (node.IsSequence()) {
    return "a list of " + std::to_string(node.size()) +
           (node.size() == 1 ? " item" : " items");
  }
  if (node.IsMap()) return "a mapping";
  std::string text = node.Scalar();
  if (text.size() > kMaxQuotedChars) text = text.substr(0, kMaxQuotedChars) + "...";
  // Keep messages on one line and free of control characters.
  for (char& c : text) {
    if (static_cast<unsigned char>(c) < 0x20 || c == 0x7f) c = '?';
  }
  return "'" + text + "'";
}

std::string Text(const Field& f) {
  return f.node.IsScalar() ? f.node.Scalar() : Describe(f.node);
}

std::string FormatNumber(double x) {
  if (std::isfinite(x) && x == std::floor(x) && std::fabs(x) < 1e15) {
    return std::to_string(static_cast<long long>(x));
  }
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%.8g", x);
  return buffer;
}

std::string JoinWords(const std::vector<std::string>& words) {
  std::string out;
  for (const std::string& w : words) out += (out.empty() ? "" : ", ") + w;
  return out;
}

FieldMap::FieldMap(const Field& map, const std::vector<std::string>& allowed,
                   const std::string& context)
    : self_(map) {
  if (!map.node.IsMap()) {
    Fail(map, "expected a mapping, got " + Describe(map.node) +
                  "; valid fields: " + JoinWords(allowed));
  }
  std::vector<int> key_lines;
  for (auto it = map.node.begin(); it != map.node.end(); ++it) {
    const SourceLocation key_where = NodeLocation(it->first, map.where);
    if (!it->first.IsScalar()) {
      ThrowAt(key_where, map.path, "expected a field name, got " + Describe(it->first));
    }
    const std::string key = it->first.Scalar();
    const std::string path = PathOf(key);
    if (std::find(allowed.begin(), allowed.end(), key) == allowed.end()) {
      ThrowAt(key_where, path, UnknownFieldMessage(key, allowed, context));
    }
    for (std::size_t i = 0; i < entries_.size(); ++i) {
      if (entries_[i].first != key) continue;
      ThrowAt(key_where, path,
              "given twice (first at line " + std::to_string(key_lines[i]) +
                  "); give each field once");
    }
    entries_.emplace_back(key,
                          Field{it->second, path, NodeLocation(it->second, key_where)});
    key_lines.push_back(key_where.line);
  }
}

std::optional<Field> FieldMap::Find(const std::string& key) const {
  for (const auto& entry : entries_) {
    if (entry.first == key) return entry.second;
  }
  return std::nullopt;
}

Field FieldMap::Get(const std::string& key) const {
  std::optional<Field> f = Find(key);
  if (!f) ThrowAt(self_.where, PathOf(key), "required field is missing");
  return *f;
}

std::string FieldMap::PathOf(const std::string& key) const {
  return self_.path.empty() ? key : self_.path + "." + key;
}

Limits Interval(const char* bounds, double lo, double hi, const std::string& unit) {
  Limits limits;
  limits.lo = lo;
  limits.hi = hi;
  limits.lo_open = bounds[0] == '(';
  limits.hi_open = bounds[1] == ')';
  limits.unit = unit;
  return limits;
}

bool Within(const Limits& limits, double x) {
  const bool above_lo = limits.lo_open ? x > limits.lo : x >= limits.lo;
  const bool below_hi = limits.hi_open ? x < limits.hi : x <= limits.hi;
  return above_lo && below_hi;
}

std::string DescribeLimits(const Limits& limits) {
  std::string out;
  if (std::isfinite(limits.lo)) {
    out = (limits.lo_open ? "above " : "at least ") + FormatNumber(limits.lo);
  }
  if (std::isfinite(limits.hi)) {
    if (!out.empty()) out += " and ";
    out += (limits.hi_open ? "below " : "at most ") + FormatNumber(limits.hi);
  }
  return limits.unit.empty() ? out : out + " " + limits.unit;
}

double AsNumber(const Field& f) {
  double x = 0.0;
  if (!f.node.IsScalar() || !ParseDecimal(f.node.Scalar(), &x))
    Fail(f, NumberTypeError(f));
  return x;
}

double AsNumber(const Field& f, const Limits& limits) {
  const double x = AsNumber(f);
  if (!Within(limits, x)) {
    Fail(f, Text(f) + " is out of range; must be " + DescribeLimits(limits));
  }
  return x;
}

int AsWholeNumber(const Field& f, const Limits& limits) {
  double x = 0.0;
  if (!f.node.IsScalar() || !ParseDecimal(f.node.Scalar(), &x) || x != std::floor(x)) {
    Fail(f, "expected a whole number, got " + Describe(f.node));
  }
  if (!Within(limits, x) || std::fabs(x) > 1e9) {
    Fail(f, Text(f) + " is out of range; must be " + DescribeLimits(limits));
  }
  return static_cast<int>(x);
}

bool AsBool(const Field& f) {
  if (f.node.IsScalar()) {
    std::string text = f.node.Scalar();
    std::transform(text.begin(), text.end(), text.begin(),
                   [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
    if (text == "true") return true;
    if (text == "false") return false;
  }
  Fail(f, "expected true or false, got " + Describe(f.node));
}

std::string AsText(const Field& f) {
  if (!f.node.IsScalar()) Fail(f, "expected text, got " + Describe(f.node));
  return f.node.Scalar();
}

Date AsDate(const Field& f) {
  if (!f.node.IsScalar()) Fail(f, "expected a date YYYY-MM-DD, got " + Describe(f.node));
  const std::optional<Date> date = ParseDate(f.node.Scalar());
  if (!date) {
    Fail(f, Text(f) + " is not a valid date; expected YYYY-MM-DD, " + kDateRangeText);
  }
  return *date;
}

std::vector<Field> AsList(const Field& f) {
  if (!f.node.IsSequence()) Fail(f, "expected a list, got " + Describe(f.node));
  std::vector<Field> items;
  for (std::size_t i = 0; i < f.node.size(); ++i) {
    const YAML::Node item = f.node[i];
    items.push_back(
        Field{item, f.path + "[" + std::to_string(i) + "]", NodeLocation(item, f.where)});
  }
  return items;
}

std::pair<Field, Field> AsPair(const Field& f, const std::string& shape) {
  if (!f.node.IsSequence() || f.node.size() != 2) {
    Fail(f, "expected a pair " + shape + ", got " + Describe(f.node));
  }
  std::vector<Field> items = AsList(f);
  return {items[0], items[1]};
}

std::string PairText(const Field& f) {
  if (!f.node.IsSequence()) return Text(f);
  std::string out;
  for (const Field& item : AsList(f)) out += (out.empty() ? "" : ", ") + Text(item);
  return "[" + out + "]";
}

std::string PeekText(const Field& f, const std::string& key) {
  if (!f.node.IsMap()) return "";
  for (auto it = f.node.begin(); it != f.node.end(); ++it) {
    if (it->first.IsScalar() && it->first.Scalar() == key && it->second.IsScalar()) {
      return it->second.Scalar();
    }
  }
  return "";
}

double ReadNumber(const FieldMap& m, const std::string& key, const Limits& limits) {
  return AsNumber(m.Get(key), limits);
}

double ReadNumber(const FieldMap& m, const std::string& key, const Limits& limits,
                  double fallback) {
  const std::optional<Field> f = m.Find(key);
  return f ? AsNumber(*f, limits) : fallback;
}

int ReadWholeNumber(const FieldMap& m, const std::string& key, const Limits& limits,
                    int fallback) {
  const std::optional<Field> f = m.Find(key);
  return f ? AsWholeNumber(*f, limits) : fallback;
}

bool ReadBool(const FieldMap& m, const std::string& key, bool fallback) {
  const std::optional<Field> f = m.Find(key);
  return f ? AsBool(*f) : fallback;
}

std::string ReadName(const FieldMap& m, const std::string& key) {
  const Field f = m.Get(key);
  const std::string text = AsText(f);
  if (text.find_first_not_of(" \t") == std::string::npos) {
    Fail(f, "is empty; give a name (shown in reports)");
  }
  return text;
}

std::string ReadText(const FieldMap& m, const std::string& key,
                     const std::string& fallback) {
  const std::optional<Field> f = m.Find(key);
  return f ? AsText(*f) : fallback;
}

}  // namespace io
}  // namespace planner
