// The records a campaign has actually logged, placed in the plan's capture
// matrix exactly as the simulation places a simulated record
// (planner/simulation.h), and the CampaignState a forecast continues from.
// Pure: plain structs in, plain structs out. The log file itself is
// planner/campaign_log.h; the format is specified in docs/progress.md.
//
// A logged record counts for a record cell when
//   * it lies in [plan start, as-of date) (00:00 of each, UTC);
//   * it is valid: its quality flag passed, its speed and direction are known
//     and its direction lies in one of the plan's valid measurement sectors;
//   * its operating state is production, parked or reduced, or it is an
//     outage (turbine out of service) and the plan counts parked records
//     during outages (parked_counts_during_outage); an outage record then
//     counts as parked;
//   * its mean speed falls in a wind bin of that state's grid and, when the
//     grid has TI bins, its TI = standard deviation / mean speed (in percent)
//     falls in a TI bin (bins are [lo, hi));
//   * it is not the record of a manual test (a test record is a transient, not
//     a normal record).
// A logged event (start_up, normal_stop, or the name of one of the plan's
// manual tests) counts for the event cell of its type whose wind bin holds
// the record's mean speed, when the record is valid. Records with the data
// acquisition down are simply absent from a real log.
#ifndef PLANNER_LOGGED_COUNTS_H_
#define PLANNER_LOGGED_COUNTS_H_

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "planner/calendar.h"
#include "planner/plan.h"
#include "planner/simulation.h"

namespace planner {

// Ten minutes in seconds: the period of one logged record.
inline constexpr int64_t kRecordSeconds = 600;

// Operating state as logged. Words in the log: "production", "parked",
// "reduced", "outage" (docs/progress.md).
enum class LoggedState {
  kProduction,  // normal production
  kParked,      // parked or idling with the turbine available (includes stops
                // by a curtailment rule)
  kReduced,     // producing in a reduced (derated) mode
  kOutage,      // turbine out of service (fault, repair, planned outage)
};
inline constexpr int kLoggedStateCount = 4;

// "production", "parked", "reduced", "outage".
const char* LoggedStateName(LoggedState s);
// The state for a word of the vocabulary above (exact, lower case), or nullopt.
std::optional<LoggedState> ParseLoggedState(const std::string& word);

// One logged 10-minute record, in SI units.
struct LoggedRecord {
  // Start of the 10-minute period: seconds since 1970-01-01 00:00 UTC, a
  // multiple of kRecordSeconds.
  int64_t time_s = 0;
  double speed_ms = 0;       // mean wind speed, m/s; NaN = not logged
  double speed_std_ms = 0;   // its standard deviation, m/s; NaN = not logged
  double direction_deg = 0;  // [0, 360), where the wind comes from; NaN = not logged
  LoggedState state = LoggedState::kParked;
  bool quality_ok = true;  // passed the data-quality checks
  std::string event;       // transient event in this record, "" = none
  // Load-channel groups whose channels were not recording, names joined by
  // ";" ("" = all recording; the plan's outages.channel_groups).
  std::string channels_down;
};

// What the log holds for a plan up to an as-of date.
struct LoggedCounts {
  std::vector<uint32_t> counts;  // per cell of plan.matrix.cells
  int64_t records_used = 0;      // records in [start, as-of)
  int64_t before_start = 0;      // records before the plan's start (not counted)
  int64_t after_as_of = 0;       // records at or after the as-of date (not counted)
  // Of the used records:
  int64_t quality_rejected = 0;  // quality flag failed
  int64_t missing_values = 0;    // speed or direction not logged, or the std
                                 // where a TI bin needed it
  int64_t outside_sector = 0;    // direction outside the valid sectors
  int64_t counted_records = 0;   // counted for a record cell
  int64_t counted_events = 0;    // counted for an event cell
  int64_t unknown_events = 0;    // events that name no event type of the plan
  // Records with a load-channel group down that every cell needs (counted
  // for no cell), and records naming a group the plan does not define (the
  // name is ignored).
  int64_t channels_down = 0;
  int64_t unknown_channel_groups = 0;
  // First and last used record (start of its period), if any.
  std::optional<int64_t> first_time_s, last_time_s;
  // End of the record with which every required cell had reached its
  // minimum (in time order), or nullopt while the matrix is not full.
  std::optional<int64_t> complete_time_s;
  // The latest used record with the quality flag passed and speed and
  // direction known: the weather a forecast starts from.
  bool has_last_wind = false;
  int64_t last_wind_time_s = 0;
  double last_speed_ms = 0, last_direction_deg = 0;
};

// 00:00 UTC of a date in seconds since 1970-01-01.
inline int64_t DateTime(const Date& d) { return DaysFromCivil(d) * 86400; }

// Places `records` (sorted by time, unique times) in the cells of `plan`'s
// matrix, counting only those before 00:00 of `as_of`. plan must be valid.
LoggedCounts CountLoggedRecords(const Plan& plan,
                                const std::vector<LoggedRecord>& records,
                                const Date& as_of);

// The state a forecast continues from at 00:00 of `as_of`: the counts, the
// days elapsed since the plan's start and the latest logged wind. as_of must
// lie in [plan.start, plan.start + horizon) (CheckAsOfDate).
CampaignState MakeCampaignState(const Plan& plan, const LoggedCounts& logged,
                                const Date& as_of);

// Throws InputError (field "--as-of") unless plan.start <= as_of < the end of
// the plan's horizon.
void CheckAsOfDate(const Plan& plan, const Date& as_of);

// True when every required cell holds at least its minimum.
bool MatrixFull(const CaptureMatrix& matrix, const std::vector<uint32_t>& counts);

}  // namespace planner

#endif  // PLANNER_LOGGED_COUNTS_H_
