#include "report/progress_html.h"

#include <algorithm>

#include "planner/progress_report.h"
#include "report/html_escape.h"
#include "report/report_numbers.h"
#include "report/svg_chart.h"

namespace planner {
namespace {

// Inline styles: the page's style sheet belongs to the forecast report, and
// its security policy allows inline styles.
const char kShortStyle[] = " style=\"background:#fbe3cf\"";

std::string Esc(const std::string& s) { return HtmlEscape(s); }
std::string TdNum(const std::string& t) { return "<td class=\"num\">" + t + "</td>"; }
std::string BinText(const Bin& b) { return StringPrintf("%g&ndash;%g", b.lo, b.hi); }

std::string CountCell(const Cell& cell, uint32_t n) {
  const bool short_of = n < static_cast<uint32_t>(cell.required);
  std::string text = StringPrintf("%u / %d", n, cell.required);
  if (short_of) text += " *";
  if (cell.optional) text += " (opt.)";
  return std::string("<td class=\"num\"") + (short_of ? kShortStyle : "") + ">" + text +
         "</td>";
}

std::string LoggedGrids(const Plan& plan, const std::vector<uint32_t>& counts) {
  const CaptureMatrix& m = plan.matrix;
  std::string out;
  for (const StateGrid& g : m.grids) {
    std::string state = OperatingStateName(g.state);
    state[0] = static_cast<char>(state[0] - 'a' + 'A');
    const size_t cols = std::max<size_t>(g.ti_bins_pct.size(), 1);
    out += "<h3>" + state +
           " (valid 10-minute records)</h3>\n<table>\n<tr><th>Wind, m/s</th>";
    for (size_t t = 0; t < cols; ++t) {
      out += "<th class=\"num\">" +
             (g.ti_bins_pct.empty() ? std::string("TI any")
                                    : "TI " + BinText(g.ti_bins_pct[t]) + " %") +
             "</th>";
    }
    out += "</tr>\n";
    for (size_t w = 0; w < g.wind_bins_ms.size(); ++w) {
      out += "<tr><td class=\"label\">" + BinText(g.wind_bins_ms[w]) + "</td>";
      for (size_t t = 0; t < cols; ++t) {
        const int c = g.cell_index[w * cols + t];
        out += c < 0 ? std::string("<td class=\"num\">&mdash;</td>")
                     : CountCell(m.cells[static_cast<size_t>(c)],
                                 counts[static_cast<size_t>(c)]);
      }
      out += "</tr>\n";
    }
    out += "</table>\n";
  }
  std::string events;
  for (size_t c = 0; c < m.cells.size(); ++c) {
    if (m.cells[c].event < 0) continue;
    events += "<tr><td class=\"label\">" +
              Esc(m.event_types[static_cast<size_t>(m.cells[c].event)]) + "</td>" +
              "<td class=\"label\">" + BinText(m.cells[c].wind_ms) + " m/s</td>" +
              CountCell(m.cells[c], counts[c]) + "</tr>\n";
  }
  if (!events.empty()) {
    out +=
        "<h3>Events (counted events)</h3>\n<table>\n<tr><th>Event</th><th>Wind "
        "speed</th><th class=\"num\">Logged / minimum</th></tr>\n" +
        events + "</table>\n";
  }
  return out +
         "<p class=\"note\">Logged count / minimum; a shaded cell marked * is still "
         "short; (opt.) marks an optional cell.</p>\n";
}

std::string ExtensionTable(const Plan& plan, const ProgressSummary& s, int thin_rows) {
  std::string out =
      "<h3>What extending buys</h3>\n<table class=\"dates\">\n<tr><th>Extension</th>"
      "<th>New end</th><th class=\"num\">P(complete)</th><th class=\"num\">Required "
      "cells likely still thin</th></tr>\n";
  out += "<tr><td>none</td><td>" + FormatDate(plan.deadline) + "</td>" +
         TdNum(PercentText(s.p_by_planned_end)) + TdNum("") + "</tr>\n";
  for (const ExtensionRow& e : s.extensions) {
    out += "<tr><td>" + StringPrintf("+%d weeks", e.weeks) + "</td><td>" +
           FormatDate(e.end) + "</td>" +
           TdNum((e.beyond_horizon ? "at least " : "") + PercentText(e.p_complete)) +
           TdNum(std::to_string(e.thin.size())) + "</tr>\n";
  }
  out += "</table>\n<p class=\"note\">Extensions count from " +
         std::string(s.extension_base == plan.deadline ? "the planned end"
                                                       : "the as-of date") +
         " (" + FormatDate(s.extension_base) +
         "). Likely thin: full by the new end in fewer than half of the runs.</p>\n";
  if (s.extensions.empty()) return out;
  const ExtensionRow& last = s.extensions.back();
  out += "<h3>" +
         StringPrintf("Required cells least likely to be full even at +%d weeks",
                      last.weeks) +
         "</h3>\n";
  if (last.uncertain.empty()) {
    return out + "<p>None: every required cell is full by then in every run.</p>\n";
  }
  out +=
      "<table>\n<tr><th>Cell</th><th class=\"num\">Required</th><th "
      "class=\"num\">Logged</th><th class=\"num\">P(full) by the planned end</th>"
      "<th class=\"num\">P(full) by " +
      FormatDate(last.end) + "</th></tr>\n";
  int rows = 0;
  for (const CellAtDate& c : last.uncertain) {
    if (rows++ == thin_rows) break;
    const Cell& cell = plan.matrix.cells[static_cast<size_t>(c.cell)];
    out += "<tr><td class=\"label\">" + Esc(CellLabel(plan.matrix, cell)) + "</td>" +
           TdNum(std::to_string(cell.required)) +
           TdNum(std::to_string(s.logged.counts[static_cast<size_t>(c.cell)])) +
           TdNum(PercentText(
               s.forecast.cells[static_cast<size_t>(c.cell)].p_full_by_deadline)) +
           TdNum(PercentText(c.p_full)) + "</tr>\n";
  }
  return out +
         "</table>\n<p class=\"note\">Cells full by then in fewer than half of "
         "the runs are likely to stay thin.</p>\n";
}

std::string HistoryTable(const std::vector<StoredProgress>& latest) {
  std::string out =
      "<table class=\"dates\">\n<tr><th>As of</th><th class=\"num\">Records</th>"
      "<th>P50 done by</th><th>P80 done by</th><th>P90 done by</th>"
      "<th class=\"num\">P(by the planned end)</th><th class=\"num\">Runs</th></tr>\n";
  for (const StoredProgress& p : latest) {
    auto date = [&p](const std::optional<std::string>& d) {
      return p.complete ? std::string("full") : d.value_or("not reached");
    };
    out += "<tr><td>" + Esc(p.as_of) + "</td>" +
           TdNum(GroupedWhole(static_cast<double>(p.records_used))) + "<td>" +
           Esc(date(p.p50_date)) + "</td><td>" + Esc(date(p.p80_date)) + "</td><td>" +
           Esc(date(p.p90_date)) + "</td>" + TdNum(PercentText(p.p_by_planned_end)) +
           TdNum(std::to_string(p.runs)) + "</tr>\n";
  }
  return out + "</table>\n";
}

std::string Point(int series, double x, double y) {
  return "<circle cx=\"" + SvgNum(x) + "\" cy=\"" + SvgNum(y) + "\" r=\"" +
         (series == 0   ? "4.5"
          : series == 1 ? "3.5"
                        : "2.5") +
         "\" class=\"pt s" + std::to_string(series) + "\"/>\n";
}

}  // namespace

std::string ProgressHistorySvg(const std::vector<StoredProgress>& latest,
                               const Date& start, const Date& planned_end) {
  if (latest.empty()) return "";
  const double end_weeks = static_cast<double>(DaysBetween(start, planned_end)) / 7.0;
  double x_lo = 1e9, x_hi = -1e9, y_hi = end_weeks;
  std::vector<double> xs;
  for (const StoredProgress& p : latest) {
    const std::optional<Date> d = ParseDate(p.as_of);
    const double x = d ? static_cast<double>(DaysBetween(start, *d)) / 7.0 : 0.0;
    xs.push_back(x);
    x_lo = std::min(x_lo, x);
    x_hi = std::max(x_hi, x);
    for (const auto& w : {p.p50_weeks, p.p80_weeks, p.p90_weeks}) {
      if (w) y_hi = std::max(y_hi, *w);
    }
  }
  if (x_hi - x_lo < 1.0) x_lo -= 1.0, x_hi += 1.0;
  PlotArea a;
  a.top = 34;
  const std::vector<double> x_ticks = NiceTicks(std::max(0.0, x_lo), x_hi, 7);
  const std::vector<double> y_ticks = NiceTicks(0.0, y_hi * 1.05, 7);
  SetDomains(&a, x_ticks.front(), x_ticks.back(), 0.0, y_ticks.back());
  auto date_tick = [start](double weeks) {
    return FormatDate(AddDays(start, static_cast<int64_t>(weeks * 7.0 + 0.5)));
  };
  std::string out = SvgOpen(a.width, a.height, "Forecast end by as-of date");
  out += SvgAxes(a, {x_ticks, date_tick, "As-of date"},
                 {y_ticks, [](double w) { return SvgNum(w); },
                  "Forecast end, weeks from the start"});
  const double dy = a.y(end_weeks);
  out += SvgLine(a.X0(), dy, a.X1(), dy, "deadline");
  for (int series = 0; series < 3; ++series) {
    std::string path, points;
    bool pen_down = false;
    for (size_t i = 0; i < latest.size(); ++i) {
      const StoredProgress& p = latest[i];
      const std::optional<double>& w = series == 0   ? p.p50_weeks
                                       : series == 1 ? p.p80_weeks
                                                     : p.p90_weeks;
      if (!w) {
        pen_down = false;
        continue;
      }
      const double px = a.x(xs[i]), py = a.y(*w);
      path += (pen_down ? " L" : " M") + SvgNum(px) + " " + SvgNum(py);
      points += Point(series, px, py);
      pen_down = true;
    }
    if (!path.empty()) {
      out +=
          "<path d=\"" + path + "\" class=\"series s" + std::to_string(series) + "\"/>\n";
    }
    out += points;
  }
  double lx = a.X0();
  const char* names[3] = {"P50", "P80", "P90"};
  for (int i = 0; i < 3; ++i, lx += 84) {
    out += SvgLine(lx, 14, lx + 26, 14, "series s" + std::to_string(i));
    out += Point(i, lx + 13, 14);
    out += SvgText(lx + 32, 18, names[i], "start", "legend");
  }
  out += SvgLine(lx + 10, 14, lx + 36, 14, "deadline");
  out +=
      SvgText(lx + 42, 18, "Planned end " + FormatDate(planned_end), "start", "legend");
  return out + SvgClose();
}

std::string ProgressHtmlSection(const HtmlReportInput& in) {
  if (in.progress == nullptr || in.progress->summary == nullptr) return "";
  const Plan& plan = *in.plan;
  const ProgressSummary& s = *in.progress->summary;
  std::string out = "<section id=\"progress\">\n<h2>Progress as of " +
                    FormatDate(s.as_of) + "</h2>\n<ul class=\"facts\">\n";
  out += "<li><b>Logged:</b> " +
         GroupedWhole(static_cast<double>(s.logged.records_used)) +
         " 10-minute records from the start to the as-of date, " +
         GroupedWhole(static_cast<double>(s.logged.counted_records)) +
         " of them counted for a cell, and " +
         GroupedWhole(static_cast<double>(s.logged.counted_events)) +
         " events (log: <code>" + Esc(in.progress->log_path) + "</code>).</li>\n";
  if (s.already_complete) {
    out += "<li><b>The capture matrix is full.</b> Remaining weeks: 0.</li>\n";
  } else {
    auto left = [](const std::optional<double>& w) {
      return w ? StringPrintf("%.1f", *w) : std::string("not reached");
    };
    out += "<li><b>Weeks still to go</b> from the as-of date: P50 " +
           left(s.remaining_p50) + ", P80 " + left(s.remaining_p80) + ", P90 " +
           left(s.remaining_p90) + ".</li>\n";
  }
  out += "<li><b>Complete by the planned end</b> (" + FormatDate(plan.deadline) +
         "): " + PercentText(s.p_by_planned_end) +
         (s.already_complete ? "" : " of the simulated continuations") + ".</li>\n";
  out +=
      "</ul>\n<p class=\"note\">The rest of this report forecasts the remainder: "
      "each simulated campaign starts on the as-of date with the logged counts and "
      "the latest logged wind; weeks count from the plan's start.</p>\n";
  out += LoggedGrids(plan, s.logged.counts);
  if (!s.already_complete) out += ExtensionTable(plan, s, in.context.thin_cell_rows);
  const std::vector<StoredProgress> latest = LatestPerAsOf(in.progress->history);
  out += "<h3>How the forecast moved</h3>\n";
  const std::string svg = ProgressHistorySvg(latest, plan.start, plan.deadline);
  if (svg.empty()) {
    out += "<p>No progress forecast is stored in the log yet.</p>\n";
  } else {
    out += "<figure>\n" + svg +
           "<figcaption>Forecast end (P50, P80, P90; weeks from the start) of each "
           "stored progress forecast against its as-of date; orange line: the planned "
           "end. A missing point was not reached within the horizon.</figcaption>\n"
           "</figure>\n" +
           HistoryTable(latest);
  }
  return out + "</section>\n";
}

}  // namespace planner
