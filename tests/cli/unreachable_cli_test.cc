// `fillcast forecast` on a plan with a required cell that can never fill: the
// real program warns before simulating, says plainly in the text which cell
// held every run up, and writes the same in the JSON (docs/output.md, "Cells
// that can never fill").
#include <gtest/gtest.h>

#include <filesystem>
#include <fstream>
#include <nlohmann/json.hpp>
#include <string>

#include "cli/cli_runner.h"

namespace fillcast_test {
namespace {

TEST(UnreachableCliTest, ForecastSaysWhichCellCanNeverFillAndHeldEveryRunUp) {
  const std::filesystem::path dir = TempDir("unreachable");
  const std::filesystem::path plan = dir / "plan.yaml";
  std::ofstream(plan)
      << "name: Parked cell at mid-range wind\n"
         "site_model: " +
             SourcePath("site-models/estuary-flats.yaml") +
             "\n"
             "campaign: {start: 2027-01-01, deadline: 2027-02-01, "
             "horizon_weeks: 10}\n"
             "turbine: {name: T1, cut_in_ms: 3, rated_ms: 11, cut_out_ms: "
             "25, restart_ms: 22}\n"
             "capture_matrix:\n"
             "  production: {wind_bins_ms: [4, 6], min_records: 5}\n"
             "  parked: {wind_bins_ms: [[10, 12]], min_records: 5}\n";
  const std::filesystem::path json = dir / "result.json";
  const std::filesystem::path html = dir / "report.html";
  const Outcome f =
      RunFillcast("forecast " + plan.string() + " --runs 20 --json " + json.string() +
                  " --report " + html.string() + " --force");
  ASSERT_EQ(f.exit_code, 0) << f.output;
  const std::string reason =
      "Cell parked 10-12 m/s can never fill: a record is parked only below cut-in "
      "(3 m/s), from the restart speed (22 m/s) up after a high-wind stop, while a "
      "curtailment stop rule applies, during a park test (manual_tests.parking), or "
      "during a turbine outage with "
      "outages.parked_counts_during_outage: true; none of these can happen at 10-12 "
      "m/s, where an available turbine produces.";
  // The warning comes before the simulation, on standard error.
  const std::string warning =
      "warning: " + plan.string() + ": 1 required cell can never fill:\n  " + reason;
  EXPECT_EQ(f.output.rfind(warning, 0), 0u) << f.output;
  EXPECT_NE(f.output.find("Cells that can never fill (found in the plan, before "
                          "simulating)"),
            std::string::npos);
  // The text wraps long sentences, so compare with line breaks removed.
  std::string flat;
  for (char c : f.output) flat += c == '\n' ? ' ' : c;
  std::string squeezed;
  for (char c : flat) {
    if (!(c == ' ' && !squeezed.empty() && squeezed.back() == ' ')) squeezed += c;
  }
  EXPECT_NE(squeezed.find("No run completed within the 10-week horizon. Required cells "
                          "still short of their minimum at the horizon: parked 10-12 m/s "
                          "(in every run)."),
            std::string::npos)
      << f.output;

  const nlohmann::json j = ReadJson(json);
  ASSERT_EQ(j["unreachable_cells"].size(), 1u);
  EXPECT_EQ(j["unreachable_cells"][0]["cell"], 1);  // after the production cell
  EXPECT_EQ(j["unreachable_cells"][0]["label"], "parked 10-12 m/s");
  EXPECT_EQ(j["unreachable_cells"][0]["required"], true);
  EXPECT_EQ(j["unreachable_cells"][0]["reason"], reason);
  EXPECT_EQ(j["p_incomplete_at_horizon"], 1.0);
  EXPECT_EQ(j["cells"][1]["p_not_full_at_end"], 1.0);
  EXPECT_NE(
      ReadFile(html).find("<li><b>Can never fill:</b> Cell parked 10-12 m/s can never "
                          "fill: a record is parked only below cut-in"),
      std::string::npos);
  // The production cells fill in some runs: the check is about one cell only.
  EXPECT_GT(j["cells"][0]["p_full_by_deadline"].get<double>(), 0.0);

  // compare and start-sweep give the same warning before they simulate.
  for (const std::string& command :
       {"compare " + plan.string() + " " + plan.string() + " --runs 10",
        "start-sweep " + plan.string() + " --runs 10 --months 2"}) {
    const Outcome o = RunFillcast(command);
    EXPECT_EQ(o.exit_code, 0) << command << "\n" << o.output;
    EXPECT_EQ(o.output.rfind(warning, 0), 0u) << command << "\n" << o.output;
  }
  std::filesystem::remove_all(dir);
}

}  // namespace
}  // namespace fillcast_test
