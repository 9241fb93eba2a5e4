// Progress on stderr when it is a terminal: one line rewritten in place, at
// most ten times a second. Silent when stderr is not a terminal or when
// quiet is asked for.
#ifndef PLANNER_CLI_TERMINAL_PROGRESS_H_
#define PLANNER_CLI_TERMINAL_PROGRESS_H_

#include <chrono>
#include <string>

#include "planner/progress.h"

namespace planner {

class TerminalProgress : public ProgressSink {
 public:
  // label: what is counted, e.g. "runs".
  TerminalProgress(std::string label, bool quiet);
  void Update(long done, long total) override;
  void Finish() override;
  bool active() const { return active_; }

 private:
  std::string label_;
  bool active_;
  bool drawn_ = false;
  std::chrono::steady_clock::time_point start_, last_;
};

}  // namespace planner

#endif  // PLANNER_CLI_TERMINAL_PROGRESS_H_
