// Measured-data CSV reader (io/met_csv_reader.h): timestamps, the time step,
// units, and every kind of bad row: each dropped row is counted under its
// reason and quoted with file and line; what makes the whole file unusable
// is an InputError whose message is checked word for word.
#include "io/met_csv_reader.h"

#include <gtest/gtest.h>

#include <cmath>
#include <ctime>
#include <filesystem>
#include <sstream>
#include <string>

#include "io/reader_test_util.h"
#include "planner/error.h"

namespace planner {
namespace {

using reader_test::ErrorOf;

const char kFile[] = "mast.csv";

MetSeries Read(const std::string& text, const MetCsvOptions& options = {},
               const std::string& file = kFile) {
  std::istringstream in(text);
  return ReadMetCsv(in, file, options);
}

std::string ReadError(const std::string& text, const MetCsvOptions& options = {},
                      const std::string& file = kFile) {
  return ErrorOf([&] { Read(text, options, file); });
}

int64_t Dropped(const MetSeries& s, DropReason reason) {
  return s.read.dropped[static_cast<int>(reason)];
}

// Reference: the C library's timegm (as in tests/model/calendar_test.cc).
int64_t TimeGm(int year, int month, int day, int hour, int minute, int second) {
  std::tm t{};
  t.tm_year = year - 1900;
  t.tm_mon = month - 1;
  t.tm_mday = day;
  t.tm_hour = hour;
  t.tm_min = minute;
  t.tm_sec = second;
  return static_cast<int64_t>(timegm(&t));
}

MetCsvOptions Speed(const std::string& column) {
  MetCsvOptions o;
  o.speed_column = column;
  return o;
}

const std::string kHeader = "timestamp,speed_ms,speed_std_ms,direction_deg\n";

TEST(MetCsvReaderTest, ReadsUsualColumnsStepAndUnits) {
  const MetSeries s = Read(kHeader +
                           "2024-03-01 00:00,7.5,0.9,236\n"
                           "2024-03-01 00:10,8.0,1.1,360\n"
                           "2024-03-01 00:20,6.25,NA,12.5\n");
  ASSERT_EQ(s.records.size(), 3u);
  EXPECT_EQ(s.read.time_column, "timestamp");
  EXPECT_EQ(s.read.speed_column, "speed_ms");
  EXPECT_EQ(s.read.std_column, "speed_std_ms");
  EXPECT_EQ(s.read.direction_column, "direction_deg");
  EXPECT_EQ(s.read.units, SpeedUnit::kMetresPerSecond);
  EXPECT_EQ(s.read.units_source, "from the column name 'speed_ms'");
  EXPECT_EQ(s.read.step_s, 600);
  EXPECT_EQ(s.read.rows_read, 3);
  EXPECT_EQ(s.read.rows_kept, 3);
  EXPECT_EQ(s.read.DroppedTotal(), 0);
  EXPECT_EQ(s.records[0].time_s, TimeGm(2024, 3, 1, 0, 0, 0));
  EXPECT_DOUBLE_EQ(s.records[0].speed_ms, 7.5);
  EXPECT_DOUBLE_EQ(s.records[0].speed_std_ms, 0.9);
  EXPECT_DOUBLE_EQ(s.records[0].direction_deg, 236.0);
  EXPECT_DOUBLE_EQ(s.records[1].direction_deg, 0.0);   // 360 is north
  EXPECT_TRUE(std::isnan(s.records[2].speed_std_ms));  // kept, std unusable
  EXPECT_EQ(s.read.std_unusable, 1);
}

TEST(MetCsvReaderTest, ParsesTheThreeTimestampFormatsLikeTimegm) {
  EXPECT_EQ(ParseTimestamp("1961-01-01"), TimeGm(1961, 1, 1, 0, 0, 0));
  EXPECT_EQ(ParseTimestamp("2024-02-29 23:50"), TimeGm(2024, 2, 29, 23, 50, 0));
  EXPECT_EQ(ParseTimestamp("2024-02-29T23:50:30"), TimeGm(2024, 2, 29, 23, 50, 30));
  EXPECT_EQ(ParseTimestamp("1969-12-31 23:00:00"), TimeGm(1969, 12, 31, 23, 0, 0));
  for (const char* bad :
       {"2023-02-29", "2024-03-01 24:00", "2024-03-01 12:60", "01/03/2024",
        "2024-03-01 00:10:00Z", "2024-3-1", "", "2024-03-01 0:10", "2024-03-01_00:10"}) {
    EXPECT_FALSE(ParseTimestamp(bad).has_value()) << bad;
  }
  EXPECT_EQ(FormatTimestamp(TimeGm(2024, 2, 29, 23, 50, 0), true), "2024-02-29 23:50");
  EXPECT_EQ(FormatTimestamp(TimeGm(1961, 1, 1, 0, 0, 0), false), "1961-01-01");
  EXPECT_EQ(FormatStep(600), "10 min");
  EXPECT_EQ(FormatStep(3600), "1 h");
  EXPECT_EQ(FormatStep(86400), "1 day");
  EXPECT_EQ(FormatStep(90), "90 s");
}

TEST(MetCsvReaderTest, CountsGapsAndMissingSteps) {
  const MetSeries s = Read(kHeader +
                           "2024-03-01 00:00,7,1,10\n"
                           "2024-03-01 00:10,7,1,10\n"
                           "2024-03-01 00:40,7,1,10\n"  // 00:20 and 00:30 missing
                           "2024-03-01 00:50,7,1,10\n"
                           "2024-03-01 01:10,7,1,10\n");  // 01:00 missing
  EXPECT_EQ(s.read.step_s, 600);
  EXPECT_EQ(s.read.gaps, 2);
  EXPECT_EQ(s.read.missing_steps, 3);
  EXPECT_EQ(s.read.off_grid, 0);
  EXPECT_EQ(s.records.size(), 5u);
}

TEST(MetCsvReaderTest, KeepsTheFirstOfDuplicatesAndTellsIdenticalFromConflicting) {
  const MetSeries s = Read(kHeader +
                           "2024-03-01 00:00,7.0,1,10\n"
                           "2024-03-01 00:00,7,1.0,10\n"  // same values
                           "2024-03-01 00:10,8,1,10\n"
                           "2024-03-01 00:10,9,1,10\n"  // other speed
                           "2024-03-01 00:20,8,1,10\n");
  ASSERT_EQ(s.records.size(), 3u);
  EXPECT_DOUBLE_EQ(s.records[1].speed_ms, 8.0);
  EXPECT_EQ(Dropped(s, DropReason::kDuplicateIdentical), 1);
  EXPECT_EQ(Dropped(s, DropReason::kDuplicateConflicting), 1);
  ASSERT_EQ(s.read.examples.size(), 2u);
  EXPECT_EQ(s.read.examples[0],
            "mast.csv:3: column 'timestamp': '2024-03-01 00:00' repeats the timestamp of "
            "line 2 with the same values; the first row is kept");
  EXPECT_EQ(s.read.examples[1],
            "mast.csv:5: column 'timestamp': '2024-03-01 00:10' repeats the timestamp of "
            "line 4 with other values; the first row is kept");
}

TEST(MetCsvReaderTest, DropsRowsOutOfTimeOrder) {
  const MetSeries s = Read(kHeader +
                           "2024-03-01 00:00,7,1,10\n"
                           "2024-03-01 00:20,7,1,10\n"
                           "2024-03-01 00:10,7,1,10\n"
                           "2024-03-01 00:30,7,1,10\n");
  EXPECT_EQ(s.records.size(), 3u);
  EXPECT_EQ(Dropped(s, DropReason::kOutOfOrder), 1);
  ASSERT_EQ(s.read.examples.size(), 1u);
  EXPECT_EQ(s.read.examples[0],
            "mast.csv:4: column 'timestamp': '2024-03-01 00:10' is earlier than "
            "2024-03-01 00:20 (line 3); rows must be in time order");
  EXPECT_EQ(s.read.step_s, 600);
}

// Every reason a speed is dropped, with the message quoted in the report.
TEST(MetCsvReaderTest, DropsBadSpeedsPerReasonWithLocatedExamples) {
  const MetSeries s = Read(kHeader +
                           "2024-03-01 00:00,7,1,10\n"
                           "2024-03-01 00:10,,1,10\n"
                           "2024-03-01 00:20,NaN,1,10\n"
                           "2024-03-01 00:30,fast,1,10\n"
                           "2024-03-01 00:40,-0.3,1,10\n"
                           "2024-03-01 00:50,80,1,10\n"
                           "2024-03-01 01:00,0.2,1,10\n"  // a calm: kept
                           "2024-03-01 01:10,n/a,1,10\n"
                           "2024-03-01 01:20,7,1,400\n"
                           "2024-03-01 01:30,7,1\n"
                           "03/01/2024 01:40,7,1,10\n");
  EXPECT_EQ(s.read.rows_read, 11);
  EXPECT_EQ(s.read.rows_kept, 2);
  EXPECT_EQ(Dropped(s, DropReason::kSpeedMissing), 2);
  EXPECT_EQ(Dropped(s, DropReason::kSpeedNaN), 1);
  EXPECT_EQ(Dropped(s, DropReason::kSpeedNonNumeric), 1);
  EXPECT_EQ(Dropped(s, DropReason::kSpeedNegative), 1);
  EXPECT_EQ(Dropped(s, DropReason::kSpeedTooHigh), 1);
  EXPECT_EQ(Dropped(s, DropReason::kDirectionInvalid), 1);
  EXPECT_EQ(Dropped(s, DropReason::kCellCount), 1);
  EXPECT_EQ(Dropped(s, DropReason::kBadTimestamp), 1);
  EXPECT_EQ(s.read.DroppedTotal(), 9);
  EXPECT_DOUBLE_EQ(s.records[1].speed_ms, 0.2);
  const std::vector<std::string> expected = {
      "mast.csv:3: column 'speed_ms': empty cell is a missing value",
      "mast.csv:4: column 'speed_ms': 'NaN' is not a number",
      "mast.csv:5: column 'speed_ms': 'fast' is not a number; expected a speed in m/s",
      "mast.csv:6: column 'speed_ms': '-0.3' is negative; a speed is at least 0",
      "mast.csv:7: column 'speed_ms': '80' is above the limit of 75 m/s",
      "mast.csv:9: column 'speed_ms': 'n/a' is a missing value",
      "mast.csv:10: column 'direction_deg': '400' is outside 0 to 360 degrees",
      "mast.csv:11: 3 cells; the header has 4",
      "mast.csv:12: column 'timestamp': '03/01/2024 01:40' is not a timestamp; valid: "
      "YYYY-MM-DD, YYYY-MM-DD HH:MM[:SS] or YYYY-MM-DDTHH:MM[:SS] (years 1900 to 2200)",
  };
  EXPECT_EQ(s.read.examples, expected);
}

TEST(MetCsvReaderTest, QuotesOnlyTheFirstThreeExamplesOfAReason) {
  std::string text = kHeader;
  for (int minute = 0; minute < 50; minute += 10) {
    text += "2024-03-01 00:" + std::to_string(minute / 10) + "0,x,1,10\n";
  }
  text += "2024-03-01 01:00,7,1,10\n2024-03-01 01:10,7,1,10\n";
  const MetSeries s = Read(text);
  EXPECT_EQ(Dropped(s, DropReason::kSpeedNonNumeric), 5);
  EXPECT_EQ(s.read.examples.size(), 3u);
}

// 1 kn = 1852 m / 3600 s exactly (definition of the knot).
TEST(MetCsvReaderTest, ConvertsKnotsFoundInTheColumnName) {
  const MetSeries s = Read("date,wind_speed_kn\n2024-03-01,10\n2024-03-02,20\n");
  EXPECT_EQ(s.read.units, SpeedUnit::kKnots);
  EXPECT_EQ(s.read.units_source, "from the column name 'wind_speed_kn'");
  EXPECT_DOUBLE_EQ(s.records[0].speed_ms, 10.0 * 1852.0 / 3600.0);
  EXPECT_NEAR(s.records[1].speed_ms, 10.28888, 1e-5);  // 20 x 0.514444
  EXPECT_EQ(s.read.step_s, 86400);
}

TEST(MetCsvReaderTest, FindsTheUnitInTheFileNameOrTakesItAsDeclared) {
  const std::string text = "date,RPT\n2024-03-01,10\n2024-03-02,12\n";
  const MetSeries from_file = Read(text, Speed("RPT"), "data/daily_mean_wind_knots.csv");
  EXPECT_EQ(from_file.read.units, SpeedUnit::kKnots);
  EXPECT_EQ(from_file.read.units_source,
            "from the file name 'daily_mean_wind_knots.csv'");
  MetCsvOptions declared;
  declared.speed_column = "RPT";
  declared.units = SpeedUnit::kMetresPerSecond;
  const MetSeries d = Read(text, declared, "data/daily_mean_wind_knots.csv");
  EXPECT_EQ(d.read.units, SpeedUnit::kMetresPerSecond);
  EXPECT_EQ(d.read.units_source, "declared with --units");
  EXPECT_DOUBLE_EQ(d.records[0].speed_ms, 10.0);
}

TEST(MetCsvReaderTest, SpeedAboveTheLimitIsReportedInMetresPerSecondToo) {
  const MetSeries s =
      Read("date,speed_kn\n2024-03-01,10\n2024-03-02,150\n2024-03-03,9\n");
  ASSERT_EQ(s.read.examples.size(), 1u);
  EXPECT_EQ(
      s.read.examples[0],
      "mast.csv:3: column 'speed_kn': '150' (77.2 m/s) is above the limit of 75 m/s");
}

TEST(MetCsvReaderTest, ReadsQuotedCellsByteOrderMarkAndWindowsLineEnds) {
  const MetSeries s = Read(
      "\xEF\xBB\xBF\"timestamp\",\"speed_ms\"\r\n\"2024-03-01 00:00\",\" 7.5\"\r\n"
      "\r\n2024-03-01 00:10,8\r\n");
  ASSERT_EQ(s.records.size(), 2u);
  EXPECT_EQ(s.read.rows_read, 2);  // the blank line is not a row
  EXPECT_DOUBLE_EQ(s.records[1].speed_ms, 8.0);
  EXPECT_EQ(SplitCsvLine("a, \"b,c\" ,\"say \"\"hi\"\"\",d"),
            (std::vector<std::string>{"a", "b,c", "say \"hi\"", "d"}));
}

struct FileErrorCase {
  const char* name;
  std::string text;
  MetCsvOptions options;
  std::string file;
  std::string message;
};

MetCsvOptions Std(const std::string& column) {
  MetCsvOptions o;
  o.std_column = column;
  return o;
}

class MetCsvFileErrorTest : public ::testing::TestWithParam<FileErrorCase> {};

TEST_P(MetCsvFileErrorTest, NamesFileLineColumnAndWhatIsValid) {
  EXPECT_EQ(ReadError(GetParam().text, GetParam().options, GetParam().file),
            GetParam().message);
}

const std::string kTwoRows = "2024-03-01 00:00,7\n2024-03-01 00:10,8\n";

INSTANTIATE_TEST_SUITE_P(
    Cases, MetCsvFileErrorTest,
    ::testing::Values(
        FileErrorCase{
            "MissingSpeedColumn", "timestamp,speed_ms\n" + kTwoRows, Speed("spd"), kFile,
            "mast.csv:1: --speed: 'spd' is not a column of the header; columns: "
            "timestamp, speed_ms"},
        FileErrorCase{
            "NoUsualSpeedName",
            "timestamp,ws_hub\n" + kTwoRows,
            {},
            kFile,
            "mast.csv:1: --speed: not given, and no column has a usual speed name "
            "(speed, speed_ms, speed_kn, speed_knots, wind_speed, wind_speed_ms, "
            "wind_speed_kn, wind_speed_knots); columns: timestamp, ws_hub; name the "
            "speed column with --speed"},
        FileErrorCase{
            "NoUsualTimeName",
            "stamp,speed_ms\n" + kTwoRows,
            {},
            kFile,
            "mast.csv:1: --time: not given, and no column has a usual time name "
            "(timestamp, time, date, datetime, date_time); columns: stamp, "
            "speed_ms; name the time column with --time"},
        FileErrorCase{
            "TwoUsualSpeedNames",
            "time,speed,speed_ms\n2024-03-01,1,1\n",
            {},
            kFile,
            "mast.csv:1: --speed: not given, and columns 'speed' and 'speed_ms' "
            "both have usual speed names; choose one with --speed"},
        FileErrorCase{
            "ColumnNamedTwice", "time,v,v\n2024-03-01,1,1\n", Speed("v"), kFile,
            "mast.csv:1: --speed: 'v' names columns 2 and 3 of the header; column "
            "names must be unique"},
        FileErrorCase{"SameColumnTwice", "time,speed_ms\n" + kTwoRows, Std("speed_ms"),
                      kFile,
                      "mast.csv:1: --std: 'speed_ms' is already the speed column; choose "
                      "another column"},
        FileErrorCase{
            "UnitUnknown", "time,v\n" + kTwoRows, Speed("v"), kFile,
            "mast.csv:1: --units: cannot tell the unit of speed column 'v' from its "
            "name or the file name; pass --units ms or --units knots"},
        FileErrorCase{
            "StdInOtherUnit",
            "time,speed_ms,std_kn\n2024-03-01,1,1\n",
            {},
            kFile,
            "mast.csv:1: --std: column 'std_kn' is in knots but the speed is in "
            "m/s; both must be in one unit (set it with --units)"},
        FileErrorCase{
            "Semicolons",
            "time;speed_ms\n2024-03-01;1\n",
            {},
            kFile,
            "mast.csv:1: header 'time;speed_ms' has one column; columns must be "
            "separated by commas"},
        FileErrorCase{
            "Empty",
            "\n\n",
            {},
            kFile,
            "mast.csv: is empty; expected a header row naming the columns, then "
            "one row per record"},
        FileErrorCase{
            "NoUsableRows",
            "time,speed_ms\n2024-03-01,x\n2024-03-02,\n",
            {},
            kFile,
            "mast.csv: no usable rows: 2 read, all dropped (speed missing: 1, "
            "speed not a number: 1); first: mast.csv:2: column 'speed_ms': 'x' is "
            "not a number; expected a speed in m/s"},
        FileErrorCase{
            "OneRow",
            "time,speed_ms\n2024-03-01,5\n",
            {},
            kFile,
            "mast.csv: only 1 usable row of 1 read; at least 2 are needed to find the "
            "time step"}),
    [](const ::testing::TestParamInfo<FileErrorCase>& info) { return info.param.name; });

TEST(MetCsvReaderTest, FileThatCannotBeOpenedIsAnInputError) {
  EXPECT_EQ(ErrorOf([] { LoadMetCsv("no/such/mast.csv", {}); }),
            "no/such/mast.csv: cannot open met data file: no such file");
  const std::string folder = std::filesystem::temp_directory_path().string();
  EXPECT_EQ(ErrorOf([&] { LoadMetCsv(folder, {}); }),
            folder + ": cannot open met data file: it is a folder");
}

}  // namespace
}  // namespace planner

