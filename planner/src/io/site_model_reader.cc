// Reading site models (docs/site-model.md).
#include <cmath>
#include <optional>
#include <string>
#include <vector>

#include "io/yaml_fields.h"
#include "planner/plan_reader.h"
#include "planner/site_model.h"
#include "planner/turbulence.h"

namespace planner {
namespace {

using io::Field;
using io::FieldMap;
using io::Interval;
using io::kInfinity;

const std::vector<std::string> kSiteFields = {"name",
                                              "description",
                                              "sectors",
                                              "sector_persistence",
                                              "wind_persistence_h",
                                              "monthly_factors",
                                              "hourly_factors",
                                              "interannual_std",
                                              "mean_speed_uncertainty_pct",
                                              "turbulence"};
const std::vector<std::string> kSectorFields = {"frequency", "weibull_a_ms", "weibull_k"};
const std::vector<std::string> kNtmFields = {"model", "class", "i_ref", "persistence_h"};
const std::vector<std::string> kTableFields = {"model", "rows", "persistence_h"};
const std::vector<std::string> kTurbulenceFields = {"model", "class", "i_ref", "rows",
                                                    "persistence_h"};
const std::vector<std::string> kTiRowFields = {"wind_ms", "ti_mean_pct", "ti_std_pct"};

// Sector frequencies are usually rounded to a few digits; within this of 1
// they are rescaled to sum exactly 1.
constexpr double kFrequencySumTolerance = 0.005;
constexpr std::size_t kMaxSectors = 72;
// A year is the longest persistence time scale that still means something.
constexpr double kMaxPersistenceH = 8760.0;
constexpr int kDaysInMonth[12] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};

Sector ReadSector(const Field& f) {
  const FieldMap m(f, kSectorFields);
  Sector sector;
  sector.frequency = io::ReadNumber(m, "frequency", Interval("(]", 0, 1));
  sector.weibull.scale_ms =
      io::ReadNumber(m, "weibull_a_ms", Interval("(]", 0, 30, "m/s"));
  // k below 1 is no 10-minute wind climate: the mean A * Gamma(1 + 1/k)
  // exceeds A and grows without bound (k = 0.1 gives 3.6 million times A).
  sector.weibull.shape =
      io::ReadNumber(m, "weibull_k", Interval("[]", kMinWeibullShape, kMaxWeibullShape));
  return sector;
}

std::vector<Sector> ReadSectors(const Field& f) {
  const std::vector<Field> items = io::AsList(f);
  if (items.empty()) {
    io::Fail(f,
             "is empty; give one entry per direction sector, the first centred on "
             "north");
  }
  if (items.size() > kMaxSectors) {
    io::Fail(f, std::to_string(items.size()) + " sectors given; at most " +
                    std::to_string(kMaxSectors) + " are allowed");
  }
  std::vector<Sector> sectors;
  double sum = 0.0;
  for (const Field& item : items) {
    sectors.push_back(ReadSector(item));
    sum += sectors.back().frequency;
  }
  if (std::fabs(sum - 1.0) > kFrequencySumTolerance) {
    io::Fail(f, "frequencies sum to " + io::FormatNumber(sum) +
                    "; they must sum to 1 (within 0.005)");
  }
  for (Sector& sector : sectors) sector.frequency /= sum;
  return sectors;
}

// `count` factors > 0, e.g. 12 monthly ones.
std::vector<double> ReadFactors(const Field& f, std::size_t count, const char* span) {
  const std::vector<Field> items = io::AsList(f);
  if (items.size() != count) {
    io::Fail(f, std::to_string(items.size()) + " values given; expected " +
                    std::to_string(count) + " (" + span + ")");
  }
  std::vector<double> factors;
  for (const Field& item : items) {
    factors.push_back(io::AsNumber(item, Interval("(]", 0, 10)));
  }
  return factors;
}

// Monthly factors are scaled so that their day-weighted mean over a 365-day
// year is 1: they then move wind between seasons but keep the annual mean.
void ReadMonthlyFactors(const Field& f, SiteModel* site) {
  const std::vector<double> factors = ReadFactors(f, 12, "January to December");
  double weighted = 0.0;
  for (int m = 0; m < 12; ++m) weighted += kDaysInMonth[m] * factors[m];
  const double mean = weighted / 365.0;
  for (int m = 0; m < 12; ++m) site->monthly_factors[m] = factors[m] / mean;
}

void ReadHourlyFactors(const Field& f, SiteModel* site) {
  const std::vector<double> factors = ReadFactors(f, 24, "hours 00 to 23");
  double sum = 0.0;
  for (double x : factors) sum += x;
  for (int h = 0; h < 24; ++h) site->hourly_factors[h] = factors[h] * 24.0 / sum;
}

void ReadIecClass(const FieldMap& m, TurbulenceModel* model) {
  const std::optional<Field> class_field = m.Find("class");
  const std::optional<Field> i_ref_field = m.Find("i_ref");
  if (class_field && i_ref_field) {
    io::Fail(*i_ref_field, "given together with class; give either class or i_ref");
  }
  if (i_ref_field) {
    model->i_ref = io::AsNumber(*i_ref_field, Interval("(]", 0, 0.5));
  } else if (class_field) {
    const std::string name = io::AsText(*class_field);
    model->i_ref = IecReferenceIntensity(name);
    if (!(model->i_ref > 0.0)) {
      io::Fail(*class_field, io::Describe(class_field->node) +
                                 " is not an IEC 61400-1 turbulence class; valid: A+, A, "
                                 "B, C");
    }
  } else {
    io::Fail(m.self(),
             "gives neither class nor i_ref; give one (class: A+, A, B or C; "
             "or i_ref in (0, 0.5])");
  }
}

// One row of a TI table; `previous` is the row before it, if any.
TiTableRow ReadTiRow(const Field& f, const TiTableRow* previous) {
  const FieldMap m(f, kTiRowFields);
  const Field wind = m.Get("wind_ms");
  const auto [lo, hi] = io::AsPair(wind);
  TiTableRow row;
  row.wind_lo_ms = io::AsNumber(lo, Interval("[)", 0, kInfinity, "m/s"));
  row.wind_hi_ms = io::AsNumber(hi, Interval("[)", 0, kInfinity, "m/s"));
  if (row.wind_hi_ms <= row.wind_lo_ms) {
    io::Fail(wind, io::PairText(wind) + " is an empty bin; lo must be below hi");
  }
  if (previous != nullptr && row.wind_lo_ms < previous->wind_hi_ms) {
    io::Fail(wind, io::PairText(wind) + " overlaps or comes before the previous row [" +
                       io::FormatNumber(previous->wind_lo_ms) + ", " +
                       io::FormatNumber(previous->wind_hi_ms) +
                       "]; rows must be sorted by wind speed and must not overlap");
  }
  row.ti_mean = io::ReadNumber(m, "ti_mean_pct", Interval("(]", 0, 100, "%")) / 100.0;
  row.ti_std = io::ReadNumber(m, "ti_std_pct", Interval("[]", 0, 100, "%")) / 100.0;
  return row;
}

std::vector<TiTableRow> ReadTiTable(const FieldMap& m) {
  const Field rows_field = m.Get("rows");
  const std::vector<Field> items = io::AsList(rows_field);
  if (items.empty()) io::Fail(rows_field, "is empty; give at least one wind bin");
  std::vector<TiTableRow> rows;
  for (const Field& item : items) {
    rows.push_back(ReadTiRow(item, rows.empty() ? nullptr : &rows.back()));
  }
  return rows;
}

// The model a turbulence mapping names, or "" if it names none (yet).
std::string PeekModel(const Field& f) {
  if (!f.node.IsMap()) return "";
  for (auto it = f.node.begin(); it != f.node.end(); ++it) {
    if (it->first.IsScalar() && it->first.Scalar() == "model" && it->second.IsScalar()) {
      return it->second.Scalar();
    }
  }
  return "";
}

TurbulenceModel ReadTurbulence(const Field& f) {
  // The valid fields depend on the model.
  const std::string peeked = PeekModel(f);
  const bool is_ntm = peeked == "iec-ntm";
  const bool is_table = peeked == "table";
  const FieldMap m(f,
                   is_ntm     ? kNtmFields
                   : is_table ? kTableFields
                              : kTurbulenceFields,
                   is_ntm || is_table ? "for model '" + peeked + "'" : "");
  const Field model_field = m.Get("model");
  const std::string model_name = io::AsText(model_field);
  TurbulenceModel model;
  if (model_name == "iec-ntm") {
    model.kind = TurbulenceModel::Kind::kIecNtm;
    ReadIecClass(m, &model);
  } else if (model_name == "table") {
    model.kind = TurbulenceModel::Kind::kTable;
    model.table = ReadTiTable(m);
  } else {
    io::Fail(model_field, io::Describe(model_field.node) +
                              " is not a turbulence model; valid: iec-ntm, table");
  }
  model.persistence_h =
      io::ReadNumber(m, "persistence_h", Interval("[]", 0, kMaxPersistenceH, "h"), 0.0);
  return model;
}

}  // namespace

