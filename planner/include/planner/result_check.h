// The last check before a result goes out: every number is finite and in its
// physical range.
//
// Each input field is checked against its own range when it is read, but
// fields that are each in range can still combine into nonsense (a monthly
// wind factor of 10 on a Weibull scale of 30 m/s gives a mean wind of about
// 270 m/s). Whatever the cause, a NaN or an absurd value must never reach a
// report, so every command checks its summaries with this before writing
// anything, and fails with the list of what is wrong.
#ifndef PLANNER_RESULT_CHECK_H_
#define PLANNER_RESULT_CHECK_H_

#include <string>
#include <vector>

#include "planner/forecast.h"

namespace planner {

// The highest 10-minute mean wind speed fillcast accepts anywhere, m/s (the
// met-data reader's limit; the highest 10-minute means measured on land are
// well below it, from memory).
inline constexpr double kMaxMeanSpeedMs = 75.0;

// One line per implausible number, "mean wind speed at hub: 312 m/s (expected
// 0 to 75 m/s)"; empty if all are plausible. Checked: shares and chances in
// [0, 1], weeks finite and from 0 to the horizon, counts finite and >= 0,
// savings finite, the mean wind speed from 0 to kMaxMeanSpeedMs.
std::vector<std::string> ImplausibleNumbers(const ForecastSummary& s);

}  // namespace planner

#endif  // PLANNER_RESULT_CHECK_H_
