// fillcast fit-site DATA.csv -o site-models/NAME.yaml: fit a site model to
// measured wind data and print how: rows kept and dropped (and why), step and
// units, each sector's Weibull with its goodness of fit, the monthly and
// hourly factors, persistence, the TI table and every warning.
#include <CLI/CLI.hpp>
#include <cstdio>
#include <filesystem>
#include <iostream>
#include <memory>
#include <sstream>
#include <string>
#include <vector>

#include "cli/commands.h"
#include "cli/output_file.h"
#include "cli/run_options.h"
#include "io/met_csv_reader.h"
#include "io/site_model_writer.h"
#include "planner/error.h"
#include "planner/plan_reader.h"
#include "planner/site_fit.h"
#include "report/cautions.h"

namespace planner {
namespace {

struct FitSiteArgs {
  std::string data_path;
  std::string output_path;
  std::string units = "auto";
  SiteFitOptions options;
  bool force = false;
};

const char* const kMonthNames[12] = {"Jan", "Feb", "Mar", "Apr", "May", "Jun",
                                     "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"};

std::string Fixed(double x, int decimals) {
  char buf[40];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, x);
  return buf;
}

std::string Pad(const std::string& s, std::size_t width, bool right = true) {
  if (s.size() >= width) return s;
  const std::string fill(width - s.size(), ' ');
  return right ? fill + s : s + fill;
}

SpeedUnit ParseUnits(const std::string& text) {
  if (text == "auto") return SpeedUnit::kAuto;
  if (text == "ms") return SpeedUnit::kMetresPerSecond;
  if (text == "knots") return SpeedUnit::kKnots;
  throw InputError("--units: '" + text + "' is invalid; expected auto, ms or knots");
}

void PrintData(const FitReport& r, std::ostream& out) {
  const MetReadReport& d = r.read;
  const bool with_time = d.step_s < 86400;
  out << "Data: " << d.file << "\n";
  out << "  columns    time '" << d.time_column << "', speed '" << d.speed_column << "'"
      << (d.std_column.empty() ? ", no standard deviation"
                               : ", standard deviation '" + d.std_column + "'")
      << (d.direction_column.empty() ? ", no direction"
                                     : ", direction '" + d.direction_column + "'")
      << "\n";
  out << "  units      " << SpeedUnitName(d.units) << " (" << d.units_source << ")"
      << (d.units == SpeedUnit::kKnots ? ", converted with 1 kn = 1852/3600 m/s" : "")
      << "\n";
  out << "  period     " << FormatTimestamp(d.first_time_s, with_time) << " to "
      << FormatTimestamp(d.last_time_s, with_time) << "\n";
  out << "  step       " << FormatStep(d.step_s)
      << " (the most common spacing of the timestamps)\n\n";
}

void PrintRows(const FitReport& r, std::ostream& out) {
  const MetReadReport& d = r.read;
  const std::size_t w = 38;
  out << "Rows\n";
  out << Pad("  read", w, false) << Pad(std::to_string(d.rows_read), 9) << "\n";
  out << Pad("  kept", w, false) << Pad(std::to_string(d.rows_kept), 9) << "\n";
  out << Pad("  dropped", w, false) << Pad(std::to_string(d.DroppedTotal()), 9) << "\n";
  for (int i = 0; i < kDropReasonCount; ++i) {
    if (d.dropped[i] == 0) continue;
    out << Pad(std::string("    ") + DropReasonText(static_cast<DropReason>(i)), w, false)
        << Pad(std::to_string(d.dropped[i]), 9) << "\n";
  }
  out << Pad("  calm (below " + Fixed(r.calm_ms, 1) + " m/s)", w, false)
      << Pad(std::to_string(r.calms), 9)
      << "   kept; censored in the Weibull fit (only 'below' is used)\n";
  out << Pad("  steps with no row", w, false) << Pad(std::to_string(d.missing_steps), 9)
      << "   in " << d.gaps << " gap" << (d.gaps == 1 ? "" : "s") << "\n";
  if (d.off_grid > 0) {
    out << Pad("  off the step grid", w, false) << Pad(std::to_string(d.off_grid), 9)
        << "   kept; the step may not be regular\n";
  }
  if (!d.std_column.empty()) {
    out << Pad("  standard deviation unusable", w, false)
        << Pad(std::to_string(d.std_unusable), 9) << "   kept; not in the TI table\n";
  }
  if (!d.examples.empty()) {
    out << "  first dropped rows of each kind:\n";
    for (const std::string& e : d.examples) out << "    " << e << "\n";
  }
  out << "\n";
}

void PrintSectors(const FitReport& r, std::ostream& out) {
  out << "Weibull per sector: maximum likelihood on the speeds divided by their month "
         "and\n"
         "hour factors; KS = Kolmogorov-Smirnov distance between data and fit\n";
  out << "  sector    from     to         n    freq       A       k    mean      KS\n";
  out << "             deg    deg                 %     m/s             m/s       %\n";
  for (std::size_t s = 0; s < r.sectors.size(); ++s) {
    const SectorFit& f = r.sectors[s];
    out << Pad(r.sectors.size() == 1 ? "all" : std::to_string(s), 8)
        << Pad(Fixed(f.from_deg, 1), 8) << Pad(Fixed(f.to_deg, 1), 7)
        << Pad(std::to_string(f.n), 10) << Pad(Fixed(100.0 * f.frequency, 1), 8)
        << Pad(Fixed(f.weibull.scale_ms, 2), 8) << Pad(Fixed(f.weibull.shape, 3), 8)
        << Pad(Fixed(f.data_mean_ms, 2), 8) << Pad(Fixed(100.0 * f.ks_distance, 1), 8)
        << "\n";
  }
  out << "  (mean: measured mean of the sector's records above the calm threshold)\n";
  out << "Mean speed: " << Fixed(r.sample_mean_ms, 2)
      << " m/s measured (all kept records), " << Fixed(r.model_mean_ms, 2)
      << " m/s from the fitted model\n\n";
}

void PrintFactors(const FitReport& r, std::ostream& out) {
  out << "Monthly factors on A (day-weighted mean 1)\n  ";
  for (const char* m : kMonthNames) out << Pad(m, 6);
  out << "\n  ";
  for (double f : r.site.monthly_factors) out << Pad(Fixed(f, 3), 6);
  out << "\n\n";
  if (!r.hourly_fitted) {
    out << "Hour-of-day factors: not fitted (step of a day or more); all 1\n\n";
    return;
  }
  out << "Hour-of-day factors on A (mean 1), hours 00 to 23\n";
  for (int row = 0; row < 2; ++row) {
    out << "  ";
    for (int h = 12 * row; h < 12 * row + 12; ++h) {
      out << Pad(Fixed(r.site.hourly_factors[h], 3), 6);
    }
    out << "\n";
  }
  out << "\n";
}

void PrintPersistence(const FitReport& r, std::ostream& out) {
  out << "Persistence\n";
  if (r.tau_fitted) {
    out << "  wind_persistence_h  " << Fixed(r.site.wind_persistence_h, 1)
        << " h   (autocorrelation " << Fixed(r.persistence_r, 3) << " of the normal-"
        << "transformed speeds at " << Fixed(r.persistence_lag_h, 2) << " h, "
        << r.persistence_pairs << " pairs)\n";
  } else {
    out << "  wind_persistence_h  " << Fixed(r.site.wind_persistence_h, 1)
        << " h   (default: too few pairs)\n";
  }
  out << "  sector_persistence  " << Fixed(r.site.sector_persistence, 4) << " per 10 min";
  if (r.sector_persistence_fitted) {
    out << "   (" << Fixed(100.0 * r.sector_stay_share, 1) << " % of " << r.sector_pairs
        << " consecutive pairs in the same sector)\n\n";
  } else {
    out << "   (default, not fitted)\n\n";
  }
}

void PrintTurbulence(const FitReport& r, std::ostream& out) {
  out << "Turbulence\n";
  if (!r.ti_from_data) {
    out << "  IEC 61400-1 normal turbulence model, I_ref "
        << Fixed(r.site.turbulence.i_ref, 2) << " (not measured)\n\n";
    return;
  }
  out << "  wind bin          n   TI mean    TI std   in table\n";
  out << "       m/s                    %         %\n";
  for (const TiBinFit& b : r.ti_bins) {
    out << Pad(Fixed(b.lo_ms, 1) + "-" + Fixed(b.hi_ms, 1), 10)
        << Pad(std::to_string(b.n), 9) << Pad(Fixed(100.0 * b.ti_mean, 1), 10)
        << Pad(Fixed(100.0 * b.ti_std, 1), 10) << (b.used ? "   yes" : "   no") << "\n";
  }
  out << "\n";
}

void PrintList(const char* title, const std::vector<std::string>& items,
               std::ostream& out) {
  if (items.empty()) return;
  out << title << "\n";
  for (const std::string& s : items) out << "  - " << s << "\n";
  out << "\n";
}

std::string FormatReport(const FitReport& r, const std::string& output_path) {
  std::ostringstream out;
  out << "Site model '" << r.site.name << "' fitted and written to " << output_path
      << "\n\n";
  PrintData(r, out);
  PrintRows(r, out);
  PrintSectors(r, out);
  PrintFactors(r, out);
  PrintPersistence(r, out);
  PrintTurbulence(r, out);
  PrintList("Warnings", r.warnings, out);
  PrintList("Notes", r.notes, out);
  std::vector<std::string> cautions = {
      "A fitted site model is an estimate from the measured period, not a promise about "
      "future wind; check it (and the warnings above) before planning on it."};
  for (const std::string& c : StandardCautions()) cautions.push_back(c);
  PrintList("Cautions", cautions, out);
  return out.str();
}

int RunFitSite(FitSiteArgs args) {
  args.options.csv.units = ParseUnits(args.units);
  if (args.options.name.empty()) {
    args.options.name = std::filesystem::path(args.output_path).stem().string();
  }
  const MetSeries series = LoadMetCsv(args.data_path, args.options.csv);
  const FitReport report = FitSite(series, args.options);
  const std::string yaml = FormatSiteModelYaml(report.site, FittedModelComments(report));
  // The file must load as a site model; a failure here is our bug, not the user's.
  try {
    ParseSiteModel(yaml, args.output_path);
  } catch (const InputError& e) {
    throw std::logic_error(std::string("fitted model does not read back: ") + e.what());
  }
  WriteOutputFile(args.output_path, yaml, args.force, {args.data_path}, "-o");
  std::cout << FormatReport(report, args.output_path);
  return kExitOk;
}

}  // namespace

