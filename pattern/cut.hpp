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
// Index of the cut sample nearest to a direction (largest dot product); -1 for an empty cut.
int nearest_cut_sample(const CutSamples& c, Vec3 dir);
// A step that resolves the grid (a quarter of its finer step, at least 0.05 deg).
double default_cut_step(const Grid& g);

// Linear power of one component along a cut (NaN where invalid).
std::vector<double> cut_power(const FarFieldSet& s, const CutSamples& c, Component comp);

struct BeamFigures {
    double peak_angle_deg = 0;
    double peak_db = 0;
    std::optional<double> hpbw_deg;           // width between the -3.0103 dB crossings
    std::optional<double> left_deg, right_deg;  // the crossings (angles on the cut)
    std::optional<double> front_to_back_db;   // peak against the sample 180 deg further round
    std::optional<double> sidelobe_db;        // highest maximum outside the first nulls, relative (<= 0)
};

// Beam figures of a closed cut. power: linear, NaN where invalid. start_index: where to begin the
// climb to the main lobe (-1: the largest sample).
BeamFigures beam_figures(const std::vector<double>& angle_deg, const std::vector<double>& power,
                         int start_index = -1);

}  // namespace ellipsa
