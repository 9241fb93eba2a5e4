// Civil dates (proleptic Gregorian) for campaign start, deadline and horizon.
//
// Dates are whole days; a campaign starts at 00:00 of its start date. The
// simulation needs only the month and the hour of day of each 10-minute step,
// so time zones and daylight saving do not enter (all hours are local standard
// time of the site).
#ifndef PLANNER_CALENDAR_H_
#define PLANNER_CALENDAR_H_

#include <cstdint>
#include <optional>
#include <string>

namespace planner {

// Ten-minute records: 6 per hour, 144 per day, 1,008 per week (common
// practice: 10-minute averaging periods, IEC 61400-12-1 and -13).
inline constexpr int kStepsPerHour = 6;
inline constexpr int kStepsPerDay = 144;
inline constexpr int kStepsPerWeek = 1008;
inline constexpr double kStepHours = 1.0 / 6.0;

struct Date {
  int year = 2000;
  int month = 1;  // 1..12
  int day = 1;    // 1..31
};

// The years fillcast reads in dates and timestamps (a campaign, its met data
// and its log all fall well inside them).
inline constexpr int kMinYear = 1900;
inline constexpr int kMaxYear = 2200;
// "a real calendar date in the years 1900 to 2200", for messages.
inline constexpr char kDateRangeText[] = "a real calendar date in the years 1900 to 2200";

// Parses "YYYY-MM-DD"; nullopt if malformed, not a real date or outside the
// years kMinYear to kMaxYear.
std::optional<Date> ParseDate(const std::string& text);

// "YYYY-MM-DD".
std::string FormatDate(const Date& d);

// Days since 1970-01-01 (negative before).
int64_t DaysFromCivil(const Date& d);
Date CivilFromDays(int64_t days);

// Whole days from a to b (b - a).
inline int64_t DaysBetween(const Date& a, const Date& b) {
  return DaysFromCivil(b) - DaysFromCivil(a);
}

Date AddDays(const Date& d, int64_t days);

inline bool operator==(const Date& a, const Date& b) {
  return a.year == b.year && a.month == b.month && a.day == b.day;
}

}  // namespace planner

#endif  // PLANNER_CALENDAR_H_
