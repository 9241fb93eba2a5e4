// The checks every input file passes before it is opened.
#ifndef PLANNER_IO_INPUT_FILE_H_
#define PLANNER_IO_INPUT_FILE_H_

#include <string>

namespace planner {
namespace io {

// Throws InputError "<path>: cannot open <what> file: ..." if path is missing,
// a folder, or not a regular file. A named pipe, device or socket is refused
// rather than read: opening a pipe nobody writes to would wait forever, and a
// device such as /dev/zero never ends. `what` names the kind of file
// ("plan", "records").
void CheckInputFile(const std::string& path, const std::string& what);

}  // namespace io
}  // namespace planner

#endif  // PLANNER_IO_INPUT_FILE_H_
