// Everything a run needs, precomputed once per plan: lookup tables, per-day
// calendar, the matrix as flat arrays. Read-only while runs execute, so one
// instance serves all threads.
#ifndef PLANNER_SIM_COMPILED_MODEL_H_
#define PLANNER_SIM_COMPILED_MODEL_H_

#include <array>
#include <memory>
#include <cstdint>
#include <vector>

#include "planner/capture_matrix.h"
#include "planner/plan.h"
#include "planner/turbulence.h"
#include "sim/bin_lookup.h"
#include "sim/channel_groups.h"
#include "sim/curtailment_rules.h"
#include "sim/episode_process.h"
#include "sim/high_wind_shutdown.h"
#include "sim/renewal_process.h"
#include "sim/weather_process.h"

namespace planner {

// A state's grid ready for lookups. TI bins are kept as natural logs of the
// TI fraction, so a record's TI bin is found from ln TI without an exp().
struct CompiledGrid {
  bool present = false;
  BinLookup wind;
  std::vector<double> log_ti_lo, log_ti_hi;  // empty = not binned
  int ti_bins = 0;                           // their number
  std::vector<int> cell_index;
  // Per wind bin: the TI table row that holds the whole bin, -1 where TI
  // depends on the speed within the bin (TiLaw::RowOfBin).
  std::vector<int> ti_row;
  // log_ti_lo padded with +infinity to a power of two, 2 * ti_half entries.
  std::vector<double> ti_search_lo;
  int ti_half = 0;

  // TI bin of ln TI, or -1: a branch-free binary search for the last bin
  // starting at or below the value, then that bin's [lo, hi) test.
  int TiBin(double log_ti) const {
    int above = 0;
    for (int h = ti_half; h > 0; h >>= 1) above += log_ti >= ti_search_lo[above + h] ? h : 0;
    return (log_ti >= log_ti_lo[above] && log_ti < log_ti_hi[above]) ? above : -1;
  }

  // Per wind bin: the TI bins' edges on the scale of the latent TI normal x,
  // where one TI table row holds the whole wind bin (ln TI = mu + s x with
  // s > 0, so ln TI >= ln e exactly when x >= (ln e - mu) / s) and the TI bins
  // are at most kLatentBins, each starting where the one before ends. Then a
  // record's TI bin takes three comparisons and no ln TI is made.
  static constexpr int kLatentBins = 4;  // Bin below makes three comparisons
  struct LatentEdges {
    bool usable = false;
    // Starts of TI bins 1..3 (+infinity past the last bin), the first bin's
    // start and the last bin's end.
    double start[kLatentBins - 1] = {HUGE_VAL, HUGE_VAL, HUGE_VAL};
    double lo = -HUGE_VAL, hi = HUGE_VAL;
    int Bin(double x) const {
      const int t = (x >= start[0]) + (x >= start[1]) + (x >= start[2]);
      return x >= lo && x < hi ? t : -1;
    }
  };
  std::vector<LatentEdges> latent_edges;  // per wind bin
};

// TI given V: lognormal (mu, s) tabulated on a speed grid (IEC NTM) or looked
// up per row (measured table).
class TiLaw {
 public:
  TiLaw() = default;
  explicit TiLaw(const TurbulenceModel& model);
  // ln TI at speed v > 0 for the latent standard normal x.
  double LogSample(double speed_ms, double x) const {
    if (table_kind_) {
      int row = rows_ms_.Find(speed_ms);
      if (row < 0) row = NearestRow(speed_ms);
      return mu_[row] + s_[row] * x;
    }
    double g = (speed_ms > kMinSpeedMs ? speed_ms : kMinSpeedMs) * (1.0 / kStepMs);
    if (g > last_index_) g = last_index_;
    const int i = static_cast<int>(g);
    const double f = g - i;
    const double mu = mu_[i] + f * (mu_[i + 1] - mu_[i]);
    const double s = s_[i] + f * (s_[i + 1] - s_[i]);
    return mu + s * x;
  }
  // The same for a speed in a wind bin that one table row holds.
  double RowSample(int row, double x) const { return mu_[row] + s_[row] * x; }
  double RowMu(int row) const { return mu_[row]; }
  double RowSigma(int row) const { return s_[row]; }
  // The table row that holds every speed of wind_ms, else -1 (also for the
  // IEC model, whose parameters vary with the speed).
  int RowOfBin(const Bin& wind_ms) const;

