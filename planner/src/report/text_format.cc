#include "report/text_format.h"

#include <algorithm>
#include <cmath>
#include <sstream>

#include "planner/weather_source.h"
#include "report/report_numbers.h"

namespace planner {

std::string Compact(double x) {
  return x == std::floor(x) ? StringPrintf("%.0f", x) : StringPrintf("%.1f", x);
}

std::string Percent(double share) { return StringPrintf("%.1f %%", 100.0 * share); }

std::string DoneBy(const Date& start, const std::optional<double>& weeks) {
  return weeks ? FormatDate(DoneByDate(start, *weeks)) : std::string();
}

std::string WeeksText(const std::optional<double>& weeks, int width) {
  return weeks ? StringPrintf("%*.1f", width, *weeks)
               : StringPrintf("%*s", width, "not reached");
}

std::string CiRangeText(const QuantileEstimate& q) {
  if (q.ci_lo && q.ci_hi) return StringPrintf("%.1f - %.1f", *q.ci_lo, *q.ci_hi);
  if (q.ci_hi) return StringPrintf("up to %.1f", *q.ci_hi);
  if (q.ci_lo) return StringPrintf("from %.1f", *q.ci_lo);
  return "not available";
}

std::string PlanHeaderLines(const Plan& plan, size_t label_width) {
  auto label = [label_width](const std::string& name) {
    std::string l = "  " + name + ":";
    return l + std::string(label_width > l.size() ? label_width - l.size() : 1, ' ');
  };
  std::string out = Wrap(label("Plan"), plan.name);
  out += Wrap(label("Site"), plan.site.name);
  out += Wrap(label("Weather"), WeatherSourceText(plan));
  if (!plan.turbine.name.empty()) out += Wrap(label("Turbine"), plan.turbine.name);
  return out;
}

std::string Wrap(const std::string& first, const std::string& text) {
  const std::string indent(first.size(), ' ');
  std::istringstream words(text);
  std::string out = first, line_start = first, word;
  size_t line_len = first.size();
  bool line_empty = true;
  while (words >> word) {
    if (!line_empty && line_len + 1 + word.size() > static_cast<size_t>(kTextWidth)) {
      out += "\n" + indent;
      line_len = indent.size();
      line_empty = true;
    }
    if (!line_empty) {
      out += ' ';
      ++line_len;
    }
    out += word;
    line_len += word.size();
    line_empty = false;
  }
  return out + "\n";
}

std::string FitLabel(std::string label, size_t width) {
  if (label.size() > width) label = label.substr(0, width - 3) + "...";
  return label;
}

}  // namespace planner