CommandAction AddFitSiteCommand(CLI::App& app) {
  auto args = std::make_shared<FitSiteArgs>();
  SiteFitOptions& o = args->options;
  CLI::App* cmd = app.add_subcommand(
      "fit-site",
      "Fit a site model (Weibull per sector, seasons, persistence, TI) to measured wind "
      "data in CSV; see docs/fit-site.md");
  cmd->add_option("data", args->data_path, "Measured data (CSV with a header row)")
      ->required();
  cmd->add_option("-o,--output", args->output_path, "Site model to write (YAML)")
      ->required()
      ->type_name("PATH");
  cmd->add_option("--time", o.csv.time_column, "Timestamp column (default: a usual name)")
      ->type_name("COL");
  cmd->add_option("--speed", o.csv.speed_column, "Mean wind speed column")
      ->type_name("COL");
  cmd->add_option("--std", o.csv.std_column, "Standard deviation column (for TI)")
      ->type_name("COL");
  cmd->add_option("--direction", o.csv.direction_column, "Wind direction column, degrees")
      ->type_name("COL");
  cmd->add_option("--units", args->units, "Unit of speed and std: auto, ms or knots")
      ->capture_default_str();
  cmd->add_option("--sectors", o.sectors, "Direction sectors (1 to 72)")
      ->check(WholeNumberIn(1, 72, "a whole number from 1 to 72"))
      ->capture_default_str();
  cmd->add_option("--calm-ms", o.calm_ms, "Calm threshold, m/s")
      ->check(NumberIn(0, 3, "a speed above 0 and at most 3 m/s"))
      ->capture_default_str();
  cmd->add_option("--ti-bin-ms", o.ti_bin_ms, "Width of the TI table's wind bins, m/s")
      ->check(NumberIn(0.1, 5, "a width from 0.1 to 5 m/s"))
      ->capture_default_str();
  cmd->add_option("--ti-min-count", o.ti_min_count, "Records a TI bin needs")
      ->check(WholeNumberIn(2, 1000000000, "a whole number of at least 2"))
      ->capture_default_str();
  cmd->add_option("--ti-class", o.ti_class,
                  "IEC 61400-1 class used when there is no std column (A+, A, B, C)")
      ->capture_default_str();
  cmd->add_option("--persistence-lag-h", o.persistence_lag_h,
                  "Lag for the persistence estimate, hours")
      ->check(NumberIn(0.1, 720, "hours from 0.1 to 720"))
      ->capture_default_str();
  cmd->add_option("--name", o.name, "Site model name (default: the output file's name)");
  cmd->add_flag(
      "--force", args->force,
      "Overwrite the output if fillcast did not write it (never an input, a device or "
      "a pipe)");
  return [cmd, args]() { return cmd->parsed() ? RunFitSite(*args) : -1; };
}

}  // namespace planner
