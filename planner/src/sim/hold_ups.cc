#include "planner/hold_ups.h"

#include <cstdio>

#include <memory>

#include "planner/disturbed_sector.h"
#include "planner/forecast_accumulator.h"

namespace planner {
namespace {

// "30 s, 3 s" for the rules' averaging times.
std::string AveragingTimes(const std::vector<ShortTermShutdown>& rules) {
  std::string out;
  for (size_t i = 0; i < rules.size(); ++i) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%g s", rules[i].averaging_s);
    out += (i == 0 ? "" : ", ") + std::string(buf);
  }
  return out;
}

}  // namespace

std::vector<ProcessVariant> ProcessVariants(const Plan& plan) {
  std::vector<ProcessVariant> out;
  const TurbineSpec& t = plan.turbine;
  if (!t.shutdown_rules.empty() || t.restart_wait_min > 0) {
    ProcessVariant v{"short_term_stops", "", plan};
    v.label = t.shutdown_rules.empty()
                  ? "restart wait after high-wind stops"
                  : "high-wind stops on " + AveragingTimes(t.shutdown_rules) + " means" +
                        (t.restart_wait_min > 0 ? "; restart wait" : "");
    v.plan.turbine.shutdown_rules.clear();
    v.plan.turbine.restart_wait_min = 0;
    out.push_back(std::move(v));
  }
  for (size_t e = 0; e < plan.episodes.size(); ++e) {
    ProcessVariant v{"episode:" + plan.episodes[e].name,
                     plan.episodes[e].name + " episodes", plan};
    v.plan.episodes.erase(v.plan.episodes.begin() + static_cast<long>(e));
    out.push_back(std::move(v));
  }
  if (!plan.channel_groups.empty()) {
    ProcessVariant v{"channel_groups", "load-channel failures and recalibrations", plan};
    v.plan.channel_groups.clear();
    for (Cell& c : v.plan.matrix.cells) c.channels = kAllChannels;
    out.push_back(std::move(v));
  }
  if (plan.layout.turbine_under_test) {
    ProcessVariant v{"turbine_wakes",
                     "wakes on the turbine under test", plan};
    v.plan.valid_sectors = ValidSectorsSeenFromMast(plan.layout, plan.sectors_as_written);
    const auto same = [](const AngleRange& a, const AngleRange& b) {
      return a.from_deg == b.from_deg && a.to_deg == b.to_deg;
    };
    const bool changes = !std::equal(v.plan.valid_sectors.begin(), v.plan.valid_sectors.end(),
                                     plan.valid_sectors.begin(), plan.valid_sectors.end(),
                                     same);
    if (changes) out.push_back(std::move(v));
  }
  return out;
}

HoldUp MakeHoldUp(const ProcessVariant& v, const ForecastSummary& with_all,
                  const ForecastSummary& without) {
  HoldUp h;
  h.key = v.key;
  h.label = v.label;
  h.p50 = without.p50;
  h.p80 = without.p80;
  h.p_complete_by_deadline = without.p_complete_by_deadline;
  if (with_all.p80.value && without.p80.value)
    h.p80_saved_weeks = *with_all.p80.value - *without.p80.value;
  return h;
}

std::optional<SiteModelSpread> ForecastSiteModelExact(const Plan& plan,
                                                      const SimulationOptions& options,
                                                      const MonteCarloOptions& mc,
                                                      ProgressSink* progress) {
  if (plan.site.mean_speed_uncertainty_pct <= 0 || plan.replay) return std::nullopt;
  SimulationOptions exact = options;
  exact.site_uncertainty = false;
  const Simulator sim(plan, exact);
  ForecastAccumulator acc(plan.matrix, sim.deadline_steps(), sim.horizon_steps(),
                          sim.relaxed_share());
  RunMonteCarloInChunks({&sim}, mc, progress,
                        [&acc](uint64_t, const std::vector<std::vector<RunResult>>& c) {
                          for (const RunResult& r : c[0]) acc.Add(r);
                        });
  const ForecastSummary s = acc.Summary(mc.seed);
  SiteModelSpread out;
  out.mean_speed_uncertainty_pct = plan.site.mean_speed_uncertainty_pct;
  out.p10 = s.p10;
  out.p50 = s.p50;
  out.p80 = s.p80;
  out.p90 = s.p90;
  out.p_complete_by_deadline = s.p_complete_by_deadline;
  return out;
}

std::vector<HoldUp> ForecastHoldUps(const Plan& plan, const SimulationOptions& options,
                                    const MonteCarloOptions& mc,
                                    const ForecastSummary& with_all,
                                    ProgressSink* progress) {
  const std::vector<ProcessVariant> variants = ProcessVariants(plan);
  if (variants.empty()) return {};
  std::vector<std::unique_ptr<Simulator>> sims;
  std::vector<const Simulator*> sim_list;
  std::vector<ForecastAccumulator> accs;
  for (const ProcessVariant& v : variants) {
    sims.push_back(std::make_unique<Simulator>(v.plan, options));
    sim_list.push_back(sims.back().get());
    accs.emplace_back(v.plan.matrix, sims.back()->deadline_steps(),
                      sims.back()->horizon_steps(), sims.back()->relaxed_share());
  }
  RunMonteCarloInChunks(sim_list, mc, progress,
                        [&accs](uint64_t, const std::vector<std::vector<RunResult>>& c) {
                          for (size_t s = 0; s < c.size(); ++s)
                            for (const RunResult& r : c[s]) accs[s].Add(r);
                        });
  std::vector<HoldUp> out;
  for (size_t s = 0; s < variants.size(); ++s)
    out.push_back(MakeHoldUp(variants[s], with_all, accs[s].Summary(mc.seed)));
  return out;
}

}  // namespace planner
