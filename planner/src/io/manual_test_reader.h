// Reading the manual_tests section of a plan (docs/plan.md#manual_tests): when
// a crew is on site, and the tests it does.
#ifndef PLANNER_IO_MANUAL_TEST_READER_H_
#define PLANNER_IO_MANUAL_TEST_READER_H_

#include "io/yaml_fields.h"
#include "planner/plan.h"

namespace planner {
namespace io {

// Fills plan->crew and plan->manual_tests. Test names are unique lowercase
// identifiers other than the natural event types; a test's wind window must
// overlap the turbine's production range (plan->turbine must be read first).
void ReadManualTests(const Field& f, Plan* plan);

}  // namespace io
}  // namespace planner

#endif  // PLANNER_IO_MANUAL_TEST_READER_H_
