// Reading the curtailment section of a plan (docs/plan.md#curtailment).
#ifndef PLANNER_IO_CURTAILMENT_READER_H_
#define PLANNER_IO_CURTAILMENT_READER_H_

#include <vector>

#include "io/yaml_fields.h"
#include "planner/plan.h"

namespace planner {
namespace io {

// The rules of `f` (a non-empty list), in the order given. Each rule needs a
// unique name, an action and at least one condition.
std::vector<CurtailmentRule> ReadCurtailment(const Field& f);

}  // namespace io
}  // namespace planner

#endif  // PLANNER_IO_CURTAILMENT_READER_H_
