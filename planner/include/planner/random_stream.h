// Random streams. Each Monte-Carlo run gets its own generator seeded from
// (seed, run index) alone, so a run's result does not depend on which thread
// ran it or in what order: same seed, same answer, whatever the thread count.
// Scenarios compared with the same seed also share their streams (common
// random numbers).
#ifndef PLANNER_RANDOM_STREAM_H_
#define PLANNER_RANDOM_STREAM_H_

#include <cstdint>

namespace planner {

// SplitMix64 finaliser (Steele, Lea & Flood 2014): a bijective 64-bit mix.
inline uint64_t SplitMix64(uint64_t x) {
  x += 0x9E3779B97F4A7C15ULL;
  x = (x ^ (x >> 30)) * 0xBF58476D1CE4E5B9ULL;
  x = (x ^ (x >> 27)) * 0x94D049BB133111EBULL;
  return x ^ (x >> 31);
}

// xoshiro256++ (Blackman & Vigna, "Scrambled linear pseudorandom number
// generators", ACM TOMS 2021): 256-bit state, period 2^256 - 1, passes
// BigCrush. Used through Boost.Random's distributions (it models a uniform
// random bit generator). Boost 1.74, the version Debian 12 ships, has no
// xoshiro, and its mt19937_64 measured about twice as slow in the hot loop
// (docs/performance.md). The state is seeded with SplitMix64, as its authors
// recommend.
class Xoshiro256pp {
 public:
  using result_type = uint64_t;
  static constexpr result_type min() { return 0; }
  static constexpr result_type max() { return ~result_type{0}; }

  explicit Xoshiro256pp(uint64_t seed) {
    for (uint64_t& word : s_) {
      seed += 0x9E3779B97F4A7C15ULL;
      word = SplitMix64(seed);
    }
  }

  result_type operator()() {
    const uint64_t result = Rotl(s_[0] + s_[3], 23) + s_[0];
    const uint64_t t = s_[1] << 17;
    s_[2] ^= s_[0];
    s_[3] ^= s_[1];
    s_[1] ^= s_[2];
    s_[0] ^= s_[3];
    s_[2] ^= t;
    s_[3] = Rotl(s_[3], 45);
    return result;
  }

 private:
  static uint64_t Rotl(uint64_t x, int k) { return (x << k) | (x >> (64 - k)); }
  uint64_t s_[4];
};

using Engine = Xoshiro256pp;

// The engine of run `run_index` under master seed `seed`.
inline Engine MakeRunEngine(uint64_t seed, uint64_t run_index) {
  return Engine(
      SplitMix64(SplitMix64(seed) ^ SplitMix64(run_index + 0x5851F42D4C957F2DULL)));
}

// Uniform in [0, 1) from the top 53 bits of one draw.
inline double UniformDouble(Engine& e) {
  return static_cast<double>(e() >> 11) * 0x1.0p-53;
}

}  // namespace planner

#endif  // PLANNER_RANDOM_STREAM_H_
