#include "planner/progress_report.h"

#include <algorithm>
#include <nlohmann/json.hpp>

#include "io/file_seal.h"
#include "io/met_csv_reader.h"
#include "planner/weather_source.h"
#include "report/cautions.h"
#include "report/report_numbers.h"
#include "report/text_format.h"

namespace planner {
namespace {

using Json = nlohmann::ordered_json;

constexpr size_t kMaxLabelWidth = 40;

std::string Stamp(int64_t time_s) { return FormatTimestamp(time_s, true); }

std::string BinText(const Bin& b) { return StringPrintf("%g-%g", b.lo, b.hi); }

// "12/10" with a marker: "*" still short, "o" optional.
std::string CountText(const Cell& cell, uint32_t n) {
  std::string text = StringPrintf("%u/%d", n, cell.required);
  if (n < static_cast<uint32_t>(cell.required)) text += "*";
  if (cell.optional) text += "o";
  return text;
}

std::string StateTitle(OperatingState s) {
  std::string name = OperatingStateName(s);
  name[0] = static_cast<char>(name[0] - 'a' + 'A');
  return name;
}

std::string GridText(const CaptureMatrix& m, const StateGrid& g,
                     const std::vector<uint32_t>& counts) {
  const size_t cols = std::max<size_t>(g.ti_bins_pct.size(), 1);
  std::string out = StateTitle(g.state) + " (valid 10-minute records)\n";
  out += StringPrintf("  %-12s", "wind, m/s");
  for (size_t t = 0; t < cols; ++t) {
    const std::string head =
        g.ti_bins_pct.empty() ? "TI any" : "TI " + BinText(g.ti_bins_pct[t]) + " %";
    out += StringPrintf(" %11s", head.c_str());
  }
  out += "\n";
  for (size_t w = 0; w < g.wind_bins_ms.size(); ++w) {
    out += StringPrintf("  %-12s", BinText(g.wind_bins_ms[w]).c_str());
    for (size_t t = 0; t < cols; ++t) {
      const int c = g.cell_index[w * cols + t];
      const std::string text = c < 0 ? "-"
                                     : CountText(m.cells[static_cast<size_t>(c)],
                                                 counts[static_cast<size_t>(c)]);
      out += StringPrintf(" %11s", text.c_str());
    }
    out += "\n";
  }
  return out;
}

int RequiredFull(const CaptureMatrix& m, const std::vector<uint32_t>& counts,
                 int64_t* still_needed) {
  int full = 0;
  *still_needed = 0;
  for (size_t c = 0; c < m.cells.size(); ++c) {
    if (m.cells[c].optional) continue;
    const int64_t short_by = static_cast<int64_t>(m.cells[c].required) - counts[c];
    if (short_by <= 0) {
      ++full;
    } else {
      *still_needed += short_by;
    }
  }
  return full;
}

std::string Header(const Plan& plan, const ProgressSummary& s,
                   const ProgressReportContext& ctx) {
  std::string out =
      StringPrintf("fillcast %s - campaign progress\n", ctx.tool_version.c_str());
  out += PlanHeaderLines(plan, 15);
  out += StringPrintf("  Start:       %s\n", FormatDate(plan.start).c_str());
  out += StringPrintf("  Planned end: %s (%.1f weeks after the start)\n",
                      FormatDate(plan.deadline).c_str(), s.forecast.deadline_weeks);
  out += StringPrintf("  As of:       %s 00:00 UTC (%.1f weeks after the start)\n",
                      FormatDate(s.as_of).c_str(), s.as_of_weeks);
  out += Wrap("  Log:         ", ctx.log_path + " (" +
                                     GroupedWhole(static_cast<double>(ctx.log_records)) +
                                     " records)");
  out += StringPrintf("  Runs:        %ld (seed %llu, %d thread%s)\n", s.forecast.runs,
                      static_cast<unsigned long long>(s.forecast.seed), ctx.threads,
                      ctx.threads == 1 ? "" : "s");
  return out;
}

std::string LoggedText(const ProgressSummary& s) {
  const LoggedCounts& l = s.logged;
  std::string out = "\nLogged from the start to the as-of date (10-minute records)\n";
  if (l.first_time_s) {
    out += StringPrintf("  %-38s %s to %s\n", "first and last record",
                        Stamp(*l.first_time_s).c_str(), Stamp(*l.last_time_s).c_str());
  }
  auto row = [](const char* name, int64_t n) {
    return StringPrintf("  %-38s %10s\n", name,
                        GroupedWhole(static_cast<double>(n)).c_str());
  };
  out += row("records used", l.records_used);
  out += row("  counted for a record cell", l.counted_records);
  out += row("  quality flag rejected", l.quality_rejected);
  out += row("  wind from outside the valid sectors", l.outside_sector);
  out += row("  missing speed, direction or std", l.missing_values);
  if (l.channels_down > 0)
    out += row("  load channels down that every cell needs", l.channels_down);
  out += row("events counted for an event cell", l.counted_events);
  if (l.unknown_events > 0)
    out += row("events the plan has no type for", l.unknown_events);
  if (l.before_start > 0)
    out += row("records before the start (not used)", l.before_start);
  if (l.after_as_of > 0) out += row("records on or after the as-of date", l.after_as_of);
  if (l.has_last_wind) {
    out += StringPrintf("  %-38s %.1f m/s from %.0f deg at %s\n", "weather starts from",
                        l.last_speed_ms, l.last_direction_deg,
                        Stamp(l.last_wind_time_s).c_str());
  }
  return out;
}

std::string ForecastText(const Plan& plan, const ProgressSummary& s) {
  std::string out;
  if (s.already_complete) {
    out += "\nThe capture matrix is full: every required cell has reached its minimum";
    if (s.logged.complete_time_s) {
      out += " with the record ending " + Stamp(*s.logged.complete_time_s);
    }
    out += ".\nRemaining weeks: 0.\n";
    return out;
  }
  out += "\nForecast of the remainder from " + FormatDate(s.as_of) +
         " (weeks from the start; remaining weeks from the as-of date)\n";
  out += StringPrintf("  %-6s %11s   %-18s %9s   %s\n", "", "weeks", "95 % CI, weeks",
                      "remaining", "done by");
  const std::tuple<const char*, const QuantileEstimate*, const std::optional<double>*>
      rows[] = {{"P50", &s.forecast.p50, &s.remaining_p50},
                {"P80", &s.forecast.p80, &s.remaining_p80},
                {"P90", &s.forecast.p90, &s.remaining_p90}};
  for (const auto& [name, q, left] : rows) {
    out += StringPrintf("  %-6s %s   %-18s %9s   %s\n", name,
                        WeeksText(q->value, 11).c_str(), CiRangeText(*q).c_str(),
                        *left ? StringPrintf("%.1f", **left).c_str() : "-",
                        DoneBy(plan.start, q->value).c_str());
  }
  return out;
}

std::string ExtensionText(const Plan& plan, const ProgressSummary& s) {
  std::string out = "\n";
  const std::string by_end =
      "Complete by the planned end (" + FormatDate(plan.deadline) + "):";
  out +=
      StringPrintf("  %-46s %8s%s\n", by_end.c_str(), Percent(s.p_by_planned_end).c_str(),
                   s.already_complete ? "" : " of runs");
  if (s.already_complete) return out;
  out += "\nWhat extending buys (beyond " +
         std::string(s.extension_base == plan.deadline ? "the planned end "
                                                       : "the as-of date ") +
         FormatDate(s.extension_base) + ")\n";
  out += StringPrintf("  %-10s %-12s %13s   %s\n", "Extension", "New end", "P(complete)",
                      "Required cells likely still thin");
  for (const ExtensionRow& e : s.extensions) {
    std::string p = Percent(e.p_complete);
    if (e.beyond_horizon) p = "at least " + p;
    out += StringPrintf("  %-10s %-12s %13s   %zu\n",
                        StringPrintf("+%d weeks", e.weeks).c_str(),
                        FormatDate(e.end).c_str(), p.c_str(), e.thin.size());
  }
  out += "  Likely thin: full by the new end in fewer than half of the runs.\n";
  return out;
}

std::string ThinText(const Plan& plan, const ProgressSummary& s, int limit) {
  if (s.already_complete || s.extensions.empty()) return "";
  const ExtensionRow& last = s.extensions.back();
  std::string out = StringPrintf(
      "\nRequired cells least likely to be full even at +%d weeks (%s): %zu likely "
      "thin\n",
      last.weeks, FormatDate(last.end).c_str(), last.thin.size());
  if (last.uncertain.empty()) {
    return out + "  (none: every required cell is full by then in every run)\n";
  }
  size_t w = 4;
  for (const CellAtDate& c : last.uncertain) {
    w = std::max(w, CellLabel(plan.matrix, plan.matrix.cells[c.cell]).size());
  }
  const int lw = static_cast<int>(std::min(w, kMaxLabelWidth));
  const std::string ext_head = StringPrintf("P(full) +%d wk", last.weeks);
  out += StringPrintf("  %-*s  %8s  %8s  %19s  %14s\n", lw, "Cell", "Required", "Logged",
                      "P(full) planned end", ext_head.c_str());
  int rows = 0;
  for (const CellAtDate& c : last.uncertain) {
    if (rows++ == limit) {
      out += StringPrintf("  ... and %zu more\n",
                          last.uncertain.size() - static_cast<size_t>(limit));
      break;
    }
    const Cell& cell = plan.matrix.cells[static_cast<size_t>(c.cell)];
    const std::string label =
        FitLabel(CellLabel(plan.matrix, cell), static_cast<size_t>(lw));
    const double p_end = s.forecast.cells[static_cast<size_t>(c.cell)].p_full_by_deadline;
    out +=
        StringPrintf("  %-*s  %8d  %8u  %19s  %14s%s\n", lw, label.c_str(), cell.required,
                     s.logged.counts[static_cast<size_t>(c.cell)], Percent(p_end).c_str(),
                     Percent(c.p_full).c_str(), c.p_full < kThinBelow ? "  thin" : "");
  }
  return out;
}

std::vector<std::string> Notes(const ProgressSummary& s) {
  std::vector<std::string> notes;
  if (s.logged.records_used == 0) {
    notes.push_back(
        "No logged record lies between the plan's start and the as-of date: the "
        "forecast starts from an empty matrix and from the climate's average weather.");
  } else if (!s.logged.has_last_wind) {
    notes.push_back(
        "No usable logged wind before the as-of date: the weather starts from the "
        "climate's average.");
  }
  if (s.logged.unknown_channel_groups > 0) {
    notes.push_back(StringPrintf(
        "%lld logged records name a load-channel group the plan does not define "
        "(outages.channel_groups); that name was ignored.",
        static_cast<long long>(s.logged.unknown_channel_groups)));
  }
  if (s.logged.unknown_events > 0) {
    notes.push_back(StringPrintf(
        "%lld logged events name no event type of the plan's matrix; they counted for "
        "no cell.",
        static_cast<long long>(s.logged.unknown_events)));
  }
  if (!s.already_complete && s.forecast.runs > 0 && s.forecast.runs < 1000) {
    notes.push_back(StringPrintf(
        "Only %ld runs: the 95 %% intervals are wide and the shares are coarse.",
        s.forecast.runs));
  }
  if (!s.already_complete && s.forecast.p_incomplete_at_horizon > 0) {
    notes.push_back(Percent(s.forecast.p_incomplete_at_horizon) +
                    " of runs did not complete within the plan's horizon; a quantile "
                    "among them is shown as not reached.");
  }
  return notes;
}

Json OptionalNumber(const std::optional<double>& x) {
  return x ? Json(*x) : Json(nullptr);
}

Json OptionalDate(const Date& start, const std::optional<double>& weeks) {
  return weeks ? Json(FormatDate(DoneByDate(start, *weeks))) : Json(nullptr);
}

Json CellsJson(const Plan& plan, const ProgressSummary& s) {
  Json cells = Json::array();
  for (size_t c = 0; c < plan.matrix.cells.size(); ++c) {
    const Cell& cell = plan.matrix.cells[c];
    const CellForecast& f = s.forecast.cells[c];
    const uint32_t n = s.logged.counts[c];
    Json j;
    j["index"] = c;
    j["label"] = CellLabel(plan.matrix, cell);
    j["kind"] = cell.event >= 0 ? "event" : "records";
    j["state"] = cell.event >= 0 ? "event" : OperatingStateName(cell.state);
    j["event"] =
        cell.event >= 0 ? Json(plan.matrix.event_types[cell.event]) : Json(nullptr);
    j["wind_ms"] = Json::array({cell.wind_ms.lo, cell.wind_ms.hi});
    j["ti"] =
        cell.ti_binned ? Json::array({cell.ti_pct.lo, cell.ti_pct.hi}) : Json(nullptr);
    j["required"] = cell.required;
    j["optional"] = cell.optional;
    j["logged"] = n;
    j["still_needed"] = std::max<int64_t>(0, static_cast<int64_t>(cell.required) - n);
    j["p_full_by_planned_end"] = f.p_full_by_deadline;
    j["count_at_planned_end"] = {{"mean", f.count_mean},
                                 {"p10", f.count_p10},
                                 {"p50", f.count_p50},
                                 {"p90", f.count_p90}};
    cells.push_back(j);
  }
  return cells;
}

Json LoggedJson(const LoggedCounts& l) {
  Json j;
  j["records_used"] = l.records_used;
  j["counted_records"] = l.counted_records;
  j["counted_events"] = l.counted_events;
  j["quality_rejected"] = l.quality_rejected;
  j["outside_sector"] = l.outside_sector;
  j["missing_values"] = l.missing_values;
  j["unknown_events"] = l.unknown_events;
  if (l.channels_down > 0 || l.unknown_channel_groups > 0) {
    j["channels_down"] = l.channels_down;
    j["unknown_channel_groups"] = l.unknown_channel_groups;
  }
  j["before_start"] = l.before_start;
  j["after_as_of"] = l.after_as_of;
  j["first_record"] = l.first_time_s ? Json(Stamp(*l.first_time_s)) : Json(nullptr);
  j["last_record"] = l.last_time_s ? Json(Stamp(*l.last_time_s)) : Json(nullptr);
  j["last_wind"] = l.has_last_wind ? Json{{"time", Stamp(l.last_wind_time_s)},
                                          {"speed_ms", l.last_speed_ms},
                                          {"direction_deg", l.last_direction_deg}}
                                   : Json(nullptr);
  return j;
}

Json ToolJson(const std::string& version) {
  return {{"name", "fillcast"}, {"version", version}, {"seal", kSealPlaceholder}};
}

Json PlanJson(const Plan& plan) {
  return {{"name", plan.name},
          {"site", plan.site.name},
          {"turbine", plan.turbine.name},
          {"start", FormatDate(plan.start)},
          {"deadline", FormatDate(plan.deadline)},
          {"horizon_weeks", plan.horizon_weeks}};
}

}  // namespace

std::string FormatLoggedMatrixText(const Plan& plan,
                                   const std::vector<uint32_t>& counts) {
  const CaptureMatrix& m = plan.matrix;
  std::string out =
      "\nCapture matrix as logged: count / minimum (* still short, o optional)\n";
  for (const StateGrid& g : m.grids) out += GridText(m, g, counts);
  bool events = false;
  for (size_t c = 0; c < m.cells.size(); ++c) {
    if (m.cells[c].event < 0) continue;
    if (!events) out += "Events (counted events)\n";
    events = true;
    const std::string label = m.event_types[static_cast<size_t>(m.cells[c].event)] + " " +
                              BinText(m.cells[c].wind_ms) + " m/s";
    out += StringPrintf("  %-36s %11s\n", label.c_str(),
                        CountText(m.cells[c], counts[c]).c_str());
  }
  int64_t needed = 0;
  const int full = RequiredFull(m, counts, &needed);
  out += StringPrintf(
      "  Required cells full: %d of %d; counts still needed in the others: %s\n", full,
      RequiredCellCount(m), GroupedWhole(static_cast<double>(needed)).c_str());
  return out;
}

std::string FormatProgressText(const Plan& plan, const ProgressSummary& s,
                               const ProgressReportContext& ctx) {
  std::string out = Header(plan, s, ctx);
  out += LoggedText(s);
  out += FormatLoggedMatrixText(plan, s.logged.counts);
  out += ForecastText(plan, s);
  out += ExtensionText(plan, s);
  out += ThinText(plan, s, ctx.thin_cell_rows);
  return out + NotesAndCautionsText(Notes(s));
}

std::string FormatProgressJson(const Plan& plan, const ProgressSummary& s,
                               const ProgressReportContext& ctx) {
  Json j;
  j["tool"] = ToolJson(ctx.tool_version);
  j["kind"] = "progress";
  j["plan"] = PlanJson(plan);
  j["weather"] = WeatherSourceJson(plan);
  j["log"] = {{"path", ctx.log_path}, {"records", ctx.log_records}};
  j["as_of"] = FormatDate(s.as_of);
  j["as_of_weeks"] = s.as_of_weeks;
  j["logged"] = LoggedJson(s.logged);
  j["complete"] = s.already_complete;
  j["completed_at"] = s.already_complete && s.logged.complete_time_s
                          ? Json(Stamp(*s.logged.complete_time_s))
                          : Json(nullptr);
  j["runs"] = s.forecast.runs;
  j["seed"] = s.forecast.seed;
  j["p_complete_by_planned_end"] = s.p_by_planned_end;
  const ForecastSummary& f = s.forecast;
  auto ci = [](const QuantileEstimate& q) {
    return Json::array({OptionalNumber(q.ci_lo), OptionalNumber(q.ci_hi)});
  };
  j["completion_weeks"] = {
      {"p50", OptionalNumber(f.p50.value)},
      {"p80", OptionalNumber(f.p80.value)},
      {"p90", OptionalNumber(f.p90.value)},
      {"ci95", {{"p50", ci(f.p50)}, {"p80", ci(f.p80)}, {"p90", ci(f.p90)}}}};
  j["completion_dates"] = {{"p50", OptionalDate(plan.start, f.p50.value)},
                           {"p80", OptionalDate(plan.start, f.p80.value)},
                           {"p90", OptionalDate(plan.start, f.p90.value)}};
  j["remaining_weeks"] = {{"p50", OptionalNumber(s.remaining_p50)},
                          {"p80", OptionalNumber(s.remaining_p80)},
                          {"p90", OptionalNumber(s.remaining_p90)}};
  j["extension_base"] = FormatDate(s.extension_base);
  Json ext = Json::array();
  for (const ExtensionRow& e : s.extensions) {
    Json thin = Json::array();
    for (const CellAtDate& c : e.thin) thin.push_back(c.cell);
    ext.push_back({{"weeks", e.weeks},
                   {"end", FormatDate(e.end)},
                   {"beyond_horizon", e.beyond_horizon},
                   {"p_complete", e.p_complete},
                   {"thin_cells", thin}});
  }
  j["extensions"] = ext;
  Json thin = Json::array();
  if (!s.extensions.empty()) {
    for (const CellAtDate& c : s.extensions.back().uncertain) {
      const Cell& cell = plan.matrix.cells[static_cast<size_t>(c.cell)];
      thin.push_back({{"index", c.cell},
                      {"label", CellLabel(plan.matrix, cell)},
                      {"required", cell.required},
                      {"logged", s.logged.counts[static_cast<size_t>(c.cell)]},
                      {"p_full_by_planned_end",
                       f.cells[static_cast<size_t>(c.cell)].p_full_by_deadline},
                      {"p_full_by_extended_end", c.p_full},
                      {"likely_thin", c.p_full < kThinBelow}});
    }
  }
  j["thin_at_longest_extension"] = thin;
  j["cells"] = CellsJson(plan, s);
  j["notes"] = Notes(s);
  j["cautions"] = StandardCautions();
  return j.dump(2) + "\n";
}

std::vector<StoredProgress> LatestPerAsOf(const std::vector<StoredProgress>& history) {
  std::vector<StoredProgress> out;
  for (const StoredProgress& p : history) {  // sorted by as-of, then made_at
    if (!out.empty() && out.back().as_of == p.as_of) {
      out.back() = p;
    } else {
      out.push_back(p);
    }
  }
  return out;
}

std::string FormatProgressHistoryText(const Plan& plan,
                                      const std::vector<StoredProgress>& history,
                                      const ProgressReportContext& ctx) {
  std::string out =
      StringPrintf("fillcast %s - progress history\n", ctx.tool_version.c_str());
  out += Wrap("  Plan:        ", plan.name);
  out += StringPrintf("  Planned end: %s\n", FormatDate(plan.deadline).c_str());
  out += Wrap("  Log:         ", ctx.log_path);
  if (history.empty()) {
    return out +
           "\nNo progress forecast is stored yet; run 'fillcast progress PLAN' "
           "first.\n";
  }
  out +=
      "\nStored progress forecasts, by as-of date (done-by dates; P: share of runs "
      "complete by the planned end)\n";
  out +=
      StringPrintf("  %-10s  %8s  %-10s  %-10s  %-10s  %9s  %6s  %-10s  %s\n", "As of",
                   "Records", "P50", "P80", "P90", "P(by end)", "Runs", "Made", "Inputs");
  std::string previous_as_of;
  for (const StoredProgress& p : history) {
    auto date = [&p](const std::optional<std::string>& d) {
      return p.complete ? std::string("full") : d.value_or("not reached");
    };
    const bool repeat = p.as_of == previous_as_of;
    previous_as_of = p.as_of;
    out += StringPrintf(
        "  %-10s  %8s  %-10s  %-10s  %-10s  %9s  %6ld  %-10s  %s%s\n", p.as_of.c_str(),
        GroupedWhole(static_cast<double>(p.records_used)).c_str(),
        date(p.p50_date).c_str(), date(p.p80_date).c_str(), date(p.p90_date).c_str(),
        Percent(p.p_by_planned_end).c_str(), p.runs, p.made_at_utc.substr(0, 10).c_str(),
        p.inputs_digest.substr(0, 8).c_str(), repeat ? "*" : "");
  }
  out += Wrap("  ",
              "Records: logged records used. Made: date the forecast was made (UTC). "
              "Inputs: digest of the plan, the site model and the records used; * marks "
              "a second result for the same as-of date made from other inputs (the chart "
              "of the report uses the latest).");
  return out;
}

std::string FormatProgressHistoryJson(const Plan& plan,
                                      const std::vector<StoredProgress>& history,
                                      const ProgressReportContext& ctx) {
  Json j;
  j["tool"] = ToolJson(ctx.tool_version);
  j["kind"] = "progress_history";
  j["plan"] = PlanJson(plan);
  j["log"] = {{"path", ctx.log_path}, {"records", ctx.log_records}};
  Json rows = Json::array();
  for (const StoredProgress& p : history) {
    auto text = [](const std::optional<std::string>& d) {
      return d ? Json(*d) : Json(nullptr);
    };
    rows.push_back({{"as_of", p.as_of},
                    {"made_at", p.made_at_utc},
                    {"inputs_digest", p.inputs_digest},
                    {"records_used", p.records_used},
                    {"runs", p.runs},
                    {"seed", p.seed},
                    {"complete", p.complete},
                    {"p_complete_by_planned_end", p.p_by_planned_end},
                    {"planned_end", p.planned_end},
                    {"completion_weeks",
                     {{"p50", OptionalNumber(p.p50_weeks)},
                      {"p80", OptionalNumber(p.p80_weeks)},
                      {"p90", OptionalNumber(p.p90_weeks)}}},
                    {"completion_dates",
                     {{"p50", text(p.p50_date)},
                      {"p80", text(p.p80_date)},
                      {"p90", text(p.p90_date)}}}});
  }
  j["history"] = rows;
  j["cautions"] = StandardCautions();
  return j.dump(2) + "\n";
}

}  // namespace planner
