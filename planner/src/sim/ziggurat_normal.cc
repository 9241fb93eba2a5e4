#include "sim/ziggurat_normal.h"

#include <cmath>

namespace planner {
namespace {
constexpr double kR = 3.442619855899;       // start of the tail, Marsaglia & Tsang
constexpr double kV = 9.91256303526217e-3;  // area of each layer
constexpr double kM1 = 2147483648.0;        // 2^31
}  // namespace

// The tables are constant data built once before main(); no mutable global.
const ZigguratNormal::Tables ZigguratNormal::kTables;

ZigguratNormal::Tables::Tables() {
  double dn = kR, tn = kR;
  const double q = kV / std::exp(-0.5 * dn * dn);
  kn[0] = static_cast<uint32_t>((dn / q) * kM1);
  kn[1] = 0;
  wn[0] = q / kM1;
  wn[127] = dn / kM1;
  fn[0] = 1.0;
  fn[127] = std::exp(-0.5 * dn * dn);
  for (int i = 126; i >= 1; --i) {
    dn = std::sqrt(-2.0 * std::log(kV / dn + std::exp(-0.5 * dn * dn)));
    kn[i + 1] = static_cast<uint32_t>((dn / tn) * kM1);
    tn = dn;
    fn[i] = std::exp(-0.5 * dn * dn);
    wn[i] = dn / kM1;
  }
}

double ZigguratNormal::Slow(uint64_t r) {
  uint64_t counter = r;
  auto uniform = [&counter]() {
    counter += 0x9E3779B97F4A7C15ULL;
    return static_cast<double>(SplitMix64(counter) >> 11) * 0x1.0p-53;
  };
  int32_t hz = static_cast<int32_t>(r >> 32);
  int iz = static_cast<int>(r & 127);
  for (;;) {
    const double x = hz * kTables.wn[iz];
    if (iz == 0) {
      // Base strip: sample the tail beyond kR (Marsaglia 1964).
      double tx, ty;
      do {
        tx = -std::log1p(-uniform()) / kR;
        ty = -std::log1p(-uniform());
      } while (ty + ty < tx * tx);
      return hz > 0 ? kR + tx : -kR - tx;
    }
    if (kTables.fn[iz] + uniform() * (kTables.fn[iz - 1] - kTables.fn[iz]) <
        std::exp(-0.5 * x * x)) {
      return x;
    }
    counter += 0x9E3779B97F4A7C15ULL;
    const uint64_t next = SplitMix64(counter);
    hz = static_cast<int32_t>(next >> 32);
    iz = static_cast<int>(next & 127);
    const uint32_t abs_hz =
        hz < 0 ? 0u - static_cast<uint32_t>(hz) : static_cast<uint32_t>(hz);
    if (abs_hz < kTables.kn[iz]) return hz * kTables.wn[iz];
  }
}

}  // namespace planner
