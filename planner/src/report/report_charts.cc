#include "report/report_charts.h"

#include <algorithm>
#include <cmath>

#include "report/html_escape.h"
#include "report/report_numbers.h"
#include "report/svg_chart.h"

namespace planner {
namespace {

// More distinct points than this are drawn from an even grid of x values.
constexpr size_t kMaxCurvePoints = 1500;

std::string PercentTick(double share) { return StringPrintf("%.0f %%", 100.0 * share); }
std::string WeeksTick(double weeks) { return SvgNum(weeks); }

AxisSpec ShareAxis(const std::string& title) {
  return {NiceTicks(0.0, 1.0, 6), PercentTick, title};
}

AxisSpec WeeksAxis(double hi, int max_ticks, const std::string& title) {
  return {NiceTicks(0.0, std::max(hi, 1.0), max_ticks), WeeksTick, title};
}

// Point shapes for the three quantile series: circle, square, triangle.
std::string SeriesPoint(int series, double x, double y) {
  const std::string cls = "pt s" + std::to_string(series);
  if (series == 0) {
    return "<circle cx=\"" + SvgNum(x) + "\" cy=\"" + SvgNum(y) +
           "\" r=\"4.5\" class=\"" + cls + "\"/>\n";
  }
  if (series == 1) return SvgRect(x - 4, y - 4, 8, 8, "", cls);
  return "<path d=\"M" + SvgNum(x) + " " + SvgNum(y - 5.5) + " L" + SvgNum(x + 5) + " " +
         SvgNum(y + 3.5) + " L" + SvgNum(x - 5) + " " + SvgNum(y + 3.5) +
         " Z\" class=\"" + cls + "\"/>\n";
}

const char* const kSeriesNames[3] = {"P50", "P80", "P90"};

// A legend row of the three series starting at (x, y).
std::string SeriesLegend(double x, double y) {
  std::string out;
  for (int i = 0; i < 3; ++i) {
    out += SvgLine(x, y - 4, x + 26, y - 4, "series s" + std::to_string(i));
    out += SeriesPoint(i, x + 13, y - 4);
    out += SvgText(x + 32, y, kSeriesNames[i], "start", "legend");
    x += 84;
  }
  return out;
}

// Empirical distribution function as a step path over the completion counts
// of n runs.
std::string EcdfPath(const PlotArea& a, const std::vector<CompletionCount>& counts,
                     long n, double x_hi) {
  const double total = static_cast<double>(n);
  std::string d = "M" + SvgNum(a.x(0.0)) + " " + SvgNum(a.y(0.0));
  auto step_to = [&](double x, long done) {
    d += " H" + SvgNum(a.x(x)) + " V" + SvgNum(a.y(static_cast<double>(done) / total));
  };
  long done = 0;
  if (counts.size() <= kMaxCurvePoints) {
    for (const CompletionCount& c : counts) step_to(c.weeks, done += c.runs);
  } else {
    size_t next = 0;
    for (size_t k = 1; k <= kMaxCurvePoints; ++k) {
      const double x = counts.back().weeks * static_cast<double>(k) / kMaxCurvePoints;
      while (next < counts.size() && counts[next].weeks <= x) done += counts[next++].runs;
      step_to(x, done);
    }
  }
  d += " H" + SvgNum(a.x(x_hi));
  return "<path d=\"" + d + "\" class=\"curve\"/>\n";
}

std::string QuantileLabel(const char* name, double weeks, const Date& start) {
  return StringPrintf("%s: %.1f weeks, %s", name, weeks,
                      FormatDate(DoneByDate(start, weeks)).c_str());
}

}  // namespace

std::string CompletionCurveSvg(const ForecastSummary& s, const Date& start,
                               const Date& deadline) {
  const long n = s.runs;
  if (n <= 0) return "";
  const std::vector<CompletionCount>& counts = s.completion_counts;  // ascending
  long complete = 0;
  for (const CompletionCount& c : counts) complete += c.runs;
  double x_hi = std::max(s.deadline_weeks, counts.empty() ? 0.0 : counts.back().weeks);
  if (complete < n) x_hi = std::max(x_hi, s.horizon_weeks);
  const AxisSpec x_axis = WeeksAxis(x_hi, 10, "Weeks from the start");
  const AxisSpec y_axis = ShareAxis("Campaigns complete, % of runs");

  PlotArea a;
  a.height = 380;
  a.top = 4 * 16 + 14;
  SetDomains(&a, 0.0, x_axis.ticks.back(), 0.0, 1.0);
  std::string out = SvgOpen(a.width, a.height, "Completion-time curve");
  out += SvgAxes(a, x_axis, y_axis);
  out += EcdfPath(a, counts, n, x_axis.ticks.back());

  std::vector<Marker> markers;
  markers.push_back({s.deadline_weeks, "Deadline " + FormatDate(deadline), "deadline"});
  const std::pair<const char*, const QuantileEstimate*> qs[] = {
      {"P50", &s.p50}, {"P80", &s.p80}, {"P90", &s.p90}};
  std::string dots;
  for (const auto& [name, q] : qs) {
    if (!q->value) continue;
    markers.push_back({*q->value, QuantileLabel(name, *q->value, start), "quantile"});
    dots += "<circle cx=\"" + SvgNum(a.x(*q->value)) + "\" cy=\"" + SvgNum(a.y(q->p)) +
            "\" r=\"4\" class=\"dot\"/>\n";
  }
  out += SvgMarkers(a, markers, 4);
  out += dots;
  return out + SvgClose();
}

std::string FillCurveSvg(const ForecastSummary& s, const Date& deadline) {
  if (s.fill_curve.empty()) return "";
  const std::vector<FillPoint>& f = s.fill_curve;
  const AxisSpec x_axis = WeeksAxis(f.back().week, 10, "Weeks from the start");
  const AxisSpec y_axis = ShareAxis("Required cells full, %");
  PlotArea a;
  a.top = 50;  // legend row, then the deadline label
  SetDomains(&a, 0.0, x_axis.ticks.back(), 0.0, 1.0);

  std::string band = "M";
  for (size_t i = 0; i < f.size(); ++i) {
    band += (i ? " L" : "") + SvgNum(a.x(f[i].week)) + " " + SvgNum(a.y(f[i].p90));
  }
  for (size_t i = f.size(); i-- > 0;) {
    band += " L" + SvgNum(a.x(f[i].week)) + " " + SvgNum(a.y(f[i].p10));
  }
  std::string median = "M";
  for (size_t i = 0; i < f.size(); ++i) {
    median += (i ? " L" : "") + SvgNum(a.x(f[i].week)) + " " + SvgNum(a.y(f[i].p50));
  }

  std::string out = SvgOpen(a.width, a.height, "Fill of the capture matrix over time");
  out += SvgAxes(a, x_axis, y_axis);
  out += "<path d=\"" + band + " Z\" class=\"band\"/>\n";
  out += "<path d=\"" + median + "\" class=\"curve\"/>\n";
  out += SvgMarkers(
      a, {{s.deadline_weeks, "Deadline " + FormatDate(deadline), "deadline"}}, 1);
  // Legend above the plot, clear of the curve and of the deadline label.
  const double ly = 16;
  out += SvgLine(a.X0(), ly - 4, a.X0() + 26, ly - 4, "curve");
  out += SvgText(a.X0() + 34, ly, "Median over the runs", "start", "legend");
  out += SvgRect(a.X0() + 200, ly - 10, 26, 12, "", "band");
  out += SvgText(a.X0() + 234, ly, "P10-P90 range of the runs", "start", "legend");
  return out + SvgClose();
}

std::string StartSweepSvg(const std::vector<StartSweepRow>& rows, double deadline_weeks) {
  if (rows.empty()) return "";
  double y_hi = deadline_weeks;
  for (const StartSweepRow& r : rows) {
    for (const QuantileEstimate* q : {&r.p50, &r.p80, &r.p90}) {
      if (q->value) y_hi = std::max(y_hi, *q->value);
    }
  }
  const bool rotate = rows.size() > 6;
  PlotArea a;
  a.height = rotate ? 380 : 340;
  a.top = 34;
  a.bottom = rotate ? 104 : 52;
  const AxisSpec y_axis = WeeksAxis(y_hi * 1.05, 7, "Weeks to completion");
  const double n = static_cast<double>(rows.size());
  SetDomains(&a, -0.5, n - 0.5, 0.0, y_axis.ticks.back());

  std::string out = SvgOpen(a.width, a.height, "Weeks to completion by start date");
  // Category axis: no numeric x ticks; start dates are written below instead.
  out += SvgAxes(a, {{}, WeeksTick, "Campaign start date"}, y_axis);
  for (size_t i = 0; i < rows.size(); ++i) {
    const double px = a.x(static_cast<double>(i));
    const std::string label = FormatDate(rows[i].start);
    out += SvgLine(px, a.Y0(), px, a.Y0() + 5, "tick");
    if (rotate) {
      out +=
          "<text x=\"0\" y=\"0\" text-anchor=\"end\" class=\"tick-label\" "
          "transform=\"translate(" +
          SvgNum(px + 4) + " " + SvgNum(a.Y0() + 14) + ") rotate(-40)\">" + label +
          "</text>\n";
    } else {
      out += SvgText(px, a.Y0() + 19, label, "middle", "tick-label");
    }
  }
  const double dy = a.y(deadline_weeks);
  out += SvgLine(a.X0(), dy, a.X1(), dy, "deadline");
  for (int series = 0; series < 3; ++series) {
    std::string path, points;
    bool pen_down = false;
    for (size_t i = 0; i < rows.size(); ++i) {
      const QuantileEstimate& q = series == 0   ? rows[i].p50
                                  : series == 1 ? rows[i].p80
                                                : rows[i].p90;
      if (!q.value) {
        pen_down = false;  // not reached: a gap in the line
        continue;
      }
      const double px = a.x(static_cast<double>(i)), py = a.y(*q.value);
      path += (pen_down ? " L" : " M") + SvgNum(px) + " " + SvgNum(py);
      points += SeriesPoint(series, px, py);
      pen_down = true;
    }
    if (!path.empty()) {
      out +=
          "<path d=\"" + path + "\" class=\"series s" + std::to_string(series) + "\"/>\n";
    }
    out += points;
  }
  out += SeriesLegend(a.X0(), 18);
  const double lx = a.X0() + 3 * 84 + 10;
  out += SvgLine(lx, 14, lx + 26, 14, "deadline");
  out += SvgText(lx + 32, 18, "Deadline (the same distance from each start)", "start",
                 "legend");
  return out + SvgClose();
}

std::string ComparisonSvg(const Comparison& c) {
  if (c.ranked.empty()) return "";
  double x_hi = 0.0;
  for (const ScenarioResult& r : c.ranked) {
    x_hi = std::max(x_hi, r.summary.deadline_weeks);
    for (const QuantileEstimate* q : {&r.summary.p50, &r.summary.p80, &r.summary.p90}) {
      x_hi = std::max(x_hi, q->value.value_or(r.summary.horizon_weeks));
    }
  }
  PlotArea a;
  a.left = 260;
  a.top = 34;
  a.height = a.top + a.bottom + 34.0 * static_cast<double>(c.ranked.size());
  const AxisSpec x_axis = WeeksAxis(x_hi, 9, "Weeks to completion");
  const double n = static_cast<double>(c.ranked.size());
  SetDomains(&a, 0.0, x_axis.ticks.back(), n - 0.5, -0.5);

  std::string out = SvgOpen(a.width, a.height, "Scenarios: weeks to completion");
  out += SvgAxes(a, x_axis, {{}, WeeksTick, ""});
  for (size_t i = 0; i < c.ranked.size(); ++i) {
    const ScenarioResult& r = c.ranked[i];
    const double py = a.y(static_cast<double>(i));
    std::string name = std::to_string(i + 1) + ". " + r.name;
    if (name.size() > 36) {
      size_t cut = 35;  // back off to the start of a UTF-8 character
      while (cut > 0 && (static_cast<unsigned char>(name[cut]) & 0xC0) == 0x80) --cut;
      name = name.substr(0, cut) + "...";
    }
    out += SvgText(a.X0() - 8, py + 4, HtmlEscape(name), "end", "tick-label");
    const QuantileEstimate* qs[3] = {&r.summary.p50, &r.summary.p80, &r.summary.p90};
    if (qs[0]->value) {
      // Not reached at P90: the range runs off the right edge.
      const double hi = qs[2]->value.value_or(x_axis.ticks.back());
      out += SvgLine(a.x(*qs[0]->value), py, a.x(hi), py, "range");
    }
    for (int k = 0; k < 3; ++k) {
      if (qs[k]->value) out += SeriesPoint(k, a.x(*qs[k]->value), py);
    }
    if (!qs[0]->value) {
      out += SvgText(a.X0() + 8, py + 4, "P50 not reached within the horizon", "start",
                     "legend muted");
    }
  }
  out += SeriesLegend(a.X0(), 18);
  return out + SvgClose();
}

}  // namespace planner
