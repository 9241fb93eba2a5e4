// Standard normal variates by the ziggurat method of Marsaglia & Tsang ("The
// Ziggurat Method for Generating Random Variables", J. Statistical Software
// 5(8), 2000), 128 layers. Following Doornik ("An Improved Ziggurat Method to
// Generate Normal Random Samples", 2005), the layer index and the value come
// from different bits of one 64-bit draw, which removes the correlation of the
// original. The rejection steps take their uniforms from SplitMix64 of the
// rejected word (see Slow). About three times faster here than Boost 1.74's
// normal_distribution, which matters at two normals per 10-minute step
// (docs/performance.md); tests compare it with Boost.Math's normal CDF.
//
// FromWord makes a normal from 32 random bits alone (7 layer bits, a sign and
// 24 value bits), so that one 64-bit draw per 10-minute step serves the wind
// speed's innovation and two 16-bit decisions (docs/methods.md). 24 bits put
// the value on a grid of 2^-24 of its layer's width, far below anything a
// wind speed carries.
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

  // One draw from the 32 bits of `word`; the same fast path about 99 % of the
  // time, else the slow path seeded by the word.
  static double FromWord(uint32_t word) {
    const int iz = static_cast<int>(word & 127);
    const int32_t hz = static_cast<int32_t>(word) >> 7;  // in [-2^24, 2^24)
    const uint32_t abs_hz =
        hz < 0 ? 0u - static_cast<uint32_t>(hz) : static_cast<uint32_t>(hz);
    if (abs_hz < kWordTables.kn[iz]) return hz * kWordTables.wn[iz];
    return SlowWord(word);
  }

  // Layer tables for values of a given bit width (scale = 2^bits).
  struct Tables {
    uint32_t kn[128];
    double wn[128];
    double fn[128];
    explicit Tables(double scale);
  };

 private:
  static const Tables kTables;      // 31 value bits (operator())
  static const Tables kWordTables;  // 24 value bits (FromWord)
  static double SlowWord(uint32_t word);
  // The rare rejection steps draw their further uniforms from SplitMix64 of
  // the rejected 64-bit word, not from the engine: the engine's state then
  // never leaves the caller's registers, and the draws stay a deterministic
  // function of the stream.
  static double Slow(uint64_t r);
};

}  // namespace planner

#endif  // PLANNER_SIM_ZIGGURAT_NORMAL_H_
