#include "cli/run_options.h"

#include <CLI/CLI.hpp>
#include <sstream>
#include <string>

#include "planner/error.h"

namespace planner {

namespace {
constexpr long kMaxRuns = 10000000;
constexpr int kMaxThreads = 1024;
}  // namespace

void AddRunOptions(CLI::App* cmd, RunOptionArgs* args) {
  cmd->add_option("--runs", args->runs, "Simulated campaigns")
      ->type_name("N")
      ->capture_default_str();
  cmd->add_option("--seed", args->seed,
                  "Master seed; same seed, same answer for any thread count")
      ->type_name("S")
      ->capture_default_str();
  cmd->add_option("--threads", args->threads, "Worker threads (default 0 = all cores)")
      ->type_name("T");
  cmd->add_flag("--quiet,-q", args->quiet,
                "No progress line; with any output file, no terminal summary either");
  cmd->add_flag("--force", args->force,
                "Overwrite output files even if fillcast did not write them");
}

std::string FlagNumber(double x) {
  std::ostringstream out;
  out << x;
  return out.str();
}

MonteCarloOptions ValidateRunOptions(const RunOptionArgs& args) {
  if (args.runs < 1 || args.runs > kMaxRuns) {
    throw InputError("--runs: " + std::to_string(args.runs) +
                     " is invalid; expected a whole number from 1 to " +
                     std::to_string(kMaxRuns));
  }
  if (args.threads < 0 || args.threads > kMaxThreads) {
    throw InputError("--threads: " + std::to_string(args.threads) +
                     " is invalid; expected 0 (all cores) or a whole number up to " +
                     std::to_string(kMaxThreads));
  }
  MonteCarloOptions mc;
  mc.runs = static_cast<int>(args.runs);
  mc.seed = args.seed;
  mc.threads = args.threads;
  return mc;
}

std::string ShellWord(const std::string& text) {
  if (!text.empty() &&
      text.find_first_not_of("abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTU"
                             "VWXYZ0123456789_-./+:=@%,") == std::string::npos) {
    return text;
  }
  std::string out = "'";
  for (const char ch : text) {
    out += ch == '\'' ? std::string("'\\''") : std::string(1, ch);
  }
  return out + "'";
}

}  // namespace planner
