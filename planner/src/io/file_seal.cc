#include "io/file_seal.h"

#include <cstdio>

namespace planner {

namespace {

constexpr std::size_t kPrefixLength = sizeof(kSealPrefix) - 1;
constexpr std::size_t kDigits = 16;

bool IsLowerHex(char c) { return (c >= '0' && c <= '9') || (c >= 'a' && c <= 'f'); }

// Offset of the digits of the last well-formed seal, npos if none.
std::size_t LastSealDigits(const std::string& text) {
  std::size_t at = text.size();
  while (at > 0) {
    at = text.rfind(kSealPrefix, at - 1);
    if (at == std::string::npos) return std::string::npos;
    const std::size_t digits = at + kPrefixLength;
    if (digits + kDigits > text.size()) continue;
    bool hex = true;
    for (std::size_t i = 0; i < kDigits && hex; ++i) hex = IsLowerHex(text[digits + i]);
    if (hex) return digits;
  }
  return std::string::npos;
}

std::string Hex16(uint64_t x) {
  char buffer[kDigits + 1];
  std::snprintf(buffer, sizeof buffer, "%016llx", static_cast<unsigned long long>(x));
  return std::string(buffer, kDigits);
}

}  // namespace

uint64_t Fnv1a64(const std::string& text) {
  uint64_t h = 0xcbf29ce484222325ULL;
  for (const char c : text) h = (h ^ static_cast<unsigned char>(c)) * 0x100000001b3ULL;
  return h;
}

std::string SealContents(std::string contents) {
  const std::size_t at = contents.rfind(kSealPlaceholder);
  if (at == std::string::npos) return contents;
  contents.replace(at + kPrefixLength, kDigits, Hex16(Fnv1a64(contents)));
  return contents;
}

bool HasValidSeal(const std::string& contents) {
  const std::size_t digits = LastSealDigits(contents);
  if (digits == std::string::npos) return false;
  std::string zeroed = contents;
  zeroed.replace(digits, kDigits, std::string(kDigits, '0'));
  return contents.compare(digits, kDigits, Hex16(Fnv1a64(zeroed))) == 0;
}

}  // namespace planner