 private:
  // Row nearest to a speed outside every row (as SigmaMomentsAt does).
  int NearestRow(double speed_ms) const;
  double last_index_ = 0;  // highest grid position usable for interpolation
  static constexpr double kStepMs = 0.05;
  static constexpr double kMinSpeedMs = 0.5;  // below: TI of 0.5 m/s
  bool table_kind_ = false;
  std::vector<double> mu_, s_;    // on the grid, or per row
  BinLookup rows_ms_;             // table kind only
  std::vector<Bin> row_bins_ms_;  // table kind only, for the nearest row
};

// Step intervals [from, to) during which something is out of service.
struct StepInterval {
  int64_t from = 0;
  int64_t to = 0;
};

// Event cells of one event type: wind bins -> cell index.
struct EventCells {
  BinLookup wind;
  std::vector<int> cells;
  bool manual = false;  // a manual test (scheduled), not a natural event
};

// The steps [first_step, end_step) in which a crew action may be done.
struct ActionSteps {
  int64_t first_step = 0;
  int64_t end_step = INT64_MAX;
  bool Holds(int64_t step) const { return step >= first_step && step < end_step; }
};

struct CompiledManualTest {
  int event_type = -1;  // index into CompiledModel::events
  double wind_lo_ms = 0, wind_hi_ms = 1e9;
  int64_t min_interval_steps = 0;
  ActionSteps steps;
};

struct CompiledParking {
  double wind_lo_ms = 0, wind_hi_ms = 1e9;
  int64_t park_steps = 1;  // records the park lasts
  int64_t min_interval_steps = 0;
  ActionSteps steps;
};

inline constexpr double kProbabilityScale = 65536.0;

struct CompiledModel {
  // Weather.
  SectorChain sector_chain;
  std::vector<double> sector_scale_ms;          // Weibull A per sector
  std::vector<double> sector_shape;             // Weibull k per sector
  std::vector<SpeedTransform> speed_transform;  // per sector (its k)
  std::array<double, 12> monthly_factors{};
  std::array<double, 24> hourly_factors{};
  double interannual_std = 0;
  // Per run: a lognormal factor with mean 1 and this standard deviation on
  // every A (0: none; the site model's uncertainty, or taken as exact).
  double site_mean_speed_cv = 0;
  LatentAr1 wind_ar1;
  Ar1Skipper ti_ar1;  // TI's latent series, advanced only when needed
  TiLaw ti_law;

  // Valid sector: per sector, valid direction spans as fractions [lo, hi) of
  // the sector's width (measured clockwise from its start).
  std::vector<std::vector<Bin>> sector_valid_spans;
  double sector_width_deg = 360;

  // Turbine.
  double cut_in_ms = 3, cut_out_ms = 25, restart_ms = 22;
  ShutdownTables shutdown;  // stops and restarts in high wind, storm control
  RenewalLaw turbine_outages, daq_outages;
  std::vector<StepInterval> planned_turbine, planned_daq;  // sorted, merged
  std::vector<EpisodeLaw> episodes;                        // icing and the like
  // Load-channel groups; per cell the groups it needs (bit masks), and the
  // groups every cell needs (when one of those is down no record counts).
  std::vector<ChannelGroupLaw> channel_groups;
  std::vector<uint32_t> cell_channels;
  uint32_t channels_every_cell_needs = 0;
  // Planned changes: at step `step` the counts of `cells` go back to 0.
  struct CountReset {
    int64_t step = 0;
    std::vector<int> cells;
  };
  std::vector<CountReset> count_resets;  // by step, inside the horizon
  bool parked_counts_during_outage = false;
  double quality_reject = 0;
  // The sector-keeping and quality-rejection probabilities as thresholds on
  // 16 random bits: u < p is tested as (16 bits) < round(p * 2^16), so each
  // probability is applied to the nearest 1/65,536 (docs/methods.md). One
  // 64-bit draw per step then carries both decisions and the wind speed's
  // normal innovation.
  uint32_t keep_threshold = 0;
  uint32_t reject_threshold = 0;

  CurtailmentRules curtailment;

  // Events: per event type (CaptureMatrix::event_types order) its cells.
  std::vector<EventCells> events;
  int start_up_event = -1;  // index into events, -1 if no such cells
  int normal_stop_event = -1;
  std::vector<CompiledManualTest> manual_tests;
  std::vector<CompiledParking> crew_parking;
  uint32_t crew_hour_mask = 0;            // bit h: crew on site during hour h
  // Per cell: 1 if a crew action can fill it (a manual test's event cell, or
  // a parked cell a park test can reach).
  std::vector<uint8_t> manual_test_cell;

  // Matrix.
  std::array<CompiledGrid, kOperatingStateCount> grids;
  std::vector<uint32_t> required;          // per cell
  std::vector<uint32_t> relaxed_required;  // per cell: ceil(relaxed_share x required)
  double relaxed_share = 0.8;
  std::vector<uint8_t> optional;  // per cell
  int required_cells = 0;

  // Replay of measured weather (null: the parametric weather above). The
  // plan's shared tables; day_of_year per simulated day picks the pool.
  std::shared_ptr<const WeatherReplay> replay;
  std::vector<uint16_t> day_of_year;

  // Calendar: per day from start, month index 0..11 and campaign year.
  std::vector<uint8_t> day_month;
  std::vector<uint16_t> day_year;
  std::vector<uint8_t> day_crew;  // 1 if the crew works that weekday
  int64_t deadline_steps = 0;
  int64_t horizon_steps = 0;
};

CompiledModel CompileModel(const Plan& plan, double relaxed_share = 0.8);

// Parts of CompileModel for the plan's operations (compile_operations.cc):
// planned outages, curtailment, events and manual tests, crew calendar.
void CompileOperations(const Plan& plan, CompiledModel* m);

// Bit mask of the hours 0..23 inside a window (wrapping past midnight).
uint32_t HourMask(const HourWindow& w);

}  // namespace planner

#endif  // PLANNER_SIM_COMPILED_MODEL_H_
