// End-to-end: fillcast fit-site on the real binary, with the open Irish
// daily-wind data (tests/data/irish-daily-wind, source in its README).
#include <gtest/gtest.h>

#include <fstream>
#include <sstream>
#include <string>

#include "cli/cli_runner.h"
#include "planner/plan_reader.h"

namespace {

using fillcast_test::Outcome;
using fillcast_test::RunFillcast;
using fillcast_test::SourcePath;

const std::string kData =
    SourcePath("tests/data/irish-daily-wind/daily_mean_wind_knots.csv");

bool Has(const std::string& text, const std::string& part) {
  return text.find(part) != std::string::npos;
}

// Malin Head: published mean 8.03 m/s (stations.csv of the data set).
TEST(FitSiteCliTest, FitsAStationAndWritesAModelTheReaderLoads) {
  const auto dir = fillcast_test::TempDir("fit-site");
  const std::string out = (dir / "malin.yaml").string();
  const Outcome o = RunFillcast("fit-site " + kData + " --speed MAL -o " + out);
  ASSERT_EQ(o.exit_code, 0) << o.output;
  EXPECT_TRUE(Has(o.output, "Site model 'malin' fitted and written to " + out))
      << o.output;
  EXPECT_TRUE(Has(o.output,
                  "  units      knots (from the file name "
                  "'daily_mean_wind_knots.csv'), converted with 1 kn = 1852/3600 m/s"))
      << o.output;
  EXPECT_TRUE(
      Has(o.output, "  step       1 day (the most common spacing of the timestamps)"));
  EXPECT_TRUE(Has(o.output, "  read                                     6574\n"));
  EXPECT_TRUE(Has(o.output, "Mean speed: 8.03 m/s measured (all kept records)"))
      << o.output;
  EXPECT_TRUE(
      Has(o.output, "Hour-of-day factors: not fitted (step of a day or more); all 1"));
  EXPECT_TRUE(
      Has(o.output, "A fitted site model is an estimate from the measured period"));
  const planner::SiteModel site = planner::LoadSiteModel(out);
  EXPECT_EQ(site.name, "malin");
  ASSERT_EQ(site.sectors.size(), 1u);
  EXPECT_GT(site.wind_persistence_h, 0.0);
  std::ifstream in(out);
  std::string first;
  std::getline(in, first);
  EXPECT_EQ(first.rfind("# generator=fillcast", 0), 0u);
  // A second fit may replace the file fillcast wrote, without --force.
  EXPECT_EQ(
      RunFillcast("fit-site " + kData + " --speed MAL --name Malin -o " + out).exit_code,
      0);
  EXPECT_EQ(planner::LoadSiteModel(out).name, "Malin");
  std::filesystem::remove_all(dir);
}

// A small CSV cut from the real data (Roche's Point, first 60 days) with
// faults put in: a duplicate, a row out of order, a non-numeric and a
// negative speed. The report counts each.
TEST(FitSiteCliTest, ReportsDroppedRowsByReason) {
  const auto dir = fillcast_test::TempDir("fit-site-rows");
  std::ifstream in(kData);
  std::string line;
  std::getline(in, line);
  std::ostringstream csv;
  csv << "date,speed_kn\n";
  for (int day = 0; day < 60 && std::getline(in, line); ++day) {
    std::stringstream cells(line);
    std::string date, rpt;
    std::getline(cells, date, ',');
    std::getline(cells, rpt, ',');
    if (day == 10)
      csv << date << ",n.a.\n";
    else if (day == 11)
      csv << date << ",-1\n";
    else
      csv << date << "," << rpt << "\n";
    if (day == 20) csv << date << "," << rpt << "\n";    // identical duplicate
    if (day == 30) csv << "1960-12-31," << rpt << "\n";  // out of order
  }
  const std::string data = (dir / "rpt.csv").string();
  std::ofstream(data) << csv.str();
  const Outcome o =
      RunFillcast("fit-site " + data + " -o " + (dir / "rpt.yaml").string());
  ASSERT_EQ(o.exit_code, 0) << o.output;
  EXPECT_TRUE(Has(o.output, "  read                                       62\n"))
      << o.output;
  EXPECT_TRUE(Has(o.output, "  kept                                       58\n"));
  EXPECT_TRUE(Has(o.output, "  dropped                                     4\n"));
  EXPECT_TRUE(Has(o.output, "    duplicate timestamp, same values          1\n"));
  EXPECT_TRUE(Has(o.output, "    timestamp out of order                    1\n"));
  EXPECT_TRUE(Has(o.output, "    speed not a number                        1\n"));
  EXPECT_TRUE(Has(o.output, "    speed negative                            1\n"));
  EXPECT_TRUE(Has(o.output,
                  "rpt.csv:12: column 'speed_kn': 'n.a.' is not a number; expected "
                  "a speed in knots"))
      << o.output;
  EXPECT_TRUE(Has(o.output, "The data cover less than a year"));
  std::filesystem::remove_all(dir);
}

TEST(FitSiteCliTest, BadInputStopsWithALocatedMessage) {
  const auto dir = fillcast_test::TempDir("fit-site-bad");
  const std::string out = (dir / "x.yaml").string();
  Outcome o = RunFillcast("fit-site " + kData + " --speed XYZ -o " + out);
  EXPECT_EQ(o.exit_code, 2);
  EXPECT_TRUE(
      Has(o.output, "fillcast: error: " + kData +
                        ":1: --speed: 'XYZ' is not a column of the header; columns: "
                        "date, RPT, VAL, ROS, KIL, SHA, BIR, DUB, CLA, MUL, CLO, BEL, "
                        "MAL\n"))
      << o.output;
  o = RunFillcast("fit-site " + kData + " --speed MAL --units mph -o " + out);
  EXPECT_EQ(o.exit_code, 2);
  EXPECT_TRUE(Has(o.output,
                  "fillcast: error: --units: 'mph' is invalid; expected auto, ms or "
                  "knots\n"))
      << o.output;
  o = RunFillcast("fit-site " + kData + " --speed MAL --sectors 0 -o " + out);
  EXPECT_EQ(o.exit_code, 2);
  EXPECT_TRUE(
      Has(o.output, "--sectors: '0' is invalid; expected a whole number from 1 to 72"))
      << o.output;
  // Never over the input, never over a file fillcast did not write.
  o = RunFillcast("fit-site " + kData + " --speed MAL -o " + kData);
  EXPECT_EQ(o.exit_code, 2);
  EXPECT_TRUE(Has(o.output, "is an input of this run; refusing to overwrite it"))
      << o.output;
  std::ofstream(out) << "notes: mine\n";
  o = RunFillcast("fit-site " + kData + " --speed MAL -o " + out);
  EXPECT_EQ(o.exit_code, 2);
  EXPECT_TRUE(Has(o.output, "exists and was not written by fillcast")) << o.output;
  EXPECT_EQ(RunFillcast("fit-site " + kData + " --speed MAL --force -o " + out).exit_code,
            0);
  std::filesystem::remove_all(dir);
}

}  // namespace
