// Shared by the libFuzzer targets of the readers (see DEVELOPERS.md, "Fuzzing").
//
// A target feeds arbitrary bytes to one reader. planner::InputError is the
// expected outcome for bad input; any other exception escapes the target and
// libFuzzer reports it, as it reports crashes, hangs, leaks and sanitizer
// findings.
#ifndef FILLCAST_TESTS_FUZZ_FUZZ_COMMON_H_
#define FILLCAST_TESTS_FUZZ_FUZZ_COMMON_H_

#include <cstddef>
#include <cstdint>
#include <string>

namespace fillcast_fuzz {

// The input as text (any bytes, NUL included).
inline std::string AsText(const uint8_t* data, size_t size) {
  return std::string(reinterpret_cast<const char*>(data), size);
}

}  // namespace fillcast_fuzz

#endif  // FILLCAST_TESTS_FUZZ_FUZZ_COMMON_H_
