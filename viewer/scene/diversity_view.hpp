// What the viewer's diversity panel shows, computed without any UI: the environment the user
// picked (pattern/environment.hpp choose_environment) and the figures of the shown patterns in it
// from the one diversity study the command and the report use (pattern/diversity_study.hpp). The
// panel (viewer/panel_diversity.cpp) only draws these values and edits the choice.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "pattern/diversity_study.hpp"
#include "pattern/environment.hpp"

namespace ellipsa::viewer {

// The user's environment choice: a preset by name, or "gaussian" with its own angles.
struct DiversityChoice {
    std::string preset = "uniform";  // "uniform", "indoor", "urban", "rural" or "gaussian"
    double xpr_db = 0;
    bool vertical_only = false;  // XPR = +inf
    double v_mean_deg = 10, v_spread_deg = 15, h_mean_deg = 10, h_spread_deg = 15;
    bool orientations = true;
    OrientationSweep sweep;
    bool operator==(const DiversityChoice& o) const;
};

// The names the panel offers, in order.
std::vector<std::string> diversity_choice_names();
// Start a choice from a preset: its XPR and angles become the editable values.
DiversityChoice choice_from_preset(const std::string& name);
// The core's choice the panel's values stand for (angles only for Gaussian models).
EnvironmentChoice environment_choice(const DiversityChoice& c);
// The environment a choice stands for (the preset's own source text, or "user parameters").
Result<Environment> make_environment(const DiversityChoice& c);

struct PatternDiversity {
    std::optional<MegFigures> meg;
    std::string meg_error;
    std::optional<OrientationFigures> orientations;
    std::string orientation_error;
};
struct DiversityFigures {
    std::optional<Environment> environment;
    std::string environment_error;
    ElevationCurve curve;        // the densities over elevation, for the profile plot
    PatternDiversity a, b;       // b only when a second pattern is given
    bool has_b = false;
    std::optional<CorrelationFigures> correlation;
    std::string correlation_error;
    std::optional<double> meg_ratio_db;  // A over B
    // Exact two-branch combining in Rayleigh fading at the default outages (pattern/combining.hpp).
    std::optional<CombiningFigures> combining;
    std::string combining_error;
};

// The distribution curves of the received power that the fading panel draws, analytic (no
// simulation): P(power <= level) for A and B in Rayleigh fading with their MEG as means, and
// for their exact selection and maximal-ratio combination with the ECC (pattern/combining.hpp).
// On one grid of levels in dBi; probabilities as log10, NaN below 1e-4 or where a curve is
// unavailable.
struct FadingCurves {
    std::vector<double> level_db;
    std::vector<double> a, b, selection, mrc;  // log10 P
    double level_lo_db = 0, level_hi_db = 0;    // the grid's ends (multiples of 10 dB)
};
// Empty (no levels) without A's MEG. Cost: `points` evaluations of each distribution (the exact
// selection one a few hundred terms each): well under a millisecond for 121 points.
FadingCurves fading_curves(const DiversityFigures& f, int points = 121);

// Cost: MEG and ECC one pass over the grid each; the orientation sweep about 50 ms on a
// 1-degree grid (pattern/diversity.hpp), so callers recompute only when an input changes.
DiversityFigures compute_diversity(const DiversityChoice& c, const FarFieldSet* a, std::size_t fa,
                                   const FarFieldSet* b, std::size_t fb, int curve_points = 181);

}  // namespace ellipsa::viewer
