// Direction ranges in degrees (clockwise from north, where the wind comes
// from), used for valid measurement sectors and excluded sectors.
//
// A range runs clockwise from from_deg to to_deg and may wrap through north:
// {350, 20} covers 350..360 and 0..20. from_deg == to_deg is empty; a full
// circle is written {0, 360}.
#ifndef PLANNER_ANGLE_RANGE_H_
#define PLANNER_ANGLE_RANGE_H_

#include <vector>

namespace planner {

struct AngleRange {
  double from_deg = 0.0;  // [0, 360)
  double to_deg = 360.0;  // [0, 360]
};

// Width of the range in degrees, in [0, 360].
double AngleRangeWidth(const AngleRange& r);

// True if direction_deg (any value; taken modulo 360) lies in [from, to).
bool AngleRangeContains(const AngleRange& r, double direction_deg);

// Degrees of [from_deg, from_deg + width_deg) covered by the union of ranges
// (overlaps among `ranges` are counted once).
double AngleOverlapDeg(const std::vector<AngleRange>& ranges, double from_deg,
                       double width_deg);

}  // namespace planner

#endif  // PLANNER_ANGLE_RANGE_H_
