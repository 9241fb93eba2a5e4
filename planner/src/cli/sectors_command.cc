// fillcast sectors PLAN.yaml: the valid measurement sector from the plan's
// layout (IEC 61400-12-1 Annex A): each disturbed sector with its reason, seen
// from the mast and (when the layout places it) from the turbine under test,
// the manual exclusions, what valid_sectors_deg leaves out, the valid sectors
// and the share of the site's wind (time and energy) that comes from them.
#include <CLI/CLI.hpp>
#include <algorithm>
#include <cstdio>
#include <iostream>
#include <memory>
#include <nlohmann/json.hpp>
#include <optional>
#include <sstream>
#include <string>
#include <vector>

#include "cli/commands.h"
#include "cli/output_file.h"
#include "io/file_seal.h"
#include "model/sector_share.h"
#include "planner/disturbed_sector.h"
#include "planner/plan_reader.h"
#include "report/cautions.h"

namespace planner {
namespace {

using Json = nlohmann::ordered_json;

struct SectorsArgs {
  std::string plan_path;
  std::string json_path;
  bool force = false;
};

// Everything the command shows, computed once for the text and the JSON.
struct SectorsResult {
  std::vector<DisturbedSector> from_mast;     // turbine under test, neighbours, obstacles
  std::vector<DisturbedSector> from_turbine;  // neighbours, obstacles (may be empty)
  std::vector<AngleRange> exclusions;
  std::vector<AngleRange> outside_written;  // left out by valid_sectors_deg alone
  std::vector<AngleRange> valid;
  std::vector<WindShare> valid_shares;
  WindShare total;
};

SectorsResult Compute(const Plan& plan) {
  SectorsResult r;
  const std::vector<DisturbedSector> all = DisturbedSectors(plan.layout);
  for (const DisturbedSector& s : all) {
    if (s.kind == DisturbanceKind::kExclusion) continue;
    (s.seen_from == Viewpoint::kMast ? r.from_mast : r.from_turbine).push_back(s);
  }
  r.exclusions = plan.layout.exclusions;
  r.valid = plan.valid_sectors;
  // valid = written - disturbed, so the circle minus valid minus disturbed is
  // what valid_sectors_deg removed and nothing else did.
  SiteLayout removed;
  removed.exclusions = r.valid;
  for (const DisturbedSector& s : all) removed.exclusions.push_back(s.range);
  r.outside_written = ValidSectorsFromLayout(removed, {AngleRange{0.0, 360.0}});
  for (const AngleRange& v : r.valid) {
    r.valid_shares.push_back(WindShareInSectors(plan.site, {v}));
  }
  r.total = WindShareInSectors(plan.site, r.valid);
  return r;
}

std::string Fixed(double x, int decimals) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, x);
  return buf;
}

std::string Pad(const std::string& s, std::size_t width, bool right) {
  if (s.size() >= width) return s;
  const std::string fill(width - s.size(), ' ');
  return right ? fill + s : s + fill;
}

// "  from     to  width" cells of a range, in degrees.
std::string RangeCells(const AngleRange& r) {
  return Pad(Fixed(r.from_deg, 1), 7, true) + Pad(Fixed(r.to_deg, 1), 7, true) +
         Pad(Fixed(AngleRangeWidth(r), 1), 7, true);
}

const char kRangeHeader[] = "   from     to  width";
const char kRangeUnits[] = "    deg    deg    deg";

void PrintSectorTable(const std::vector<DisturbedSector>& sectors, std::ostream& out) {
  std::size_t width = std::string("Reason").size();
  for (const DisturbedSector& s : sectors) width = std::max(width, s.reason.size());
  out << "  " << Pad("Reason", width, false) << kRangeHeader << "\n";
  out << "  " << Pad("", width, false) << kRangeUnits << "\n";
  for (const DisturbedSector& s : sectors) {
    out << "  " << Pad(s.reason, width, false);
    if (AngleRangeWidth(s.range) > 0.0) {
      out << RangeCells(s.range) << "\n";
    } else {
      out << Pad("-", 7, true) << Pad("-", 7, true) << Pad("0.0", 7, true) << "\n";
    }
    if (!s.note.empty()) out << "    note: " << s.note << "\n";
  }
}

