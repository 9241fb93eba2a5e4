#include "io/capture_matrix_reader.h"

#include <algorithm>
#include <cmath>
#include <optional>
#include <string>
#include <vector>

#include "io/event_cell_reader.h"
#include "io/plan_fields.h"

namespace planner {
namespace io {
namespace {

const std::vector<std::string> kMatrixFields = {"production", "parked", "reduced",
                                                "events"};
const std::vector<std::string> kStateFields = {"wind_bins_ms", "ti_bins_pct",
                                               "min_records", "overrides", "channels"};
const std::vector<std::string> kRangeFields = {"from", "to", "width"};
const std::vector<std::string> kOverrideFields = {"wind_ms", "ti_pct", "min_records",
                                                  "optional", "channels"};

constexpr std::size_t kMaxBins = 1000;
constexpr std::size_t kMaxGridCells = 100000;
constexpr double kMaxRecords = 1000000;
// Edges computed from {from, to, width} are rounded to this, and ranges in
// overrides are compared with it, so that 0.1-wide bins still line up.
constexpr double kEdgeResolution = 1e-9;

const char kBinForms[] =
    "give {from, to, width}, a list of edges like [3, 4, 5] or a list of [lo, hi] pairs";

Limits NonNegative(const std::string& unit) { return Interval("[)", 0, kInfinity, unit); }

double RoundEdge(double x) { return std::round(x / kEdgeResolution) * kEdgeResolution; }

// "20-21 m/s", "12-16 %", as in CellLabel.
std::string BinText(const Bin& bin, const std::string& unit) {
  return FormatNumber(bin.lo) + "-" + FormatNumber(bin.hi) + " " + unit;
}

std::vector<Bin> BinsFromRange(const Field& f, const std::string& unit) {
  const FieldMap m(f, kRangeFields);
  const double from = ReadNumber(m, "from", NonNegative(unit));
  const double to = ReadNumber(m, "to", NonNegative(unit));
  const double width = ReadNumber(m, "width", Interval("()", 0, kInfinity, unit));
  if (to <= from) {
    Fail(m.Get("to"),
         Text(m.Get("to")) + " must be above from (" + FormatNumber(from) + ")");
  }
  const double count = (to - from) / width;
  const double whole = std::round(count);
  if (std::fabs(count - whole) > 1e-6 * std::max(1.0, whole)) {
    Fail(m.Get("width"), Text(m.Get("width")) + " does not divide " + FormatNumber(from) +
                             "-" + FormatNumber(to) + " " + unit + " into whole bins");
  }
  if (whole > kMaxBins) {
    Fail(m.Get("width"), Text(m.Get("width")) + " gives " + FormatNumber(whole) +
                             " bins; at most " + std::to_string(kMaxBins) +
                             " are allowed");
  }
  const int n = static_cast<int>(whole);
  std::vector<Bin> bins;
  for (int i = 0; i < n; ++i) {
    const double hi = i + 1 == n ? to : RoundEdge(from + (i + 1) * width);
    bins.push_back(Bin{RoundEdge(from + i * width), hi});
  }
  return bins;
}

std::vector<Bin> BinsFromEdges(const Field& f, const std::vector<Field>& items,
                               const std::string& unit) {
  if (items.size() < 2) Fail(f, "gives a single edge; a bin needs two: [lo, hi]");
  std::vector<Bin> bins;
  double previous = AsNumber(items[0], NonNegative(unit));
  for (std::size_t i = 1; i < items.size(); ++i) {
    const double edge = AsNumber(items[i], NonNegative(unit));
    if (edge <= previous) {
      Fail(items[i], Text(items[i]) + " is not above the previous edge (" +
                         FormatNumber(previous) + "); edges must increase");
    }
    bins.push_back(Bin{previous, edge});
    previous = edge;
  }
  return bins;
}

std::vector<Bin> BinsFromPairs(const std::vector<Field>& items, const std::string& unit) {
  std::vector<Bin> bins;
  for (const Field& item : items) {
    const auto [lo, hi] = AsPair(item);
    const Bin bin{AsNumber(lo, NonNegative(unit)), AsNumber(hi, NonNegative(unit))};
    if (bin.hi <= bin.lo)
      Fail(item, PairText(item) + " is an empty bin; lo must be below hi");
    if (!bins.empty() && bin.lo < bins.back().hi) {
      Fail(item, PairText(item) + " overlaps or comes before the previous bin (" +
                     BinText(bins.back(), unit) +
                     "); bins must be sorted and must not overlap (gaps are allowed)");
    }
    bins.push_back(bin);
  }
  return bins;
}

std::vector<Bin> ReadBins(const Field& f, const std::string& unit) {
  if (f.node.IsMap()) return BinsFromRange(f, unit);
  if (!f.node.IsSequence()) {
    Fail(f, "expected bins, got " + Describe(f.node) + "; " + kBinForms);
  }
  const std::vector<Field> items = AsList(f);
  if (items.empty()) Fail(f, std::string("is empty; ") + kBinForms);
  const bool pairs = items[0].node.IsSequence();
  for (const Field& item : items) {
    if (item.node.IsSequence() != pairs) {
      Fail(item, "mixes edges and [lo, hi] pairs in one list; " + std::string(kBinForms));
    }
  }
  std::vector<Bin> bins =
      pairs ? BinsFromPairs(items, unit) : BinsFromEdges(f, items, unit);
  if (bins.size() > kMaxBins) {
    Fail(f, std::to_string(bins.size()) + " bins given; at most " +
                std::to_string(kMaxBins) + " are allowed");
  }
  return bins;
}

// Minimum count, optional flag and channel groups needed of every grid
// position (w * ti_count + t).
struct GridTargets {
  std::vector<int> required;
  std::vector<bool> optional;
  std::vector<uint32_t> channels;
};

std::size_t TiCount(const StateGrid& grid) {
  return std::max<std::size_t>(1, grid.ti_bins_pct.size());
}

// Indices of the bins inside the range [lo, hi] given by `range`. A bin may
// not straddle an end of the range, and at least one bin must be inside.
std::vector<std::size_t> SelectBins(const Field& range, const std::vector<Bin>& bins,
                                    const std::string& unit) {
  const auto [lo_field, hi_field] = AsPair(range);
  const double lo = AsNumber(lo_field, NonNegative(unit));
  const double hi = AsNumber(hi_field, NonNegative(unit));
  if (hi <= lo) Fail(range, PairText(range) + " is an empty range; lo must be below hi");
  std::vector<std::size_t> selected;
  for (std::size_t i = 0; i < bins.size(); ++i) {
    const bool inside =
        bins[i].lo >= lo - kEdgeResolution && bins[i].hi <= hi + kEdgeResolution;
    const bool apart =
        bins[i].hi <= lo + kEdgeResolution || bins[i].lo >= hi - kEdgeResolution;
    if (inside) selected.push_back(i);
    if (!inside && !apart) {
      Fail(range, PairText(range) + " cuts through the bin " + BinText(bins[i], unit) +
                      "; start and end the range on bin edges");
    }
  }
  if (selected.empty()) {
    Fail(range, PairText(range) + " covers no bin; the bins run from " +
                    FormatNumber(bins.front().lo) + " to " +
                    FormatNumber(bins.back().hi) + " " + unit);
  }
  return selected;
}

std::vector<std::size_t> AllIndices(std::size_t n) {
  std::vector<std::size_t> all(n);
  for (std::size_t i = 0; i < n; ++i) all[i] = i;
  return all;
}

void ApplyOverride(const Field& f, const StateGrid& grid, const Plan& plan,
                   GridTargets* targets) {
  const FieldMap m(f, kOverrideFields);
  if (!m.Has("min_records") && !m.Has("optional") && !m.Has("channels")) {
    Fail(f, "sets nothing; give min_records, optional, channels or several of them");
  }
  std::vector<std::size_t> winds = AllIndices(grid.wind_bins_ms.size());
  if (const auto w = m.Find("wind_ms")) winds = SelectBins(*w, grid.wind_bins_ms, "m/s");
  std::vector<std::size_t> tis = AllIndices(TiCount(grid));
  if (const auto t = m.Find("ti_pct")) {
    if (grid.ti_bins_pct.empty()) {
      Fail(*t, "this state has no TI bins (ti_bins_pct is not given); leave ti_pct out");
    }
    tis = SelectBins(*t, grid.ti_bins_pct, "%");
  }
  const std::optional<Field> records = m.Find("min_records");
  const std::optional<Field> optional = m.Find("optional");
  const int required =
      records ? AsWholeNumber(*records, Interval("[]", 0, kMaxRecords)) : 0;
  const bool is_optional = optional ? AsBool(*optional) : false;
  const std::optional<Field> channels = m.Find("channels");
  const uint32_t needs = channels ? ReadChannelNeeds(*channels, plan) : kAllChannels;
  for (std::size_t w : winds) {
    for (std::size_t t : tis) {
      const std::size_t position = w * TiCount(grid) + t;
      if (records) targets->required[position] = required;
      if (optional) targets->optional[position] = is_optional;
      if (channels) targets->channels[position] = needs;
    }
  }
}

// Production records (normal or reduced) exist only for cut_in <= V < cut_out,
// so a production or reduced cell wholly outside that range could never fill.
void CheckProductionRange(const Field& wind_field, const StateGrid& grid,
                          const GridTargets& targets, const TurbineSpec& turbine) {
  for (std::size_t w = 0; w < grid.wind_bins_ms.size(); ++w) {
    const Bin& bin = grid.wind_bins_ms[w];
    if (bin.hi > turbine.cut_in_ms && bin.lo < turbine.cut_out_ms) continue;
    for (std::size_t t = 0; t < TiCount(grid); ++t) {
      if (targets.required[w * TiCount(grid) + t] == 0) continue;
      Fail(wind_field, "the bin " + BinText(bin, "m/s") +
                           " lies outside turbine.cut_in_ms to cut_out_ms (" +
                           FormatNumber(turbine.cut_in_ms) + "-" +
                           FormatNumber(turbine.cut_out_ms) +
                           " m/s), so it could never fill; remove it or set its "
                           "min_records to 0");
    }
  }
}

void AppendCells(StateGrid grid, const GridTargets& targets, CaptureMatrix* matrix) {
  const std::size_t ti_count = TiCount(grid);
  grid.cell_index.assign(grid.wind_bins_ms.size() * ti_count, -1);
  for (std::size_t w = 0; w < grid.wind_bins_ms.size(); ++w) {
    for (std::size_t t = 0; t < ti_count; ++t) {
      const std::size_t position = w * ti_count + t;
      if (targets.required[position] == 0) continue;
      Cell cell;
      cell.state = grid.state;
      cell.wind_ms = grid.wind_bins_ms[w];
      cell.ti_binned = !grid.ti_bins_pct.empty();
      if (cell.ti_binned) cell.ti_pct = grid.ti_bins_pct[t];
      cell.required = targets.required[position];
      cell.optional = targets.optional[position];
      cell.channels = targets.channels[position];
      grid.cell_index[position] = static_cast<int>(matrix->cells.size());
      matrix->cells.push_back(cell);
    }
  }
  matrix->grids.push_back(std::move(grid));
}

void ReadState(const Field& f, OperatingState state, const Plan& plan,
               CaptureMatrix* matrix) {
  const FieldMap m(f, kStateFields);
  StateGrid grid;
  grid.state = state;
  const Field wind_field = m.Get("wind_bins_ms");
  grid.wind_bins_ms = ReadBins(wind_field, "m/s");
  if (const auto t = m.Find("ti_bins_pct")) grid.ti_bins_pct = ReadBins(*t, "%");
  const std::size_t positions = grid.wind_bins_ms.size() * TiCount(grid);
  if (positions > kMaxGridCells) {
    Fail(f, "has " + std::to_string(positions) + " cells; at most " +
                std::to_string(kMaxGridCells) + " are allowed");
  }
  const int default_records =
      AsWholeNumber(m.Get("min_records"), Interval("[]", 0, kMaxRecords));
  const auto channels = m.Find("channels");
  GridTargets targets{
      std::vector<int>(positions, default_records), std::vector<bool>(positions, false),
      std::vector<uint32_t>(positions,
                            channels ? ReadChannelNeeds(*channels, plan) : kAllChannels)};
  if (const auto overrides = m.Find("overrides")) {
    for (const Field& item : AsList(*overrides)) ApplyOverride(item, grid, plan, &targets);
  }
  if (state != OperatingState::kParked) {
    CheckProductionRange(wind_field, grid, targets, plan.turbine);
  }
  AppendCells(std::move(grid), targets, matrix);
}

}  // namespace

// Reduced-mode records exist only while a curtailment rule with action
// reduce holds, or under storm control.
void CheckReduceRule(const Field& f, const Plan& plan) {
  if (plan.turbine.storm_control_from_ms > 0) return;
  for (const CurtailmentRule& rule : plan.curtailment) {
    if (rule.action == CurtailmentRule::Action::kReduce) return;
  }
  Fail(f,
       "no curtailment rule has action: reduce and the turbine has no storm_control, "
       "so no record is ever in reduced mode and these cells could never fill; add "
       "such a rule or storm_control, or remove reduced");
}

CaptureMatrix ReadCaptureMatrix(const Field& f, const Plan& plan) {
  const FieldMap m(f, kMatrixFields);
  if (!m.Has("production") && !m.Has("parked") && !m.Has("reduced") && !m.Has("events")) {
    Fail(f, "has no cells; give production, parked, reduced or events");
  }
  CaptureMatrix matrix;
  if (const auto p = m.Find("production")) {
    ReadState(*p, OperatingState::kProduction, plan, &matrix);
  }
  if (const auto p = m.Find("parked"))
    ReadState(*p, OperatingState::kParked, plan, &matrix);
  if (const auto p = m.Find("reduced")) {
    CheckReduceRule(*p, plan);
    ReadState(*p, OperatingState::kReduced, plan, &matrix);
  }
  if (const auto e = m.Find("events")) ReadEventCells(*e, plan, &matrix);
  const bool any_required = std::any_of(matrix.cells.begin(), matrix.cells.end(),
                                        [](const Cell& c) { return !c.optional; });
  if (!any_required) {
    Fail(f,
         "has no required cell: every cell is optional or has min_records 0; at "
         "least one cell must hold up completion");
  }
  return matrix;
}

}  // namespace io
}  // namespace planner
