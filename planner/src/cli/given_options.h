// Checks of the chosen command's options that every command shares, made
// right after parsing and before any work.
#ifndef PLANNER_CLI_GIVEN_OPTIONS_H_
#define PLANNER_CLI_GIVEN_OPTIONS_H_

namespace CLI {
class App;
}

namespace planner {

// Throws InputError if an option or argument of the chosen command (or its
// chosen subcommand, as in "log add") was given an empty value, or if its
// output files (--json, --report, --csv-cells, --csv-curve, -o) would be
// refused when written (see CheckOutputTargets in cli/output_file.h): so a
// long run never ends in "cannot write".
void CheckGivenOptions(const CLI::App& app);

}  // namespace planner

#endif  // PLANNER_CLI_GIVEN_OPTIONS_H_
