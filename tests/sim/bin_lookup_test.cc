#include "sim/bin_lookup.h"

#include <gtest/gtest.h>

#include <boost/math/distributions/lognormal.hpp>
#include <boost/math/distributions/normal.hpp>

#include <cmath>
#include <vector>

#include "planner/turbulence.h"
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

// A single-cell plan whose TI comes from a measured-style table with one row
// for every wind speed, binned in TI by ti_bins_pct.
CompiledModel LatentPlan(const std::vector<Bin>& ti_bins_pct, double ti_std,
                         bool table = true) {
  Plan plan = testing_plans::SingleCellPlan(8.0, 2.0, 4.0, 8.0, 10);
  if (table) {
    plan.site.turbulence.kind = TurbulenceModel::Kind::kTable;
    plan.site.turbulence.table = {TiTableRow{0.0, 40.0, 0.11, ti_std}};
  }
  plan.matrix.grids[0].ti_bins_pct = ti_bins_pct;
  plan.matrix.grids[0].cell_index.assign(ti_bins_pct.size(), 0);
  return CompileModel(plan);
}

// Where one TI row holds the wind bin, the TI bin is found on the latent
// normal's scale (ln TI = mu + s x, s > 0, is increasing in x): the same bin
// as TiBin of ln TI for every x, on and next to every edge, for one to four
// contiguous bins from 0 % or from 2 %. (Only within a few units in the last
// place of an edge may the two differ by rounding, a chance of about 1e-15
// per record; the probes keep 1e-12 from the edges.)
TEST(BinLookupTest, LatentTiEdgesAgreeWithLogTiBins) {
  for (int n = 1; n <= CompiledGrid::kLatentBins; ++n) {
    for (double first : {0.0, 2.0}) {
      std::vector<Bin> bins_pct;
      double lo = first;
      for (int i = 0; i < n; ++i) {
        bins_pct.push_back({lo, lo + 4.0 + i});
        lo += 4.0 + i;
      }
      const CompiledModel model = LatentPlan(bins_pct, 0.03);
      const CompiledGrid& g = model.grids[0];
      const int row = g.ti_row[0];
      ASSERT_GE(row, 0);
      const CompiledGrid::LatentEdges& e = g.latent_edges[0];
      ASSERT_TRUE(e.usable) << n << " bins from " << first << " %";
      std::vector<double> probes = {-HUGE_VAL, -40.0, 0.0, 40.0};
      for (double edge : {e.lo, e.hi, e.start[0], e.start[1], e.start[2]}) {
        if (std::isinf(edge)) continue;
        // 1e-12 either side: outside the few units in the last place in
        // which the two sides' rounding may differ.
        probes.push_back(edge - 1e-12);
        probes.push_back(edge + 1e-12);
      }
      for (double x = -7.0; x < 7.0; x += 0.00731) probes.push_back(x);
      for (double x : probes) {
        ASSERT_EQ(e.Bin(x), g.TiBin(model.ti_law.RowSample(row, x)))
            << n << " bins from " << first << " %, x " << x;
      }
    }
  }
}

// The latent edges give each TI bin the probability of the lognormal TI law
// with the row's mean and standard deviation: Phi(x_hi) - Phi(x_lo) against
// Boost.Math's lognormal CDF at the bin's TI edges, whose mean and standard
// deviation are checked first (moments of the lognormal: textbook).
TEST(BinLookupTest, LatentTiEdgesCarryTheLognormalBinProbabilities) {
  const std::vector<Bin> bins_pct = {{0, 8}, {8, 12}, {12, 16}, {16, 30}};
  const CompiledModel model = LatentPlan(bins_pct, 0.03);
  const CompiledGrid& g = model.grids[0];
  const CompiledGrid::LatentEdges& e = g.latent_edges[0];
  ASSERT_TRUE(e.usable);
  const int row = g.ti_row[0];
  const boost::math::lognormal_distribution<double> ti(model.ti_law.RowMu(row),
                                                      model.ti_law.RowSigma(row));
  EXPECT_NEAR(boost::math::mean(ti), 0.11, 1e-12);
  EXPECT_NEAR(boost::math::standard_deviation(ti), 0.03, 1e-12);
  const boost::math::normal_distribution<double> unit;
  const auto phi = [&](double x) {
    return std::isinf(x) ? (x > 0 ? 1.0 : 0.0) : boost::math::cdf(unit, x);
  };
  const double edges_x[] = {e.lo, e.start[0], e.start[1], e.start[2], e.hi};
  for (int t = 0; t < 4; ++t) {
    const double lo = bins_pct[t].lo / 100.0, hi = bins_pct[t].hi / 100.0;
    const double expected =
        boost::math::cdf(ti, hi) - (lo > 0 ? boost::math::cdf(ti, lo) : 0.0);
    EXPECT_NEAR(phi(edges_x[t + 1]) - phi(edges_x[t]), expected, 1e-12) << "bin " << t;
  }
}

// Where the latent edges cannot stand in for the search they are marked
// unusable and the ln TI path is taken: more than four TI bins, a gap between
// TI bins, no spread in the row (s = 0), and the IEC model, whose parameters
// vary within a wind bin.
TEST(BinLookupTest, LatentTiEdgesOnlyWhereTheyHold) {
  const std::vector<Bin> five = {{0, 4}, {4, 8}, {8, 12}, {12, 16}, {16, 30}};
  EXPECT_FALSE(LatentPlan(five, 0.03).grids[0].latent_edges[0].usable);
  const std::vector<Bin> gapped = {{0, 8}, {9, 12}};
  EXPECT_FALSE(LatentPlan(gapped, 0.03).grids[0].latent_edges[0].usable);
  const std::vector<Bin> four = {{0, 8}, {8, 12}, {12, 16}, {16, 30}};
  EXPECT_FALSE(LatentPlan(four, 0.0).grids[0].latent_edges[0].usable);
  EXPECT_FALSE(LatentPlan(four, 0.03, false).grids[0].latent_edges[0].usable);
  EXPECT_TRUE(LatentPlan(four, 0.03).grids[0].latent_edges[0].usable);
}

}  // namespace
}  // namespace planner
