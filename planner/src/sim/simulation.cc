#include "planner/simulation.h"

#include <algorithm>
#include <cmath>

#include "planner/random_stream.h"
#include "sim/compiled_model.h"
#include "sim/ziggurat_normal.h"

namespace planner {
namespace {

// Streams of one run, each from (seed, run index) with its own salt so that
// changing the outage model never shifts the weather (common random numbers).
constexpr uint64_t kTurbineSalt = 0x74757262696E6531ULL;
constexpr uint64_t kDaqSalt = 0x6461712D6F757421ULL;
constexpr uint64_t kYearSalt = 0x796561722D666163ULL;

inline double HighUniform(uint64_t r) { return static_cast<double>(r >> 32) * 0x1.0p-32; }
inline double LowUniform(uint64_t r) {
  return static_cast<double>(r & 0xFFFFFFFFULL) * 0x1.0p-32;
}

inline bool InSpans(const std::vector<Bin>& spans, double u) {
  for (const Bin& b : spans) {
    if (u >= b.lo && u < b.hi) return true;
  }
  return false;
}

// The mutable state of one run.
struct RunState {
  int sector = 0;
  double direction_u = 0;  // position within the sector, [0, 1)
  double z = 0;            // latent wind-speed normal
  double x_ti = 0;         // latent TI normal
  bool high_wind_stop = false;
  int remaining = 0;       // required cells not yet full
  int64_t turbine_up_steps = 0, daq_up_steps = 0, valid_sector_steps = 0;
};

class RunLoop {
 public:
  RunLoop(const CompiledModel& m, uint64_t seed, uint64_t run, RunResult* out)
      : m_(m),
        seed_(seed),
        run_(run),
        weather_(MakeRunEngine(seed, run)),
        turbine_engine_(MakeRunEngine(seed ^ kTurbineSalt, run)),
        daq_engine_(MakeRunEngine(seed ^ kDaqSalt, run)),
        turbine_(m.turbine_outages, &turbine_engine_),
        daq_(m.daq_outages, &daq_engine_),
        out_(out) {}

  void Run();

 private:
  void Stop(int64_t steps);
  void Start();
  void DrawYearFactors();
  void Step(int64_t step, double scale);
  int CellOf(int state, double speed_ms, double x_ti) const;
  void Count(int cell, int64_t step);

