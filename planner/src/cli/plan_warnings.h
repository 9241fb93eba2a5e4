// Warnings about a plan that every simulating command prints before it
// starts (on stderr, so that they stay out of piped results).
#ifndef PLANNER_CLI_PLAN_WARNINGS_H_
#define PLANNER_CLI_PLAN_WARNINGS_H_

#include "planner/plan.h"

namespace planner {

// Says which required cells the plan rules out (reachability.h), so that a
// long run to the horizon is no surprise; the reports repeat it. Nothing when
// every required cell can fill.
void WarnUnreachable(const Plan& plan);

}  // namespace planner

#endif  // PLANNER_CLI_PLAN_WARNINGS_H_
