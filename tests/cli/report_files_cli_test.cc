// End-to-end: fillcast forecast --report / --csv-cells / --csv-curve on the
// demo plan. The files agree with the JSON of the same run, and the
// overwrite rule of every output file holds for them too.
#include <gtest/gtest.h>

#include <cstdlib>
#include <fstream>
#include <sstream>
#include <string>
#include <vector>

#include "cli/cli_runner.h"

namespace {

namespace fs = std::filesystem;
using fillcast_test::ReadJson;
using fillcast_test::RunFillcast;
using fillcast_test::SourcePath;
using fillcast_test::TempDir;

using fillcast_test::ReadFile;

// CRLF-separated lines (the demo's fields hold no line breaks).
std::vector<std::string> Lines(const std::string& text) {
  std::vector<std::string> out;
  size_t start = 0;
  for (size_t end; (end = text.find("\r\n", start)) != std::string::npos;
       start = end + 2) {
    out.push_back(text.substr(start, end - start));
  }
  return out;
}

std::vector<std::string> Split(const std::string& line) {
  std::vector<std::string> out;
  std::stringstream s(line);
  std::string field;
  while (std::getline(s, field, ',')) out.push_back(field);
  return out;
}

class ReportFilesCliTest : public ::testing::Test {
 protected:
  void SetUp() override { dir_ = TempDir("report-files"); }
  void TearDown() override { fs::remove_all(dir_); }
  std::string Forecast(const std::string& extra) {
    return "forecast " + SourcePath("demo-site/plan.yaml") +
           " --runs 120 --seed 9 --quiet " + extra;
  }
  fs::path dir_;
};

TEST_F(ReportFilesCliTest, CsvFilesAgreeWithTheJsonOfTheSameRun) {
  const fs::path json = dir_ / "f.json", cells = dir_ / "cells.csv",
                 curve = dir_ / "curve.csv";
  const auto o = RunFillcast(Forecast("--json " + json.string() + " --csv-cells " +
                                      cells.string() + " --csv-curve " + curve.string()));
  ASSERT_EQ(o.exit_code, 0) << o.output;
  EXPECT_EQ(o.output, "");  // --quiet with output files: nothing on the terminal
  const nlohmann::json j = ReadJson(json);

  const std::vector<std::string> cell_lines = Lines(ReadFile(cells));
  ASSERT_GE(cell_lines.size(), 2u);
  EXPECT_EQ(cell_lines[0].rfind("# generator=fillcast ", 0), 0u);
  EXPECT_EQ(cell_lines.size(), j.at("cells").size() + 2);  // comment, header, cells
  const std::vector<std::string> header = Split(cell_lines[1]);
  ASSERT_EQ(header[15], "p_full_by_deadline");
  for (size_t k = 0; k < j.at("cells").size(); ++k) {
    const std::vector<std::string> f = Split(cell_lines[k + 2]);
    ASSERT_EQ(f.size(), header.size()) << cell_lines[k + 2];
    EXPECT_EQ(f[1], j["cells"][k]["label"]);
    EXPECT_EQ(std::strtod(f[15].c_str(), nullptr),
              j["cells"][k]["p_full_by_deadline"].get<double>());
  }

  const std::vector<std::string> curve_lines = Lines(ReadFile(curve));
  ASSERT_GE(curve_lines.size(), 3u);
  EXPECT_EQ(curve_lines[1], "week,runs_complete,share_complete");
  const std::vector<std::string> last = Split(curve_lines.back());
  EXPECT_DOUBLE_EQ(std::strtod(last[2].c_str(), nullptr),
                   1.0 - j.at("p_incomplete_at_horizon").get<double>());
  // The P50 of the JSON is the first week at which half the runs are done.
  for (size_t i = 2; i < curve_lines.size(); ++i) {
    const std::vector<std::string> f = Split(curve_lines[i]);
    if (std::strtod(f[2].c_str(), nullptr) >= 0.5) {
      EXPECT_EQ(std::strtod(f[0].c_str(), nullptr),
                j.at("completion_weeks").at("p50").get<double>());
      break;
    }
  }
}

TEST_F(ReportFilesCliTest, ReportIsReplacedOnlyWhenFillcastWroteIt) {
  const fs::path page = dir_ / "page.html";
  std::ofstream(page) << "<html><body>my own page</body></html>\n";
  auto o = RunFillcast(Forecast("--report " + page.string()));
  EXPECT_EQ(o.exit_code, 2);
  EXPECT_NE(o.output.find("--report: " + page.string() +
                          " exists and was not written by fillcast"),
            std::string::npos)
      << o.output;
  EXPECT_EQ(ReadFile(page), "<html><body>my own page</body></html>\n");

  o = RunFillcast(Forecast("--force --report " + page.string()));
  ASSERT_EQ(o.exit_code, 0) << o.output;
  EXPECT_NE(ReadFile(page).find("<meta name=\"generator\" content=\"fillcast "),
            std::string::npos);
  // Its own report it replaces without --force.
  o = RunFillcast(Forecast("--report " + page.string()));
  EXPECT_EQ(o.exit_code, 0) << o.output;
}

TEST_F(ReportFilesCliTest, RefusesToWriteOverAnInputEvenWithForce) {
  // A copy of the demo with its site model at the same relative place.
  fs::create_directories(dir_ / "demo-site");
  fs::create_directories(dir_ / "site-models");
  const fs::path plan = dir_ / "demo-site" / "plan.yaml";
  const fs::path site = dir_ / "site-models" / "coastal-ridge.yaml";
  fs::copy_file(SourcePath("demo-site/plan.yaml"), plan);
  fs::copy_file(SourcePath("site-models/coastal-ridge.yaml"), site);
  const std::string plan_text = ReadFile(plan), site_text = ReadFile(site);
  const std::pair<const char*, fs::path> cases[] = {
      {"--csv-cells", plan}, {"--csv-curve", site}, {"--report", plan}};
  for (const auto& [option, target] : cases) {
    SCOPED_TRACE(option);
    const auto o =
        RunFillcast("forecast " + plan.string() + " --runs 20 --quiet --force " + option +
                    " " + target.string());
    EXPECT_EQ(o.exit_code, 2) << o.output;
    EXPECT_NE(o.output.find(std::string(option) + ": " + target.string() +
                            " is an input of this run"),
              std::string::npos)
        << o.output;
  }
  EXPECT_EQ(ReadFile(plan), plan_text);
  EXPECT_EQ(ReadFile(site), site_text);
}

}  // namespace
