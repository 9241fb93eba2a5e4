// fillcast compare PLAN PLAN...: several sites or scenarios on the same random
// numbers, side by side, ranked, with the paired difference of the best two.
#include <CLI/CLI.hpp>
#include <iostream>
#include <memory>
#include <set>

#include "cli/commands.h"
#include "cli/output_file.h"
#include "cli/plan_warnings.h"
#include "cli/run_options.h"
#include "cli/terminal_progress.h"
#include "planner/decision_report.h"
#include "planner/error.h"
#include "planner/forecast_accumulator.h"
#include "planner/monte_carlo.h"
#include "planner/plan_reader.h"
#include "planner/report_files.h"
#include "planner/simulation.h"

namespace planner {
namespace {

struct CompareArgs {
  std::vector<std::string> plan_paths;
  RunOptionArgs run;
  std::string rank_by = "p80";
  std::string json_path;
  std::string report_path;
};

RankBy ParseRankBy(const std::string& text) {
  if (text == "p50") return RankBy::kP50;
  if (text == "p80") return RankBy::kP80;
  if (text == "p90") return RankBy::kP90;
  if (text == "cost") return RankBy::kExpectedCost;
  throw InputError("--rank-by: '" + text +
                   "' is invalid; expected p50, p80, p90 or cost");
}

int RunCompare(const CompareArgs& args) {
  const MonteCarloOptions mc = ValidateRunOptions(args.run);
  const RankBy rank_by = ParseRankBy(args.rank_by);
  if (args.plan_paths.size() < 2) {
    throw InputError("compare: " + std::to_string(args.plan_paths.size()) +
                     " plan given; expected two or more plans to compare");
  }
  std::vector<Plan> plans;
  std::set<std::string> names;
  bool clash = false;
  for (const std::string& path : args.plan_paths) {
    plans.push_back(LoadPlan(path));
    WarnUnreachable(plans.back());
    clash = clash || !names.insert(plans.back().name).second;
  }
  // All scenarios run chunk by chunk on the same run indices, each chunk
  // folded into the summaries and the paired tally and then discarded, so
  // memory does not grow with --runs.
  std::vector<std::unique_ptr<Simulator>> sims;
  std::vector<const Simulator*> sim_list;
  std::vector<ForecastAccumulator> accs;
  std::vector<CostModel> costs;
  for (const Plan& plan : plans) {
    sims.push_back(std::make_unique<Simulator>(plan));
    sim_list.push_back(sims.back().get());
    accs.emplace_back(plan.matrix, sims.back()->deadline_steps(),
                      sims.back()->horizon_steps(), sims.back()->relaxed_share());
    costs.push_back(plan.cost);
  }
  ComparisonTally tally(costs);
  TerminalProgress progress("runs of " + std::to_string(plans.size()) + " scenarios",
                            args.run.quiet);
  RunMonteCarloInChunks(sim_list, mc, &progress,
                        [&](uint64_t, const std::vector<std::vector<RunResult>>& chunk) {
                          for (size_t i = 0; i < chunk.size(); ++i) {
                            for (const RunResult& r : chunk[i]) accs[i].Add(r);
                          }
                          tally.Add(chunk);
                        });
  std::vector<ScenarioResult> scenarios;
  std::vector<std::string> inputs;
  for (size_t i = 0; i < plans.size(); ++i) {
    ScenarioResult r;
    r.name = clash ? plans[i].name + " (" + args.plan_paths[i] + ")" : plans[i].name;
    r.file = args.plan_paths[i];
    r.cost = plans[i].cost;
    for (const Cell& c : plans[i].matrix.cells) {
      r.cell_labels.push_back(CellLabel(plans[i].matrix, c));
    }
    r.summary = accs[i].Summary(mc.seed);
    RequirePlausible(r.summary, "the forecast of " + args.plan_paths[i]);
    scenarios.push_back(std::move(r));
    for (const std::string& f : PlanInputFiles(plans[i])) inputs.push_back(f);
  }
  const Comparison comparison = RankScenarios(scenarios, tally, rank_by);
  ReportContext ctx;
  ctx.tool_version = FILLCAST_VERSION;
  ctx.threads = EffectiveThreads(mc.threads);
  if (!args.json_path.empty()) {
    WriteOutputFile(args.json_path, FormatComparisonJson(comparison, ctx), args.run.force,
                    inputs, "--json");
  }
  if (!args.report_path.empty()) {
    // The report leads with the best-ranked scenario and adds the comparison.
    const ScenarioResult& best = comparison.ranked.front();
    size_t index = 0;
    while (args.plan_paths[index] != best.file) ++index;
    HtmlReportInput in;
    in.plan = &plans[index];
    in.forecast = &best.summary;
    in.comparison = &comparison;
    in.context = ctx;
    in.command_line = "fillcast compare ... --runs " + std::to_string(mc.runs) +
                      " --seed " + std::to_string(mc.seed);
    WriteOutputFile(args.report_path, FormatHtmlReport(in), args.run.force, inputs,
                    "--report");
  }
  if (!args.run.quiet || (args.json_path.empty() && args.report_path.empty())) {
    std::cout << FormatComparisonText(comparison, ctx);
  }
  return kExitOk;
}

}  // namespace

CommandAction AddCompareCommand(CLI::App& app) {
  auto args = std::make_shared<CompareArgs>();
  CLI::App* cmd = app.add_subcommand(
      "compare",
      "Compare sites or scenarios on the same random numbers: duration, risk, cost");
  cmd->add_option("plans", args->plan_paths, "Two or more plans (YAML)")->required();
  AddRunOptions(cmd, &args->run);
  cmd->add_option("--rank-by", args->rank_by,
                  "Rank by p50, p80, p90 or cost (expected cost) (default p80)")
      ->type_name("KEY");
  cmd->add_option("--json", args->json_path, "Also write the comparison as JSON to PATH")
      ->type_name("PATH");
  cmd->add_option("--report", args->report_path,
                  "Also write an HTML report (best scenario + comparison) to PATH")
      ->type_name("PATH");
  return [cmd, args]() { return cmd->parsed() ? RunCompare(*args) : -1; };
}

}  // namespace planner
