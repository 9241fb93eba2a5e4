// Realism features of the simulation, each checked against an exact property
// or an outside reference: seasons and hours, inter-annual factors,
// non-exponential outage laws, planned outages, curtailment, events and
// manual tests.
#include <gtest/gtest.h>

#include <algorithm>
#include <boost/math/distributions/lognormal.hpp>
#include <boost/math/distributions/weibull.hpp>
#include <cmath>
#include <numeric>
#include <vector>

#include "planner/monte_carlo.h"
#include "planner/simulation.h"
#include "planner/weibull.h"
#include "sim/renewal_process.h"
#include "sim/test_plans.h"
#include "sim/ziggurat_normal.h"

namespace planner {
namespace {

using testing_plans::Outages;
using testing_plans::SingleCellPlan;

std::vector<RunResult> Simulate(const Plan& plan, int runs, uint64_t seed) {
  const Simulator sim(plan);
  MonteCarloOptions mc;
  mc.runs = runs;
  mc.seed = seed;
  mc.threads = 2;
  return RunMonteCarlo(sim, mc, nullptr);
}

struct MeanAndSe {
  double mean = 0, se = 0;
};
MeanAndSe Summarise(const std::vector<double>& x) {
  const double n = static_cast<double>(x.size());
  const double mean = std::accumulate(x.begin(), x.end(), 0.0) / n;
  double var = 0;
  for (double v : x) var += (v - mean) * (v - mean);
  return {mean, std::sqrt(var / (n - 1) / n)};
}

// Month factors normalised to a day-weighted mean of 1 over a 365-day year
// and hour factors to a mean of 1 move wind between seasons and hours but
// leave the annual mean at the Weibull mean A Gamma(1 + 1/k) (Boost.Math).
TEST(OperationsTest, SeasonAndHourFactorsKeepTheAnnualMean) {
  Plan plan = SingleCellPlan(9.0, 2.1, 2.0, 30.0, 1, 365, 53);
  plan.site.wind_persistence_h = 24;
  const int days_in_month[12] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
  double weighted = 0;
  for (int m = 0; m < 12; ++m) {
    plan.site.monthly_factors[m] = 1.0 + 0.3 * std::cos(2 * M_PI * m / 12.0);
    weighted += plan.site.monthly_factors[m] * days_in_month[m];
  }
  for (double& f : plan.site.monthly_factors) f *= 365.0 / weighted;
  for (int h = 0; h < 24; ++h)
    plan.site.hourly_factors[h] = 1.0 + 0.2 * std::sin(2 * M_PI * h / 24);
  plan.start = Date{2027, 1, 1};  // not a leap year: exactly the 365 normalised days
  plan.deadline = AddDays(plan.start, 365);
  const std::vector<RunResult> runs = Simulate(plan, 200, 31);
  std::vector<double> annual_means;
  for (const RunResult& r : runs) {
    ASSERT_EQ(r.simulated_steps, 365 * kStepsPerDay);
    annual_means.push_back(r.speed_sum_ms / r.simulated_steps);
  }
  const boost::math::weibull_distribution<double> ref(2.1, 9.0);
  const MeanAndSe m = Summarise(annual_means);
  EXPECT_NEAR(m.mean, boost::math::mean(ref), 4 * m.se);
}

// Year factors come from their own stream, so with the same seed the weather
// is identical and each run's annual mean with the factor is exactly F times
// the one without (common random numbers). The F's have mean 1 and the
// site's standard deviation (lognormal; Boost.Math lognormal as reference).
TEST(OperationsTest, InterannualFactorScalesWholeYearsLognormally) {
  Plan plan = SingleCellPlan(8.0, 2.0, 2.0, 30.0, 1, 360, 52);
  plan.site.wind_persistence_h = 24;
  const std::vector<RunResult> base = Simulate(plan, 400, 77);
  plan.site.interannual_std = 0.06;
  const std::vector<RunResult> varied = Simulate(plan, 400, 77);
  std::vector<double> factors;
  for (size_t i = 0; i < base.size(); ++i) {
    factors.push_back(varied[i].speed_sum_ms / base[i].speed_sum_ms);
  }
  const double s = std::sqrt(std::log1p(0.06 * 0.06));
  const boost::math::lognormal_distribution<double> ref(-0.5 * s * s, s);
  const MeanAndSe m = Summarise(factors);
  EXPECT_NEAR(m.mean, boost::math::mean(ref), 4 * m.se);
  double var = 0;
  for (double f : factors) var += (f - m.mean) * (f - m.mean);
  const double sd = std::sqrt(var / (factors.size() - 1));
  // Standard error of a sample standard deviation ~ sd / sqrt(2 (n - 1)).
  EXPECT_NEAR(sd, 0.06, 4 * sd / std::sqrt(2.0 * (factors.size() - 1)));
}

// Weibull and lognormal duration laws given by their mean have the textbook
// means (Boost.Math weibull_distribution, lognormal_distribution).
TEST(OperationsTest, DurationLawsHaveTheirTextbookMeans) {
  const ZigguratNormal normal;
  for (const DurationLaw& law : {DurationLaw{DurationLaw::Kind::kWeibull, 0.7},
                                 DurationLaw{DurationLaw::Kind::kWeibull, 2.5},
                                 DurationLaw{DurationLaw::Kind::kLognormal, 0.9}}) {
    const DurationSampler sampler(law, 240.0);
    if (law.kind == DurationLaw::Kind::kWeibull) {
      const boost::math::weibull_distribution<double> ref(law.shape,
                                                          sampler.weibull_scale_steps);
      EXPECT_NEAR(boost::math::mean(ref), 240.0, 1e-9);
    } else {
      const boost::math::lognormal_distribution<double> ref(sampler.log_mu,
                                                            sampler.log_sigma);
      EXPECT_NEAR(boost::math::mean(ref), 240.0, 1e-9);
    }
    Engine e = MakeRunEngine(5, static_cast<uint64_t>(law.shape * 10));
    std::vector<double> draws(200000);
    for (double& d : draws) {
      const double u = UniformDouble(e);
      d = sampler.Draw(u, normal(e));
    }
    const MeanAndSe m = Summarise(draws);
    EXPECT_NEAR(m.mean, 240.0, 4 * m.se) << "shape " << law.shape;
  }
}

// Availability MTBF / (MTBF + MTTR) holds for any up and repair laws
// (renewal-reward theorem); a repair-access factor of 2 in every month makes
// it MTBF / (MTBF + 2 MTTR). Tolerance: 4 standard errors across replicates
// plus the start-up transient, at most one cycle over the horizon.
TEST(OperationsTest, NonExponentialOutagesKeepLongRunAvailability) {
  for (double factor : {1.0, 2.0}) {
    OutageModel model = Outages(100.0, 20.0);
    model.up_law = {DurationLaw::Kind::kWeibull, 0.8};
    model.repair_law = {DurationLaw::Kind::kLognormal, 1.0};
    model.repair_month_factors.fill(factor);
    const RenewalLaw law = MakeRenewalLaw(model);
    const std::vector<uint8_t> months(30000, 0);
    const int64_t steps = 2000000;
    std::vector<double> shares;
    for (int r = 0; r < 40; ++r) {
      Engine e = MakeRunEngine(2024, r);
      RenewalProcess p(law, &e, months.data(), static_cast<int64_t>(months.size()));
      int64_t up = 0;
      for (int64_t t = 0; t < steps; ++t) up += p.UpAt(t);
      shares.push_back(static_cast<double>(up) / steps);
    }
    const double expected = 100.0 / (100.0 + factor * 20.0);
    const MeanAndSe m = Summarise(shares);
    const double transient = (100.0 + factor * 20.0) * 6 / steps;
    EXPECT_NEAR(m.mean, expected, 4 * m.se + transient) << "factor " << factor;
  }
}

TEST(OperationsTest, PlannedOutageRemovesExactlyItsDays) {
  Plan plan = SingleCellPlan(8.0, 2.0, 40.0, 41.0, 5, 30, 5);  // unreachable cell
  plan.turbine.cut_out_ms = 45;
  plan.turbine.restart_ms = 42;
  PlannedOutage outage;
  outage.from = AddDays(plan.start, 10);
  outage.to = AddDays(plan.start, 17);
  plan.planned_outages = {outage};
  for (const RunResult& r : Simulate(plan, 4, 9)) {
    EXPECT_EQ(r.turbine_up_steps, r.simulated_steps - 7 * kStepsPerDay);
    EXPECT_EQ(r.daq_up_steps, r.simulated_steps);
  }
}

// A stop rule for the whole year leaves no production record (an exact
// property); the turbine is parked throughout.
TEST(OperationsTest, YearRoundCurtailmentGivesNoProductionRecords) {
  Plan plan = SingleCellPlan(8.0, 2.0, 4.0, 20.0, 1000000, 30, 5);
  plan.curtailment = {CurtailmentRule{}};  // every month, hour, speed, direction; stop
  for (const RunResult& r : Simulate(plan, 4, 12)) {
    EXPECT_EQ(r.count_at_end[0], 0u);
    EXPECT_EQ(r.curtailed_steps, r.simulated_steps);
  }
}

// The long-run share of curtailed time equals the window's share of the wind
// distribution: hours 22-06 (8 of 24) x P(V < 6 m/s) (Boost.Math Weibull) x
// the frequency of the rule's direction (sector 0 of 4). Tolerance: 4
// standard errors across runs.
TEST(OperationsTest, CurtailedShareIsTheWindowsShareOfTheWind) {
  Plan plan = SingleCellPlan(8.0, 2.0, 40.0, 41.0, 5, 120, 18);
  plan.turbine.cut_out_ms = 45;
  plan.turbine.restart_ms = 42;
  plan.site.sectors = {Sector{0.3, Weibull{7.0, 2.0}}, Sector{0.2, Weibull{8.0, 2.0}},
                       Sector{0.3, Weibull{9.0, 2.0}}, Sector{0.2, Weibull{8.0, 2.0}}};
  plan.site.wind_persistence_h = 12;
  plan.site.sector_persistence = 0.95;
  CurtailmentRule rule;
  rule.hours = {22, 6};
  rule.wind_hi_ms = 6.0;
  rule.directions = {AngleRange{315, 45}};  // exactly sector 0
  plan.curtailment = {rule};
  std::vector<double> shares;
  for (const RunResult& r : Simulate(plan, 200, 4)) {
    shares.push_back(static_cast<double>(r.curtailed_steps) / r.simulated_steps);
  }
  const boost::math::weibull_distribution<double> sector0(2.0, 7.0);
  const double expected = (8.0 / 24.0) * 0.3 * boost::math::cdf(sector0, 6.0);
  const MeanAndSe m = Summarise(shares);
  EXPECT_NEAR(m.mean, expected, 4 * m.se);
}

// A reduce rule for the whole year moves every production record to the
// reduced state. With the same seed the weather is the same, so the reduced
// cell gets exactly the records the production cell got without the rule.
TEST(OperationsTest, ReducedModeRecordsGoToReducedCells) {
  Plan plan = SingleCellPlan(8.0, 2.0, 6.0, 9.0, 1000000, 20, 3);
  plan.site.wind_persistence_h = 20;
  const std::vector<RunResult> normal = Simulate(plan, 6, 8);
  CurtailmentRule rule;
  rule.action = CurtailmentRule::Action::kReduce;
  plan.curtailment = {rule};
  Cell reduced = plan.matrix.cells[0];
  reduced.state = OperatingState::kReduced;
  plan.matrix.cells.push_back(reduced);
  StateGrid grid;
  grid.state = OperatingState::kReduced;
  grid.wind_bins_ms = {reduced.wind_ms};
  grid.cell_index = {1};
  plan.matrix.grids.push_back(grid);
  const std::vector<RunResult> curtailed = Simulate(plan, 6, 8);
  for (size_t i = 0; i < normal.size(); ++i) {
    EXPECT_EQ(curtailed[i].count_at_end[0], 0u);
    EXPECT_EQ(curtailed[i].count_at_end[1], normal[i].count_at_end[0]);
    EXPECT_GT(normal[i].count_at_end[0], 100u);
  }
}

// Adds an event cell for `event` over [lo, hi) needing `required` events.
void AddEventCell(Plan* plan, const std::string& event, double lo, double hi,
                  int required) {
  CaptureMatrix& m = plan->matrix;
  auto it = std::find(m.event_types.begin(), m.event_types.end(), event);
  if (it == m.event_types.end()) it = m.event_types.insert(m.event_types.end(), event);
  Cell c;
  c.event = static_cast<int>(it - m.event_types.begin());
  c.wind_ms = {lo, hi};
  c.required = required;
  m.cells.push_back(c);
}

// With independent records and no outages, production at a record is a
// Bernoulli trial with p = P(V >= cut-in); a start-up is a record that
// produces after one that did not, a normal stop the reverse. Over D records
// each has expected count (D - 1) p (1 - p) (Boost.Math Weibull for p).
TEST(OperationsTest, NaturalStartUpsAndStopsFollowCutInCrossings) {
  Plan plan = SingleCellPlan(6.0, 2.0, 40.0, 41.0, 5, 10, 2);  // unreachable record cell
  plan.turbine.cut_in_ms = 3.0;
  plan.turbine.cut_out_ms = 45;
  plan.turbine.restart_ms = 42;
  AddEventCell(&plan, kStartUpEvent, 0.0, 45.0, 1000000);
  AddEventCell(&plan, kNormalStopEvent, 0.0, 45.0, 1000000);
  const boost::math::weibull_distribution<double> ref(2.0, 6.0);
  const double p = 1.0 - boost::math::cdf(ref, 3.0);
  const double expected = (10 * kStepsPerDay - 1) * p * (1 - p);
  std::vector<double> starts, stops;
  for (const RunResult& r : Simulate(plan, 300, 21)) {
    starts.push_back(r.count_at_deadline[1]);
    stops.push_back(r.count_at_deadline[2]);
  }
  const MeanAndSe a = Summarise(starts), b = Summarise(stops);
  EXPECT_NEAR(a.mean, expected, 4 * a.se);
  EXPECT_NEAR(b.mean, expected, 4 * b.se);
}

// Manual tests wait for the crew: Monday to Friday, 08-16 h, one test per 4 h.
// Starting on a Saturday with wind nearly always in the window, the three
// tests fall on Monday 08:00, Monday 12:00 and Tuesday 08:00, so the matrix
// completes at the end of Tuesday's 08:00 record: 3 days + 8 h = 481 records.
TEST(OperationsTest, ManualTestsFollowTheCrewSchedule) {
  Plan plan = SingleCellPlan(12.0, 3.0, 40.0, 41.0, 1, 10, 2);
  plan.turbine.cut_in_ms = 0.5;
  plan.turbine.cut_out_ms = 45;
  plan.turbine.restart_ms = 42;
  plan.matrix.cells[0].optional = true;  // only the tests are required
  plan.start = Date{2027, 3, 6};         // a Saturday
  plan.deadline = AddDays(plan.start, 10);
  ManualTest test;
  test.name = "emergency_stop";
  test.wind_lo_ms = 0.5;
  test.min_interval_h = 4.0;
  plan.manual_tests = {test};
  AddEventCell(&plan, "emergency_stop", 0.0, 45.0, 3);
  const std::vector<RunResult> runs = Simulate(plan, 50, 5);
  int on_schedule = 0;
  for (const RunResult& r : runs)
    on_schedule += r.completion_step == (2 * 144 + 144 + 48 + 1);
  // P(V < 0.5 m/s) is 7e-5 per record for Weibull(12, 3): practically always.
  EXPECT_GE(on_schedule, 49);
}

}  // namespace
}  // namespace planner
