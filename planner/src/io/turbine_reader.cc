#include "io/turbine_reader.h"

#include <cmath>
#include <optional>
#include <string>
#include <vector>

namespace planner {
namespace io {
namespace {

const std::vector<std::string> kTurbineFields = {
    "name",           "rated_power_kw", "rotor_diameter_m", "hub_height_m",
    "cut_in_ms",      "rated_ms",       "cut_out_ms",       "restart_ms",
    "restart_wait_min", "shutdown_rules", "storm_control"};
const std::vector<std::string> kRuleFields = {"averaging_s", "threshold_ms"};
const std::vector<std::string> kStormFields = {"from_ms", "to_ms"};

constexpr double kDefaultRestartMarginMs = 3.0;
constexpr double kRecordS = 600.0;
constexpr double kMaxRestartWaitMin = 1440.0;  // a day

Limits Speed() { return Interval("(]", 0, kMaxWindSpeedMs, "m/s"); }

// "above <name> (<value>)" pieces of turbine messages.
std::string Named(const std::string& name, double value) {
  return name + " (" + FormatNumber(value) + ")";
}

// The 10-minute stop: cut_out_ms, or storm_control.to_ms with storm control
// (then cut_out_ms must not be given), with storm control's start.
void ReadStopSpeeds(const FieldMap& m, TurbineSpec* t) {
  const std::optional<Field> storm = m.Find("storm_control");
  if (!storm) {
    t->cut_out_ms = ReadNumber(m, "cut_out_ms", Speed());
    return;
  }
  if (const std::optional<Field> cut_out = m.Find("cut_out_ms")) {
    Fail(*cut_out, Text(*cut_out) +
                       " is given with storm_control, whose to_ms is where the "
                       "turbine stops on the 10-minute mean; remove cut_out_ms");
  }
  const FieldMap s(*storm, kStormFields);
  t->storm_control_from_ms = ReadNumber(s, "from_ms", Speed());
  const Field to = s.Get("to_ms");
  t->cut_out_ms = AsNumber(to, Speed());
  if (t->cut_out_ms <= t->storm_control_from_ms) {
    Fail(to, Text(to) + " must be above " + Named("from_ms", t->storm_control_from_ms));
  }
}

// restart_ms defaults to the 10-minute stop - 3 and must lie in (cut_in, stop].
void ReadRestart(const FieldMap& m, const std::string& stop_name, TurbineSpec* t) {
  const std::optional<Field> f = m.Find("restart_ms");
  const Field at = f ? *f : Field{YAML::Node(), m.PathOf("restart_ms"), m.self().where};
  t->restart_ms = f ? AsNumber(*f, Speed()) : t->cut_out_ms - kDefaultRestartMarginMs;
  if (t->restart_ms > t->cut_in_ms && t->restart_ms <= t->cut_out_ms) return;
  const std::string what =
      f ? Text(*f)
        : "the default " + stop_name + " - 3 = " + FormatNumber(t->restart_ms);
  Fail(at, what + " must be above " + Named("cut_in_ms", t->cut_in_ms) +
               " and at most " + Named(stop_name, t->cut_out_ms));
}

ShortTermShutdown ReadRule(const Field& f, const TurbineSpec& t) {
  const FieldMap m(f, kRuleFields);
  ShortTermShutdown rule;
  const Field averaging = m.Get("averaging_s");
  rule.averaging_s = AsNumber(averaging, Interval("[)", 1, kRecordS, "s"));
  const Field threshold = m.Get("threshold_ms");
  rule.threshold_ms = AsNumber(threshold, Speed());
  if (rule.threshold_ms <= t.restart_ms) {
    Fail(threshold, Text(threshold) + " must be above " +
                        Named("restart_ms", t.restart_ms) +
                        "; a lower threshold would stop the turbine in records in "
                        "which it restarts");
  }
  return rule;
}

std::vector<ShortTermShutdown> ReadRules(const Field& f, const TurbineSpec& t) {
  const std::vector<Field> items = AsList(f);
  if (items.empty()) {
    Fail(f, "is empty; give at least one rule, or leave the field out (the turbine "
            "then stops on the 10-minute mean alone)");
  }
  if (items.size() > static_cast<size_t>(kMaxShutdownRules)) {
    Fail(f, std::to_string(items.size()) + " rules given; at most " +
                std::to_string(kMaxShutdownRules) + " are allowed");
  }
  std::vector<ShortTermShutdown> rules;
  for (const Field& item : items) {
    const ShortTermShutdown rule = ReadRule(item, t);
    for (const ShortTermShutdown& before : rules) {
      if (before.averaging_s != rule.averaging_s) continue;
      Fail(FieldMap(item, kRuleFields).Get("averaging_s"),
           FormatNumber(rule.averaging_s) +
               " s is given twice; give each averaging time once");
    }
    rules.push_back(rule);
  }
  return rules;
}

}  // namespace

TurbineSpec ReadTurbine(const Field& f) {
  const FieldMap m(f, kTurbineFields);
  TurbineSpec t;
  t.name = ReadName(m, "name");
  t.rated_power_kw = ReadNumber(m, "rated_power_kw", Interval("(]", 0, 1e6, "kW"), 0.0);
  t.rotor_diameter_m = ReadNumber(m, "rotor_diameter_m", Interval("(]", 0, 500, "m"), 0.0);
  t.hub_height_m = ReadNumber(m, "hub_height_m", Interval("(]", 0, 500, "m"), 0.0);
  t.cut_in_ms = ReadNumber(m, "cut_in_ms", Speed());
  ReadStopSpeeds(m, &t);
  const std::string stop_name = t.storm_control_from_ms > 0 ? "to_ms" : "cut_out_ms";
  if (t.cut_in_ms >= t.cut_out_ms) {
    Fail(m.Get("cut_in_ms"),
         Text(m.Get("cut_in_ms")) + " must be below " + Named(stop_name, t.cut_out_ms));
  }
  if (t.storm_control_from_ms > 0 && t.storm_control_from_ms <= t.cut_in_ms) {
    const Field from = FieldMap(m.Get("storm_control"), kStormFields).Get("from_ms");
    Fail(from, Text(from) + " must be above " + Named("cut_in_ms", t.cut_in_ms));
  }
  const Field rated = m.Get("rated_ms");
  t.rated_ms = AsNumber(rated, Speed());
  if (t.rated_ms <= t.cut_in_ms || t.rated_ms > t.cut_out_ms) {
    Fail(rated, Text(rated) + " must be above " + Named("cut_in_ms", t.cut_in_ms) +
                    " and at most " + Named(stop_name, t.cut_out_ms));
  }
  ReadRestart(m, stop_name, &t);
  t.restart_wait_min = ReadNumber(m, "restart_wait_min",
                                  Interval("[]", 0, kMaxRestartWaitMin, "min"), 0.0);
  if (const std::optional<Field> rules = m.Find("shutdown_rules")) {
    t.shutdown_rules = ReadRules(*rules, t);
  }
  return t;
}

}  // namespace io
}  // namespace planner
