// Multipath environments: where the incoming power comes from, and with what polarisation.
//
// An environment is two angular densities of incoming power, P_theta (vertical part) and P_phi
// (horizontal part), each integrating to 1 over the sphere, plus XPR, the vertical-to-horizontal
// power ratio (T. Taga, IEEE Trans. VT-39, 1990; conventions.md). Every model here is uniform in
// azimuth, so a density is a function of elevation only, in the environment's own frame whose up
// axis is +z (vertical = theta component, horizontal = phi component).
//
// Models
//   uniform          P_theta = P_phi = 1 / (4 pi)                         (isotropic, Taga 1990)
//   gaussian         P ~ exp(-(theta - (pi/2 - m))^2 / (2 s^2)), m the mean elevation above the
//                    horizon and s the spread, separately for V (m_V, s_V) and H (m_H, s_H)
//                    (Taga 1990's model)
//   profile          a user table of (elevation_deg, p_v, p_h), linearly interpolated in elevation,
//                    zero outside the tabulated elevations; the values are shapes, each column is
//                    normalised on its own. They are read either per unit solid angle or per unit
//                    elevation angle (power in an elevation band, already summed over azimuth).
//
// On a grid the densities are sampled at the grid points and then normalised numerically with the
// same cell weights as pattern/integrate.hpp, so that sum(P * cell solid angle) is exactly 1 on a
// full sphere: the discretisation cannot bias MEG (a constant pattern gets exactly its value).
#pragma once
#include <optional>
#include <span>
#include <string>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

enum class EnvironmentModel { uniform, gaussian, profile };
const char* to_string(EnvironmentModel m);

// How the numbers of an elevation profile table are meant.
enum class ProfileMeasure {
    per_solid_angle,  // power per steradian at that elevation (the form Taga's P_theta has)
    per_elevation     // power per unit elevation angle, summed over azimuth
};
const char* to_string(ProfileMeasure m);

struct ProfilePoint {
    double elevation_deg = 0;  // above the horizon, in [-90, 90]
    double p_v = 0;            // vertical (theta) part, relative, >= 0
    double p_h = 0;            // horizontal (phi) part, relative, >= 0
};

// The largest finite XPR a user gives, dB: beyond 160 dB the weaker weight 1/(1 + 10^(XPR/10)) is
// below the double's resolution of 1 (2^-53, about -160 dB), so the weights equal those of inf; the
// options (--xpr, the module's xpr_db) refuse a larger finite number as a mistake (give inf or
// -inf). A profile table's own XPR may lie beyond it.
constexpr double max_finite_xpr_db = 160;

struct Environment {
    EnvironmentModel model = EnvironmentModel::uniform;
    std::string name = "uniform";  // preset name, or "custom"
    std::string source;            // where the numbers come from (citation, or "from memory")
    // Vertical-to-horizontal power ratio in dB; may be +inf (vertical only) or -inf (horizontal only).
    double xpr_db = 0;
    // Gaussian model: mean elevation above the horizon and spread (standard deviation), degrees.
    double v_mean_deg = 0, v_spread_deg = 0;
    double h_mean_deg = 0, h_spread_deg = 0;
    // Profile model: strictly increasing elevations.
    std::vector<ProfilePoint> profile;
    ProfileMeasure profile_measure = ProfileMeasure::per_solid_angle;

    // Weights XPR/(1+XPR) and 1/(1+XPR), finite for infinite XPR.
    double weight_vertical() const;
    double weight_horizontal() const;
};

// Checks the parameters (finite means in [-90, 90], spreads > 0, a usable table, XPR not NaN).
// A table column whose largest value lies outside [1e-290, 1e290] is refused (rescale it, as
// choose_environment does): sums of such values underflow or overflow.
Status validate(const Environment& e);

// The named presets, as a table of data: one row per preset with the numbers and where they come
// from. Only "uniform" is a definition; the Gaussian rows are typical values quoted from memory
// (their `source` says so), good for comparing antennas with each other, not a measured site.
struct EnvironmentPreset {
    const char* name;
    const char* description;
    EnvironmentModel model;
    double xpr_db;
    double v_mean_deg, v_spread_deg, h_mean_deg, h_spread_deg;  // Gaussian rows only
    const char* source;
};
std::span<const EnvironmentPreset> environment_presets();
// The preset by name, or an Error listing the known ones.
Result<Environment> environment_preset(const std::string& name);

