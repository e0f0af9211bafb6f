// Field values between grid samples.
//
// Complex data are interpolated on the Cartesian field vector (Ex, Ey, Ez), bilinearly in the
// grid's (theta, phi) index space, then projected back on theta-hat and phi-hat at the asked
// direction. That keeps the result right near the poles, where the theta/phi basis turns with phi,
// and across the phi seam. The linear phase of the frequency's interpolation centre (its phase
// centre, far_field.hpp and pattern/phase_centre.hpp) is taken out of the samples before blending
// and put back after, so a phase reference far from the antenna costs no level between samples;
// grid samples themselves come back unchanged. Magnitude-only and total-only data carry no phase:
// their partial powers are interpolated instead, and returned as real amplitudes.
#pragma once
#include <optional>

#include "pattern/far_field.hpp"

namespace ellipsa {

struct FieldSample {
    cplx e_theta, e_phi;
};

// The Cartesian field vector of grid sample (i_theta, i_phi).
CVec3 cartesian_at(const Grid& g, const FarField& f, int i_theta, int i_phi);

// Field at (theta, phi) in degrees; nullopt outside the sampled region. Any phi is accepted
// (taken modulo 360); theta must lie in [0, 180].
std::optional<FieldSample> interpolate(const FarFieldSet& s, std::size_t freq_index, double theta_deg,
                                       double phi_deg);
// Same, for a direction vector (need not be normalised).
std::optional<FieldSample> interpolate(const FarFieldSet& s, std::size_t freq_index, Vec3 dir);

// Bilinear weights into the grid for one direction: four samples and their weights. Returns false
// when the direction lies outside the sampled region. Exposed for batch users (mesh builders).
struct GridStencil {
    int i_theta[2];
    int i_phi[2];
    double w[2][2];  // w[a][b] weights sample (i_theta[a], i_phi[b])
};
bool grid_stencil(const Grid& g, double theta_deg, double phi_deg, GridStencil& out);

}  // namespace ellipsa
