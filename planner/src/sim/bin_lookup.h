// Exact bin lookup in O(1) on average: a bucket table over [0, last hi) points
// each bucket to the first bin that may contain its values; a short forward
// scan and the exact [lo, hi) test finish the job. Same answer as FindBin
// (capture_matrix.h) for every x, without a binary search per record.
#ifndef PLANNER_SIM_BIN_LOOKUP_H_
#define PLANNER_SIM_BIN_LOOKUP_H_

#include <vector>

#include "planner/capture_matrix.h"

namespace planner {

class BinLookup {
 public:
  BinLookup() = default;
  // bins: sorted, non-overlapping, lo >= 0.
  explicit BinLookup(const std::vector<Bin>& bins);

  // Index of the bin with lo <= x < hi, or -1.
  int Find(double x) const {
    if (!(x >= 0.0) || x >= end_) return -1;
    int i = first_[static_cast<int>(x * inv_width_)];
    // Buckets are at most half the narrowest bin wide, so one branch-free step
    // almost always suffices; the loop only runs past narrow gaps.
    i += hi_[i] <= x;
    while (hi_[i] <= x) ++i;  // terminates: x < end_ = hi_ of the last bin
    return x >= lo_[i] ? i : -1;
  }

 private:
  std::vector<double> lo_, hi_;
  std::vector<int> first_;  // per bucket: first bin with hi > bucket start
  double inv_width_ = 1.0;
  double end_ = 0.0;  // hi of the last bin; Find is -1 at and above it
};

}  // namespace planner

#endif  // PLANNER_SIM_BIN_LOOKUP_H_
