#include "planner/decision.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <limits>

namespace planner {
namespace {
constexpr double kInf = std::numeric_limits<double>::infinity();

std::optional<double> CostAt(const CostModel& cost, const QuantileEstimate& q) {
  if (!q.value) return std::nullopt;
  return CampaignCost(cost, *q.value);
}

// The value a scenario is ranked by; +inf when not reached.
double RankValue(const ScenarioResult& r, RankBy by) {
  switch (by) {
    case RankBy::kP50:
      return r.summary.p50.value.value_or(kInf);
    case RankBy::kP80:
      return r.summary.p80.value.value_or(kInf);
    case RankBy::kP90:
      return r.summary.p90.value.value_or(kInf);
    case RankBy::kExpectedCost:
      return r.expected_cost;
  }
  return kInf;
}
}  // namespace

double CampaignCost(const CostModel& cost, double weeks) {
  return cost.weekly * weeks + cost.mobilisation;
}

const char* RankByName(RankBy r) {
  switch (r) {
    case RankBy::kP50:
      return "p50";
    case RankBy::kP80:
      return "p80";
    case RankBy::kP90:
      return "p90";
    case RankBy::kExpectedCost:
      return "cost";
  }
  return "?";
}

PairedDifference PairedCompletionDifference(const std::string& a_name,
                                            const std::vector<RunResult>& a,
                                            const std::string& b_name,
                                            const std::vector<RunResult>& b) {
  PairedDifference d;
  d.a = a_name;
  d.b = b_name;
  const size_t n = std::min(a.size(), b.size());
  double sum = 0, sum2 = 0;
  long sooner = 0;
  for (size_t i = 0; i < n; ++i) {
    const int64_t ta = a[i].completion_step, tb = b[i].completion_step;
    // An incomplete run counts as later than any complete one.
    if (ta >= 0 && (tb < 0 || ta < tb)) ++sooner;
    if (ta < 0 || tb < 0) continue;
    const double diff = StepsToWeeks(tb) - StepsToWeeks(ta);
    sum += diff;
    sum2 += diff * diff;
    ++d.pairs;
  }
  if (d.pairs > 0) {
    d.mean_weeks = sum / d.pairs;
    if (d.pairs > 1) {
      const double var = (sum2 - d.pairs * d.mean_weeks * d.mean_weeks) / (d.pairs - 1);
      d.se_weeks = std::sqrt(std::max(0.0, var) / d.pairs);
    }
  }
  d.p_a_sooner = n > 0 ? static_cast<double>(sooner) / n : 0.0;
  return d;
}

Comparison RankScenarios(std::vector<ScenarioResult> scenarios,
                         const std::vector<std::vector<RunResult>>& per_run,
                         RankBy rank_by) {
  std::vector<size_t> order(scenarios.size());
  for (size_t i = 0; i < order.size(); ++i) order[i] = i;
  for (size_t i = 0; i < scenarios.size(); ++i) {
    ScenarioResult& r = scenarios[i];
    r.cost_p50 = CostAt(r.cost, r.summary.p50);
    r.cost_p80 = CostAt(r.cost, r.summary.p80);
    r.cost_p90 = CostAt(r.cost, r.summary.p90);
    double total = 0;
    for (const RunResult& run : per_run[i]) {
      const int64_t steps =
          run.completion_step >= 0 ? run.completion_step : run.simulated_steps;
      total += CampaignCost(r.cost, StepsToWeeks(steps));
      r.expected_cost_is_lower_bound |= run.completion_step < 0;
    }
    r.expected_cost = per_run[i].empty() ? 0.0 : total / per_run[i].size();
  }
  std::stable_sort(order.begin(), order.end(), [&](size_t a, size_t b) {
    return RankValue(scenarios[a], rank_by) < RankValue(scenarios[b], rank_by);
  });
  Comparison c;
  c.rank_by = rank_by;
  for (size_t i : order) c.ranked.push_back(scenarios[i]);
  if (order.size() >= 2) {
    c.best_two = PairedCompletionDifference(scenarios[order[0]].name, per_run[order[0]],
                                            scenarios[order[1]].name, per_run[order[1]]);
  }
  return c;
}

Plan ShiftStart(const Plan& plan, const Date& new_start) {
  Plan p = plan;
  const int64_t shift = DaysBetween(plan.start, new_start);
  p.start = new_start;
  p.deadline = AddDays(plan.deadline, shift);
  for (PlannedOutage& o : p.planned_outages) {
    o.from = AddDays(o.from, shift);
    o.to = AddDays(o.to, shift);
  }
  return p;
}

std::string BottleneckSentence(const CaptureMatrix& matrix, const ForecastSummary& s) {
  if (s.bottleneck_cell < 0 || s.bottleneck_cell >= static_cast<int>(s.cells.size())) {
    return "No run completed within the horizon, so no single cell can be named as the "
           "bottleneck; see the cells least likely to be full.";
  }
  const CellForecast& c = s.cells[static_cast<size_t>(s.bottleneck_cell)];
  char buf[512];
  std::snprintf(buf, sizeof buf,
                "The campaign waits mostly on %s (last to fill in %.0f %% of runs)",
                CellLabel(matrix, c.cell).c_str(), 100.0 * c.p_last_to_fill);
  std::string out = buf;
  if (c.saved_p80_if_optional && *c.saved_p80_if_optional >= 0.05) {
    std::snprintf(buf, sizeof buf,
                  "; making it optional would save about %.1f weeks at P80.",
                  *c.saved_p80_if_optional);
    out += buf;
  } else if (c.saved_p80_if_optional) {
    out += "; making it optional alone would hardly change P80.";
  } else {
    out += ".";
  }
  return out;
}

}  // namespace planner
