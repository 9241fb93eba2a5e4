// Aggregation of many runs into the answer an engineer reads: weeks to
// completion with their risk, and the state of every cell at the deadline.
// A week is 1,008 ten-minute records; weeks count from the start date.
#ifndef PLANNER_FORECAST_H_
#define PLANNER_FORECAST_H_

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "planner/capture_matrix.h"
#include "planner/quantile.h"
#include "planner/simulation.h"

namespace planner {

struct CellForecast {
  int index = 0;  // into CaptureMatrix::cells
  Cell cell;
  // Valid records at the deadline over the runs.
  double count_mean = 0, count_p10 = 0, count_p50 = 0, count_p90 = 0;
  double p_full_by_deadline = 0;  // share of runs with the cell full by then
  // Weeks until the cell reached its minimum in half / 90 % of the runs;
  // nullopt where fewer runs than that reached it while simulated.
  std::optional<double> weeks_to_full_p50;
  std::optional<double> weeks_to_full_p90;
  double p_last_to_fill = 0;  // share of all runs in which it filled last
  // Share of all runs in which the cell had not reached its minimum when the
  // run stopped (for a required cell: runs it held up to the horizon).
  double p_not_full_at_end = 0;

  // What relaxing this cell buys, from the same runs: weeks saved at P50 /
  // P80 of completion if the cell were optional, or if its minimum were
  // lowered to ForecastSummary::relaxed_share of it. nullopt where the
  // quantile is not reached with or without the change. Zero for optional
  // cells.
  std::optional<double> saved_p50_if_optional, saved_p80_if_optional;
  std::optional<double> saved_p50_if_relaxed, saved_p80_if_relaxed;
};

// Runs that completed at one completion time.
struct CompletionCount {
  double weeks = 0;
  long runs = 0;
};

// Share of required cells full at a week, over the runs.
struct FillPoint {
  double week = 0;
  double p10 = 0, p50 = 0, p90 = 0;
};

// With the site model's uncertainty drawn per run: the same runs and seed
// with the site model taken as exact, i.e. the weather's spread alone.
struct SiteModelSpread {
  double mean_speed_uncertainty_pct = 0;  // as stated in the site model
  QuantileEstimate p10, p50, p80, p90;    // site model taken as exact
  double p_complete_by_deadline = 0;
};

// A process switched off (planner/hold_ups.h): the forecast without it, from
// the same runs and seed.
struct HoldUp {
  std::string key;    // e.g. "episode:icing"
  std::string label;  // for people
  QuantileEstimate p50, p80;
  double p_complete_by_deadline = 0;
  // P80 with every process minus P80 without this one (weeks; both reached).
  std::optional<double> p80_saved_weeks;
};

struct ForecastSummary {
  long runs = 0;
  uint64_t seed = 0;
  double deadline_weeks = 0;
  double horizon_weeks = 0;

  // Completion weeks; the mean only when every run completed.
  std::optional<double> mean_weeks;
  std::optional<double> mean_se_weeks;  // Monte-Carlo standard error of the mean
  QuantileEstimate p10, p50, p80, p90;

  double p_complete_by_deadline = 0;
  double p_incomplete_at_horizon = 0;

  std::vector<CellForecast> cells;  // in matrix order
  int bottleneck_cell = -1;         // most often last to fill, -1 if none

  // The distinct completion weeks, ascending, each with its number of runs
  // (one entry per distinct completion step, at most one per step of the
  // horizon, however many runs); the runs not counted here did not complete.
  std::vector<CompletionCount> completion_counts;
  // Share of required cells full, week by week from 0 to the last simulated
  // week (runs that stopped count as they stopped).
  std::vector<FillPoint> fill_curve;
  double relaxed_share = 0.8;  // see CellForecast::saved_*_if_relaxed

  // Shares of simulated time (diagnostics that explain the answer).
  double turbine_availability = 0;
  double daq_availability = 0;
  double channels_availability = 0;  // every load-channel group up (1 if none)
  double valid_sector_share = 0;
  double curtailed_share = 0;  // time with a curtailment rule in force
  double mean_speed_ms = 0;    // mean simulated wind speed at hub height

  // What each process the plan uses costs (empty: none, or not asked for).
  std::vector<HoldUp> hold_ups;
  // Set when the site model states an uncertainty (and the weather is not
  // replayed): the forecast above includes it; this is without it.
  std::optional<SiteModelSpread> site_exact;
};

// The summary of runs held in a vector (tests, small run counts): the same as
// ForecastAccumulator (planner/forecast_accumulator.h) fed with them in order,
// which the commands use so that memory does not grow with the runs.
ForecastSummary SummarizeForecast(const CaptureMatrix& matrix, int64_t deadline_steps,
                                  int64_t horizon_steps,
                                  const std::vector<RunResult>& runs, uint64_t seed,
                                  double relaxed_share = 0.8);

// Records -> weeks.
inline double StepsToWeeks(int64_t steps) { return static_cast<double>(steps) / 1008.0; }

// Cells sorted from least to most likely to be full by the deadline (ties:
// lower expected share of the minimum first); at most `limit`.
std::vector<const CellForecast*> ThinnestCells(const ForecastSummary& s, int limit,
                                               bool include_optional);

}  // namespace planner

#endif  // PLANNER_FORECAST_H_
