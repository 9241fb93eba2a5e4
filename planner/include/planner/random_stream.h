// Random streams. Each Monte-Carlo run gets its own generator seeded from
// (seed, run index) alone, so a run's result does not depend on which thread
// ran it or in what order: same seed, same answer, whatever the thread count.
// Scenarios compared with the same seed also share their streams (common
// random numbers).
#ifndef PLANNER_RANDOM_STREAM_H_
#define PLANNER_RANDOM_STREAM_H_

#include <cstdint>

#include <boost/random/mersenne_twister.hpp>

namespace planner {

using Engine = boost::random::mt19937_64;

// SplitMix64 finaliser (Steele, Lea & Flood 2014): a bijective 64-bit mix.
inline uint64_t SplitMix64(uint64_t x) {
  x += 0x9E3779B97F4A7C15ULL;
  x = (x ^ (x >> 30)) * 0xBF58476D1CE4E5B9ULL;
  x = (x ^ (x >> 27)) * 0x94D049BB133111EBULL;
  return x ^ (x >> 31);
}

// The engine of run `run_index` under master seed `seed`.
inline Engine MakeRunEngine(uint64_t seed, uint64_t run_index) {
  return Engine(SplitMix64(SplitMix64(seed) ^ SplitMix64(run_index + 0x5851F42D4C957F2DULL)));
}

// Uniform in [0, 1) from the top 53 bits of one draw.
inline double UniformDouble(Engine& e) {
  return static_cast<double>(e() >> 11) * 0x1.0p-53;
}

}  // namespace planner

#endif  // PLANNER_RANDOM_STREAM_H_
