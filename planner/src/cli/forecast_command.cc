// fillcast forecast PLAN.yaml: simulate many campaigns and report weeks to
// completion, its risk, and the cells that stay thin.
#include <CLI/CLI.hpp>
#include <iostream>
#include <memory>

#include "cli/commands.h"
#include "cli/output_file.h"
#include "cli/plan_warnings.h"
#include "cli/run_options.h"
#include "cli/terminal_progress.h"
#include "planner/error.h"
#include "planner/forecast.h"
#include "planner/forecast_accumulator.h"
#include "planner/forecast_report.h"
#include "planner/hold_ups.h"
#include "planner/monte_carlo.h"
#include "planner/plan_reader.h"
#include "planner/report_files.h"
#include "planner/simulation.h"

namespace planner {
namespace {

struct ForecastArgs {
  std::string plan_path;
  RunOptionArgs run;
  std::string json_path;
  std::string report_path;     // --report: HTML
  std::string csv_cells_path;  // --csv-cells
  std::string csv_curve_path;  // --csv-curve
  int thin_rows = 10;
  double precision_weeks = 0;  // --precision; 0 = off
  std::string precision_quantile = "p80";
  int max_runs = 100000;
  double relaxed_share = 0.8;  // --relax: lowered minimum for the what-if
  bool no_explain = false;     // --no-explain: skip the hold-up forecasts
};

double ParseQuantile(const std::string& text) {
  if (text == "p50") return 0.5;
  if (text == "p80") return 0.8;
  if (text == "p90") return 0.9;
  throw InputError("--precision-of: '" + text + "' is invalid; expected p50, p80 or p90");
}

// The command that reproduces this result, for the report's inputs section.
std::string ReproducingCommand(const ForecastArgs& args) {
  return "fillcast forecast " + ShellWord(args.plan_path) + " --runs " +
         std::to_string(args.run.runs) + " --seed " + std::to_string(args.run.seed) +
         (args.run.threads > 0 ? " --threads " + std::to_string(args.run.threads) : "");
}

void WriteReportFiles(const ForecastArgs& args, const Plan& plan,
                      const ForecastSummary& summary, const ReportContext& ctx) {
  const std::vector<std::string> inputs = PlanInputFiles(plan);
  if (!args.report_path.empty()) {
    HtmlReportInput in;
    in.plan = &plan;
    in.forecast = &summary;
    in.context = ctx;
    in.command_line = ReproducingCommand(args);
    WriteOutputFile(args.report_path, FormatHtmlReport(in), args.run.force, inputs,
                    "--report");
  }
  if (!args.csv_cells_path.empty()) {
    WriteOutputFile(args.csv_cells_path, FormatCellsCsv(plan, summary, ctx),
                    args.run.force, inputs, "--csv-cells");
  }
  if (!args.csv_curve_path.empty()) {
    WriteOutputFile(args.csv_curve_path, FormatCompletionCurveCsv(summary, ctx),
                    args.run.force, inputs, "--csv-curve");
  }
}

int RunForecast(const ForecastArgs& args) {
  const MonteCarloOptions mc = ValidateRunOptions(args.run);
  if (args.thin_rows < 0) {
    throw InputError("--thin: " + std::to_string(args.thin_rows) +
                     " is invalid; expected a whole number >= 0");
  }
  const Plan plan = LoadPlan(args.plan_path);
  if (!(args.relaxed_share > 0.0 && args.relaxed_share < 1.0)) {
    throw InputError("--relax: " + FlagNumber(args.relaxed_share) +
                     " is invalid; expected a share above 0 and below 1 (0.8 = each "
                     "minimum lowered by 20 %)");
  }
  WarnUnreachable(plan);
  SimulationOptions sim_options;
  sim_options.relaxed_share = args.relaxed_share;
  const Simulator sim(plan, sim_options);
  TerminalProgress progress("runs", args.run.quiet);
  ReportContext ctx;
  // Runs are folded in chunk by chunk and discarded: memory does not grow
  // with --runs (docs/performance.md, "Memory").
  ForecastAccumulator acc(plan.matrix, sim.deadline_steps(), sim.horizon_steps(),
                          sim.relaxed_share());
  const ChunkFold fold = [&acc](uint64_t, const std::vector<std::vector<RunResult>>& c) {
    for (const RunResult& r : c[0]) acc.Add(r);
  };
  if (args.precision_weeks > 0) {
    const double q = ParseQuantile(args.precision_quantile);
    if (args.max_runs < mc.runs || args.max_runs > 10000000) {
      throw InputError("--max-runs: " + std::to_string(args.max_runs) +
                       " is invalid; expected a whole number from --runs (" +
                       std::to_string(mc.runs) + ") to 10000000");
    }
    const PrecisionResult p =
        RunToPrecision(sim, mc, q, args.precision_weeks, args.max_runs, &progress, fold);
    ctx.precision_used = true;
    ctx.precision_quantile = q;
    ctx.precision_target_weeks = args.precision_weeks;
    ctx.precision_width_weeks = p.ci_width_weeks;
    ctx.precision_met = p.target_met;
  } else if (args.precision_weeks < 0) {
    throw InputError("--precision: " + FlagNumber(args.precision_weeks) +
                     " is invalid; expected a width in weeks above 0");
  } else {
    RunMonteCarloInChunks({&sim}, mc, &progress, fold);
  }
  ForecastSummary summary = acc.Summary(mc.seed);
  RequirePlausible(summary, "the forecast");
  {
    // The weather's spread alone, beside the one with the site model's
    // uncertainty (only when the site model states one).
    MonteCarloOptions same = mc;
    same.runs = static_cast<int>(summary.runs);
    TerminalProgress exact("runs, site model exact", args.run.quiet);
    summary.site_exact = ForecastSiteModelExact(plan, sim_options, same, &exact);
  }
  if (!args.no_explain) {
    // The same runs with each process switched off (planner/hold_ups.h).
    MonteCarloOptions same = mc;
    same.runs = static_cast<int>(summary.runs);
    TerminalProgress explain("runs, one process off", args.run.quiet);
    summary.hold_ups = ForecastHoldUps(plan, sim_options, same, summary, &explain);
  }

  ctx.tool_version = FILLCAST_VERSION;
  ctx.threads = EffectiveThreads(mc.threads);
  ctx.thin_cell_rows = args.thin_rows;
  if (!args.json_path.empty()) {
    WriteOutputFile(args.json_path, FormatForecastJson(plan, summary, ctx),
                    args.run.force, PlanInputFiles(plan), "--json");
  }
  WriteReportFiles(args, plan, summary, ctx);
  const bool wrote_file = !args.json_path.empty() || !args.report_path.empty() ||
                          !args.csv_cells_path.empty() || !args.csv_curve_path.empty();
  if (!args.run.quiet || !wrote_file) {
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
  cmd->add_option(
         "--report", args->report_path,
         "Also write a self-contained HTML report to PATH (opens offline, prints "
         "to PDF)")
      ->type_name("PATH");
  cmd->add_option("--csv-cells", args->csv_cells_path,
                  "Also write the cell table as CSV to PATH")
      ->type_name("PATH");
  cmd->add_option("--csv-curve", args->csv_curve_path,
                  "Also write the completion-time curve as CSV to PATH")
      ->type_name("PATH");
  cmd->add_option("--thin", args->thin_rows,
                  "Rows in the table of cells least likely to be full (default 10)")
      ->type_name("N")
      ->check(WholeNumberIn(0, 1000000, "a whole number >= 0"));
  cmd->add_option("--relax", args->relaxed_share,
                  "Share of each cell's minimum for the 'what if it were lowered' column")
      ->type_name("S")
      ->check(NumberIn(0, 1,
                       "a share above 0 and below 1 (0.8 = each minimum lowered by "
                       "20 %)"))
      ->capture_default_str();
  cmd->add_option("--precision", args->precision_weeks,
                  "Add runs (doubling from --runs) until the 95 % interval of the chosen "
                  "quantile is at most WEEKS wide")
      ->type_name("WEEKS")
      ->check(NumberIn(0, 1e6, "a width in weeks above 0"));
  cmd->add_option("--precision-of", args->precision_quantile,
                  "Quantile for --precision: p50, p80 or p90")
      ->type_name("Q")
      ->capture_default_str();
  cmd->add_option("--max-runs", args->max_runs, "Cap on runs for --precision")
      ->type_name("N")
      ->check(WholeNumberIn(1, 10000000, "a whole number from --runs to 10000000"))
      ->capture_default_str();
  cmd->add_flag("--no-explain", args->no_explain,
               "Skip 'what holds the campaign up': the same runs once more per process "
               "(short-term high-wind stops, each episode, load-channel groups, "
               "turbine-side wakes) switched off");
  return [cmd, args]() { return cmd->parsed() ? RunForecast(*args) : -1; };
}

}  // namespace planner
