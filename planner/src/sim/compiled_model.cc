#include "sim/compiled_model.h"

#include <algorithm>
#include <cmath>

namespace planner {

TiLaw::TiLaw(const TurbulenceModel& model) {
  if (model.kind == TurbulenceModel::Kind::kTable) {
    table_kind_ = true;
    for (const TiTableRow& row : model.table) {
      const LogNormalParams p = LogNormalFromMoments(row.ti_mean, row.ti_std);
      row_bins_ms_.push_back({row.wind_lo_ms, row.wind_hi_ms});
      mu_.push_back(p.mu);
      s_.push_back(p.s);
    }
    rows_ms_ = BinLookup(row_bins_ms_);
    return;
  }
  const int points = static_cast<int>(80.0 / kStepMs) + 1;
  for (int i = 0; i < points; ++i) {
    const LogNormalParams p = TiLogNormalAt(model, std::max(kMinSpeedMs, i * kStepMs));
    mu_.push_back(p.mu);
    s_.push_back(p.s);
  }
  last_index_ = static_cast<double>(points - 1) - 1e-9;
}

int TiLaw::RowOfBin(const Bin& wind_ms) const {
  if (!table_kind_) return -1;
  for (size_t r = 0; r < row_bins_ms_.size(); ++r) {
    if (row_bins_ms_[r].lo <= wind_ms.lo && wind_ms.hi <= row_bins_ms_[r].hi)
      return static_cast<int>(r);
  }
  return -1;
}

int TiLaw::NearestRow(double speed_ms) const {
  int nearest = 0;
  double best = 1e300;
  for (size_t r = 0; r < row_bins_ms_.size(); ++r) {
    const double d =
        std::max(row_bins_ms_[r].lo - speed_ms, speed_ms - row_bins_ms_[r].hi);
    if (d < best) best = d, nearest = static_cast<int>(r);
  }
  return nearest;
}

namespace {

// Valid spans of sector i as fractions of its width.
std::vector<Bin> ValidSpans(const std::vector<AngleRange>& valid, double start_deg,
                            double width_deg) {
  // Sample the boundaries exactly: collect range edges inside the sector.
  std::vector<double> cuts = {0.0, 1.0};
  for (const AngleRange& r : valid) {
    for (double edge : {r.from_deg, r.to_deg}) {
      double rel = std::fmod(edge - start_deg + 720.0, 360.0) / width_deg;
      if (rel > 0.0 && rel < 1.0) cuts.push_back(rel);
    }
  }
  std::sort(cuts.begin(), cuts.end());
  std::vector<Bin> spans;
  for (size_t i = 0; i + 1 < cuts.size(); ++i) {
    const double mid_deg = start_deg + 0.5 * (cuts[i] + cuts[i + 1]) * width_deg;
    bool inside = false;
    for (const AngleRange& r : valid) inside = inside || AngleRangeContains(r, mid_deg);
    if (!inside || cuts[i + 1] <= cuts[i]) continue;
    if (!spans.empty() && spans.back().hi == cuts[i]) {
      spans.back().hi = cuts[i + 1];
    } else {
      spans.push_back({cuts[i], cuts[i + 1]});
    }
  }
  return spans;
}

void CompileWeather(const SiteModel& site, const std::vector<AngleRange>& valid,
                    CompiledModel* m) {
  std::vector<double> freq;
  const double width = SectorWidthDeg(site);
  for (size_t i = 0; i < site.sectors.size(); ++i) {
    const Sector& s = site.sectors[i];
    freq.push_back(s.frequency);
    m->sector_scale_ms.push_back(s.weibull.scale_ms);
    m->sector_shape.push_back(s.weibull.shape);
    m->speed_transform.emplace_back(s.weibull.shape);
    const double start = static_cast<double>(i) * width - 0.5 * width;
    m->sector_valid_spans.push_back(ValidSpans(valid, start, width));
  }
  m->sector_width_deg = width;
  m->sector_chain.keep_probability = site.sector_persistence;
  m->sector_chain.frequencies = AliasTable(freq);
  m->monthly_factors = site.monthly_factors;
  m->hourly_factors = site.hourly_factors;
  m->interannual_std = site.interannual_std;
  m->site_mean_speed_cv = site.mean_speed_uncertainty_pct / 100.0;
  m->wind_ar1 = LatentAr1(site.wind_persistence_h);
  m->ti_ar1 = Ar1Skipper(site.turbulence.persistence_h);
  m->ti_law = TiLaw(site.turbulence);
}

// The TI bins of a grid on the latent normal's scale for a wind bin whose TI
// row is `row` (CompiledGrid::LatentEdges; unusable where the row varies
// within the wind bin, the spread is 0, or the TI bins are many or gapped).
CompiledGrid::LatentEdges LatentTiEdges(const CompiledGrid& g, const TiLaw& law,
                                        int row) {
  CompiledGrid::LatentEdges e;
  const int n = g.ti_bins;
  if (row < 0 || n == 0 || n > CompiledGrid::kLatentBins) return e;
  const double mu = law.RowMu(row), s = law.RowSigma(row);
  if (!(s > 0.0)) return e;
  for (int t = 1; t < n; ++t) {
    if (g.log_ti_lo[t] != g.log_ti_hi[t - 1]) return e;
  }
  const auto latent = [&](double log_ti) { return (log_ti - mu) / s; };
  for (int t = 1; t < n; ++t) e.start[t - 1] = latent(g.log_ti_lo[t]);
  e.lo = latent(g.log_ti_lo[0]);  // -infinity for a first bin from 0 %
  e.hi = latent(g.log_ti_hi[n - 1]);
  e.usable = true;
  return e;
}

void CompileMatrix(const CaptureMatrix& matrix, CompiledModel* m) {
  for (const StateGrid& g : matrix.grids) {
    CompiledGrid& cg = m->grids[static_cast<int>(g.state)];
    cg.present = true;
    cg.wind = BinLookup(g.wind_bins_ms);
    for (const Bin& b : g.ti_bins_pct) {
      // ln 0 = -infinity: a bin starting at 0 % takes every TI below its hi.
      cg.log_ti_lo.push_back(b.lo > 0 ? std::log(b.lo / 100.0) : -HUGE_VAL);
      cg.log_ti_hi.push_back(std::log(b.hi / 100.0));
    }
    cg.ti_bins = static_cast<int>(cg.log_ti_lo.size());
    int size = 1;
    while (size < cg.ti_bins) size *= 2;
    cg.ti_search_lo = cg.log_ti_lo;
    cg.ti_search_lo.resize(size, HUGE_VAL);
    cg.ti_half = size / 2;
    cg.cell_index = g.cell_index;
    for (const Bin& w : g.wind_bins_ms) cg.ti_row.push_back(m->ti_law.RowOfBin(w));
    for (const int row : cg.ti_row)
      cg.latent_edges.push_back(LatentTiEdges(cg, m->ti_law, row));
  }
  for (const Cell& c : matrix.cells) {
    m->required.push_back(static_cast<uint32_t>(c.required));
    m->optional.push_back(c.optional ? 1 : 0);
    if (!c.optional) ++m->required_cells;
  }
}

void CompileCalendar(const Plan& plan, CompiledModel* m) {
  m->deadline_steps = DeadlineSteps(plan);
  m->horizon_steps = HorizonSteps(plan);
  const int64_t days = m->horizon_steps / kStepsPerDay + 1;
  const int64_t first = DaysFromCivil(plan.start);
  for (int64_t d = 0; d < days; ++d) {
    m->day_month.push_back(static_cast<uint8_t>(CivilFromDays(first + d).month - 1));
    if (m->replay) m->day_of_year.push_back(static_cast<uint16_t>(DayOfYear365(first + d)));
    m->day_year.push_back(static_cast<uint16_t>(d / 365));
  }
}

// p as a threshold on 16 random bits, to the nearest 1/65,536.
uint32_t ProbabilityThreshold(double p) {
  return static_cast<uint32_t>(std::lround(p * kProbabilityScale));
}

}  // namespace

CompiledModel CompileModel(const Plan& plan, double relaxed_share) {
  CompiledModel m;
  m.relaxed_share = relaxed_share;
  m.replay = plan.replay;
  CompileWeather(plan.site, plan.valid_sectors, &m);
  m.cut_in_ms = plan.turbine.cut_in_ms;
  m.cut_out_ms = plan.turbine.cut_out_ms;
  m.restart_ms = plan.turbine.restart_ms;
  const double hub_m = plan.turbine.hub_height_m;
  m.shutdown = CompileShutdown(plan.turbine, m.ti_law,
                               hub_m > 0 ? IecKaimalLengthScale(hub_m)
                                         : RecordSpectrum().length_scale_m);
  m.turbine_outages = MakeRenewalLaw(plan.turbine_outages);
  m.daq_outages = MakeRenewalLaw(plan.daq_outages);
  for (const EpisodeModel& e : plan.episodes) m.episodes.push_back(MakeEpisodeLaw(e));
  for (const ChannelGroup& g : plan.channel_groups)
    m.channel_groups.push_back(MakeChannelGroupLaw(g));
  const uint32_t groups = plan.channel_groups.empty()
                              ? 0u
                              : static_cast<uint32_t>((1ull << plan.channel_groups.size()) - 1);
  m.channels_every_cell_needs = groups;
  for (const Cell& c : plan.matrix.cells) {
    m.cell_channels.push_back(c.channels & groups);
    m.channels_every_cell_needs &= c.channels;
  }
  m.parked_counts_during_outage = plan.parked_counts_during_outage;
  m.quality_reject = plan.quality_reject_fraction;
  m.keep_threshold = ProbabilityThreshold(m.sector_chain.keep_probability);
  m.reject_threshold = ProbabilityThreshold(m.quality_reject);
  CompileMatrix(plan.matrix, &m);
  for (uint32_t r : m.required) {
    const double relaxed = std::ceil(relaxed_share * r - 1e-9);
    m.relaxed_required.push_back(std::max<uint32_t>(1, static_cast<uint32_t>(relaxed)));
  }
  CompileCalendar(plan, &m);
  CompileOperations(plan, &m);
  for (const PlannedChange& c : plan.planned_changes) {
    const int64_t step = DaysBetween(plan.start, c.date) * kStepsPerDay;
    if (step < m.horizon_steps) m.count_resets.push_back({step, c.cells});
  }
  return m;
}

}  // namespace planner
