// Reading plans and site models from YAML (yaml-cpp). Every field, unit and
// default is specified in docs/plan.md and docs/site-model.md.
//
// Readers validate everything: unknown keys, wrong types, out-of-range values
// and inconsistent combinations all throw InputError naming file, line,
// column, field, the value and what is valid. A plan that loads is safe to
// simulate.
#ifndef PLANNER_PLAN_READER_H_
#define PLANNER_PLAN_READER_H_

#include <string>

#include "planner/plan.h"
#include "planner/site_model.h"

namespace planner {

// Reads the plan at `path` and the site model it references (a path relative
// to the plan's folder).
Plan LoadPlan(const std::string& path);

// Reads a site model file.
SiteModel LoadSiteModel(const std::string& path);

// The same from text; `file_name` is used in messages, `base_dir` to resolve
// the plan's site-model path.
Plan ParsePlan(const std::string& yaml_text, const std::string& file_name,
               const std::string& base_dir);
SiteModel ParseSiteModel(const std::string& yaml_text, const std::string& file_name);

}  // namespace planner

#endif  // PLANNER_PLAN_READER_H_
