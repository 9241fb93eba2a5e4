// A measurement campaign plan: when, which turbine, where it may measure,
// how often things break, and what the capture matrix asks for.
// See docs/plan.md for the YAML form of every field.
#ifndef PLANNER_PLAN_H_
#define PLANNER_PLAN_H_

#include <array>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "planner/angle_range.h"
#include "planner/calendar.h"
#include "planner/capture_matrix.h"
#include "planner/disturbed_sector.h"
#include "planner/replay.h"
#include "planner/site_model.h"

namespace planner {

// A high-wind stop on a short-term average: the turbine stops in a record in
// which the averaging_s moving average of the wind speed reaches threshold_ms
// (docs/methods.md, "High-wind shutdown on short-term averages").
struct ShortTermShutdown {
  double averaging_s = 3.0;    // 1 <= tau < 600 s (600 s is cut_out_ms)
  double threshold_ms = 35.0;  // above restart_ms
};

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
  // After a high-wind stop the turbine restarts only once the 10-minute mean
  // has stayed below restart_ms this long, minutes (0: in the first record
  // below it). Rounded up to whole records.
  double restart_wait_min = 0.0;
  // Stops on short-term averages besides the 10-minute mean's cut_out_ms
  // (none by default: today's cut-out on the 10-minute mean alone).
  std::vector<ShortTermShutdown> shutdown_rules;
  // Storm control: from storm_control_from_ms up to cut_out_ms the turbine
  // runs on in a reduced mode (records of the reduced state) instead of
  // stopping; 0 = no storm control. The plan's storm_control.to_ms is
  // cut_out_ms then.
  double storm_control_from_ms = 0.0;
};

// Law of a duration (up time or repair time), given by its mean.
struct DurationLaw {
  enum class Kind { kExponential, kWeibull, kLognormal };
  Kind kind = Kind::kExponential;
  // Weibull: shape k (> 0; k < 1 = early failures dominate). Lognormal: sigma
  // of ln(duration) (> 0). Unused for the exponential.
  double shape = 1.0;
};

// Alternating renewal process of up and repair times. Long-run availability
// = MTBF / (MTBF + MTTR) (reliability-engineering textbook result).
struct OutageModel {
  double mtbf_h =
      0.0;  // mean time between failures (mean up time), hours; 0 = never fails
  double mttr_h = 0.0;     // mean time to repair, hours
  DurationLaw up_law;      // law of up times, mean mtbf_h
  DurationLaw repair_law;  // law of repair times, mean mttr_h
  // Factor on the duration of a repair that starts in each month (Jan..Dec),
  // e.g. 1.5 in winter when access is harder. Default 1.
  std::array<double, 12> repair_month_factors{1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1};
};

// A fixed planned outage (e.g. a scheduled retrofit): [from, to) dates.
struct PlannedOutage {
  std::string name;
  Date from;
  Date to;              // exclusive
  bool turbine = true;  // the turbine is out of service
  bool daq = false;     // the data acquisition is down
};

// Episodes such as icing that remove whole stretches of records: they start
// at random with a rate that depends on the month and last a drawn time;
// while one lasts the turbine is stopped, its records are invalid (iced
// sensors), or both. Episodes of one kind do not overlap.
struct EpisodeModel {
  std::string name;
  // Mean number of episodes starting in each month (Jan..Dec), >= 0.
  std::array<double, 12> starts_per_month{};
  double mean_h = 24.0;      // mean duration, hours
  DurationLaw duration_law;  // law of durations, mean mean_h
  bool stops_turbine = true;
  bool invalidates_records = true;
};

// After a repair, a load-channel group's records count again only once it is
// recalibrated, which needs `hours` in a row with the 10-minute mean wind
// below below_ms and, if crew is true, the crew on site (e.g. a strain-gauge
// zero on a parked rotor in light wind).
struct Recalibration {
  bool needed = false;
  double hours = 2.0;
  double below_ms = 6.0;
  bool crew = true;
};

// A group of load channels (blade, tower, drive train ...) of the
// measurement system, with its own failures and repairs (outages.channel_groups).
struct ChannelGroup {
  std::string name;
  OutageModel failures;
  Recalibration recalibration;
};

// At most this many load-channel groups (bits of Cell::channels).
inline constexpr int kMaxChannelGroups = 16;

// A planned change that invalidates data (a controller update, a sensor
// exchange): at 00:00 of `date` the counts of `cells` go back to 0, so that
// only records from then on count for them.
struct PlannedChange {
  std::string name;
  Date date;
  std::vector<int> cells;  // indices into CaptureMatrix::cells, ascending
};

// Hours of the day [from_hour, to_hour), may wrap past midnight (22 -> 6).
struct HourWindow {
  int from_hour = 0;  // 0..23
  int to_hour = 24;   // 1..24; from == 0 && to == 24 = all day
};

