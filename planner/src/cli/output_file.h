// Writing output files without losing anything a user gave us.
//
// Rules, for every output file of every command:
// - An existing file is replaced only if it carries a valid fillcast seal
//   (io/file_seal.h: a hash of its own contents, so neither a user's file that
//   mentions fillcast nor a fillcast file the user has since edited passes)
//   or the user passed --force.
// - Never, even with --force: an input of the run, a folder, or anything that
//   is not a regular file (named pipe, device, socket).
// - The text goes to a new temporary file beside the target, created
//   exclusively (never through an existing file or link) under a name no user
//   has, flushed to disk, then renamed onto the target: a crash or a full disk
//   never leaves half a file, and the rename never lands on anything but the
//   target. A target that did not exist is not replaced if it appears while
//   the file is written.
// - A symbolic link as the target is followed: the file it points to is
//   replaced (under the rules above) and the link kept.
// Every refusal is an InputError naming the option, the path and the reason.
#ifndef PLANNER_CLI_OUTPUT_FILE_H_
#define PLANNER_CLI_OUTPUT_FILE_H_

#include <string>
#include <vector>

namespace planner {

// True if the regular file at path carries a valid fillcast seal.
bool WrittenByFillcast(const std::string& path);

// One output file a command was asked to write.
struct OutputTarget {
  std::string option;  // "--json", "-o", ...
  std::string path;
};

// Checks, before any work, what WriteOutputFile would refuse: an empty path,
// two outputs to one file, one of `inputs` (the files named on the command
// line; those a plan names are known only once it is read), a folder or
// other non-regular file, and an existing file fillcast did not write
// (without --force).
void CheckOutputTargets(const std::vector<OutputTarget>& targets,
                        const std::vector<std::string>& inputs, bool force);

// Writes contents (sealed, see above) to path. `inputs` are the files this
// run read; writing over one of them is always refused. `option` names the
// output in messages.
void WriteOutputFile(const std::string& path, const std::string& contents, bool force,
                     const std::vector<std::string>& inputs, const std::string& option);

// What a failed write says for the system error `err` (errno): "disk full
// (No space left on device)" for a full disk or quota, else the system's
// own words.
std::string WriteErrorText(int err);

}  // namespace planner

#endif  // PLANNER_CLI_OUTPUT_FILE_H_
