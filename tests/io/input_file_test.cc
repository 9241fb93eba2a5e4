// Inputs must be regular files: a named pipe nobody writes to would block a
// read forever, a device such as /dev/zero never ends (io/input_file.h).
#include "io/input_file.h"

#include <gtest/gtest.h>
#include <sys/stat.h>
#include <unistd.h>

#include <filesystem>
#include <fstream>
#include <string>

#include "planner/error.h"
#include "planner/plan_reader.h"

namespace planner {
namespace io {
namespace {

namespace fs = std::filesystem;

std::string ErrorOf(const std::string& path, const std::string& what) {
  try {
    CheckInputFile(path, what);
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

class InputFileTest : public ::testing::Test {
 protected:
  void SetUp() override {
    dir_ = fs::temp_directory_path() / ("fillcast-input-" + std::to_string(::getpid()));
    fs::create_directories(dir_);
  }
  void TearDown() override { fs::remove_all(dir_); }
  fs::path dir_;
};

TEST_F(InputFileTest, RegularFilesPassEverythingElseIsNamed) {
  const fs::path file = dir_ / "plan.yaml", pipe = dir_ / "pipe.yaml";
  std::ofstream(file) << "name: x\n";
  ASSERT_EQ(::mkfifo(pipe.c_str(), 0600), 0);
  fs::create_symlink(file, dir_ / "link.yaml");
  EXPECT_EQ(ErrorOf(file.string(), "plan"), "");
  EXPECT_EQ(ErrorOf((dir_ / "link.yaml").string(), "plan"), "");  // links are followed
  EXPECT_EQ(
      ErrorOf(pipe.string(), "plan"),
      pipe.string() +
          ": cannot open plan file: it is a named pipe (FIFO); fillcast reads regular "
          "files only (save the data to a file first)");
  EXPECT_EQ(
      ErrorOf("/dev/zero", "records"),
      "/dev/zero: cannot open records file: it is a character device; fillcast reads "
      "regular files only (save the data to a file first)");
  EXPECT_EQ(ErrorOf(dir_.string(), "site model"),
            dir_.string() + ": cannot open site model file: it is a folder");
  EXPECT_EQ(ErrorOf((dir_ / "none.yaml").string(), "plan"),
            (dir_ / "none.yaml").string() + ": cannot open plan file: no such file");
  EXPECT_EQ(ErrorOf("", "plan"), "cannot open plan file: the path is empty");
}

TEST_F(InputFileTest, APlanGivenAsANamedPipeIsRefusedNotWaitedFor) {
  const fs::path pipe = dir_ / "plan.yaml";
  ASSERT_EQ(::mkfifo(pipe.c_str(), 0600), 0);
  // Before the check, opening the pipe blocked until a writer came.
  std::string error;
  try {
    LoadPlan(pipe.string());
  } catch (const InputError& e) {
    error = e.what();
  }
  EXPECT_NE(error.find("it is a named pipe (FIFO)"), std::string::npos) << error;
}

}  // namespace
}  // namespace io
}  // namespace planner
