#include "report/cautions.h"

#include "report/text_format.h"

namespace planner {

std::vector<std::string> StandardCautions() {
  return {
      "A forecast is an estimate, not a promise: it comes from a model of the weather, "
      "the turbine and its outages, and the real campaign may take longer or shorter.",
      "The capture-matrix bins and counts, the valid measurement sectors and the "
      "test procedures must be those agreed with the certification body under the "
      "current edition of the standards.",
      "Work on the turbine and the measurement equipment follows local safety rules "
      "and is done by qualified people; fillcast plans none of it.",
  };
}

std::string NotesAndCautionsText(const std::vector<std::string>& notes) {
  std::string out;
  if (!notes.empty()) {
    out += "\nNotes on this result\n";
    for (const std::string& n : notes) out += Wrap("  - ", n);
  }
  out += "\nCautions\n";
  for (const std::string& c : StandardCautions()) out += Wrap("  - ", c);
  return out;
}

}  // namespace planner
