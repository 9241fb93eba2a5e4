// Cells that can never fill, decided from the plan alone, before any
// simulation.
//
// A record cell counts records of one operating state in a wind bin (and a
// TI bin); an event cell counts events of one type in a wind bin. Some plans
// ask for cells that the plan itself rules out: a parked cell at wind speeds
// where an available turbine always produces, a normal stop in mid-range
// wind, a manual test below cut-in, a TI bin that a turbulence table with a
// standard deviation of 0 never reaches, a curtailment rule that holds at all
// times, or planned outages that cover the whole simulated time. A required
// cell among them means that no run can ever complete: every run would
// simulate to the horizon. FindUnreachableCells names those cells with the
// reason in plain words, so that the forecast can say so before it starts.
//
// The check is exact and conservative: a cell is reported only when the
// simulation (docs/methods.md) can give it no record or event at any time,
// whatever the random numbers. A cell that is merely rare (a storm bin at a
// calm site) is not reported; the forecast shows how rarely it fills. The
// rules, per state and event type, are in docs/output.md ("Cells that can
// never fill").
//
// It is a warning, not an error: the plan stays valid, and the forecast still
// reports the other cells.
#ifndef PLANNER_REACHABILITY_H_
#define PLANNER_REACHABILITY_H_

#include <string>
#include <vector>

#include "planner/plan.h"

namespace planner {

struct UnreachableCell {
  int cell = -1;          // index into CaptureMatrix::cells
  bool required = false;  // not optional: it holds up completion
  // "Cell parked 10-12 m/s can never fill: ..." (one or two sentences).
  std::string reason;
};

struct Reachability {
  std::vector<UnreachableCell> cells;  // in matrix order
  int required_unreachable = 0;        // how many of them are required
  // True when no required cell is unreachable (completion is possible).
  bool CanComplete() const { return required_unreachable == 0; }
};

// The cells of plan.matrix that can never fill under `plan` (validated by the
// readers). Pure: no I/O.
Reachability FindUnreachableCells(const Plan& plan);

// The advice that follows a list of unreachable required cells: "The capture
// matrix cannot complete as planned: ..." ("" when there are none).
std::string UnreachableAdvice(const Reachability& r);

}  // namespace planner

#endif  // PLANNER_REACHABILITY_H_
