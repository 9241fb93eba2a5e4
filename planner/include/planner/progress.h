// Progress of a long computation. The core reports through this interface;
// the CLI passes a terminal implementation, tests a silent one.
#ifndef PLANNER_PROGRESS_H_
#define PLANNER_PROGRESS_H_

namespace planner {

class ProgressSink {
 public:
  virtual ~ProgressSink() = default;
  // done of total units finished. Called from worker threads, one call at a
  // time (callers serialise), with done increasing.
  virtual void Update(long done, long total) = 0;
  // The computation is over (called once, from the calling thread).
  virtual void Finish() {}
};

class SilentProgress : public ProgressSink {
 public:
  void Update(long, long) override {}
};

}  // namespace planner

#endif  // PLANNER_PROGRESS_H_
