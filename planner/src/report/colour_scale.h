// The colour scale of the report's capture-matrix grids: probability (0..1)
// to a fill colour, from burnt orange (unlikely) through a pale cream (even
// chance) to deep blue (likely).
//
// Why this scale: orange against blue stays distinct for the common forms of
// colour-vision deficiency (red-green confusion), because they differ in the
// blue-yellow channel that those forms keep (common practice in chart design).
// The numbers are always written in the cell too, so nothing depends on the
// colour alone, and both ends are dark enough to survive grey-scale printing.
#ifndef PLANNER_REPORT_COLOUR_SCALE_H_
#define PLANNER_REPORT_COLOUR_SCALE_H_

#include <string>

namespace planner {

// "#rrggbb" for a probability; values outside [0, 1] are clamped, NaN reads 0.
std::string ProbabilityColour(double p);

// True when white text on ProbabilityColour(p) has more contrast than black:
// relative luminance below 0.179, where the two WCAG 2 contrast ratios
// (L + 0.05) / 0.05 and 1.05 / (L + 0.05) are equal.
bool NeedsLightText(double p);

}  // namespace planner

#endif  // PLANNER_REPORT_COLOUR_SCALE_H_
