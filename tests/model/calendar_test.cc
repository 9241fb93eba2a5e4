#include "planner/calendar.h"

#include <gtest/gtest.h>

#include <ctime>

namespace planner {
namespace {

// Reference: the C library's timegm (POSIX epoch, proleptic Gregorian).
int64_t LibcDays(int y, int m, int d) {
  std::tm tm{};
  tm.tm_year = y - 1900;
  tm.tm_mon = m - 1;
  tm.tm_mday = d;
  return static_cast<int64_t>(timegm(&tm)) / 86400;
}

TEST(CalendarTest, DaysFromCivilMatchesLibcTimegm) {
  for (int y : {1961, 1970, 1999, 2000, 2024, 2027, 2100}) {
    for (int m = 1; m <= 12; ++m) {
      for (int d : {1, 15, 28}) {
        EXPECT_EQ(DaysFromCivil({y, m, d}), LibcDays(y, m, d))
            << y << "-" << m << "-" << d;
      }
    }
  }
}

TEST(CalendarTest, CivilFromDaysInvertsDaysFromCivil) {
  for (int64_t day = -800; day < 60000; day += 37) {
    EXPECT_EQ(DaysFromCivil(CivilFromDays(day)), day);
  }
}

TEST(CalendarTest, ParseDateAcceptsRealDatesOnly) {
  EXPECT_TRUE(ParseDate("2028-02-29").has_value());  // leap year
  EXPECT_FALSE(ParseDate("2027-02-29").has_value());
  EXPECT_FALSE(ParseDate("2100-02-29").has_value());  // century, not leap
  EXPECT_TRUE(ParseDate("2000-02-29").has_value());   // 400-year rule
  EXPECT_FALSE(ParseDate("2027-13-01").has_value());
  EXPECT_FALSE(ParseDate("2027-3-1").has_value());
  EXPECT_FALSE(ParseDate("2027-03-01x").has_value());
  EXPECT_EQ(FormatDate(*ParseDate("2027-03-01")), "2027-03-01");
}

TEST(CalendarTest, WeekIsTenThousandAndEightRecords) {
  // Common practice: 10-minute records, 6 per hour, 1,008 per week, 52,560 per
  // 365-day year.
  EXPECT_EQ(kStepsPerWeek, 1008);
  EXPECT_EQ(kStepsPerDay * 365, 52560);
}

}  // namespace
}  // namespace planner
