// Counts of whole numbers (records, steps) folded in one at a time, so that
// order statistics over many runs can be read without keeping the runs.
// Internal to the library (forecast_accumulator.cc, monte_carlo.cc).
//
// The histogram keeps the distinct values seen, each with its count, up to
// max_buckets of them. Past that it merges values into buckets of width 2,
// then 4, 8, ... (a value v lies in the bucket starting at v - v mod width),
// until at most max_buckets remain. So:
//  - while at most max_buckets distinct values have been added (always, when
//    no more than max_buckets values were added at all), every order
//    statistic is exact;
//  - after that, an order statistic is reported as the middle of its bucket
//    and is within (width - 1) / 2 of the exact one.
// The width reached depends only on the set of values added, not on their
// order. Memory: at most about 16 x (max_buckets + kPendingValues) bytes,
// whatever the number of values added.
#ifndef PLANNER_SIM_VALUE_HISTOGRAM_H_
#define PLANNER_SIM_VALUE_HISTOGRAM_H_

#include <cstddef>
#include <cstdint>
#include <optional>
#include <utility>
#include <vector>

namespace planner {

class ValueHistogram {
 public:
  // Values are buffered this many at a time before they are merged in.
  static constexpr size_t kPendingValues = 1024;

  // max_buckets >= 2.
  explicit ValueHistogram(size_t max_buckets);

  // value >= 0 is counted; value < 0 counts as "never" (+infinity), ranked
  // after every value. Values must be below 2^31.
  void Add(int64_t value);

  long total() const { return total_; }
  long never() const { return never_; }
  // Bucket width (1 while exact). Flushes what is buffered.
  int64_t width() const;

  // The value of 1-based rank k in ascending order (the k-th smallest), or
  // nullopt when k is outside [1, total()] or falls on a "never". Exact when
  // width() == 1, else the middle of its bucket.
  std::optional<double> AtRank(long k) const;

  // Distinct buckets in ascending order: (lowest value of the bucket, count).
  // While width() == 1 these are the distinct values themselves.
  const std::vector<std::pair<int32_t, uint32_t>>& buckets() const;

  // Bytes held (capacities of the buffers), for the memory bound's tests.
  size_t MemoryBytes() const;

 private:
  void Flush() const;
  void Coarsen() const;

  size_t max_buckets_;
  long total_ = 0;
  long never_ = 0;
  // Merged state and the values not yet merged; mutable so that reads can
  // merge what is buffered first.
  mutable int64_t width_ = 1;
  mutable std::vector<std::pair<int32_t, uint32_t>> buckets_;
  mutable std::vector<int32_t> pending_;
};

}  // namespace planner

#endif  // PLANNER_SIM_VALUE_HISTOGRAM_H_
