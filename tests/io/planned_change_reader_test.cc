// The planned_changes section of a plan: the cells each change resets, and
// every rejected input with its exact message.
#include <gtest/gtest.h>

#include <string>
#include <vector>

#include "io/reader_test_util.h"
#include "planner/plan_reader.h"

namespace planner {
namespace {

using reader_test::BadInput;
using reader_test::ExpectMessages;
using reader_test::ParseTestPlan;
using reader_test::Replace;
using reader_test::TestPlanError;

// Production cells 4-8 m/s (cells 0-3), parked 0-3 m/s (cell 4), start-up
// events 3-5 m/s (cell 5); the changes from line 12.
const std::string kBase =
    reader_test::PlanHead("Change test") +
    "capture_matrix:\n"
    "  production:\n"
    "    wind_bins_ms: {from: 4, to: 8, width: 1}\n"
    "    min_records: 10\n"
    "  parked: {wind_bins_ms: [[0, 3]], min_records: 5}\n"
    "  events:\n"
    "    - {event: start_up, wind_ms: [3, 5], min_records: 2}\n"
    "planned_changes:\n"
    "  - name: controller update\n"
    "    date: 2027-09-01\n"
    "    resets: [{state: production, wind_ms: [6, 8]}, {event: start_up}]\n"
    "  - name: logger exchange\n"
    "    date: 2027-05-01\n"
    "    resets: all\n";

TEST(PlannedChangeReaderTest, ReadsTheCellsEachChangeResetsSortedByDate) {
  const Plan plan = ParseTestPlan(kBase);
  ASSERT_EQ(plan.planned_changes.size(), 2u);
  EXPECT_EQ(plan.planned_changes[0].name, "logger exchange");
  EXPECT_EQ(plan.planned_changes[0].cells, (std::vector<int>{0, 1, 2, 3, 4, 5}));
  EXPECT_EQ(plan.planned_changes[1].name, "controller update");
  EXPECT_EQ(FormatDate(plan.planned_changes[1].date), "2027-09-01");
  EXPECT_EQ(plan.planned_changes[1].cells, (std::vector<int>{2, 3, 5}));
}

TEST(PlannedChangeReaderTest, RejectsBadInputWithExactMessages) {
  const std::string& b = kBase;
  const std::vector<BadInput> cases = {
      {"before the start", Replace(b, "2027-09-01", "2027-02-01"),
       "plan.yaml:14:11: planned_changes[0].date: 2027-02-01 is not after the start "
       "(2027-03-01); a change resets counts from 00:00 of a later date"},
      {"no cell chosen", Replace(b, "{state: production, wind_ms: [6, 8]}, {event: start_up}",
               "{state: production, wind_ms: [20, 25]}"),
       "plan.yaml:15:13: planned_changes[0].resets: chooses no cell of the capture matrix; "
       "check the states, events and wind ranges"},
      {"unknown event", Replace(b, "{event: start_up}", "{event: yaw_test}"),
       "plan.yaml:15:60: planned_changes[0].resets[1].event: 'yaw_test' is not an event "
       "type of the capture matrix; valid: start_up"},
      {"state and event", Replace(b, "{event: start_up}", "{event: start_up, state: parked}"),
       "plan.yaml:15:52: planned_changes[0].resets[1]: must give either state (production, "
       "parked, reduced) or event (an event type of the capture matrix), not both or "
       "neither"},
      {"not all", Replace(b, "resets: all", "resets: every"),
       "plan.yaml:18:13: planned_changes[1].resets: 'every' is not a choice of cells; give "
       "all, or a list such as [{state: production}, {event: start_up}]"},
      {"same name", Replace(b, "name: logger exchange", "name: controller update"),
       "plan.yaml:16:11: planned_changes[1].name: 'controller update' is already the name "
       "of planned_changes[0]; give each planned change its own name"},
  };
  ExpectMessages(cases, TestPlanError);
}

}  // namespace
}  // namespace planner
