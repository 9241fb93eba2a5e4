#include "cli/output_file.h"

#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <filesystem>
#include <random>

#include "io/file_seal.h"
#include "planner/error.h"

namespace fs = std::filesystem;

namespace planner {

namespace {

// Files larger than this are never taken for fillcast's own output.
constexpr off_t kMaxSealedBytes = off_t{1} << 30;

std::string SystemText(int err) { return std::strerror(err); }

// "a named pipe (FIFO)" and the like, for a file that is not regular.
std::string KindOf(const struct stat& st) {
  if (S_ISDIR(st.st_mode)) return "a folder";
  if (S_ISFIFO(st.st_mode)) return "a named pipe (FIFO)";
  if (S_ISCHR(st.st_mode)) return "a character device";
  if (S_ISBLK(st.st_mode)) return "a block device";
  if (S_ISSOCK(st.st_mode)) return "a socket";
  return "not a regular file";
}

// The file a path names: symbolic links are followed (the file a link points
// to is what gets replaced, even if it does not exist yet), anything else is
// the path itself.
std::string Resolve(const std::string& option, const std::string& path) {
  fs::path at(path);
  for (int hops = 0; hops < 40; ++hops) {
    struct stat st;
    if (::lstat(at.c_str(), &st) != 0 || !S_ISLNK(st.st_mode)) return at.string();
    std::error_code ec;
    const fs::path to = fs::read_symlink(at, ec);
    if (ec) break;
    at = to.is_absolute() ? to : at.parent_path() / to;
  }
  throw InputError(option + ": " + path + " is a symbolic link that cannot be followed " +
                   "(a loop, or more than 40 links); choose another output path.");
}

// Refuses what may never be replaced and what needs --force. Returns true if
// the target exists (its mode in *mode).
bool CheckTarget(const std::string& option, const std::string& path,
                 const std::string& real, bool force, mode_t* mode) {
  struct stat st;
  if (::stat(real.c_str(), &st) != 0) {
    if (errno == ENOENT) return false;
    throw InputError(option + ": cannot use " + path + ": " + SystemText(errno));
  }
  if (S_ISDIR(st.st_mode)) {
    throw InputError(option + ": " + path + " is a folder; expected a file path.");
  }
  if (!S_ISREG(st.st_mode)) {
    throw InputError(option + ": " + path + " is " + KindOf(st) +
                     "; fillcast writes regular files only and never replaces anything "
                     "else, even with --force. Choose a file path.");
  }
  if (!force && !WrittenByFillcast(real)) {
    throw InputError(option + ": " + path +
                     " exists and was not written by fillcast (it carries no valid "
                     "fillcast seal: a user's file, or fillcast output edited since); "
                     "refusing to overwrite it. Remove it, choose another path or pass "
                     "--force.");
  }
  if (mode != nullptr) *mode = st.st_mode & 07777;
  return true;
}

bool SameFile(const std::string& a, const std::string& b) {
  std::error_code ec;
  return fs::exists(a, ec) && fs::exists(b, ec) && fs::equivalent(a, b, ec);
}

// Where two spellings of a path meet: absolute, links followed, "." and ".."
// folded.
std::string Canonical(const std::string& path) {
  std::error_code ec;
  const fs::path p = fs::weakly_canonical(fs::absolute(path, ec), ec);
  return ec ? path : p.string();
}

std::string RandomHex12() {
  static thread_local std::mt19937_64 engine(std::random_device{}() ^
                                             (static_cast<uint64_t>(::getpid()) << 20));
  char buffer[16];
  std::snprintf(buffer, sizeof buffer, "%012llx",
                static_cast<unsigned long long>(engine() & 0xffffffffffffULL));
  return buffer;
}

// A new, empty temporary file beside `real`, opened for writing: created
// exclusively (O_EXCL, O_NOFOLLOW), under ".<name>.fillcast-<12 hex>.tmp".
int CreateTemporary(const std::string& real, std::string* tmp_path) {
  const fs::path target(real);
  const fs::path dir = target.has_parent_path() ? target.parent_path() : fs::path(".");
  const std::string base = target.filename().string().substr(0, 100);
  for (int attempt = 0; attempt < 64; ++attempt) {
    *tmp_path = (dir / ("." + base + ".fillcast-" + RandomHex12() + ".tmp")).string();
    const int fd = ::open(tmp_path->c_str(),
                          O_WRONLY | O_CREAT | O_EXCL | O_NOFOLLOW | O_CLOEXEC, 0666);
    if (fd >= 0 || errno != EEXIST) return fd;
  }
  errno = EEXIST;
  return -1;
}

bool WriteAll(int fd, const std::string& contents) {
  const char* p = contents.data();
  std::size_t left = contents.size();
  while (left > 0) {
    const ssize_t n = ::write(fd, p, left);
    if (n < 0 && errno == EINTR) continue;
    if (n <= 0) {
      if (n == 0) errno = ENOSPC;
      return false;
    }
    p += n;
    left -= static_cast<std::size_t>(n);
  }
  return true;
}

// Renames tmp onto real. Onto a target that did not exist, never replaces a
// file that appeared meanwhile.
bool Publish(const std::string& tmp, const std::string& real, bool existed) {
  if (existed) return std::rename(tmp.c_str(), real.c_str()) == 0;
  if (::renameat2(AT_FDCWD, tmp.c_str(), AT_FDCWD, real.c_str(), RENAME_NOREPLACE) == 0) {
    return true;
  }
  if (errno != EINVAL && errno != ENOSYS) return false;
  // A file system without RENAME_NOREPLACE: link() also refuses an existing
  // name.
  if (::link(tmp.c_str(), real.c_str()) != 0) return false;
  ::unlink(tmp.c_str());
  return true;
}

void SyncFolderOf(const std::string& real) {
  const fs::path target(real);
  const std::string dir = target.has_parent_path() ? target.parent_path().string() : ".";
  const int fd = ::open(dir.c_str(), O_RDONLY | O_DIRECTORY | O_CLOEXEC);
  if (fd < 0) return;
  ::fsync(fd);  // best effort: the file itself is already on disk
  ::close(fd);
}

std::string CannotCreate(const std::string& real, int err) {
  const fs::path target(real);
  const std::string dir = target.has_parent_path() ? target.parent_path().string() : ".";
  if (err == ENOENT) return "its folder " + dir + " does not exist";
  if (err == EACCES || err == EPERM) {
    return "no permission to create files in the folder " + dir;
  }
  return WriteErrorText(err);
}

}  // namespace

std::string WriteErrorText(int err) {
  if (err == ENOSPC || err == EDQUOT) return "disk full (" + SystemText(err) + ")";
  return SystemText(err);
}

bool WrittenByFillcast(const std::string& path) {
  const int fd = ::open(path.c_str(), O_RDONLY | O_NONBLOCK | O_CLOEXEC);
  if (fd < 0) return false;
  struct stat st;
  std::string text;
  if (::fstat(fd, &st) == 0 && S_ISREG(st.st_mode) && st.st_size <= kMaxSealedBytes) {
    text.resize(static_cast<std::size_t>(st.st_size));
    std::size_t got = 0;
    while (got < text.size()) {
      const ssize_t n = ::read(fd, text.data() + got, text.size() - got);
      if (n < 0 && errno == EINTR) continue;
      if (n <= 0) break;
      got += static_cast<std::size_t>(n);
    }
    text.resize(got);
  }
  ::close(fd);
  return HasValidSeal(text);
}

void CheckOutputTargets(const std::vector<OutputTarget>& targets,
                        const std::vector<std::string>& inputs, bool force) {
  for (std::size_t i = 0; i < targets.size(); ++i) {
    const OutputTarget& t = targets[i];
    if (t.path.empty()) {
      throw InputError(t.option + ": the path is empty; expected a file path.");
    }
    for (std::size_t j = 0; j < i; ++j) {
      if (Canonical(t.path) == Canonical(targets[j].path) ||
          SameFile(t.path, targets[j].path)) {
        throw InputError(t.option + ": " + t.path + " is also the path of " +
                         targets[j].option + "; each output needs a file of its own.");
      }
    }
    const std::string real = Resolve(t.option, t.path);
    for (const std::string& input : inputs) {
      if (SameFile(real, input)) {
        throw InputError(t.option + ": " + t.path +
                         " is an input of this run; refusing " +
                         "to overwrite it. Choose another output path.");
      }
    }
    CheckTarget(t.option, t.path, real, force, nullptr);
  }
}

void WriteOutputFile(const std::string& path, const std::string& contents, bool force,
                     const std::vector<std::string>& inputs, const std::string& option) {
  if (path.empty())
    throw InputError(option + ": the path is empty; expected a file path.");
  const std::string real = Resolve(option, path);
  for (const std::string& input : inputs) {
    if (SameFile(real, input)) {
      throw InputError(option + ": " + path + " is an input of this run; refusing to " +
                       "overwrite it. Choose another output path.");
    }
  }
  mode_t mode = 0;
  const bool existed = CheckTarget(option, path, real, force, &mode);
  const std::string sealed = SealContents(contents);

  std::string tmp;
  const int fd = CreateTemporary(real, &tmp);
  if (fd < 0) {
    throw InputError(option + ": cannot write " + path + ": " +
                     CannotCreate(real, errno) + ".");
  }
  bool ok = WriteAll(fd, sealed);
  int err = ok ? 0 : errno;
  if (ok && existed) ::fchmod(fd, mode);  // keep the replaced file's permissions
  if (ok && ::fsync(fd) != 0 && errno != EINVAL) ok = false, err = errno;
  if (::close(fd) != 0 && ok) ok = false, err = errno;
  if (ok && !Publish(tmp, real, existed)) {
    err = errno;
    ::unlink(tmp.c_str());
    if (err == EEXIST) {
      throw InputError(option + ": " + path +
                       " appeared while fillcast was writing it; " +
                       "it was left as it is. Run again, or choose another path.");
    }
    throw InputError(option + ": cannot write " + path + ": " + WriteErrorText(err) +
                     ".");
  }
  if (!ok) {
    ::unlink(tmp.c_str());
    throw InputError(option + ": cannot write " + path + ": " + WriteErrorText(err) +
                     "; nothing was changed.");
  }
  SyncFolderOf(real);
}

}  // namespace planner
