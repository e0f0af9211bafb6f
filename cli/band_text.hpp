// Text and JSON for the circular-polarisation and band figures (pattern/circular.hpp,
// pattern/band.hpp), shared by `ellipsa info` and `ellipsa band` so both say the same thing.
#pragma once
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "cli/json.hpp"
#include "pattern/band.hpp"
#include "pattern/circular.hpp"

namespace ellipsa::cli {

// {"lower_hz", "upper_hz", "centre_hz", "percent", "lower_open", "upper_open", "interpolated"} or null.
void edges_json(JsonWriter& j, std::string_view key, const std::optional<BandEdges>& e);

// The per-frequency circular figures of `info`: AR beamwidth in both planes through the peak and
// the share of the sphere where AR <= 3 dB.
struct CircularFigures {
    ArBeamwidth elevation, azimuth;
    std::optional<ArSolidAngle> solid_angle;
    bool peak_at_pole = false;  // the planes are phi = 0 and phi = 90 (PatternSummary::peak_at_pole)
    std::string solid_angle_shortfall;  // why the share of the sphere is missing on cuts (sphere_shortfall)
};
CircularFigures circular_figures(const FarFieldSet& s, std::size_t freq_index, const PatternSummary& r);
// JSON keys ar_beamwidth_deg (elevation plane through the peak, 3 dB; null with
// ar_beamwidth_unavailable_reason), ar_beamwidth_azimuth_deg, ar_solid_angle_share.
void circular_json(JsonWriter& j, const CircularFigures& c);
// "89.9 deg (elevation plane), 89.9 deg (azimuth plane); AR <= 3 dB over 29.2 % of the sphere".
std::string circular_text(const CircularFigures& c);

void band_summary_json(JsonWriter& j, const BandSummary& b);
// Indented lines for the human summary.
std::string band_summary_text(const BandSummary& b);

}  // namespace ellipsa::cli
