// Episodes such as icing (sim/episode_process.h): a Poisson process of starts
// with a rate set per month, each episode lasting a drawn time, and their
// effect on the records of a run.
#include <gtest/gtest.h>

#include <array>
#include <cmath>
#include <utility>
#include <vector>

#include "planner/calendar.h"
#include "planner/simulation.h"
#include "sim/episode_process.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

// Day d of a calendar whose months follow each other as in a 365-day year.
std::vector<uint8_t> CyclicMonths(int64_t years) {
  constexpr int kDays[12] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
  std::vector<uint8_t> months;
  for (int64_t y = 0; y < years; ++y) {
    for (int m = 0; m < 12; ++m) months.insert(months.end(), kDays[m], m);
  }
  return months;
}

struct Walk {
  std::array<double, 12> starts{};      // episodes started, by month
  std::array<double, 12> free_steps{};  // steps outside episodes, by month
  double episode_steps = 0;
  std::vector<double> durations_steps;
};

// Walks the process step by step over the whole calendar.
Walk WalkEpisodes(const EpisodeModel& model, const std::vector<uint8_t>& months,
                  uint64_t seed) {
  const EpisodeLaw law = MakeEpisodeLaw(model);
  EpisodeProcess process(law, MakeRunEngine(seed, 0), months.data(),
                         static_cast<int64_t>(months.size()));
  Walk w;
  bool in = false;
  int64_t since = 0;
  const int64_t steps = static_cast<int64_t>(months.size()) * kStepsPerDay;
  for (int64_t step = 0; step < steps; ++step) {
    const int month = months[step / kStepsPerDay];
    const bool now = process.InAt(step);
    if (now && !in) w.starts[month] += 1, since = step;
    if (!now && in) w.durations_steps.push_back(static_cast<double>(step - since));
    in = now;
    (now ? w.episode_steps : w.free_steps[month]) += 1;
  }
  return w;
}

// The same start rate in every month, durations of the given law and mean.
EpisodeModel AllYear(double starts_per_month, double mean_h, DurationLaw::Kind kind,
                     double shape) {
  EpisodeModel e;
  e.starts_per_month.fill(starts_per_month);
  e.mean_h = mean_h;
  e.duration_law.kind = kind;
  e.duration_law.shape = shape;
  return e;
}

// Sample mean and its standard error.
std::pair<double, double> MeanAndSe(const std::vector<double>& x) {
  double sum = 0, ss = 0;
  for (double v : x) sum += v;
  const double n = static_cast<double>(x.size());
  const double mean = sum / n;
  for (double v : x) ss += (v - mean) * (v - mean);
  return {mean, std::sqrt(ss / (n - 1) / n)};
}

// The rate of a Poisson process estimated as starts / exposure (the free
// time, since no episode starts during one) must match the plan's rate in
// every month within 4 standard errors (sqrt(count) / exposure); months
// with no rate see no start at all. Long episodes (mean 2 days) so that the
// exposure differs much from the calendar time.
TEST(EpisodeProcessTest, StartsFollowTheMonthlyRateOverTheFreeTime) {
  EpisodeModel icing;
  icing.starts_per_month = {3, 2.5, 1.5, 0.5, 0, 0, 0, 0, 0, 0.5, 1.5, 3};
  icing.mean_h = 48;
  const std::vector<uint8_t> months = CyclicMonths(300);
  const Walk w = WalkEpisodes(icing, months, 5);
  const EpisodeLaw law = MakeEpisodeLaw(icing);
  for (int m = 0; m < 12; ++m) {
    SCOPED_TRACE(m + 1);
    if (icing.starts_per_month[m] == 0) {
      EXPECT_EQ(w.starts[m], 0.0);
      continue;
    }
    const double rate = w.starts[m] / w.free_steps[m];
    EXPECT_NEAR(rate, law.starts_per_step[m], 4.0 * std::sqrt(w.starts[m]) / w.free_steps[m]);
    ASSERT_GT(w.starts[m], 100);
  }
}

