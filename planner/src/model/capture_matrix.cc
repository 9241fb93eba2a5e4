#include "planner/capture_matrix.h"

#include <algorithm>
#include <cstdio>

namespace planner {

const char* OperatingStateName(OperatingState s) {
  switch (s) {
    case OperatingState::kProduction:
      return "production";
    case OperatingState::kParked:
      return "parked";
    case OperatingState::kReduced:
      return "reduced";
  }
  return "unknown";
}

int FindBin(const std::vector<Bin>& bins, double x) {
  auto it = std::upper_bound(bins.begin(), bins.end(), x,
                             [](double v, const Bin& b) { return v < b.lo; });
  if (it == bins.begin()) return -1;
  --it;
  return x < it->hi ? static_cast<int>(it - bins.begin()) : -1;
}

int RequiredCellCount(const CaptureMatrix& m) {
  return static_cast<int>(std::count_if(m.cells.begin(), m.cells.end(),
                                        [](const Cell& c) { return !c.optional; }));
}

namespace {
std::string Range(const Bin& b) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%g-%g", b.lo, b.hi);
  return buf;
}
}  // namespace

std::string CellLabel(const CaptureMatrix& m, const Cell& c) {
  if (c.event < 0) return CellLabel(c);
  const std::string name = c.event < static_cast<int>(m.event_types.size())
                               ? m.event_types[c.event]
                               : std::string("?");
  return "event " + name + " " + Range(c.wind_ms) + " m/s";
}

std::string CellLabel(const Cell& c) {
  if (c.event >= 0) return "event " + Range(c.wind_ms) + " m/s";
  std::string label = OperatingStateName(c.state);
  label += " " + Range(c.wind_ms) + " m/s";
  if (c.ti_binned) label += " TI " + Range(c.ti_pct) + " %";
  return label;
}

}  // namespace planner
