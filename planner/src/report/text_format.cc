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
  out += Wrap(label("Site"),
              plan.site.name +
                  (plan.site.mean_speed_uncertainty_pct > 0 && !plan.replay
                       ? StringPrintf(" (mean wind speed known to %g %%, 1 s.d.; each run "
                                      "draws its own)",
                                      plan.site.mean_speed_uncertainty_pct)
                       : std::string()));
  out += Wrap(label("Weather"), WeatherSourceText(plan));
  if (!plan.turbine.name.empty()) out += Wrap(label("Turbine"), plan.turbine.name);
  if (const std::string h = HighWindText(plan.turbine); !h.empty())
    out += Wrap(label("High wind"), h);
  if (const std::string e = EpisodesText(plan); !e.empty())
    out += Wrap(label("Episodes"), e);
  if (const std::string c = ChannelGroupsText(plan); !c.empty())
    out += Wrap(label("Channels"), c);
  return out;
}

std::string HighWindText(const TurbineSpec& t) {
  if (t.shutdown_rules.empty() && t.restart_wait_min == 0 &&
      t.storm_control_from_ms == 0)
    return "";
  std::string out;
  if (t.storm_control_from_ms > 0) {
    out += StringPrintf("storm control (reduced) from %g m/s; ", t.storm_control_from_ms);
  }
  out += StringPrintf("stops at %g m/s (10-minute mean)", t.cut_out_ms);
  for (const ShortTermShutdown& r : t.shutdown_rules) {
    out += StringPrintf(", %g m/s (%g s mean)", r.threshold_ms, r.averaging_s);
  }
  out += StringPrintf("; restarts below %g m/s", t.restart_ms);
  if (t.restart_wait_min > 0) out += StringPrintf(" after %g min", t.restart_wait_min);
  return out;
}

std::string EpisodesText(const Plan& plan) {
  std::string out;
  for (const EpisodeModel& e : plan.episodes) {
    double per_year = 0;
    for (double m : e.starts_per_month) per_year += m;
    const char* effect = e.stops_turbine && e.invalidates_records
                             ? "stops the turbine, records invalid"
                         : e.stops_turbine ? "stops the turbine"
                                           : "records invalid";
    out += StringPrintf("%s%s (%s): %.1f a year, mean %g h", out.empty() ? "" : "; ",
                        e.name.c_str(), effect, per_year, e.mean_h);
  }
  return out;
}

std::string ChannelGroupsText(const Plan& plan) {
  std::string out;
  for (const ChannelGroup& g : plan.channel_groups) {
    const double share = g.failures.mtbf_h / (g.failures.mtbf_h + g.failures.mttr_h);
    out += StringPrintf("%s%s: up %.1f %%", out.empty() ? "" : "; ", g.name.c_str(),
                        100.0 * share);
    const Recalibration& r = g.recalibration;
    if (r.needed) {
      out += StringPrintf(", then %g h below %g m/s%s to recalibrate", r.hours, r.below_ms,
                          r.crew ? " with the crew" : "");
    }
  }
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
