#include "sim/crew_actions.h"

#include <algorithm>

namespace planner {

CrewActions::CrewActions(const CompiledModel& m)
    : m_(m),
      last_test_(m.manual_tests.size(), INT64_MIN / 2),
      last_park_(m.crew_parking.size(), INT64_MIN / 2) {}

CrewAction CrewActions::Next(double speed_ms, int64_t step, const uint32_t* counts) {
  CrewAction a;
  for (size_t t = 0; t < m_.manual_tests.size(); ++t) {
    const CompiledManualTest& test = m_.manual_tests[t];
    if (speed_ms < test.wind_lo_ms || speed_ms >= test.wind_hi_ms) continue;
    if (step - last_test_[t] < test.min_interval_steps || !test.steps.Holds(step)) continue;
    const EventCells& e = m_.events[test.event_type];
    const int i = e.wind.Find(speed_ms);
    if (i < 0 || counts[e.cells[i]] >= m_.required[e.cells[i]]) continue;
    last_test_[t] = step;
    a.kind = CrewAction::Kind::kTest;
    a.event_type = test.event_type;
    a.cell = e.cells[i];
    return a;
  }
  for (size_t p = 0; p < m_.crew_parking.size(); ++p) {
    const CompiledParking& park = m_.crew_parking[p];
    if (speed_ms < park.wind_lo_ms || speed_ms >= park.wind_hi_ms) continue;
    if (step - last_park_[p] < park.min_interval_steps || !park.steps.Holds(step)) continue;
    if (!ParkedCellShort(speed_ms, counts)) continue;
    last_park_[p] = step;
    a.kind = CrewAction::Kind::kPark;
    a.park_steps = park.park_steps;
    return a;
  }
  return a;
}

bool CrewActions::ParkedCellShort(double speed_ms, const uint32_t* counts) const {
  const CompiledGrid& g = m_.grids[static_cast<int>(OperatingState::kParked)];
  if (!g.present) return false;
  const int w = g.wind.Find(speed_ms);
  if (w < 0) return false;
  const int ti_bins = std::max(1, g.ti_bins);
  for (int t = 0; t < ti_bins; ++t) {
    const int c = g.cell_index[w * ti_bins + t];
    if (c >= 0 && counts[c] < m_.required[c]) return true;
  }
  return false;
}

}  // namespace planner
