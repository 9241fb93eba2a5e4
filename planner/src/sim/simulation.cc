#include "planner/simulation.h"

#include <algorithm>
#include <boost/math/distributions/normal.hpp>
#include <cmath>

#include "planner/calendar.h"
#include "planner/random_stream.h"
#include "sim/compiled_model.h"
#include "sim/crew_actions.h"
#include "sim/day_weather.h"
#include "sim/outage_windows.h"
#include "sim/ziggurat_normal.h"

namespace planner {
namespace {

// Streams of one run, each from (seed, run index) with its own salt so that
// changing the outage model never shifts the weather (common random numbers).
constexpr uint64_t kTurbineSalt = 0x74757262696E6531ULL;
constexpr uint64_t kDaqSalt = 0x6461712D6F757421ULL;
constexpr uint64_t kYearSalt = 0x796561722D666163ULL;
constexpr uint64_t kTiSalt = 0x74692D6C6174656EULL;
constexpr uint64_t kReplaySalt = 0x7265706C61792D62ULL;
constexpr uint64_t kShutdownSalt = 0x6869676877696E64ULL;
constexpr uint64_t kEpisodeSalt = 0x6570697365646531ULL;  // + the episode's index
constexpr uint64_t kChannelSalt = 0x6368616E6E656C31ULL;  // + the group's index
constexpr uint64_t kSiteSalt = 0x736974652D6D6F64ULL;

// Normal score z with Phi(z) = F(x) for a unit-scale Weibull of shape k:
// the inverse of SpeedTransform (Boost.Math's normal quantile).
double NormalScoreOfSpeed(double unit_speed, double shape) {
  const double upper = std::exp(-std::pow(std::max(unit_speed, 0.0), shape));  // 1 - F
  const double p = std::clamp(upper, 1e-15, 1.0 - 1e-15);
  return -boost::math::quantile(boost::math::normal_distribution<double>(), p);
}

inline bool InSpans(const std::vector<Bin>& spans, double u) {
  for (const Bin& b : spans) {
    if (u >= b.lo && u < b.hi) return true;
  }
  return false;
}

// The model's per-step limits, copied into a local of the day loop so that
// they stay in registers (stores through RunState could otherwise alias them).
struct StepLimits {
  double cut_in_ms;
  // From here up, or while stopped for high wind, the shutdown unit decides
  // (ShutdownTables::attention_ms); below it a running turbine runs on.
  double attention_ms;
  double storm_from_ms;  // reduced mode from here (storm control)
  bool parked_counts_during_outage;
};

struct RunState;

// What every step updates, kept in registers through a day and written back
// to RunState at the day's end and when the run stops.
struct DayTallies {
  explicit DayTallies(const RunState& s);
  void SaveTo(RunState& s) const;
  double speed_sum_ms;
  int64_t curtailed_steps;
  bool high_wind_stop;
};

// The mutable state of one run. Run() keeps it in a local so that the
// compiler can hold much of it in registers through the hot loop.
struct RunState {
  int sector = 0;
  double direction_u = 0;  // position within the sector, [0, 1)
  // Cached for the current direction.
  bool sector_ok = false;
  // sector_ok && records_ok (RunLoop::SetRecordable)
  bool recordable = false;
  // daq_up && !records_void, and no channel group down that every cell needs
  bool records_ok = true;
  uint32_t direction_rules = 0;  // curtailment rules whose direction holds
  double x_ti = 0;  // latent TI normal at step ti_step
  int64_t ti_step = 0;
  bool high_wind_stop = false;
  bool producing = false;  // in the previous step
  // Outage states, re-evaluated only at the steps where one may change.
  bool turbine_up = true, daq_up = true;
  bool records_void = false;  // an episode (icing) makes records invalid
  uint32_t channels_down = 0;  // load-channel groups whose records do not count
  bool recalibrating = false;  // a repaired group waits for its recalibration
  int64_t next_outage_step = 0;
  // Set once per hour.
  uint32_t hour_rules = 0;  // curtailment rules in force this month and hour
  bool crew_here = false;
  // A park test: the crew parks the turbine for the steps [park_from,
  // park_end) (INT64_MAX: none pending); crew_parked while it lasts.
  bool crew_parked = false;
  int64_t park_from = INT64_MAX, park_end = INT64_MAX;
  int remaining = 0;   // required cells not yet full
  int tests_open = 0;  // manual-test cells not yet full
  // First step at which the loop must look at the deadline, the horizon or a
  // completed matrix.
  int64_t checkpoint = 0;
  // The first step at which a checkpoint, an outage change or a new direction
  // is due: one comparison per step for all three (RunLoop::OnEvents).
  int64_t next_event = 0;
  // Diagnostics. The time shares are summed per interval, when the outage
  // states or the direction change (and at the end), not per step.
  int64_t turbine_up_steps = 0, daq_up_steps = 0, valid_sector_steps = 0;
  int64_t channels_up_steps = 0;
  int64_t channels_since = 0;  // first step of the current channel states
  int64_t outages_since = 0;    // first step of the current outage states
  int64_t direction_since = 0;  // first step of the current direction
  int64_t curtailed_steps = 0;
  double speed_sum_ms = 0;
};

DayTallies::DayTallies(const RunState& s)
    : speed_sum_ms(s.speed_sum_ms),
      curtailed_steps(s.curtailed_steps),
      high_wind_stop(s.high_wind_stop) {}

void DayTallies::SaveTo(RunState& s) const {
  s.speed_sum_ms = speed_sum_ms;
  s.curtailed_steps = curtailed_steps;
  s.high_wind_stop = high_wind_stop;
}

class RunLoop {
 public:
  RunLoop(const CompiledModel& m, uint64_t seed, uint64_t run, RunResult* out)
      : m_(m),
        seed_(seed),
        run_(run),
        ti_engine_(MakeRunEngine(seed ^ kTiSalt, run)),
        turbine_engine_(MakeRunEngine(seed ^ kTurbineSalt, run)),
        daq_engine_(MakeRunEngine(seed ^ kDaqSalt, run)),
        turbine_(m.turbine_outages, &turbine_engine_, m.day_month.data(),
                 static_cast<int64_t>(m.day_month.size())),
        daq_(m.daq_outages, &daq_engine_, m.day_month.data(),
             static_cast<int64_t>(m.day_month.size())),
        planned_turbine_(m.planned_turbine),
        planned_daq_(m.planned_daq),
        shutdown_(m.shutdown, MakeRunEngine(seed ^ kShutdownSalt, run)),
        channels_(m.channel_groups, ChannelEngines(m, seed, run), m.day_month.data(),
                  static_cast<int64_t>(m.day_month.size())),
        crew_(m),
        out_(out) {
    for (size_t e = 0; e < m.episodes.size(); ++e) {
      episodes_.emplace_back(m.episodes[e], MakeRunEngine(seed ^ (kEpisodeSalt + e), run),
                             m.day_month.data(),
                             static_cast<int64_t>(m.day_month.size()));
    }
  }

