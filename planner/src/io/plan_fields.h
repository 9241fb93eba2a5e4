// Pieces of plan syntax that several plan sections share: direction sectors,
// wind-speed ranges, hour-of-day windows and names that must be unique.
// Built on yaml_fields.h; the sections themselves are read in plan_reader.cc
// and the *_reader.cc files beside it.
#ifndef PLANNER_IO_PLAN_FIELDS_H_
#define PLANNER_IO_PLAN_FIELDS_H_

#include <string>
#include <utility>
#include <vector>

#include "io/yaml_fields.h"
#include "planner/angle_range.h"
#include "planner/plan.h"

namespace planner {
namespace io {

// [from, to] in degrees, clockwise, may wrap through north; from == to is an
// error ([0, 360] is the full circle).
AngleRange ReadAngleRange(const Field& f);

// A non-empty list of [from, to] sectors. `when_empty` ends the message for an
// empty list, e.g. "leave the field out for the full circle".
std::vector<AngleRange> ReadAngleRanges(const Field& f, const std::string& when_empty);

// [lo, hi] in m/s, 0 <= lo < hi. Returned as {lo, hi}.
std::pair<double, double> ReadWindRange(const Field& f);

// [from, to] whole hours, from 0..23, to 1..24, from != to; wraps past
// midnight when from > to ([22, 6]); [0, 24] is the whole day.
HourWindow ReadHourWindow(const Field& f);

// The load-channel groups a cell needs: a non-empty list of names of
// plan.channel_groups (outages.channel_groups, read first). Returned as a
// bit mask (Cell::channels).
uint32_t ReadChannelNeeds(const Field& f, const Plan& plan);

// A wind window [lo, hi] of something done while the turbine produces (a
// manual test, a park test) must overlap cut_in_ms to cut_out_ms; `why`
// ends the message ("a test is done while the turbine produces").
void CheckWindInProduction(const Field& wind, double lo, double hi,
                           const TurbineSpec& turbine, const std::string& why);

// True if `name` is a lowercase identifier: a-z, then a-z, 0-9 or _.
bool IsIdentifier(const std::string& name);

// Names given so far in one namespace (e.g. every planned outage), with the
// path where each was given, so that a repeated name is reported with both.
class NameSet {
 public:
  // `what` names the items in messages: "planned outage", "curtailment rule".
  explicit NameSet(std::string what) : what_(std::move(what)) {}
  // Throws at `f` if `name` was given before; otherwise remembers it.
  void Add(const Field& f, const std::string& name);
  // The required field "name" of `m` (ReadName), added as above.
  std::string Read(const FieldMap& m);
  const std::vector<std::string>& names() const { return names_; }

 private:
  std::string what_;
  std::vector<std::string> names_;
  std::vector<std::string> paths_;
};

// The items of a list of named things (planned outages, episodes, tests
// ...), each read by read_item(field, &names): not empty ("is empty; give at
// least one WHAT" + when_empty), at most `most` items (0: any number), names
// unique within the list.
template <class T, class ReadItem>
std::vector<T> ReadNamedItems(const Field& f, const std::string& what, size_t most,
                              const std::string& when_empty, ReadItem read_item) {
  const std::vector<Field> items = AsList(f);
  if (items.empty()) Fail(f, "is empty; give at least one " + what + when_empty);
  if (most > 0 && items.size() > most) {
    Fail(f, std::to_string(items.size()) + " " + what + "s given; at most " +
                std::to_string(most) + " are allowed");
  }
  NameSet names(what);
  std::vector<T> out;
  for (const Field& item : items) out.push_back(read_item(item, &names));
  return out;
}

}  // namespace io
}  // namespace planner

#endif  // PLANNER_IO_PLAN_FIELDS_H_
