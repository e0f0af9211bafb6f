// Sphere coverage: the share of the sphere (or of a band of elevations) where a component is at
// least a given level, as a complementary cumulative distribution over solid angle.
//
// Each grid sample stands for its cell, with the exact cell solid angles of pattern/integrate
// (the same weights as every other integral over the sphere). Inside a cell the value is not
// taken as constant: each quarter of the cell (sample to cell edge in theta, times sample to cell
// edge in phi, the edge half-way to the neighbour) carries the bilinear interpolant of the linear
// power between the sample, the two half-way values and the corner, and its exact solid angle is
// spread evenly over the range of values it spans. A level that cuts through a cell so counts the
// part of the cell above it (to second order in the step) instead of the whole cell or none:
// the share converges to the closed form as the step shrinks, with the error falling as the
// step's square (tests/unit/test_sphere_coverage.cpp). Where there is no neighbour (the edge of
// the sampled region, a NaN), the value is held at the sample's.
// An elevation band clips the cells: a cell that straddles the band edge counts with the part
// of its solid angle inside the band, dphi * (cos(max(a, t_lo)) - cos(min(b, t_hi))),
// theta = 90 deg - elevation, and with the values of that part only.
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

// The distribution as knots from the highest level down, each with the share of the band where
// the value is at least that high. Between two knots the share is linear in the linear level
// (share_at_or_above() reads it so); a level that holds a share of its own (a flat region, an
// exact zero) has two knots, the share just above it and the share at it.
struct CoverageCurve {
    std::vector<double> level;     // knots, linear, descending (not strictly: see above)
    std::vector<double> level_db;  // the same in dB (-inf for zero power)
    std::vector<double> share;     // share of the band at or above level[k], rising to the non-NaN sampled share
    double band_solid_angle_sr = 0;
    double sampled_share = 0;      // share of the band inside the sampled region
};

// values: linear power per grid sample (grid.size(), row-major as the field arrays); NaN is not
// counted. Cost: one pass over the grid and a sort of up to 8 events a sample inside the band.
CoverageCurve coverage_curve(const Grid& g, const std::vector<double>& values, ElevationBand band);

// Share of the band where the value is at least level_db (on the piecewise-linear curve).
double share_at_or_above(const CoverageCurve& c, double level_db);

// Solid angle (sr) of the band where the value is at least `level` (linear, the values' own
// unit), by the same quarter-cell model, without the curve: one pass over the grid, no sort.
// For one level of any quantity that is smooth between samples (ar_solid_angle uses it for |V|/I).
// Rows whose quarters all lie below a positive level (with their neighbour rows' values) are
// passed over, which changes no bit of the sum; every_row: visit every row (for tests).
double solid_angle_at_or_above(const Grid& g, const std::vector<double>& values, double level, ElevationBand band = {},
                               bool every_row = false);

// One quarter cell of the model above: the range of values its interpolant spans and its solid angle.
struct QuarterCell {
    double lo = 0, hi = 0, solid_angle_sr = 0;
};
// Every quarter cell inside the band, in the order the figures above sum them. The general path
// (each sample's cells clipped on its own) is the definition; by default a faster path takes
// the unclipped interior of the grid. general_only: the definition alone. For tests, which
// hold the two to the same cells bit for bit.
std::vector<QuarterCell> quarter_cells(const Grid& g, const std::vector<double>& values, ElevationBand band, bool general_only);

// Linear power of a component at every grid sample of one frequency, as a new array
// (component_power_grid of pattern/components.hpp). The caller checks that the data can give it.
std::vector<double> component_power_samples(const FarFieldSet& s, std::size_t freq_index, Component c);

// The same component of `b` at every grid sample of `a`'s grid (b interpolated on the Cartesian
// field vector where the grids differ; NaN outside b's sampled region).
std::vector<double> component_power_on_grid(const FarFieldSet& b, std::size_t freq_index, Component c, const Grid& grid);

// Per sample, the larger of two value arrays (the best of two antennas); NaN where either is NaN.
std::vector<double> best_of(const std::vector<double>& a, const std::vector<double>& b);

}  // namespace ellipsa
