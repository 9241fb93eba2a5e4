#include "sim/curtailment_rules.h"

#include <algorithm>

#include "sim/compiled_model.h"

namespace planner {

CurtailmentRules::CurtailmentRules(const std::vector<CurtailmentRule>& rules) {
  const size_t n = std::min<size_t>(rules.size(), kMaxCurtailmentRules);
  for (size_t r = 0; r < n; ++r) {
    const CurtailmentRule& rule = rules[r];
    rules_.push_back({rule.wind_lo_ms, rule.wind_hi_ms,
                      rule.action == CurtailmentRule::Action::kReduce, rule.directions});
    const uint32_t hours = HourMask(rule.hours);
    for (int month = 1; month <= 12; ++month) {
      const bool in_month =
          rule.months.empty() ||
          std::find(rule.months.begin(), rule.months.end(), month) != rule.months.end();
      if (!in_month) continue;
      for (int h = 0; h < 24; ++h) {
        if (hours & (1u << h)) time_mask_[month - 1][h] |= 1u << r;
      }
    }
  }
}

uint32_t CurtailmentRules::ForDirection(double direction_deg) const {
  uint32_t mask = 0;
  for (size_t r = 0; r < rules_.size(); ++r) {
    const std::vector<AngleRange>& dirs = rules_[r].directions;
    bool inside = dirs.empty();
    for (const AngleRange& a : dirs)
      inside = inside || AngleRangeContains(a, direction_deg);
    if (inside) mask |= 1u << r;
  }
  return mask;
}

}  // namespace planner
