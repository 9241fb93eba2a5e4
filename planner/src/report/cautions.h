// The cautions every written report carries (terminal text, JSON, HTML) and
// the README repeats. Kept in one place so the wording never drifts apart.
#ifndef PLANNER_REPORT_CAUTIONS_H_
#define PLANNER_REPORT_CAUTIONS_H_

#include <string>
#include <vector>

namespace planner {

// Plain sentences, one per caution, without bullets or line breaks:
// the forecast is an estimate, not a promise; matrix counts, valid sectors
// and procedures are those agreed with the certification body; turbine work
// follows local safety rules and is done by qualified people.
std::vector<std::string> StandardCautions();

// The closing part of every text report: "Notes on this result" (when
// `notes` is not empty), then the cautions, one wrapped item each.
std::string NotesAndCautionsText(const std::vector<std::string>& notes);

}  // namespace planner

#endif  // PLANNER_REPORT_CAUTIONS_H_
