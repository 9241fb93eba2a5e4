// Standard normal variates by the ziggurat method of Marsaglia & Tsang ("The
// Ziggurat Method for Generating Random Variables", J. Statistical Software
// 5(8), 2000), 128 layers. Following Doornik ("An Improved Ziggurat Method to
// Generate Normal Random Samples", 2005), the layer index and the value come
// from different bits of one 64-bit draw, which removes the correlation of the
// original. The rejection steps take their uniforms from SplitMix64 of the
// rejected word (see Slow). About three times faster here than Boost 1.74's
// normal_distribution, which matters at two normals per 10-minute step
// (docs/performance.md); tests compare it with Boost.Math's normal CDF.
#ifndef PLANNER_SIM_ZIGGURAT_NORMAL_H_
#define PLANNER_SIM_ZIGGURAT_NORMAL_H_

#include <cstdint>

#include "planner/random_stream.h"

namespace planner {

class ZigguratNormal {
 public:
  // One draw; uses one engine output on the fast path (about 99 % of calls).
  double operator()(Engine& e) const {
    const uint64_t r = e();
    const int32_t hz = static_cast<int32_t>(r >> 32);
    const int iz = static_cast<int>(r & 127);
    const uint32_t abs_hz =
        hz < 0 ? 0u - static_cast<uint32_t>(hz) : static_cast<uint32_t>(hz);
    if (abs_hz < kTables.kn[iz]) return hz * kTables.wn[iz];
    return Slow(r);
  }

 private:
  struct Tables {
    uint32_t kn[128];
    double wn[128];
    double fn[128];
    Tables();
  };
  static const Tables kTables;
  // The rare rejection steps draw their further uniforms from SplitMix64 of
  // the rejected 64-bit word, not from the engine: the engine's state then
  // never leaves the caller's registers, and the draws stay a deterministic
  // function of the stream.
  static double Slow(uint64_t r);
};

}  // namespace planner

#endif  // PLANNER_SIM_ZIGGURAT_NORMAL_H_
