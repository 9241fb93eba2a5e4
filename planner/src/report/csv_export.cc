// FormatCellsCsv and FormatCompletionCurveCsv (planner/report_files.h): tables
// for people who continue in their own tools. RFC 4180 fields; numbers at
// full precision (shortest text that reads back exactly); empty = not
// reached or not applicable. Columns: docs/output.md.
#include <algorithm>
#include <cmath>

#include "io/file_seal.h"
#include "planner/report_files.h"
#include "report/report_numbers.h"

namespace planner {
namespace {

// RFC 4180: a field with a comma, quote, CR or LF is quoted, quotes doubled.
std::string Field(const std::string& text) {
  if (text.find_first_of(",\"\r\n") == std::string::npos) return text;
  std::string out = "\"";
  for (const char ch : text) {
    if (ch == '"') out += '"';
    out += ch;
  }
  return out + "\"";
}

std::string Num(double x) { return ExactNumber(x); }
std::string Num(const std::optional<double>& x) { return x ? ExactNumber(*x) : ""; }

std::string Row(const std::vector<std::string>& fields) {
  std::string out;
  for (size_t i = 0; i < fields.size(); ++i) out += (i ? "," : "") + Field(fields[i]);
  return out + "\r\n";
}

std::string GeneratorLine(const ReportContext& ctx) {
  return "# generator=fillcast " + ctx.tool_version + " " + kSealPlaceholder + "\r\n";
}

}  // namespace

std::string FormatCellsCsv(const Plan& plan, const ForecastSummary& s,
                           const ReportContext& ctx) {
  std::string out = GeneratorLine(ctx);
  out += Row({"index",
              "label",
              "kind",
              "state",
              "event",
              "wind_lo_ms",
              "wind_hi_ms",
              "ti_lo_pct",
              "ti_hi_pct",
              "required",
              "optional",
              "count_mean",
              "count_p10",
              "count_p50",
              "count_p90",
              "p_full_by_deadline",
              "weeks_to_full_p50",
              "weeks_to_full_p90",
              "p_last_to_fill",
              "saved_p50_if_optional_weeks",
              "saved_p80_if_optional_weeks",
              "relaxed_share",
              "saved_p50_if_relaxed_weeks",
              "saved_p80_if_relaxed_weeks"});
  const CaptureMatrix& m = plan.matrix;
  for (const CellForecast& c : s.cells) {
    const bool event = c.cell.event >= 0;
    const bool named = event && c.cell.event < static_cast<int>(m.event_types.size());
    out += Row({std::to_string(c.index),
                CellLabel(m, c.cell),
                event ? "event" : "records",
                event ? "event" : OperatingStateName(c.cell.state),
                named ? m.event_types[static_cast<size_t>(c.cell.event)] : "",
                Num(c.cell.wind_ms.lo),
                Num(c.cell.wind_ms.hi),
                c.cell.ti_binned ? Num(c.cell.ti_pct.lo) : "",
                c.cell.ti_binned ? Num(c.cell.ti_pct.hi) : "",
                std::to_string(c.cell.required),
                c.cell.optional ? "true" : "false",
                Num(c.count_mean),
                Num(c.count_p10),
                Num(c.count_p50),
                Num(c.count_p90),
                Num(c.p_full_by_deadline),
                Num(c.weeks_to_full_p50),
                Num(c.weeks_to_full_p90),
                Num(c.p_last_to_fill),
                Num(c.saved_p50_if_optional),
                Num(c.saved_p80_if_optional),
                Num(s.relaxed_share),
                Num(c.saved_p50_if_relaxed),
                Num(c.saved_p80_if_relaxed)});
  }
  return out;
}

std::string FormatCompletionCurveCsv(const ForecastSummary& s, const ReportContext& ctx) {
  std::string out = GeneratorLine(ctx);
  out += Row({"week", "runs_complete", "share_complete"});
  const double n = static_cast<double>(s.runs);
  long done = 0;
  // One row per distinct completion time: the curve's steps.
  for (const CompletionCount& c : s.completion_counts) {
    done += c.runs;
    out += Row({Num(c.weeks), std::to_string(done), Num(static_cast<double>(done) / n)});
  }
  return out;
}

}  // namespace planner
