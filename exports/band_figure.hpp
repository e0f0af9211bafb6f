// Figures against frequency as a plot (panels over a shared frequency axis, exports/xy_plot.hpp)
// and as CSV: what `ellipsa band` writes and what the report's band section shows. Every number
// comes from pattern/band.hpp; nothing is computed between sampled frequencies except the band
// edges, which are drawn as dashed lines and say that they are interpolated.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "exports/xy_plot.hpp"
#include "pattern/band.hpp"
#include "pattern/environment.hpp"
#include "pattern/result.hpp"

namespace ellipsa::exports {

// The panels a band plot can hold, one quantity each.
enum class BandPanel {
    gain, efficiency, meg, axial_ratio, beamwidth, front_to_back, ar_beamwidth, correlation, diversity_gain
};
// "gain", "efficiency", "meg", "axial-ratio", "hpbw", "front-to-back", "ar-beamwidth", "ecc", "diversity-gain"
const char* to_string(BandPanel p);
// Parse "gain,efficiency,axial-ratio"; the Error lists the known names.
Result<std::vector<BandPanel>> parse_band_panels(const std::string& text);

// One pattern's figures over its frequencies.
struct BandSet {
    std::string label;  // legend prefix ("A. turnstile"); empty for a lone pattern
    const FarFieldSet* set = nullptr;
    std::vector<FrequencyFigures> figures;  // band_figures(), ascending
    BandSummary summary;                    // band_summary() of the same figures
};
// Figures of a pair of patterns over their shared frequencies.
struct BandPair {
    std::string label;  // "A–B"
    std::vector<PairFrequencyFigures> figures;
};

struct BandRequest {
    BandOptions options;  // environments, direction, AR threshold
    std::vector<BandPanel> panels{BandPanel::gain, BandPanel::efficiency, BandPanel::axial_ratio, BandPanel::beamwidth};
    std::string title;
};

// "2.41 .. 2.49 GHz (3.3 %)"; an open edge reads "2.4 GHz or below" / "or above" and the
// percentage "at least".
std::string edges_text(const BandEdges& e);

// Compute one pattern's figures (band_figures + band_summary).
BandSet compute_band_set(const std::string& label, const FarFieldSet& s, const BandOptions& o);

// The plot. Panels without any value say why in the panel (e.g. no phase for axial ratio).
XyFigure make_band_figure(const std::vector<BandSet>& sets, const std::vector<BandPair>& pairs, const BandRequest& r);

// The values as one table, one row per pattern and frequency (kind "pattern") and per pair and
// shared frequency (kind "pair"):
//   kind,label,frequency_hz,peak_db,peak_theta_deg,peak_phi_deg,directivity_dbi,radiation_efficiency,
//   hpbw_elevation_deg,hpbw_azimuth_deg,front_to_back_db,axial_ratio_db,sense,ar_beamwidth_deg,
//   ar_beamwidth_azimuth_deg,axial_ratio_at_direction_db,meg_<env>_db...,ecc_<env>,diversity_gain_<env>_db...
// A row leaves the other kind's columns empty; an empty field is unavailable; "inf" is a linear
// field's axial ratio. Numbers have 17 significant digits (they read back as the same doubles).
std::string band_csv(const std::vector<BandSet>& sets, const std::vector<BandPair>& pairs, const BandRequest& r);

}  // namespace ellipsa::exports
