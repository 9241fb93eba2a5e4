// fillcast forecast PLAN.yaml: simulate many campaigns and report weeks to
// completion, its risk, and the cells that stay thin.
#include <CLI/CLI.hpp>

#include <iostream>
#include <memory>

#include "cli/commands.h"
#include "cli/output_file.h"
#include "cli/run_options.h"
#include "cli/terminal_progress.h"
#include "planner/error.h"
#include "planner/forecast.h"
#include "planner/forecast_report.h"
#include "planner/monte_carlo.h"
#include "planner/plan_reader.h"
#include "planner/simulation.h"

namespace planner {
namespace {

struct ForecastArgs {
  std::string plan_path;
  RunOptionArgs run;
  std::string json_path;
  int thin_rows = 10;
};

int RunForecast(const ForecastArgs& args) {
  const MonteCarloOptions mc = ValidateRunOptions(args.run);
  if (args.thin_rows < 0) {
    throw InputError("--thin: " + std::to_string(args.thin_rows) +
                     " is invalid; expected a whole number >= 0");
  }
  const Plan plan = LoadPlan(args.plan_path);
  const Simulator sim(plan);
  TerminalProgress progress("runs", args.run.quiet);
  const std::vector<RunResult> runs = RunMonteCarlo(sim, mc, &progress);
  const ForecastSummary summary = SummarizeForecast(
      plan.matrix, sim.deadline_steps(), sim.horizon_steps(), runs, mc.seed);

  ReportContext ctx;
  ctx.tool_version = FILLCAST_VERSION;
  ctx.threads = EffectiveThreads(mc.threads);
  ctx.thin_cell_rows = args.thin_rows;
  if (!args.json_path.empty()) {
    WriteOutputFile(args.json_path, FormatForecastJson(plan, summary, ctx), args.run.force,
                    {plan.source_file, plan.site_file}, "--json");
  }
  if (!args.run.quiet || args.json_path.empty()) {
    std::cout << FormatForecastText(plan, summary, ctx);
  }
  return kExitOk;
}

}  // namespace

CommandAction AddForecastCommand(CLI::App& app) {
  auto args = std::make_shared<ForecastArgs>();
  CLI::App* cmd = app.add_subcommand(
      "forecast", "Simulate the campaign many times: weeks to completion and thin cells");
  cmd->add_option("plan", args->plan_path, "Campaign plan (YAML, see docs/plan.md)")
      ->required();
  AddRunOptions(cmd, &args->run);
  cmd->add_option("--json", args->json_path, "Also write the full result as JSON to PATH")
      ->type_name("PATH");
  cmd->add_option("--thin", args->thin_rows,
                  "Rows in the table of cells least likely to be full (default 10)")
      ->type_name("N");
  return [cmd, args]() { return cmd->parsed() ? RunForecast(*args) : -1; };
}

}  // namespace planner
