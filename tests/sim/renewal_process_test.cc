#include "sim/renewal_process.h"

#include <gtest/gtest.h>

#include <cmath>
#include <vector>

namespace planner {
namespace {

// Long-run availability of an alternating renewal process is
// MTBF / (MTBF + MTTR) (reliability-engineering textbook result). Starting
// up, the exponential case is a two-state Markov chain whose mean up share over
// [0, T] is A + (1 - A)(1 - exp(-cT)) / (cT), c = 1/MTBF + 1/MTTR (same
// textbooks). Tolerance: 4 standard errors across independent replicates.
TEST(RenewalProcessTest, UpShareIsMtbfOverMtbfPlusMttr) {
  const double mtbf_h = 120.0, mttr_h = 30.0;
  OutageModel model;
  model.mtbf_h = mtbf_h;
  model.mttr_h = mttr_h;
  const RenewalLaw law = MakeRenewalLaw(model);
  const int replicates = 300;
  const int64_t steps = 200000;
  std::vector<double> shares;
  for (int r = 0; r < replicates; ++r) {
    Engine e = MakeRunEngine(99, r);
    RenewalProcess p(law, &e, nullptr, 0);
    int64_t up = 0;
    for (int64_t t = 0; t < steps; ++t) up += p.UpAt(t);
    shares.push_back(static_cast<double>(up) / steps);
  }
  double mean = 0, var = 0;
  for (double s : shares) mean += s;
  mean /= replicates;
  for (double s : shares) var += (s - mean) * (s - mean);
  var /= (replicates - 1);
  const double a = mtbf_h / (mtbf_h + mttr_h);
  const double c = 1.0 / law.up.mean_steps + 1.0 / law.down.mean_steps;
  const double expected = a + (1 - a) * (1 - std::exp(-c * steps)) / (c * steps);
  EXPECT_NEAR(mean, expected, 4 * std::sqrt(var / replicates));
  EXPECT_NEAR(mean, 0.8, 0.01);  // the long-run value itself, 120 / 150
}

TEST(RenewalProcessTest, DisabledProcessIsAlwaysUp) {
  Engine e = MakeRunEngine(1, 1);
  const RenewalLaw never_fails;
  RenewalProcess p(never_fails, &e, nullptr, 0);
  for (int64_t t = 0; t < 1000; ++t) ASSERT_TRUE(p.UpAt(t));
}

}  // namespace
}  // namespace planner
