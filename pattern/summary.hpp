// The headline figures of a pattern at one frequency: what `ellipsa info` prints, what the
// report tabulates and what the viewer shows in its figures panel.
#pragma once
#include <optional>
#include <string>

#include "pattern/far_field.hpp"
#include "pattern/integrate.hpp"
#include "pattern/peak.hpp"
#include "pattern/polarisation.hpp"

namespace ellipsa {

struct PatternSummary {
    double frequency_hz = 0;
    Peak peak;                       // total power
    double peak_db = 0;              // 10 log10 of the refined peak (dBi for gain/directivity)
    PowerFigures power;              // radiated power, coverage, directivity, efficiency
    std::optional<double> directivity_dbi;
    std::optional<double> hpbw_elevation_deg;  // phi = const cut through the peak
    std::optional<double> hpbw_azimuth_deg;    // orthogonal great circle through the peak
    std::optional<double> front_to_back_db;    // peak against the antipode
    std::optional<double> sidelobe_elevation_db;
    std::optional<double> axial_ratio_db;      // at the peak; nullopt when linear or no phase
    std::optional<Sense> sense;                // at the peak; nullopt without phase
    std::string unavailable_reason;            // why phase-dependent figures are missing, if they are
};

PatternSummary summarize(const FarFieldSet& s, std::size_t freq_index);

}  // namespace ellipsa