  // state: continue a running campaign (null = from the plan's start).
  void Run(const CampaignState* state);

 public:
  std::vector<TracedRecord>* trace_ = nullptr;  // tests only: every record

 private:
  // kExtras: the plan has load-channel groups or park tests (the loop's
  // checks for them are compiled out otherwise, docs/performance.md).
  template <bool kTrace, bool kReplay, bool kExtras>
  void RunSteps(int64_t first_day, int64_t step, RunState& s, WeatherState& ws,
                Engine& weather);
  bool OnEvents(int64_t step, int64_t day_step, const DirectionChange*& change,
                RunState& s);
  void ApplyState(const CampaignState& state, int64_t start_step, RunState& s,
                  WeatherState& ws);
  void Trace(int64_t step, double speed_ms, int state, bool quality_ok, bool manual_test,
             int cell, const RunState& s);
  double TiNormal() {
    if (ti_next_ == kTiBuffer) RefillTiNormals();
    return ti_normals_[ti_next_++];
  }
  void RefillTiNormals();

  double traced_ti_ = 0;
  int64_t traced_ti_step_ = -1;
  int traced_event_type_ = -1, traced_event_cell_ = -1;
  void SetDirection(int sector, double direction_u, int64_t step, RunState& s) const;
  RunState Start(uint64_t direction_bits);
  void DrawYearFactors();
  template <bool kTrace, bool kReplay, bool kExtras>
  void Step(int64_t step, int k, const DayWeather& w, const StepLimits& lim,
            DayTallies& day, RunState& s);
  template <bool kReplay, bool kExtras>
  int Stretch(int k, int end, int64_t day_step, const DayWeather& w,
              const StepLimits& lim, DayTallies& day, RunState& s);
  template <bool kCounting, bool kReplay, bool kExtras>
  int PlainStretch(int k, int end, int64_t day_step, const DayWeather& w,
                   const StepLimits& lim, DayTallies& day, RunState& s,
                   bool* transition);
  void UpdateOutages(int64_t step, RunState& s);
  // After an outage, episode or channel state changed.
  void SetRecordable(RunState& s) const {
    s.records_ok = s.daq_up && !s.records_void &&
                   (s.channels_down & m_.channels_every_cell_needs) == 0;
    s.recordable = s.sector_ok && s.records_ok;
  }
  // Whether the channel groups `cell` needs are up.
  bool ChannelsUp(int cell, const RunState& s) const {
    return (s.channels_down & m_.cell_channels[cell]) == 0;
  }
  void SetChannels(int64_t step, RunState& s);
  void ObserveChannels(double speed_ms, int64_t step, RunState& s);
  static std::vector<Engine> ChannelEngines(const CompiledModel& m, uint64_t seed,
                                            uint64_t run) {
    std::vector<Engine> engines;
    for (size_t g = 0; g < m.channel_groups.size(); ++g)
      engines.push_back(MakeRunEngine(seed ^ (kChannelSalt + g), run));
    return engines;
  }
  bool HighWind(bool was_stopped, double speed_ms, bool may_run, int64_t step,
                const DayWeather& w, int k, RunState& s);
  double RecordLogTi(double speed_ms, int64_t step, const DayWeather& w, int k,
                     RunState& s);
  void OnTransition(bool producing, double speed_ms, bool valid, int64_t step,
                    RunState& s);
  // What TryManualTest did: nothing; a manual test in this record (a
  // transient, not a production record); or a park test that starts with the
  // next record (this one counts as usual).
  enum CrewOutcome : int { kNoAction = 0, kTestRecord = 1, kParkNext = 2 };
  int TryManualTest(double speed_ms, bool valid, int64_t step, RunState& s);
  int CountEvent(int type, double speed_ms, int64_t step, RunState& s);
  template <bool kReplay>
  int CellOf(int state, double speed_ms, const DayWeather& weather, int k,
             int64_t step, RunState& s);
  bool Count(int cell, int64_t step, RunState& s);
  uint32_t NextMark(int cell, uint32_t n) const;
  void ReachMark(int cell, int64_t step, RunState& s);
  void Stop(int64_t steps, const RunState& s);
  int64_t NextCheckpoint(int64_t step, int remaining);
  void ApplyResets(int64_t step, RunState& s);
  size_t next_reset_ = 0;  // the first planned change not yet applied

