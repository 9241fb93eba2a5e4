// The outages section of a plan: duration laws given by their mean or by their
// own parameters, repair-month factors, planned outages, and every rejected
// input with its exact message.
#include <gtest/gtest.h>

#include <boost/math/distributions/lognormal.hpp>
#include <boost/math/distributions/weibull.hpp>
#include <string>
#include <vector>

#include "io/reader_test_util.h"
#include "planner/plan_reader.h"

namespace planner {
namespace {

using reader_test::ErrorOf;
using reader_test::Replace;
using reader_test::SourcePath;

// Eight lines; the outages section follows from line 9.
const std::string kBase = reader_test::BasePlan("Outage test");

// Lines 9-12.
const std::string kTurbine =
    "outages:\n"
    "  turbine:\n"
    "    mtbf_h: 400\n"
    "    mttr_h: 36\n";

// Lines 9-13.
const std::string kPlanned =
    "outages:\n"
    "  planned:\n"
    "    - name: retrofit\n"
    "      from: 2027-07-12\n"
    "      to: 2027-07-19\n";

const auto& Parse = reader_test::ParseTestPlan;
const auto& PlanError = reader_test::TestPlanError;

TEST(OutageReaderTest, DefaultsAreExponentialWithoutMonthFactorsOrPlannedOutages) {
  const Plan plan = Parse(kBase + kTurbine);
  EXPECT_DOUBLE_EQ(plan.turbine_outages.mtbf_h, 400.0);
  EXPECT_DOUBLE_EQ(plan.turbine_outages.mttr_h, 36.0);
  EXPECT_EQ(plan.turbine_outages.up_law.kind, DurationLaw::Kind::kExponential);
  EXPECT_EQ(plan.turbine_outages.repair_law.kind, DurationLaw::Kind::kExponential);
  for (double f : plan.turbine_outages.repair_month_factors) EXPECT_EQ(f, 1.0);
  EXPECT_TRUE(plan.planned_outages.empty());
}

TEST(OutageReaderTest, ReadsLawsGivenByTheirMean) {
  const Plan plan = Parse(kBase + kTurbine +
                          "    up_times: {law: weibull, k: 0.8}\n"
                          "    repair_times: {law: lognormal, sigma: 0.9}\n"
                          "    repair_month_factors: [1.5, 1.5, 1.3, 1, 1, 1, 1, 1, 1, "
                          "1.1, 1.3, 1.5]\n");
  const OutageModel& m = plan.turbine_outages;
  EXPECT_DOUBLE_EQ(m.mtbf_h, 400.0);
  EXPECT_DOUBLE_EQ(m.mttr_h, 36.0);
  EXPECT_EQ(m.up_law.kind, DurationLaw::Kind::kWeibull);
  EXPECT_DOUBLE_EQ(m.up_law.shape, 0.8);
  EXPECT_EQ(m.repair_law.kind, DurationLaw::Kind::kLognormal);
  EXPECT_DOUBLE_EQ(m.repair_law.shape, 0.9);
  EXPECT_DOUBLE_EQ(m.repair_month_factors[0], 1.5);  // January: not normalised
  EXPECT_DOUBLE_EQ(m.repair_month_factors[2], 1.3);
  EXPECT_DOUBLE_EQ(m.repair_month_factors[6], 1.0);
  EXPECT_DOUBLE_EQ(m.repair_month_factors[11], 1.5);
}

TEST(OutageReaderTest, LawsOwnParametersAreTurnedIntoTheirMean) {
  const Plan plan = Parse(kBase +
                          "outages:\n"
                          "  data_acquisition:\n"
                          "    up_times: {law: weibull, k: 1.5, scale_h: 1000}\n"
                          "    repair_times: {law: lognormal, sigma: 0.5, mu: 3}\n");
  const OutageModel& m = plan.daq_outages;
  // Reference: Boost.Math's distribution means (Weibull mean scale Gamma(1 +
  // 1/k), lognormal mean exp(mu + sigma^2 / 2)).
  const boost::math::weibull_distribution<> up(1.5, 1000.0);
  const boost::math::lognormal_distribution<> repair(3.0, 0.5);
  EXPECT_NEAR(m.mtbf_h, boost::math::mean(up), 1e-9);
  EXPECT_NEAR(m.mttr_h, boost::math::mean(repair), 1e-12);
  EXPECT_NEAR(m.mtbf_h, 902.745, 0.001);  // 1000 Gamma(5/3); Gamma(5/3) = 0.902745
  EXPECT_EQ(m.up_law.kind, DurationLaw::Kind::kWeibull);
  EXPECT_DOUBLE_EQ(m.up_law.shape, 1.5);
  EXPECT_EQ(m.repair_law.kind, DurationLaw::Kind::kLognormal);
  EXPECT_DOUBLE_EQ(m.repair_law.shape, 0.5);
}

TEST(OutageReaderTest, ReadsPlannedOutagesWithTheirDefaults) {
  const Plan plan = Parse(kBase + kPlanned +
                          "    - {name: logger swap, from: 2027-09-01, to: 2027-09-02,\n"
                          "       turbine: false, data_acquisition: true}\n");
  ASSERT_EQ(plan.planned_outages.size(), 2u);
  const PlannedOutage& a = plan.planned_outages[0];
  EXPECT_EQ(a.name, "retrofit");
  EXPECT_TRUE(a.from == (Date{2027, 7, 12}));
  EXPECT_TRUE(a.to == (Date{2027, 7, 19}));
  EXPECT_TRUE(a.turbine);
  EXPECT_FALSE(a.daq);
  const PlannedOutage& b = plan.planned_outages[1];
  EXPECT_EQ(b.name, "logger swap");
  EXPECT_FALSE(b.turbine);
  EXPECT_TRUE(b.daq);
}

using reader_test::BadInput;

const char kMissingMean[] =
    "required field is missing; give the mean up time, or up_times with the law's "
    "own scale (scale_h for weibull, mu for lognormal)";

std::vector<BadInput> BadInputs() {
  const std::string t = kBase + kTurbine;  // up_times etc. go on line 13
  const std::string p = kBase + kPlanned;
  return {
      {"unknown law", t + "    up_times:\n      law: gamma\n",
       "plan.yaml:14:12: outages.turbine.up_times.law: 'gamma' is not a law; valid: "
       "exponential, weibull, lognormal"},
      {"law missing", t + "    up_times: {k: 2}\n",
       "plan.yaml:13:15: outages.turbine.up_times.law: required field is missing"},
      {"Weibull without k", t + "    up_times:\n      law: weibull\n",
       "plan.yaml:14:7: outages.turbine.up_times.k: required field is missing"},
      {"a lognormal key for a Weibull",
       t + "    up_times:\n      law: weibull\n      k: 0.8\n      sigma: 1\n",
       "plan.yaml:16:7: outages.turbine.up_times.sigma: unknown field for law 'weibull'; "
       "valid fields: law, k, scale_h"},
      {"Weibull k of 0", t + "    up_times:\n      law: weibull\n      k: 0\n",
       "plan.yaml:15:10: outages.turbine.up_times.k: 0 is out of range; must be at least "
       "0.1 and at most 10"},
      {"lognormal sigma of 0",
       t + "    repair_times:\n      law: lognormal\n      sigma: 0\n",
       "plan.yaml:15:14: outages.turbine.repair_times.sigma: 0 is out of range; must be "
       "above 0 and at most 4"},
      {"law as a word", t + "    up_times: weibull\n",
       "plan.yaml:13:15: outages.turbine.up_times: expected a mapping, got 'weibull'; "
       "valid fields: law, k, scale_h, sigma, mu"},
      {"mean and scale both given",
       t + "    up_times:\n      law: weibull\n      k: 2\n      scale_h: 500\n",
       "plan.yaml:11:13: outages.turbine.mtbf_h: given together with up_times.scale_h; "
       "give either the mean (mtbf_h) or the law's own scale, not both"},
      {"no mean and no scale", Replace(t, "    mtbf_h: 400\n", ""),
       std::string("plan.yaml:11:5: outages.turbine.mtbf_h: ") + kMissingMean},
      // exp(12 + 1/2) = 268337.29 h, above the 100,000 h allowed for a repair.
      {"scale gives an absurd mean",
       Replace(t, "    mttr_h: 36\n", "") +
           "    repair_times: {law: lognormal, sigma: 1, mu: 12}\n",
       "plan.yaml:12:50: outages.turbine.repair_times.mu: gives a mean repair time of "
       "268337.29 h; must be at least 0 and at most 100000 h"},
      {"eleven month factors",
       t + "    repair_month_factors: [1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1]\n",
       "plan.yaml:13:27: outages.turbine.repair_month_factors: 11 values given; expected "
       "12 (January to December)"},
      {"a month factor of 0",
       t + "    repair_month_factors: [1, 1, 1, 0, 1, 1, 1, 1, 1, 1, 1, 1]\n",
       "plan.yaml:13:37: outages.turbine.repair_month_factors[3]: 0 is out of range; "
       "must be above 0 and at most 10"},
      {"unknown outage-model field", t + "    mean_repair_h: 3\n",
       "plan.yaml:13:5: outages.turbine.mean_repair_h: unknown field; valid fields: "
       "mtbf_h, mttr_h, up_times, repair_times, repair_month_factors"},
      {"planned outage ending on its start",
       Replace(p, "to: 2027-07-19", "to: 2027-07-12"),
       "plan.yaml:13:11: outages.planned[0].to: 2027-07-12 is not after from "
       "(2027-07-12); the outage runs from 00:00 of from to 00:00 of to (exclusive)"},
      {"planned outage of nothing", p + "      turbine: false\n",
       "plan.yaml:11:7: outages.planned[0]: takes neither the turbine nor the data "
       "acquisition out of service; set turbine or data_acquisition to true"},
      {"planned outage name repeated",
       p + "    - {name: retrofit, from: 2027-08-01, to: 2027-08-02}\n",
       "plan.yaml:14:14: outages.planned[1].name: 'retrofit' is already the name of "
       "outages.planned[0]; give each planned outage its own name"},
      {"planned outage without a name", Replace(p, "- name: retrofit\n      ", "- "),
       "plan.yaml:11:7: outages.planned[0].name: required field is missing"},
      {"planned outage with until", Replace(p, "to: 2027", "until: 2027"),
       "plan.yaml:13:7: outages.planned[0].until: unknown field; valid fields: name, "
       "from, to, turbine, data_acquisition"},
      {"planned outage on 31 June", Replace(p, "2027-07-12", "2027-06-31"),
       "plan.yaml:12:13: outages.planned[0].from: 2027-06-31 is not a valid date; "
       "expected YYYY-MM-DD, a real calendar date in the years 1900 to 2200"},
      {"no planned outages", kBase + "outages:\n  planned: []\n",
       "plan.yaml:10:12: outages.planned: is empty; give at least one planned outage, or "
       "leave the field out"},
  };
}

// Lines 9-15.
const std::string kEpisodes =
    "outages:\n"
    "  episodes:\n"
    "    - name: icing\n"
    "      starts_per_month: [2, 1.5, 1, 0.2, 0, 0, 0, 0, 0, 0.2, 1, 1.8]\n"
    "      mean_h: 30\n"
    "      durations: {law: lognormal, sigma: 0.9}\n"
    "      effect: both\n";

TEST(OutageReaderTest, ReadsEpisodes) {
  const Plan plan = Parse(kBase + kEpisodes);
  ASSERT_EQ(plan.episodes.size(), 1u);
  const EpisodeModel& e = plan.episodes[0];
  EXPECT_EQ(e.name, "icing");
  EXPECT_DOUBLE_EQ(e.starts_per_month[0], 2.0);
  EXPECT_DOUBLE_EQ(e.starts_per_month[3], 0.2);
  EXPECT_DOUBLE_EQ(e.starts_per_month[11], 1.8);
  EXPECT_DOUBLE_EQ(e.mean_h, 30.0);
  EXPECT_EQ(e.duration_law.kind, DurationLaw::Kind::kLognormal);
  EXPECT_TRUE(e.stops_turbine);
  EXPECT_TRUE(e.invalidates_records);
  const Plan invalid = Parse(Replace(kBase + kEpisodes, "effect: both", "effect: invalid"));
  EXPECT_FALSE(invalid.episodes[0].stops_turbine);
  EXPECT_TRUE(invalid.episodes[0].invalidates_records);
  EXPECT_TRUE(Parse(kBase).episodes.empty());
}

TEST(OutageReaderTest, RejectsBadEpisodesWithExactMessages) {
  const std::string e = kBase + kEpisodes;
  reader_test::ExpectMessages(
      {
          {"eleven months", Replace(e, "[2, 1.5,", "[1.5,"),
           "plan.yaml:12:25: outages.episodes[0].starts_per_month: 11 values given; "
           "expected 12 (January to December)"},
          {"never", Replace(e, "[2, 1.5, 1, 0.2, 0, 0, 0, 0, 0, 0.2, 1, 1.8]",
                            "[0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0]"),
           "plan.yaml:12:25: outages.episodes[0].starts_per_month: is 0 in every month, so "
           "the episode never happens; give the mean number of starts in the months it "
           "happens, or remove the episode"},
          {"negative starts", Replace(e, "[2, 1.5,", "[-2, 1.5,"),
           "plan.yaml:12:26: outages.episodes[0].starts_per_month[0]: -2 is out of range; "
           "must be at least 0 and at most 30"},
          {"unknown effect", Replace(e, "effect: both", "effect: freeze"),
           "plan.yaml:15:15: outages.episodes[0].effect: 'freeze' is not an effect; valid: "
           "stop (the turbine stops), invalid (its records do not count), both"},
          {"no mean", Replace(e, "      mean_h: 30\n", ""),
           "plan.yaml:11:7: outages.episodes[0].mean_h: required field is missing; give the "
           "mean duration, or durations with the law's own scale (scale_h for weibull, mu "
           "for lognormal)"},
          {"zero mean", Replace(e, "mean_h: 30", "mean_h: 0"),
           "plan.yaml:13:15: outages.episodes[0].mean_h: 0 is out of range; must be above 0 "
           "and at most 1440 h"},
          {"same name twice",
           e + "    - name: icing\n"
               "      starts_per_month: [1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1]\n"
               "      mean_h: 5\n"
               "      effect: stop\n",
           "plan.yaml:16:13: outages.episodes[1].name: 'icing' is already the name of "
           "outages.episodes[0]; give each episode its own name"},
      },
      PlanError);
}

TEST(OutageReaderTest, RejectsBadInputWithExactMessages) {
  reader_test::ExpectMessages(BadInputs(), PlanError);
}

}  // namespace
}  // namespace planner
