// Sample quantiles with distribution-free confidence intervals.
//
// The p-quantile estimate is the order statistic X_(ceil(n p)) (the inverse of
// the empirical distribution function). Its confidence interval is the pair of
// order statistics [X_(l), X_(u)] with l, u taken from the binomial(n, p)
// distribution so that P(X_(l) <= Q_p <= X_(u)) >= confidence (e.g. Hahn &
// Meeker, Statistical Intervals, 1991, ch. 5; from memory). No assumption on
// the shape of the distribution is needed.
#ifndef PLANNER_QUANTILE_H_
#define PLANNER_QUANTILE_H_

#include <functional>
#include <optional>
#include <vector>

namespace planner {

struct QuantileEstimate {
  double p = 0.5;
  // nullopt means "not reached": the order statistic is an incomplete run
  // (samples may be +infinity for runs that did not finish).
  std::optional<double> value;
  std::optional<double> ci_lo;
  std::optional<double> ci_hi;
};

// sorted: ascending, +infinity allowed, at least one element. 0 < p < 1.
QuantileEstimate EstimateQuantile(const std::vector<double>& sorted, double p,
                                  double confidence = 0.95);

// The same estimate for n samples held elsewhere (a histogram): at(k) is the
// k-th smallest (1-based, 1 <= k <= n), nullopt where it is +infinity.
using RankLookup = std::function<std::optional<double>(long rank)>;
QuantileEstimate EstimateQuantile(long n, const RankLookup& at, double p,
                                  double confidence = 0.95);

// 1-based order-statistic ranks (l, u) of the interval above for n samples.
// l may be 0 (no lower bound) and u may be n + 1 (no upper bound).
struct RankInterval {
  long lo = 0;
  long hi = 0;
};
RankInterval QuantileRankInterval(long n, double p, double confidence = 0.95);

}  // namespace planner

#endif  // PLANNER_QUANTILE_H_
