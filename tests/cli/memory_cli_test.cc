// Peak memory of the real program does not grow with --runs
// (docs/performance.md, "Memory"): a forecast of a small plan (one cell, a
// one-day deadline, a one-week horizon, so that runs are short) with 100
// times the runs holds about the same resident memory. Before the runs were
// folded chunk by chunk, every run's result was kept: about 300 bytes each
// here, so 300,000 runs took some 100 MB more than 3,000.
#include <gtest/gtest.h>
#include <sys/resource.h>

#include <filesystem>
#include <fstream>
#include <string>

#include "cli/cli_runner.h"

namespace fillcast_test {
namespace {

// Largest resident set of any finished child so far, in kilobytes (Linux
// getrusage(2): ru_maxrss of RUSAGE_CHILDREN covers waited-for descendants).
long ChildrenPeakKb() {
  rusage usage{};
  getrusage(RUSAGE_CHILDREN, &usage);
  return usage.ru_maxrss;
}

TEST(MemoryCliTest, PeakMemoryDoesNotGrowWithRuns) {
  const std::filesystem::path dir = TempDir("memory");
  const std::filesystem::path plan = dir / "plan.yaml";
  std::ofstream(plan) << "name: One day of light wind (memory check)\n"
                         "site_model: " +
                             SourcePath("site-models/estuary-flats.yaml") +
                             "\n"
                             "campaign: {start: 2027-01-01, deadline: 2027-01-02, "
                             "horizon_weeks: 1}\n"
                             "turbine: {name: T1, cut_in_ms: 3, rated_ms: 11, "
                             "cut_out_ms: 25, restart_ms: 22}\n"
                             "capture_matrix:\n"
                             "  production: {wind_bins_ms: [4, 6], min_records: 1}\n";
  const std::string base = "forecast " + plan.string() + " --quiet --force --json ";
  // The small run first: the children's peak after it is its own.
  const Outcome few = RunFillcast(base + (dir / "few.json").string() + " --runs 3000");
  ASSERT_EQ(few.exit_code, 0) << few.output;
  const long few_kb = ChildrenPeakKb();
  const Outcome many =
      RunFillcast(base + (dir / "many.json").string() + " --runs 300000");
  ASSERT_EQ(many.exit_code, 0) << many.output;
  const long many_kb = ChildrenPeakKb();  // the larger of the two peaks
  const nlohmann::json j = ReadJson(dir / "many.json");
  ASSERT_EQ(j["runs"], 300000);
  // Chunks of runs and the summary's tables are the same size for both; 16 MB
  // leaves room for allocator noise, against about 100 MB for kept results.
  EXPECT_LT(many_kb - few_kb, 16 * 1024) << few_kb << " KB, then " << many_kb << " KB";
}

}  // namespace
}  // namespace fillcast_test
