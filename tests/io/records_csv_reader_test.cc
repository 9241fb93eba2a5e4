// Reading logged 10-minute records from CSV: what is kept, what is "not
// logged", and the exact message of every problem that stops an ingest.
#include "io/records_csv_reader.h"

#include <gtest/gtest.h>

#include <cmath>
#include <sstream>

#include "io/reader_test_util.h"

namespace planner {
namespace {

using reader_test::BadInput;
using reader_test::ErrorOf;
using reader_test::ExpectMessages;
using reader_test::Replace;

const std::string kGood =
    "timestamp,speed_ms,speed_std_ms,direction_deg,state,quality,event\n"
    "2027-03-01 00:00,7.4,0.81,236,production,ok,\n"
    "2027-03-01 00:10,7.9,NA,360,parked,rejected,start_up\n";

RecordsFile Read(const std::string& text, const RecordsCsvOptions& o = {}) {
  std::istringstream in(text);
  return ReadRecordsCsv(in, "log.csv", o);
}

TEST(RecordsCsvReaderTest, ReadsRowsInSiUnits) {
  const RecordsFile f = Read(kGood);
  ASSERT_EQ(f.rows.size(), 2u);
  const LoggedRecord& a = f.rows[0].record;
  EXPECT_EQ(a.time_s, DateTime(Date{2027, 3, 1}));
  EXPECT_DOUBLE_EQ(a.speed_ms, 7.4);
  EXPECT_DOUBLE_EQ(a.speed_std_ms, 0.81);
  EXPECT_DOUBLE_EQ(a.direction_deg, 236);
  EXPECT_EQ(a.state, LoggedState::kProduction);
  EXPECT_TRUE(a.quality_ok);
  EXPECT_EQ(a.event, "");
  EXPECT_EQ(f.rows[0].line, 2);
  const LoggedRecord& b = f.rows[1].record;
  EXPECT_TRUE(std::isnan(b.speed_std_ms));  // NA: not logged
  EXPECT_DOUBLE_EQ(b.direction_deg, 0.0);   // 360 is north
  EXPECT_FALSE(b.quality_ok);
  EXPECT_EQ(b.event, "start_up");
  EXPECT_EQ(f.missing_values, 1);
}

TEST(RecordsCsvReaderTest, StampAtEndAndUtcOffsetMoveTheKey) {
  RecordsCsvOptions o;
  o.stamp_at_end = true;
  o.utc_offset_h = 1.0;  // written in UTC+1: 00:10 local is 23:10 UTC the day before
  const RecordsFile f = Read(kGood, o);
  EXPECT_EQ(f.rows[1].record.time_s, DateTime(Date{2027, 3, 1}) - 3600);
}

TEST(RecordsCsvReaderTest, MappedColumnsCommentsAndBlankLines) {
  RecordsCsvOptions o;
  o.time_column = "Zeit";
  o.speed_column = "ws";
  o.std_column = "ws_sd";
  o.direction_column = "wd";
  o.state_column = "mode";
  o.quality_column = "qc";
  const RecordsFile f = Read(
      "# exported by an invented logger\nZeit,ws,ws_sd,wd,mode,qc\n\n"
      "2027-03-01T00:20,7.4,0.8,236,Reduced,1\n# note\n",
      o);
  ASSERT_EQ(f.rows.size(), 1u);
  EXPECT_EQ(f.rows[0].line, 4);
  EXPECT_EQ(f.rows[0].record.state, LoggedState::kReduced);
  EXPECT_EQ(f.event_column, "");
}

TEST(RecordsCsvReaderTest, ProblemsAreLocatedWordForWord) {
  auto error_of = [](const std::string& text) { return ErrorOf([&] { Read(text); }); };
  const std::string tail = "\nlog.csv: 1 row has problems; nothing was added to the log";
  const std::vector<BadInput> cases = {
      {"not a timestamp", Replace(kGood, "2027-03-01 00:00", "03/01/2027 00:00"),
       "log.csv:2:1: column 'timestamp': '03/01/2027 00:00' is not a timestamp; valid: "
       "YYYY-MM-DD HH:MM[:SS] or YYYY-MM-DDTHH:MM[:SS] (years 1900 to 2200) on the "
       "10-minute grid" +
           tail},
      {"date only", Replace(kGood, "2027-03-01 00:00", "2027-03-01"),
       "log.csv:2:1: column 'timestamp': '2027-03-01' is not a timestamp; valid: "
       "YYYY-MM-DD HH:MM[:SS] or YYYY-MM-DDTHH:MM[:SS] (years 1900 to 2200) on the "
       "10-minute grid" +
           tail},
      {"off the grid", Replace(kGood, "2027-03-01 00:00", "2027-03-01 00:05"),
       "log.csv:2:1: column 'timestamp': '2027-03-01 00:05' is not on the 10-minute "
       "grid; valid: YYYY-MM-DD HH:MM[:SS] or YYYY-MM-DDTHH:MM[:SS] (years 1900 to "
       "2200) on the 10-minute grid (minutes 00, 10, ..., 50 and seconds 00)" +
           tail},
      {"negative speed", Replace(kGood, "7.4", "-7.4"),
       "log.csv:2:2: column 'speed_ms': '-7.4' is out of range; valid: a mean speed "
       "from 0 to 75 m/s" +
           tail},
      {"speed with unit", Replace(kGood, "7.4", "7.4m/s"),
       "log.csv:2:2: column 'speed_ms': '7.4m/s' is not a number; valid: a mean speed "
       "from 0 to 75 m/s" +
           tail},
      {"direction out of range", Replace(kGood, "236", "400"),
       "log.csv:2:4: column 'direction_deg': '400' is out of range; valid: a direction "
       "from 0 to 360 degrees" +
           tail},
      {"unknown state", Replace(kGood, "production", "running"),
       "log.csv:2:5: column 'state': 'running' is not an operating state; valid: "
       "production, parked, reduced, outage" +
           tail},
      {"unknown flag", Replace(kGood, ",ok,", ",good,"),
       "log.csv:2:6: column 'quality': 'good' is not a quality flag; valid: ok, 1, true "
       "(passed) or rejected, 0, false (failed)" +
           tail},
      {"empty state", Replace(kGood, "production", ""),
       "log.csv:2:5: column 'state': empty cell is not an operating state; valid: "
       "production, parked, reduced, outage" +
           tail},
      {"bad event", Replace(kGood, "start_up", "start up!"),
       "log.csv:3:7: column 'event': 'start up!' is not an event name; valid: empty or "
       "none, or a name of letters, digits, '_' and '-' (start_up, normal_stop or a "
       "manual test of the plan)" +
           tail},
      {"cell count", Replace(kGood, "236,production", "236,,production"),
       "log.csv:2: 8 cells; the header has 7" + tail},
      {"missing column", Replace(kGood, "quality", "qc"),
       "log.csv:1: --quality: not given, and no column has a usual quality name "
       "(quality, quality_flag, flag); columns: timestamp, speed_ms, speed_std_ms, "
       "direction_deg, state, qc, event; name the quality column with --quality"},
      {"empty file", "",
       "log.csv: is empty; expected a header row naming the columns, "
       "then one row per 10-minute record"},
  };
  ExpectMessages(cases, error_of);
}

TEST(RecordsCsvReaderTest, SeveralProblemsAreListedThenCounted) {
  std::string text = "timestamp,speed_ms,speed_std_ms,direction_deg,state,quality\n";
  for (int i = 0; i < 12; ++i) text += "2027-03-01 00:00,7,1,10,on,ok\n";
  const std::string message = ErrorOf([&] { Read(text); });
  EXPECT_EQ(message.substr(0, message.find('\n')),
            "log.csv:2:5: column 'state': 'on' is not an operating state; valid: "
            "production, parked, reduced, outage");
  EXPECT_NE(message.find("log.csv:11:5:"), std::string::npos);
  EXPECT_EQ(message.find("log.csv:12:5:"), std::string::npos);  // ten listed
  EXPECT_NE(message.find("log.csv: 12 rows have problems; nothing was added to the log"),
            std::string::npos);
}

TEST(RecordsCsvReaderTest, MissingFileIsNamed) {
  EXPECT_EQ(ErrorOf([] { LoadRecordsCsv("/nonexistent/log.csv", {}); }),
            "/nonexistent/log.csv: cannot open records file: no such file");
}

}  // namespace
}  // namespace planner

