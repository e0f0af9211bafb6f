// The antennas and environments the diversity tests and benchmarks share: closed-form reference
// antennas sampled on a full-sphere grid (pattern/reference.hpp) and Taga's Gaussian environment
// with the given angles (pattern/environment.hpp).
#pragma once
#include "pattern/environment.hpp"
#include "pattern/reference.hpp"

namespace ellipsa {

// The antenna of the given kind, turned by `orientation`, at 1 GHz on a grid of `step_deg`.
inline FarFieldSet diversity_fixture(ReferenceKind kind, Mat3 orientation = {}, double step_deg = 1.0) {
    ReferenceAntenna a;
    a.kind = kind;
    a.orientation = orientation;
    return synthesize(a, step_deg, 1e9);
}

// Taga's Gaussian model (IEEE Trans. VT-39, 1990): mean elevations and spreads in degrees, XPR in dB.
inline Environment taga_environment(double v_mean_deg, double v_spread_deg, double h_mean_deg, double h_spread_deg,
                                    double xpr_db) {
    Environment e;
    e.model = EnvironmentModel::gaussian;
    e.name = "test";
    e.v_mean_deg = v_mean_deg;
    e.v_spread_deg = v_spread_deg;
    e.h_mean_deg = h_mean_deg;
    e.h_spread_deg = h_spread_deg;
    e.xpr_db = xpr_db;
    return e;
}

// The Gaussian environment most tests use: V 10 +- 15 deg, H 20 +- 30 deg, XPR 6 dB.
inline Environment urbanish_environment() { return taga_environment(10, 15, 20, 30, 6); }

}  // namespace ellipsa
