// The hover probe's figures for one direction: every component the data can give, axial
// ratio, tilt, sense and Stokes parameters, as label/value rows ready to show. Pure code: the
// field comes from pattern/interpolate.hpp (Cartesian interpolation) and decompose().
#pragma once
#include <string>
#include <vector>

#include "pattern/far_field.hpp"

namespace ellipsa::viewer {

struct ProbeRow {
    std::string label, value;
};
// Rows for (theta, phi) in degrees at one frequency. Outside the sampled region: the direction
// and a note. Without phase: the powers and a note instead of the polarisation rows.
std::vector<ProbeRow> probe_rows(const FarFieldSet& set, std::size_t freq, double theta_deg, double phi_deg);

}  // namespace ellipsa::viewer
