#include "io/manual_test_reader.h"

#include <string>
#include <vector>

#include "io/plan_fields.h"

namespace planner {
namespace io {
namespace {

const std::vector<std::string> kManualTestsFields = {"crew", "tests", "parking"};
const std::vector<std::string> kCrewFields = {"weekdays", "hours"};
const std::vector<std::string> kTestFields = {"name", "wind_ms", "min_interval_h",
                                              "lead_time_days", "from", "to"};
const std::vector<std::string> kParkingFields = {
    "name", "wind_ms", "hours", "min_interval_h", "lead_time_days", "from", "to"};
const Limits kLeadTimeLimits = Interval("[]", 0, 3650, "days");
// In the order of CrewSchedule::weekdays (Sunday first).
const std::vector<std::string> kWeekdays = {"sun", "mon", "tue", "wed",
                                            "thu", "fri", "sat"};
const char kWeekdayList[] = "mon, tue, wed, thu, fri, sat, sun";

int WeekdayIndex(const Field& f) {
  const std::string text = AsText(f);
  for (std::size_t i = 0; i < kWeekdays.size(); ++i) {
    if (kWeekdays[i] == text) return static_cast<int>(i);
  }
  Fail(f, Describe(f.node) + " is not a weekday; valid: " + kWeekdayList);
}

CrewSchedule ReadCrew(const Field& f) {
  const FieldMap m(f, kCrewFields);
  CrewSchedule crew;
  if (const auto days = m.Find("weekdays")) {
    const std::vector<Field> items = AsList(*days);
    if (items.empty()) {
      Fail(*days, std::string("is empty; give the days the crew is on site, e.g. [") +
                      "mon, tue, wed, thu, fri]");
    }
    crew.weekdays.fill(false);
    for (const Field& item : items) {
      const int day = WeekdayIndex(item);
      if (crew.weekdays[day])
        Fail(item, Text(item) + " is given twice; give each day once");
      crew.weekdays[day] = true;
    }
  }
  if (const auto hours = m.Find("hours")) crew.hours = ReadHourWindow(*hours);
  return crew;
}

std::string ReadTestName(const FieldMap& m, NameSet* names) {
  const Field f = m.Get("name");
  const std::string name = AsText(f);
  if (!IsIdentifier(name)) {
    Fail(f, Describe(f.node) +
                " is not a valid event name; use lowercase letters, digits and _, "
                "starting with a letter (e.g. emergency_stop)");
  }
  if (name == kStartUpEvent || name == kNormalStopEvent) {
    Fail(f, "'" + name +
                "' is a natural event type (start_up, normal_stop); give the manual "
                "test another name");
  }
  names->Add(f, name);
  return name;
}

// lead_time_days, from and to of a test or a park. The window must leave at
// least one day on which the action may be done.
ActionDates ReadActionDates(const FieldMap& m, const Plan& plan) {
  ActionDates d;
  d.lead_time_days = ReadWholeNumber(m, "lead_time_days", kLeadTimeLimits, 0);
  if (const auto from = m.Find("from")) d.from = AsDate(*from);
  if (const auto to = m.Find("to")) {
    d.to = AsDate(*to);
    const Date first = AddDays(plan.start, d.lead_time_days);
    const Date earliest = d.from && DaysBetween(first, *d.from) > 0 ? *d.from : first;
    if (DaysBetween(earliest, *d.to) <= 0) {
      Fail(*to, Text(*to) + " is not after the first day the action may be done (" +
                    FormatDate(earliest) +
                    ": the later of from and the campaign's start plus "
                    "lead_time_days); the window would hold no day");
    }
  }
  return d;
}

ManualTest ReadTest(const Field& f, const Plan& plan, NameSet* names) {
  const TurbineSpec& turbine = plan.turbine;
  const FieldMap m(f, kTestFields);
  ManualTest test;
  test.name = ReadTestName(m, names);
  const Field wind = m.Get("wind_ms");
  const auto [lo, hi] = ReadWindRange(wind);
  test.wind_lo_ms = lo;
  test.wind_hi_ms = hi;
  CheckWindInProduction(wind, lo, hi, turbine, "a test is done while the turbine produces");
  test.min_interval_h =
      ReadNumber(m, "min_interval_h", Interval("(]", 0, 8760, "h"), test.min_interval_h);
  test.dates = ReadActionDates(m, plan);
  return test;
}

CrewParking ReadParking(const Field& f, const Plan& plan, NameSet* names) {
  const FieldMap m(f, kParkingFields);
  CrewParking p;
  p.name = names->Read(m);
  const Field wind = m.Get("wind_ms");
  const auto [lo, hi] = ReadWindRange(wind);
  p.wind_lo_ms = lo;
  p.wind_hi_ms = hi;
  CheckWindInProduction(wind, lo, hi, plan.turbine,
                        "the crew parks a producing turbine");
  p.hours = ReadNumber(m, "hours", Interval("(]", 0, 24, "h"));
  p.min_interval_h =
      ReadNumber(m, "min_interval_h", Interval("(]", 0, 8760, "h"), p.min_interval_h);
  p.dates = ReadActionDates(m, plan);
  return p;
}

}  // namespace

void ReadManualTests(const Field& f, Plan* plan) {
  const FieldMap m(f, kManualTestsFields);
  if (const auto crew = m.Find("crew")) plan->crew = ReadCrew(*crew);
  if (!m.Has("tests") && !m.Has("parking")) {
    Fail(f, "has neither tests nor parking; give at least one of them");
  }
  const Plan& p = *plan;
  if (const auto tests = m.Find("tests")) {
    // (Messages say "test"; names are unique among the manual tests.)
    const std::vector<Field> items = AsList(*tests);
    if (items.empty()) Fail(*tests, "is empty; give at least one test");
    plan->manual_tests = ReadNamedItems<ManualTest>(
        *tests, "manual test", 0, "",
        [&p](const Field& item, NameSet* names) { return ReadTest(item, p, names); });
  }
  if (const auto parking = m.Find("parking")) {
    plan->crew_parking = ReadNamedItems<CrewParking>(
        *parking, "park test", 0, "",
        [&p](const Field& item, NameSet* names) { return ReadParking(item, p, names); });
  }
}

}  // namespace io
}  // namespace planner
