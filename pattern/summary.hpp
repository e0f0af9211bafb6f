// The headline figures of a pattern at one frequency: what `ellipsa info` prints, what the
// report tabulates and what the viewer shows in its figures panel.
#pragma once
#include <optional>
#include <vector>
#include <string>

#include "pattern/cut.hpp"
#include "pattern/far_field.hpp"
#include "pattern/integrate.hpp"
#include "pattern/peak.hpp"
#include "pattern/polarisation.hpp"

namespace ellipsa {

// Above this radiation efficiency (1 %: well beyond the integration error of any grid the tool
// reads) efficiency from absolute gain data is a data problem: flagged, the figures still given.
inline constexpr double efficiency_tolerance = 0.01;

struct PatternSummary {
    double frequency_hz = 0;
    bool zero_field = false;         // every sample is zero: no peak direction, beam or polarisation figures
    Peak peak;                       // total power (direction meaningless when zero_field)
    double peak_db = 0;              // 10 log10 of the refined peak (dBi for gain/directivity); -inf when zero_field
    PowerFigures power;              // radiated power, coverage, directivity, efficiency
    std::optional<double> directivity_dbi;
    bool efficiency_above_100 = false;  // radiation efficiency above 1 + efficiency_tolerance: a data problem
    // The peak sample is a pole (theta 0 or 180): every plane through it is an elevation plane and
    // the peak's phi there is arbitrary (the largest of equal samples, or noise), so the two beam
    // planes are the fixed planes phi = 0 (elevation) and phi = 90 (azimuth) instead.
    bool peak_at_pole = false;
    // Where the two beam planes cross: the peak, or at a pole the pole itself with phi 0. The AR
    // beamwidths (circular.hpp) are taken through this direction too.
    double planes_theta_deg = 0, planes_phi_deg = 0;
    BeamFigures elevation;                     // the phi = const cut through the peak (mirror halves); phi = 0 at a pole
    BeamFigures azimuth;                       // the great circle through the peak along phi-hat; phi = 90 at a pole
    std::optional<double> hpbw_elevation_deg;  // phi = const cut through the peak
    std::optional<double> hpbw_azimuth_deg;    // orthogonal great circle through the peak
    std::optional<double> front_to_back_db;    // peak against the antipode, when at most null_ratio_bound_db
    std::optional<double> front_to_back_above_db;  // null_ratio_bound_db when the back is a null (ratio beyond it)
    std::optional<double> sidelobe_elevation_db;
    std::optional<double> axial_ratio_db;      // at the peak, as reported: none when linear, zero or without phase
    std::optional<Sense> sense;                // at the peak, as reported; nullopt without phase
    double tilt_deg = 0;                       // at the peak; NaN where undefined (near circular, zero, no phase)
    std::string unavailable_reason;            // why phase-dependent figures are missing, if they are
};

PatternSummary summarize(const FarFieldSet& s, std::size_t freq_index);

// The peak's sample is a pole of the grid (PatternSummary::peak_at_pole).
bool peak_at_pole(const Grid& g, const Peak& pk);
// The phi of the elevation plane through a peak: its own phi, or 0 at a pole.
double elevation_plane_phi_deg(const Grid& g, const Peak& pk);

// summarize() of each listed frequency, in that order, one frequency a task on up to four
// threads (pattern/parallel.hpp): the same figures as one at a time, sooner on several cores.
std::vector<PatternSummary> summarize_each(const FarFieldSet& s, const std::vector<std::size_t>& freq_indices);

}  // namespace ellipsa
