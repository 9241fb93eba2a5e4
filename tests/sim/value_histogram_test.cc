// The histogram's order statistics against the definition: the k-th smallest
// of the values, read from a fully sorted copy (std::sort, the C++ standard
// library, as the reference).
#include "sim/value_histogram.h"

#include <gtest/gtest.h>

#include <algorithm>
#include <random>
#include <vector>

namespace planner {
namespace {

std::vector<int64_t> Draws(size_t n, int64_t hi, uint32_t seed) {
  std::mt19937 gen(seed);
  std::uniform_int_distribution<int64_t> value(-1, hi);  // -1: "never"
  std::vector<int64_t> v(n);
  for (int64_t& x : v) x = value(gen);
  return v;
}

// Ranks ascending with "never" last, as +infinity.
std::vector<int64_t> SortedWithNeverLast(std::vector<int64_t> v) {
  std::sort(v.begin(), v.end(), [](int64_t a, int64_t b) {
    if (a < 0 || b < 0) return b < 0 && a >= 0;
    return a < b;
  });
  return v;
}

TEST(ValueHistogramTest, EveryOrderStatisticIsExactWhileFewDistinctValues) {
  // 5,000 values over 0..799: at most 800 distinct, under the 1,000 kept.
  const std::vector<int64_t> values = Draws(5000, 799, 11);
  ValueHistogram h(1000);
  for (int64_t v : values) h.Add(v);
  const std::vector<int64_t> sorted = SortedWithNeverLast(values);
  EXPECT_EQ(h.width(), 1);
  EXPECT_EQ(h.total(), 5000);
  EXPECT_EQ(h.never(), std::count(values.begin(), values.end(), -1));
  for (long k = 1; k <= h.total(); ++k) {
    const int64_t exact = sorted[static_cast<size_t>(k - 1)];
    const std::optional<double> got = h.AtRank(k);
    if (exact < 0) {
      EXPECT_FALSE(got) << k;
    } else {
      ASSERT_TRUE(got) << k;
      EXPECT_EQ(*got, static_cast<double>(exact)) << k;
    }
  }
  EXPECT_FALSE(h.AtRank(0));
  EXPECT_FALSE(h.AtRank(5001));
}

TEST(ValueHistogramTest, MergedBucketsKeepEachOrderStatisticWithinHalfAWidth) {
  // 20,000 values over 0..99,999 into at most 512 buckets: the width must
  // grow to 256 (100,000 / 256 = 391 buckets; 128 would need 782).
  const std::vector<int64_t> values = Draws(20000, 99999, 12);
  ValueHistogram h(512);
  for (int64_t v : values) h.Add(v);
  const std::vector<int64_t> sorted = SortedWithNeverLast(values);
  const int64_t width = h.width();
  EXPECT_EQ(width, 256);
  EXPECT_LE(h.buckets().size(), 512u);
  for (long k = 1; k <= h.total(); ++k) {
    const int64_t exact = sorted[static_cast<size_t>(k - 1)];
    const std::optional<double> got = h.AtRank(k);
    if (exact < 0) {
      EXPECT_FALSE(got) << k;
      continue;
    }
    ASSERT_TRUE(got) << k;
    EXPECT_LE(std::abs(*got - static_cast<double>(exact)), (width - 1) / 2.0) << k;
  }
}

TEST(ValueHistogramTest, ResultDoesNotDependOnTheOrderOfValues) {
  std::vector<int64_t> values = Draws(30000, 50000, 13);
  ValueHistogram forward(300), backward(300);
  for (int64_t v : values) forward.Add(v);
  std::reverse(values.begin(), values.end());
  for (int64_t v : values) backward.Add(v);
  EXPECT_EQ(forward.width(), backward.width());
  EXPECT_EQ(forward.buckets(), backward.buckets());
}

TEST(ValueHistogramTest, MemoryStaysWithinItsBoundHoweverManyValues) {
  // The bound of value_histogram.h: about 16 x (max_buckets + pending) bytes.
  const size_t max_buckets = 256;
  const size_t bound =
      sizeof(ValueHistogram) + 16 * (max_buckets + ValueHistogram::kPendingValues);
  ValueHistogram h(max_buckets);
  std::mt19937 gen(14);
  std::uniform_int_distribution<int64_t> value(0, 1000000);
  size_t after_first = 0;
  for (long i = 1; i <= 2000000; ++i) {
    h.Add(value(gen));
    if (i % 100000 == 0) {
      EXPECT_LE(h.MemoryBytes(), bound) << i;
    }
    if (i == 100000) after_first = h.MemoryBytes();
  }
  EXPECT_EQ(h.total(), 2000000);
  EXPECT_LE(h.MemoryBytes(), after_first);
}

}  // namespace
}  // namespace planner
