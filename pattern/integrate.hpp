// Integration over the sampled part of the sphere.
//
// Each sample is the centre of a cell whose exact solid angle is
//   dphi * (cos(t - dt/2) - cos(t + dt/2)),
// with the cell clipped to the sampled theta range (so to the poles on a full sphere) and, when
// phi does not go all the way round, to the sampled phi range. phi = 0 and phi = 360 are never
// both counted: a wrapping grid stores phi in [0, 360).
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "pattern/far_field.hpp"

namespace ellipsa {

struct CellWeights {
    std::vector<double> theta;  // per theta row: cos(a) - cos(b) of the clipped cell [a, b]
    std::vector<double> phi;    // per phi column: clipped cell width in radians
    // Solid angle of sample (i, j) is theta[i] * phi[j].
};
CellWeights cell_weights(const Grid& g);

// Sampled solid angle over 4 pi, in [0, 1]; 0 for cuts (far_field.hpp, Sampling).
double coverage(const Grid& g);
// True when the sampled cells cover the whole sphere (to 1e-9); never for cuts.
bool is_full_sphere(const Grid& g);
// Why a figure over the whole sphere (directivity, efficiency, MEG, ECC, coverage, a 3D surface)
// cannot come from this grid, in words that follow "needs the whole sphere; ": "the data hold
// cuts only (phi 0, 90 deg)", "the data hold cuts only (theta 90 deg)", "the data cover 50.0 %
// of it". Empty when the grid is the full sphere. The one wording every front end uses.
std::string sphere_shortfall(const Grid& g);

// Integral of |E|^2 over the sampled sphere (the radiated power in units where an isotropic
// radiator of unit intensity radiates 4 pi).
double radiated_power(const Grid& g, const FarField& f);

// Integral of an arbitrary per-sample function value (already evaluated at each grid sample).
double integrate_samples(const Grid& g, const CellWeights& w, const double* values);

struct PowerFigures {
    double radiated_power = 0;  // integral of |E|^2 dOmega over the sampled region
    double coverage = 0;
    // 4 pi U_max / P: only when the sphere is fully sampled.
    std::optional<double> directivity;
    // P / 4 pi: only for absolute gain data on the full sphere.
    std::optional<double> radiation_efficiency;
    // 4 pi U_max / P over the sampled region only ("assuming nothing radiates outside"):
    // given for partial coverage so a user can see it, clearly labelled as such.
    std::optional<double> directivity_sampled_only;
};
// u_max: the peak |E|^2 (refined or sampled) to use for directivity.
PowerFigures power_figures(const FarFieldSet& s, std::size_t freq_index, double u_max);

}  // namespace ellipsa
