#include "io/manual_test_reader.h"

#include <string>
#include <vector>

#include "io/plan_fields.h"

namespace planner {
namespace io {
namespace {

const std::vector<std::string> kManualTestsFields = {"crew", "tests"};
const std::vector<std::string> kCrewFields = {"weekdays", "hours"};
const std::vector<std::string> kTestFields = {"name", "wind_ms", "min_interval_h"};
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

ManualTest ReadTest(const Field& f, const TurbineSpec& turbine, NameSet* names) {
  const FieldMap m(f, kTestFields);
  ManualTest test;
  test.name = ReadTestName(m, names);
  const Field wind = m.Get("wind_ms");
  const auto [lo, hi] = ReadWindRange(wind);
  test.wind_lo_ms = lo;
  test.wind_hi_ms = hi;
  if (hi <= turbine.cut_in_ms || lo >= turbine.cut_out_ms) {
    Fail(wind, PairText(wind) + " lies outside turbine.cut_in_ms to cut_out_ms (" +
                   FormatNumber(turbine.cut_in_ms) + "-" +
                   FormatNumber(turbine.cut_out_ms) +
                   " m/s); a test is done while the turbine produces, so it could "
                   "never be done");
  }
  test.min_interval_h =
      ReadNumber(m, "min_interval_h", Interval("(]", 0, 8760, "h"), test.min_interval_h);
  return test;
}

}  // namespace

void ReadManualTests(const Field& f, Plan* plan) {
  const FieldMap m(f, kManualTestsFields);
  if (const auto crew = m.Find("crew")) plan->crew = ReadCrew(*crew);
  const Field tests = m.Get("tests");
  const std::vector<Field> items = AsList(tests);
  if (items.empty()) Fail(tests, "is empty; give at least one test");
  NameSet names("manual test");
  for (const Field& item : items) {
    plan->manual_tests.push_back(ReadTest(item, plan->turbine, &names));
  }
}

}  // namespace io
}  // namespace planner