// With the same rate in every month the process alternates exponential free
// times (mean 1 / rate) and episodes (mean D): the long-run share of time in
// episodes is D / (1 / rate + D) (renewal-reward theorem, as for outages:
// reliability-engineering textbooks, from memory). Tolerance: 4 standard
// errors from 30 batches of 10 years.
TEST(EpisodeProcessTest, LongRunShareFollowsTheRenewalRewardTheorem) {
  const EpisodeModel e = AllYear(2.0, 36, DurationLaw::Kind::kLognormal, 0.9);
  const std::vector<uint8_t> year = CyclicMonths(10);
  std::vector<double> shares;
  for (uint64_t batch = 0; batch < 30; ++batch) {
    const Walk w = WalkEpisodes(e, year, 100 + batch);
    double free = 0;
    for (double x : w.free_steps) free += x;
    shares.push_back(w.episode_steps / (w.episode_steps + free));
  }
  const auto [mean, se] = MeanAndSe(shares);
  // Rate per step: 2 per month of 365/12 days on average, as the calendar.
  const double rate_per_h = 2.0 * 12.0 / (365.0 * 24.0);
  const double expected = 36.0 / (1.0 / rate_per_h + 36.0);
  EXPECT_NEAR(mean, expected, 4.0 * se);
  EXPECT_LT(se, 0.1 * expected);  // the check has power
}

// Durations follow their law: the mean of the drawn lengths is mean_h within
// 4 standard errors (whole steps: an episode covers the steps whose start
// lies inside it, so a length is the drawn time rounded, mean unchanged to
// within a step).
TEST(EpisodeProcessTest, DurationsHaveTheGivenMean) {
  const EpisodeModel e = AllYear(4.0, 20, DurationLaw::Kind::kWeibull, 0.7);
  const Walk w = WalkEpisodes(e, CyclicMonths(40), 9);
  ASSERT_GT(w.durations_steps.size(), 1000u);
  const auto [mean, se] = MeanAndSe(w.durations_steps);
  EXPECT_NEAR(mean, 20.0 * kStepsPerHour, 4.0 * se + 1.0);
}

// In a run: while an "invalid" episode lasts, no record counts although the
// acquisition is up and the sector valid; while a "stop" episode lasts the
// turbine is down (no production). The records lost come in stretches.
TEST(EpisodeProcessTest, EpisodesRemoveStretchesOfRecordsInARun) {
  Plan plan = testing_plans::SingleCellPlan(9.0, 2.0, 3.0, 20.0, 1000000, 90, 13);
  plan.start = Date{2027, 1, 1};
  EpisodeModel icing;
  icing.name = "icing";
  icing.starts_per_month = {4, 4, 4, 0, 0, 0, 0, 0, 0, 0, 0, 4};
  icing.mean_h = 30;
  icing.stops_turbine = false;
  icing.invalidates_records = true;
  plan.episodes = {icing};
  const Simulator sim(plan);
  RunResult result;
  std::vector<TracedRecord> records;
  int64_t void_records = 0, stretches = 0;
  for (uint64_t run = 0; run < 4; ++run) {
    sim.Trace(3, run, &result, &records);
    bool before = false;
    for (const TracedRecord& r : records) {
      const bool lost = r.daq_up && r.sector_ok && !r.valid;
      if (lost) EXPECT_EQ(r.cell, -1) << "record " << r.step;
      void_records += lost;
      stretches += lost && !before;
      before = lost;
    }
  }
  ASSERT_GT(stretches, 20);
  // Stretches of about 30 h (180 records) on average, not single records.
  EXPECT_GT(static_cast<double>(void_records) / stretches, 60.0);

  plan.episodes[0].stops_turbine = true;
  plan.episodes[0].invalidates_records = false;
  const Simulator stopping(plan);
  int64_t down = 0;
  for (uint64_t run = 0; run < 2; ++run) {
    stopping.Trace(3, run, &result, &records);
    for (const TracedRecord& r : records) {
      if (r.turbine_up) continue;
      ++down;
      EXPECT_EQ(r.state, OperatingState::kParked) << "record " << r.step;
      EXPECT_TRUE(r.valid) << "record " << r.step;  // the records themselves count
    }
  }
  EXPECT_GT(down, 1000);
}

}  // namespace
}  // namespace planner
