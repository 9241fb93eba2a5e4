// Curtailment rules as the run loop asks them (plan: `curtailment`,
// docs/plan.md): which rules are in force in a month and hour, which hold
// for a wind direction (bit masks, looked up once per hour and once per
// direction change), and what the rules in force do to a record at a given
// speed. Stop wins over reduce. Built once per plan; read-only in the runs.
#ifndef PLANNER_SIM_CURTAILMENT_RULES_H_
#define PLANNER_SIM_CURTAILMENT_RULES_H_

#include <array>
#include <cstdint>
#include <vector>

#include "planner/angle_range.h"
#include "planner/plan.h"

namespace planner {

// Curtailment outcome of a record.
enum Curtail : int { kNotCurtailed = 0, kReduce = 1, kStop = 2 };

// At most this many curtailment rules (bits of a mask); the reader checks.
inline constexpr int kMaxCurtailmentRules = 32;

class CurtailmentRules {
 public:
  CurtailmentRules() = default;
  explicit CurtailmentRules(const std::vector<CurtailmentRule>& rules);

  bool empty() const { return rules_.empty(); }
  // Bit r: rule r is in force in this month (0..11) and hour (0..23).
  uint32_t InForce(int month, int hour) const { return time_mask_[month][hour]; }
  // Bit r: rule r holds for wind from direction_deg (clockwise from north).
  uint32_t ForDirection(double direction_deg) const;
  // What the rules of the mask (in force, direction holding) do to a record
  // with mean wind speed_ms.
  Curtail At(double speed_ms, uint32_t rules) const {
    Curtail result = kNotCurtailed;
    for (size_t r = 0; rules != 0; ++r, rules >>= 1) {
      if (!(rules & 1u)) continue;
      const Rule& c = rules_[r];
      if (speed_ms < c.wind_lo_ms || speed_ms >= c.wind_hi_ms) continue;
      if (!c.reduce) return kStop;
      result = kReduce;
    }
    return result;
  }

 private:
  struct Rule {
    double wind_lo_ms = 0, wind_hi_ms = 1e9;
    bool reduce = false;                 // false: stop
    std::vector<AngleRange> directions;  // empty = all
  };
  std::vector<Rule> rules_;
  std::array<std::array<uint32_t, 24>, 12> time_mask_{};
};

}  // namespace planner

#endif  // PLANNER_SIM_CURTAILMENT_RULES_H_
