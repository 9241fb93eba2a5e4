// Writing output files without losing anything a user gave us.
//
// A file is written to a temporary name beside the target and renamed into
// place, so a crash never leaves half a file. An existing file is replaced
// only if fillcast wrote it (it carries fillcast's mark) or the user passed
// --force; otherwise InputError says so and nothing is touched.
#ifndef PLANNER_CLI_OUTPUT_FILE_H_
#define PLANNER_CLI_OUTPUT_FILE_H_

#include <string>
#include <vector>

namespace planner {

// True if the file at path looks like fillcast output (JSON with
// "name": "fillcast" in its tool block, or a CSV/HTML carrying our mark).
bool WrittenByFillcast(const std::string& path);

// Writes contents to path as described above. `inputs` are the files this run
// read; writing over one of them is always refused.
void WriteOutputFile(const std::string& path, const std::string& contents, bool force,
                     const std::vector<std::string>& inputs, const std::string& option);

}  // namespace planner

#endif  // PLANNER_CLI_OUTPUT_FILE_H_