namespace planner {
namespace {

// RFC 4180 (common practice for CSV): a quoted field ends at its closing
// quote. A quote left open must not run on or swallow the rest of the file.
TEST(RecordsCsvReaderTest, UnterminatedQuoteIsReportedWhereItOpens) {
  const std::string text = Replace(kGood, "2027-03-01 00:10,7.9,NA,360,parked",
                                   "2027-03-01 00:10,\"7.9,NA,360,parked");
  EXPECT_EQ(
      ErrorOf([&] { Read(text); }),
      "log.csv:3:18: unterminated quote: the \" that opens this cell is not closed "
      "on this line; close it with \" (a quote inside a cell is written \"\"; cells "
      "holding line breaks are not read)");
  EXPECT_EQ(ErrorOf([&] { Read(Replace(kGood, "7.4,0.81", "\"7.4\"x,0.81")); }),
            "log.csv:2:23: text after the closing quote of a cell; a quoted cell ends at "
            "its closing \" (write a quote inside it as \"\")");
}

TEST(RecordsCsvReaderTest, LinesEndingInCarriageReturnOnlyAreNamed) {
  std::string text = kGood;
  for (char& c : text) c = c == '\n' ? '\r' : c;
  EXPECT_EQ(
      ErrorOf([&] { Read(text); }),
      "log.csv:1:66: a carriage return (CR) inside the line: the file's lines end in "
      "CR only (an old Mac format); save it with LF or CR LF line ends");
}

}  // namespace
}  // namespace planner

namespace planner {
namespace {

// The optional channels_down column: group names separated by ';' or spaces,
// kept joined by ';'; empty or none for every group recording; anything else
// is named with its row and column.
TEST(RecordsCsvReaderTest, ReadsLoadChannelGroupsDown) {
  const std::string text =
      "timestamp,speed_ms,speed_std_ms,direction_deg,state,quality,channels_down\n"
      "2027-03-01 00:00,7.4,0.81,236,production,ok,blade; tower\n"
      "2027-03-01 00:10,7.9,0.9,230,production,ok,none\n"
      "2027-03-01 00:20,7.9,0.9,230,production,ok,\n";
  const RecordsFile f = Read(text);
  ASSERT_EQ(f.rows.size(), 3u);
  EXPECT_EQ(f.channels_down_column, "channels_down");
  EXPECT_EQ(f.rows[0].record.channels_down, "blade;tower");
  EXPECT_EQ(f.rows[1].record.channels_down, "");
  EXPECT_EQ(f.rows[2].record.channels_down, "");
  EXPECT_EQ(Read(kGood).channels_down_column, "");
  EXPECT_EQ(ErrorOf([&] { Read(Replace(text, "blade; tower", "blade/tower")); }),
            "log.csv:2:7: column 'channels_down': 'blade/tower' is not a list of "
            "load-channel groups; valid: empty or none, or names of letters, digits, '_' "
            "and '-' separated by ';' (groups of the plan's outages.channel_groups)\n"
            "log.csv: 1 row has problems; nothing was added to the log");
}

}  // namespace
}  // namespace planner
