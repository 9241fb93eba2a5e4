#include "sim/alias_table.h"

#include <numeric>

namespace planner {

AliasTable::AliasTable(const std::vector<double>& weights)
    : size_(static_cast<int>(weights.size())),
      prob_(weights.size()),
      alias_(weights.size()) {
  const double total = std::accumulate(weights.begin(), weights.end(), 0.0);
  std::vector<double> scaled(weights.size());
  std::vector<int> small, large;
  for (int i = 0; i < size_; ++i) {
    scaled[i] = weights[i] * size_ / total;
    (scaled[i] < 1.0 ? small : large).push_back(i);
  }
  while (!small.empty() && !large.empty()) {
    const int s = small.back();
    small.pop_back();
    const int l = large.back();
    prob_[s] = scaled[s];
    alias_[s] = l;
    scaled[l] = (scaled[l] + scaled[s]) - 1.0;
    if (scaled[l] < 1.0) {
      large.pop_back();
      small.push_back(l);
    }
  }
  for (int i : large) prob_[i] = 1.0, alias_[i] = i;
  for (int i : small) prob_[i] = 1.0, alias_[i] = i;  // round-off leftovers
}

}  // namespace planner
