// fillcast start-sweep PLAN: the same campaign started on the first of each
// month in turn, so that a windy-season start can be argued with numbers.
#include <CLI/CLI.hpp>
#include <iostream>
#include <memory>

#include "cli/commands.h"
#include "cli/output_file.h"
#include "cli/plan_warnings.h"
#include "cli/run_options.h"
#include "cli/terminal_progress.h"
#include "planner/decision.h"
#include "planner/decision_report.h"
#include "planner/error.h"
#include "planner/forecast_accumulator.h"
#include "planner/monte_carlo.h"
#include "planner/plan_reader.h"
#include "planner/report_files.h"
#include "planner/simulation.h"

namespace planner {
namespace {

struct SweepArgs {
  std::string plan_path;
  RunOptionArgs run;
  int months = 12;
  std::string json_path;
  std::string report_path;
};

Date AddMonths(const Date& first_of_month, int months) {
  const int index = first_of_month.month - 1 + months;
  return Date{first_of_month.year + index / 12, index % 12 + 1, 1};
}

// The plan's forecast, its runs folded chunk by chunk (memory does not grow
// with --runs).
ForecastSummary ForecastInChunks(const Plan& plan, const MonteCarloOptions& mc,
                                 ProgressSink* progress) {
  const Simulator sim(plan);
  ForecastAccumulator acc(plan.matrix, sim.deadline_steps(), sim.horizon_steps(),
                          sim.relaxed_share());
  RunMonteCarloInChunks({&sim}, mc, progress,
                        [&acc](uint64_t, const std::vector<std::vector<RunResult>>& c) {
                          for (const RunResult& r : c[0]) acc.Add(r);
                        });
  return acc.Summary(mc.seed);
}

int RunSweep(const SweepArgs& args) {
  const MonteCarloOptions mc = ValidateRunOptions(args.run);
  if (args.months < 1 || args.months > 36) {
    throw InputError("--months: " + std::to_string(args.months) +
                     " is invalid; expected a whole number from 1 to 36");
  }
  const Plan plan = LoadPlan(args.plan_path);
  WarnUnreachable(plan);
  const Date first{plan.start.year, plan.start.month, 1};
  std::vector<StartSweepRow> rows;
  TerminalProgress progress("runs (" + std::to_string(args.months) + " starts)",
                            args.run.quiet);
  for (int m = 0; m < args.months; ++m) {
    const Plan shifted = ShiftStart(plan, AddMonths(first, m));
    const ForecastSummary s = ForecastInChunks(shifted, mc, &progress);
    RequirePlausible(s, "the forecast for the start " + FormatDate(shifted.start));
    rows.push_back(
        {shifted.start, shifted.deadline, s.p50, s.p80, s.p90, s.p_complete_by_deadline});
  }
  ReportContext ctx;
  ctx.tool_version = FILLCAST_VERSION;
  ctx.threads = EffectiveThreads(mc.threads);
  const std::vector<std::string> inputs = PlanInputFiles(plan);
  if (!args.json_path.empty()) {
    WriteOutputFile(args.json_path,
                    FormatStartSweepJson(plan, rows, ctx, mc.runs, mc.seed),
                    args.run.force, inputs, "--json");
  }
  if (!args.report_path.empty()) {
    const ForecastSummary own = ForecastInChunks(plan, mc, nullptr);
    RequirePlausible(own, "the forecast");
    HtmlReportInput in;
    in.plan = &plan;
    in.forecast = &own;
    in.start_sweep = rows;
    in.context = ctx;
    in.command_line = "fillcast start-sweep " + args.plan_path + " --runs " +
                      std::to_string(mc.runs) + " --seed " + std::to_string(mc.seed);
    WriteOutputFile(args.report_path, FormatHtmlReport(in), args.run.force, inputs,
                    "--report");
  }
  if (!args.run.quiet || (args.json_path.empty() && args.report_path.empty())) {
    std::cout << FormatStartSweepText(plan, rows, ctx, mc.runs, mc.seed);
  }
  return kExitOk;
}

}  // namespace

CommandAction AddStartSweepCommand(CLI::App& app) {
  auto args = std::make_shared<SweepArgs>();
  args->run.runs = 1000;
  CLI::App* cmd = app.add_subcommand(
      "start-sweep", "Forecast the campaign for each start month (first of the month)");
  cmd->add_option("plan", args->plan_path, "Campaign plan (YAML)")->required();
  AddRunOptions(cmd, &args->run);
  cmd->add_option("--months", args->months,
                  "Consecutive monthly starts from the plan's start month (default 12)")
      ->type_name("N")
      ->check(WholeNumberIn(1, 36, "a whole number from 1 to 36"));
  cmd->add_option("--json", args->json_path, "Also write the sweep as JSON to PATH")
      ->type_name("PATH");
  cmd->add_option("--report", args->report_path,
                  "Also write an HTML report (the plan + the sweep) to PATH")
      ->type_name("PATH");
  return [cmd, args]() { return cmd->parsed() ? RunSweep(*args) : -1; };
}

}  // namespace planner
