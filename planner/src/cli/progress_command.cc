// fillcast progress PLAN.yaml: the capture matrix as logged so far and a
// forecast of the remainder from the as-of date; each run is stored in the
// campaign log, and --history shows how the forecast moved.
#include <CLI/CLI.hpp>
#include <fstream>
#include <iostream>
#include <iterator>
#include <memory>

#include "cli/clock.h"
#include "cli/commands.h"
#include "cli/output_file.h"
#include "cli/plan_warnings.h"
#include "cli/run_options.h"
#include "cli/terminal_progress.h"
#include "planner/campaign_log.h"
#include "planner/error.h"
#include "planner/logged_counts.h"
#include "planner/plan_reader.h"
#include "planner/progress_forecast.h"
#include "planner/progress_report.h"
#include "planner/report_files.h"
#include "report/report_numbers.h"

namespace planner {
namespace {

struct ProgressArgs {
  std::string plan_path;
  std::string log_path;  // --log; "" = beside the plan
  std::string as_of;     // --as-of; "" = the day after the last logged record
  RunOptionArgs run;
  std::string json_path;
  std::string report_path;
  bool history = false;
  bool no_store = false;
  int thin_rows = 10;
};

// FNV-1a, 64 bit (a published, stable hash: the digest must not change
// between builds or machines).
class Digest {
 public:
  void Add(const void* data, size_t n) {
    const unsigned char* p = static_cast<const unsigned char*>(data);
    for (size_t i = 0; i < n; ++i) h_ = (h_ ^ p[i]) * 0x100000001b3ULL;
  }
  void Add(const std::string& s) {
    Add(s.data(), s.size());
    Add("\x1f", 1);
  }
  std::string Hex() const {
    return StringPrintf("%016llx", static_cast<unsigned long long>(h_));
  }

