// Cuts through the pattern and the beam figures read off them.
//
// Every cut is a closed loop sampled at a uniform angle step:
//   phi = const: the great circle through both poles; angle = theta from -180 to 180, where a
//                negative angle means (|theta|, phi + 180).
//   theta = const: the cone at that theta; angle = phi from 0 to 360.
//   great circle: through a centre direction c along a unit tangent t: r(s) = cos s c + sin s t,
//                 angle = s from -180 to 180 (s = 0 at c).
// Samples outside the sampled region are marked invalid; beam figures never cross them.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/components.hpp"
#include "pattern/polarisation.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

// Ratios against a null (front-to-back, cross-polar discrimination, any ratio whose denominator
// can be an exact zero): beyond null_ratio_bound_db the denominator is a null of the pattern or
// of rounding, not a level anyone measures, so the ratio is reported only as "above 60 dB".
inline constexpr double null_ratio_bound_db = 60;
struct RatioDb {
    std::optional<double> db;        // the ratio, when at most null_ratio_bound_db
    std::optional<double> above_db;  // null_ratio_bound_db, when the ratio exceeds it (or the denominator is zero)
};
// The ratio of two linear powers in dB. Nothing when the numerator is not positive or either is NaN.
RatioDb ratio_db(double numerator, double denominator);

enum class CutKind { phi_const, theta_const, great_circle };

struct CutSpec {
    CutKind kind = CutKind::phi_const;
    double phi_deg = 0;     // phi_const
    double theta_deg = 90;  // theta_const
    Vec3 centre{0, 0, 1};   // great_circle
    Vec3 tangent{1, 0, 0};  // great_circle (made orthogonal to centre)
    static CutSpec phi_cut(double phi_deg);
    static CutSpec theta_cut(double theta_deg);
    static CutSpec great_circle(Vec3 centre, Vec3 tangent);
    // The great circle through a direction, along theta-hat (elevation-like) or phi-hat (azimuth-like).
    static CutSpec through(double theta_deg, double phi_deg, bool along_phi);
    std::string label() const;            // "phi = 90 deg", "theta = 45 deg", "great circle through ..."
    const char* angle_name() const;       // "theta", "phi", "angle"
};

struct CutSamples {
    std::vector<double> angle_deg;  // uniform; first sample at the start of the range
    std::vector<double> theta_deg, phi_deg;
    std::vector<cplx> e_theta, e_phi;  // in the theta/phi basis at each sample's (theta, phi)
    std::vector<unsigned char> valid;  // 1 when inside the sampled region
    double step_deg = 1;
};

// Sample a cut; step_deg is rounded so that 360 / step is a whole even number.
CutSamples sample_cut(const FarFieldSet& s, std::size_t freq_index, const CutSpec& spec, double step_deg);
// sample_cut in two parts: the cut's angles and directions alone (every sample invalid, no
// field yet), then the field at one sample k; every k filled gives sample_cut's samples.
CutSamples cut_positions(const CutSpec& spec, double step_deg);
void sample_cut_at(const FarFieldSet& s, std::size_t freq_index, CutSamples& c, std::size_t k);
// Index of the cut sample nearest to a direction (largest dot product); -1 for an empty cut.
int nearest_cut_sample(const CutSamples& c, Vec3 dir);
// A step that resolves the grid (a quarter of its finer step, at least 0.05 deg).
double default_cut_step(const Grid& g);

// Linear power of one component along a cut (NaN where invalid).
std::vector<double> cut_power(const FarFieldSet& s, const CutSamples& c, Component comp);

// A lobe is a local maximum that stands out by at least lobe_prominence_db from the lowest point
// between it and any higher sample on each side (its topographic prominence, as
// scipy.signal.peak_prominences defines it): ripple and interpolation dips are not lobes.
inline constexpr double lobe_prominence_db = 3.0;
// The half-power level below the peak, 10 log10 2.
inline constexpr double half_power_db = 3.0102999566398120;

// Why a half-power crossing is missing on one side of the peak.
enum class EdgeStatus {
    found,         // the -3.0103 dB crossing
    outside_data,  // the cut leaves the sampled region before the power falls 3 dB
    never_falls    // the power stays above half all the way round the cut
};
enum class BeamShape {
    no_power,            // no positive sample on the cut
    beam,                // both crossings, at most 180 deg apart: hpbw_deg
    omnidirectional,     // never 3 dB below the peak on a closed cut: ripple_db
    wider_than_180,      // crossings more than 180 deg apart: no beam (half_power_span_deg)
    edges_outside_data   // a crossing lies outside the sampled range (left / right say which)
};
const char* to_string(BeamShape b);  // "beam", "omnidirectional", "wider_than_180_deg", ...

struct BeamFigures {
    BeamShape shape = BeamShape::no_power;
    double peak_angle_deg = 0;
    double peak_db = 0;
    std::optional<double> hpbw_deg;             // only for BeamShape::beam
    std::optional<double> left_deg, right_deg;  // the crossings that exist (angles on the cut)
    EdgeStatus left = EdgeStatus::never_falls, right = EdgeStatus::never_falls;  // toward lower / higher angles
    std::optional<double> ripple_db;            // omnidirectional: peak minus the lowest sample
    std::optional<double> half_power_span_deg;  // wider_than_180: the angle between the crossings
    std::optional<double> front_to_back_db;     // peak against the sample 180 deg round, up to null_ratio_bound_db
    std::optional<double> front_to_back_above_db;  // null_ratio_bound_db when that sample is a null
    std::optional<double> sidelobe_db;          // highest lobe other than the main beam (and its mirror), relative (<= 0)
    bool mirror_beam = false;                   // a mirror image of the main beam was found and not counted
};

// Beam figures of a closed cut. power: linear, NaN where invalid. start_index: where to begin the
// climb to the main lobe (-1: the largest sample). mirrored_halves: angles a and -a are mirror
// images about the axis (phi = const cuts); a lobe there within half power of the peak is the
// main beam's mirror (an axially symmetric pattern crosses its main beam twice), not a side lobe.
// Cost: O(n) for the peak and crossings, O(n) per candidate lobe tried (the highest first).
BeamFigures beam_figures(const std::vector<double>& angle_deg, const std::vector<double>& power,
                         int start_index = -1, bool mirrored_halves = false);

// A cut of several components, as every front end shows and writes it (the viewer's cut panel,
// its export, `ellipsa cut`, the report): one value from which the screen and the files draw.
struct ComponentCut {
    CutSpec spec;
    std::size_t freq_index = 0;
    CutSamples samples;
    std::vector<Component> components;
    std::vector<std::vector<double>> power;  // linear, per component, NaN outside the data
    std::vector<BeamFigures> beams;          // per component; BeamShape::no_power for a zero curve
};

// Sample the cut and compute each component with its beam figures. step_deg <= 0 uses
// default_cut_step(grid). The climb to the main lobe starts at the largest sample; between
// equal maxima (a symmetric pattern) at the one with a non-negative angle, in the cut's own
// half-plane rather than phi + 180. Errors: frequency index out of range, theta of a conical
// cut outside 0..180, a component the data cannot give (component_unavailable's words), a cut
// entirely outside the sampled region. Cost: one sample_cut and one pass per component.
Result<ComponentCut> compute_cut(const FarFieldSet& s, std::size_t freq_index, const CutSpec& spec,
                                 const std::vector<Component>& components, double step_deg = 0);

}  // namespace ellipsa
