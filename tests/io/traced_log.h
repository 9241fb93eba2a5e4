// A campaign log written from a simulated campaign (Simulator::Trace): the
// CSV a real data acquisition would have produced for those records. Shared
// by the round-trip test and the demo-log generator (tests/tools).
#ifndef FILLCAST_TESTS_IO_TRACED_LOG_H_
#define FILLCAST_TESTS_IO_TRACED_LOG_H_

#include <cmath>
#include <cstdio>
#include <string>
#include <vector>

#include "io/met_csv_reader.h"
#include "planner/logged_counts.h"
#include "planner/plan.h"
#include "planner/simulation.h"
#include "report/report_numbers.h"

namespace fillcast_test {

struct TracedLogOptions {
  int64_t from_step = 0;        // first record written
  int64_t to_step = INT64_MAX;  // records before this one
  // Decimals of speed, std and direction; -1 = exact (the shortest text that
  // reads back as the same double).
  int decimals = -1;
  // Standard deviation written where the simulation drew no TI (such a record
  // needs none); empty = leave the cell empty. Given as TI (fraction).
  double filler_ti = NAN;
};

inline std::string Number(double x, int decimals) {
  if (std::isnan(x)) return "";
  if (decimals < 0) return planner::ExactNumber(x);
  char buf[40];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, x);
  return buf;
}

// The names of the load-channel groups down, joined by ';'.
inline std::string ChannelsDown(const planner::Plan& plan, uint32_t mask) {
  std::string out;
  for (size_t g = 0; g < plan.channel_groups.size(); ++g) {
    if (mask & (1u << g)) out += (out.empty() ? "" : ";") + plan.channel_groups[g].name;
  }
  return out;
}

inline const char* const kTracedLogHeader =
    "timestamp,speed_ms,speed_std_ms,direction_deg,state,quality,event,channels_down\n";

// One CSV line per record with the data acquisition up (records while it is
// down are absent from a real log).
inline std::string TracedLogCsv(const planner::Plan& plan,
                                const std::vector<planner::TracedRecord>& trace,
                                const TracedLogOptions& o) {
  using namespace planner;
  std::string out = kTracedLogHeader;
  const int64_t start_s = DateTime(plan.start);
  for (const TracedRecord& r : trace) {
    if (!r.daq_up || r.step < o.from_step || r.step >= o.to_step) continue;
    double std_ms = std::isnan(r.ti) ? NAN : r.ti * r.speed_ms;
    if (std::isnan(std_ms) && !std::isnan(o.filler_ti)) std_ms = o.filler_ti * r.speed_ms;
    const char* state = !r.turbine_up ? "outage" : OperatingStateName(r.state);
    const std::string event =
        r.event_type >= 0 ? plan.matrix.event_types[static_cast<size_t>(r.event_type)]
                          : "";
    out += FormatTimestamp(start_s + r.step * kRecordSeconds, true) + "," +
           Number(r.speed_ms, o.decimals) + "," +
           Number(std_ms, o.decimals + (o.decimals >= 0)) + "," +
           Number(r.direction_deg, o.decimals < 0 ? -1 : 1) + "," + state + "," +
           (r.quality_ok ? "ok" : "rejected") + "," + event + "," +
           ChannelsDown(plan, r.channels_down) + "\n";
  }
  return out;
}

}  // namespace fillcast_test

#endif  // FILLCAST_TESTS_IO_TRACED_LOG_H_
