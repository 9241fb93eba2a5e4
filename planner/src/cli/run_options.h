// Options shared by every command that runs the Monte-Carlo simulation.
#ifndef PLANNER_CLI_RUN_OPTIONS_H_
#define PLANNER_CLI_RUN_OPTIONS_H_

#include <cstdint>
#include <string>

#include "planner/monte_carlo.h"

namespace CLI {
class App;
}

namespace planner {

struct RunOptionArgs {
  long runs = 2000;
  uint64_t seed = 20270301;
  int threads = 0;
  bool quiet = false;
  bool force = false;
};

// Adds --runs, --seed, --threads, --quiet, --force.
void AddRunOptions(CLI::App* cmd, RunOptionArgs* args);

// A flag's number as the user would write it ("1.5", not "1.500000").
std::string FlagNumber(double x);

// A path as a POSIX shell word: unchanged when plain, else single-quoted
// (for the command lines the reports print to reproduce a run).
std::string ShellWord(const std::string& text);

// Checks ranges (InputError naming the flag) and fills MonteCarloOptions.
MonteCarloOptions ValidateRunOptions(const RunOptionArgs& args);

}  // namespace planner

#endif  // PLANNER_CLI_RUN_OPTIONS_H_
