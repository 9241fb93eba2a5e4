// Writing a site model as YAML, in exactly the format docs/site-model.md
// documents, so that the site-model reader (planner/plan_reader.h) reads it
// back to the same model (numbers to 6 significant digits).
//
// The file starts with comment lines: "# generator=fillcast <version>" (the
// mark cli/output_file.h looks for before it replaces a file), then whatever
// the caller adds, e.g. FittedModelComments().
#ifndef PLANNER_IO_SITE_MODEL_WRITER_H_
#define PLANNER_IO_SITE_MODEL_WRITER_H_

#include <string>
#include <vector>

#include "planner/site_fit.h"
#include "planner/site_model.h"

namespace planner {

// The YAML text of `site`, after the generator mark and `comments` (one
// "# " line each). Precondition: `site` is valid (as the reader leaves it).
std::string FormatSiteModelYaml(const SiteModel& site,
                                const std::vector<std::string>& comments);

// Comment lines for a fitted model: the data file, columns, units and period
// it was fitted to, how, and the caution that a fitted model is an estimate.
std::vector<std::string> FittedModelComments(const FitReport& report);

}  // namespace planner

#endif  // PLANNER_IO_SITE_MODEL_WRITER_H_
