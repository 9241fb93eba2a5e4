#include "report/svg_chart.h"

#include <algorithm>
#include <cmath>

#include "report/report_numbers.h"

namespace planner {

double LinearScale::operator()(double v) const {
  const double span = domain_hi - domain_lo;
  if (span == 0.0) return range_lo;
  return range_lo + (v - domain_lo) / span * (range_hi - range_lo);
}

std::vector<double> NiceTicks(double lo, double hi, int max_ticks) {
  std::vector<double> ticks;
  if (!(hi > lo) || max_ticks < 2) return {lo, hi};
  const double raw = (hi - lo) / static_cast<double>(max_ticks - 1);
  const double magnitude = std::pow(10.0, std::floor(std::log10(raw)));
  double step = magnitude * 10.0;
  for (const double m : {1.0, 2.0, 5.0, 10.0}) {
    if (m * magnitude >= raw) {
      step = m * magnitude;
      break;
    }
  }
  const double first = std::floor(lo / step + 1e-9) * step;
  const double last = std::ceil(hi / step - 1e-9) * step;
  for (double t = first; t <= last + step * 1e-6; t += step) {
    // Snap away accumulated rounding so labels read "0.3", not "0.30000000000000004".
    ticks.push_back(std::round(t / step) * step);
  }
  return ticks;
}

std::string SvgNum(double v) {
  std::string s = StringPrintf("%.1f", v);
  if (s.size() > 2 && s.compare(s.size() - 2, 2, ".0") == 0) s.resize(s.size() - 2);
  if (s == "-0") s = "0";
  return s;
}

void SetDomains(PlotArea* area, double x_lo, double x_hi, double y_lo, double y_hi) {
  area->x = {x_lo, x_hi, area->X0(), area->X1()};
  area->y = {y_lo, y_hi, area->Y0(), area->Y1()};
}

std::string SvgOpen(double width, double height, const std::string& title) {
  return "<svg viewBox=\"0 0 " + SvgNum(width) + " " + SvgNum(height) + "\" width=\"" +
         SvgNum(width) + "\" height=\"" + SvgNum(height) +
         "\" style=\"max-width:" + SvgNum(width) +
         "px\" role=\"img\" preserveAspectRatio=\"xMinYMin meet\"><title>" + title +
         "</title>\n";
}

std::string SvgClose() { return "</svg>\n"; }

std::string SvgLine(double x1, double y1, double x2, double y2,
                    const std::string& css_class) {
  return "<line x1=\"" + SvgNum(x1) + "\" y1=\"" + SvgNum(y1) + "\" x2=\"" + SvgNum(x2) +
         "\" y2=\"" + SvgNum(y2) + "\" class=\"" + css_class + "\"/>\n";
}

std::string SvgRect(double x, double y, double w, double h, const std::string& fill,
                    const std::string& css_class) {
  std::string out = "<rect x=\"" + SvgNum(x) + "\" y=\"" + SvgNum(y) + "\" width=\"" +
                    SvgNum(w) + "\" height=\"" + SvgNum(h) + "\"";
  if (!fill.empty()) out += " fill=\"" + fill + "\"";
  if (!css_class.empty()) out += " class=\"" + css_class + "\"";
  return out + "/>\n";
}

std::string SvgText(double x, double y, const std::string& text, const char* anchor,
                    const std::string& css_class) {
  std::string out = "<text x=\"" + SvgNum(x) + "\" y=\"" + SvgNum(y) +
                    "\" text-anchor=\"" + anchor + "\"";
  if (!css_class.empty()) out += " class=\"" + css_class + "\"";
  return out + ">" + text + "</text>\n";
}

std::string SvgAxes(const PlotArea& a, const AxisSpec& x, const AxisSpec& y) {
  std::string out = "<g class=\"axes\">\n";
  for (const double t : y.ticks) {
    const double py = a.y(t);
    out += SvgLine(a.X0(), py, a.X1(), py, "grid");
    out += SvgLine(a.X0() - 5, py, a.X0(), py, "tick");
    out += SvgText(a.X0() - 8, py + 4, y.format(t), "end", "tick-label");
  }
  for (const double t : x.ticks) {
    const double px = a.x(t);
    out += SvgLine(px, a.Y0(), px, a.Y0() + 5, "tick");
    out += SvgText(px, a.Y0() + 19, x.format(t), "middle", "tick-label");
  }
  out += SvgLine(a.X0(), a.Y0(), a.X1(), a.Y0(), "axis");
  out += SvgLine(a.X0(), a.Y0(), a.X0(), a.Y1(), "axis");
  out += SvgText((a.X0() + a.X1()) / 2, a.height - 10, x.title, "middle", "axis-title");
  const double cy = (a.Y0() + a.Y1()) / 2;
  out +=
      "<text x=\"0\" y=\"0\" text-anchor=\"middle\" class=\"axis-title\" "
      "transform=\"translate(16 " +
      SvgNum(cy) + ") rotate(-90)\">" + y.title + "</text>\n";
  return out + "</g>\n";
}

namespace {

struct PlacedLabel {
  double x, lo, hi;  // line position and text span
  int row;
};

// Conflicts of a label in `row` spanning [lo, hi] with its line at x: text on
// text in the same row, or a line that rises through a lower row's text.
int Conflicts(const std::vector<PlacedLabel>& placed, double x, double lo, double hi,
              int row) {
  constexpr double kPad = 6;
  int n = 0;
  for (const PlacedLabel& p : placed) {
    if (p.row == row && lo < p.hi + kPad && p.lo < hi + kPad) ++n;
    if (p.row > row && p.x >= lo - 2 && p.x <= hi + 2) ++n;
    if (row > p.row && x >= p.lo - 2 && x <= p.hi + 2) ++n;
  }
  return n;
}

}  // namespace

std::string SvgMarkers(const PlotArea& a, const std::vector<Marker>& markers, int rows) {
  std::vector<const Marker*> order;
  for (const Marker& m : markers) {
    const double px = a.x(m.x);
    if (std::isfinite(px) && px >= a.X0() - 0.5 && px <= a.X1() + 0.5)
      order.push_back(&m);
  }
  // Right to left: labels run rightwards from their lines, so a label placed
  // later (further left) can climb above the lines it would otherwise cover.
  std::stable_sort(order.begin(), order.end(),
                   [](const Marker* p, const Marker* q) { return p->x > q->x; });
  rows = std::max(rows, 1);
  std::vector<PlacedLabel> placed;
  std::string lines, labels;
  for (const Marker* m : order) {
    const double px = a.x(m->x);
    const double w = TextWidth(m->label.size());
    // Labels start just right of their line, or end left of it near the right edge.
    const bool flip = px + 4 + w > a.width - 2;
    const double lo = flip ? px - 4 - w : px + 4;
    int best_row = 0, best = -1;
    for (int r = 0; r < rows; ++r) {
      const int n = Conflicts(placed, px, lo, lo + w, r);
      if (best < 0 || n < best) {
        best = n;
        best_row = r;
      }
      if (n == 0) break;
    }
    placed.push_back({px, lo, lo + w, best_row});
    const double label_y = a.Y1() - 6 - 16.0 * static_cast<double>(best_row);
    lines += SvgLine(px, a.Y0(), px, label_y - 10, m->css_class);
    labels += SvgText(flip ? px - 4 : px + 4, label_y, m->label, flip ? "end" : "start",
                      m->css_class + "-label");
  }
  return "<g class=\"markers\">\n" + lines + labels + "</g>\n";
}

}  // namespace planner
