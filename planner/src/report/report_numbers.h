// Number, date and money formatting shared by the written reports (HTML and
// CSV), so that every file states the same figure the same way.
#ifndef PLANNER_REPORT_REPORT_NUMBERS_H_
#define PLANNER_REPORT_REPORT_NUMBERS_H_

#include <optional>
#include <string>

#include "planner/calendar.h"
#include "planner/quantile.h"

namespace planner {

// printf into a std::string.
std::string StringPrintf(const char* format, ...) __attribute__((format(printf, 1, 2)));

// A completion `weeks` after 00:00 of `start` is done by 00:00 of
// start + ceil(7 weeks) days: the convention of the (exclusive) deadline, so
// a run is complete by the deadline exactly when its done-by date is on or
// before it (docs/output.md). A tiny allowance keeps whole days whole.
Date DoneByDate(const Date& start, double weeks);

// Shortest text that reads back as exactly the same double ("0.1", "46.5",
// "1e-05"); "" for NaN or infinity. For files that programs read.
std::string ExactNumber(double x);

// "1,234,568" (rounded to a whole number, thousands separated by commas).
std::string GroupedWhole(double x);

// "EUR 1,234,568": currency code, a space, the grouped whole amount.
std::string Money(double amount, const std::string& currency);

// "62.0 %" with `decimals` digits after the point.
std::string PercentText(double share, int decimals = 1);

// "44.9-48.1", "up to 48.1", "from 44.9" or "not available" (weeks, one
// decimal): the 95 % interval of a quantile with its open bounds spelled out.
std::string CiText(const QuantileEstimate& q, const char* dash = "-");

}  // namespace planner

#endif  // PLANNER_REPORT_REPORT_NUMBERS_H_
