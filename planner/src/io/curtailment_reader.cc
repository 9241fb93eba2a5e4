#include "io/curtailment_reader.h"

#include <algorithm>
#include <string>

#include "io/plan_fields.h"

namespace planner {
namespace io {
namespace {

// The simulation keeps the rules in force as bits of a 32-bit mask.
constexpr std::size_t kMaxRules = 32;

const std::vector<std::string> kRuleFields = {"name",    "months",         "hours",
                                              "wind_ms", "directions_deg", "action"};

std::vector<int> ReadMonths(const Field& f) {
  const std::vector<Field> items = AsList(f);
  if (items.empty()) {
    Fail(f, "is empty; give months 1 to 12, or leave the field out for every month");
  }
  std::vector<int> months;
  for (const Field& item : items) {
    const int month = AsWholeNumber(item, Interval("[]", 1, 12));
    if (std::find(months.begin(), months.end(), month) != months.end()) {
      Fail(item, Text(item) + " is given twice; give each month once");
    }
    months.push_back(month);
  }
  return months;
}

CurtailmentRule::Action ReadAction(const Field& f) {
  const std::string action = AsText(f);
  if (action == "stop") return CurtailmentRule::Action::kStop;
  if (action == "reduce") return CurtailmentRule::Action::kReduce;
  Fail(f, Describe(f.node) + " is not an action; valid: stop, reduce");
}

CurtailmentRule ReadRule(const Field& f, NameSet* names) {
  const FieldMap m(f, kRuleFields);
  CurtailmentRule rule;
  rule.name = names->Read(m);
  if (const auto months = m.Find("months")) rule.months = ReadMonths(*months);
  if (const auto hours = m.Find("hours")) rule.hours = ReadHourWindow(*hours);
  if (const auto wind = m.Find("wind_ms")) {
    const auto [lo, hi] = ReadWindRange(*wind);
    rule.wind_lo_ms = lo;
    rule.wind_hi_ms = hi;
  }
  if (const auto directions = m.Find("directions_deg")) {
    rule.directions =
        ReadAngleRanges(*directions, "leave the field out for every direction");
  }
  rule.action = ReadAction(m.Get("action"));
  if (!m.Has("months") && !m.Has("hours") && !m.Has("wind_ms") &&
      !m.Has("directions_deg")) {
    Fail(f,
         "has no condition, so it would hold for the whole campaign; give months, "
         "hours, wind_ms or directions_deg");
  }
  return rule;
}

}  // namespace

std::vector<CurtailmentRule> ReadCurtailment(const Field& f) {
  const std::vector<Field> items = AsList(f);
  if (items.empty()) Fail(f, "is empty; give at least one rule, or leave the field out");
  if (items.size() > kMaxRules) {
    Fail(f, std::to_string(items.size()) + " rules given; at most " +
                std::to_string(kMaxRules) + " are allowed");
  }
  NameSet names("curtailment rule");
  std::vector<CurtailmentRule> rules;
  for (const Field& item : items) rules.push_back(ReadRule(item, &names));
  return rules;
}

}  // namespace io
}  // namespace planner
