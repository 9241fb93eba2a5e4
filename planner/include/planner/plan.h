// A measurement campaign plan: when, which turbine, where it may measure,
// how often things break, and what the capture matrix asks for.
// See docs/plan.md for the YAML form of every field.
#ifndef PLANNER_PLAN_H_
#define PLANNER_PLAN_H_

#include <string>
#include <vector>

#include "planner/angle_range.h"
#include "planner/calendar.h"
#include "planner/capture_matrix.h"
#include "planner/site_model.h"

namespace planner {

struct TurbineSpec {
  std::string name;
  double rated_power_kw = 0.0;  // informative
  double rotor_diameter_m = 0.0;
  double hub_height_m = 0.0;
  double cut_in_ms = 3.0;    // production starts at V >= cut_in
  double rated_ms = 11.0;    // informative (reports)
  double cut_out_ms = 25.0;  // stops at V >= cut_out
  // After a high-wind stop the turbine restarts only when V < restart_ms
  // (hysteresis). restart_ms <= cut_out_ms; default = cut_out_ms - 3.
  double restart_ms = 22.0;
};

// Alternating renewal process of up and repair times (exponential laws in
// this version). Long-run availability = MTBF / (MTBF + MTTR).
struct OutageModel {
  double mtbf_h = 0.0;  // mean time between failures (mean up time), hours; 0 = never fails
  double mttr_h = 0.0;  // mean time to repair, hours
};

struct Plan {
  std::string name;
  std::string source_file;  // path the plan was read from (for messages)
  SiteModel site;
  std::string site_file;  // path of the site model

  Date start;     // campaign starts at 00:00 of this date
  Date deadline;  // planned end (exclusive: records up to 00:00 of this date)
  int horizon_weeks = 156;  // simulate at most this long from start

  TurbineSpec turbine;

  // Valid measurement sectors; a record counts only if its direction is in
  // one of them. Default: the full circle.
  std::vector<AngleRange> valid_sectors{AngleRange{0.0, 360.0}};

  OutageModel turbine_outages;
  OutageModel daq_outages;  // data acquisition
  // Count parked records while the turbine is out of service (false: outage
  // records are maintenance time and count for no cell).
  bool parked_counts_during_outage = false;

  // Share of records rejected by data-quality checks, [0, 1).
  double quality_reject_fraction = 0.0;

  CaptureMatrix matrix;
};

// Steps from start to deadline, and to the horizon.
int64_t DeadlineSteps(const Plan& p);
int64_t HorizonSteps(const Plan& p);

}  // namespace planner

#endif  // PLANNER_PLAN_H_
