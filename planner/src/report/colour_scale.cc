#include "report/colour_scale.h"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdio>

namespace planner {
namespace {

struct Rgb {
  double r, g, b;  // 0..255
};

// Stops at p = 0, 0.25, 0.5, 0.75, 1.
constexpr std::array<Rgb, 5> kStops = {{
    {154, 61, 0},     // burnt orange
    {226, 140, 64},   // light orange
    {244, 236, 219},  // cream
    {112, 164, 207},  // light blue
    {31, 78, 134},    // deep blue
}};

Rgb Interpolate(double p) {
  if (!(p >= 0.0)) p = 0.0;  // also NaN
  p = std::min(p, 1.0);
  const double x = p * (kStops.size() - 1);
  const size_t i = std::min(static_cast<size_t>(x), kStops.size() - 2);
  const double f = x - static_cast<double>(i);
  const Rgb& a = kStops[i];
  const Rgb& b = kStops[i + 1];
  return {a.r + f * (b.r - a.r), a.g + f * (b.g - a.g), a.b + f * (b.b - a.b)};
}

// WCAG 2 relative luminance of an sRGB colour.
double Luminance(const Rgb& c) {
  auto channel = [](double v) {
    v /= 255.0;
    return v <= 0.03928 ? v / 12.92 : std::pow((v + 0.055) / 1.055, 2.4);
  };
  return 0.2126 * channel(c.r) + 0.7152 * channel(c.g) + 0.0722 * channel(c.b);
}

}  // namespace

std::string ProbabilityColour(double p) {
  const Rgb c = Interpolate(p);
  char buf[8];
  std::snprintf(buf, sizeof buf, "#%02x%02x%02x", static_cast<int>(std::lround(c.r)),
                static_cast<int>(std::lround(c.g)), static_cast<int>(std::lround(c.b)));
  return buf;
}

bool NeedsLightText(double p) { return Luminance(Interpolate(p)) < 0.179; }

}  // namespace planner
