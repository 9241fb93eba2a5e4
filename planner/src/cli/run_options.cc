#include "cli/run_options.h"

#include <CLI/CLI.hpp>
#include <cerrno>
#include <cmath>
#include <cstdlib>
#include <limits>
#include <sstream>
#include <string>

#include "planner/error.h"
#include "planner/result_check.h"

namespace planner {

namespace {
constexpr long kMaxRuns = 10000000;
constexpr int kMaxThreads = 1024;

// The whole text as a number (strtod/strtoll): false on trailing text.
bool ParseWhole(const std::string& text, long long* x) {
  if (text.empty() || text.find_first_of(".eE") != std::string::npos) return false;
  char* end = nullptr;
  errno = 0;
  *x = std::strtoll(text.c_str(), &end, 10);
  return errno == 0 && end != text.c_str() && *end == '\0';
}

bool ParseReal(const std::string& text, double* x) {
  if (text.empty()) return false;
  char* end = nullptr;
  *x = std::strtod(text.c_str(), &end);
  return end != text.c_str() && *end == '\0';
}

std::string Invalid(const std::string& text, const std::string& valid) {
  return "'" + text + "' is invalid; expected " + valid;
}

}  // namespace

CLI::Validator WholeNumberIn(long long lo, long long hi, const std::string& valid) {
  return CLI::Validator(
      [lo, hi, valid](std::string& text) {
        long long x = 0;
        return ParseWhole(text, &x) && x >= lo && x <= hi ? std::string()
                                                          : Invalid(text, valid);
      },
      "");
}

CLI::Validator NumberIn(double lo, double hi, const std::string& valid) {
  return CLI::Validator(
      [lo, hi, valid](std::string& text) {
        double x = 0;
        return ParseReal(text, &x) && std::isfinite(x) && x >= lo && x <= hi
                   ? std::string()
                   : Invalid(text, valid);
      },
      "");
}

void AddRunOptions(CLI::App* cmd, RunOptionArgs* args) {
  cmd->add_option("--runs", args->runs, "Simulated campaigns")
      ->type_name("N")
      ->check(WholeNumberIn(1, kMaxRuns,
                            "a whole number from 1 to " + std::to_string(kMaxRuns)))
      ->capture_default_str();
  cmd->add_option("--seed", args->seed,
                  "Master seed; same seed, same answer for any thread count")
      ->type_name("S")
      ->check(CLI::Validator(
          [](std::string& text) {
            const bool digits = !text.empty() && text.size() <= 20 &&
                                text.find_first_not_of("0123456789") == std::string::npos;
            errno = 0;
            if (digits) std::strtoull(text.c_str(), nullptr, 10);
            return digits && errno == 0
                       ? std::string()
                       : Invalid(text, "a whole number from 0 to 18446744073709551615");
          },
          ""))
      ->capture_default_str();
  cmd->add_option("--threads", args->threads, "Worker threads (default 0 = all cores)")
      ->type_name("T")
      ->check(WholeNumberIn(
          0, kMaxThreads,
          "0 (all cores) or a whole number up to " + std::to_string(kMaxThreads)));
  cmd->add_flag("--quiet,-q", args->quiet,
                "No progress line; with any output file, no terminal summary either");
  cmd->add_flag(
      "--force", args->force,
      "Overwrite output files fillcast did not write (never an input, a device or a "
      "pipe)");
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

void RequirePlausible(const ForecastSummary& summary, const std::string& what) {
  const std::vector<std::string> problems = ImplausibleNumbers(summary);
  if (problems.empty()) return;
  std::string list;
  for (std::size_t i = 0; i < problems.size() && i < 5; ++i) list += "\n  " + problems[i];
  if (problems.size() > 5) {
    list += "\n  ... and " + std::to_string(problems.size() - 5) + " more";
  }
  throw InputError(
      what + " holds numbers that cannot be right, so nothing was written:" + list +
      "\nEach input is within its own range, but together they make an "
      "impossible result; check the site model (Weibull A and k, monthly and "
      "hourly factors) and the plan.");
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