void PrintDisturbed(const Plan& plan, const SectorsResult& r, std::ostream& out) {
  out << "Disturbed sectors (IEC 61400-12-1 Annex A: alpha = 1.3 arctan(2.5 D/L + 0.15) "
         "+ 10 deg)\n";
  const std::optional<TurbineUnderTest>& tut = plan.layout.turbine_under_test;
  if (!tut) {
    if (r.from_mast.empty()) {
      out << "  none: the plan lists no neighbouring turbine or obstacle\n\n";
      return;
    }
    PrintSectorTable(r.from_mast, out);
    out << "\n";
    return;
  }
  out << "Seen from the met mast (bearings from the mast)\n";
  PrintSectorTable(r.from_mast, out);
  out << "Seen from the turbine under test, " << tut->name << " ("
      << Fixed(tut->distance_m, 1) << " m from the mast on bearing "
      << Fixed(tut->bearing_deg, 1) << " deg)\n";
  if (r.from_turbine.empty()) {
    out << "  none: the plan lists no neighbouring turbine or obstacle\n";
  } else {
    PrintSectorTable(r.from_turbine, out);
  }
  out << "  (the turbine under test does not disturb itself; the mast is not an "
         "obstacle for it)\n\n";
}

void PrintRanges(const std::string& title, const std::vector<AngleRange>& ranges,
                 std::ostream& out) {
  if (ranges.empty()) return;
  out << title << "\n" << kRangeHeader << "\n" << kRangeUnits << "\n";
  for (const AngleRange& r : ranges) out << RangeCells(r) << "\n";
  out << "\n";
}

std::string Percent(double share) { return Fixed(100.0 * share, 1); }

void PrintValid(const SectorsResult& r, std::ostream& out) {
  out << "Valid sectors, with the share of the site's wind that comes from them\n";
  out << kRangeHeader << "   time  energy\n";
  out << kRangeUnits << "      %       %\n";
  for (std::size_t i = 0; i < r.valid.size(); ++i) {
    out << RangeCells(r.valid[i]) << Pad(Percent(r.valid_shares[i].time), 7, true)
        << Pad(Percent(r.valid_shares[i].energy), 8, true) << "\n";
  }
  double width = 0.0;
  for (const AngleRange& v : r.valid) width += AngleRangeWidth(v);
  out << Pad("  total", 14, false) << Pad(Fixed(width, 1), 7, true)
      << Pad(Percent(r.total.time), 7, true) << Pad(Percent(r.total.energy), 8, true)
      << "\n";
  out << "time: share of the 10-minute records; energy: share of the mean of V^3\n"
         "(from the site's sector frequencies and Weibulls; direction uniform within "
         "each "
         "site sector)\n\n";
}

std::string FormatText(const Plan& plan, const SectorsResult& r) {
  std::ostringstream out;
  out << "Valid measurement sector: " << plan.name << "\n";
  out << "Site model: " << plan.site.name << " (" << plan.site.sectors.size()
      << " sectors of " << Fixed(SectorWidthDeg(plan.site), 1) << " deg)\n";
  if (plan.layout.turbine_under_test) {
    out << "Bearings in degrees clockwise from north, seen from the met mast and from "
           "the turbine under test;\nthe wind comes from them. A record counts only if "
           "its direction is valid for both.\n\n";
  } else {
    out << "Bearings in degrees clockwise from north, seen from the measurement point; "
           "the wind comes from them.\n\n";
  }
  PrintDisturbed(plan, r, out);
  PrintRanges("Manual exclusions", r.exclusions, out);
  PrintRanges("Outside valid_sectors_deg", r.outside_written, out);
  PrintValid(r, out);
  out << "Cautions\n";
  for (const std::string& c : StandardCautions()) out << "  - " << c << "\n";
  return out.str();
}

