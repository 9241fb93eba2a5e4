#include "io/input_file.h"

#include <sys/stat.h>

#include <cerrno>
#include <cstring>

#include "planner/error.h"

namespace planner {
namespace io {

void CheckInputFile(const std::string& path, const std::string& what) {
  const SourceLocation where{path, 0, 0};
  const std::string cannot = "cannot open " + what + " file: ";
  if (path.empty()) ThrowAt(where, "", cannot + "the path is empty");
  struct stat st;
  if (::stat(path.c_str(), &st) != 0) {
    ThrowAt(where, "",
            cannot + (errno == ENOENT ? "no such file" : std::strerror(errno)));
  }
  if (S_ISDIR(st.st_mode)) ThrowAt(where, "", cannot + "it is a folder");
  if (S_ISREG(st.st_mode)) return;
  const char* kind = S_ISFIFO(st.st_mode)   ? "a named pipe (FIFO)"
                     : S_ISCHR(st.st_mode)  ? "a character device"
                     : S_ISBLK(st.st_mode)  ? "a block device"
                     : S_ISSOCK(st.st_mode) ? "a socket"
                                            : "not a regular file";
  ThrowAt(where, "",
          cannot + "it is " + kind +
              "; fillcast reads regular files only (save the data to a file first)");
}

}  // namespace io
}  // namespace planner
