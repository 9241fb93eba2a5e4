#include "sim/bin_lookup.h"

#include <algorithm>
#include <cmath>

namespace planner {

BinLookup::BinLookup(const std::vector<Bin>& bins) {
  if (bins.empty()) return;
  double narrowest = bins.front().hi - bins.front().lo;
  for (const Bin& b : bins) {
    lo_.push_back(b.lo);
    hi_.push_back(b.hi);
    narrowest = std::min(narrowest, b.hi - b.lo);
  }
  end_ = bins.back().hi;
  // Buckets about half the narrowest bin, at most 65536 of them.
  const double width = std::max(narrowest / 2.0, end_ / 65536.0);
  inv_width_ = 1.0 / width;
  const int buckets = static_cast<int>(end_ * inv_width_) + 2;
  first_.resize(buckets);
  int i = 0;
  for (int b = 0; b < buckets; ++b) {
    // A hair early, so rounding in Find's bucket index never skips a bin.
    const double start = (b - 1e-6) * width;
    while (i + 1 < static_cast<int>(bins.size()) && hi_[i] <= start) ++i;
    first_[b] = i;
  }
}

}  // namespace planner
