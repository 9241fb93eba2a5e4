// Walker's alias method (Vose's construction): draw an index from a discrete
// distribution in O(1) with one uniform number. Used for the sector jumps.
// Source: M. D. Vose, "A linear algorithm for generating random numbers with
// a given distribution", IEEE Trans. Software Eng. 17 (1991).
#ifndef PLANNER_SIM_ALIAS_TABLE_H_
#define PLANNER_SIM_ALIAS_TABLE_H_

#include <vector>

namespace planner {

class AliasTable {
 public:
  AliasTable() = default;
  // weights: >= 0, not all zero (need not sum to 1).
  explicit AliasTable(const std::vector<double>& weights);

  // u uniform in [0, 1).
  int Draw(double u) const {
    const double scaled = u * static_cast<double>(size_);
    int i = static_cast<int>(scaled);
    if (i >= size_) i = size_ - 1;
    return (scaled - i) < prob_[i] ? i : alias_[i];
  }
  int size() const { return size_; }

 private:
  int size_ = 0;
  std::vector<double> prob_;
  std::vector<int> alias_;
};

}  // namespace planner

#endif  // PLANNER_SIM_ALIAS_TABLE_H_
