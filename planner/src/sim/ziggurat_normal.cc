#include "sim/ziggurat_normal.h"

#include <cmath>

namespace planner {
namespace {
constexpr double kR = 3.442619855899;       // start of the tail, Marsaglia & Tsang
constexpr double kV = 9.91256303526217e-3;  // area of each layer

// The rejection steps, common to both layouts: layer iz, signed value hz on
// the tables' scale, further uniforms from SplitMix64 of `counter`, and new
// (layer, value) pairs from `next_pair`.
template <typename NextPair>
double Reject(const ZigguratNormal::Tables& t, int iz, int32_t hz, uint64_t counter,
              NextPair next_pair) {
  auto uniform = [&counter]() {
    counter += 0x9E3779B97F4A7C15ULL;
    return static_cast<double>(SplitMix64(counter) >> 11) * 0x1.0p-53;
  };
  for (;;) {
    const double x = hz * t.wn[iz];
    if (iz == 0) {
      // Base strip: sample the tail beyond kR (Marsaglia 1964).
      double tx, ty;
      do {
        tx = -std::log1p(-uniform()) / kR;
        ty = -std::log1p(-uniform());
      } while (ty + ty < tx * tx);
      return hz > 0 ? kR + tx : -kR - tx;
    }
    if (t.fn[iz] + uniform() * (t.fn[iz - 1] - t.fn[iz]) < std::exp(-0.5 * x * x)) {
      return x;
    }
    counter += 0x9E3779B97F4A7C15ULL;
    next_pair(SplitMix64(counter), &iz, &hz);
    const uint32_t abs_hz =
        hz < 0 ? 0u - static_cast<uint32_t>(hz) : static_cast<uint32_t>(hz);
    if (abs_hz < t.kn[iz]) return hz * t.wn[iz];
  }
}
}  // namespace

// The tables are constant data built once before main(); no mutable global.
const ZigguratNormal::Tables ZigguratNormal::kTables(2147483648.0);  // 2^31
const ZigguratNormal::Tables ZigguratNormal::kWordTables(16777216.0);  // 2^24

ZigguratNormal::Tables::Tables(double scale) {
  const double kM1 = scale;
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
  return Reject(kTables, static_cast<int>(r & 127), static_cast<int32_t>(r >> 32), r,
                [](uint64_t next, int* iz, int32_t* hz) {
                  *hz = static_cast<int32_t>(next >> 32);
                  *iz = static_cast<int>(next & 127);
                });
}

double ZigguratNormal::SlowWord(uint32_t word) {
  return Reject(kWordTables, static_cast<int>(word & 127),
                static_cast<int32_t>(word) >> 7, word,
                [](uint64_t next, int* iz, int32_t* hz) {
                  *hz = static_cast<int32_t>(static_cast<uint32_t>(next)) >> 7;
                  *iz = static_cast<int>(next & 127);
                });
}

}  // namespace planner