  // The TI stream's normals, drawn kTiBuffer at a time ahead of use (the same
  // sequence as one at a time; the engine's state then stays out of the loop).
  static constexpr int kTiBuffer = 64;
  uint32_t* counts_ = nullptr;      // out_->count_at_end's data
  std::vector<uint32_t> next_mark_;  // per cell, see Count
  double ti_normals_[kTiBuffer];
  int ti_next_ = kTiBuffer;

  const CompiledModel& m_;
  uint64_t seed_, run_;
  Engine ti_engine_;  // TI's latent series draws only where a record needs it
  Engine turbine_engine_, daq_engine_;
  RenewalProcess turbine_, daq_;
  OutageWindows planned_turbine_, planned_daq_;
  HighWindShutdown shutdown_;
  std::vector<EpisodeProcess> episodes_;
  ChannelGroups channels_;
  CrewActions crew_;
  ZigguratNormal normal_;
  RunResult* out_;
  std::vector<double> year_factor_;  // per campaign year
  bool deadline_passed_ = false;
  int64_t first_step_ = 0;  // no production start or stop is counted in it
};

// direction_bits is the weather stream's first draw. (The engines stay out of
// every out-of-line call so that they can live in registers.)
RunState RunLoop::Start(uint64_t direction_bits) {
  const size_t cells = m_.required.size();
  out_->count_at_deadline.assign(cells, 0);
  out_->count_at_end.assign(cells, 0);
  out_->full_step.assign(cells, -1);
  out_->relaxed_full_step.assign(cells, -1);
  out_->completion_step = -1;
  out_->last_cell = -1;
  out_->simulated_steps = 0;
  counts_ = out_->count_at_end.data();
  next_mark_.resize(cells);
  for (size_t c = 0; c < cells; ++c) next_mark_[c] = NextMark(static_cast<int>(c), 0);
  // Start in the stationary distribution of direction and speed.
  RunState s;
  SetDirection(m_.sector_chain.frequencies.Draw(HighUniform(direction_bits)),
               LowUniform(direction_bits), 0, s);
  s.x_ti = TiNormal();
  s.remaining = m_.required_cells;
  s.tests_open = static_cast<int>(
      std::count(m_.manual_test_cell.begin(), m_.manual_test_cell.end(), 1));
  DrawYearFactors();
  return s;
}

void RunLoop::RefillTiNormals() {
  Engine e = ti_engine_;
  for (double& x : ti_normals_) x = normal_(e);
  ti_engine_ = e;
  ti_next_ = 0;
}

// A cell's count goes up by one. Only when it reaches the cell's next mark
// (its relaxed or its full minimum) is there more to do; true then (what is
// due may have changed: a completed matrix stops the run).
inline bool RunLoop::Count(int cell, int64_t step, RunState& s) {
  if (++counts_[cell] != next_mark_[cell]) return false;
  ReachMark(cell, step, s);
  return true;
}

// The next count of `cell` above n at which something happens (0: none; a
// count after an increment is never 0).
uint32_t RunLoop::NextMark(int cell, uint32_t n) const {
  uint32_t mark = 0;
  for (const uint32_t m : {m_.relaxed_required[cell], m_.required[cell]})
    if (m > n && (mark == 0 || m < mark)) mark = m;
  return mark;
}

[[gnu::noinline, gnu::cold]] void RunLoop::ReachMark(int cell, int64_t step,
                                                     RunState& s) {
  const uint32_t n = counts_[cell];
  next_mark_[cell] = NextMark(cell, n);
  if (n == m_.relaxed_required[cell]) out_->relaxed_full_step[cell] = step + 1;
  if (n != m_.required[cell]) return;
  out_->full_step[cell] = step + 1;
  s.tests_open -= m_.manual_test_cell[cell];
  if (m_.optional[cell]) return;
  if (--s.remaining == 0) {
    out_->completion_step = step + 1;
    out_->last_cell = cell;
    s.checkpoint = s.next_event = step + 1;
  }
}

template <bool kReplay>
inline int RunLoop::CellOf(int state, double speed_ms, const DayWeather& weather,
                           int k, int64_t step, RunState& s) {
  const CompiledGrid& g = m_.grids[state];
  if (!g.present) return -1;
  const int w = g.wind.Find(speed_ms);
  if (w < 0) return -1;
  const int ti_bins = g.ti_bins;
  if (ti_bins == 0) return g.cell_index[w];
  s.x_ti = m_.ti_ar1.Advance(s.x_ti, step - s.ti_step, TiNormal());
  s.ti_step = step;
  // The latent-edge path returns early, before the general one. (Merging the
  // two through a shared ln TI helper measured 169 to 179 instructions per
  // step against 167: the compiler then keeps less of the loop in registers.)
  if (!kReplay || std::isnan(weather.measured_log_ti[k])) {
    if (const CompiledGrid::LatentEdges& e = g.latent_edges[w]; e.usable) {
      if (trace_ != nullptr) {
        traced_ti_ = std::exp(m_.ti_law.RowSample(g.ti_row[w], s.x_ti));
        traced_ti_step_ = step;
      }
      const int t = e.Bin(s.x_ti);
      return t < 0 ? -1 : g.cell_index[w * ti_bins + t];
    }
  }
  const int row = g.ti_row[w];
  const double measured = kReplay ? weather.measured_log_ti[k] : NAN;
  const double log_ti = !std::isnan(measured) ? measured
                        : row >= 0 ? m_.ti_law.RowSample(row, s.x_ti)
                                   : m_.ti_law.LogSample(speed_ms, s.x_ti);
  if (trace_ != nullptr) traced_ti_ = std::exp(log_ti), traced_ti_step_ = step;
  const int t = g.TiBin(log_ti);
  return t < 0 ? -1 : g.cell_index[w * ti_bins + t];
}

// The direction from `step` on.
inline void RunLoop::SetDirection(int sector, double direction_u, int64_t step,
                                  RunState& s) const {
  if (s.sector_ok) s.valid_sector_steps += step - s.direction_since;
  s.direction_since = step;
  s.sector = sector;
  s.direction_u = direction_u;
  s.sector_ok = InSpans(m_.sector_valid_spans[s.sector], s.direction_u);
  s.recordable = s.sector_ok && s.records_ok;
  if (!m_.curtailment.empty()) {
    s.direction_rules = m_.curtailment.ForDirection((s.sector - 0.5 + s.direction_u) *
                                                    m_.sector_width_deg);
  }
}

// The outage states from `step` on.
[[gnu::noinline, gnu::cold]] void RunLoop::UpdateOutages(int64_t step, RunState& s) {
  if (s.turbine_up) s.turbine_up_steps += step - s.outages_since;
  if (s.daq_up) s.daq_up_steps += step - s.outages_since;
  s.outages_since = step;
  // (Every process is asked, so that each one's next change step is current.)
  const bool turbine_random_up = turbine_.UpAt(step);
  const bool daq_random_up = daq_.UpAt(step);
  const bool turbine_planned_out = planned_turbine_.InAt(step);
  const bool daq_planned_out = planned_daq_.InAt(step);
  s.turbine_up = turbine_random_up && !turbine_planned_out;
  s.daq_up = daq_random_up && !daq_planned_out;
  s.next_outage_step =
      std::min({turbine_.NextChangeStep(), daq_.NextChangeStep(),
                planned_turbine_.NextChangeStep(), planned_daq_.NextChangeStep()});
  s.records_void = false;
  for (EpisodeProcess& e : episodes_) {
    if (e.InAt(step)) {
      s.turbine_up = s.turbine_up && !e.law().stops_turbine;
      s.records_void = s.records_void || e.law().invalidates_records;
    }
    s.next_outage_step = std::min(s.next_outage_step, e.NextChangeStep());
  }
  if (!m_.channel_groups.empty()) {
    channels_.UpdateAt(step);
    s.next_outage_step = std::min(s.next_outage_step, channels_.NextChangeStep());
    SetChannels(step, s);
  }
  if (step >= s.park_from) {  // a park test starts or ends
    s.crew_parked = step < s.park_end;
    if (!s.crew_parked) s.park_from = s.park_end = INT64_MAX;
  }
  s.next_outage_step =
      std::min(s.next_outage_step, s.crew_parked ? s.park_end : s.park_from);
  SetRecordable(s);
}

// The channel groups' states from `step` on.
void RunLoop::SetChannels(int64_t step, RunState& s) {
  if (s.channels_down == 0) s.channels_up_steps += step - s.channels_since;
  s.channels_since = step;
  s.channels_down = channels_.down();
  s.recalibrating = channels_.recalibrating();
}

// A record while a repaired channel group waits for its recalibration: once
// the record ends, a group whose conditions have held long enough counts
// again, from the next step on (which is then looked at anew).
[[gnu::noinline, gnu::cold]] void RunLoop::ObserveChannels(double speed_ms, int64_t step,
                                                           RunState& s) {
  if (!channels_.Observe(speed_ms, s.crew_here)) return;
  SetChannels(step + 1, s);
  SetRecordable(s);
  s.next_event = std::min(s.next_event, step + 1);
}

// The shutdown unit's answer for a record at or above its attention speed or
// while the turbine is stopped; the record's TI is drawn (from the TI
// process) only where a short-term rule could stop it. Only Step asks, once
// per record (PlainStretch hands such records to it).
[[gnu::noinline, gnu::cold]] bool RunLoop::HighWind(bool was_stopped, double speed_ms,
                                                    bool may_run, int64_t step,
                                                    const DayWeather& w, int k,
                                                    RunState& s) {
  const double log_ti = shutdown_.MayTrip(was_stopped, speed_ms, may_run)
                            ? RecordLogTi(speed_ms, step, w, k, s)
                            : 0.0;
  return shutdown_.Next(was_stopped, speed_ms, may_run, log_ti);
}

// The record's ln TI. The TI process is advanced to this step, so that the
// record's cell (CellOf, same step) has the same TI: its advance by zero
// steps keeps the value.
double RunLoop::RecordLogTi(double speed_ms, int64_t step, const DayWeather& w, int k,
                            RunState& s) {
  s.x_ti = m_.ti_ar1.Advance(s.x_ti, step - s.ti_step, TiNormal());
  s.ti_step = step;
  const double measured = m_.replay != nullptr ? w.measured_log_ti[k] : NAN;
  const double log_ti =
      std::isnan(measured) ? m_.ti_law.LogSample(speed_ms, s.x_ti) : measured;
  if (trace_ != nullptr) traced_ti_ = std::exp(log_ti), traced_ti_step_ = step;
  return log_ti;
}

// Returns the event cell counted, -1 if none.
inline int RunLoop::CountEvent(int type, double speed_ms, int64_t step, RunState& s) {
  const EventCells& e = m_.events[type];
  const int i = e.wind.Find(speed_ms);
  if (i < 0 || !ChannelsUp(e.cells[i], s)) return -1;
  Count(e.cells[i], step, s);
  return e.cells[i];
}

// Production started or ended. A start is a start-up whatever stopped the
// turbine before; an end is a normal stop unless a fault took the turbine out.
[[gnu::noinline, gnu::cold]] void RunLoop::OnTransition(bool producing, double speed_ms,
                                                        bool valid, int64_t step,
                                                        RunState& s) {
  if (step != first_step_) {
    const int type =
        producing ? m_.start_up_event : (s.turbine_up ? m_.normal_stop_event : -1);
    const int cell = type >= 0 && valid ? CountEvent(type, speed_ms, step, s) : -1;
    if (trace_ != nullptr) traced_event_type_ = type, traced_event_cell_ = cell;
  }
  s.producing = producing;
}

// The crew is on site, the turbine produces normally and the record would be
// valid but for the quality check: the crew unit (sim/crew_actions.h) says
// whether a manual test is done in this record or a park test starts with
// the next one.
[[gnu::noinline, gnu::cold]] int RunLoop::TryManualTest(double speed_ms, bool valid,
                                                        int64_t step, RunState& s) {
  if (s.park_from != INT64_MAX) return kNoAction;  // a park is pending or on
  const CrewAction a = crew_.Next(speed_ms, step, counts_);
  if (a.kind == CrewAction::Kind::kPark) {
    // (The park starts and ends as the outage states change: UpdateOutages.)
    s.park_from = step + 1;
    s.park_end = step + 1 + a.park_steps;
    s.next_outage_step = std::min(s.next_outage_step, s.park_from);
    s.next_event = std::min(s.next_event, s.park_from);
    return kParkNext;
  }
  if (a.kind != CrewAction::Kind::kTest) return kNoAction;
  const bool counts = valid && ChannelsUp(a.cell, s);
  if (counts) Count(a.cell, step, s);
  if (trace_ != nullptr)
    traced_event_type_ = a.event_type, traced_event_cell_ = counts ? a.cell : -1;
  s.producing = false;  // the test stopped the turbine: next comes a start-up
  return kTestRecord;
}

// One 10-minute record: the turbine's state and what the record counts, from
// the day's weather (FillWeather / FillReplay).
template <bool kTrace, bool kReplay, bool kExtras>
inline void RunLoop::Step(int64_t step, int k, const DayWeather& w, const StepLimits& lim,
                          DayTallies& day, RunState& s) {
  const double speed = w.speed_ms[k];
  day.speed_sum_ms += speed;

  Curtail curtail = kNotCurtailed;
  if (const uint32_t rules = s.hour_rules & s.direction_rules; rules != 0) {
    curtail = m_.curtailment.At(speed, rules);
    day.curtailed_steps += curtail != kNotCurtailed;
  }
  if constexpr (kExtras) {
    if (s.crew_parked) curtail = kStop;
  }
  if (speed >= lim.attention_ms || day.high_wind_stop) {
    day.high_wind_stop = HighWind(day.high_wind_stop, speed,
                                  s.turbine_up && curtail != kStop, step, w, k, s);
  }
  const bool producing =
      s.turbine_up && !day.high_wind_stop && speed >= lim.cut_in_ms && curtail != kStop;
  const bool quality_ok = w.quality_ok[k];
  const bool transition = producing != s.producing;
  if (transition) OnTransition(producing, speed, s.recordable && quality_ok, step, s);
  const int state =
      producing ? (curtail == kReduce || speed >= lim.storm_from_ms ? 2 : 0) : 1;
  int cell = -1;
  if (s.recordable) {
    // (Not in the record in which production started: a test waits for the
    // next one, so that a record carries at most one event.)
    if (s.tests_open > 0 && s.crew_here && producing && !transition &&
        state == 0 && TryManualTest(speed, quality_ok, step, s) == kTestRecord) {
      // A test record is a transient, not a production record.
      if constexpr (kTrace) Trace(step, speed, state, quality_ok, true, -1, s);
      if constexpr (kExtras) {
        if (s.recalibrating) ObserveChannels(speed, step, s);
      }
      return;
    }
    if (quality_ok && (producing || s.turbine_up || lim.parked_counts_during_outage)) {
      cell = CellOf<kReplay>(state, speed, w, k, step, s);
      if constexpr (kExtras) {
        if (cell >= 0 && s.channels_down != 0 && !ChannelsUp(cell, s)) cell = -1;
      }
      if (cell >= 0) Count(cell, step, s);
    }
  }
  if constexpr (kTrace) Trace(step, speed, state, quality_ok, false, cell, s);
  if constexpr (kExtras) {
    if (s.recalibrating) ObserveChannels(speed, step, s);
  }
}

void RunLoop::Trace(int64_t step, double speed_ms, int state, bool quality_ok,
                    bool manual_test, int cell, const RunState& s) {
  TracedRecord t;
  t.step = step;
  t.speed_ms = speed_ms;
  t.direction_deg =
      std::fmod((s.sector - 0.5 + s.direction_u) * m_.sector_width_deg + 360.0, 360.0);
  t.ti = s.ti_step == step && traced_ti_step_ == step ? traced_ti_ : NAN;
  t.state = static_cast<OperatingState>(state);
  t.turbine_up = s.turbine_up;
  t.daq_up = s.daq_up;
  t.channels_down = s.channels_down;
  t.sector_ok = s.sector_ok;
  t.quality_ok = quality_ok;
  t.valid = s.recordable && quality_ok;
  t.manual_test = manual_test;
  t.cell = cell;
  t.event_type = traced_event_type_;
  t.event_cell = traced_event_cell_;
  traced_event_type_ = traced_event_cell_ = -1;
  trace_->push_back(t);
}

// One lognormal factor with mean 1 and standard deviation interannual_std per
// campaign year, from its own stream.
// Times the site model's uncertainty: one lognormal factor with mean 1 and
// standard deviation site_mean_speed_cv for the whole run, from a stream of
// its own (the weather and the year factors stay as they were).
void RunLoop::DrawYearFactors() {
  const size_t years = m_.day_year.empty() ? 1 : m_.day_year.back() + 1;
  year_factor_.assign(years, 1.0);
  const auto lognormal = [this](Engine& e, double cv) {
    const double s = std::sqrt(std::log1p(cv * cv));
    return std::exp(-0.5 * s * s + s * normal_(e));
  };
  if (m_.interannual_std > 0.0) {
    Engine e = MakeRunEngine(seed_ ^ kYearSalt, run_);
    for (double& f : year_factor_) f = lognormal(e, m_.interannual_std);
  }
  if (m_.site_mean_speed_cv > 0.0) {
    Engine e = MakeRunEngine(seed_ ^ kSiteSalt, run_);
    const double site = lognormal(e, m_.site_mean_speed_cv);
    for (double& f : year_factor_) f *= site;
  }
}

// Counts so far, cells already full, and the weather started from the latest
// logged wind: its sector and position in it, and the normal score of its
// speed under that sector's Weibull scaled as on the evening before.
void RunLoop::ApplyState(const CampaignState& state, int64_t start_step, RunState& s,
                         WeatherState& ws) {
  s.ti_step = start_step;
  for (size_t c = 0; c < state.counts.size() && c < m_.required.size(); ++c) {
    const uint32_t n = state.counts[c];
    out_->count_at_end[c] = n;
    next_mark_[c] = NextMark(static_cast<int>(c), n);
    if (n >= m_.relaxed_required[c]) out_->relaxed_full_step[c] = start_step;
    if (n < m_.required[c]) continue;
    out_->full_step[c] = start_step;
    s.tests_open -= m_.manual_test_cell[c];
    if (!m_.optional[c]) --s.remaining;
  }
  if (s.remaining == 0) out_->completion_step = start_step;
  if (start_step > m_.deadline_steps) {
    out_->count_at_deadline = out_->count_at_end;  // the deadline has passed
    deadline_passed_ = true;
  }
  if (!state.has_last_wind || m_.replay) return;
  const DirectionChange d = DirectionOfDegrees(m_, state.last_direction_deg);
  SetDirection(d.sector, d.direction_u, start_step, s);
  const int64_t day = std::max<int64_t>(0, start_step / kStepsPerDay - 1);
  const double scale = m_.sector_scale_ms[d.sector] *
                       m_.monthly_factors[m_.day_month[day]] *
                       year_factor_[m_.day_year[day]] * m_.hourly_factors[23];
  ws.z = NormalScoreOfSpeed(state.last_speed_ms / scale, m_.sector_shape[d.sector]);
}

void RunLoop::Run(const CampaignState* state) {
  Engine weather = MakeRunEngine(seed_, run_);
  const uint64_t direction_bits = weather();
  WeatherState ws;
  ws.z = normal_(weather);
  RunState s = Start(direction_bits);
  const int64_t first_day = state != nullptr ? state->elapsed_days : 0;
  const int64_t step = first_day * kStepsPerDay;
  first_step_ = step;
  // (Changes before a continued campaign's start are in its logged counts.)
  while (next_reset_ < m_.count_resets.size() && m_.count_resets[next_reset_].step < step)
    ++next_reset_;
  s.direction_since = s.outages_since = s.channels_since = step;
  if (state != nullptr) ApplyState(*state, step, s, ws);
  ws.sector_scale_ms = m_.sector_scale_ms[s.sector];
  ws.transform = &m_.speed_transform[s.sector];
  s.checkpoint = step;
  const bool replay = m_.replay != nullptr;
  const bool extras = !m_.channel_groups.empty() || !m_.crew_parking.empty();
  if (trace_ != nullptr) {
    replay ? RunSteps<true, true, true>(first_day, step, s, ws, weather)
           : RunSteps<true, false, true>(first_day, step, s, ws, weather);
  } else if (extras) {
    replay ? RunSteps<false, true, true>(first_day, step, s, ws, weather)
           : RunSteps<false, false, true>(first_day, step, s, ws, weather);
  } else {
    replay ? RunSteps<false, true, false>(first_day, step, s, ws, weather)
           : RunSteps<false, false, false>(first_day, step, s, ws, weather);
  }
}

// Steps [k, end) of a plain stretch: no curtailment rule is in force and the
// turbine's, the data acquisition's and the direction's states hold (they
// change only at events). With kCounting the turbine and data acquisition are
// up and the direction is valid, so every record goes to the production or
// parked grid as the wind and the cut-out hysteresis say (or is a manual
// test); without it no record can count (acquisition down or direction not
// valid, or the turbine down with parked records not counted) and only the
// turbine's state is followed. Either way this loop carries less state than
// Step. Returns the first step not done: end, or a step at which production
// starts or stops (for Step to do; *transition is then true), or the step
// after a manual test or a cell reaching a mark (so that what is due is
// looked at again).
template <bool kCounting, bool kReplay, bool kExtras>
int RunLoop::PlainStretch(int k, int end, int64_t day_step, const DayWeather& w,
                          const StepLimits& lim, DayTallies& day, RunState& s,
                          bool* transition) {
  *transition = false;
  double speed_sum_ms = day.speed_sum_ms;
  const bool high_wind_stop = day.high_wind_stop;
  const bool producing_before = s.producing;
  const bool turbine_up = s.turbine_up;
  const bool tests_possible = kCounting && s.crew_here && s.tests_open > 0;
  for (; k < end; ++k) {
    const double speed = w.speed_ms[k];
    // (High wind, storm control or a stopped turbine: the full step decides.)
    const bool producing = turbine_up && speed >= lim.cut_in_ms;
    if (producing != producing_before || speed >= lim.attention_ms || high_wind_stop) {
      *transition = true;
      break;
    }
    if constexpr (kCounting && kExtras) {
      // A test record is done. Before a park test this record is worked
      // again as usual (the crew unit, with the park pending, does nothing
      // then) and the stretch ends there.
      if (tests_possible && producing) {
        if (const int crew = TryManualTest(speed, w.quality_ok[k], day_step + k, s)) {
          if (crew == kTestRecord) speed_sum_ms += speed, ++k;
          break;
        }
      }
    }
    speed_sum_ms += speed;
    if constexpr (kCounting) {
      const int64_t step = day_step + k;
      if constexpr (!kExtras) {  // (no park tests: a crew action is a test record)
        if (tests_possible && producing && TryManualTest(speed, w.quality_ok[k], step, s)) {
          ++k;
          break;
        }
      }
      if (!w.quality_ok[k]) continue;
      const int cell = CellOf<kReplay>(producing ? 0 : 1, speed, w, k, step, s);
      if (cell >= 0 && Count(cell, step, s)) {
        ++k;
        break;
      }
    }
  }
  day.speed_sum_ms = speed_sum_ms;
  return k;
}

// Steps from k of a stretch without a curtailment rule in force, up to end
// (where the crew's presence or the rules change, or something is due): the
// plain loop that fits the outage and direction states, then the full step
// where it stopped at a production start or stop. Returns the next step.
template <bool kReplay, bool kExtras>
int RunLoop::Stretch(int k, int end, int64_t day_step, const DayWeather& w,
                     const StepLimits& lim, DayTallies& day, RunState& s) {
  bool transition = false;
  if (s.recordable && s.turbine_up && (!kExtras || s.channels_down == 0)) {
    k = PlainStretch<true, kReplay, kExtras>(k, end, day_step, w, lim, day, s, &transition);
  } else if ((!kExtras || !s.recalibrating) &&
             (!s.recordable || (!s.turbine_up && !lim.parked_counts_during_outage))) {
    k = PlainStretch<false, kReplay, kExtras>(k, end, day_step, w, lim, day, s,
                                              &transition);
  } else {
    // The full steps: the turbine down with parked records counted, a channel
    // group down that some cells do not need, or one waiting for its
    // recalibration (until something is due: a count may complete the matrix)
    for (; k < end && day_step + k < s.next_event; ++k)
      Step<false, kReplay, kExtras>(day_step + k, k, w, lim, day, s);
  }
  if (transition) {  // a production start or stop: the full step
    Step<false, kReplay, kExtras>(day_step + k, k, w, lim, day, s);
    ++k;
  }
  return k;
}

template <bool kTrace, bool kReplay, bool kExtras>
void RunLoop::RunSteps(int64_t first_day, int64_t step, RunState& s, WeatherState& ws,
                       Engine& weather) {
  const int64_t days = static_cast<int64_t>(m_.day_month.size());
  Engine blocks = MakeRunEngine(seed_ ^ kReplaySalt, run_);
  DayWeather w;
  const StepLimits lim{m_.cut_in_ms, m_.shutdown.attention_ms(),
                       m_.shutdown.storm_from_ms, m_.parked_counts_during_outage};
  for (int64_t day = first_day; day < days; ++day) {
    if constexpr (kReplay) {
      FillReplay(m_, day, first_day, w, ws, weather, blocks);
    } else {
      FillWeather(m_, m_.monthly_factors[m_.day_month[day]] * year_factor_[m_.day_year[day]],
                  w, ws, weather);
    }
    const int64_t day_step = step;
    const DirectionChange* change = w.changes;
    s.next_event = std::min({s.checkpoint, s.next_outage_step, day_step + change->k});
    const int month = m_.day_month[day];
    const bool crew_day = m_.day_crew[day] != 0;
    // Per hour: the first later hour at which a curtailment rule comes into
    // force or the crew arrives or leaves (a plain stretch ends there).
    int plain_end[24];
    plain_end[23] = 24;
    for (int h = 22; h >= 0; --h) {
      const bool same_crew = ((m_.crew_hour_mask >> h) & 1u) ==
                             ((m_.crew_hour_mask >> (h + 1)) & 1u);
      plain_end[h] = m_.curtailment.InForce(month, h + 1) == 0 && (same_crew || !crew_day)
                         ? plain_end[h + 1]
                         : h + 1;
    }
    DayTallies tallies(s);
    for (int k = 0; k < kStepsPerDay;) {
      const int hour = k / kStepsPerHour;
      s.hour_rules = m_.curtailment.InForce(month, hour);
      s.crew_here = crew_day && ((m_.crew_hour_mask >> hour) & 1u);
      for (const int hour_end = k - k % kStepsPerHour + kStepsPerHour; k < hour_end;) {
        step = day_step + k;
        if (step >= s.next_event && !OnEvents(step, day_step, change, s)) {
          tallies.SaveTo(s);
          return Stop(step, s);
        }
        // (An outage state may be due again at once: then no stretch.)
        const int end = static_cast<int>(std::min<int64_t>(
            plain_end[hour] * kStepsPerHour, s.next_event - day_step));
        if (!kTrace && s.hour_rules == 0 && (!kExtras || !s.crew_parked) && end > k) {
          k = Stretch<kReplay, kExtras>(k, end, day_step, w, lim, tallies, s);
          break;  // k may be hours on: set the hour's rules and crew anew
        }
        Step<kTrace, kReplay, kExtras>(step, k, w, lim, tallies, s);
        ++k;
      }
    }
    step = day_step + kStepsPerDay;
    tallies.SaveTo(s);
  }
  Stop(step, s);
}

// What is due at `step`: the deadline, horizon or completion checkpoint, a new
// direction, a change of the outage states. False when the run is over.
[[gnu::noinline, gnu::cold]] bool RunLoop::OnEvents(int64_t step, int64_t day_step,
                                                    const DirectionChange*& change,
                                                    RunState& s) {
  if (step >= s.checkpoint) {
    s.checkpoint = NextCheckpoint(step, s.remaining);
    if (s.checkpoint < 0) return false;
    if (next_reset_ < m_.count_resets.size()) {
      ApplyResets(step, s);
      if (next_reset_ < m_.count_resets.size())
        s.checkpoint = std::min(s.checkpoint, m_.count_resets[next_reset_].step);
    }
  }
  if (day_step + change->k == step) {
    SetDirection(change->sector, change->direction_u, step, s);
    ++change;
  }
  if (step >= s.next_outage_step) UpdateOutages(step, s);
  s.next_event = std::min({s.checkpoint, s.next_outage_step, day_step + change->k});
  return true;
}

// The planned changes due by `step` (00:00 of their date): the counts of
// their cells go back to 0, and cells that were full are open again. After
// the matrix was complete a change undoes nothing: the campaign was over.
[[gnu::noinline, gnu::cold]] void RunLoop::ApplyResets(int64_t step, RunState& s) {
  for (; next_reset_ < m_.count_resets.size() && m_.count_resets[next_reset_].step <= step;
       ++next_reset_) {
    if (out_->completion_step >= 0) continue;
    for (const int c : m_.count_resets[next_reset_].cells) {
      if (counts_[c] >= m_.required[c]) {
        out_->full_step[c] = -1;
        s.tests_open += m_.manual_test_cell[c];
        if (!m_.optional[c]) ++s.remaining;
      }
      if (counts_[c] >= m_.relaxed_required[c]) out_->relaxed_full_step[c] = -1;
      counts_[c] = 0;
      next_mark_[c] = NextMark(c, 0);
    }
  }
}

// The next step the loop must stop at, or -1 when the run is over. Takes the
// deadline snapshot on the way. (RunState stays out of its signature so that
// the compiler can keep it in registers.)
[[gnu::noinline, gnu::cold]] int64_t RunLoop::NextCheckpoint(int64_t step,
                                                             int remaining) {
  if (step == m_.deadline_steps) {
    out_->count_at_deadline = out_->count_at_end;
    deadline_passed_ = true;
  }
  if (step >= m_.horizon_steps || (remaining == 0 && deadline_passed_)) return -1;
  return deadline_passed_ ? m_.horizon_steps
                          : std::min(m_.deadline_steps, m_.horizon_steps);
}

void RunLoop::Stop(int64_t steps, const RunState& s) {
  out_->simulated_steps = steps;
  out_->turbine_up_steps =
      s.turbine_up_steps + (s.turbine_up ? steps - s.outages_since : 0);
  out_->daq_up_steps = s.daq_up_steps + (s.daq_up ? steps - s.outages_since : 0);
  out_->channels_up_steps =
      s.channels_up_steps + (s.channels_down == 0 ? steps - s.channels_since : 0);
  out_->valid_sector_steps =
      s.valid_sector_steps + (s.sector_ok ? steps - s.direction_since : 0);
  out_->curtailed_steps = s.curtailed_steps;
  out_->speed_sum_ms = s.speed_sum_ms;
}

}  // namespace

namespace {

CompiledModel CompileFor(const Plan& plan, const SimulationOptions& options) {
  CompiledModel m = CompileModel(plan, options.relaxed_share);
  if (!options.site_uncertainty) m.site_mean_speed_cv = 0.0;  // taken as exact
  return m;
}

}  // namespace

Simulator::Simulator(const Plan& plan, const SimulationOptions& options)
    : model_(std::make_unique<CompiledModel>(CompileFor(plan, options))) {}

Simulator::~Simulator() = default;

void Simulator::Run(uint64_t seed, uint64_t run_index, RunResult* out) const {
  RunLoop loop(*model_, seed, run_index, out);
  loop.Run(nullptr);
}

void Simulator::Trace(uint64_t seed, uint64_t run_index, RunResult* out,
                      std::vector<TracedRecord>* records) const {
  RunLoop loop(*model_, seed, run_index, out);
  records->clear();
  loop.trace_ = records;
  loop.Run(nullptr);
}

void Simulator::Run(uint64_t seed, uint64_t run_index, const CampaignState& state,
                    RunResult* out) const {
  RunLoop loop(*model_, seed, run_index, out);
  loop.Run(&state);
}

void Simulator::Trace(uint64_t seed, uint64_t run_index, const CampaignState& state,
                      RunResult* out, std::vector<TracedRecord>* records) const {
  RunLoop loop(*model_, seed, run_index, out);
  records->clear();
  loop.trace_ = records;
  loop.Run(&state);
}

int Simulator::cell_count() const { return static_cast<int>(model_->required.size()); }
int64_t Simulator::deadline_steps() const { return model_->deadline_steps; }
int64_t Simulator::horizon_steps() const { return model_->horizon_steps; }
double Simulator::relaxed_share() const { return model_->relaxed_share; }

}  // namespace planner
