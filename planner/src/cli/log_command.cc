// fillcast log add PLAN.yaml RECORDS.csv...: add the campaign's logged
// 10-minute statistics to its campaign log (planner/campaign_log.h).
#include <CLI/CLI.hpp>
#include <cmath>
#include <iostream>
#include <memory>

#include "cli/clock.h"
#include "cli/commands.h"
#include "cli/run_options.h"
#include "io/met_csv_reader.h"
#include "io/records_csv_reader.h"
#include "planner/campaign_log.h"
#include "planner/error.h"
#include "planner/plan_reader.h"
#include "report/report_numbers.h"

namespace planner {
namespace {

struct LogAddArgs {
  std::string plan_path;
  std::vector<std::string> files;
  std::string log_path;  // --log; "" = beside the plan
  RecordsCsvOptions csv;
  std::string stamp = "start";
};

std::string Grouped(int64_t n) { return GroupedWhole(static_cast<double>(n)); }

void CheckOptions(const LogAddArgs& args) {
  if (args.stamp != "start" && args.stamp != "end") {
    throw InputError("--stamp: '" + args.stamp +
                     "' is invalid; expected start (the timestamp marks the start of the "
                     "10-minute period) or end");
  }
  const double minutes = args.csv.utc_offset_h * 60.0;
  if (!(args.csv.utc_offset_h >= -14 && args.csv.utc_offset_h <= 14) ||
      std::fmod(minutes, 10.0) != 0.0) {
    throw InputError("--utc-offset: " + StringPrintf("%g", args.csv.utc_offset_h) +
                     " is invalid; expected hours from -14 to 14 in steps of 10 minutes "
                     "(e.g. 1, -5, 5.5)");
  }
}

void PrintReport(const IngestReport& r) {
  std::cout << "  " << r.file << "\n";
  std::cout << StringPrintf("    %-22s %10s\n", "rows read", Grouped(r.rows).c_str());
  std::cout << StringPrintf("    %-22s %10s\n", "new records", Grouped(r.added).c_str());
  std::cout << StringPrintf("    %-22s %10s\n", "already logged",
                            Grouped(r.already_logged).c_str());
  std::cout << StringPrintf("    %-22s %10s\n", "conflicting",
                            Grouped(r.conflicting).c_str());
  for (const IngestConflict& c : r.conflicts) {
    std::cout << "    conflict: " << c.where << ": " << FormatTimestamp(c.time_s, true)
              << " is already logged (from " << c.logged_from
              << ") with other values: " << c.difference
              << "; the logged record is kept\n";
  }
  if (r.conflicting > static_cast<int64_t>(r.conflicts.size())) {
    std::cout << "    ... and "
              << r.conflicting - static_cast<int64_t>(r.conflicts.size())
              << " more conflicts\n";
  }
}

int RunLogAdd(LogAddArgs args) {
  CheckOptions(args);
  args.csv.stamp_at_end = args.stamp == "end";
  const Plan plan = LoadPlan(args.plan_path);
  const std::string log_path =
      args.log_path.empty() ? CampaignLog::DefaultPath(args.plan_path) : args.log_path;
  // Read every file first: a problem in any of them stops before anything is
  // written.
  std::vector<RecordsFile> files;
  for (const std::string& f : args.files) files.push_back(LoadRecordsCsv(f, args.csv));
  CampaignLog log(log_path, true, plan.name);
  std::cout << "fillcast " << FILLCAST_VERSION << " - campaign log " << log_path << "\n";
  int64_t conflicts = 0;
  IngestOptions options;
  options.now_utc = NowUtc();
  // One transaction for the whole call: every file is added, or none.
  std::vector<CampaignLog::IngestInput> inputs;
  for (const RecordsFile& f : files) inputs.push_back({f.file, &f.rows});
  for (const IngestReport& r : log.IngestAll(inputs, options)) {
    PrintReport(r);
    conflicts += r.conflicting;
  }
  const std::vector<LoggedRecord> records = log.Records();
  std::cout << StringPrintf("  %-24s %10s", "records in the log",
                            Grouped(static_cast<int64_t>(records.size())).c_str());
  if (!records.empty()) {
    std::cout << "  (" << FormatTimestamp(records.front().time_s, true) << " to "
              << FormatTimestamp(records.back().time_s, true) << " UTC)";
  }
  std::cout << "\n";
  if (conflicts > 0) {
    std::cerr << "fillcast: warning: " << conflicts
              << " conflicting duplicate records were not added (listed above); the "
                 "logged values were kept\n";
    return kExitConflicts;
  }
  return kExitOk;
}

}  // namespace

CommandAction AddLogCommand(CLI::App& app) {
  auto args = std::make_shared<LogAddArgs>();
  CLI::App* log = app.add_subcommand(
      "log", "Keep the campaign log: the 10-minute records the campaign has logged");
  log->require_subcommand(1);
  CLI::App* add = log->add_subcommand(
      "add",
      "Add logged 10-minute records (CSV) to the campaign log beside the plan; "
      "records already logged are not added twice");
  add->add_option("plan", args->plan_path, "Campaign plan (YAML, see docs/plan.md)")
      ->required();
  add->add_option("records", args->files,
                  "CSV files of logged 10-minute records (docs/progress.md)")
      ->required();
  add->add_option("--log", args->log_path,
                  "Campaign log file (default: PLAN-FOLDER/PLAN-STEM.campaign.sqlite)")
      ->type_name("PATH");
  RecordsCsvOptions& o = args->csv;
  add->add_option("--time", o.time_column, "Timestamp column (default: a usual name)")
      ->type_name("NAME");
  add->add_option("--speed", o.speed_column, "Mean wind speed column, m/s")
      ->type_name("NAME");
  add->add_option("--std", o.std_column, "Standard deviation of the speed column, m/s")
      ->type_name("NAME");
  add->add_option("--direction", o.direction_column, "Wind direction column, degrees")
      ->type_name("NAME");
  add->add_option("--state", o.state_column,
                  "Operating state column: production, parked, reduced or outage")
      ->type_name("NAME");
  add->add_option("--quality", o.quality_column,
                  "Data-quality flag column: ok/1/true or rejected/0/false")
      ->type_name("NAME");
  add->add_option("--event", o.event_column,
                  "Event column (optional): start_up, normal_stop or a manual test")
      ->type_name("NAME");
  add->add_option("--channels-down", o.channels_down_column,
                  "Load-channel groups down column (optional): names separated by ';'")
      ->type_name("NAME");
  add->add_option("--stamp", args->stamp,
                  "Timestamps mark the start or the end of the 10-minute period")
      ->type_name("start|end")
      ->capture_default_str();
  add->add_option("--utc-offset", o.utc_offset_h,
                  "Timestamps are written in UTC + H hours (converted to UTC)")
      ->type_name("H")
      ->check(NumberIn(-14, 14,
                       "hours from -14 to 14 in steps of 10 minutes (e.g. 1, -5, 5.5)"))
      ->capture_default_str();
  return [add, args]() { return add->parsed() ? RunLogAdd(*args) : -1; };
}

}  // namespace planner
