#include "report/matrix_grid.h"

#include <algorithm>

#include "report/colour_scale.h"
#include "report/html_escape.h"
#include "report/report_numbers.h"
#include "report/svg_chart.h"

namespace planner {
namespace {

constexpr double kLabelWidth = 92;    // wind-bin labels
constexpr double kHeaderHeight = 50;  // TI title and bin labels
constexpr double kRowHeight = 40;
constexpr double kMaxCellWidth = 124;
constexpr double kGap = 2;  // white gap between cells
constexpr double kPageWidth = 760;

std::string BinText(const Bin& b, const char* unit) {
  return StringPrintf("%g-%g %s", b.lo, b.hi, unit);
}

// Rounded percent that never claims certainty the runs did not show.
std::string ProbabilityText(double p) {
  if (p >= 1.0) return "100 %";
  if (p > 0.99) return "&gt;99 %";
  if (p <= 0.0) return "0 %";
  if (p < 0.01) return "&lt;1 %";
  return StringPrintf("%.0f %%", 100.0 * p);
}

std::string CountText(double x) {
  return x < 100 ? StringPrintf("%.1f", x) : StringPrintf("%.0f", x);
}

// One cell: coloured box, two lines of text, a tooltip with the full label.
std::string CellSvg(const CaptureMatrix& m, const CellForecast& c, double x, double y,
                    double w, double h) {
  const double p = c.p_full_by_deadline;
  const std::string text_class = NeedsLightText(p) ? "cell-text light" : "cell-text";
  std::string out = "<g class=\"cell\"><title>" + HtmlEscape(CellLabel(m, c.cell)) +
                    StringPrintf(
                        ": expected %.1f of %d required at the deadline; "
                        "full by the deadline in %.1f %% of runs",
                        c.count_mean, c.cell.required, 100.0 * p) +
                    (c.cell.optional ? " (optional)" : "") + "</title>\n";
  out += SvgRect(x, y, w, h, ProbabilityColour(p), "");
  if (c.cell.optional) {
    out += SvgRect(x + 2.5, y + 2.5, w - 5, h - 5, "none",
                   NeedsLightText(p) ? "optional-mark light" : "optional-mark");
  }
  out += SvgText(x + w / 2, y + 15,
                 CountText(c.count_mean) + " / " + std::to_string(c.cell.required),
                 "middle", text_class);
  out += SvgText(x + w / 2, y + 31, ProbabilityText(p), "middle", text_class + " small");
  return out + "</g>\n";
}

}  // namespace

std::string MatrixLegendSvg() {
  const double width = kPageWidth, height = 78;
  std::string out = SvgOpen(width, height, "Legend of the capture-matrix grids");
  const double x0 = 20, bar_w = 300, y = 24;
  out +=
      SvgText(x0 - 10, 14, "Probability full by the deadline", "start", "legend strong");
  constexpr int kSteps = 20;
  for (int i = 0; i < kSteps; ++i) {
    const double p = (i + 0.5) / kSteps;
    out += SvgRect(x0 + bar_w * i / kSteps, y, bar_w / kSteps + 0.5, 16,
                   ProbabilityColour(p), "");
  }
  for (int i = 0; i <= 4; ++i) {
    const double px = x0 + bar_w * i / 4.0;
    out += SvgLine(px, y + 16, px, y + 21, "tick");
    out += SvgText(px, y + 34, StringPrintf("%d %%", 25 * i), "middle", "tick-label");
  }
  const double sx = 350;
  out += SvgText(sx, 14, "In each cell: expected count at the deadline / required count,",
                 "start", "legend");
  out += SvgText(sx, 30, "and the probability that the cell is full by the deadline.",
                 "start", "legend");
  out += SvgRect(sx, 42, 28, 20, ProbabilityColour(0.5), "");
  out += SvgRect(sx + 3, 45, 22, 14, "none", "optional-mark");
  out += SvgText(sx + 36, 56, "optional cell", "start", "legend");
  out += SvgRect(sx + 150, 42, 28, 20, ProbabilityColour(0.5), "");
  out += SvgRect(sx + 150, 42, 28, 20, "", "bottleneck");
  out += SvgText(sx + 186, 56, "most often last to fill", "start", "legend");
  return out + SvgClose();
}

std::string StateGridSvg(const CaptureMatrix& m, const StateGrid& g,
                         const ForecastSummary& s) {
  const size_t cols = std::max<size_t>(1, g.ti_bins_pct.size());
  const size_t rows = g.wind_bins_ms.size();
  const double cell_w = std::min(
      kMaxCellWidth, (kPageWidth - kLabelWidth - 10) / static_cast<double>(cols));
  const double width = kLabelWidth + cell_w * static_cast<double>(cols) + 10;
  // Without TI bins there is no TI title row above the column head.
  const double header = g.ti_bins_pct.empty() ? kHeaderHeight - 20 : kHeaderHeight;
  const double height = header + kRowHeight * static_cast<double>(rows) + 8;
  std::string out = SvgOpen(
      width, height, std::string("Capture matrix, ") + OperatingStateName(g.state));

  const double grid_x = kLabelWidth;
  if (!g.ti_bins_pct.empty()) {
    out += SvgText(grid_x + cell_w * static_cast<double>(cols) / 2, 16,
                   "Turbulence intensity (TI) bin", "middle", "axis-title");
  }
  out += SvgText(kLabelWidth - 10, header - 10, "Wind speed", "end", "axis-title");
  for (size_t t = 0; t < cols; ++t) {
    const std::string head =
        g.ti_bins_pct.empty() ? "TI not binned" : BinText(g.ti_bins_pct[t], "%");
    out += SvgText(grid_x + cell_w * (static_cast<double>(t) + 0.5), header - 10, head,
                   "middle", "tick-label");
  }

  std::string outline;  // drawn last so nothing covers it
  for (size_t w = 0; w < rows; ++w) {
    const double y = header + kRowHeight * static_cast<double>(w);
    out += SvgText(kLabelWidth - 10, y + kRowHeight / 2 + 4,
                   BinText(g.wind_bins_ms[w], "m/s"), "end", "tick-label");
    for (size_t t = 0; t < cols; ++t) {
      const double x = grid_x + cell_w * static_cast<double>(t);
      const size_t k = w * cols + t;
      const int index = k < g.cell_index.size() ? g.cell_index[k] : -1;
      const double cw = cell_w - kGap, ch = kRowHeight - kGap;
      if (index < 0 || index >= static_cast<int>(s.cells.size())) {
        out += SvgRect(x, y, cw, ch, "", "no-cell");
        out += SvgText(x + cw / 2, y + 24, "no cell", "middle", "cell-text muted small");
        continue;
      }
      out += CellSvg(m, s.cells[static_cast<size_t>(index)], x, y, cw, ch);
      if (index == s.bottleneck_cell) outline = SvgRect(x, y, cw, ch, "", "bottleneck");
    }
  }
  return out + outline + SvgClose();
}

}  // namespace planner
