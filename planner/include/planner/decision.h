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

// What ranking needs from the runs of several scenarios on the same streams,
// folded run index by run index so that memory does not grow with the runs:
// each scenario's cost summed over its runs, and for every pair of scenarios
// the sums of their paired completion differences. Sums are taken in run
// order, so the result repeats exactly.
class ComparisonTally {
 public:
  // One cost model per scenario.
  explicit ComparisonTally(std::vector<CostModel> costs);
  // chunk[s][j] is run j of this chunk for scenario s (the chunks in run
  // order; every scenario the same number of runs).
  void Add(const std::vector<std::vector<RunResult>>& chunk);

  long runs() const { return runs_; }
  // Mean cost over the runs of scenario s (see ScenarioResult::expected_cost),
  // and whether an incomplete run made it a lower bound.
  double ExpectedCost(size_t s) const;
  bool ExpectedCostIsLowerBound(size_t s) const;
  // PairedCompletionDifference of scenarios a and b (a != b), named.
  PairedDifference Paired(size_t a, const std::string& a_name, size_t b,
                          const std::string& b_name) const;

 private:
  struct PairSums {
    long pairs = 0;            // runs where both completed
    double sum = 0, sum2 = 0;  // of (later scenario - earlier), weeks
    long first_sooner = 0, second_sooner = 0;
  };
  const PairSums& Pair(size_t a, size_t b) const;

  std::vector<CostModel> costs_;
  long runs_ = 0;
  std::vector<double> cost_sum_;
  std::vector<bool> lower_bound_;
  std::vector<PairSums> pairs_;  // [a * scenarios + b] for a < b
};

// Ranks scenarios (ties keep input order). tally holds the runs of
// scenarios[i] as its scenario i, all with the same seed and run count.
Comparison RankScenarios(std::vector<ScenarioResult> scenarios,
                         const ComparisonTally& tally, RankBy rank_by);
// The same from runs held in vectors: per_run[i] are the runs of scenarios[i].
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
