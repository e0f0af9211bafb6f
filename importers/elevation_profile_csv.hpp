// Elevation profile tables for the user-defined multipath environment (pattern/environment.hpp).
//
// Format: comma-separated text. Lines starting with '#' and blank lines are ignored. The first other
// line is the header and must name exactly the columns elevation_deg, p_v and p_h (any order, any
// case). Each following line gives one elevation (degrees above the horizon, in [-90, 90], strictly
// increasing) and the relative vertical and horizontal incoming power there (finite, >= 0).
//   # street canyon, measured shape
//   elevation_deg,p_v,p_h
//   -10,0,0
//   0,1,0.3
//   30,0.2,0.1
// Errors name file, line and column.
#pragma once
#include <string>
#include <string_view>
#include <vector>

#include "pattern/environment.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

Result<std::vector<ProfilePoint>> parse_elevation_profile(std::string_view text, const std::string& display_name);
Result<std::vector<ProfilePoint>> read_elevation_profile(const std::string& path);

}  // namespace ellipsa
