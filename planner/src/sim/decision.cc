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

ComparisonTally::ComparisonTally(std::vector<CostModel> costs)
    : costs_(std::move(costs)),
      cost_sum_(costs_.size(), 0.0),
      lower_bound_(costs_.size(), false),
      pairs_(costs_.size() * costs_.size()) {}

void ComparisonTally::Add(const std::vector<std::vector<RunResult>>& chunk) {
  const size_t k = std::min(costs_.size(), chunk.size());
  size_t n = chunk.empty() ? 0 : chunk[0].size();
  for (size_t s = 0; s < k; ++s) n = std::min(n, chunk[s].size());
  for (size_t j = 0; j < n; ++j) {
    ++runs_;
    for (size_t s = 0; s < k; ++s) {
      const RunResult& run = chunk[s][j];
      const int64_t steps =
          run.completion_step >= 0 ? run.completion_step : run.simulated_steps;
      cost_sum_[s] += CampaignCost(costs_[s], StepsToWeeks(steps));
      if (run.completion_step < 0) lower_bound_[s] = true;
    }
    for (size_t a = 0; a < k; ++a) {
      for (size_t b = a + 1; b < k; ++b) {
        PairSums& p = pairs_[a * costs_.size() + b];
        const int64_t ta = chunk[a][j].completion_step, tb = chunk[b][j].completion_step;
        // An incomplete run counts as later than any complete one.
        if (ta >= 0 && (tb < 0 || ta < tb)) ++p.first_sooner;
        if (tb >= 0 && (ta < 0 || tb < ta)) ++p.second_sooner;
        if (ta < 0 || tb < 0) continue;
        const double diff = StepsToWeeks(tb) - StepsToWeeks(ta);
        p.sum += diff;
        p.sum2 += diff * diff;
        ++p.pairs;
      }
    }
  }
}

double ComparisonTally::ExpectedCost(size_t s) const {
  return runs_ == 0 ? 0.0 : cost_sum_[s] / runs_;
}

bool ComparisonTally::ExpectedCostIsLowerBound(size_t s) const { return lower_bound_[s]; }

const ComparisonTally::PairSums& ComparisonTally::Pair(size_t a, size_t b) const {
  return pairs_[std::min(a, b) * costs_.size() + std::max(a, b)];
}

PairedDifference ComparisonTally::Paired(size_t a, const std::string& a_name, size_t b,
                                         const std::string& b_name) const {
  PairedDifference d;
  d.a = a_name;
  d.b = b_name;
  const PairSums& p = Pair(a, b);
  // The sums are of (later - earlier) scenario; negating a sum of negated
  // terms is exact, so either order gives the same figures.
  const double sign = a < b ? 1.0 : -1.0;
  const double sum = sign * p.sum;
  d.pairs = p.pairs;
  if (d.pairs > 0) {
    d.mean_weeks = sum / d.pairs;
    if (d.pairs > 1) {
      const double var = (p.sum2 - d.pairs * d.mean_weeks * d.mean_weeks) / (d.pairs - 1);
      d.se_weeks = std::sqrt(std::max(0.0, var) / d.pairs);
    }
  }
  const long sooner = a < b ? p.first_sooner : p.second_sooner;
  d.p_a_sooner = runs_ > 0 ? static_cast<double>(sooner) / runs_ : 0.0;
  return d;
}

PairedDifference PairedCompletionDifference(const std::string& a_name,
                                            const std::vector<RunResult>& a,
                                            const std::string& b_name,
                                            const std::vector<RunResult>& b) {
  const size_t n = std::min(a.size(), b.size());
  ComparisonTally tally({CostModel{}, CostModel{}});
  tally.Add(
      {std::vector<RunResult>(a.begin(), a.begin() + static_cast<std::ptrdiff_t>(n)),
       std::vector<RunResult>(b.begin(), b.begin() + static_cast<std::ptrdiff_t>(n))});
  return tally.Paired(0, a_name, 1, b_name);
}

Comparison RankScenarios(std::vector<ScenarioResult> scenarios,
                         const ComparisonTally& tally, RankBy rank_by) {
  std::vector<size_t> order(scenarios.size());
  for (size_t i = 0; i < order.size(); ++i) order[i] = i;
  for (size_t i = 0; i < scenarios.size(); ++i) {
    ScenarioResult& r = scenarios[i];
    r.cost_p50 = CostAt(r.cost, r.summary.p50);
    r.cost_p80 = CostAt(r.cost, r.summary.p80);
    r.cost_p90 = CostAt(r.cost, r.summary.p90);
    r.expected_cost = tally.ExpectedCost(i);
    r.expected_cost_is_lower_bound = tally.ExpectedCostIsLowerBound(i);
  }
  std::stable_sort(order.begin(), order.end(), [&](size_t a, size_t b) {
    return RankValue(scenarios[a], rank_by) < RankValue(scenarios[b], rank_by);
  });
  Comparison c;
  c.rank_by = rank_by;
  for (size_t i : order) c.ranked.push_back(scenarios[i]);
  if (order.size() >= 2) {
    c.best_two = tally.Paired(order[0], scenarios[order[0]].name, order[1],
                              scenarios[order[1]].name);
  }
  return c;
}

Comparison RankScenarios(std::vector<ScenarioResult> scenarios,
                         const std::vector<std::vector<RunResult>>& per_run,
                         RankBy rank_by) {
  std::vector<CostModel> costs;
  for (const ScenarioResult& r : scenarios) costs.push_back(r.cost);
  ComparisonTally tally(std::move(costs));
  tally.Add(per_run);
  return RankScenarios(std::move(scenarios), tally, rank_by);
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
