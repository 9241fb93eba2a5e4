// Small building blocks for the report's hand-written SVG charts: linear
// scales, "nice" axis ticks, axes with labelled units, and marker lines whose
// labels never overlap. Output is SVG text for inline use in an HTML page;
// the page's style sheet gives the classes (axis, grid, ...) their look.
//
// Every text argument must already be escaped (report/html_escape.h).
#ifndef PLANNER_REPORT_SVG_CHART_H_
#define PLANNER_REPORT_SVG_CHART_H_

#include <functional>
#include <string>
#include <vector>

namespace planner {

// Maps [domain_lo, domain_hi] linearly onto [range_lo, range_hi] (SVG user
// units; the range may run backwards, as the y axis does).
struct LinearScale {
  double domain_lo = 0.0, domain_hi = 1.0;
  double range_lo = 0.0, range_hi = 1.0;
  double operator()(double v) const;
};

// Tick values of 1, 2 or 5 times a power of ten covering [lo, hi] with at
// most about max_ticks ticks. lo < hi. The first tick is the largest step
// multiple <= lo, the last the smallest >= hi.
std::vector<double> NiceTicks(double lo, double hi, int max_ticks);

// Number text for coordinates: one decimal, no trailing ".0".
std::string SvgNum(double v);

// A plot area of width x height user units with margins for the axes.
struct PlotArea {
  double width = 760.0, height = 320.0;
  double left = 64.0, right = 24.0, top = 24.0, bottom = 52.0;
  LinearScale x, y;

  double X0() const { return left; }
  double X1() const { return width - right; }
  double Y0() const { return height - bottom; }  // bottom edge of the plot
  double Y1() const { return top; }              // top edge of the plot
};

// Sets the scales of `area` to map [x_lo, x_hi] x [y_lo, y_hi] onto it.
void SetDomains(PlotArea* area, double x_lo, double x_hi, double y_lo, double y_hi);

// <svg> start tag sized by viewBox (scales down with the page, never above
// its natural width), role="img", and a
// <title> for screen readers; and its end tag.
std::string SvgOpen(double width, double height, const std::string& title);
std::string SvgClose();

std::string SvgLine(double x1, double y1, double x2, double y2,
                    const std::string& css_class);
std::string SvgRect(double x, double y, double w, double h, const std::string& fill,
                    const std::string& css_class);
// anchor: "start", "middle" or "end".
std::string SvgText(double x, double y, const std::string& text, const char* anchor,
                    const std::string& css_class);

struct AxisSpec {
  std::vector<double> ticks;
  std::function<std::string(double)> format;  // tick label text
  std::string title;  // with its unit, e.g. "Weeks from the start"
};

// Grid lines at the y ticks, the two axis lines, tick marks, tick labels and
// both axis titles (the y title rotated beside the axis).
std::string SvgAxes(const PlotArea& area, const AxisSpec& x, const AxisSpec& y);

// A vertical line across the plot at data value x, labelled above the plot.
struct Marker {
  double x = 0.0;
  std::string label;
  std::string css_class;  // style of the line (and a "-label" text class)
};

// Draws the markers; labels go in rows above the plot (area.top must leave
// rows * 16 + 14 units). From right to left, each label takes the lowest row
// where its text overlaps no other label and no line crosses it (or, if no
// row is free, the row with the fewest such conflicts). Text width is
// estimated at 6.8 units per character of the 12-unit font. A marker outside
// the x domain is left out.
std::string SvgMarkers(const PlotArea& area, const std::vector<Marker>& markers,
                       int rows);

// Estimated width of `characters` of the 12-unit chart font.
inline double TextWidth(size_t characters) {
  return 6.8 * static_cast<double>(characters);
}

}  // namespace planner

#endif  // PLANNER_REPORT_SVG_CHART_H_
