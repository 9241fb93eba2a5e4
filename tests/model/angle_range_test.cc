#include "planner/angle_range.h"

#include <gtest/gtest.h>

namespace planner {
namespace {

TEST(AngleRangeTest, WrapThroughNorthIsOneRange) {
  const AngleRange r{350, 20};
  EXPECT_DOUBLE_EQ(AngleRangeWidth(r), 30.0);
  EXPECT_TRUE(AngleRangeContains(r, 355));
  EXPECT_TRUE(AngleRangeContains(r, 0));
  EXPECT_TRUE(AngleRangeContains(r, 19.9));
  EXPECT_FALSE(AngleRangeContains(r, 20));  // [from, to)
  EXPECT_FALSE(AngleRangeContains(r, 180));
  EXPECT_TRUE(AngleRangeContains(r, -5));  // taken modulo 360
}

TEST(AngleRangeTest, FullAndEmptyCircle) {
  EXPECT_DOUBLE_EQ(AngleRangeWidth({0, 360}), 360.0);
  EXPECT_TRUE(AngleRangeContains({0, 360}, 359.99));
  EXPECT_DOUBLE_EQ(AngleRangeWidth({40, 40}), 0.0);
  EXPECT_FALSE(AngleRangeContains({40, 40}, 40));
}

TEST(AngleRangeTest, OverlapCountsUnionOnce) {
  const std::vector<AngleRange> ranges = {{300, 60}, {30, 90}};
  EXPECT_DOUBLE_EQ(AngleOverlapDeg(ranges, 0, 360), 150.0);  // 300..90
  EXPECT_DOUBLE_EQ(AngleOverlapDeg(ranges, 345, 30), 30.0);  // sector around north
  EXPECT_DOUBLE_EQ(AngleOverlapDeg(ranges, 75, 30), 15.0);   // 75..90 of 75..105
  EXPECT_DOUBLE_EQ(AngleOverlapDeg(ranges, 180, 30), 0.0);
}

}  // namespace
}  // namespace planner
