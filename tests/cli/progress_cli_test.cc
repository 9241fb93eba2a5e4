// End to end: the real fillcast binary keeps a campaign log of the demo's
// logged records and forecasts the rest (log add, progress, --history).
#include <gtest/gtest.h>

#include <string>

#include "cli/cli_runner.h"

namespace {

using fillcast_test::ReadJson;
using fillcast_test::RunFillcast;
using fillcast_test::SourcePath;
using fillcast_test::TempDir;

const std::string kPlan = SourcePath("demo-site/plan.yaml");

std::string DemoFiles() {
  return SourcePath("demo-site/campaign-log/2027-03.csv") + " " +
         SourcePath("demo-site/campaign-log/2027-04.csv") + " " +
         SourcePath("demo-site/campaign-log/2027-05.csv") + " " +
         SourcePath("demo-site/campaign-log/2027-06.csv");
}

TEST(ProgressCliTest, DemoLogForecastsTheRemainderAndKeepsItsHistory) {
  const auto dir = TempDir("progress-cli");
  const std::string log = (dir / "demo.campaign.sqlite").string();
  const auto add = RunFillcast("log add " + kPlan + " " + DemoFiles() + " --log " + log);
  ASSERT_EQ(add.exit_code, 0) << add.output;
  // Adding a file again adds nothing.
  const auto again =
      RunFillcast("log add " + kPlan + " " +
                  SourcePath("demo-site/campaign-log/2027-05.csv") + " --log " + log);
  ASSERT_EQ(again.exit_code, 0) << again.output;
  EXPECT_NE(again.output.find("new records                     0"), std::string::npos)
      << again.output;

  for (const char* as_of : {"2027-05-01", "2027-06-01"}) {
    const auto r = RunFillcast("progress " + kPlan + " --log " + log + " --as-of " +
                               as_of + " --runs 200 --threads 2 --quiet");
    ASSERT_EQ(r.exit_code, 0) << r.output;
  }
  const std::string json = (dir / "progress.json").string();
  const std::string report = (dir / "progress.html").string();
  const auto r = RunFillcast("progress " + kPlan + " --log " + log +
                             " --runs 300 --json " + json + " --report " + report);
  ASSERT_EQ(r.exit_code, 0) << r.output;
  EXPECT_NE(r.output.find("As of:       2027-07-01 00:00 UTC"), std::string::npos)
      << r.output;  // the day after the last logged record (2027-06-30 23:50)
  EXPECT_NE(r.output.find("What extending buys"), std::string::npos);
  EXPECT_NE(r.output.find("A forecast is an estimate, not a promise"), std::string::npos);

  const nlohmann::json j = ReadJson(json);
  EXPECT_EQ(j["kind"], "progress");
  EXPECT_EQ(j["as_of"], "2027-07-01");
  EXPECT_EQ(j["runs"], 300);
  for (const char* key :
       {"plan", "log", "logged", "complete", "completed_at", "p_complete_by_planned_end",
        "completion_weeks", "completion_dates", "remaining_weeks", "extensions",
        "thin_at_longest_extension", "cells", "notes", "cautions"}) {
    EXPECT_TRUE(j.contains(key)) << key;
  }
  ASSERT_EQ(j["extensions"].size(), 4u);
  EXPECT_EQ(j["extensions"][3]["weeks"], 26);
  EXPECT_EQ(j["extensions"][0]["end"], "2028-03-29");  // planned end 2028-03-01 + 28 days
  EXPECT_EQ(j["logged"]["last_record"], "2027-06-30 23:50");
  // Logged counts are those of the cells, whatever the forecast.
  long logged_total = 0;
  for (const auto& c : j["cells"]) logged_total += c["logged"].get<long>();
  EXPECT_EQ(logged_total, j["logged"]["counted_records"].get<long>() +
                              j["logged"]["counted_events"].get<long>());

  const std::string html = fillcast_test::ReadFile(report);
  EXPECT_NE(html.find("id=\"progress\""), std::string::npos);
  EXPECT_NE(html.find("Forecast end by as-of date"), std::string::npos);  // history chart

  const auto h = RunFillcast("progress " + kPlan + " --log " + log + " --history");
  ASSERT_EQ(h.exit_code, 0) << h.output;
  const size_t may = h.output.find("2027-05-01"), june = h.output.find("2027-06-01"),
               july = h.output.find("2027-07-01");
  EXPECT_NE(may, std::string::npos) << h.output;
  EXPECT_LT(may, june);
  EXPECT_LT(june, july);
  std::filesystem::remove_all(dir);
}

TEST(ProgressCliTest, ConflictsAreListedAndExitWithThree) {
  const auto dir = TempDir("progress-conflict");
  const auto a = dir / "a.csv";
  const auto b = dir / "b.csv";
  std::ofstream(a) << "timestamp,speed_ms,speed_std_ms,direction_deg,state,quality\n"
                      "2027-03-01 00:00,7.4,0.8,236,production,ok\n";
  std::ofstream(b) << "timestamp,speed_ms,speed_std_ms,direction_deg,state,quality\n"
                      "2027-03-01 00:00,7.6,0.8,236,production,ok\n"
                      "2027-03-01 00:10,7.6,0.8,236,production,ok\n";
  const std::string log = " --log " + (dir / "log.sqlite").string();
  ASSERT_EQ(RunFillcast("log add " + kPlan + " " + a.string() + log).exit_code, 0);
  const auto r = RunFillcast("log add " + kPlan + " " + b.string() + log);
  EXPECT_EQ(r.exit_code, 3) << r.output;
  EXPECT_NE(r.output.find("conflict: " + b.string() +
                          ":2: 2027-03-01 00:00 is already logged (from " + a.string() +
                          ":2) with other values: speed_ms 7.4 logged, 7.6 here; the "
                          "logged record is kept"),
            std::string::npos)
      << r.output;
  EXPECT_NE(r.output.find("new records                     1"), std::string::npos);
  std::filesystem::remove_all(dir);
}

TEST(ProgressCliTest, BadInputNamesTheProblem) {
  const auto dir = TempDir("progress-bad");
  const std::string log = (dir / "none.sqlite").string();
  auto r = RunFillcast("progress " + kPlan + " --log " + log);
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_EQ(r.output, "fillcast: error: " + log +
                          ": no campaign log here; add logged records first with "
                          "'fillcast log add PLAN RECORDS.csv' (or name the log with "
                          "--log)\n");
  const std::string csv = SourcePath("demo-site/campaign-log/2027-03.csv");
  ASSERT_EQ(RunFillcast("log add " + kPlan + " " + csv + " --log " + log).exit_code, 0);
  r = RunFillcast("progress " + kPlan + " --log " + log + " --as-of 2027-02-30");
  EXPECT_EQ(r.output,
            "fillcast: error: --as-of: '2027-02-30' is not a date; expected "
            "YYYY-MM-DD (a real calendar date in the years 1900 to 2200)\n");
  r = RunFillcast("progress " + kPlan + " --log " + log + " --as-of 2031-01-01");
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_EQ(r.output,
            "fillcast: error: --as-of: 2031-01-01 is beyond the plan's "
            "horizon; valid: a date from 2027-03-01 to 2030-02-24\n");
  r = RunFillcast("log add " + kPlan + " " + csv + " --log " + log + " --stamp middle");
  EXPECT_EQ(r.output,
            "fillcast: error: --stamp: 'middle' is invalid; expected start (the "
            "timestamp marks the start of the 10-minute period) or end\n");
  std::filesystem::remove_all(dir);
}

}  // namespace
