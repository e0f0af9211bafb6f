// The patterns the viewer opens when it is given no file and finds no example files: three
// closed-form antennas (pattern/reference.hpp), invented for the demo.
#pragma once
#include <vector>

#include "pattern/far_field.hpp"

namespace ellipsa::viewer {

// A crossed-dipole turnstile (right-hand circular toward +z), a half-wave dipole along z and a
// small loop in the xy-plane, sampled on a step_deg grid at 2.45 GHz.
std::vector<FarFieldSet> demo_patterns(double step_deg = 1.0);

}  // namespace ellipsa::viewer
