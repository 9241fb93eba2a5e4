#include "planner/decision_report.h"

#include <nlohmann/json.hpp>

#include "io/file_seal.h"
#include "report/cautions.h"
#include "report/report_numbers.h"
#include "report/text_format.h"

namespace planner {
namespace {

using Json = nlohmann::ordered_json;

std::string MoneyText(const std::optional<double>& amount, const std::string& currency) {
  return amount ? Money(*amount, currency) : std::string("not reached");
}

std::string QuantileCell(const QuantileEstimate& q) {
  return q.value ? StringPrintf("%5.1f (%s)", *q.value, CiRangeText(q).c_str())
                 : std::string("not reached");
}

Json OptionalJson(const std::optional<double>& x) { return x ? Json(*x) : Json(nullptr); }

Json QuantileJson(const QuantileEstimate& q) {
  return {{"weeks", OptionalJson(q.value)},
          {"ci95", Json::array({OptionalJson(q.ci_lo), OptionalJson(q.ci_hi)})}};
}

std::string CautionsText() {
  std::string out = "\nCautions\n";
  for (const std::string& c : StandardCautions()) out += Wrap("  - ", c);
  return out;
}

std::string PairedText(const Comparison& c) {
  if (!c.best_two) return "";
  const PairedDifference& d = *c.best_two;
  std::string out = "\nPaired difference of the best two (same random numbers)\n";
  if (d.pairs == 0) return out + "  No run completed in both scenarios.\n";
  out +=
      Wrap("  ", StringPrintf("%s takes on average %.1f weeks %s than %s (95 %% interval "
                              "%.1f to %.1f weeks, from %ld runs where both completed).",
                              d.b.c_str(), std::abs(d.mean_weeks),
                              d.mean_weeks >= 0 ? "longer" : "less", d.a.c_str(),
                              d.mean_weeks - 1.96 * d.se_weeks,
                              d.mean_weeks + 1.96 * d.se_weeks, d.pairs));
  out += Wrap("  ", StringPrintf("%s completes sooner in %s of runs.", d.a.c_str(),
                                 Percent(d.p_a_sooner).c_str()));
  return out;
}

}  // namespace

std::string FormatComparisonText(const Comparison& c, const ReportContext& ctx) {
  const long runs = c.ranked.empty() ? 0 : c.ranked.front().summary.runs;
  const uint64_t seed = c.ranked.empty() ? 0 : c.ranked.front().summary.seed;
  std::string out =
      StringPrintf("fillcast %s - scenario comparison\n", ctx.tool_version.c_str());
  out += StringPrintf(
      "  %ld runs per scenario, seed %llu, common random numbers; ranked by %s\n\n", runs,
      static_cast<unsigned long long>(seed), RankByName(c.rank_by));
  out += StringPrintf("  %-2s %-28s %-21s %-21s %-21s %11s\n", "#", "Scenario",
                      "P50 wk (95 % CI)", "P80 wk (95 % CI)", "P90 wk (95 % CI)",
                      "P(deadline)");
  for (size_t i = 0; i < c.ranked.size(); ++i) {
    const ScenarioResult& r = c.ranked[i];
    out += StringPrintf("  %-2zu %-28s %-21s %-21s %-21s %11s\n", i + 1,
                        FitLabel(r.name, 28).c_str(), QuantileCell(r.summary.p50).c_str(),
                        QuantileCell(r.summary.p80).c_str(),
                        QuantileCell(r.summary.p90).c_str(),
                        Percent(r.summary.p_complete_by_deadline).c_str());
  }
  out += "\n  Cost = weekly cost x weeks + mobilisation\n";
  out += StringPrintf("  %-2s %-30s %18s %18s %24s\n", "#", "Scenario", "at P50",
                      "at P80", "expected (mean)");
  for (size_t i = 0; i < c.ranked.size(); ++i) {
    const ScenarioResult& r = c.ranked[i];
    const std::string expected = (r.expected_cost_is_lower_bound ? ">= " : "") +
                                 Money(r.expected_cost, r.cost.currency);
    out += StringPrintf("  %-2zu %-30s %18s %18s %24s\n", i + 1,
                        FitLabel(r.name, 30).c_str(),
                        MoneyText(r.cost_p50, r.cost.currency).c_str(),
                        MoneyText(r.cost_p80, r.cost.currency).c_str(), expected.c_str());
  }
  out += PairedText(c);
  out += "\nThinnest cells of each scenario (probability full by its deadline)\n";
  for (const ScenarioResult& r : c.ranked) {
    for (const CellForecast* cell : ThinnestCells(r.summary, 3, false)) {
      out += StringPrintf("  %-30s %-44s %8s\n", FitLabel(r.name, 30).c_str(),
                          FitLabel(cell->index < static_cast<int>(r.cell_labels.size())
                                       ? r.cell_labels[static_cast<size_t>(cell->index)]
                                       : CellLabel(cell->cell),
                                   44)
                              .c_str(),
                          Percent(cell->p_full_by_deadline).c_str());
    }
  }
  return out + CautionsText();
}

std::string FormatComparisonJson(const Comparison& c, const ReportContext& ctx) {
  Json j;
  j["tool"] = {
      {"name", "fillcast"}, {"version", ctx.tool_version}, {"seal", kSealPlaceholder}};
  j["rank_by"] = RankByName(c.rank_by);
  j["scenarios"] = Json::array();
  for (const ScenarioResult& r : c.ranked) {
    j["scenarios"].push_back(
        {{"name", r.name},
         {"file", r.file},
         {"runs", r.summary.runs},
         {"seed", r.summary.seed},
         {"p50", QuantileJson(r.summary.p50)},
         {"p80", QuantileJson(r.summary.p80)},
         {"p90", QuantileJson(r.summary.p90)},
         {"p_complete_by_deadline", r.summary.p_complete_by_deadline},
         {"p_incomplete_at_horizon", r.summary.p_incomplete_at_horizon},
         {"cost",
          {{"currency", r.cost.currency},
           {"weekly", r.cost.weekly},
           {"mobilisation", r.cost.mobilisation},
           {"at_p50", OptionalJson(r.cost_p50)},
           {"at_p80", OptionalJson(r.cost_p80)},
           {"at_p90", OptionalJson(r.cost_p90)},
           {"expected", r.expected_cost},
           {"expected_is_lower_bound", r.expected_cost_is_lower_bound}}}});
  }
  if (c.best_two) {
    const PairedDifference& d = *c.best_two;
    j["paired_difference"] = {{"a", d.a},
                              {"b", d.b},
                              {"pairs", d.pairs},
                              {"mean_weeks_b_minus_a", d.mean_weeks},
                              {"se_weeks", d.se_weeks},
                              {"p_a_sooner", d.p_a_sooner}};
  } else {
    j["paired_difference"] = nullptr;
  }
  j["cautions"] = StandardCautions();
  return j.dump(2) + "\n";
}

std::string FormatStartSweepText(const Plan& plan, const std::vector<StartSweepRow>& rows,
                                 const ReportContext& ctx, long runs, uint64_t seed) {
  std::string out =
      StringPrintf("fillcast %s - start-date sweep\n", ctx.tool_version.c_str());
  out += Wrap("  Plan:  ", plan.name);
  out += StringPrintf(
      "  %ld runs per start, seed %llu, common random numbers; the deadline moves "
      "with the start (%lld days after it)\n\n",
      runs, static_cast<unsigned long long>(seed),
      static_cast<long long>(DaysBetween(plan.start, plan.deadline)));
  out += StringPrintf("  %-10s  %-10s  %23s  %23s  %23s  %11s\n", "start", "deadline",
                      "P50 weeks / done by", "P80 weeks / done by", "P90 weeks / done by",
                      "P(deadline)");
  for (const StartSweepRow& r : rows) {
    auto cell = [&](const QuantileEstimate& q) {
      return q.value
                 ? StringPrintf("%5.1f / %s", *q.value, DoneBy(r.start, q.value).c_str())
                 : std::string("not reached");
    };
    out += StringPrintf("  %-10s  %-10s  %23s  %23s  %23s  %11s\n",
                        FormatDate(r.start).c_str(), FormatDate(r.deadline).c_str(),
                        cell(r.p50).c_str(), cell(r.p80).c_str(), cell(r.p90).c_str(),
                        Percent(r.p_complete_by_deadline).c_str());
  }
  return out + CautionsText();
}

std::string FormatStartSweepJson(const Plan& plan, const std::vector<StartSweepRow>& rows,
                                 const ReportContext& ctx, long runs, uint64_t seed) {
  Json j;
  j["tool"] = {
      {"name", "fillcast"}, {"version", ctx.tool_version}, {"seal", kSealPlaceholder}};
  j["plan"] = plan.name;
  j["runs"] = runs;
  j["seed"] = seed;
  j["starts"] = Json::array();
  for (const StartSweepRow& r : rows) {
    j["starts"].push_back({{"start", FormatDate(r.start)},
                           {"deadline", FormatDate(r.deadline)},
                           {"p50", QuantileJson(r.p50)},
                           {"p80", QuantileJson(r.p80)},
                           {"p90", QuantileJson(r.p90)},
                           {"p_complete_by_deadline", r.p_complete_by_deadline}});
  }
  j["cautions"] = StandardCautions();
  return j.dump(2) + "\n";
}

}  // namespace planner
