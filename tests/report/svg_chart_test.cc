// Chart building blocks: axis ticks at 1-2-5 steps covering the data, and
// marker labels that neither overlap each other nor sit under another
// marker's line.
#include "report/svg_chart.h"

#include <gtest/gtest.h>

#include <cmath>
#include <regex>
#include <string>
#include <vector>

namespace planner {
namespace {

TEST(NiceTicksTest, CoverTheRangeInStepsOfOneTwoOrFive) {
  struct Case {
    double lo, hi;
    int max_ticks;
    std::vector<double> expected;  // worked by hand
  };
  const Case cases[] = {
      {0, 156, 10, {0, 20, 40, 60, 80, 100, 120, 140, 160}},
      {0, 1, 6, {0, 0.2, 0.4, 0.6, 0.8, 1.0}},
      {0, 52.3, 7, {0, 10, 20, 30, 40, 50, 60}},
      {0, 7, 10, {0, 1, 2, 3, 4, 5, 6, 7}},
      {0, 1200, 7, {0, 200, 400, 600, 800, 1000, 1200}},
  };
  for (const Case& c : cases) {
    SCOPED_TRACE(c.hi);
    const std::vector<double> ticks = NiceTicks(c.lo, c.hi, c.max_ticks);
    ASSERT_EQ(ticks.size(), c.expected.size());
    for (size_t i = 0; i < ticks.size(); ++i) EXPECT_DOUBLE_EQ(ticks[i], c.expected[i]);
    EXPECT_LE(static_cast<int>(ticks.size()), c.max_ticks + 1);
  }
}

TEST(SvgNumTest, OneDecimalWithoutTrailingZero) {
  EXPECT_EQ(SvgNum(12.0), "12");
  EXPECT_EQ(SvgNum(12.25), "12.2");  // printf rounds half to even on binary ties
  EXPECT_EQ(SvgNum(-0.01), "0");
  EXPECT_EQ(SvgNum(3.96), "4");
}

struct Label {
  double lo, hi, baseline;
};
struct Line {
  double x, top;
};

// Reads back the labels (their extent from the anchor and the width
// estimate) and the vertical lines of SvgMarkers' output.
void Parse(const std::string& svg, std::vector<Label>* labels, std::vector<Line>* lines) {
  const std::regex text_re(
      "<text x=\"([-0-9.]+)\" y=\"([-0-9.]+)\" "
      "text-anchor=\"(start|end)\"[^>]*>([^<]*)<");
  for (std::sregex_iterator it(svg.begin(), svg.end(), text_re), end; it != end; ++it) {
    const double x = std::stod((*it)[1]);
    const double w = TextWidth((*it)[4].length());
    const bool start = (*it)[3] == "start";
    labels->push_back({start ? x : x - w, start ? x + w : x, std::stod((*it)[2])});
  }
  const std::regex line_re(
      "<line x1=\"([-0-9.]+)\" y1=\"([-0-9.]+)\" x2=\"[-0-9.]+\" y2=\"([-0-9.]+)\"");
  for (std::sregex_iterator it(svg.begin(), svg.end(), line_re), end; it != end; ++it) {
    lines->push_back(
        {std::stod((*it)[1]), std::min(std::stod((*it)[2]), std::stod((*it)[3]))});
  }
}

TEST(SvgMarkersTest, LabelsOfCloseMarkersNeitherOverlapNorSitUnderALine) {
  PlotArea a;
  a.top = 4 * 16 + 14;
  SetDomains(&a, 0, 160, 0, 1);
  // The demo's layout: P50 just before the deadline, P80 and P90 close.
  const std::vector<Marker> markers = {
      {52.3, "Deadline 2028-03-01", "deadline"},
      {46.1, "P50: 46.1 weeks, 2028-01-18", "quantile"},
      {87.9, "P80: 87.9 weeks, 2028-11-06", "quantile"},
      {94.8, "P90: 94.8 weeks, 2028-12-24", "quantile"},
      {158.0, "Near the right edge", "quantile"},
  };
  std::vector<Label> labels;
  std::vector<Line> lines;
  Parse(SvgMarkers(a, markers, 4), &labels, &lines);
  ASSERT_EQ(labels.size(), markers.size());
  ASSERT_EQ(lines.size(), markers.size());
  for (size_t i = 0; i < labels.size(); ++i) {
    const Label& l = labels[i];
    EXPECT_GE(l.lo, 0.0);
    EXPECT_LE(l.hi, a.width);
    EXPECT_LT(l.baseline, a.Y1());  // above the plot
    for (size_t j = 0; j < labels.size(); ++j) {
      if (j == i) continue;
      const bool same_row = labels[j].baseline == l.baseline;
      EXPECT_FALSE(same_row && labels[j].lo < l.hi && l.lo < labels[j].hi)
          << "labels " << i << " and " << j << " overlap";
    }
    for (size_t j = 0; j < lines.size(); ++j) {
      if (j == i) continue;
      const bool crosses =
          lines[j].x >= l.lo && lines[j].x <= l.hi && lines[j].top < l.baseline;
      EXPECT_FALSE(crosses) << "line " << j << " crosses label " << i;
    }
  }
}

TEST(SvgMarkersTest, MarkerOutsideTheDomainIsLeftOut) {
  PlotArea a;
  SetDomains(&a, 0, 10, 0, 1);
  const std::string svg = SvgMarkers(a, {{5, "in", "m"}, {12, "out", "m"}}, 1);
  EXPECT_NE(svg.find(">in<"), std::string::npos);
  EXPECT_EQ(svg.find(">out<"), std::string::npos);
}

}  // namespace
}  // namespace planner