 private:
  uint64_t h_ = 0xcbf29ce484222325ULL;
};

std::string FileBytes(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  return std::string((std::istreambuf_iterator<char>(in)),
                     std::istreambuf_iterator<char>());
}

// Plan, site model and the records the forecast used.
std::string InputsDigest(const Plan& plan, const std::vector<LoggedRecord>& records,
                         const Date& as_of) {
  Digest d;
  d.Add(FileBytes(plan.source_file));
  d.Add(FileBytes(plan.site_file));
  d.Add(FormatDate(as_of));
  const int64_t from_s = DateTime(plan.start), to_s = DateTime(as_of);
  for (const LoggedRecord& r : records) {
    if (r.time_s < from_s || r.time_s >= to_s) continue;
    d.Add(StringPrintf("%lld %.17g %.17g %.17g %d %d ", static_cast<long long>(r.time_s),
                       r.speed_ms, r.speed_std_ms, r.direction_deg,
                       static_cast<int>(r.state), r.quality_ok ? 1 : 0) +
          r.event);
  }
  return d.Hex();
}

Date AsOfDate(const ProgressArgs& args, const std::vector<LoggedRecord>& records,
              const std::string& log_path) {
  if (!args.as_of.empty()) {
    const std::optional<Date> d = ParseDate(args.as_of);
    if (!d) {
      throw InputError("--as-of: '" + args.as_of +
                       "' is not a date; expected YYYY-MM-DD (" + kDateRangeText + ")");
    }
    return *d;
  }
  if (records.empty()) {
    throw InputError(log_path +
                     ": the campaign log holds no records, so there is no default "
                     "as-of date; add records with 'fillcast log add' or give --as-of");
  }
  return AddDays(CivilFromDays(records.back().time_s / 86400), 1);
}

StoredProgress ToStored(const Plan& plan, const ProgressSummary& s,
                        const std::string& digest, const std::string& json) {
  StoredProgress p;
  p.as_of = FormatDate(s.as_of);
  p.made_at_utc = NowUtc();
  p.inputs_digest = digest;
  p.records_used = s.logged.records_used;
  p.runs = s.forecast.runs;
  p.seed = s.forecast.seed;
  p.complete = s.already_complete;
  p.p_by_planned_end = s.p_by_planned_end;
  p.planned_end = FormatDate(plan.deadline);
  auto date = [&plan](const std::optional<double>& w) {
    return w ? std::optional<std::string>(FormatDate(DoneByDate(plan.start, *w)))
             : std::nullopt;
  };
  p.p50_weeks = s.forecast.p50.value;
  p.p80_weeks = s.forecast.p80.value;
  p.p90_weeks = s.forecast.p90.value;
  if (s.already_complete && s.logged.complete_time_s) {
    const double w =
        static_cast<double>(*s.logged.complete_time_s - DateTime(plan.start)) /
        (7.0 * 86400.0);
    p.p50_weeks = p.p80_weeks = p.p90_weeks = w;
  }
  p.p50_date = date(p.p50_weeks);
  p.p80_date = date(p.p80_weeks);
  p.p90_date = date(p.p90_weeks);
  p.result_json = json;
  return p;
}

int RunHistory(const ProgressArgs& args, const Plan& plan, const CampaignLog& log,
               ProgressReportContext ctx) {
  if (!args.report_path.empty()) {
    throw InputError(
        "--report: not with --history; the report of a progress run "
        "(without --history) charts the stored history");
  }
  const std::vector<StoredProgress> history = log.History();
  const std::vector<std::string> inputs = {plan.source_file, plan.site_file, log.path()};
  if (!args.json_path.empty()) {
    WriteOutputFile(args.json_path, FormatProgressHistoryJson(plan, history, ctx),
                    args.run.force, inputs, "--json");
  }
  if (!args.run.quiet || args.json_path.empty()) {
    std::cout << FormatProgressHistoryText(plan, history, ctx);
  }
  return kExitOk;
}

void WriteFiles(const ProgressArgs& args, const Plan& plan, const ProgressSummary& s,
                const ProgressReportContext& ctx, const CampaignLog& log,
                const std::string& json, const Date& as_of) {
  const std::vector<std::string> inputs = {plan.source_file, plan.site_file, log.path()};
  if (!args.json_path.empty()) {
    WriteOutputFile(args.json_path, json, args.run.force, inputs, "--json");
  }
  if (args.report_path.empty()) return;
  ProgressHtml progress;
  progress.summary = &s;
  progress.history = log.History();
  progress.log_path = log.path();
  HtmlReportInput in;
  in.plan = &plan;
  in.forecast = &s.forecast;
  in.progress = &progress;
  in.context.tool_version = FILLCAST_VERSION;
  in.context.threads = ctx.threads;
  in.context.thin_cell_rows = args.thin_rows;
  in.command_line = "fillcast progress " + ShellWord(args.plan_path) + " --log " +
                    ShellWord(log.path()) + " --as-of " + FormatDate(as_of) + " --runs " +
                    std::to_string(args.run.runs) + " --seed " +
                    std::to_string(args.run.seed);
  WriteOutputFile(args.report_path, FormatHtmlReport(in), args.run.force, inputs,
                  "--report");
}

int RunProgress(const ProgressArgs& args) {
  const MonteCarloOptions mc = ValidateRunOptions(args.run);
  if (args.thin_rows < 0) {
    throw InputError("--thin: " + std::to_string(args.thin_rows) +
                     " is invalid; expected a whole number >= 0");
  }
  const Plan plan = LoadPlan(args.plan_path);
  WarnUnreachable(plan);
  const std::string log_path =
      args.log_path.empty() ? CampaignLog::DefaultPath(args.plan_path) : args.log_path;
  CampaignLog log(log_path, false);
  ProgressReportContext ctx;
  ctx.tool_version = FILLCAST_VERSION;
  ctx.threads = EffectiveThreads(mc.threads);
  ctx.log_path = log_path;
  ctx.log_records = log.RecordCount();
  ctx.thin_cell_rows = args.thin_rows;
  if (args.history) return RunHistory(args, plan, log, ctx);

  const std::vector<LoggedRecord> records = log.Records();
  const Date as_of = AsOfDate(args, records, log_path);
  CheckAsOfDate(plan, as_of);
  const LoggedCounts logged = CountLoggedRecords(plan, records, as_of);
  TerminalProgress progress("runs", args.run.quiet);
  const ProgressSummary s = ForecastProgress(plan, logged, as_of, mc, &progress);
  RequirePlausible(s.forecast, "the forecast of the rest of the campaign");
  const std::string json = FormatProgressJson(plan, s, ctx);
  std::string stored_note;
  if (!args.no_store) {
    const std::string digest = InputsDigest(plan, records, as_of);
    const bool replaced = log.StoreProgress(ToStored(plan, s, digest, json));
    const int64_t others = log.OtherResultsFor(FormatDate(as_of), digest);
    stored_note =
        "\nStored in the campaign log as the forecast of " + FormatDate(as_of) +
        (replaced ? ", replacing the earlier one made from the same inputs" : "") +
        (others > 0 ? "; " + std::to_string(others) +
                          " stored for this date from other inputs are kept"
                    : "") +
        ". See them all with --history.\n";
  }
  WriteFiles(args, plan, s, ctx, log, json, as_of);
  const bool wrote_file = !args.json_path.empty() || !args.report_path.empty();
  if (!args.run.quiet || !wrote_file) {
    std::cout << FormatProgressText(plan, s, ctx) << stored_note;
  }
  return kExitOk;
}

}  // namespace

CommandAction AddProgressCommand(CLI::App& app) {
  auto args = std::make_shared<ProgressArgs>();
  CLI::App* cmd = app.add_subcommand(
      "progress",
      "The capture matrix as logged so far, and a forecast of the remainder from the "
      "as-of date");
  cmd->add_option("plan", args->plan_path, "Campaign plan (YAML, see docs/plan.md)")
      ->required();
  cmd->add_option("--log", args->log_path,
                  "Campaign log file (default: PLAN-FOLDER/PLAN-STEM.campaign.sqlite)")
      ->type_name("PATH");
  cmd->add_option("--as-of", args->as_of,
                  "Count records before 00:00 UTC of DATE and forecast from it (default: "
                  "the day after the last logged record)")
      ->type_name("DATE");
  AddRunOptions(cmd, &args->run);
  cmd->add_option("--json", args->json_path, "Also write the result as JSON to PATH")
      ->type_name("PATH");
  cmd->add_option("--report", args->report_path,
                  "Also write a self-contained HTML report to PATH, with the stored "
                  "history charted")
      ->type_name("PATH");
  cmd->add_flag("--history", args->history,
                "Show the stored progress forecasts by as-of date instead (no new run)");
  cmd->add_flag("--no-store", args->no_store,
                "Do not store this forecast in the campaign log");
  cmd->add_option("--thin", args->thin_rows,
                  "Rows in the table of cells thin even when extended (default 10)")
      ->type_name("N")
      ->check(WholeNumberIn(0, 1000000, "a whole number >= 0"));
  return [cmd, args]() { return cmd->parsed() ? RunProgress(*args) : -1; };
}

}  // namespace planner
