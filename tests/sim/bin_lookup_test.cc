#include "sim/bin_lookup.h"

#include <gtest/gtest.h>

#include <cmath>
#include <vector>

namespace planner {
namespace {

// BinLookup is an exact replacement for the binary search FindBin: same answer
// for every value, including values on and next to the edges.
TEST(BinLookupTest, AgreesWithBinarySearchEverywhere) {
  const std::vector<std::vector<Bin>> layouts = {
      {{3, 4}, {4, 5}, {5, 6}, {6, 7}, {7, 25}},
      {{0, 3}, {25, 30}},                                   // gap between
      {{0.25, 0.5}, {0.5, 3.75}, {4.1, 4.15}, {4.15, 40}},  // uneven widths
      {{2.5, 3.5}}};
  for (const auto& bins : layouts) {
    const BinLookup lookup(bins);
    std::vector<double> probes = {-1.0, 0.0, 1e-12, 45.0, NAN};
    for (const Bin& b : bins) {
      for (double edge : {b.lo, b.hi}) {
        probes.push_back(edge);
        probes.push_back(std::nextafter(edge, -1e9));
        probes.push_back(std::nextafter(edge, 1e9));
      }
    }
    for (double v = 0.0; v < 42.0; v += 0.0137) probes.push_back(v);
    for (double v : probes) ASSERT_EQ(lookup.Find(v), FindBin(bins, v)) << "v=" << v;
  }
}

}  // namespace
}  // namespace planner
