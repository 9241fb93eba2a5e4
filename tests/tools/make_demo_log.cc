// Writes the demo's invented campaign log: the records one simulated campaign
// of demo-site/plan.yaml would have logged from its start (2027-03-01) to
// 2027-07-01, one CSV file per month, as demo-site/campaign-log/YYYY-MM.csv.
// Deterministic: the same plan, seed and run give the same files.
//
//   build/tests/fillcast_demo_log demo-site/plan.yaml demo-site/campaign-log
//
// Not part of the fillcast CLI; documented in docs/progress.md. Records while
// the simulated data acquisition was down are absent, as in a real log.
// Values are rounded as a logger would write them (speed 0.01 m/s, std
// 0.001 m/s, direction 0.1 degree); where the simulation drew no TI (a record
// that needs none), the standard deviation is written for TI 12 %.
#include <filesystem>
#include <fstream>
#include <iostream>

#include "io/traced_log.h"
#include "planner/error.h"
#include "planner/plan_reader.h"

int main(int argc, char** argv) {
  using namespace planner;
  if (argc != 3) {
    std::cerr << "usage: fillcast_demo_log PLAN.yaml OUTPUT-FOLDER\n";
    return 2;
  }
  try {
    const Plan plan = LoadPlan(argv[1]);
    const Simulator sim(plan);
    RunResult result;
    std::vector<TracedRecord> trace;
    constexpr uint64_t kSeed = 20270301, kRun = 7;  // an ordinary run (chosen once)
    sim.Trace(kSeed, kRun, &result, &trace);
    std::filesystem::create_directories(argv[2]);
    Date month = Date{plan.start.year, plan.start.month, 1};
    for (int i = 0; i < 4; ++i) {
      const Date next = month.month == 12 ? Date{month.year + 1, 1, 1}
                                          : Date{month.year, month.month + 1, 1};
      fillcast_test::TracedLogOptions o;
      o.from_step = DaysBetween(plan.start, month) * kStepsPerDay;
      o.to_step = DaysBetween(plan.start, next) * kStepsPerDay;
      o.decimals = 2;
      o.filler_ti = 0.12;
      const std::string name = StringPrintf("%04d-%02d.csv", month.year, month.month);
      const std::filesystem::path path = std::filesystem::path(argv[2]) / name;
      std::ofstream out(path, std::ios::binary);
      out << "# Invented demo campaign log: simulated records of demo-site/plan.yaml "
             "(seed 20270301, run 7), written by tests/tools/make_demo_log.cc\n"
          << fillcast_test::TracedLogCsv(plan, trace, o);
      std::cout << "wrote " << path.string() << "\n";
      month = next;
    }
  } catch (const InputError& e) {
    std::cerr << "fillcast_demo_log: " << e.what() << "\n";
    return 2;
  }
  return 0;
}
