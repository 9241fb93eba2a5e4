// Reading campaign plans (docs/plan.md). Site models: site_model_reader.cc;
// the sections with their own readers: outage_reader.cc, curtailment_reader.cc,
// manual_test_reader.cc, layout_reader.cc, capture_matrix_reader.cc (with
// event_cell_reader.cc).
#include "planner/plan_reader.h"

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <filesystem>
#include <optional>
#include <string>
#include <vector>

#include "io/capture_matrix_reader.h"
#include "io/curtailment_reader.h"
#include "io/layout_reader.h"
#include "io/manual_test_reader.h"
#include "io/outage_reader.h"
#include "io/plan_fields.h"
#include "io/planned_change_reader.h"
#include "io/turbine_reader.h"
#include "io/weather_reader.h"
#include "io/yaml_fields.h"

namespace planner {
namespace {

namespace fs = std::filesystem;
using io::Field;
using io::FieldMap;
using io::Interval;
using io::kInfinity;

const std::vector<std::string> kPlanFields = {"name",
                                              "site_model",
                                              "weather",
                                              "campaign",
                                              "turbine",
                                              "valid_sectors_deg",
                                              "layout",
                                              "outages",
                                              "curtailment",
                                              "manual_tests",
                                              "quality_reject_fraction",
                                              "capture_matrix",
                                              "cost",
                                              "planned_changes"};
const std::vector<std::string> kCostFields = {"weekly", "mobilisation", "currency"};
const std::vector<std::string> kCampaignFields = {"start", "deadline", "horizon_weeks"};

// Twenty years: longer horizons are typing mistakes, and cost run time.
constexpr int kMaxHorizonWeeks = 1040;

void ReadCampaign(const Field& f, Plan* plan) {
  const FieldMap m(f, kCampaignFields);
  plan->start = io::AsDate(m.Get("start"));
  const Field deadline = m.Get("deadline");
  plan->deadline = io::AsDate(deadline);
  const int64_t deadline_days = DaysBetween(plan->start, plan->deadline);
  if (deadline_days <= 0) {
    io::Fail(deadline, io::Text(deadline) + " is not after the start (" +
                           FormatDate(plan->start) + "); the deadline must be later");
  }
  plan->horizon_weeks = io::ReadWholeNumber(
      m, "horizon_weeks", Interval("[]", 1, kMaxHorizonWeeks, "weeks"), 156);
  if (plan->horizon_weeks * int64_t{7} < deadline_days) {
    const int64_t needed = (deadline_days + 6) / 7;
    const std::optional<Field> given = m.Find("horizon_weeks");
    const std::string what = given ? io::Text(*given) : "the default 156";
    const Field at =
        given ? *given : Field{YAML::Node(), m.PathOf("horizon_weeks"), f.where};
    io::Fail(at, what + " weeks end before the deadline (" +
                     io::FormatNumber(std::round(deadline_days / 0.7) / 10.0) +
                     " weeks after the start); must be at least " +
                     std::to_string(needed));
  }
}

// The site model path is relative to the plan's folder.
void ReadSite(const Field& f, const std::string& base_dir, Plan* plan) {
  const std::string given = io::AsText(f);
  if (given.empty()) io::Fail(f, "is empty; give the path of a site model file");
  const fs::path resolved = base_dir.empty()
                                ? fs::path(given)
                                : (fs::path(base_dir) / given).lexically_normal();
  std::error_code ec;
  if (!fs::is_regular_file(resolved, ec)) {
    io::Fail(f, "'" + given + "' is not a file (looked for '" + resolved.string() +
                    "'); give a path relative to the plan's folder");
  }
  plan->site_file = resolved.string();
  plan->site = LoadSiteModel(plan->site_file);
}

// Campaign cost: weekly running cost and a fixed mobilisation, in `currency`
// (a 3-letter code; informative, no conversion).
CostModel ReadCost(const Field& f) {
  const FieldMap m(f, kCostFields);
  CostModel cost;
  cost.weekly = io::ReadNumber(m, "weekly", Interval("[]", 0, 1e9, "per week"), 0.0);
  cost.mobilisation = io::ReadNumber(m, "mobilisation", Interval("[]", 0, 1e10), 0.0);
  cost.currency = io::ReadText(m, "currency", "EUR");
  const bool code = cost.currency.size() == 3 &&
                    std::all_of(cost.currency.begin(), cost.currency.end(),
                                [](char c) { return c >= 'A' && c <= 'Z'; });
  if (!code) {
    io::Fail(m.Get("currency"), "'" + cost.currency +
                                    "' is not a currency code; expected three capital "
                                    "letters such as EUR, GBP or USD");
  }
  return cost;
}

}  // namespace

Plan ParsePlan(const std::string& yaml_text, const std::string& file_name,
               const std::string& base_dir) {
  const Field root = io::ParseDocument(yaml_text, file_name);
  if (io::HasField(root, "sectors") && !io::HasField(root, "campaign") &&
      !io::HasField(root, "capture_matrix")) {
    ThrowAt(SourceLocation{file_name, 0, 0}, "",
            "is a site model (it has 'sectors' and no 'campaign' or 'capture_matrix'), "
            "not a campaign plan; give the plan here and name this file in the plan's "
            "site_model field (docs/plan.md)");
  }
  const FieldMap m(root, kPlanFields);
  Plan plan;
  plan.name = io::ReadName(m, "name");
  plan.source_file = file_name;
  ReadCampaign(m.Get("campaign"), &plan);
  plan.turbine = io::ReadTurbine(m.Get("turbine"));
  const std::optional<Field> sectors = m.Find("valid_sectors_deg");
  if (sectors) {
    plan.valid_sectors =
        io::ReadAngleRanges(*sectors, "leave the field out for the full circle");
  }
  if (const auto f = m.Find("layout")) io::ReadLayout(*f, sectors.has_value(), &plan);
  if (const auto f = m.Find("outages")) io::ReadOutages(*f, &plan);
  if (const auto f = m.Find("curtailment")) plan.curtailment = io::ReadCurtailment(*f);
  if (const auto f = m.Find("manual_tests")) io::ReadManualTests(*f, &plan);
  plan.quality_reject_fraction =
      io::ReadNumber(m, "quality_reject_fraction", Interval("[)", 0, 1), 0.0);
  if (const auto f = m.Find("cost")) plan.cost = ReadCost(*f);
  // After curtailment and manual tests, which the matrix refers to.
  plan.matrix = io::ReadCaptureMatrix(m.Get("capture_matrix"), plan);
  if (const auto f = m.Find("planned_changes"))
    plan.planned_changes = io::ReadPlannedChanges(*f, plan);
  // Last, so that the plan's own mistakes are reported before the site's.
  ReadSite(m.Get("site_model"), base_dir, &plan);
  if (const auto f = m.Find("weather")) io::ReadWeather(*f, base_dir, &plan);
  return plan;
}

Plan LoadPlan(const std::string& path) {
  const std::string text = io::ReadInputFile(path, "plan");
  return ParsePlan(text, path, fs::path(path).parent_path().string());
}

}  // namespace planner
