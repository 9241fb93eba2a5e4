// Placing logged records in the capture matrix: each rule of
// planner/logged_counts.h, on a small plan built in code.
#include "planner/logged_counts.h"

#include <gtest/gtest.h>

#include <cmath>

#include "planner/error.h"
#include "sim/test_plans.h"

namespace planner {
namespace {

// Production: wind [4, 6) and [6, 8) m/s x TI [0, 10) and [10, 20) % (cells
// 0-3); parked [0, 3) m/s without TI bins (cell 4); events start_up [3, 5)
// m/s (cell 5) and the manual test emergency_stop [6, 8) m/s (cell 6). Valid
// sector 90-270 degrees.
Plan SmallPlan() {
  Plan p = testing_plans::SingleCellPlan(8.0, 2.0, 4.0, 6.0, 1, 30, 10);
  p.valid_sectors = {AngleRange{90.0, 270.0}};
  CaptureMatrix& m = p.matrix;
  m.cells.clear();
  StateGrid prod;
  prod.state = OperatingState::kProduction;
  prod.wind_bins_ms = {{4, 6}, {6, 8}};
  prod.ti_bins_pct = {{0, 10}, {10, 20}};
  for (int w = 0; w < 2; ++w) {
    for (int t = 0; t < 2; ++t) {
      Cell c;
      c.wind_ms = prod.wind_bins_ms[w];
      c.ti_binned = true;
      c.ti_pct = prod.ti_bins_pct[t];
      c.required = 1;
      prod.cell_index.push_back(static_cast<int>(m.cells.size()));
      m.cells.push_back(c);
    }
  }
  StateGrid parked;
  parked.state = OperatingState::kParked;
  parked.wind_bins_ms = {{0, 3}};
  parked.cell_index = {4};
  Cell pc;
  pc.state = OperatingState::kParked;
  pc.wind_ms = {0, 3};
  pc.required = 1;
  m.cells.push_back(pc);
  m.grids = {prod, parked};
  m.event_types = {kStartUpEvent, "emergency_stop"};
  Cell start_up;
  start_up.event = 0;
  start_up.wind_ms = {3, 5};
  start_up.required = 1;
  Cell test = start_up;
  test.event = 1;
  test.wind_ms = {6, 8};
  m.cells.push_back(start_up);
  m.cells.push_back(test);
  ManualTest mt;
  mt.name = "emergency_stop";
  p.manual_tests = {mt};
  return p;
}

// A record `minutes` after the plan's start.
LoggedRecord Rec(const Plan& p, int64_t minutes, LoggedState state, double speed_ms,
                 double std_ms, double direction_deg, bool ok = true,
                 const std::string& event = "") {
  LoggedRecord r;
  r.time_s = DateTime(p.start) + minutes * 60;
  r.state = state;
  r.speed_ms = speed_ms;
  r.speed_std_ms = std_ms;
  r.direction_deg = direction_deg;
  r.quality_ok = ok;
  r.event = event;
  return r;
}

std::vector<LoggedRecord> Records(const Plan& p) {
  const double nan = std::nan("");
  using S = LoggedState;
  return {
      Rec(p, -10, S::kProduction, 5, 0.25, 180),  // before the start
      Rec(p, 0, S::kProduction, 5, 0.25, 180),    // TI 5 % -> cell 0
      Rec(p, 10, S::kProduction, 5, 0.75, 180),   // TI 15 % -> cell 1
      Rec(p, 20, S::kProduction, 7, 0.5, 180),    // TI 7.1 % -> cell 2
      Rec(p, 30, S::kProduction, 7, 1.4, 180),    // TI 20 %: bins are [lo, hi)
      Rec(p, 40, S::kProduction, 5, 0.25, 300),   // outside the valid sector
      Rec(p, 50, S::kProduction, 5, 0.25, 90),    // sector edge 90 is inside -> cell 0
      Rec(p, 60, S::kProduction, 5, 0.25, 180, false),  // quality rejected
      Rec(p, 70, S::kParked, 2, nan, 180),              // no TI bins: std not needed -> 4
      Rec(p, 80, S::kOutage, 2, nan, 180),              // outage: not counted by default
      Rec(p, 90, S::kProduction, 4, 0.2, 180, true, "start_up"),         // -> 5 and 0
      Rec(p, 100, S::kProduction, 7, 0.5, 180, true, "emergency_stop"),  // -> 6 only
      Rec(p, 110, S::kProduction, 5, nan, 180),  // std missing where TI is binned
      Rec(p, 120, S::kProduction, 7, 0.5, 180, true, "yaw_test"),  // unknown event
      Rec(p, 30 * 24 * 60, S::kProduction, 5, 0.25, 180),          // on the as-of date
  };
}

// A planned change resets its cells at 00:00 of its date: records before it
// no longer count for them, records after it do; other cells keep theirs.
// A change after the as-of date does nothing yet; one between the last record
// and the as-of date still resets.
TEST(LoggedCountsTest, PlannedChangeResetsItsCellsAtItsDate) {
  Plan p = SmallPlan();
  p.planned_changes = {{"controller update", AddDays(p.start, 1), {0, 4}}};
  using S = LoggedState;
  const std::vector<LoggedRecord> records = {
      Rec(p, 0, S::kProduction, 5, 0.25, 180),            // cell 0, before the change
      Rec(p, 10, S::kProduction, 5, 0.75, 180),           // cell 1, not reset
      Rec(p, 20, S::kParked, 2, std::nan(""), 180),       // cell 4, before
      Rec(p, 24 * 60 + 10, S::kProduction, 5, 0.25, 180),  // cell 0, after
  };
  const LoggedCounts c = CountLoggedRecords(p, records, AddDays(p.start, 30));
  EXPECT_EQ(c.counts, (std::vector<uint32_t>{1, 1, 0, 0, 0, 0, 0}));
  EXPECT_EQ(c.counted_records, 4);  // counted when logged, then reset

  const LoggedCounts before = CountLoggedRecords(p, records, AddDays(p.start, 1));
  EXPECT_EQ(before.counts, (std::vector<uint32_t>{1, 1, 0, 0, 1, 0, 0}));

  p.planned_changes[0].date = AddDays(p.start, 5);  // after the last record
  const LoggedCounts after = CountLoggedRecords(p, records, AddDays(p.start, 6));
  EXPECT_EQ(after.counts, (std::vector<uint32_t>{0, 1, 0, 0, 0, 0, 0}));
}

TEST(LoggedCountsTest, EachRecordGoesWhereThePlanSays) {
  const Plan p = SmallPlan();
  const LoggedCounts c = CountLoggedRecords(p, Records(p), AddDays(p.start, 30));
  // TI = sigma_u / V (IEC 61400-1 definition of turbulence intensity; common
  // practice), in percent against [lo, hi) bins.
  EXPECT_EQ(c.counts, (std::vector<uint32_t>{3, 1, 1, 0, 1, 1, 1}));
  EXPECT_EQ(c.before_start, 1);
  EXPECT_EQ(c.after_as_of, 1);
  EXPECT_EQ(c.records_used, 13);
  EXPECT_EQ(c.outside_sector, 1);
  EXPECT_EQ(c.quality_rejected, 1);
  EXPECT_EQ(c.missing_values, 1);
  EXPECT_EQ(c.unknown_events, 1);
  EXPECT_EQ(c.counted_events, 2);
  EXPECT_EQ(c.counted_records, 6);
  // The latest record with a passed flag and known wind before the as-of date.
  EXPECT_TRUE(c.has_last_wind);
  EXPECT_EQ(c.last_wind_time_s, DateTime(p.start) + 120 * 60);
  EXPECT_DOUBLE_EQ(c.last_speed_ms, 7.0);
}

TEST(LoggedCountsTest, OutageRecordsCountAsParkedOnlyWhenThePlanSaysSo) {
  Plan p = SmallPlan();
  p.parked_counts_during_outage = true;
  const LoggedCounts c = CountLoggedRecords(p, Records(p), AddDays(p.start, 30));
  EXPECT_EQ(c.counts[4], 2u);
}

TEST(LoggedCountsTest, AsOfDateCutsTheRecordsUsed) {
  const Plan p = SmallPlan();
  // As of the second day: the first day's records only.
  const LoggedCounts c = CountLoggedRecords(p, Records(p), AddDays(p.start, 1));
  EXPECT_EQ(c.records_used, 13);
  const LoggedCounts none = CountLoggedRecords(p, Records(p), p.start);
  EXPECT_EQ(none.records_used, 0);
  EXPECT_EQ(none.counts, std::vector<uint32_t>(7, 0));
  EXPECT_FALSE(none.has_last_wind);
}

TEST(LoggedCountsTest, CompletionIsTheEndOfTheRecordThatFilledTheLastCell) {
  Plan p = testing_plans::SingleCellPlan(8.0, 2.0, 4.0, 6.0, 2, 30, 10);
  std::vector<LoggedRecord> r = {Rec(p, 0, LoggedState::kProduction, 5, 0.5, 10),
                                 Rec(p, 10, LoggedState::kProduction, 9, 0.5, 10),
                                 Rec(p, 20, LoggedState::kProduction, 5, 0.5, 10),
                                 Rec(p, 30, LoggedState::kProduction, 5, 0.5, 10)};
  const LoggedCounts c = CountLoggedRecords(p, r, AddDays(p.start, 1));
  EXPECT_EQ(c.counts[0], 3u);
  ASSERT_TRUE(c.complete_time_s.has_value());
  EXPECT_EQ(*c.complete_time_s, DateTime(p.start) + 30 * 60);  // end of the 20-min record
  EXPECT_TRUE(MatrixFull(p.matrix, c.counts));
  const CampaignState s = MakeCampaignState(p, c, AddDays(p.start, 1));
  EXPECT_EQ(s.elapsed_days, 1);
  EXPECT_EQ(s.counts, c.counts);
  EXPECT_TRUE(s.has_last_wind);
  EXPECT_DOUBLE_EQ(s.last_speed_ms, 5.0);
  EXPECT_DOUBLE_EQ(s.last_direction_deg, 10.0);
}

TEST(LoggedCountsTest, AsOfOutsideTheCampaignIsRefused) {
  const Plan p = SmallPlan();  // start 2027-01-01, horizon 10 weeks
  auto message = [&p](const Date& d) {
    try {
      CheckAsOfDate(p, d);
    } catch (const InputError& e) {
      return std::string(e.what());
    }
    return std::string("(no error)");
  };
  EXPECT_EQ(message(Date{2026, 12, 31}),
            "--as-of: 2026-12-31 is before the plan's start; valid: a date from "
            "2027-01-01 to 2027-03-11");
  EXPECT_EQ(message(Date{2027, 3, 12}),
            "--as-of: 2027-03-12 is beyond the plan's horizon; valid: a date from "
            "2027-01-01 to 2027-03-11");
  EXPECT_EQ(message(Date{2027, 3, 11}), "(no error)");
}

TEST(LoggedCountsTest, StateWordsReadBack) {
  for (int i = 0; i < kLoggedStateCount; ++i) {
    const LoggedState s = static_cast<LoggedState>(i);
    EXPECT_EQ(ParseLoggedState(LoggedStateName(s)), s);
  }
  EXPECT_FALSE(ParseLoggedState("running").has_value());
}

}  // namespace
}  // namespace planner
