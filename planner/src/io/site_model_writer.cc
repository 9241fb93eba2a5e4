#include "io/site_model_writer.h"

#include <cmath>
#include <cstdio>
#include <sstream>

#include "io/file_seal.h"
#include "io/met_csv_reader.h"
#include "planner/turbulence.h"

namespace planner {
namespace {

constexpr std::size_t kCommentWidth = 86;

// 6 significant digits: ample for fitted values, and what the round trip
// promises.
std::string Num(double x) {
  if (x == 0.0) return "0";
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.6g", x);
  return buf;
}

// A YAML double-quoted scalar.
std::string Quote(const std::string& text) {
  std::string out = "\"";
  for (const char c : text) {
    if (c == '"' || c == '\\') {
      out += '\\';
      out += c;
    } else if (c == '\n') {
      out += "\\n";
    } else if (static_cast<unsigned char>(c) < 0x20) {
      out += ' ';
    } else {
      out += c;
    }
  }
  return out + "\"";
}

std::string List(const double* values, int count, int per_line, int indent) {
  std::string out = "[";
  for (int i = 0; i < count; ++i) {
    if (i > 0) {
      out += ",";
      out += i % per_line == 0 ? "\n" + std::string(indent, ' ') : " ";
    }
    out += Num(values[i]);
  }
  return out + "]";
}

// "# " lines, wrapped at word boundaries; continuation lines indented.
void WriteComment(const std::string& text, std::ostringstream& out) {
  std::string line = "#";
  std::istringstream words(text);
  std::string word;
  bool first = true;
  while (words >> word) {
    if (!first && line.size() + 1 + word.size() > kCommentWidth) {
      out << line << "\n";
      line = "#  ";
    }
    line += " " + word;
    first = false;
  }
  out << line << "\n";
}

std::string IecClassOf(double i_ref) {
  for (const char* name : {"A+", "A", "B", "C"}) {
    if (IecReferenceIntensity(name) == i_ref) return name;
  }
  return "";
}

void WriteTurbulence(const TurbulenceModel& t, std::ostringstream& out) {
  out << "turbulence:\n";
  if (t.kind == TurbulenceModel::Kind::kIecNtm) {
    out << "  model: iec-ntm\n";
    const std::string name = IecClassOf(t.i_ref);
    if (name.empty()) {
      out << "  i_ref: " << Num(t.i_ref) << "\n";
    } else {
      out << "  class: " << Quote(name) << "\n";
    }
    out << "  persistence_h: " << Num(t.persistence_h) << "\n";
    return;
  }
  out << "  model: table\n";
  out << "  persistence_h: " << Num(t.persistence_h) << "\n";
  out << "  rows:\n";
  for (const TiTableRow& row : t.table) {
    out << "    - {wind_ms: [" << Num(row.wind_lo_ms) << ", " << Num(row.wind_hi_ms)
        << "], ti_mean_pct: " << Num(100.0 * row.ti_mean)
        << ", ti_std_pct: " << Num(100.0 * row.ti_std) << "}\n";
  }
}

std::string SectorComment(std::size_t i, std::size_t n) {
  if (n == 1) return "all directions";
  const double width = 360.0 / static_cast<double>(n);
  const double from =
      std::fmod(static_cast<double>(i) * width - 0.5 * width + 360.0, 360.0);
  return Num(from) + "-" + Num(static_cast<double>(i) * width + 0.5 * width) + " deg";
}

}  // namespace

std::string FormatSiteModelYaml(const SiteModel& site,
                                const std::vector<std::string>& comments) {
  std::ostringstream out;
  out << "# generator=fillcast " << FILLCAST_VERSION << " " << kSealPlaceholder << "\n";
  for (const std::string& c : comments) WriteComment(c, out);
  out << "\nname: " << Quote(site.name) << "\n";
  if (!site.description.empty())
    out << "description: " << Quote(site.description) << "\n";
  if (site.sectors.size() == 1) {
    out << "\n# One sector: all directions.\n";
  } else {
    out << "\n# " << site.sectors.size()
        << " sectors; the first is centred on north, then clockwise.\n";
  }
  out << "sectors:\n";
  for (std::size_t i = 0; i < site.sectors.size(); ++i) {
    const Sector& s = site.sectors[i];
    out << "  - {frequency: " << Num(s.frequency)
        << ", weibull_a_ms: " << Num(s.weibull.scale_ms)
        << ", weibull_k: " << Num(s.weibull.shape) << "}  # "
        << SectorComment(i, site.sectors.size()) << "\n";
  }
  out << "\nsector_persistence: " << Num(site.sector_persistence)
      << "   # per 10-minute step\n";
  out << "wind_persistence_h: " << Num(site.wind_persistence_h) << "\n\n";
  out << "monthly_factors: " << List(site.monthly_factors.data(), 12, 12, 17) << "\n";
  out << "hourly_factors: " << List(site.hourly_factors.data(), 24, 12, 17) << "\n";
  out << "interannual_std: " << Num(site.interannual_std) << "\n\n";
  if (site.mean_speed_uncertainty_pct > 0) {
    out << "mean_speed_uncertainty_pct: " << Num(site.mean_speed_uncertainty_pct)
        << "\n\n";
  }
  WriteTurbulence(site.turbulence, out);
  return out.str();
}

std::vector<std::string> FittedModelComments(const FitReport& report) {
  const MetReadReport& r = report.read;
  const bool with_time = r.step_s < 86400;
  std::vector<std::string> c;
  c.push_back("Fitted by fillcast fit-site from " + r.file + ".");
  std::string columns = "Columns: time '" + r.time_column + "', speed '" +
                        r.speed_column + "' (" + SpeedUnitName(r.units) + ", " +
                        r.units_source + ")";
  columns += r.std_column.empty() ? ", no standard deviation"
                                  : ", standard deviation '" + r.std_column + "'";
  columns += r.direction_column.empty() ? ", no direction."
                                        : ", direction '" + r.direction_column + "'.";
  c.push_back(columns);
  c.push_back("Data: " + FormatTimestamp(r.first_time_s, with_time) + " to " +
              FormatTimestamp(r.last_time_s, with_time) + ", step " +
              FormatStep(r.step_s) + "; " + std::to_string(r.rows_read) + " rows read, " +
              std::to_string(r.rows_kept) + " kept, " + std::to_string(r.DroppedTotal()) +
              " dropped; " + std::to_string(report.calms) + " calms (below " +
              Num(report.calm_ms) + " m/s), censored in the Weibull fit.");
  c.push_back(
      "Method (docs/fit-site.md): Weibull per sector by maximum likelihood on the speeds "
      "divided by their month and hour factors, calms as left-censored records; "
      "wind_persistence_h from the autocorrelation "
      "of the normal-transformed speeds at a lag of " +
      Num(report.persistence_lag_h) + " h.");
  for (const std::string& w : report.warnings) c.push_back("Warning: " + w);
  c.push_back(
      "Caution: a fitted site model is an estimate from the measured period, not a "
      "promise about future wind. Other years, a longer record or another height give "
      "other values; check it before planning a campaign on it.");
  return c;
}

}  // namespace planner