// A curtailment rule: while all its conditions hold, the turbine stops or
// runs in a reduced mode. Records then do not count as normal production.
struct CurtailmentRule {
  std::string name;
  std::vector<int> months;  // 1..12; empty = every month
  HourWindow hours;
  double wind_lo_ms = 0.0;  // applies for wind_lo_ms <= V < wind_hi_ms
  double wind_hi_ms = 1e9;
  std::vector<AngleRange> directions;  // empty = every direction
  enum class Action { kStop, kReduce };
  Action action = Action::kStop;
};

// Who can be on site for manual tests.
struct CrewSchedule {
  std::array<bool, 7> weekdays{false, true, true, true, true, true, false};  // Sun..Sat
  HourWindow hours{8, 16};
};

// A manual test (e.g. an emergency stop or a grid-loss test), done when the
// crew is on site, the wind is in its window, the turbine is producing and the
// record would be valid (acquisition up, valid sector). The simulation does it
// at the first such opportunity, at most once per min_interval_h. Its event
// cells (by wind range) count the tests whose record also passes the quality
// check.
// When a crew action may first and last be done: not before lead_time_days
// after the campaign's start (approvals, procedures), and within [from, to)
// when given.
struct ActionDates {
  int lead_time_days = 0;
  std::optional<Date> from;
  std::optional<Date> to;  // exclusive
};

struct ManualTest {
  std::string name;         // event type name, e.g. "emergency_stop"
  double wind_lo_ms = 0.0;  // window [lo, hi) for doing the test
  double wind_hi_ms = 1e9;
  double min_interval_h = 4.0;  // between two tests of this kind
  ActionDates dates;
};

// A crew-initiated park (or idle) test: when the crew is on site, the turbine
// produces normally with the wind in [wind_lo_ms, wind_hi_ms) and a parked
// cell at that wind is still short, the crew parks the turbine from the next
// record for `hours`, so that parked cells at mid wind speeds fill. At most
// once per min_interval_h.
struct CrewParking {
  std::string name;
  double wind_lo_ms = 0.0;
  double wind_hi_ms = 1e9;
  double hours = 2.0;
  double min_interval_h = 24.0;
  ActionDates dates;
};

// What the campaign costs, for comparing sites and scenarios.
struct CostModel {
  double weekly = 0.0;        // running cost per week of campaign, >= 0
  double mobilisation = 0.0;  // fixed cost (set-up and removal), >= 0
  std::string currency = "EUR";
};

struct Plan {
  std::string name;
  std::string source_file;  // path the plan was read from (for messages)
  SiteModel site;
  std::string site_file;  // path of the site model

  Date start;               // campaign starts at 00:00 of this date
  Date deadline;            // planned end (exclusive: records up to 00:00 of this date)
  int horizon_weeks = 156;  // simulate at most this long from start

  TurbineSpec turbine;

  // Valid measurement sectors; a record counts only if its direction is in
  // one of them. Default: the full circle. When a layout is given, the reader
  // sets this to ValidSectorsFromLayout(layout, the sectors written in the
  // plan or the full circle).
  std::vector<AngleRange> valid_sectors{AngleRange{0.0, 360.0}};
  SiteLayout layout;  // neighbours, obstacles, exclusions (may be empty)
  // With a layout: the sectors as written in the plan (or the full circle),
  // before the layout's disturbed sectors were removed.
  std::vector<AngleRange> sectors_as_written{AngleRange{0.0, 360.0}};

  OutageModel turbine_outages;
  OutageModel daq_outages;  // data acquisition
  std::vector<PlannedOutage> planned_outages;
  std::vector<EpisodeModel> episodes;  // icing and the like (outages.episodes)
  std::vector<ChannelGroup> channel_groups;  // outages.channel_groups
  std::vector<PlannedChange> planned_changes;  // sorted by date
  std::vector<CurtailmentRule> curtailment;
  CrewSchedule crew;
  std::vector<ManualTest> manual_tests;
  std::vector<CrewParking> crew_parking;  // manual_tests.parking
  // Count parked records while the turbine is out of service (false: outage
  // records are maintenance time and count for no cell).
  bool parked_counts_during_outage = false;

  // Share of records rejected by data-quality checks, [0, 1).
  double quality_reject_fraction = 0.0;

  CaptureMatrix matrix;
  CostModel cost;

  // Weather: null = the site model's parametric weather (the default); set =
  // a block bootstrap of a measured series (plan section `weather`, source
  // replay). Shared, read-only: plans are copied for scenarios.
  std::shared_ptr<const WeatherReplay> replay;
};

// The files a plan was read from: the plan, its site model and, under
// replay, the measured series. Outputs never overwrite them.
std::vector<std::string> PlanInputFiles(const Plan& p);

// Steps from start to deadline, and to the horizon.
int64_t DeadlineSteps(const Plan& p);
int64_t HorizonSteps(const Plan& p);

}  // namespace planner

#endif  // PLANNER_PLAN_H_
