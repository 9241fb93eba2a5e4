// fillcast: forecasts how fast a load-measurement campaign fills its IEC
// 61400-13 capture matrix. main() only builds the command line, dispatches and
// maps errors to exit codes; each subcommand lives in its own file.
#include <CLI/CLI.hpp>
#include <exception>
#include <iostream>
#include <string>
#include <vector>

#include "cli/commands.h"
#include "cli/given_options.h"
#include "planner/error.h"

int main(int argc, char** argv) {
  using namespace planner;
  CLI::App app(
      "fillcast " FILLCAST_VERSION
      " - forecasts how many weeks a wind-turbine load-measurement campaign needs to "
      "fill its capture matrix (IEC 61400-13), with the risk, from a site's wind and "
      "turbulence model, the turbine's downtime and the target matrix.",
      "fillcast");
  app.set_version_flag("--version,-V", "fillcast " FILLCAST_VERSION);
  app.require_subcommand(1);
  app.footer(
      "A forecast is an estimate, not a promise. See README.md and docs/ for the "
      "file formats and methods.");
  std::vector<CommandAction> actions = {AddForecastCommand(app),   AddCompareCommand(app),
                                        AddStartSweepCommand(app), AddSectorsCommand(app),
                                        AddFitSiteCommand(app),    AddLogCommand(app),
                                        AddProgressCommand(app)};
  std::string names;
  bool known = false;
  for (const CLI::App* sub : app.get_subcommands({})) {
    names += (names.empty() ? "" : ", ") + sub->get_name();
    known = known || (argc > 1 && sub->get_name() == argv[1]);
  }
  if (argc > 1 && argv[1][0] != '-' && !known) {
    std::cerr << "fillcast: error: '" << argv[1]
              << "' is not a fillcast command; expected "
              << "one of: " << names << " (see fillcast --help)\n";
    return kExitInputError;
  }
  try {
    app.parse(argc, argv);
  } catch (const CLI::ParseError& e) {
    if (e.get_exit_code() == 0) return app.exit(e);  // --help, --version
    // A checked value's message says what is valid; others point to --help.
    const bool checked = dynamic_cast<const CLI::ValidationError*>(&e) != nullptr;
    std::cerr << "fillcast: error: " << e.what()
              << (checked ? "" : " (see fillcast --help)") << "\n";
    return kExitInputError;
  }
  try {
    CheckGivenOptions(app);
    for (const CommandAction& action : actions) {
      const int code = action();
      if (code >= 0) return code;
    }
    return kExitOk;
  } catch (const InputError& e) {
    std::cerr << "fillcast: error: " << e.what() << "\n";
    return kExitInputError;
  } catch (const std::exception& e) {
    std::cerr << "fillcast: internal error: " << e.what() << "\n";
    return kExitInternalError;
  }
}
