// End-to-end: the real fillcast writes the demo's HTML report, and headless
// Chromium opens it. The rendered page must carry the key figures, the
// browser's console must stay empty (no script errors, no blocked fetches),
// it must print to PDF, and a screenshot is saved beside the test binary.
//
// Chromium is a Debian package that .ci/setup installs. Without it these
// tests fail: a report nobody has looked at in a browser is not checked.
#include <gtest/gtest.h>

#include <cmath>
#include <cstdlib>
#include <ctime>
#include <filesystem>
#include <fstream>
#include <iomanip>
#include <iostream>
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

// Runs a shell command; returns its stdout and sets its exit code.
std::string Shell(const std::string& command, int* exit_code) {
  const fillcast_test::Outcome o = fillcast_test::RunShell(command);
  *exit_code = o.exit_code;
  return o.output;
}

std::string FindChromium() {
  if (const char* env = std::getenv("FILLCAST_CHROMIUM")) return env;
  for (const char* name : {"chromium", "chromium-browser"}) {
    int code = -1;
    std::string path = Shell(std::string("command -v ") + name + " 2>/dev/null", &code);
    while (!path.empty() && std::isspace(static_cast<unsigned char>(path.back()))) {
      path.pop_back();
    }
    if (code == 0 && !path.empty()) return path;
  }
  return "";
}

struct Browser {
  std::string binary;
  fs::path dir;  // profiles and logs
  int calls = 0;

  // Runs headless Chromium with `action` on a local file; returns stdout,
  // puts the browser's log (stderr) in *log.
  std::string Run(const std::string& action, const fs::path& page, std::string* log,
                  int* exit_code) {
    const fs::path profile = dir / ("profile-" + std::to_string(++calls));
    const fs::path log_file = dir / ("chromium-" + std::to_string(calls) + ".log");
    fs::create_directories(profile);
    const std::string command =
        "timeout 180 " + binary +
        " --headless --no-sandbox --disable-gpu --disable-quic --no-first-run"
        " --disable-background-networking --disable-component-update --disable-sync"
        " --user-data-dir=" +
        profile.string() + " --enable-logging=stderr --v=0 " + action + " 'file://" +
        fs::absolute(page).string() + "' 2>" + log_file.string();
    const std::string out = Shell(command, exit_code);
    *log = ReadFile(log_file);
    return out;
  }
};

// Lines of the browser log that come from the page: console messages (any
// level, including policy violations) and uncaught exceptions.
std::vector<std::string> PageMessages(const std::string& log) {
  std::vector<std::string> found;
  std::istringstream lines(log);
  std::string line;
  while (std::getline(lines, line)) {
    if (line.find(":CONSOLE") != std::string::npos ||
        line.find("Uncaught") != std::string::npos) {
      found.push_back(line);
    }
  }
  return found;
}

// Done-by date of docs/output.md (start + ceil(7 w) days) with the C
// library's calendar.
std::string DoneBy(const std::string& start, double weeks) {
  std::tm t{};
  std::istringstream(start) >> std::get_time(&t, "%Y-%m-%d");
  t.tm_mday += static_cast<int>(std::ceil(7.0 * weeks - 1e-9));
  t.tm_hour = 12;
  const std::time_t when = timegm(&t);
  std::tm out{};
  gmtime_r(&when, &out);
  char buf[16];
  std::strftime(buf, sizeof buf, "%Y-%m-%d", &out);
  return buf;
}

size_t Count(const std::string& text, const std::string& what) {
  size_t n = 0;
  for (size_t p = text.find(what); p != std::string::npos; p = text.find(what, p + 1))
    ++n;
  return n;
}

class ReportBrowserTest : public ::testing::Test {
 protected:
  void SetUp() override {
    browser_.binary = FindChromium();
    ASSERT_FALSE(browser_.binary.empty())
        << "Chromium not found. Install the Debian package: apt-get install chromium "
           "(bash .ci/setup installs it), or set FILLCAST_CHROMIUM to its path.";
    dir_ = TempDir("report-browser");
    browser_.dir = dir_;
    report_ = dir_ / "demo-report.html";
    json_ = dir_ / "demo.json";
    const auto o = RunFillcast("forecast " + SourcePath("demo-site/plan.yaml") +
                               " --runs 200 --seed 5 --quiet --report " +
                               report_.string() + " --json " + json_.string());
    ASSERT_EQ(o.exit_code, 0) << o.output;
  }
  void TearDown() override { fs::remove_all(dir_); }

  Browser browser_;
  fs::path dir_, report_, json_;
};

