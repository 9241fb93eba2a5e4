#include "cli/plan_warnings.h"

#include <iostream>

#include "planner/reachability.h"

namespace planner {

void WarnUnreachable(const Plan& plan) {
  const Reachability r = FindUnreachableCells(plan);
  if (r.required_unreachable == 0) return;
  std::cerr << "warning: " << plan.source_file << ": " << r.required_unreachable
            << (r.required_unreachable == 1 ? " required cell" : " required cells")
            << " can never fill:\n";
  for (const UnreachableCell& u : r.cells) {
    if (u.required) std::cerr << "  " << u.reason << "\n";
  }
  std::cerr << "  " << UnreachableAdvice(r) << "\n";
}

}  // namespace planner
