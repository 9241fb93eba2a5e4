#include "planner/forecast_report.h"

#include <algorithm>
#include <cmath>
#include <cstdarg>
#include <cstdio>
#include <nlohmann/json.hpp>
#include <sstream>

#include "io/file_seal.h"
#include "planner/decision.h"
#include "planner/reachability.h"
#include "planner/weather_source.h"
#include "report/cautions.h"
#include "report/report_numbers.h"
#include "report/text_format.h"

namespace planner {
namespace {

using Json = nlohmann::ordered_json;

// Widest cell label in the thin-cell table: its other columns take 58.
constexpr size_t kMaxLabelWidth = 42;

// Situational notes on this particular result (the fixed cautions follow).
std::vector<std::string> ResultNotes(const ForecastSummary& s) {
  std::vector<std::string> notes;
  if (s.runs > 0 && s.runs < 1000) {
    notes.push_back(
        StringPrintf("Only %ld runs: the 95 %% intervals are wide and the shares are "
                     "coarse; more runs narrow them.",
                     s.runs));
  }
  if (s.p_incomplete_at_horizon > 0) {
    notes.push_back(StringPrintf(
        "%s of runs did not complete within the %s-week horizon. A quantile that "
        "falls among those runs is shown as not reached, and there is no mean.",
        Percent(s.p_incomplete_at_horizon).c_str(), Compact(s.horizon_weeks).c_str()));
  }
  long never_full = 0;
  for (const CellForecast& c : s.cells) {
    if (!c.cell.optional && c.p_full_by_deadline == 0.0) ++never_full;
  }
  if (s.runs > 0 && never_full > 0) {
    notes.push_back(
        StringPrintf("%ld required cell%s full by the deadline in no run: the "
                     "deadline cannot be met as planned.",
                     never_full, never_full == 1 ? " was" : "s were"));
  }
  return notes;
}

// Required cells that were short of their minimum when runs stopped at the
// horizon, most often short first; at most this many are named.
constexpr size_t kMaxHeldUpCells = 5;

std::vector<const CellForecast*> HeldUpCells(const ForecastSummary& s) {
  std::vector<const CellForecast*> cells;
  for (const CellForecast& c : s.cells) {
    if (!c.cell.optional && c.p_not_full_at_end > 0.0) cells.push_back(&c);
  }
  std::stable_sort(cells.begin(), cells.end(),
                   [](const CellForecast* a, const CellForecast* b) {
                     return a->p_not_full_at_end > b->p_not_full_at_end;
                   });
  return cells;
}

long RunCount(double share, long runs) {
  return std::lround(share * static_cast<double>(runs));
}

// "No run completed within the 156-week horizon; ..." naming the cells that
// held the incomplete runs up ("" when every run completed).
std::string HeldUpSentence(const Plan& plan, const ForecastSummary& s) {
  const long incomplete = RunCount(s.p_incomplete_at_horizon, s.runs);
  if (s.runs <= 0 || incomplete == 0) return "";
  const bool none_done = incomplete == s.runs;
  std::string out = none_done
                        ? StringPrintf("No run completed within the %s-week horizon",
                                       Compact(s.horizon_weeks).c_str())
                        : StringPrintf(
                              "%ld of %ld runs did not complete within the %s-week "
                              "horizon",
                              incomplete, s.runs, Compact(s.horizon_weeks).c_str());
  const std::vector<const CellForecast*> cells = HeldUpCells(s);
  std::string list;
  for (size_t i = 0; i < cells.size() && i < kMaxHeldUpCells; ++i) {
    const long n = RunCount(cells[i]->p_not_full_at_end, s.runs);
    const std::string in_runs =
        n >= incomplete ? (none_done ? "in every run" : "in every one of them")
                        : StringPrintf("in %ld of them", n);
    list += (list.empty() ? "" : "; ") + CellLabel(plan.matrix, cells[i]->cell) + " (" +
            in_runs + ")";
  }
  if (cells.size() > kMaxHeldUpCells) {
    list += StringPrintf("; and %zu more", cells.size() - kMaxHeldUpCells);
  }
  return out + ". Required cells still short of their minimum at the horizon: " + list +
         ".";
}

// ---- text ------------------------------------------------------------------

// Cells the plan itself rules out, before any simulation (planner/reachability.h).
std::string TextUnreachable(const Plan& plan) {
  const Reachability r = FindUnreachableCells(plan);
  if (r.cells.empty()) return "";
  std::string out =
      "\nCells that can never fill (found in the plan, before simulating)\n";
  for (const UnreachableCell& u : r.cells) {
    out += Wrap("  - ", u.reason + (u.required ? ""
                                               : " It is optional, so it does not hold "
                                                 "up completion."));
  }
  if (!r.CanComplete()) out += Wrap("  ", UnreachableAdvice(r));
  return out;
}

std::string TextHeader(const Plan& plan, const ForecastSummary& s,
                       const ReportContext& ctx) {
  std::string out =
      StringPrintf("fillcast %s - campaign forecast\n", ctx.tool_version.c_str());
  out += PlanHeaderLines(plan, 13);
  out += StringPrintf("  Start:     %s\n", FormatDate(plan.start).c_str());
  out += StringPrintf("  Deadline:  %s (%.1f weeks after the start)\n",
                      FormatDate(plan.deadline).c_str(), s.deadline_weeks);
  out += StringPrintf("  Horizon:   %s weeks\n", Compact(s.horizon_weeks).c_str());
  out += StringPrintf("  Runs:      %ld (seed %llu, %d thread%s)\n", s.runs,
                      static_cast<unsigned long long>(s.seed), ctx.threads,
                      ctx.threads == 1 ? "" : "s");
  if (ctx.precision_used) {
    const std::string width = std::isfinite(ctx.precision_width_weeks)
                                  ? StringPrintf("%.2f weeks", ctx.precision_width_weeks)
                                  : std::string("open (runs incomplete)");
    out += Wrap(
        "  Precision: ",
        StringPrintf(
            "runs added until the 95 %% interval of P%.0f was at most %.2f weeks "
            "wide: %s after %ld runs%s",
            100.0 * ctx.precision_quantile, ctx.precision_target_weeks, width.c_str(),
            s.runs, ctx.precision_met ? "" : " (the cap on runs was reached first)"));
  }
  return out;
}

// The weather's spread alone beside the one with the site model's
// uncertainty, when the site model states one.
std::string TextSiteSpread(const ForecastSummary& s) {
  if (!s.site_exact) return "";
  const SiteModelSpread& e = *s.site_exact;
  std::string out = StringPrintf(
      "\nSpread from the weather and from the site model (mean wind speed known to "
      "%g %%, 1 s.d.)\n"
      "  %-32s %11s %11s %11s %11s %12s\n",
      e.mean_speed_uncertainty_pct, "weeks from the start", "P10", "P50", "P80", "P90", "by deadline");
  const auto row = [&out](const char* name, const QuantileEstimate& p10,
                          const QuantileEstimate& p50, const QuantileEstimate& p80,
                          const QuantileEstimate& p90, double by_deadline) {
    out += StringPrintf("  %-32s %11s %11s %11s %11s %12s\n", name,
                        WeeksText(p10.value, 11).c_str(), WeeksText(p50.value, 11).c_str(),
                        WeeksText(p80.value, 11).c_str(), WeeksText(p90.value, 11).c_str(),
                        Percent(by_deadline).c_str());
  };
  row("weather alone (site model exact)", e.p10, e.p50, e.p80, e.p90,
      e.p_complete_by_deadline);
  row("weather and site model (above)", s.p10, s.p50, s.p80, s.p90,
      s.p_complete_by_deadline);
  return out;
}

std::string TextCompletion(const Plan& plan, const ForecastSummary& s) {
  std::string out = "\nWeeks to a full capture matrix (all required cells)\n";
  out +=
      StringPrintf("  %-6s %11s   %-18s %s\n", "", "weeks", "95 % CI, weeks", "done by");
  const std::pair<const char*, const QuantileEstimate*> rows[] = {
      {"P10", &s.p10}, {"P50", &s.p50}, {"P80", &s.p80}, {"P90", &s.p90}};
  for (const auto& [name, q] : rows) {
    out += StringPrintf("  %-6s %s   %-18s %s\n", name, WeeksText(q->value, 11).c_str(),
                        CiRangeText(*q).c_str(), DoneBy(plan.start, q->value).c_str());
  }
  if (s.mean_weeks) {
    const std::string se = s.mean_se_weeks
                               ? StringPrintf("+/- %.1f (1 s.e.)", *s.mean_se_weeks)
                               : std::string();
    out += StringPrintf("  %-6s %11.1f   %-18s %s\n", "mean", *s.mean_weeks, se.c_str(),
                        DoneBy(plan.start, s.mean_weeks).c_str());
  } else {
    out += StringPrintf("  %-6s %11s   (not every run completed within the horizon)\n",
                        "mean", "none");
  }
  out += "\n";
  const std::string by_deadline =
      "Complete by the deadline (" + FormatDate(plan.deadline) + "):";
  out += StringPrintf("  %-46s %8s of runs\n", by_deadline.c_str(),
                      Percent(s.p_complete_by_deadline).c_str());
  const std::string in_horizon =
      "Not complete within the horizon (" + Compact(s.horizon_weeks) + " weeks):";
  out += StringPrintf("  %-46s %8s of runs\n", in_horizon.c_str(),
                      Percent(s.p_incomplete_at_horizon).c_str());
  const std::string held_up = HeldUpSentence(plan, s);
  if (!held_up.empty()) out += "\n" + Wrap("  ", held_up);
  out += TextSiteSpread(s);
  return out;
}

std::string TextThinCells(const Plan& plan, const ForecastSummary& s,
                          const ReportContext& ctx) {
  const std::vector<const CellForecast*> thin =
      ThinnestCells(s, ctx.thin_cell_rows, false);
  int required_cells = 0;
  for (const CellForecast& c : s.cells) required_cells += c.cell.optional ? 0 : 1;
  std::string out = StringPrintf(
      "\nCells least likely to be full by the deadline (%zu of %d "
      "required cells)\n",
      thin.size(), required_cells);
  if (thin.empty()) return out + "  (none)\n";

  out +=
      "  Counts are valid 10-minute records (events: counted events); weeks count from "
      "the "
      "start.\n";
  size_t w = 4;
  for (const CellForecast* c : thin)
    w = std::max(w, CellLabel(plan.matrix, c->cell).size());
  w = std::min(w, kMaxLabelWidth);
  const int lw = static_cast<int>(w);
  out += StringPrintf("  %-*s  %8s  %-31s  %11s\n", lw, "", "",
                      "------- at the deadline -------", "Weeks to");
  out += StringPrintf("  %-*s  %8s  %8s  %11s  %8s  %11s\n", lw, "Cell", "Required",
                      "Expected", "P10-P90", "P(full)", "full, P50");
  for (const CellForecast* c : thin) {
    const std::string range = StringPrintf("%.0f-%.0f", c->count_p10, c->count_p90);
    out += StringPrintf("  %-*s  %8d  %8.1f  %11s  %8s  %s\n", lw,
                        FitLabel(CellLabel(plan.matrix, c->cell), w).c_str(),
                        c->cell.required, c->count_mean, range.c_str(),
                        Percent(c->p_full_by_deadline).c_str(),
                        WeeksText(c->weeks_to_full_p50, 11).c_str());
  }
  return out;
}

std::string SavedText(const std::optional<double>& weeks) {
  return weeks ? StringPrintf("%.1f", *weeks) : std::string("-");
}

// The cells whose relaxation would save most at P80: what making each
// optional, or lowering its minimum, buys (from the same runs).
std::string TextSavings(const Plan& plan, const ForecastSummary& s) {
  std::vector<const CellForecast*> cells;
  for (const CellForecast& c : s.cells) {
    if (!c.cell.optional && c.saved_p80_if_optional && *c.saved_p80_if_optional > 0.0) {
      cells.push_back(&c);
    }
  }
  if (cells.empty()) return "";
  std::stable_sort(cells.begin(), cells.end(),
                   [](const CellForecast* a, const CellForecast* b) {
                     return *a->saved_p80_if_optional > *b->saved_p80_if_optional;
                   });
  if (cells.size() > 5) cells.resize(5);
  std::string out = StringPrintf(
      "\nWhat relaxing a cell would save (weeks, from the same runs)\n"
      "  %-42s %17s %17s %17s\n",
      "Cell", "optional: P50", "optional: P80",
      StringPrintf("min x %.0f %%: P80", 100.0 * s.relaxed_share).c_str());
  for (const CellForecast* c : cells) {
    out += StringPrintf("  %-42s %17s %17s %17s\n",
                        FitLabel(CellLabel(plan.matrix, c->cell), 42).c_str(),
                        SavedText(c->saved_p50_if_optional).c_str(),
                        SavedText(c->saved_p80_if_optional).c_str(),
                        SavedText(c->saved_p80_if_relaxed).c_str());
  }
  return out;
}

// What each process the plan uses costs: P50 and P80 with it switched off,
// from the same runs and seed.
std::string TextHoldUps(const ForecastSummary& s) {
  if (s.hold_ups.empty()) return "";
  std::string out = StringPrintf(
      "\nWhat holds the campaign up (the same %ld runs and seed, one process switched "
      "off)\n"
      "  %-48s %8s %8s %10s %12s\n",
      s.runs, "Switched off", "P50, wk", "P80, wk", "P80 saved", "by deadline");
  out += StringPrintf("  %-48s %8s %8s %10s %12s\n", "(nothing: the forecast above)",
                      WeeksText(s.p50.value, 8).c_str(), WeeksText(s.p80.value, 8).c_str(),
                      "", Percent(s.p_complete_by_deadline).c_str());
  for (const HoldUp& h : s.hold_ups) {
    out += StringPrintf("  %-48s %8s %8s %10s %12s\n", FitLabel(h.label, 48).c_str(),
                        WeeksText(h.p50.value, 8).c_str(),
                        WeeksText(h.p80.value, 8).c_str(),
                        SavedText(h.p80_saved_weeks).c_str(),
                        Percent(h.p_complete_by_deadline).c_str());
  }
  const HoldUp* most = nullptr;
  for (const HoldUp& h : s.hold_ups) {
    if (h.p80_saved_weeks && *h.p80_saved_weeks > 0 &&
        (most == nullptr || *h.p80_saved_weeks > *most->p80_saved_weeks))
      most = &h;
  }
  if (most != nullptr) {
    out += "\n" + Wrap("", "Switching off " + most->label + " saves most: " +
                               StringPrintf("%.1f", *most->p80_saved_weeks) +
                               " weeks at P80.");
  }
  return out;
}

std::string TextBottleneckAndDiagnostics(const Plan& plan, const ForecastSummary& s) {
  std::string out = "\n";
  out += Wrap("", BottleneckSentence(plan.matrix, s));
  out += TextSavings(plan, s);
  out += TextHoldUps(s);
  out += "\nShares of the simulated time (diagnostics)\n";
  out += StringPrintf("  Turbine available:            %8s\n",
                      Percent(s.turbine_availability).c_str());
  out += StringPrintf("  Data acquisition available:   %8s\n",
                      Percent(s.daq_availability).c_str());
  if (!plan.channel_groups.empty()) {
    out += StringPrintf("  All load channels counting:   %8s\n",
                        Percent(s.channels_availability).c_str());
  }
  out += StringPrintf("  Wind from a valid sector:     %8s\n",
                      Percent(s.valid_sector_share).c_str());
  out += StringPrintf("  Curtailment rule in force:    %8s\n",
                      Percent(s.curtailed_share).c_str());
  out += StringPrintf("  Mean wind speed at hub:       %6.2f m/s\n", s.mean_speed_ms);
  return out;
}

// ---- JSON ------------------------------------------------------------------

Json OptionalNumber(const std::optional<double>& x) {
  return x ? Json(*x) : Json(nullptr);
}

Json QuantileJson(const QuantileEstimate& q) {
  return Json::array({OptionalNumber(q.ci_lo), OptionalNumber(q.ci_hi)});
}

Json CellJson(const CaptureMatrix& m, const CellForecast& c) {
  Json j;
  j["index"] = c.index;
  j["label"] = CellLabel(m, c.cell);
  const bool event =
      c.cell.event >= 0 && c.cell.event < static_cast<int>(m.event_types.size());
  j["kind"] = event ? "event" : "records";
  j["state"] = event ? "event" : OperatingStateName(c.cell.state);
  j["event"] =
      event ? Json(m.event_types[static_cast<size_t>(c.cell.event)]) : Json(nullptr);
  j["wind_ms"] = Json::array({c.cell.wind_ms.lo, c.cell.wind_ms.hi});
  j["ti"] = c.cell.ti_binned ? Json::array({c.cell.ti_pct.lo, c.cell.ti_pct.hi})
                             : Json(nullptr);
  j["required"] = c.cell.required;
  j["optional"] = c.cell.optional;
  j["count_at_deadline"] = {{"mean", c.count_mean},
                            {"p10", c.count_p10},
                            {"p50", c.count_p50},
                            {"p90", c.count_p90}};
  j["p_full_by_deadline"] = c.p_full_by_deadline;
  j["weeks_to_full"] = {{"p50", OptionalNumber(c.weeks_to_full_p50)},
                        {"p90", OptionalNumber(c.weeks_to_full_p90)}};
  j["p_last_to_fill"] = c.p_last_to_fill;
  j["p_not_full_at_end"] = c.p_not_full_at_end;
  j["saved_weeks_if_optional"] = {{"p50", OptionalNumber(c.saved_p50_if_optional)},
                                  {"p80", OptionalNumber(c.saved_p80_if_optional)}};
  j["saved_weeks_if_relaxed"] = {{"p50", OptionalNumber(c.saved_p50_if_relaxed)},
                                 {"p80", OptionalNumber(c.saved_p80_if_relaxed)}};
  return j;
}

Json CompletionJson(const ForecastSummary& s) {
  Json j;
  j["mean"] = OptionalNumber(s.mean_weeks);
  j["mean_se"] = OptionalNumber(s.mean_se_weeks);
  j["p10"] = OptionalNumber(s.p10.value);
  j["p50"] = OptionalNumber(s.p50.value);
  j["p80"] = OptionalNumber(s.p80.value);
  j["p90"] = OptionalNumber(s.p90.value);
  j["ci95"] = {{"p10", QuantileJson(s.p10)},
               {"p50", QuantileJson(s.p50)},
               {"p80", QuantileJson(s.p80)},
               {"p90", QuantileJson(s.p90)}};
  return j;
}

Json DatesJson(const Plan& plan, const ForecastSummary& s) {
  auto date = [&](const std::optional<double>& weeks) {
    return weeks ? Json(FormatDate(DoneByDate(plan.start, *weeks))) : Json(nullptr);
  };
  return {{"p10", date(s.p10.value)},
          {"p50", date(s.p50.value)},
          {"p80", date(s.p80.value)},
          {"p90", date(s.p90.value)}};
}

}  // namespace

std::string FormatForecastText(const Plan& plan, const ForecastSummary& s,
                               const ReportContext& ctx) {
  std::string out = TextHeader(plan, s, ctx);
  out += TextUnreachable(plan);
  out += TextCompletion(plan, s);
  out += TextThinCells(plan, s, ctx);
  out += TextBottleneckAndDiagnostics(plan, s);
  return out + NotesAndCautionsText(ResultNotes(s));
}

std::string FormatForecastJson(const Plan& plan, const ForecastSummary& s,
                               const ReportContext& ctx) {
  Json j;
  j["tool"] = {
      {"name", "fillcast"}, {"version", ctx.tool_version}, {"seal", kSealPlaceholder}};
  j["plan"] = {{"name", plan.name},
               {"site", plan.site.name},
               {"turbine", plan.turbine.name},
               {"start", FormatDate(plan.start)},
               {"deadline", FormatDate(plan.deadline)},
               {"horizon_weeks", s.horizon_weeks}};
  j["weather"] = WeatherSourceJson(plan);
  j["runs"] = s.runs;
  if (ctx.precision_used) {
    j["precision"] = {{"quantile", ctx.precision_quantile},
                      {"target_weeks", ctx.precision_target_weeks},
                      {"ci95_width_weeks", std::isfinite(ctx.precision_width_weeks)
                                               ? Json(ctx.precision_width_weeks)
                                               : Json(nullptr)},
                      {"met", ctx.precision_met}};
  }
  j["seed"] = s.seed;
  j["deadline_weeks"] = s.deadline_weeks;
  j["completion_weeks"] = CompletionJson(s);
  j["completion_dates"] = DatesJson(plan, s);
  j["p_complete_by_deadline"] = s.p_complete_by_deadline;
  j["p_incomplete_at_horizon"] = s.p_incomplete_at_horizon;
  if (s.bottleneck_cell >= 0 && s.bottleneck_cell < static_cast<int>(s.cells.size())) {
    const CellForecast& c = s.cells[static_cast<size_t>(s.bottleneck_cell)];
    j["bottleneck"] = {{"cell", c.index},
                       {"label", CellLabel(plan.matrix, c.cell)},
                       {"p_last_to_fill", c.p_last_to_fill}};
  } else {
    j["bottleneck"] = nullptr;
  }
  j["bottleneck_sentence"] = BottleneckSentence(plan.matrix, s);
  j["unreachable_cells"] = Json::array();
  for (const UnreachableCell& u : FindUnreachableCells(plan).cells) {
    j["unreachable_cells"].push_back(
        {{"cell", u.cell},
         {"label",
          CellLabel(plan.matrix, plan.matrix.cells[static_cast<size_t>(u.cell)])},
         {"required", u.required},
         {"reason", u.reason}});
  }
  j["held_up_sentence"] = HeldUpSentence(plan, s);
  j["relaxed_share"] = s.relaxed_share;
  j["fill_curve"] = Json::array();
  for (const FillPoint& p : s.fill_curve) {
    j["fill_curve"].push_back(
        {{"week", p.week}, {"p10", p.p10}, {"p50", p.p50}, {"p90", p.p90}});
  }
  j["cells"] = Json::array();
  for (const CellForecast& c : s.cells) j["cells"].push_back(CellJson(plan.matrix, c));
  j["diagnostics"] = {{"turbine_availability", s.turbine_availability},
                      {"daq_availability", s.daq_availability},
                      {"valid_sector_share", s.valid_sector_share},
                      {"curtailed_share", s.curtailed_share},
                      {"mean_speed_ms", s.mean_speed_ms}};
  if (!plan.channel_groups.empty())
    j["diagnostics"]["channels_availability"] = s.channels_availability;
  if (s.site_exact) {
    const SiteModelSpread& e = *s.site_exact;
    j["site_model_exact"] = {{"mean_speed_uncertainty_pct", e.mean_speed_uncertainty_pct},
                             {"p10", OptionalNumber(e.p10.value)},
                             {"p50", OptionalNumber(e.p50.value)},
                             {"p80", OptionalNumber(e.p80.value)},
                             {"p90", OptionalNumber(e.p90.value)},
                             {"p_complete_by_deadline", e.p_complete_by_deadline}};
  }
  if (!s.hold_ups.empty()) {
    j["hold_ups"] = Json::array();
    for (const HoldUp& h : s.hold_ups) {
      j["hold_ups"].push_back({{"process", h.key},
                               {"label", h.label},
                               {"p50_weeks", OptionalNumber(h.p50.value)},
                               {"p80_weeks", OptionalNumber(h.p80.value)},
                               {"p80_ci95", QuantileJson(h.p80)},
                               {"p80_saved_weeks", OptionalNumber(h.p80_saved_weeks)},
                               {"p_complete_by_deadline", h.p_complete_by_deadline}});
    }
  }
  j["notes"] = ResultNotes(s);
  j["cautions"] = StandardCautions();
  return j.dump(2) + "\n";
}

}  // namespace planner
