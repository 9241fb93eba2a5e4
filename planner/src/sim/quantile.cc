#include "planner/quantile.h"

#include <algorithm>
#include <boost/math/distributions/binomial.hpp>
#include <cmath>

namespace planner {
namespace {

// P(Bin(n, p) <= k), with the edges handled here so Boost never sees an
// out-of-domain k.
double BinomialCdf(const boost::math::binomial_distribution<double>& bin, long n,
                   long k) {
  if (k < 0) return 0.0;
  if (k >= n) return 1.0;
  return boost::math::cdf(bin, static_cast<double>(k));
}

// 1-based rank of the type-1 order statistic X_(ceil(n p)), in [1, n]. The
// small allowance keeps n p that is an integer in exact arithmetic (10 x 0.3)
// from rounding up to the next rank.
long PointRank(long n, double p) {
  const double np = static_cast<double>(n) * p;
  long k = static_cast<long>(std::ceil(np - 1e-9 * std::max(1.0, np)));
  return std::clamp(k, 1L, n);
}

}  // namespace

RankInterval QuantileRankInterval(long n, double p, double confidence) {
  RankInterval r;
  if (n < 1 || !(p > 0.0 && p < 1.0) || !(confidence > 0.0 && confidence < 1.0)) {
    r.lo = 0;
    r.hi = n + 1;
    return r;
  }
  const boost::math::binomial_distribution<double> bin(static_cast<double>(n), p);
  const double tail = (1.0 - confidence) / 2.0;

  // lo: largest l in [0, n] with F(l - 1) <= tail. F(l - 1) rises with l and
  // F(-1) = 0, so binary search for the last rank that passes.
  long a = 0, b = n;
  while (a < b) {
    const long mid = a + (b - a + 1) / 2;
    if (BinomialCdf(bin, n, mid - 1) <= tail) {
      a = mid;
    } else {
      b = mid - 1;
    }
  }
  r.lo = a;

  // hi: smallest u in [1, n + 1] with F(u - 1) >= 1 - tail (F(n) = 1).
  a = 1;
  b = n + 1;
  while (a < b) {
    const long mid = a + (b - a) / 2;
    if (BinomialCdf(bin, n, mid - 1) >= 1.0 - tail) {
      b = mid;
    } else {
      a = mid + 1;
    }
  }
  r.hi = a;
  return r;
}

QuantileEstimate EstimateQuantile(long n, const RankLookup& at, double p,
                                  double confidence) {
  QuantileEstimate q;
  q.p = p;
  if (n < 1) return q;
  // Ranks 0 and n + 1 stand for "no bound".
  auto finite_at = [&](long rank) -> std::optional<double> {
    if (rank < 1 || rank > n) return std::nullopt;
    return at(rank);
  };
  q.value = finite_at(PointRank(n, p));
  const RankInterval r = QuantileRankInterval(n, p, confidence);
  q.ci_lo = finite_at(r.lo);
  q.ci_hi = finite_at(r.hi);
  return q;
}

QuantileEstimate EstimateQuantile(const std::vector<double>& sorted, double p,
                                  double confidence) {
  return EstimateQuantile(
      static_cast<long>(sorted.size()),
      [&](long rank) -> std::optional<double> {
        const double x = sorted[static_cast<size_t>(rank - 1)];
        if (!std::isfinite(x)) return std::nullopt;
        return x;
      },
      p, confidence);
}

}  // namespace planner