TEST_F(ReportBrowserTest, MessageCheckSeesAScriptError) {
  // The check below must be able to fail: a page with a deliberate error.
  const fs::path bad = dir_ / "bad.html";
  std::ofstream(bad) << "<!DOCTYPE html><p>x</p><script>notDefinedAnywhere();</script>";
  std::string log;
  int code = -1;
  browser_.Run("--dump-dom", bad, &log, &code);
  ASSERT_EQ(code, 0) << log;
  const std::vector<std::string> messages = PageMessages(log);
  ASSERT_FALSE(messages.empty()) << log;
  EXPECT_NE(messages[0].find("notDefinedAnywhere"), std::string::npos) << messages[0];
}

TEST_F(ReportBrowserTest, ReportBlocksAndReportsAnyFetch) {
  // The same report with an external image slipped in: its own security
  // policy blocks the fetch, and the browser says so in the console.
  std::string html = ReadFile(report_);
  const size_t main = html.find("<main>");
  ASSERT_NE(main, std::string::npos);
  html.insert(main + 6, "<img src=\"https://example.invalid/logo.png\" alt=\"\">");
  const fs::path tampered = dir_ / "tampered.html";
  std::ofstream(tampered) << html;
  std::string log;
  int code = -1;
  browser_.Run("--dump-dom", tampered, &log, &code);
  ASSERT_EQ(code, 0) << log;
  const std::vector<std::string> messages = PageMessages(log);
  ASSERT_FALSE(messages.empty()) << log;
  EXPECT_NE(messages[0].find("Content Security Policy"), std::string::npos)
      << messages[0];
}

TEST_F(ReportBrowserTest, RendersKeyFiguresWithoutPageMessages) {
  const nlohmann::json j = ReadJson(json_);
  const std::string start = j.at("plan").at("start");
  const double p50 = j.at("completion_weeks").at("p50");
  const double p80 = j.at("completion_weeks").at("p80");

  std::string log;
  int code = -1;
  const std::string dom = browser_.Run("--dump-dom", report_, &log, &code);
  ASSERT_EQ(code, 0) << log;
  EXPECT_NE(dom.find(DoneBy(start, p50)), std::string::npos) << "P50 date";
  EXPECT_NE(dom.find(DoneBy(start, p80)), std::string::npos) << "P80 date";
  EXPECT_NE(dom.find("In one minute"), std::string::npos);
  EXPECT_NE(dom.find("<h2>Cautions</h2>"), std::string::npos);
  EXPECT_NE(dom.find("A forecast is an estimate, not a promise"), std::string::npos);
  EXPECT_GE(Count(dom, "<svg "), 5u);                 // curve, legend, two grids, fill
  EXPECT_EQ(dom.find("<script"), std::string::npos);  // the report uses no script at all
  const std::vector<std::string> messages = PageMessages(log);
  EXPECT_TRUE(messages.empty()) << messages.front();
}

TEST_F(ReportBrowserTest, SavesAScreenshot) {
  const fs::path shot =
      fs::read_symlink("/proc/self/exe").parent_path() / "report-screenshot.png";
  fs::remove(shot);
  std::string log;
  int code = -1;
  browser_.Run("--screenshot=" + shot.string() + " --window-size=1280,4000", report_,
               &log, &code);
  ASSERT_EQ(code, 0) << log;
  const std::string png = ReadFile(shot);
  ASSERT_GT(png.size(), 24u) << "no screenshot at " << shot;
  EXPECT_EQ(png.substr(0, 8), std::string("\x89PNG\r\n\x1a\n", 8));
  // IHDR width and height, big-endian (PNG specification, section 11.2.2).
  auto be32 = [&](size_t at) {
    return (static_cast<unsigned char>(png[at]) << 24) |
           (static_cast<unsigned char>(png[at + 1]) << 16) |
           (static_cast<unsigned char>(png[at + 2]) << 8) |
           static_cast<unsigned char>(png[at + 3]);
  };
  EXPECT_EQ(be32(16), 1280u);
  EXPECT_EQ(be32(20), 4000u);
  EXPECT_GT(png.size(), 50000u);  // a blank page compresses to far less
  std::cout << "Report screenshot: " << shot.string() << "\n";
  RecordProperty("screenshot", shot.string());
}

TEST_F(ReportBrowserTest, PrintsToAPdfOfSeveralPages) {
  const fs::path pdf = dir_ / "demo-report.pdf";
  std::string log;
  int code = -1;
  browser_.Run("--no-pdf-header-footer --print-to-pdf=" + pdf.string(), report_, &log,
               &code);
  ASSERT_EQ(code, 0) << log;
  const std::string bytes = ReadFile(pdf);
  ASSERT_GT(bytes.size(), 5u);
  EXPECT_EQ(bytes.substr(0, 5), "%PDF-");
  // Page objects (ISO 32000-1, 7.7.3.3): the print style starts the matrix and
  // the inputs on new pages.
  const size_t pages = Count(bytes, "/Type /Page") - Count(bytes, "/Type /Pages");
  EXPECT_GE(pages, 3u);
}

}  // namespace
