// End-to-end: no output option ever loses a user's file (cli/output_file.h).
// Each case below lost data or answered with exit status 0 before the
// output files were sealed and written through an exclusive temporary file.
#include <gtest/gtest.h>
#include <sys/stat.h>
#include <unistd.h>

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <string>
#include <vector>

#include "cli/cli_runner.h"

namespace {

namespace fs = std::filesystem;
using fillcast_test::ReadFile;
using fillcast_test::RunFillcast;
using fillcast_test::RunShell;
using fillcast_test::SourcePath;
using fillcast_test::TempDir;

class OutputSafetyCliTest : public ::testing::Test {
 protected:
  void SetUp() override { dir_ = TempDir("output-safety"); }
  void TearDown() override { fs::remove_all(dir_); }
  static std::string Forecast(const std::string& extra) {
    return "forecast " + SourcePath("demo-site/plan.yaml") +
           " --runs 20 --seed 9 --quiet " + extra;
  }
  // Names in the folder, sorted, for "nothing else was left behind".
  std::vector<std::string> Names() const {
    std::vector<std::string> names;
    for (const auto& e : fs::directory_iterator(dir_)) {
      names.push_back(e.path().filename().string());
    }
    std::sort(names.begin(), names.end());
    return names;
  }
  fs::path dir_;
};

TEST_F(OutputSafetyCliTest, UserNotesThatMentionFillcastsMarksAreNotOverwritten) {
  const char* const notes[] = {
      "{\"tool\": {\"name\": \"fillcast\"}} my edited copy\n",
      "# generator=fillcast 0.2.0\nmy own table\n",
      "<meta name=\"generator\" content=\"fillcast 0.2.0\"> my page\n",
      "fillcast-seal:0000000000000000 copied from the docs\n",
  };
  for (const char* text : notes) {
    SCOPED_TRACE(text);
    const fs::path file = dir_ / "notes.txt";
    std::ofstream(file) << text;
    const auto o = RunFillcast(Forecast("--json " + file.string()));
    EXPECT_EQ(o.exit_code, 2) << o.output;
    EXPECT_NE(o.output.find("exists and was not written by fillcast"), std::string::npos)
        << o.output;
    EXPECT_EQ(ReadFile(file), text);
  }
}

TEST_F(OutputSafetyCliTest, OwnFileIsReplacedButNotOnceTheUserEditedIt) {
  const fs::path json = dir_ / "result.json";
  ASSERT_EQ(RunFillcast(Forecast("--json " + json.string())).exit_code, 0);
  ASSERT_EQ(RunFillcast(Forecast("--json " + json.string())).exit_code, 0);
  std::ofstream(json, std::ios::app) << "\nmy note on this run\n";
  const std::string edited = ReadFile(json);
  const auto o = RunFillcast(Forecast("--json " + json.string()));
  EXPECT_EQ(o.exit_code, 2) << o.output;
  EXPECT_EQ(ReadFile(json), edited);
  EXPECT_EQ(RunFillcast(Forecast("--force --json " + json.string())).exit_code, 0);
}

TEST_F(OutputSafetyCliTest, TemporaryFileNeverTouchesAFileOrLinkOfTheUser) {
  // The names a fixed temporary name scheme would use, held by the user: a
  // file, and a link to a file elsewhere that must not be written through.
  const fs::path victim = dir_ / "victim.txt";
  std::ofstream(victim) << "precious\n";
  std::ofstream(dir_ / "out.json.fillcast-tmp") << "mine\n";
  fs::create_symlink(victim, dir_ / "out.csv.fillcast-tmp");
  const auto o = RunFillcast(Forecast("--json " + (dir_ / "out.json").string() +
                                      " --csv-cells " + (dir_ / "out.csv").string()));
  ASSERT_EQ(o.exit_code, 0) << o.output;
  EXPECT_EQ(ReadFile(victim), "precious\n");
  EXPECT_EQ(ReadFile(dir_ / "out.json.fillcast-tmp"), "mine\n");
  EXPECT_TRUE(fs::is_symlink(dir_ / "out.csv.fillcast-tmp"));
  const std::vector<std::string> expected = {"out.csv", "out.csv.fillcast-tmp",
                                             "out.json", "out.json.fillcast-tmp",
                                             "victim.txt"};
  EXPECT_EQ(Names(), expected);  // no temporary file left behind
}

TEST_F(OutputSafetyCliTest, ForceNeverReplacesAPipeOrADevice) {
  const fs::path pipe = dir_ / "pipe.json";
  ASSERT_EQ(::mkfifo(pipe.c_str(), 0600), 0);
  // `timeout`: before this was checked, opening the pipe blocked for ever.
  auto o = RunShell("timeout 60 " + std::string(FILLCAST_BINARY) + " " +
                    Forecast("--force --json " + pipe.string()) + " 2>&1");
  EXPECT_EQ(o.exit_code, 2) << o.output;
  EXPECT_NE(o.output.find("--json: " + pipe.string() +
                          " is a named pipe (FIFO); fillcast writes regular files only "
                          "and never replaces anything else, even with --force"),
            std::string::npos)
      << o.output;
  struct stat st;
  ASSERT_EQ(::stat(pipe.c_str(), &st), 0);
  EXPECT_TRUE(S_ISFIFO(st.st_mode));
  o = RunFillcast(Forecast("--force --report /dev/null"));
  EXPECT_EQ(o.exit_code, 2) << o.output;
  EXPECT_NE(o.output.find("--report: /dev/null is a character device"), std::string::npos)
      << o.output;
}

TEST_F(OutputSafetyCliTest, TwoOutputsToOneFileOrAnEmptyPathAreRefusedBeforeAnyWork) {
  const std::string a = (dir_ / "a.out").string();
  const struct {
    std::string args;
    std::string message;
  } cases[] = {
      {"--json " + a + " --report " + a,
       "--report: " + a +
           " is also the path of --json; each output needs a file of its own."},
      {"--csv-cells " + a + " --csv-curve " + dir_.string() + "/./a.out",
       "--csv-curve: " + dir_.string() + "/./a.out is also the path of --csv-cells"},
      {"--json ''", "--json: the value is empty; expected a file path"},
  };
  for (const auto& c : cases) {
    SCOPED_TRACE(c.args);
    // 10 million runs would take hours: the refusal must come first.
    const auto o = RunFillcast("forecast " + SourcePath("demo-site/plan.yaml") +
                               " --runs 10000000 --quiet " + c.args);
    EXPECT_EQ(o.exit_code, 2) << o.output;
    EXPECT_NE(o.output.find("fillcast: error: " + c.message), std::string::npos)
        << o.output;
    EXPECT_FALSE(fs::exists(a));
  }
  const auto o = RunFillcast(
      "fit-site " + SourcePath("tests/data/irish-daily-wind/daily_mean_wind_knots.csv") +
      " -o ''");
  EXPECT_EQ(o.exit_code, 2) << o.output;
}

TEST_F(OutputSafetyCliTest, ALinkIsFollowedAndKept) {
  const fs::path target = dir_ / "real.json", link = dir_ / "link.json";
  fs::create_symlink("real.json", link);
  ASSERT_EQ(RunFillcast(Forecast("--json " + link.string())).exit_code, 0);
  EXPECT_TRUE(fs::is_symlink(link));
  ASSERT_TRUE(fs::is_regular_file(target));
  ::chmod(target.c_str(), 0640);
  ASSERT_EQ(RunFillcast(Forecast("--json " + link.string())).exit_code, 0);
  EXPECT_TRUE(fs::is_symlink(link));
  EXPECT_EQ(fs::status(target).permissions() & fs::perms::all,
            fs::perms::owner_read | fs::perms::owner_write | fs::perms::group_read);
}

TEST_F(OutputSafetyCliTest, AFullDiskSaysSoAndLeavesNothingBehind) {
  // A 16 KiB file system of its own, in a mount namespace of its own (so
  // nothing outlives the command); the demo's JSON is about 90 KiB.
  const fs::path small = dir_ / "small";
  fs::create_directories(small);
  const std::string probe =
      "unshare -m sh -c 'mount -t tmpfs -o size=16k tmpfs " + small.string() + "' 2>&1";
  if (RunShell(probe).exit_code != 0) {
    GTEST_SKIP() << "cannot mount a small file system here (needs unshare and mount)";
  }
  const auto o = RunShell("unshare -m sh -c 'mount -t tmpfs -o size=16k tmpfs " +
                          small.string() + " && " + FILLCAST_BINARY + " " +
                          Forecast("--json " + (small / "out.json").string()) +
                          " 2>&1; echo \"exit=$?\"; ls -A " + small.string() + "'");
  EXPECT_NE(o.output.find("--json: cannot write " + (small / "out.json").string() +
                          ": disk full (No space left on device); nothing was changed."),
            std::string::npos)
      << o.output;
  EXPECT_NE(o.output.find("exit=2\n"), std::string::npos) << o.output;
  EXPECT_EQ(o.output.substr(o.output.find("exit=2\n") + 7), "");  // folder left empty
}

}  // namespace
