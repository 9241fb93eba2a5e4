#include "report/report_numbers.h"

#include <algorithm>
#include <charconv>
#include <cmath>
#include <cstdarg>
#include <cstdio>

namespace planner {

std::string StringPrintf(const char* format, ...) {
  va_list args, copy;
  va_start(args, format);
  va_copy(copy, args);
  const int size = std::vsnprintf(nullptr, 0, format, copy);
  va_end(copy);
  std::string out(size > 0 ? static_cast<size_t>(size) : 0, '\0');
  if (size > 0) std::vsnprintf(&out[0], out.size() + 1, format, args);
  va_end(args);
  return out;
}

Date DoneByDate(const Date& start, double weeks) {
  const double days = weeks * 7.0;
  return AddDays(start,
                 static_cast<int64_t>(std::ceil(days - 1e-9 * std::max(1.0, days))));
}

std::string ExactNumber(double x) {
  if (!std::isfinite(x)) return "";
  char buf[64];
  const std::to_chars_result r = std::to_chars(buf, buf + sizeof buf, x);
  return std::string(buf, r.ptr);
}

std::string GroupedWhole(double x) {
  const double rounded = std::round(x);
  std::string digits = StringPrintf("%.0f", std::fabs(rounded));
  std::string out;
  const size_t n = digits.size();
  for (size_t i = 0; i < n; ++i) {
    if (i > 0 && (n - i) % 3 == 0) out += ',';
    out += digits[i];
  }
  return (rounded < 0 ? "-" : "") + out;
}

std::string Money(double amount, const std::string& currency) {
  return currency.empty() ? GroupedWhole(amount) : currency + " " + GroupedWhole(amount);
}

std::string PercentText(double share, int decimals) {
  return StringPrintf("%.*f %%", decimals, 100.0 * share);
}

std::string CiText(const QuantileEstimate& q, const char* dash) {
  if (q.ci_lo && q.ci_hi) return StringPrintf("%.1f%s%.1f", *q.ci_lo, dash, *q.ci_hi);
  if (q.ci_hi) return StringPrintf("up to %.1f", *q.ci_hi);
  if (q.ci_lo) return StringPrintf("from %.1f", *q.ci_lo);
  return "not available";
}

}  // namespace planner
