#include "sim/bin_lookup.h"

#include <gtest/gtest.h>

#include <cmath>
#include <vector>

#include "sim/compiled_model.h"
#include "sim/test_plans.h"

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

// A grid's TI bin, found by a branch-free binary search over bin starts
// padded to a power of two, is the bin FindBin finds among the same bins in
// ln TI, for 1 to 9 bins (with and without gaps, from 0 % or not), on and
// next to every edge.
TEST(BinLookupTest, TiBinAgreesWithBinarySearch) {
  for (int n = 1; n <= 9; ++n) {
    for (bool gaps : {false, true}) {
      std::vector<Bin> bins_pct;
      double lo = gaps ? 2.0 : 0.0;
      for (int i = 0; i < n; ++i) {
        const double hi = lo + 2.5 + 0.5 * i;
        bins_pct.push_back({lo, hi});
        lo = hi + (gaps ? 1.0 : 0.0);
      }
      Plan plan = testing_plans::SingleCellPlan(8.0, 2.0, 4.0, 8.0, 10);
      plan.matrix.grids[0].ti_bins_pct = bins_pct;
      plan.matrix.grids[0].cell_index.assign(n, 0);
      const CompiledModel model = CompileModel(plan);
      const CompiledGrid& g = model.grids[0];
      ASSERT_EQ(g.ti_bins, n);
      std::vector<Bin> bins_log;
      for (int t = 0; t < n; ++t) bins_log.push_back({g.log_ti_lo[t], g.log_ti_hi[t]});
      std::vector<double> probes = {-20.0, 0.0, 3.0, -HUGE_VAL, NAN};
      for (const Bin& b : bins_log) {
        for (double edge : {b.lo, b.hi}) {
          if (std::isinf(edge)) continue;
          probes.push_back(edge);
          probes.push_back(std::nextafter(edge, -1e9));
          probes.push_back(std::nextafter(edge, 1e9));
        }
      }
      for (double v = -6.0; v < 0.0; v += 0.00731) probes.push_back(v);
      for (double v : probes)
        ASSERT_EQ(g.TiBin(v), FindBin(bins_log, v)) << n << " bins, gaps " << gaps
                                                     << ", ln TI " << v;
    }
  }
}

}  // namespace
}  // namespace planner
