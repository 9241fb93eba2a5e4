#include "io/plan_fields.h"

#include <algorithm>

namespace planner {
namespace io {

AngleRange ReadAngleRange(const Field& f) {
  const auto [from, to] = AsPair(f, "[from, to]");
  AngleRange range;
  range.from_deg = AsNumber(from, Interval("[)", 0, 360, "degrees"));
  range.to_deg = AsNumber(to, Interval("[]", 0, 360, "degrees"));
  if (range.from_deg == range.to_deg) {
    Fail(f, PairText(f) +
                " is an empty sector; a sector runs clockwise from the "
                "first angle to the second (write [0, 360] for the full "
                "circle)");
  }
  return range;
}

std::vector<AngleRange> ReadAngleRanges(const Field& f, const std::string& when_empty) {
  const std::vector<Field> items = AsList(f);
  if (items.empty())
    Fail(f, "is empty; give at least one [from, to] sector, or " + when_empty);
  std::vector<AngleRange> sectors;
  for (const Field& item : items) sectors.push_back(ReadAngleRange(item));
  return sectors;
}

std::pair<double, double> ReadWindRange(const Field& f) {
  const auto [lo_field, hi_field] = AsPair(f);
  const Limits speed = Interval("[)", 0, kInfinity, "m/s");
  const double lo = AsNumber(lo_field, speed);
  const double hi = AsNumber(hi_field, speed);
  if (hi <= lo) Fail(f, PairText(f) + " is an empty range; lo must be below hi");
  return {lo, hi};
}

void CheckWindInProduction(const Field& wind, double lo, double hi,
                           const TurbineSpec& turbine, const std::string& why) {
  if (hi > turbine.cut_in_ms && lo < turbine.cut_out_ms) return;
  Fail(wind, PairText(wind) + " lies outside turbine.cut_in_ms to cut_out_ms (" +
                 FormatNumber(turbine.cut_in_ms) + "-" + FormatNumber(turbine.cut_out_ms) +
                 " m/s); " + why + ", so it could never be done");
}

uint32_t ReadChannelNeeds(const Field& f, const Plan& plan) {
  std::vector<std::string> names;
  for (const ChannelGroup& g : plan.channel_groups) names.push_back(g.name);
  if (names.empty()) {
    Fail(f, "names load-channel groups, but outages.channel_groups defines none; define "
            "the groups there, or leave the field out");
  }
  const std::vector<Field> items = AsList(f);
  if (items.empty()) {
    Fail(f, "is empty; a record needs at least one channel group (leave the field out "
            "for every group)");
  }
  uint32_t mask = 0;
  for (const Field& item : items) {
    const std::string name = AsText(item);
    const auto at = std::find(names.begin(), names.end(), name);
    if (at == names.end()) {
      Fail(item, Describe(item.node) +
                     " is not a channel group; valid: " + JoinWords(names));
    }
    mask |= 1u << (at - names.begin());
  }
  return mask;
}

HourWindow ReadHourWindow(const Field& f) {
  const auto [from, to] = AsPair(f, "[from, to]");
  HourWindow window;
  window.from_hour = AsWholeNumber(from, Interval("[]", 0, 23, "h"));
  window.to_hour = AsWholeNumber(to, Interval("[]", 1, 24, "h"));
  if (window.from_hour == window.to_hour) {
    Fail(f, PairText(f) +
                " is an empty window; hours run from the first to the second and may "
                "wrap past midnight ([22, 6]); write [0, 24] for the whole day");
  }
  return window;
}

bool IsIdentifier(const std::string& name) {
  if (name.empty() || name[0] < 'a' || name[0] > 'z') return false;
  return std::all_of(name.begin(), name.end(), [](char c) {
    return (c >= 'a' && c <= 'z') || (c >= '0' && c <= '9') || c == '_';
  });
}

std::string NameSet::Read(const FieldMap& m) {
  const std::string name = ReadName(m, "name");
  Add(m.Get("name"), name);
  return name;
}

void NameSet::Add(const Field& f, const std::string& name) {
  for (std::size_t i = 0; i < names_.size(); ++i) {
    if (names_[i] != name) continue;
    Fail(f, Describe(f.node) + " is already the name of " + paths_[i] + "; give each " +
                what_ + " its own name");
  }
  names_.push_back(name);
  // The item's path: the name field's path without its last ".name" part.
  const std::size_t dot = f.path.rfind('.');
  paths_.push_back(dot == std::string::npos ? f.path : f.path.substr(0, dot));
}

}  // namespace io
}  // namespace planner
