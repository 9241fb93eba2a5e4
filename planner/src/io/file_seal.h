// The seal that tells fillcast's own output files from a user's files.
//
// Every file fillcast writes carries, once, the text "fillcast-seal:" followed
// by 16 hexadecimal digits: the FNV-1a 64-bit hash (Fowler, Noll and Vo; the
// published offset basis and prime) of the whole file as it was written, with
// those 16 digits read as zeros. A file is taken for fillcast's own only when
// its last such seal matches its contents. A user's notes that mention the
// seal, or a fillcast file the user has since edited, fail the check, so
// fillcast never replaces them without --force.
//
// Writers put kSealPlaceholder where the format allows a comment or a field
// (JSON tool.seal, an HTML meta tag, the first comment line of a CSV or YAML
// file); WriteOutputFile seals the text just before writing it.
#ifndef PLANNER_IO_FILE_SEAL_H_
#define PLANNER_IO_FILE_SEAL_H_

#include <cstdint>
#include <string>

namespace planner {

inline constexpr char kSealPrefix[] = "fillcast-seal:";
inline constexpr char kSealPlaceholder[] = "fillcast-seal:0000000000000000";

// FNV-1a 64-bit hash of `text`.
uint64_t Fnv1a64(const std::string& text);

// `contents` with its last kSealPlaceholder replaced by the seal of the
// result. Unchanged if it holds no placeholder.
std::string SealContents(std::string contents);

// True if the last seal in `contents` ("fillcast-seal:" and 16 lower-case
// hexadecimal digits) matches the contents.
bool HasValidSeal(const std::string& contents);

}  // namespace planner

#endif  // PLANNER_IO_FILE_SEAL_H_
