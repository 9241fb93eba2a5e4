// Fuzz target: the site-model reader (ParseSiteModel). A model that loads is
// also summarised (SiteMeanSpeed), as every report does with it.
#include <cmath>
#include <cstdlib>

#include "fuzz_common.h"
#include "planner/error.h"
#include "planner/plan_reader.h"

extern "C" int LLVMFuzzerTestOneInput(const uint8_t* data, size_t size) {
  try {
    const planner::SiteModel site =
        planner::ParseSiteModel(fillcast_fuzz::AsText(data, size), "site.yaml");
    // A loaded model is valid: its mean speed is a finite positive number.
    const double mean_ms = planner::SiteMeanSpeed(site);
    if (!(std::isfinite(mean_ms) && mean_ms > 0.0)) std::abort();
  } catch (const planner::InputError&) {
    // Bad input, reported as such: the expected outcome.
  }
  return 0;
}
