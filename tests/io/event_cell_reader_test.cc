// capture_matrix.events and capture_matrix.reduced: event cells after the
// record cells, event types in first-seen order, the reduced grid, and every
// rejected input with its exact message.
#include <gtest/gtest.h>

#include <string>
#include <vector>

#include "io/reader_test_util.h"
#include "planner/capture_matrix.h"
#include "planner/plan_reader.h"

namespace planner {
namespace {

using reader_test::ErrorOf;
using reader_test::Replace;
using reader_test::SourcePath;

// Fourteen lines; the first event cell is on lines 12-14.
const std::string kBase =
    reader_test::PlanHead("Event test") +
    "manual_tests:\n"
    "  tests: [{name: emergency_stop, wind_ms: [10, 14]}]\n"
    "capture_matrix:\n"
    "  production:\n"
    "    wind_bins_ms: [4, 5]\n"
    "    min_records: 10\n"
    "  events:\n"
    "    - event: start_up\n"
    "      wind_ms: [3, 5]\n"
    "      min_records: 8\n";

const auto& Parse = reader_test::ParseTestPlan;
const auto& PlanError = reader_test::TestPlanError;

TEST(EventCellReaderTest, EventCellsFollowTheRecordCellsWithTypesInFirstSeenOrder) {
  const CaptureMatrix m =
      Parse(kBase +
            "    - {event: emergency_stop, wind_ms: [10, 14], min_records: 2}\n"
            "    - {event: normal_stop, wind_ms: [25, 35], min_records: 3, optional: "
            "true}\n"
            "    - {event: start_up, wind_ms: [18, 22], min_records: 3}\n")
          .matrix;
  ASSERT_EQ(m.cells.size(), 5u);
  EXPECT_EQ(m.cells[0].event, -1);  // the one production cell
  EXPECT_EQ(m.event_types,
            (std::vector<std::string>{"start_up", "emergency_stop", "normal_stop"}));
  const std::vector<int> types = {m.cells[1].event, m.cells[2].event, m.cells[3].event,
                                  m.cells[4].event};
  EXPECT_EQ(types, (std::vector<int>{0, 1, 2, 0}));
  EXPECT_DOUBLE_EQ(m.cells[1].wind_ms.lo, 3.0);
  EXPECT_DOUBLE_EQ(m.cells[1].wind_ms.hi, 5.0);
  EXPECT_EQ(m.cells[1].required, 8);
  EXPECT_FALSE(m.cells[1].ti_binned);
  EXPECT_TRUE(m.cells[3].optional);
  EXPECT_EQ(m.cells[4].required, 3);
  EXPECT_EQ(CellLabel(m, m.cells[2]), "event emergency_stop 10-14 m/s");
  EXPECT_EQ(RequiredCellCount(m), 4);
}

TEST(EventCellReaderTest, AMatrixMayHoldEventsAlone) {
  const CaptureMatrix m = Parse(Replace(kBase,
                                        "  production:\n"
                                        "    wind_bins_ms: [4, 5]\n"
                                        "    min_records: 10\n",
                                        ""))
                              .matrix;
  ASSERT_EQ(m.cells.size(), 1u);
  EXPECT_TRUE(m.grids.empty());
  EXPECT_EQ(m.cells[0].event, 0);
}

TEST(EventCellReaderTest, ReducedGridComesAfterParkedAndBeforeEvents) {
  const std::string text =
      Replace(kBase, "capture_matrix:\n",
              "curtailment: [{name: noise, hours: [22, 6], action: reduce}]\n"
              "capture_matrix:\n"
              "  reduced:\n"
              "    wind_bins_ms: [[4, 6], [6, 8]]\n"
              "    min_records: 5\n"
              "  parked:\n"
              "    wind_bins_ms: [[0, 3]]\n"
              "    min_records: 2\n");
  const CaptureMatrix m = Parse(text).matrix;
  ASSERT_EQ(m.grids.size(), 3u);
  EXPECT_EQ(m.grids[0].state, OperatingState::kProduction);
  EXPECT_EQ(m.grids[1].state, OperatingState::kParked);
  EXPECT_EQ(m.grids[2].state, OperatingState::kReduced);
  EXPECT_EQ(m.grids[2].cell_index, (std::vector<int>{2, 3}));
  ASSERT_EQ(m.cells.size(), 5u);
  EXPECT_EQ(m.cells[2].state, OperatingState::kReduced);
  EXPECT_EQ(m.cells[3].required, 5);
  EXPECT_EQ(CellLabel(m.cells[3]), "reduced 6-8 m/s");
  EXPECT_EQ(m.cells[4].event, 0);
}

using reader_test::BadInput;

const std::string kEvent0 = "capture_matrix.events[0]";

std::vector<BadInput> BadInputs() {
  const std::string b = kBase;
  const std::string no_tests = Replace(
      b, "manual_tests:\n  tests: [{name: emergency_stop, wind_ms: [10, 14]}]\n", "");
  const std::string reduced =
      "  reduced:\n"
      "    wind_bins_ms: [4, 6]\n"
      "    min_records: 5\n";
  return {
      {"misspelt event", Replace(b, "event: start_up", "event: emergency_sotp"),
       "plan.yaml:12:14: " + kEvent0 +
           ".event: 'emergency_sotp' is not an event type; valid: start_up, "
           "normal_stop, emergency_stop"},
      {"manual test not defined",
       Replace(no_tests, "event: start_up", "event: grid_loss"),
       "plan.yaml:10:14: " + kEvent0 +
           ".event: 'grid_loss' is not an event type; valid: start_up, normal_stop "
           "(manual tests are defined in manual_tests.tests)"},
      {"overlapping cells of one type",
       b + "    - {event: start_up, wind_ms: [4, 6], min_records: 2}\n",
       "plan.yaml:15:34: capture_matrix.events[1].wind_ms: [4, 6] overlaps the start_up "
       "cell 3-5 m/s of capture_matrix.events[0]; an event must fall in at most one "
       "cell of its type"},
      {"zero events", Replace(b, "min_records: 8", "min_records: 0"),
       "plan.yaml:14:20: " + kEvent0 +
           ".min_records: 0 is out of range; must be at least 1 and at most 1000000"},
      {"start-up below cut-in", Replace(b, "wind_ms: [3, 5]", "wind_ms: [0, 3]"),
       "plan.yaml:13:16: " + kEvent0 +
           ".wind_ms: [0, 3] lies outside turbine.cut_in_ms to cut_out_ms (3-25 m/s); a "
           "start-up begins production, so this cell could never fill"},
      {"test cell outside the test's window",
       b + "    - {event: emergency_stop, wind_ms: [15, 20], min_records: 2}\n",
       "plan.yaml:15:40: capture_matrix.events[1].wind_ms: [15, 20] lies outside the "
       "wind window of manual test emergency_stop (10-14 m/s), so this cell could never "
       "fill"},
      {"empty wind range", Replace(b, "wind_ms: [3, 5]", "wind_ms: [5, 3]"),
       "plan.yaml:13:16: " + kEvent0 +
           ".wind_ms: [5, 3] is an empty range; lo must be "
           "below hi"},
      {"no event type",
       Replace(b, "    - event: start_up\n      wind_ms", "    - wind_ms"),
       "plan.yaml:12:7: " + kEvent0 + ".event: required field is missing"},
      {"unknown key", Replace(b, "      min_records: 8", "      required: 8"),
       "plan.yaml:14:7: " + kEvent0 +
           ".required: unknown field; valid fields: event, wind_ms, min_records, "
           "optional, channels"},
      {"no event cells",
       Replace(b,
               "  events:\n    - event: start_up\n      wind_ms: [3, 5]\n      "
               "min_records: 8\n",
               "  events: []\n"),
       "plan.yaml:11:11: capture_matrix.events: is empty; give at least one event cell, "
       "or leave the field out"},
      {"reduced without a reduce rule", b + reduced,
       "plan.yaml:16:5: capture_matrix.reduced: no curtailment rule has action: reduce "
       "and the turbine has no storm_control, so no record is ever in reduced mode and "
       "these cells could never fill; add such a rule or storm_control, or remove "
       "reduced"},
      {"reduced above cut-out",
       Replace(b + Replace(reduced, "[4, 6]", "[25, 26]"), "capture_matrix:\n",
               "curtailment: [{name: noise, hours: [22, 6], action: reduce}]\n"
               "capture_matrix:\n"),
       "plan.yaml:17:19: capture_matrix.reduced.wind_bins_ms: the bin 25-26 m/s lies "
       "outside turbine.cut_in_ms to cut_out_ms (3-25 m/s), so it could never fill; "
       "remove it or set its min_records to 0"},
  };
}

TEST(EventCellReaderTest, RejectsBadInputWithExactMessages) {
  reader_test::ExpectMessages(BadInputs(), PlanError);
}

}  // namespace
}  // namespace planner
