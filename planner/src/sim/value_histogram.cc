#include "sim/value_histogram.h"

#include <algorithm>

namespace planner {

ValueHistogram::ValueHistogram(size_t max_buckets)
    : max_buckets_(std::max<size_t>(max_buckets, 2)) {
  pending_.reserve(kPendingValues);
}

void ValueHistogram::Add(int64_t value) {
  ++total_;
  if (value < 0) {
    ++never_;
    return;
  }
  pending_.push_back(static_cast<int32_t>(value));
  if (pending_.size() >= kPendingValues) Flush();
}

int64_t ValueHistogram::width() const {
  Flush();
  return width_;
}

void ValueHistogram::Flush() const {
  if (pending_.empty()) return;
  for (int32_t& v : pending_) v = static_cast<int32_t>(v - v % width_);
  std::sort(pending_.begin(), pending_.end());
  // Merge the sorted new values into the sorted buckets.
  std::vector<std::pair<int32_t, uint32_t>> merged;
  merged.reserve(buckets_.size() + pending_.size());
  size_t b = 0;
  for (size_t p = 0; p < pending_.size();) {
    const int32_t v = pending_[p];
    while (b < buckets_.size() && buckets_[b].first < v) merged.push_back(buckets_[b++]);
    uint32_t count = 0;
    if (b < buckets_.size() && buckets_[b].first == v) count = buckets_[b++].second;
    for (; p < pending_.size() && pending_[p] == v; ++p) ++count;
    merged.emplace_back(v, count);
  }
  merged.insert(merged.end(), buckets_.begin() + static_cast<std::ptrdiff_t>(b),
                buckets_.end());
  pending_.clear();
  buckets_.swap(merged);
  if (buckets_.size() > max_buckets_) Coarsen();
}

void ValueHistogram::Coarsen() const {
  while (buckets_.size() > max_buckets_) {
    width_ *= 2;
    size_t out = 0;
    for (size_t i = 0; i < buckets_.size(); ++i) {
      const int32_t key =
          static_cast<int32_t>(buckets_[i].first - buckets_[i].first % width_);
      if (out > 0 && buckets_[out - 1].first == key) {
        buckets_[out - 1].second += buckets_[i].second;
      } else {
        buckets_[out++] = {key, buckets_[i].second};
      }
    }
    buckets_.resize(out);
  }
  buckets_.shrink_to_fit();
}

std::optional<double> ValueHistogram::AtRank(long k) const {
  Flush();
  if (k < 1 || k > total_ - never_) return std::nullopt;
  long seen = 0;
  for (const auto& [value, count] : buckets_) {
    seen += count;
    if (seen >= k) {
      return static_cast<double>(value) + static_cast<double>(width_ - 1) / 2.0;
    }
  }
  return std::nullopt;  // not reached: the counts add up to total - never
}

const std::vector<std::pair<int32_t, uint32_t>>& ValueHistogram::buckets() const {
  Flush();
  return buckets_;
}

size_t ValueHistogram::MemoryBytes() const {
  return sizeof(*this) + buckets_.capacity() * sizeof(buckets_[0]) +
         pending_.capacity() * sizeof(int32_t);
}

}  // namespace planner
