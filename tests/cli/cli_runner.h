// Runs the real fillcast binary for end-to-end tests (the way Ninja's output
// tests run the real program) and collects its output and exit code.
#ifndef FILLCAST_TESTS_CLI_CLI_RUNNER_H_
#define FILLCAST_TESTS_CLI_CLI_RUNNER_H_

#include <sys/wait.h>
#include <unistd.h>

#include <cstdio>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <nlohmann/json.hpp>
#include <string>

namespace fillcast_test {

struct Outcome {
  int exit_code = -1;
  std::string output;  // stdout and stderr together
};

// Runs a shell command line; output is what it writes to stdout (add 2>&1 to
// the command for stderr too).
inline Outcome RunShell(const std::string& command) {
  Outcome o;
  FILE* pipe = popen(command.c_str(), "r");
  if (pipe == nullptr) return o;
  char buf[4096];
  size_t n;
  while ((n = fread(buf, 1, sizeof buf, pipe)) > 0) o.output.append(buf, n);
  const int status = pclose(pipe);
  o.exit_code = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
  return o;
}

inline Outcome RunFillcast(const std::string& args) {
  return RunShell(std::string(FILLCAST_BINARY) + " " + args + " 2>&1");
}

inline std::string SourcePath(const std::string& relative) {
  return std::string(FILLCAST_SOURCE_DIR) + "/" + relative;
}

// A fresh folder for one test's files.
inline std::filesystem::path TempDir(const std::string& tag) {
  std::filesystem::path dir = std::filesystem::temp_directory_path() /
                              ("fillcast-" + tag + "-" + std::to_string(::getpid()));
  std::filesystem::create_directories(dir);
  return dir;
}

inline std::string ReadFile(const std::filesystem::path& p) {
  std::ifstream in(p, std::ios::binary);
  std::string text((std::istreambuf_iterator<char>(in)),
                   std::istreambuf_iterator<char>());
  return text;
}

inline nlohmann::json ReadJson(const std::filesystem::path& p) {
  std::ifstream in(p);
  return nlohmann::json::parse(in);
}

}  // namespace fillcast_test

#endif  // FILLCAST_TESTS_CLI_CLI_RUNNER_H_