namespace planner {
namespace {

// RFC 4180 (common practice for CSV): a quoted cell ends at its closing quote.
TEST(MetCsvReaderTest, QuoteLeftOpenOrTextAfterItIsAnErrorAtItsColumn) {
  const struct {
    const char* line;
    const char* error;  // "" = no error
  } cases[] = {
      {"a,\"b", ":7:3: unterminated quote"},
      {"\"a\"\"", ":7:1: unterminated quote"},
      {"a, \"b\" x,c", ":7:8: text after the closing quote"},
      {"a, \"b\" ,\"\"", ""},
      {"\"\"\"q\"\"\"", ""},
  };
  for (const auto& c : cases) {
    SCOPED_TRACE(c.line);
    std::string error;
    try {
      SplitCsvLine(c.line, SourceLocation{"mast.csv", 7, 0});
    } catch (const InputError& e) {
      error = e.what();
    }
    if (*c.error == '\0') {
      EXPECT_EQ(error, "");
    } else {
      EXPECT_EQ(error.substr(0, 8 + std::string(c.error).size()),
                std::string("mast.csv") + c.error);
    }
  }
}

TEST(MetCsvReaderTest, RowsDroppedAsOutOfOrderAreNamedWhenTooFewRemain) {
  // Newest first: every row after the first is earlier than the one kept.
  const std::string text =
      "timestamp,speed_ms\n2024-03-01 00:20,7\n2024-03-01 00:10,7\n2024-03-01 00:00,7\n";
  std::string error;
  try {
    Read(text);
  } catch (const InputError& e) {
    error = e.what();
  }
  EXPECT_EQ(
      error,
      "mast.csv: only 1 usable row of 3 read; at least 2 are needed to find the time "
      "step; dropped: timestamp out of order: 2; first: mast.csv:3: column "
      "'timestamp': '2024-03-01 00:10' is earlier than 2024-03-01 00:20 (line 2); "
      "rows must be in time order; sort the file by its timestamps, oldest first");
}

}  // namespace
}  // namespace planner
