// Load-channel groups in a plan (outages.channel_groups) and the groups a
// cell needs (capture_matrix ... channels): what is read, and every
// rejected input with its exact message.
#include <gtest/gtest.h>

#include <string>

#include "io/reader_test_util.h"
#include "planner/plan_reader.h"

namespace planner {
namespace {

using reader_test::Replace;

const auto& Parse = reader_test::ParseTestPlan;
const auto& PlanError = reader_test::TestPlanError;

// Lines 1-4 the head, 5-17 the outages, 18-29 the matrix.
const std::string kPlan = reader_test::PlanHead("Channel test") +
                          "outages:\n"
                          "  channel_groups:\n"
                          "    - name: blade\n"
                          "      mtbf_h: 1500\n"
                          "      mttr_h: 48\n"
                          "      repair_times: {law: lognormal, sigma: 0.8}\n"
                          "      recalibration: {hours: 2, below_ms: 6, crew: true}\n"
                          "    - name: tower\n"
                          "      mtbf_h: 4000\n"
                          "      mttr_h: 24\n"
                          "    - name: drive_train\n"
                          "      mtbf_h: 2500\n"
                          "      mttr_h: 36\n"
                          "capture_matrix:\n"
                          "  production:\n"
                          "    wind_bins_ms: {from: 4, to: 8, width: 1}\n"
                          "    min_records: 10\n"
                          "    overrides:\n"
                          "      - {wind_ms: [6, 8], channels: [blade]}\n"
                          "  parked:\n"
                          "    wind_bins_ms: [[0, 3]]\n"
                          "    min_records: 5\n"
                          "    channels: [blade, tower]\n"
                          "  events:\n"
                          "    - {event: start_up, wind_ms: [3, 5], min_records: 4, "
                          "channels: [drive_train]}\n";

TEST(ChannelGroupsReaderTest, ReadsGroupsAndWhatEachCellNeeds) {
  const Plan plan = Parse(kPlan);
  ASSERT_EQ(plan.channel_groups.size(), 3u);
  const ChannelGroup& blade = plan.channel_groups[0];
  EXPECT_EQ(blade.name, "blade");
  EXPECT_DOUBLE_EQ(blade.failures.mtbf_h, 1500);
  EXPECT_DOUBLE_EQ(blade.failures.mttr_h, 48);
  EXPECT_EQ(blade.failures.repair_law.kind, DurationLaw::Kind::kLognormal);
  EXPECT_TRUE(blade.recalibration.needed);
  EXPECT_DOUBLE_EQ(blade.recalibration.hours, 2);
  EXPECT_DOUBLE_EQ(blade.recalibration.below_ms, 6);
  EXPECT_TRUE(blade.recalibration.crew);
  EXPECT_FALSE(plan.channel_groups[1].recalibration.needed);
  // Production 4-5, 5-6: every group; 6-7, 7-8: blade; parked: blade and
  // tower; the start-up cell: drive_train.
  const std::vector<Cell>& cells = plan.matrix.cells;
  ASSERT_EQ(cells.size(), 6u);
  EXPECT_EQ(cells[0].channels, kAllChannels);
  EXPECT_EQ(cells[1].channels, kAllChannels);
  EXPECT_EQ(cells[2].channels, 0b001u);
  EXPECT_EQ(cells[3].channels, 0b001u);
  EXPECT_EQ(cells[4].channels, 0b011u);
  EXPECT_EQ(cells[5].channels, 0b100u);
  // Without the field, every cell needs every group (the default).
  EXPECT_EQ(Parse(reader_test::BasePlan("No groups")).matrix.cells[0].channels,
            kAllChannels);
}

TEST(ChannelGroupsReaderTest, RejectsBadInputWithExactMessages) {
  reader_test::ExpectMessages(
      {
          {"unknown group", Replace(kPlan, "channels: [blade, tower]", "channels: [blade, hub]"),
           "plan.yaml:27:23: capture_matrix.parked.channels[1]: 'hub' is not a channel "
           "group; valid: blade, tower, drive_train"},
          {"empty needs", Replace(kPlan, "channels: [blade, tower]", "channels: []"),
           "plan.yaml:27:15: capture_matrix.parked.channels: is empty; a record needs at "
           "least one channel group (leave the field out for every group)"},
          {"needs without groups",
           reader_test::PlanHead("Channel test") +
               "capture_matrix:\n"
               "  production:\n"
               "    wind_bins_ms: {from: 4, to: 8, width: 1}\n"
               "    min_records: 10\n"
               "    channels: [blade]\n",
           "plan.yaml:9:15: capture_matrix.production.channels: names load-channel groups, "
           "but outages.channel_groups defines none; define the groups there, or leave "
           "the field out"},
          {"never fails", Replace(kPlan, "mtbf_h: 4000", "mtbf_h: 0"),
           "plan.yaml:13:15: outages.channel_groups[1].mtbf_h: 0 means the group never "
           "fails, so it changes nothing; give its mean up time above 0, or remove the "
           "group"},
          {"no repair time", Replace(kPlan, "      mttr_h: 24\n", ""),
           "plan.yaml:12:7: outages.channel_groups[1].mttr_h: required field is missing; "
           "give the mean repair time, or repair_times with the law's own scale (scale_h "
           "for weibull, mu for lognormal)"},
          {"recalibration hours", Replace(kPlan, "hours: 2,", "hours: 0,"),
           "plan.yaml:11:30: outages.channel_groups[0].recalibration.hours: 0 is out of "
           "range; must be above 0 and at most 336 h"},
          {"recalibration wind", Replace(kPlan, "below_ms: 6", "below_ms: 60"),
           "plan.yaml:11:43: outages.channel_groups[0].recalibration.below_ms: 60 is out "
           "of range; must be above 0 and at most 50 m/s"},
          {"recalibration field", Replace(kPlan, "crew: true", "crane: true"),
           "plan.yaml:11:46: outages.channel_groups[0].recalibration.crane: unknown field "
           "(did you mean 'crew'?); valid fields: hours, below_ms, crew"},
          {"same name twice", Replace(kPlan, "name: drive_train", "name: tower"),
           "plan.yaml:15:13: outages.channel_groups[2].name: 'tower' is already the name of "
           "outages.channel_groups[1]; give each channel group its own name"},
          {"no groups",
           reader_test::PlanHead("Channel test") + "outages:\n  channel_groups: []\n" +
               kPlan.substr(kPlan.find("capture_matrix:")),
           "plan.yaml:6:19: outages.channel_groups: is empty; give at least one channel "
           "group, or leave the field out"},
      },
      PlanError);
}

}  // namespace
}  // namespace planner