// The environment as a user chooses it (command-line options, the viewer's panel, a report
// option): a preset or a model, with the values the user changed. Plain data; no text parsing.
struct EnvironmentChoice {
    // A preset name, "gaussian" (all four angles given) or "profile" (a table given); empty:
    // "profile" when a table is given, "gaussian" when any angle is, "uniform" otherwise.
    std::string model;
    std::optional<double> xpr_db;  // overrides the preset's or table's XPR; may be +-inf
    std::optional<double> v_mean_deg, v_spread_deg, h_mean_deg, h_spread_deg;
    std::optional<std::vector<ProfilePoint>> profile;
    std::string profile_name;  // where the table came from, for the source line ("prof.csv")
    ProfileMeasure profile_measure = ProfileMeasure::per_solid_angle;
};
// Where the environment's XPR came from.
enum class XprOrigin { model_default, user, preset, profile_table };
const char* to_string(XprOrigin o);
struct ChosenEnvironment {
    Environment environment;
    XprOrigin xpr_from = XprOrigin::model_default;
};
// The environment a choice stands for. A preset whose angles the user changed is named
// "NAME (modified)"; a profile table is rescaled per column (each to a largest value of 1) and its
// XPR taken from the column totals on their original scale in a way that cannot overflow (unless
// the choice gives XPR). Errors: an unknown name, a combination that makes no sense (angles with
// the uniform model, a table with another model, a Gaussian model missing an angle), and every
// refusal of validate().
Result<ChosenEnvironment> choose_environment(const EnvironmentChoice& c);

// Unnormalised density toward a direction of the environment frame, given by theta (from the up
// axis), for the vertical (vertical = true) or horizontal part. Cheap: one exp at most.
double raw_density(const Environment& e, bool vertical, double theta_rad);
// The same for a profile table read per unit elevation, averaged over the theta interval [a, b]
// (used for the cells at the poles, where the per-steradian density of such a table diverges).
double raw_density_cell_mean(const Environment& e, bool vertical, double theta_a_rad, double theta_b_rad);

// Exact (to ~1e-10) share of the vertical or horizontal incoming power that arrives with theta in
// [a, b], from a fine 1-D quadrature independent of any pattern grid. Returns 1 for [0, pi].
double density_share(const Environment& e, bool vertical, double theta_a_rad, double theta_b_rad);

// The densities sampled on a pattern grid (row-major like the field arrays).
struct SampledEnvironment {
    std::vector<double> p_theta;  // per sample, per steradian
    std::vector<double> p_phi;
    double w_v = 0.5, w_h = 0.5;  // XPR/(1+XPR), 1/(1+XPR)
    // Share of the incoming power (weighted by w_v, w_h) that arrives inside the sampled region:
    // 1 on a full sphere; below 1 the figures count only what arrives where the pattern is known.
    double sampled_share = 1;
};
// Fails when a part with non-zero weight has no power at any grid sample (for example a narrow
// beam of incoming power aimed where the grid has no samples).
// Cost: one raw_density per theta row and part, plus one pass over the grid.
Result<SampledEnvironment> sample_environment(const Environment& e, const Grid& g);

// Ratio of the integrated p_v to p_h of a profile table (in its own measure), in dB: the XPR the
// table implies when its two columns are on one absolute scale; +-inf when one column is zero.
// Scale-safe: each column is integrated after dividing by its largest value, and the scales
// enter as a difference of logarithms (1e308 in both columns gives 0 dB, not NaN).
double profile_xpr_db(const Environment& e);

// True when the environment cannot tell V from H: XPR 0 dB and the same V and H density shape.
// Total-only data (no V/H split) can be scored only in such an environment.
bool polarisation_blind(const Environment& e);

// The environment as curves over elevation, for plots: the densities per steradian, normalised
// to integrate to 1 over the sphere, at `count` elevations centred in equal bands from -90 to 90 deg.
struct ElevationCurve {
    std::vector<double> elevation_deg, p_v, p_h;
};
ElevationCurve elevation_curve(const Environment& e, int count);

// One-line human description: "Gaussian (urban): V 20 deg +- 20 deg, H ..., XPR 6 dB".
std::string describe(const Environment& e);

}  // namespace ellipsa
