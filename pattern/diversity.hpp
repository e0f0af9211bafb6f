// Polarisation diversity figures of a pattern in a multipath environment (pattern/environment.hpp).
//
//   Mean effective gain (T. Taga, IEEE Trans. VT-39, 1990):
//     MEG = integral of [ w_v G_theta P_theta + w_h G_phi P_phi ] dOmega,  w_v = XPR/(1+XPR), w_h = 1/(1+XPR)
//     split into its vertical (w_v ...) and horizontal (w_h ...) contributions.
//   Envelope correlation (R. G. Vaughan, J. B. Andersen, IEEE Trans. VT-36, 1987, XPR-weighted as in
//     conventions.md). The exact diversity gains it implies are in pattern/combining.hpp; the
//     approximation 10 sqrt(1 - rho_e) dB (equal branches, selection at 1 %; common practice)
//     stays only as a labelled comparison.
//   Polarisation balance: the shares of MEG taken in as vertical and horizontal, and the share of
//     the incoming power (environment-weighted sphere) where G_theta and G_phi lie within 3 dB.
//   Orientation robustness: MEG of the antenna turned through a set of orientations.
//
// Gain scale: gain data are used as they are; directivity data give MEG of a lossless antenna;
// relative data (unknown scale) are scaled to directivity over the full sphere (lossless
// assumption) and refused on part of the sphere. The note in the results says which applied.
//
// All functions are pure and work on one frequency of a set.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "pattern/environment.hpp"
#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

// The factor that turns the set's |E|^2 into gain for MEG, and what it assumes ("" for gain data).
struct GainScale {
    double factor = 1;
    std::string assumption;
};
Result<GainScale> gain_scale(const FarFieldSet& s, std::size_t freq_index);

// 3 dB as a power ratio: the two partial gains count as balanced when within this factor.
inline constexpr double balance_ratio_3db = 1.9952623149688795;  // 10^(3/10)

struct MegFigures {
    double meg = 0;  // linear
    // Contributions; their sum is meg. Unavailable for total-only data.
    std::optional<double> meg_vertical, meg_horizontal;
    // meg_vertical / meg and meg_horizontal / meg.
    std::optional<double> vertical_share, horizontal_share;
    // Environment-weighted share of the sphere where G_theta and G_phi are within 3 dB.
    std::optional<double> balanced_share;
    // Share of the incoming power that arrives inside the sampled region (1 on a full sphere).
    double sampled_share = 1;
    std::string assumption;  // from gain_scale
    std::vector<std::string> notes;
};

// MEG and balance of frequency `fi` in environment `e` (antenna up axis = environment up axis).
// Total-only data are accepted only in a polarisation-blind environment (XPR 0 dB and the same
// V and H density); otherwise the V/H split they lack is needed and the Error says so.
// Cost: one pass over the grid.
Result<MegFigures> mean_effective_gain(const FarFieldSet& s, std::size_t fi, const Environment& e);

// MEG of the antenna turned by R (E'(r) = R E(R^T r)), computed without resampling the pattern:
// with r = R u, MEG = integral of [w_v |v(u).E(u)|^2 P_v(R u) + w_h |h(u).E(u)|^2 P_h(R u)] dOmega_u,
// where v(u), h(u) are the environment's vertical and horizontal unit vectors seen in the antenna
// frame. For an azimuth-uniform environment they and P depend only on n = R^T z (where "up" points
// in the antenna frame): |v.E|^2 = |n.E|^2 / (1 - (n.u)^2), |h.E|^2 = |E|^2 - |v.E|^2. The rotated
// densities are normalised numerically on the grid. Needs the full sphere and complex data
// (magnitude-only lacks the E_theta/E_phi phase the turned split needs).
Result<MegFigures> mean_effective_gain_rotated(const FarFieldSet& s, std::size_t fi, const Environment& e,
                                               const Mat3& r);

