// Points on the Poincare sphere: each direction's polarisation state as the normalised Stokes
// vector (Q, U, V) / I, so linear states lie on the equator, right-hand circular at the north pole
// (V > 0, IEEE sense) and left-hand at the south pole. The spread of the cloud of strong
// directions shows how much the polarisation varies over the beam.
#pragma once
#include <cstddef>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/polarisation.hpp"

namespace ellipsa::viewer {

struct PoincarePoint {
    double s1 = 0, s2 = 0, s3 = 0;  // Q/I, U/I, V/I
    double below_peak_db = 0;       // total power relative to the peak, <= 0
};

inline PoincarePoint poincare_point(const Stokes& s) {
    if (!(s.i > 0)) return {};
    return {s.q / s.i, s.u / s.i, s.v / s.i, 0};
}

// Every grid sample whose total power lies within within_db of the peak, thinned to at most
// max_points by taking every n-th qualifying sample. Needs phase (empty otherwise).
std::vector<PoincarePoint> poincare_cloud(const FarFieldSet& s, std::size_t freq_index, double within_db,
                                          std::size_t max_points = 4000);

// On-screen position of a sphere point for a fixed oblique view (looking from azimuth az_deg and
// elevation el_deg in (s1, s2, s3) space, s3 up): x right, y up, depth > 0 toward the viewer.
struct SpherePoint2 {
    double x = 0, y = 0, depth = 0;
};
SpherePoint2 view_sphere_point(double s1, double s2, double s3, double az_deg, double el_deg);

}  // namespace ellipsa::viewer
