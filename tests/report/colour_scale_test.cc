// The matrix colour scale: its ends, and text on every colour readable at the
// contrast WCAG 2 asks for normal text.
#include "report/colour_scale.h"

#include <gtest/gtest.h>

#include <cmath>
#include <cstdlib>
#include <string>

namespace planner {
namespace {

// WCAG 2.x relative luminance of "#rrggbb" (W3C, WCAG 2.1, "relative
// luminance" definition), written here independently of the code under test.
double Luminance(const std::string& hex) {
  double out = 0;
  const double weights[3] = {0.2126, 0.7152, 0.0722};
  for (int i = 0; i < 3; ++i) {
    const double v = std::strtol(hex.substr(1 + 2 * i, 2).c_str(), nullptr, 16) / 255.0;
    out += weights[i] * (v <= 0.03928 ? v / 12.92 : std::pow((v + 0.055) / 1.055, 2.4));
  }
  return out;
}

// WCAG 2.x contrast ratio (L1 + 0.05) / (L2 + 0.05), L1 the lighter.
double Contrast(double a, double b) {
  return (std::max(a, b) + 0.05) / (std::min(a, b) + 0.05);
}

TEST(ColourScaleTest, EndsAreOrangeForUnlikelyAndBlueForLikely) {
  const std::string low = ProbabilityColour(0.0), high = ProbabilityColour(1.0);
  ASSERT_EQ(low.size(), 7u);
  // Orange: red above blue; blue: blue above red.
  EXPECT_GT(std::strtol(low.substr(1, 2).c_str(), nullptr, 16),
            std::strtol(low.substr(5, 2).c_str(), nullptr, 16));
  EXPECT_GT(std::strtol(high.substr(5, 2).c_str(), nullptr, 16),
            std::strtol(high.substr(1, 2).c_str(), nullptr, 16));
  EXPECT_EQ(ProbabilityColour(-1.0), low);  // clamped
  EXPECT_EQ(ProbabilityColour(2.0), high);
  EXPECT_EQ(ProbabilityColour(std::nan("")), low);
}

TEST(ColourScaleTest, CellTextMeetsWcagAaContrastOnEveryColour) {
  for (int i = 0; i <= 100; ++i) {
    const double p = i / 100.0;
    SCOPED_TRACE(p);
    const double background = Luminance(ProbabilityColour(p));
    const double text = NeedsLightText(p) ? 1.0 : 0.0;  // white or black
    // WCAG 2.1 success criterion 1.4.3: at least 4.5:1 for normal text.
    EXPECT_GE(Contrast(background, text), 4.5);
  }
}

}  // namespace
}  // namespace planner
