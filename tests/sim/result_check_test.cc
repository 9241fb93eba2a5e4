// The last check before a result goes out (planner/result_check.h).
#include "planner/result_check.h"

#include <gtest/gtest.h>

#include <cmath>
#include <limits>

#include "planner/monte_carlo.h"
#include "planner/simulation.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

ForecastSummary RealSummary() {
  const Plan plan = testing_plans::SingleCellPlan(8.0, 2.0, 7.0, 9.0, 50, 7, 4);
  const Simulator sim(plan);
  MonteCarloOptions mc;
  mc.runs = 40;
  mc.seed = 3;
  return SummarizeForecast(plan.matrix, sim.deadline_steps(), sim.horizon_steps(),
                           RunMonteCarlo(sim, mc, nullptr), mc.seed, sim.relaxed_share());
}

TEST(ResultCheckTest, ARealForecastIsPlausible) {
  EXPECT_EQ(ImplausibleNumbers(RealSummary()), std::vector<std::string>{});
}

TEST(ResultCheckTest, EveryKindOfNonsenseIsNamed) {
  const double nan = std::numeric_limits<double>::quiet_NaN();
  ForecastSummary s = RealSummary();
  ASSERT_FALSE(s.cells.empty());
  s.mean_speed_ms = 3.6e6;  // a Weibull k of 0.1 on A = 1 m/s
  s.turbine_availability = nan;
  s.p80.value = -1.0;
  s.cells[0].count_mean = nan;
  s.cells[0].p_full_by_deadline = 1.5;
  s.cells[0].saved_p80_if_optional = std::numeric_limits<double>::infinity();
  const std::vector<std::string> expected = {
      "P80: -1 (expected 0 to the horizon in weeks)",
      "turbine availability: nan (expected 0 to 1)",
      "mean wind speed at hub: 3.6e+06 (expected 0 to 75 m/s)",
      "cell 1, mean count: nan (expected a count >= 0)",
      "cell 1, chance full by the deadline: 1.5 (expected 0 to 1)",
      "cell 1, saved if optional, P80: inf (expected a finite number)",
  };
  EXPECT_EQ(ImplausibleNumbers(s), expected);
}

}  // namespace
}  // namespace planner