SiteModel ParseSiteModel(const std::string& yaml_text, const std::string& file_name) {
  const Field root = io::ParseDocument(yaml_text, file_name);
  for (const char* plan_field : {"campaign", "capture_matrix", "site_model"}) {
    if (!io::HasField(root, plan_field)) continue;
    ThrowAt(SourceLocation{file_name, 0, 0}, "",
            std::string("is a campaign plan (it has '") + plan_field +
                "'), not a site model; a site model has 'sectors' and 'turbulence' "
                "(docs/site-model.md), and a plan names it in its site_model field");
  }
  const FieldMap m(root, kSiteFields);
  SiteModel site;
  site.name = io::ReadName(m, "name");
  site.description = io::ReadText(m, "description", "");
  site.sectors = ReadSectors(m.Get("sectors"));
  site.sector_persistence =
      io::ReadNumber(m, "sector_persistence", Interval("[)", 0, 1), 0.97);
  site.wind_persistence_h = io::ReadNumber(
      m, "wind_persistence_h", Interval("[]", 0, kMaxPersistenceH, "h"), 36.0);
  if (const auto f = m.Find("monthly_factors")) ReadMonthlyFactors(*f, &site);
  if (const auto f = m.Find("hourly_factors")) ReadHourlyFactors(*f, &site);
  site.interannual_std =
      io::ReadNumber(m, "interannual_std", Interval("[]", 0, 0.5), 0.0);
  site.mean_speed_uncertainty_pct = io::ReadNumber(m, "mean_speed_uncertainty_pct",
                                                   Interval("[]", 0, 30, "%"), 0.0);
  site.turbulence = ReadTurbulence(m.Get("turbulence"));
  return site;
}

SiteModel LoadSiteModel(const std::string& path) {
  return ParseSiteModel(io::ReadInputFile(path, "site model"), path);
}

}  // namespace planner
