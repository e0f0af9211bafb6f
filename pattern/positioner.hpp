// The angle systems of two-axis range positioners, beside theta/phi (docs/conventions.md,
// "Positioner grids"). Boresight is +z in both. Each direction and its two unit vectors come from
// the positioner's rotations (the lower axis fixed in the room, the upper one riding on it, the
// probe fixed on the room's +z axis); they are the az/el systems of Masters & Gregson,
// "Coordinate system plotting for antenna measurements", AMTA 2007:
//
//   azimuth over elevation (elevation the lower axis; poles at +-y):
//     r = (sin az cos el, sin el, cos az cos el)
//     az-hat = ( cos az, 0, -sin az),  el-hat = (-sin az sin el, cos el, -cos az sin el)
//   elevation over azimuth (azimuth the lower axis; poles at +-x):
//     r = (sin az, cos az sin el, cos az cos el)
//     az-hat = ( cos az, -sin az sin el, -sin az cos el),  el-hat = (0, cos el, -sin el)
//
// In both, az-hat x el-hat = r-hat (the right-handed order of theta-hat x phi-hat), so a field
// given as (E_az, E_el) in a grid's own unit vectors is E = E_az az-hat + E_el el-hat, and the
// circular parts follow from (E_az, E_el) with the formulas of theta/phi. The formulas hold for
// any angle values (az + 180 with 180 - el is the same direction as az, el).
#pragma once
#include <cmath>

#include "pattern/vec3.hpp"

namespace ellipsa {

enum class PositionerGrid { az_over_el, el_over_az };

struct PositionerFrame {
    Vec3 r, az_hat, el_hat;
};

// Direction and unit vectors at (az, el) in radians. Cost: two sincos.
inline PositionerFrame positioner_frame(PositionerGrid g, double az_rad, double el_rad) {
    const double sa = std::sin(az_rad), ca = std::cos(az_rad), se = std::sin(el_rad), ce = std::cos(el_rad);
    if (g == PositionerGrid::az_over_el) return {{sa * ce, se, ca * ce}, {ca, 0, -sa}, {-sa * se, ce, -ca * se}};
    return {{sa, ca * se, ca * ce}, {ca, -sa * se, -sa * ce}, {0, ce, -se}};
}

// The angles of a unit direction: the lower axis's angle in (-180, 180] deg, the other in
// [-90, 90] deg (az-over-el: el = asin y, az = atan2(x, z); el-over-az: az = asin x,
// el = atan2(y, z)). The other representation of the same direction is (az + 180, 180 - el)
// for az-over-el and (180 - az, el + 180) for el-over-az.
inline void positioner_angles(PositionerGrid g, Vec3 r, double& az_deg, double& el_deg) {
    if (g == PositionerGrid::az_over_el) {
        el_deg = std::atan2(r.y, std::hypot(r.x, r.z)) / deg;
        az_deg = std::atan2(r.x, r.z) / deg;
    } else {
        az_deg = std::atan2(r.x, std::hypot(r.y, r.z)) / deg;
        el_deg = std::atan2(r.y, r.z) / deg;
    }
}

}  // namespace ellipsa
