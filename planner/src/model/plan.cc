#include "planner/plan.h"

namespace planner {

int64_t DeadlineSteps(const Plan& p) {
  return DaysBetween(p.start, p.deadline) * kStepsPerDay;
}

int64_t HorizonSteps(const Plan& p) {
  return static_cast<int64_t>(p.horizon_weeks) * kStepsPerWeek;
}

}  // namespace planner
