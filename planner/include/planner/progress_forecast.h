// Forecasting the rest of a running campaign from what it has logged
// (fillcast progress). The Monte-Carlo runs continue from the logged state
// (planner/logged_counts.h, CampaignState): the calendar where the as-of date
// is, the counts as logged, the weather from the latest logged wind. Weeks
// still count from the plan's start, so every date convention of
// docs/output.md holds; the remaining weeks are counted from the as-of date.
//
// Extensions: "what does extending by N weeks buy" is read from the same
// runs: the share of runs complete by the planned end + N weeks (counted from
// the as-of date instead once the planned end has passed), and the required
// cells that are full by then in fewer than half of the runs. Each run goes
// on until every required cell is full (or the horizon), so these shares are
// exact for required cells; beyond the horizon they are lower bounds and the
// row says so.
#ifndef PLANNER_PROGRESS_FORECAST_H_
#define PLANNER_PROGRESS_FORECAST_H_

#include <optional>
#include <vector>

#include "planner/forecast.h"
#include "planner/logged_counts.h"
#include "planner/monte_carlo.h"
#include "planner/plan.h"

namespace planner {

// Extensions asked about, weeks beyond the planned end.
inline const std::vector<int> kExtensionWeeks = {4, 8, 12, 26};
// A required cell is "likely thin" at a date when fewer than this share of
// the runs have it full by then.
inline constexpr double kThinBelow = 0.5;

struct CellAtDate {
  int cell = 0;       // index into the matrix's cells
  double p_full = 0;  // share of runs with the cell full by the date
};

struct ExtensionRow {
  int weeks = 0;                // beyond the base (planned end, or as-of once passed)
  Date end;                     // base + weeks (exclusive, like the deadline)
  bool beyond_horizon = false;  // shares are lower bounds
  double p_complete = 0;        // share of runs complete by `end`
  // Required cells full by `end` in fewer than kThinBelow of the runs,
  // least likely first.
  std::vector<CellAtDate> thin;
  // Every required cell not full by `end` in all runs, least likely first
  // (thin is its head).
  std::vector<CellAtDate> uncertain;
};

struct ProgressSummary {
  Date as_of;
  double as_of_weeks = 0;  // from the plan's start
  LoggedCounts logged;
  bool already_complete = false;  // the logged counts fill every required cell
  // The runs, summarised as a forecast (weeks from the plan's start; the
  // deadline is the planned end).
  ForecastSummary forecast;
  // Share of runs complete by the planned end. Once the matrix is full in the
  // log: 1 if it filled before the planned end, else 0.
  double p_by_planned_end = 0;
  // Weeks from the as-of date to completion at P50 / P80 / P90; nullopt =
  // not reached within the horizon.
  std::optional<double> remaining_p50, remaining_p80, remaining_p90;
  Date extension_base;  // the planned end, or the as-of date once it has passed
  std::vector<ExtensionRow> extensions;  // one per kExtensionWeeks
};

// Runs the Monte-Carlo continuation and summarises it. plan must be valid and
// as_of pass CheckAsOfDate; options.state is set here (any given is ignored).
ProgressSummary ForecastProgress(const Plan& plan, const LoggedCounts& logged,
                                 const Date& as_of, MonteCarloOptions options,
                                 ProgressSink* progress);

// The summary part alone, from runs already made (for tests).
ProgressSummary SummarizeProgress(const Plan& plan, const LoggedCounts& logged,
                                  const Date& as_of, const std::vector<RunResult>& runs,
                                  uint64_t seed, double relaxed_share);

}  // namespace planner

#endif  // PLANNER_PROGRESS_FORECAST_H_
