#include "cli/output_file.h"

#include <cstdio>
#include <filesystem>
#include <fstream>
#include <sstream>

#include "planner/error.h"

namespace fs = std::filesystem;

namespace planner {

bool WrittenByFillcast(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  std::string head(65536, '\0');
  in.read(head.data(), static_cast<std::streamsize>(head.size()));
  head.resize(static_cast<size_t>(in.gcount()));
  return head.find("\"name\": \"fillcast\"") != std::string::npos ||
         head.find("generator=fillcast") != std::string::npos ||
         head.find("<meta name=\"generator\" content=\"fillcast") != std::string::npos;
}

namespace {

bool SameFile(const std::string& a, const std::string& b) {
  std::error_code ec;
  return fs::exists(a, ec) && fs::exists(b, ec) && fs::equivalent(a, b, ec);
}

}  // namespace

void WriteOutputFile(const std::string& path, const std::string& contents, bool force,
                     const std::vector<std::string>& inputs, const std::string& option) {
  for (const std::string& input : inputs) {
    if (SameFile(path, input)) {
      throw InputError(option + ": " + path + " is an input of this run; refusing to " +
                       "overwrite it. Choose another output path.");
    }
  }
  std::error_code ec;
  if (fs::is_directory(path, ec)) {
    throw InputError(option + ": " + path + " is a folder; expected a file path.");
  }
  if (fs::exists(path, ec) && !force && !WrittenByFillcast(path)) {
    throw InputError(option + ": " + path + " exists and was not written by fillcast; " +
                     "refusing to overwrite it. Remove it, choose another path or pass " +
                     "--force.");
  }
  const std::string tmp = path + ".fillcast-tmp";
  {
    std::ofstream out(tmp, std::ios::binary | std::ios::trunc);
    out << contents;
    out.close();
    if (!out) {
      std::remove(tmp.c_str());
      throw InputError(option + ": cannot write " + path + " (check that its folder " +
                       "exists and is writable).");
    }
  }
  fs::rename(tmp, path, ec);
  if (ec) {
    std::remove(tmp.c_str());
    throw InputError(option + ": cannot write " + path + ": " + ec.message());
  }
}

}  // namespace planner
