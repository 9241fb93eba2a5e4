// FormatHtmlReport (planner/report_files.h): the page a manager reads. The
// charts live in report/report_charts.h and report/matrix_grid.h, the style
// sheet in report/html_style.h; this file writes the sections in order.
#include <cctype>
#include <cmath>
#include <stdexcept>

#include "io/file_seal.h"
#include "planner/reachability.h"
#include "planner/report_files.h"
#include "planner/weather_source.h"
#include "report/cautions.h"
#include "report/html_escape.h"
#include "report/html_style.h"
#include "report/matrix_grid.h"
#include "report/progress_html.h"
#include "report/report_charts.h"
#include "report/report_numbers.h"
#include "report/text_format.h"

namespace planner {
namespace {

const std::string kDash = "\u2013";  // en dash for ranges

std::string Esc(const std::string& s) { return HtmlEscape(s); }

std::string Td(const std::string& text) { return "<td>" + text + "</td>"; }
std::string TdNum(const std::string& text) {
  return "<td class=\"num\">" + text + "</td>";
}

std::string WeeksOrNotReached(const std::optional<double>& w) {
  return w ? StringPrintf("%.1f", *w) : std::string("not reached");
}

std::string DateOrDash(const Date& start, const std::optional<double>& w) {
  return w ? FormatDate(DoneByDate(start, *w)) : std::string("&mdash;");
}

// "46.5 (44.9–48.1)": weeks and the 95 % interval, for tables.
std::string WeeksWithCi(const QuantileEstimate& q) {
  if (!q.value) return "not reached";
  return StringPrintf("%.1f", *q.value) + " <span class=\"note\">(" +
         CiText(q, kDash.c_str()) + ")</span>";
}

std::string OptionalMoney(const std::optional<double>& x, const std::string& currency) {
  return x ? Esc(Money(*x, currency)) : std::string("&mdash;");
}

// ---- header and summary ------------------------------------------------------

// The page's security policy forbids every fetch and every script: whatever
// the browser, opening the file reaches no network, and anything that tried
// would show as a policy error in the browser's console (the browser test
// checks that the console stays empty).
std::string PageHead(const HtmlReportInput& in) {
  const std::string& version = in.context.tool_version;
  return "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n"
         "<meta name=\"generator\" content=\"fillcast " +
         Esc(version) + "\">\n<meta name=\"fillcast-seal\" content=\"" +
         kSealPlaceholder +
         "\">\n"
         "<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; "
         "style-src 'unsafe-inline'; img-src data:\">\n"
         "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n"
         "<title>Campaign forecast: " +
         Esc(in.plan->name) + "</title>\n<style>" + HtmlReportStyle() +
         "</style>\n</head>\n<body>\n";
}

std::string PageHeader(const HtmlReportInput& in) {
  const Plan& plan = *in.plan;
  const ForecastSummary& s = *in.forecast;
  std::string out = "<header class=\"report\">\n<h1>" + Esc(plan.name) + "</h1>\n";
  out += "<p class=\"meta\">Site: " + Esc(plan.site.name);
  if (!plan.turbine.name.empty()) out += " &middot; Turbine: " + Esc(plan.turbine.name);
  out += "</p>\n<p class=\"meta\">Campaign from " + FormatDate(plan.start) +
         ", deadline " + FormatDate(plan.deadline) +
         StringPrintf(" (%.1f weeks) &middot; %ld simulated campaigns", s.deadline_weeks,
                      s.runs) +
         "</p>\n<p class=\"meta\">Forecast by fillcast " + Esc(in.context.tool_version) +
         "</p>\n</header>\n";
  return out;
}

std::string KeyBox(const char* title, const QuantileEstimate& q, const Plan& plan,
                   const ForecastSummary& s) {
  std::string out =
      "<div class=\"key\">\n<p class=\"key-name\">" + std::string(title) + "</p>\n";
  if (!q.value) {
    out += "<p class=\"key-date\">not reached</p>\n<p class=\"key-detail\">" +
           StringPrintf("beyond the %.0f-week horizon", s.horizon_weeks) + "</p>\n";
    return out + "</div>\n";
  }
  out +=
      "<p class=\"key-date\">" + FormatDate(DoneByDate(plan.start, *q.value)) + "</p>\n";
  out += "<p class=\"key-detail\">" + StringPrintf("%.1f weeks", *q.value) +
         " (95 % CI " + CiText(q, kDash.c_str()) + ")</p>\n";
  if (plan.cost.weekly > 0) {
    out += "<p class=\"key-cost\">Cost " +
           Esc(Money(CampaignCost(plan.cost, *q.value), plan.cost.currency)) + "</p>\n";
  }
  return out + "</div>\n";
}

std::string CostFact(const Plan& plan, const ForecastSummary& s) {
  const CostModel& c = plan.cost;
  if (!(c.weekly > 0)) {
    return "<li><b>Cost:</b> the plan gives no weekly cost, so no cost is shown.</li>\n";
  }
  auto at = [&](const char* name, const QuantileEstimate& q) {
    return std::string(name) + " " +
           (q.value ? Esc(Money(CampaignCost(c, *q.value), c.currency))
                    : std::string("not reached"));
  };
  return "<li><b>Cost:</b> " + at("at P50", s.p50) + "; " + at("at P80", s.p80) +
         " <span class=\"note\">(" + Esc(Money(c.weekly, c.currency)) +
         " a week &times; weeks + " + Esc(Money(c.mobilisation, c.currency)) +
         " mobilisation)</span>.</li>\n";
}

std::string SummarySection(const HtmlReportInput& in) {
  const Plan& plan = *in.plan;
  const ForecastSummary& s = *in.forecast;
  std::string out = "<section id=\"summary\">\n<h2>In one minute</h2>\n";
  out +=
      "<p>Dates by which the capture matrix is full (every required cell at its "
      "minimum) in half, four in five and nine in ten of the simulated "
      "campaigns.</p>\n<div class=\"keys\">\n";
  out += KeyBox("P50: half of the campaigns done by", s.p50, plan, s);
  out += KeyBox("P80: four in five done by", s.p80, plan, s);
  out += KeyBox("P90: nine in ten done by", s.p90, plan, s);
  out += "</div>\n<ul class=\"facts\">\n";
  out += "<li><b>Complete by the deadline</b> (" + FormatDate(plan.deadline) + "): <b>" +
         PercentText(s.p_complete_by_deadline) +
         "</b> of the simulated campaigns.</li>\n";
  out += CostFact(plan, s);
  out += "<li><b>Main bottleneck:</b> " + Esc(BottleneckSentence(plan.matrix, s)) +
         "</li>\n";
  if (s.p_incomplete_at_horizon > 0) {
    out += "<li>" + PercentText(s.p_incomplete_at_horizon) +
           StringPrintf(" of the runs were not complete within the %.0f-week horizon.",
                        s.horizon_weeks) +
           "</li>\n";
  }
  const Reachability reach = FindUnreachableCells(plan);
  for (const UnreachableCell& u : reach.cells) {
    out += "<li><b>Can never fill" + std::string(u.required ? "" : " (optional)") +
           ":</b> " + Esc(u.reason) + "</li>\n";
  }
  if (!reach.CanComplete()) out += "<li>" + Esc(UnreachableAdvice(reach)) + "</li>\n";
  out +=
      "</ul>\n<p class=\"note\">The 95 % intervals show the Monte-Carlo uncertainty "
      "only (more runs narrow them), not whether the site model is right. This is an "
      "estimate, not a promise: see the cautions at the end.</p>\n</section>\n";
  return out;
}

// ---- completion, matrix, fill -----------------------------------------------

std::string CompletionSection(const HtmlReportInput& in) {
  const ForecastSummary& s = *in.forecast;
  std::string out = "<section id=\"completion\">\n<h2>Completion-time curve</h2>\n";
  const std::string svg = CompletionCurveSvg(s, in.plan->start, in.plan->deadline);
  if (svg.empty()) return out + "<p>No runs to draw.</p>\n</section>\n";
  out += "<figure>\n" + svg +
         "<figcaption>Share of the simulated campaigns whose capture matrix was full, "
         "against weeks from the start (" +
         FormatDate(in.plan->start) +
         "). Dashed lines: P50, P80 and P90 with their done-by dates; orange line: the "
         "deadline.";
  if (s.p_incomplete_at_horizon > 0) {
    out += " The curve stops below 100 % because " +
           PercentText(s.p_incomplete_at_horizon) +
           " of the runs did not complete within the horizon.";
  }
  return out + "</figcaption>\n</figure>\n</section>\n";
}

// The columns both cell tables share, after the cell's name.
std::string CellColumnsHead() {
  return "<th class=\"num\">Required</th><th class=\"num\">Expected</th>"
         "<th class=\"num nowrap\">P10" +
         kDash +
         "P90</th><th class=\"num\">P(full)</th>"
         "<th class=\"num\">Weeks to full (P50)</th><th class=\"num\">Last to fill</th>";
}

std::string CellColumns(const CellForecast& c) {
  return TdNum(std::to_string(c.cell.required)) +
         TdNum(StringPrintf("%.1f", c.count_mean)) +
         TdNum(StringPrintf("%.0f", c.count_p10) + kDash +
               StringPrintf("%.0f", c.count_p90)) +
         TdNum(PercentText(c.p_full_by_deadline)) +
         TdNum(WeeksOrNotReached(c.weeks_to_full_p50)) +
         TdNum(PercentText(c.p_last_to_fill));
}

// Opens a cell's table row; the bottleneck's row is set in bold.
std::string RowStart(const CellForecast& c, const ForecastSummary& s) {
  return c.index == s.bottleneck_cell
             ? "<tr class=\"bottleneck-row\"><td class=\"label\">"
             : "<tr><td class=\"label\">";
}

const char kCellColumnsNote[] =
    "Expected and P10"
    "\u2013"
    "P90: count at the deadline over the runs (valid 10-minute "
    "records; for events, events with a valid record). P(full): share of runs with the "
    "cell full by the deadline. Weeks to full: from the start, when half of the runs had "
    "the cell full. Last to fill: share of runs in which this cell was the last to fill; "
    "a row in bold is the cell most often last to fill.";

std::string ThinCellsTable(const Plan& plan, const ForecastSummary& s, int rows) {
  const std::vector<const CellForecast*> thin = ThinnestCells(s, rows, false);
  if (thin.empty()) return "";
  bool savings = false;
  for (const CellForecast* c : thin) savings = savings || c->saved_p80_if_optional;
  std::string out =
      "<h3>Cells least likely to be full by the deadline</h3>\n<table>\n"
      "<tr><th>Cell</th>" +
      CellColumnsHead();
  if (savings) out += "<th class=\"num\">Saved at P80 if optional, weeks</th>";
  out += "</tr>\n";
  for (const CellForecast* c : thin) {
    out += RowStart(*c, s) + Esc(CellLabel(plan.matrix, c->cell)) + "</td>" +
           CellColumns(*c);
    if (savings) {
      out +=
          TdNum(c->saved_p80_if_optional ? StringPrintf("%.1f", *c->saved_p80_if_optional)
                                         : "&mdash;");
    }
    out += "</tr>\n";
  }
  out += "</table>\n<p class=\"note\">" + std::string(kCellColumnsNote);
  if (savings) {
    out +=
        " Saved: how many weeks sooner P80 completion would come if the cell were "
        "optional (from the same runs).";
  }
  return out + "</p>\n";
}

std::string EventCellsTable(const Plan& plan, const ForecastSummary& s) {
  std::string rows;
  for (const CellForecast& c : s.cells) {
    if (c.cell.event < 0) continue;
    const bool named = c.cell.event < static_cast<int>(plan.matrix.event_types.size());
    rows += RowStart(c, s) +
            (named ? Esc(plan.matrix.event_types[static_cast<size_t>(c.cell.event)])
                   : std::string("?")) +
            "</td><td class=\"label\">" + StringPrintf("%g", c.cell.wind_ms.lo) + kDash +
            StringPrintf("%g m/s", c.cell.wind_ms.hi) + "</td>" + CellColumns(c) +
            Td(c.cell.optional ? "yes" : "no") + "</tr>\n";
  }
  if (rows.empty()) return "";
  return "<h3>Event cells</h3>\n<table>\n<tr><th>Event</th><th>Wind speed</th>" +
         CellColumnsHead() + "<th>Optional</th></tr>\n" + rows + "</table>\n" +
         "<p class=\"note\">" + kCellColumnsNote + "</p>\n";
}

std::string MatrixSection(const HtmlReportInput& in) {
  const Plan& plan = *in.plan;
  const ForecastSummary& s = *in.forecast;
  std::string out =
      "<section id=\"matrix\" class=\"page\">\n<h2>Capture matrix at the "
      "deadline</h2>\n<p>Each cell is coloured by the share of runs in "
      "which it was full by the deadline (" +
      FormatDate(plan.deadline) + ").</p>\n<figure>\n" + MatrixLegendSvg() +
      "</figure>\n";
  for (const StateGrid& g : plan.matrix.grids) {
    std::string state = OperatingStateName(g.state);
    if (!state.empty()) state[0] = static_cast<char>(std::toupper(state[0]));
    out += "<h3>" + state + "</h3>\n<figure>\n" + StateGridSvg(plan.matrix, g, s) +
           "</figure>\n";
  }
  out += ThinCellsTable(plan, s, in.context.thin_cell_rows);
  out += EventCellsTable(plan, s);
  return out + "</section>\n";
}

std::string FillSection(const HtmlReportInput& in) {
  const std::string svg = FillCurveSvg(*in.forecast, in.plan->deadline);
  std::string out = "<section id=\"fill\">\n<h2>Fill over time</h2>\n";
  if (svg.empty()) return out + "<p>Not available for this result.</p>\n</section>\n";
  return out + "<figure>\n" + svg +
         "<figcaption>Share of the required cells that are full, week by week: the "
         "median over the runs and the range from the 10th to the 90th percentile. A "
         "long flat stretch near the top means a few cells hold the campaign up."
         "</figcaption>\n</figure>\n</section>\n";
}

// ---- optional sections ---------------------------------------------------------

std::string SiteSpreadSection(const HtmlReportInput& in) {
  const ForecastSummary& s = *in.forecast;
  if (!s.site_exact) return "";
  const SiteModelSpread& e = *s.site_exact;
  auto weeks = [](const QuantileEstimate& q) {
    return TdNum(q.value ? StringPrintf("%.1f", *q.value) : std::string("not reached"));
  };
  std::string out = StringPrintf(
      "<section id=\"site-spread\">\n<h2>Spread from the weather and from the site "
      "model</h2>\n<p>The site model states its mean wind speed to %g %% (one standard "
      "deviation); each simulated campaign draws its own. Weeks from the start:</p>\n"
      "<table>\n<thead><tr><th></th><th>P10</th><th>P50</th><th>P80</th><th>P90</th>"
      "<th>Complete by the deadline</th></tr></thead>\n<tbody>\n",
      e.mean_speed_uncertainty_pct);
  out += "<tr>" + Td("weather alone (site model taken as exact)") + weeks(e.p10) +
         weeks(e.p50) + weeks(e.p80) + weeks(e.p90) +
         TdNum(PercentText(e.p_complete_by_deadline)) + "</tr>\n";
  out += "<tr>" + Td("weather and site model (this forecast)") + weeks(s.p10) +
         weeks(s.p50) + weeks(s.p80) + weeks(s.p90) +
         TdNum(PercentText(s.p_complete_by_deadline)) + "</tr>\n";
  return out + "</tbody>\n</table>\n</section>\n";
}

std::string HoldUpsSection(const HtmlReportInput& in) {
  const ForecastSummary& s = *in.forecast;
  if (s.hold_ups.empty()) return "";
  auto weeks = [](const std::optional<double>& w) {
    return w ? StringPrintf("%.1f", *w) : std::string("not reached");
  };
  std::string out =
      "<section id=\"hold-ups\">\n<h2>What holds the campaign up</h2>\n"
      "<table>\n<thead><tr><th>Switched off</th><th>P50, weeks</th><th>P80, weeks</th>"
      "<th>P80 saved, weeks</th><th>Complete by the deadline</th></tr></thead>\n<tbody>\n";
  out += "<tr>" + Td("nothing: the forecast above") + TdNum(weeks(s.p50.value)) +
         TdNum(weeks(s.p80.value)) + TdNum("") +
         TdNum(PercentText(s.p_complete_by_deadline)) + "</tr>\n";
  for (const HoldUp& h : s.hold_ups) {
    out += "<tr>" + Td(Esc(h.label)) + TdNum(weeks(h.p50.value)) +
           TdNum(weeks(h.p80.value)) +
           TdNum(h.p80_saved_weeks ? StringPrintf("%.1f", *h.p80_saved_weeks) : "-") +
           TdNum(PercentText(h.p_complete_by_deadline)) + "</tr>\n";
  }
  return out + StringPrintf(
                   "</tbody>\n</table>\n<p class=\"note\">Each row repeats the same %ld "
                   "runs and seed with one process of the plan switched off, so the "
                   "weather is the same run by run and the difference is what that "
                   "process costs.</p>\n</section>\n",
                   s.runs);
}

std::string SweepSection(const HtmlReportInput& in) {
  const std::vector<StartSweepRow>& rows = in.start_sweep;
  if (rows.empty()) return "";
  std::string out =
      "<section id=\"start-sweep\" class=\"page\">\n<h2>Start date</h2>\n"
      "<p>The same plan started on other dates, its deadline moved by the "
      "same number of days, on the same random numbers.</p>\n<figure>\n" +
      StartSweepSvg(rows, in.forecast->deadline_weeks) +
      "<figcaption>Weeks to a full matrix at P50, P80 and P90 for each start "
      "date. A missing point is not reached within the horizon."
      "</figcaption>\n</figure>\n<table class=\"dates\">\n<tr><th>Start</th><th>Deadline"
      "</th><th class=\"num\">P50 weeks</th><th>P50 done by</th>"
      "<th class=\"num\">P80 weeks</th><th>P80 done by</th>"
      "<th class=\"num\">P90 weeks</th><th>P90 done by</th>"
      "<th class=\"num\">P(complete by the deadline)</th></tr>\n";
  for (const StartSweepRow& r : rows) {
    out += "<tr>" + Td(FormatDate(r.start)) + Td(FormatDate(r.deadline));
    for (const QuantileEstimate* q : {&r.p50, &r.p80, &r.p90}) {
      out += TdNum(WeeksOrNotReached(q->value)) + Td(DateOrDash(r.start, q->value));
    }
    out += TdNum(PercentText(r.p_complete_by_deadline)) + "</tr>\n";
  }
  return out + "</table>\n</section>\n";
}

std::string RankPhrase(RankBy r) {
  switch (r) {
    case RankBy::kP50:
      return "P50 weeks to completion";
    case RankBy::kP80:
      return "P80 weeks to completion";
    case RankBy::kP90:
      return "P90 weeks to completion";
    case RankBy::kExpectedCost:
      return "expected cost";
  }
  return "?";
}

std::string PairedText(const PairedDifference& d) {
  std::string out = "<p><b>Best two, paired on the same runs:</b> ";
  if (d.pairs == 0) {
    return out + "no run completed under both " + Esc(d.a) + " and " + Esc(d.b) +
           ", so there is no paired difference; " + Esc(d.a) + " completed sooner in " +
           PercentText(d.p_a_sooner) + " of all runs.</p>\n";
  }
  out += Esc(d.b) + " takes " +
         StringPrintf("%.1f weeks %s", std::fabs(d.mean_weeks),
                      d.mean_weeks >= 0 ? "longer" : "less") +
         " than " + Esc(d.a) + " on average";
  if (d.pairs > 1) out += StringPrintf(" (standard error %.1f weeks)", d.se_weeks);
  out += StringPrintf(", over the %ld runs in which both completed; ", d.pairs) +
         Esc(d.a) + " completed sooner in " + PercentText(d.p_a_sooner) +
         " of all runs.</p>\n";
  return out;
}

std::string ComparisonSection(const HtmlReportInput& in) {
  if (in.comparison == nullptr || in.comparison->ranked.empty()) return "";
  const Comparison& c = *in.comparison;
  std::string out =
      "<section id=\"comparison\" class=\"page\">\n<h2>Sites and "
      "scenarios</h2>\n<p>Ranked by " +
      RankPhrase(c.rank_by) +
      ", best first. All scenarios ran on the same random numbers, so "
      "their differences are not Monte-Carlo noise.</p>\n<figure>\n" +
      ComparisonSvg(c) +
      "<figcaption>Weeks to a full matrix: P50 (circle), P80 (square) and "
      "P90 (triangle). A bar that runs to the edge is not reached within "
      "the horizon.</figcaption>\n</figure>\n";
  bool costs = false;
  for (const ScenarioResult& r : c.ranked) {
    costs = costs || r.cost.weekly > 0 || r.cost.mobilisation > 0;
  }
  out +=
      "<table>\n<tr><th class=\"num\">#</th><th>Scenario</th>"
      "<th class=\"num\">P50, weeks</th><th class=\"num\">P80, weeks</th>"
      "<th class=\"num\">P90, weeks</th><th class=\"num\">P(deadline)</th>";
  if (costs) {
    out +=
        "<th class=\"num\">Cost at P50</th><th class=\"num\">Cost at P80</th>"
        "<th class=\"num\">Expected cost</th>";
  }
  out += "</tr>\n";
  for (size_t i = 0; i < c.ranked.size(); ++i) {
    const ScenarioResult& r = c.ranked[i];
    const std::string& cur = r.cost.currency;
    out += "<tr>" + TdNum(std::to_string(i + 1)) + "<td class=\"scenario\">" +
           Esc(r.name) +
           (r.file.empty() ? "" : "<br><code class=\"note\">" + Esc(r.file) + "</code>") +
           "</td>" + TdNum(WeeksWithCi(r.summary.p50)) +
           TdNum(WeeksWithCi(r.summary.p80)) + TdNum(WeeksWithCi(r.summary.p90)) +
           TdNum(PercentText(r.summary.p_complete_by_deadline));
    if (costs) {
      out += TdNum(OptionalMoney(r.cost_p50, cur)) +
             TdNum(OptionalMoney(r.cost_p80, cur)) +
             TdNum((r.expected_cost_is_lower_bound ? "at least " : "") +
                   Esc(Money(r.expected_cost, cur)));
    }
    out += "</tr>\n";
  }
  out +=
      "</table>\n<p class=\"note\">Weeks from each scenario's start, with the 95 % "
      "confidence interval in brackets. P(deadline): share of runs complete by the "
      "scenario's deadline.";
  if (costs) {
    out +=
        " Cost: weekly cost &times; weeks + mobilisation; the expected cost averages "
        "over the runs and is a lower bound (\"at least\") when some runs did not "
        "complete within the horizon.";
  }
  out += "</p>\n";
  if (c.best_two) out += PairedText(*c.best_two);
  return out + "</section>\n";
}

// ---- diagnostics, inputs, cautions ---------------------------------------------

std::string DiagnosticsSection(const Plan& plan, const ForecastSummary& s) {
  std::string out =
      "<section id=\"diagnostics\">\n<h2>What the simulated time looked "
      "like</h2>\n<table class=\"inputs\">\n";
  auto row = [](const char* name, const std::string& value) {
    return "<tr><th>" + std::string(name) + "</th>" + TdNum(value) + "</tr>\n";
  };
  out += row("Turbine available", PercentText(s.turbine_availability));
  out += row("Data acquisition available", PercentText(s.daq_availability));
  if (!plan.channel_groups.empty())
    out += row("All load channels counting", PercentText(s.channels_availability));
  out += row("Wind from a valid measurement sector", PercentText(s.valid_sector_share));
  out += row("Curtailment rule in force", PercentText(s.curtailed_share));
  out += row("Mean wind speed at hub height", StringPrintf("%.2f m/s", s.mean_speed_ms));
  return out +
         "</table>\n<p class=\"note\">Shares of all simulated 10-minute "
         "records.</p>\n</section>\n";
}

std::string InputsSection(const HtmlReportInput& in) {
  const Plan& plan = *in.plan;
  const ForecastSummary& s = *in.forecast;
  std::string out =
      "<section id=\"inputs\" class=\"page\">\n<h2>Inputs and seed</h2>\n"
      "<table class=\"inputs\">\n";
  auto row = [](const char* name, const std::string& value) {
    return "<tr><th>" + std::string(name) + "</th><td>" + value + "</td></tr>\n";
  };
  out += row("Plan", Esc(plan.name));
  if (!plan.source_file.empty())
    out += row("Plan file", "<code>" + Esc(plan.source_file) + "</code>");
  out += row("Site model", Esc(plan.site.name));
  if (!plan.site_file.empty())
    out += row("Site model file", "<code>" + Esc(plan.site_file) + "</code>");
  out += row("Weather", Esc(WeatherSourceText(plan)));
  if (!plan.turbine.name.empty()) out += row("Turbine", Esc(plan.turbine.name));
  out += row("Cut-in / cut-out / restart",
             StringPrintf("%g / %g / %g m/s", plan.turbine.cut_in_ms,
                          plan.turbine.cut_out_ms, plan.turbine.restart_ms));
  if (const std::string h = HighWindText(plan.turbine); !h.empty())
    out += row("High-wind stops", Esc(h));
  if (const std::string e = EpisodesText(plan); !e.empty())
    out += row("Episodes", Esc(e));
  if (const std::string c = ChannelGroupsText(plan); !c.empty())
    out += row("Load-channel groups", Esc(c));
  out += row("Start", FormatDate(plan.start) + " (00:00)");
  out += row("Deadline", FormatDate(plan.deadline) +
                             StringPrintf(" (exclusive; %.1f weeks after the start)",
                                          s.deadline_weeks));
  out += row("Horizon", StringPrintf("%.0f weeks", s.horizon_weeks));
  out += row("Capture matrix",
             StringPrintf("%zu cells, %d required", plan.matrix.cells.size(),
                          RequiredCellCount(plan.matrix)));
  out += row("Runs", std::to_string(s.runs));
  out += row("Seed", std::to_string(s.seed));
  out += row("Threads",
             std::to_string(in.context.threads) +
                 " <span class=\"note\">(the numbers do not depend on it)</span>");
  if (!in.command_line.empty())
    out += row("Command", "<code>" + Esc(in.command_line) + "</code>");
  out += row("Program", "fillcast " + Esc(in.context.tool_version));
  return out + "</table>\n</section>\n";
}

std::string CautionsSection() {
  std::string out =
      "<section id=\"cautions\">\n<h2>Cautions</h2>\n<ul class=\"facts\">\n";
  for (const std::string& c : StandardCautions()) out += "<li>" + Esc(c) + "</li>\n";
  return out + "</ul>\n</section>\n";
}

}  // namespace

std::string FormatHtmlReport(const HtmlReportInput& in) {
  if (in.plan == nullptr || in.forecast == nullptr) {
    throw std::logic_error("FormatHtmlReport needs a plan and a forecast");
  }
  std::string out = PageHead(in);
  out += PageHeader(in);
  out += "<main>\n";
  out += SummarySection(in);
  out += ProgressHtmlSection(in);
  out += CompletionSection(in);
  out += SiteSpreadSection(in);
  out += MatrixSection(in);
  out += FillSection(in);
  out += HoldUpsSection(in);
  out += SweepSection(in);
  out += ComparisonSection(in);
  out += DiagnosticsSection(*in.plan, *in.forecast);
  out += InputsSection(in);
  out += CautionsSection();
  out += "</main>\n<footer>Written by fillcast " + Esc(in.context.tool_version) +
         ". Same plan, runs and seed give the same numbers.</footer>\n</body>\n</html>\n";
  return out;
}

}  // namespace planner
