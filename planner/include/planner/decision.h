// The engineer's decisions: which site or scenario, when to start. Built on
// forecasts run with common random numbers (the same per-run streams), so
// differences between scenarios are not Monte-Carlo noise.
#ifndef PLANNER_DECISION_H_
#define PLANNER_DECISION_H_

#include <optional>
#include <string>
#include <vector>

#include "planner/forecast.h"
#include "planner/plan.h"

namespace planner {

// Cost of a campaign lasting `weeks`: weekly x weeks + mobilisation.
double CampaignCost(const CostModel& cost, double weeks);

struct ScenarioResult {
  std::string name;  // plan name (or file when names clash)
  std::string file;
  ForecastSummary summary;
  std::vector<std::string> cell_labels;  // per cell, CellLabel(matrix, cell)
  CostModel cost;
  // Cost at the completion quantiles; nullopt where the quantile is not reached.
  std::optional<double> cost_p50, cost_p80, cost_p90;
  // Mean cost over the runs, counting incomplete runs at the horizon (a lower
  // bound then, flagged by expected_cost_is_lower_bound).
  double expected_cost = 0;
  bool expected_cost_is_lower_bound = false;
};

// Paired difference of completion weeks between two scenarios run on the same
// streams: b minus a, over the runs where both completed.
struct PairedDifference {
  std::string a, b;
  long pairs = 0;         // runs where both completed
  double mean_weeks = 0;  // mean of (b - a)
  double se_weeks = 0;    // its standard error
  double p_a_sooner = 0;  // share of all runs where a completed strictly sooner
};

enum class RankBy { kP50, kP80, kP90, kExpectedCost };
const char* RankByName(RankBy r);

struct Comparison {
  RankBy rank_by = RankBy::kP80;
  std::vector<ScenarioResult> ranked;  // best first
  std::optional<PairedDifference> best_two;
};

// Ranks scenarios (ties keep input order). per_run[i] are the runs of
// scenarios[i], all with the same seed and run count.
Comparison RankScenarios(std::vector<ScenarioResult> scenarios,
                         const std::vector<std::vector<RunResult>>& per_run,
                         RankBy rank_by);

PairedDifference PairedCompletionDifference(const std::string& a_name,
                                            const std::vector<RunResult>& a,
                                            const std::string& b_name,
                                            const std::vector<RunResult>& b);

// One row of a start-date sweep: the plan moved to start on `start`, its
// deadline moved by the same number of days.
struct StartSweepRow {
  Date start;
  Date deadline;
  QuantileEstimate p50, p80, p90;
  double p_complete_by_deadline = 0;
};

// The plan with start and deadline shifted so that it starts on new_start.
Plan ShiftStart(const Plan& plan, const Date& new_start);

// "The campaign waits mostly on X; making it optional would save about N
// weeks at P80." (or a plain statement when nothing stands out).
std::string BottleneckSentence(const CaptureMatrix& matrix, const ForecastSummary& s);

}  // namespace planner

#endif  // PLANNER_DECISION_H_
