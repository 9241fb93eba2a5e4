#include "cli/given_options.h"

#include <CLI/CLI.hpp>
#include <string>
#include <vector>

#include "cli/output_file.h"
#include "planner/error.h"

namespace planner {

namespace {

// The options that name files a command writes.
const char* const kOutputOptions[] = {"--json", "--report", "--csv-cells", "--csv-curve",
                                      "--output"};

// The chosen command: the deepest parsed subcommand.
const CLI::App* Chosen(const CLI::App& app) {
  for (const CLI::App* sub : app.get_subcommands()) {
    if (sub->parsed()) return Chosen(*sub);
  }
  return &app;
}

std::string NameOf(const CLI::Option& option) {
  return option.get_positional() ? option.get_name(true) : option.get_name();
}

bool IsOutput(const CLI::Option& option) {
  for (const char* name : kOutputOptions) {
    if (option.check_lname(name + 2)) return true;
  }
  return false;
}

}  // namespace

void CheckGivenOptions(const CLI::App& app) {
  const CLI::App* command = Chosen(app);
  std::vector<OutputTarget> outputs;
  std::vector<std::string> inputs;  // the files named as arguments
  bool force = false;
  for (const CLI::Option* option : command->get_options()) {
    if (option->count() == 0) continue;
    if (option->check_lname("force")) force = true;
    for (const std::string& value : option->results()) {
      if (value.empty() && option->get_expected_min() > 0) {
        const std::string type = option->get_type_name();
        throw InputError(NameOf(*option) + ": the value is empty; expected " +
                         (type == "PATH" || option->get_positional() ? "a file path"
                          : type.empty()                             ? "a value"
                                                                     : type));
      }
      if (IsOutput(*option)) outputs.push_back({option->get_name(), value});
      if (option->get_positional() || option->check_lname("log")) inputs.push_back(value);
    }
  }
  CheckOutputTargets(outputs, inputs, force);
}

}  // namespace planner