Json RangeJson(const AngleRange& r) {
  return Json{
      {"from_deg", r.from_deg}, {"to_deg", r.to_deg}, {"width_deg", AngleRangeWidth(r)}};
}

std::string FormatJson(const Plan& plan, const SectorsResult& r) {
  Json j;
  j["tool"] = {{"name", "fillcast"},
               {"version", FILLCAST_VERSION},
               {"command", "sectors"},
               {"seal", kSealPlaceholder}};
  j["plan"] = {{"name", plan.name}, {"site", plan.site.name}};
  const std::optional<TurbineUnderTest>& tut = plan.layout.turbine_under_test;
  if (tut) {
    j["turbine_under_test"] = {{"name", tut->name},
                               {"bearing_from_mast_deg", tut->bearing_deg},
                               {"distance_from_mast_m", tut->distance_m},
                               {"rotor_diameter_m", tut->rotor_diameter_m}};
  } else {
    j["turbine_under_test"] = nullptr;
  }
  Json disturbed = Json::array();
  for (const std::vector<DisturbedSector>* view : {&r.from_mast, &r.from_turbine}) {
    for (const DisturbedSector& s : *view) {
      Json d = RangeJson(s.range);
      d["seen_from"] = s.seen_from == Viewpoint::kMast ? "mast" : "turbine_under_test";
      d["kind"] = s.kind == DisturbanceKind::kNeighbour  ? "neighbour"
                  : s.kind == DisturbanceKind::kObstacle ? "obstacle"
                                                         : "turbine_under_test";
      d["reason"] = s.reason;
      d["excluded"] = AngleRangeWidth(s.range) > 0.0;
      d["note"] = s.note;
      disturbed.push_back(d);
    }
  }
  j["disturbed_sectors"] = disturbed;
  j["exclusions"] = Json::array();
  for (const AngleRange& e : r.exclusions) j["exclusions"].push_back(RangeJson(e));
  j["outside_valid_sectors_deg"] = Json::array();
  for (const AngleRange& o : r.outside_written) {
    j["outside_valid_sectors_deg"].push_back(RangeJson(o));
  }
  j["valid_sectors"] = Json::array();
  double width = 0.0;
  for (std::size_t i = 0; i < r.valid.size(); ++i) {
    Json v = RangeJson(r.valid[i]);
    v["time_share"] = r.valid_shares[i].time;
    v["energy_share"] = r.valid_shares[i].energy;
    j["valid_sectors"].push_back(v);
    width += AngleRangeWidth(r.valid[i]);
  }
  j["valid_total"] = {{"width_deg", width},
                      {"time_share", r.total.time},
                      {"energy_share", r.total.energy}};
  j["cautions"] = StandardCautions();
  return j.dump(2) + "\n";
}

int RunSectors(const SectorsArgs& args) {
  const Plan plan = LoadPlan(args.plan_path);
  const SectorsResult result = Compute(plan);
  if (!args.json_path.empty()) {
    WriteOutputFile(args.json_path, FormatJson(plan, result), args.force,
                    PlanInputFiles(plan), "--json");
  }
  std::cout << FormatText(plan, result);
  return kExitOk;
}

}  // namespace

CommandAction AddSectorsCommand(CLI::App& app) {
  auto args = std::make_shared<SectorsArgs>();
  CLI::App* cmd = app.add_subcommand(
      "sectors",
      "Valid measurement sector from the plan's layout (IEC 61400-12-1 Annex A), seen "
      "from the met mast and, when the layout places it, from the turbine under test, "
      "and the share of the site's wind in it");
  cmd->add_option("plan", args->plan_path, "Campaign plan (YAML, see docs/plan.md)")
      ->required();
  cmd->add_option("--json", args->json_path, "Also write the result as JSON to PATH")
      ->type_name("PATH");
  cmd->add_flag(
      "--force", args->force,
      "Overwrite the --json file if fillcast did not write it (never an input, a "
      "device or a pipe)");
  return [cmd, args]() { return cmd->parsed() ? RunSectors(*args) : -1; };
}

}  // namespace planner
