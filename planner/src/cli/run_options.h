// Options shared by every command that runs the Monte-Carlo simulation.
#ifndef PLANNER_CLI_RUN_OPTIONS_H_
#define PLANNER_CLI_RUN_OPTIONS_H_

#include <CLI/CLI.hpp>
#include <cstdint>
#include <string>

#include "planner/forecast.h"
#include "planner/monte_carlo.h"

namespace planner {

struct RunOptionArgs {
  long runs = 2000;
  uint64_t seed = 20270301;
  int threads = 0;
  bool quiet = false;
  bool force = false;
};

// Checks for numeric options, run by the option parser on the text as given:
// a (whole) number, finite (no nan or inf), from lo to hi. The message reads
// "'<text>' is invalid; expected <valid>" (the parser adds the option's name),
// so a mistyped number says the valid range like every other input error.
CLI::Validator WholeNumberIn(long long lo, long long hi, const std::string& valid);
CLI::Validator NumberIn(double lo, double hi, const std::string& valid);

// Adds --runs, --seed, --threads, --quiet, --force.
void AddRunOptions(CLI::App* cmd, RunOptionArgs* args);

// A flag's number as the user would write it ("1.5", not "1.500000").
std::string FlagNumber(double x);

// A path as a POSIX shell word: unchanged when plain, else single-quoted
// (for the command lines the reports print to reproduce a run).
std::string ShellWord(const std::string& text);

// Throws InputError listing the implausible numbers of a summary
// (planner/result_check.h), if any; `what` names the result ("the forecast",
// "scenario 2"). Called before anything is written.
void RequirePlausible(const ForecastSummary& summary, const std::string& what);

// Checks ranges (InputError naming the flag) and fills MonteCarloOptions.
MonteCarloOptions ValidateRunOptions(const RunOptionArgs& args);

}  // namespace planner

#endif  // PLANNER_CLI_RUN_OPTIONS_H_
