// Fuzz target: the campaign-records CSV reader (ReadRecordsCsv), which
// `fillcast log add` uses. The first byte picks the options (time stamps at
// the start or end of the period, a UTC offset); the rest is the file.
#include <sstream>

#include "fuzz_common.h"
#include "io/records_csv_reader.h"
#include "planner/error.h"

extern "C" int LLVMFuzzerTestOneInput(const uint8_t* data, size_t size) {
  if (size == 0) return 0;
  planner::RecordsCsvOptions options;
  options.stamp_at_end = (data[0] & 1) != 0;
  options.utc_offset_h = static_cast<double>((data[0] >> 1) % 27) - 13.0;
  std::istringstream in(fillcast_fuzz::AsText(data + 1, size - 1));
  try {
    const planner::RecordsFile file = planner::ReadRecordsCsv(in, "records.csv", options);
    (void)file;
  } catch (const planner::InputError&) {
    // Bad input, reported as such: the expected outcome.
  }
  return 0;
}
