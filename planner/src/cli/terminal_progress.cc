#include "cli/terminal_progress.h"

#include <unistd.h>

#include <cstdio>

namespace planner {

TerminalProgress::TerminalProgress(std::string label, bool quiet)
    : label_(std::move(label)),
      active_(!quiet && isatty(STDERR_FILENO) == 1),
      start_(std::chrono::steady_clock::now()),
      last_(start_) {}

void TerminalProgress::Update(long done, long total) {
  if (!active_) return;
  const auto now = std::chrono::steady_clock::now();
  if (done < total && now - last_ < std::chrono::milliseconds(100)) return;
  last_ = now;
  const double elapsed_s = std::chrono::duration<double>(now - start_).count();
  const double share = total > 0 ? static_cast<double>(done) / total : 1.0;
  const double left_s = share > 0 ? elapsed_s * (1.0 - share) / share : 0.0;
  std::fprintf(stderr, "\r  simulating %8ld / %ld %s  %5.1f %%  %6.1f s left ", done,
               total, label_.c_str(), 100.0 * share, left_s);
  std::fflush(stderr);
  drawn_ = true;
}

void TerminalProgress::Finish() {
  if (!active_ || !drawn_) return;
  std::fprintf(stderr, "\r%72s\r", "");
  std::fflush(stderr);
}

}  // namespace planner
