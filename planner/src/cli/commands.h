// The subcommands of the fillcast CLI. Each lives in its own file and adds
// itself to the app; main() only dispatches and maps errors to exit codes.
#ifndef PLANNER_CLI_COMMANDS_H_
#define PLANNER_CLI_COMMANDS_H_

#include <functional>

namespace CLI {
class App;
}

namespace planner {

// Each Add* registers a subcommand and returns the action main() runs when it
// was chosen. Actions return the process exit code.
using CommandAction = std::function<int()>;

CommandAction AddForecastCommand(CLI::App& app);
CommandAction AddCompareCommand(CLI::App& app);
CommandAction AddStartSweepCommand(CLI::App& app);
CommandAction AddSectorsCommand(CLI::App& app);
CommandAction AddFitSiteCommand(CLI::App& app);
CommandAction AddLogCommand(CLI::App& app);
CommandAction AddProgressCommand(CLI::App& app);

// Exit codes.
inline constexpr int kExitOk = 0;
inline constexpr int kExitInputError = 2;
// log add: conflicting duplicate records were reported and not added (the
// other records were).
inline constexpr int kExitConflicts = 3;
inline constexpr int kExitInternalError = 70;

}  // namespace planner

#endif  // PLANNER_CLI_COMMANDS_H_
