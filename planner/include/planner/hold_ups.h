// What holds the campaign up: the plan's processes that decide the few
// high-wind and winter cells (short-term high-wind stops, episodes such as
// icing, load-channel groups, wakes on the turbine under test), each switched
// off in turn. The same runs and seed are simulated for every variant
// (common random numbers: run i has the same weather in each), so the
// difference in P80 is what that process costs, not noise between two sets
// of weather.
#ifndef PLANNER_HOLD_UPS_H_
#define PLANNER_HOLD_UPS_H_

#include <optional>
#include <string>
#include <vector>

#include "planner/forecast.h"
#include "planner/monte_carlo.h"
#include "planner/plan.h"
#include "planner/progress.h"
#include "planner/simulation.h"

namespace planner {

// The plan with one process switched off.
struct ProcessVariant {
  std::string key;    // "short_term_stops", "episode:icing", "channel_groups",
                      // "turbine_wakes"
  std::string label;  // for people: "high-wind stops on 30 s, 3 s means; restart wait"
  Plan plan;
};

// One variant per process the plan uses, in the order above (one per
// episode); empty when it uses none of them.
std::vector<ProcessVariant> ProcessVariants(const Plan& plan);

// The forecast without `v`'s process beside the plan's own.
HoldUp MakeHoldUp(const ProcessVariant& v, const ForecastSummary& with_all,
                  const ForecastSummary& without);

// Forecasts every variant of `plan` with the runs and seed of `with_all`
// (mc.runs should be with_all.runs), all in one pass over the runs, and sets
// each beside `with_all`. Empty when the plan uses none of the processes.
std::vector<HoldUp> ForecastHoldUps(const Plan& plan, const SimulationOptions& options,
                                    const MonteCarloOptions& mc,
                                    const ForecastSummary& with_all,
                                    ProgressSink* progress);

// When the site model states an uncertainty of its mean wind speed (and the
// weather is not replayed): the same runs and seed with the site model taken
// as exact (SimulationOptions::site_uncertainty false), for the split of the
// spread into weather and site model. nullopt otherwise.
std::optional<SiteModelSpread> ForecastSiteModelExact(const Plan& plan,
                                                      const SimulationOptions& options,
                                                      const MonteCarloOptions& mc,
                                                      ProgressSink* progress);

}  // namespace planner

#endif  // PLANNER_HOLD_UPS_H_
