// Typed, located access to YAML input, shared by the readers in src/io.
//
// Every value is read through a Field: the yaml-cpp node, the path a user
// would recognise ("turbine.cut_in_ms", "sectors[2].weibull_k"; list indices
// count from 0) and where it was written. Each problem is then reported as
//
//   plan.yaml:12:14: turbine.cut_in_ms: 30 must be below cut_out_ms (25)
//
// through ThrowAt (planner/error.h). Nothing here knows about plans or sites.
#ifndef PLANNER_IO_YAML_FIELDS_H_
#define PLANNER_IO_YAML_FIELDS_H_

#include <yaml-cpp/yaml.h>

#include <limits>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "planner/calendar.h"
#include "planner/error.h"

namespace planner {
namespace io {

struct Field {
  YAML::Node node;
  std::string path;  // empty for a document's root
  SourceLocation where;
};

// The whole content of the input file at `path`. `what` names the kind of
// file for messages ("plan", "site model"). Throws InputError naming the file
// if it is missing, a folder, unreadable or absurdly large.
std::string ReadInputFile(const std::string& path, const std::string& what);

// Parses `text` as one YAML document. Syntax errors throw InputError at their
// line and column; a second document in the same text is an error.
Field ParseDocument(const std::string& text, const std::string& file_name);

// True if f is a mapping with the field `key` (for telling kinds of files
// apart before reading one as another).
bool HasField(const Field& f, const std::string& key);

// Throws InputError at f's location, naming f's path.
[[noreturn]] void Fail(const Field& f, const std::string& message);

// How a value reads in a message: a scalar's text in quotes ('abc'), or
// "a list of 3 items", "a mapping", "nothing".
std::string Describe(const YAML::Node& node);

// A scalar's text as the user wrote it (for "30 must be below ...").
std::string Text(const Field& f);

// Shortest plain form of a computed number: 25, 0.97, 1.0123.
std::string FormatNumber(double x);

// "a, b, c".
std::string JoinWords(const std::vector<std::string>& words);

// A mapping whose keys have been checked: each key is one of `allowed`
// (otherwise "unknown field", with a suggestion and the valid keys) and is
// given once. `context` is added to the unknown-field message, e.g.
// "for model 'table'".
class FieldMap {
 public:
  FieldMap(const Field& map, const std::vector<std::string>& allowed,
           const std::string& context = "");

  const Field& self() const { return self_; }
  bool Has(const std::string& key) const { return Find(key).has_value(); }
  std::optional<Field> Find(const std::string& key) const;
  // Throws "required field is missing" at the mapping's location.
  Field Get(const std::string& key) const;
  // The path a key has (or would have) inside this mapping.
  std::string PathOf(const std::string& key) const;

 private:
  Field self_;
  std::vector<std::pair<std::string, Field>> entries_;
};

// Allowed values of a number, with the unit used in messages.
struct Limits {
  double lo = -std::numeric_limits<double>::infinity();
  double hi = std::numeric_limits<double>::infinity();
  bool lo_open = false;  // lo itself is not allowed
  bool hi_open = false;  // hi itself is not allowed
  std::string unit;      // "m/s", "h", "%"...; empty for pure numbers
};

// `bounds` is "[]", "[)", "(]" or "()": whether lo and hi are included. Use an
// infinity for a one-sided interval.
Limits Interval(const char* bounds, double lo, double hi, const std::string& unit = "");
bool Within(const Limits& limits, double x);
// "above 0 and at most 30 m/s", "at least 0 h".
std::string DescribeLimits(const Limits& limits);

// Conversions. Each throws InputError at f when the value has the wrong type
// ("expected a number, got 'abc'") or lies outside `limits`
// ("0 is out of range; must be above 0 and at most 30 m/s").
double AsNumber(const Field& f);
double AsNumber(const Field& f, const Limits& limits);
int AsWholeNumber(const Field& f, const Limits& limits);
bool AsBool(const Field& f);
std::string AsText(const Field& f);         // any scalar
Date AsDate(const Field& f);                // YYYY-MM-DD, a real calendar date
std::vector<Field> AsList(const Field& f);  // element paths "path[i]"
// A list of exactly two items; `shape` names them in messages.
std::pair<Field, Field> AsPair(const Field& f, const std::string& shape = "[lo, hi]");
// "[a, b]" as the user wrote it.
std::string PairText(const Field& f);

// The text of `key` in mapping f if f is a mapping holding that key with a
// scalar value, else "". For mappings whose valid keys depend on one of them
// (a "law" or "model"), before the keys are checked.
std::string PeekText(const Field& f, const std::string& key);

// Required (Get) and optional (with fallback) fields of a mapping.
double ReadNumber(const FieldMap& m, const std::string& key, const Limits& limits);
double ReadNumber(const FieldMap& m, const std::string& key, const Limits& limits,
                  double fallback);
int ReadWholeNumber(const FieldMap& m, const std::string& key, const Limits& limits,
                    int fallback);
bool ReadBool(const FieldMap& m, const std::string& key, bool fallback);
// Required text that must not be empty.
std::string ReadName(const FieldMap& m, const std::string& key);
std::string ReadText(const FieldMap& m, const std::string& key,
                     const std::string& fallback);

inline constexpr double kInfinity = std::numeric_limits<double>::infinity();

}  // namespace io
}  // namespace planner

#endif  // PLANNER_IO_YAML_FIELDS_H_
