// Two-parameter Weibull distribution of the 10-minute mean wind speed.
//
//   F(v) = 1 - exp(-(v/A)^k),   mean = A * Gamma(1 + 1/k)
//
// Source: any wind-energy handbook; Boost.Math's weibull_distribution is the
// reference implementation the tests compare against.
#ifndef PLANNER_WEIBULL_H_
#define PLANNER_WEIBULL_H_

namespace planner {

struct Weibull {
  double scale_ms = 8.0;  // A, m/s, > 0.
  double shape = 2.0;     // k, dimensionless, > 0.
};

// Cumulative probability P(V <= speed_ms); 0 for speed_ms <= 0.
double WeibullCdf(const Weibull& w, double speed_ms);

// Speed (m/s) with WeibullCdf == p, for 0 <= p < 1.
double WeibullQuantile(const Weibull& w, double p);

// Mean speed in m/s: A * Gamma(1 + 1/k).
double WeibullMean(const Weibull& w);

// Probability that lo_ms <= V < hi_ms.
double WeibullBinProbability(const Weibull& w, double lo_ms, double hi_ms);

}  // namespace planner

#endif  // PLANNER_WEIBULL_H_