  const CompiledModel& m_;
  uint64_t seed_, run_;
  Engine weather_;
  Engine turbine_engine_, daq_engine_;
  RenewalProcess turbine_, daq_;
  ZigguratNormal normal_;
  RunState s_;
  RunResult* out_;
  std::vector<double> year_factor_;  // per campaign year
};

void RunLoop::Start() {
  const size_t cells = m_.required.size();
  out_->count_at_deadline.assign(cells, 0);
  out_->count_at_end.assign(cells, 0);
  out_->full_step.assign(cells, -1);
  out_->completion_step = -1;
  out_->last_cell = -1;
  out_->simulated_steps = 0;
  // Start in the stationary distribution of direction and speed.
  s_.sector = m_.sector_chain.frequencies.Draw(UniformDouble(weather_));
  s_.direction_u = UniformDouble(weather_);
  s_.z = normal_(weather_);
  s_.x_ti = normal_(weather_);
  s_.remaining = m_.required_cells;
  DrawYearFactors();
}

void RunLoop::Count(int cell, int64_t step) {
  const uint32_t n = ++out_->count_at_end[cell];
  if (n != m_.required[cell]) return;
  out_->full_step[cell] = step + 1;
  if (m_.optional[cell]) return;
  if (--s_.remaining == 0) {
    out_->completion_step = step + 1;
    out_->last_cell = cell;
  }
}

int RunLoop::CellOf(int state, double speed_ms, double x_ti) const {
  const CompiledGrid& g = m_.grids[state];
  if (!g.present) return -1;
  const int w = g.wind.Find(speed_ms);
  if (w < 0) return -1;
  const int ti_bins = static_cast<int>(g.log_ti_hi.size());
  if (ti_bins == 0) return g.cell_index[w];
  // ln TI against the ln edges; a short linear scan (a few TI bins).
  const double log_ti = m_.ti_law.LogSample(speed_ms, x_ti);
  for (int t = 0; t < ti_bins; ++t) {
    if (log_ti < g.log_ti_hi[t]) {
      return log_ti >= g.log_ti_lo[t] ? g.cell_index[w * ti_bins + t] : -1;
    }
  }
  return -1;
}

void RunLoop::Step(int64_t step, double scale) {
  // Weather: a fixed number of draws per step, whatever happens below.
  const uint64_t r1 = weather_();
  const uint64_t r2 = weather_();
  const double e_z = normal_(weather_);
  const double e_ti = normal_(weather_);
  const int next = m_.sector_chain.Next(s_.sector, HighUniform(r1), HighUniform(r2));
  // A new draw of the sector (even of the same one) is a new direction in it.
  if (HighUniform(r1) >= m_.sector_chain.keep_probability) s_.direction_u = LowUniform(r2);
  s_.sector = next;
  s_.z = m_.wind_ar1.Next(s_.z, e_z);
  s_.x_ti = m_.ti_ar1.Next(s_.x_ti, e_ti);
  const double speed = m_.sector_scale_ms[s_.sector] * scale *
                       m_.speed_transform[s_.sector](s_.z);

  // Turbine state with cut-out hysteresis.
  if (speed >= m_.cut_out_ms) {
    s_.high_wind_stop = true;
  } else if (s_.high_wind_stop && speed < m_.restart_ms) {
    s_.high_wind_stop = false;
  }
  const bool turbine_up = turbine_.UpAt(step);
  const bool daq_up = daq_.UpAt(step);
  const bool sector_ok = InSpans(m_.sector_valid_spans[s_.sector], s_.direction_u);
  s_.turbine_up_steps += turbine_up;
  s_.daq_up_steps += daq_up;
  s_.valid_sector_steps += sector_ok;
  if (!daq_up || !sector_ok || LowUniform(r1) < m_.quality_reject) return;
  const bool producing = turbine_up && !s_.high_wind_stop && speed >= m_.cut_in_ms;
  if (!producing && !turbine_up && !m_.parked_counts_during_outage) return;
  const int cell = CellOf(producing ? 0 : 1, speed, s_.x_ti);
  if (cell >= 0) Count(cell, step);
}

// One lognormal factor with mean 1 and standard deviation interannual_std per
// campaign year, from its own stream.
void RunLoop::DrawYearFactors() {
  const size_t years = m_.day_year.empty() ? 1 : m_.day_year.back() + 1;
  year_factor_.assign(years, 1.0);
  if (m_.interannual_std <= 0.0) return;
  Engine e = MakeRunEngine(seed_ ^ kYearSalt, run_);
  const double cv = m_.interannual_std;
  const double s = std::sqrt(std::log1p(cv * cv));
  for (double& f : year_factor_) f = std::exp(-0.5 * s * s + s * normal_(e));
}

void RunLoop::Run() {
  Start();
  int64_t step = 0;
  const int64_t days = static_cast<int64_t>(m_.day_month.size());
  for (int64_t day = 0; day < days; ++day) {
    const double day_scale =
        m_.monthly_factors[m_.day_month[day]] * year_factor_[m_.day_year[day]];
    for (int hour = 0; hour < 24; ++hour) {
      const double scale = day_scale * m_.hourly_factors[hour];
      for (int k = 0; k < kStepsPerHour; ++k, ++step) {
        if (step == m_.deadline_steps) out_->count_at_deadline = out_->count_at_end;
        if (step >= m_.horizon_steps ||
            (s_.remaining == 0 && step >= m_.deadline_steps)) {
          return Stop(step);
        }
        Step(step, scale);
      }
    }
  }
  Stop(step);
}

void RunLoop::Stop(int64_t steps) {
  out_->simulated_steps = steps;
  out_->turbine_up_steps = s_.turbine_up_steps;
  out_->daq_up_steps = s_.daq_up_steps;
  out_->valid_sector_steps = s_.valid_sector_steps;
}

}  // namespace

Simulator::Simulator(const Plan& plan)
    : model_(std::make_unique<CompiledModel>(CompileModel(plan))) {}

Simulator::~Simulator() = default;

void Simulator::Run(uint64_t seed, uint64_t run_index, RunResult* out) const {
  RunLoop loop(*model_, seed, run_index, out);
  loop.Run();
}

int Simulator::cell_count() const { return static_cast<int>(model_->required.size()); }
int64_t Simulator::deadline_steps() const { return model_->deadline_steps; }
int64_t Simulator::horizon_steps() const { return model_->horizon_steps; }

}  // namespace planner
