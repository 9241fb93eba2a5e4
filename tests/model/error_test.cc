#include "planner/error.h"

#include <gtest/gtest.h>

namespace planner {
namespace {

// The shape documented in error.h: "file:line:col: field: message", with the
// parts that are unknown left out.
TEST(ErrorTest, FormatLocatedJoinsKnownParts) {
  EXPECT_EQ(FormatLocated({"plan.yaml", 12, 14}, "turbine.cut_in_ms",
                          "30 must be below cut_out_ms (25)"),
            "plan.yaml:12:14: turbine.cut_in_ms: 30 must be below cut_out_ms (25)");
  EXPECT_EQ(FormatLocated({"plan.yaml", 3, 0}, "name", "is empty"),
            "plan.yaml:3: name: is empty");
  EXPECT_EQ(FormatLocated({"plan.yaml", 0, 0}, "", "cannot open plan file: no such file"),
            "plan.yaml: cannot open plan file: no such file");
  EXPECT_EQ(FormatLocated({"", 0, 0}, "--runs", "must be at least 1"),
            "--runs: must be at least 1");
  EXPECT_EQ(FormatLocated({"", 2, 5}, "x", "bad"), "<input>:2:5: x: bad");
}

TEST(ErrorTest, ThrowAtThrowsInputErrorWithTheFormattedMessage) {
  try {
    ThrowAt({"site.yaml", 4, 2}, "sectors", "is empty");
    FAIL() << "ThrowAt returned";
  } catch (const InputError& e) {
    EXPECT_STREQ(e.what(), "site.yaml:4:2: sectors: is empty");
  }
}

}  // namespace
}  // namespace planner