// The orientation set: the antenna is first turned by `roll` about its own z axis, then tilted by
// `tilt` about the world's horizontal x axis: R = R_x(tilt) R_z(roll). The environments are
// uniform in azimuth, so a turn about the world's vertical changes nothing and this set covers
// every orientation with the antenna's axis up to tilt_max from vertical. Tilts 0 and 180 are counted
// once (every roll gives the same MEG there).
struct OrientationSweep {
    double tilt_step_deg = 15;
    double tilt_max_deg = 90;
    double roll_step_deg = 15;
};
// The most orientations a sweep may hold. Each costs one pass over the grid (about 0.35 ms on a
// 1-degree grid), so this bounds the work at well under a minute; 0.1-degree steps over every
// orientation (6.5 million) would run for hours. 1-degree steps over every orientation fit.
inline constexpr double max_sweep_orientations = 100000;
// Tilts from 0 to tilt_max (tilt_max itself included) times rolls over [0, 360): the size of the set.
double sweep_orientation_count(const OrientationSweep& sweep);
// Checks the ranges of the steps and the largest tilt, and the set's size (max_sweep_orientations).
Status validate(const OrientationSweep& sweep);

struct OrientationSample {
    double tilt_deg = 0, roll_deg = 0;
    double meg = 0, meg_vertical = 0, meg_horizontal = 0;  // linear
};
struct TiltRow {
    double tilt_deg = 0;
    double min = 0, mean = 0, max = 0;  // linear MEG over the rolls at this tilt
};
struct OrientationFigures {
    std::vector<OrientationSample> samples;  // tilt-major, roll-minor
    std::vector<TiltRow> by_tilt;
    double min = 0, median = 0, max = 0;  // linear MEG over all samples
    OrientationSample worst, best;
    // Mean over orientations drawn uniformly at random with the axis within tilt_max of vertical:
    // each tilt row stands for the band of axis directions halfway to its neighbours and is
    // weighted by that band's solid angle (cos a - cos b).
    double random_mean = 0;
    // The MEG that 90 % of such random orientations reach or exceed (same weights; the value of
    // the sample where the cumulative weight passes 10 %).
    double random_p10 = 0;
    // Each sample's weight in that random-orientation distribution (in the order of `samples`,
    // summing to 1): what a mixture over orientations (rank.hpp's fading level) integrates with.
    std::vector<double> random_weights;
    bool exact_roll_shift = false;  // rolls done by exact column shifts of the grid (roll step multiple of phi step)
};
// Cost: with the roll step a multiple of the grid's phi step, one acos and two density
// evaluations per grid sample per tilt, plus about 15 flops per sample per orientation; otherwise
// the densities are evaluated for every orientation.
Result<OrientationFigures> orientation_robustness(const FarFieldSet& s, std::size_t fi, const Environment& e,
                                                  const OrientationSweep& sweep);

struct CorrelationFigures {
    double ecc = 0;                  // envelope correlation rho_e in [0, 1]
    double approximate_gain_db = 0;  // 10 sqrt(1 - rho_e): a comparison only (pattern/combining.hpp is exact)
    double sampled_share = 1;
    bool resampled = false;  // the second pattern was interpolated onto the first one's grid
};
// rho_e between frequency fa of a and fb of b in environment e. Both need complex data; b is
// interpolated (Cartesian, pattern/interpolate.hpp) onto a's grid when the grids differ and must
// cover it. Cost: one pass over the grid (plus the interpolation when resampling).
Result<CorrelationFigures> envelope_correlation(const FarFieldSet& a, std::size_t fa, const FarFieldSet& b,
                                                std::size_t fb, const Environment& e);

// Frequency fi of s interpolated (Cartesian, pattern/interpolate.hpp) onto the samples of g.
// Error (without a subject: "does not cover the grid (no data at theta .., phi .. deg)") when g
// reaches outside s's data. Cost: one interpolation per sample of g.
Result<FarField> resample_field(const FarFieldSet& s, std::size_t fi, const Grid& g);

// The approximation 10 sqrt(1 - rho_e) dB of two-branch selection combining at 1 % outage (equal
// branches; common practice), kept for comparison with the exact figure (rho_e clamped to [0, 1]).
double approximate_selection_gain_db(double ecc);

}  // namespace ellipsa
