// Sphere coverage: the share of the sphere (or of a band of elevations) where a component is at
// least a given level, as a complementary cumulative distribution over solid angle.
//
// Each grid sample stands for its cell, with the exact cell solid angles of pattern/integrate
// (the same weights as every other integral over the sphere). An elevation band clips the cells:
// a cell that straddles the band edge counts with the part of its solid angle inside the band,
//   dphi * (cos(max(a, t_lo)) - cos(min(b, t_hi))),  theta = 90 deg - elevation.
// Shares are of the band's whole solid angle 2 pi (sin el_max - sin el_min); where the data do
// not reach (a partial sphere) nothing is counted, and sampled_share says how much was known.
#pragma once
#include <cstddef>
#include <optional>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/polarisation.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

// Elevation above the horizon (the xy-plane), degrees: theta = 90 - elevation.
struct ElevationBand {
    double min_deg = -90, max_deg = 90;
    bool whole_sphere() const { return min_deg <= -90 && max_deg >= 90; }
};
// "Within w degrees of the horizon": elevations -w..w.
inline ElevationBand horizon_band(double within_deg) { return {-within_deg, within_deg}; }

// The distribution: values sorted from the highest down, each with the share of the band where
// the value is at least that high (a step function: share_at_or_above() reads it exactly).
struct CoverageCurve {
    std::vector<double> level_db;  // descending sample values in dB (-inf for zero power)
    std::vector<double> share;     // share of the band at or above level_db[k], rising to sampled_share
    double band_solid_angle_sr = 0;
    double sampled_share = 0;      // share of the band inside the sampled region
};

// values: linear power per grid sample (grid.size(), row-major as the field arrays); NaN is not
// counted. Cost: one pass over the grid and a sort of the samples inside the band.
CoverageCurve coverage_curve(const Grid& g, const std::vector<double>& values, ElevationBand band);

// Share of the band where the value is at least level_db (exact on the step function).
double share_at_or_above(const CoverageCurve& c, double level_db);

// Linear power of a component at every grid sample of one frequency, as a new array
// (component_power_grid of pattern/components.hpp). The caller checks that the data can give it.
std::vector<double> component_power_samples(const FarFieldSet& s, std::size_t freq_index, Component c);

// The same component of `b` at every grid sample of `a`'s grid (b interpolated on the Cartesian
// field vector where the grids differ; NaN outside b's sampled region).
std::vector<double> component_power_on_grid(const FarFieldSet& b, std::size_t freq_index, Component c, const Grid& grid);

// Per sample, the larger of two value arrays (the best of two antennas); NaN where either is NaN.
std::vector<double> best_of(const std::vector<double>& a, const std::vector<double>& b);

}  // namespace ellipsa
