// The wall clock, read only by the CLI (the library never reads it): when a
// log was written to or a progress forecast was made.
#ifndef PLANNER_CLI_CLOCK_H_
#define PLANNER_CLI_CLOCK_H_

#include <string>

namespace planner {

// The current time in UTC as "YYYY-MM-DDTHH:MM:SSZ".
std::string NowUtc();

}  // namespace planner

#endif  // PLANNER_CLI_CLOCK_H_
