// Helpers shared by the reader tests.
#ifndef FILLCAST_TESTS_IO_READER_TEST_UTIL_H_
#define FILLCAST_TESTS_IO_READER_TEST_UTIL_H_

#include <gtest/gtest.h>

#include <functional>
#include <string>
#include <vector>

#include "planner/error.h"
#include "planner/plan_reader.h"

namespace planner {
namespace reader_test {

// `text` with the first `from` replaced by `to`; a marker text if `from` is
// missing, so that a mistyped case fails instead of testing the base text.
inline std::string Replace(std::string text, const std::string& from,
                           const std::string& to) {
  const std::size_t at = text.find(from);
  if (at == std::string::npos) return "test bug: '" + from + "' not in the base text";
  return text.replace(at, from.size(), to);
}

// The InputError message `action` throws, or a marker if it throws none.
inline std::string ErrorOf(const std::function<void()>& action) {
  try {
    action();
  } catch (const InputError& e) {
    return e.what();
  }
  return "(no error)";
}

inline std::string SourcePath(const std::string& relative) {
  return std::string(FILLCAST_SOURCE_DIR) + "/" + relative;
}

// The four lines every reader test's plan starts with: its name, the shipped
// coastal-ridge site model, a one-year campaign and a turbine.
inline std::string PlanHead(const std::string& name) {
  return "name: " + name +
         "\n"
         "site_model: coastal-ridge.yaml\n"
         "campaign: {start: 2027-03-01, deadline: 2028-03-01}\n"
         "turbine: {name: T1, cut_in_ms: 3, rated_ms: 11, cut_out_ms: 25}\n";
}

// Eight lines: PlanHead and a production matrix of four wind bins (lines
// 5-8). A section under test follows from line 9.
inline std::string BasePlan(const std::string& name) {
  return PlanHead(name) +
         "capture_matrix:\n"
         "  production:\n"
         "    wind_bins_ms: {from: 4, to: 8, width: 1}\n"
         "    min_records: 10\n";
}

// A plan text read as "plan.yaml" next to the shipped site models.
inline Plan ParseTestPlan(const std::string& text) {
  return ParsePlan(text, "plan.yaml", SourcePath("site-models"));
}

inline std::string TestPlanError(const std::string& text) {
  return ErrorOf([&] { ParseTestPlan(text); });
}

// One bad input and the exact message it must give.
struct BadInput {
  const char* name;
  std::string text;
  std::string message;
};

// Each case's text, read by `error_of`, gives exactly its message.
inline void ExpectMessages(
    const std::vector<BadInput>& cases,
    const std::function<std::string(const std::string&)>& error_of) {
  for (const BadInput& c : cases) {
    SCOPED_TRACE(c.name);
    EXPECT_EQ(error_of(c.text), c.message);
  }
}

}  // namespace reader_test
}  // namespace planner

#endif  // FILLCAST_TESTS_IO_READER_TEST_UTIL_H_
