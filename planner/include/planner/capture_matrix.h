// The capture matrix: cells of operating state x wind-speed bin x TI bin, each
// with a minimum number of valid 10-minute records.
//
// Bins are [lo, hi). Bin sizes and counts are agreed per campaign with the
// certification body (IEC 61400-13 leaves them to be adapted), so they are
// always configuration. Cells are laid out per state as a grid of wind bins x
// TI bins; a state without TI bins has one TI "bin" covering everything.
#ifndef PLANNER_CAPTURE_MATRIX_H_
#define PLANNER_CAPTURE_MATRIX_H_

#include <cstdint>
#include <string>
#include <vector>

namespace planner {

// What the turbine was doing during a record.
enum class OperatingState {
  kProduction,  // available, cut-in <= V < cut-out, not stopped or curtailed
  kParked,      // parked or idling: below cut-in, above cut-out, restarting,
                // or stopped by a curtailment rule
  kReduced,     // producing in a reduced (derated) mode set by a curtailment
                // rule: not normal production
};
inline constexpr int kOperatingStateCount = 3;

// "production" / "parked" / "reduced".
const char* OperatingStateName(OperatingState s);

// Cell::channels when a cell needs every load-channel group of the plan.
inline constexpr uint32_t kAllChannels = 0xFFFFFFFFu;

struct Bin {
  double lo = 0.0;  // inclusive
  double hi = 0.0;  // exclusive
};

struct Cell {
  OperatingState state = OperatingState::kProduction;
  // -1 for a cell of 10-minute records; otherwise an event cell counting
  // events of type CaptureMatrix::event_types[event] whose wind speed lies in
  // wind_ms (state is then unused, ti_binned false).
  int event = -1;
  Bin wind_ms;
  bool ti_binned = false;  // false: any TI; ti_pct is then unused
  Bin ti_pct;              // TI bin in percent
  int required = 0;        // minimum count of valid records, >= 1
  bool optional = false;   // reported, but does not hold up completion
  // Load-channel groups the cell needs (bit g: Plan::channel_groups[g]); a
  // record counts only while they are all up. Default: every group.
  uint32_t channels = kAllChannels;
};

// Cells of one state as a grid. cell_index[w * ti_bins.size() + t] is the
// index into CaptureMatrix::cells, or -1 if that grid position has no cell
// (min_records 0).
struct StateGrid {
  OperatingState state = OperatingState::kProduction;
  std::vector<Bin> wind_bins_ms;  // sorted, non-overlapping, gaps allowed
  std::vector<Bin> ti_bins_pct;   // sorted, non-overlapping; empty = not binned
  std::vector<int> cell_index;
};

// Event types. The natural ones are fixed; manual tests are named by the plan.
inline constexpr const char* kStartUpEvent = "start_up";        // any start to production
inline constexpr const char* kNormalStopEvent = "normal_stop";  // production ends by wind
                                                                // (below cut-in, cut-out)

struct CaptureMatrix {
  std::vector<Cell> cells;       // record cells (grid order), then event cells
  std::vector<StateGrid> grids;  // at most one per state
  // Names of the event types the event cells refer to: "start_up",
  // "normal_stop", or the name of a manual test in Plan::manual_tests.
  std::vector<std::string> event_types;
};

// Index of the bin containing x, or -1. bins must be sorted, non-overlapping.
int FindBin(const std::vector<Bin>& bins, double x);

// Number of cells that hold up completion.
int RequiredCellCount(const CaptureMatrix& m);

// Human label, e.g. "production 11-12 m/s TI 12-16 %", "parked 25-26 m/s" or
// (with the matrix, for event names) "event start_up 3-5 m/s".
std::string CellLabel(const Cell& c);
std::string CellLabel(const CaptureMatrix& m, const Cell& c);

}  // namespace planner

#endif  // PLANNER_CAPTURE_MATRIX_H_
