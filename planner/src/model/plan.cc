#include "planner/plan.h"

namespace planner {

std::vector<std::string> PlanInputFiles(const Plan& p) {
  std::vector<std::string> files = {p.source_file, p.site_file};
  if (p.replay) files.push_back(p.replay->series_file);
  return files;
}

int64_t DeadlineSteps(const Plan& p) {
  return DaysBetween(p.start, p.deadline) * kStepsPerDay;
}

int64_t HorizonSteps(const Plan& p) {
  return static_cast<int64_t>(p.horizon_weeks) * kStepsPerWeek;
}

}  // namespace planner
