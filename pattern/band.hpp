// Figures against frequency: the headline figures of every frequency of a set (built on
// summarize(), so they agree with `ellipsa info`), MEG in chosen environments, the axial ratio at
// the peak and at a chosen direction, the axial-ratio beamwidth, and for a pair of sets the
// envelope correlation and diversity gain; and band edges read off them.
//
// Nothing is invented between sampled frequencies: every figure is computed at the samples.
// Band edges alone are placed between samples, by linear interpolation of the figure between
// the last sample inside the band and the first one outside, and say so (BandEdges::interpolated).
#pragma once
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "pattern/circular.hpp"
#include "pattern/environment.hpp"
#include "pattern/far_field.hpp"
#include "pattern/result.hpp"
#include "pattern/summary.hpp"

namespace ellipsa {

struct BandOptions {
    std::vector<Environment> environments;  // MEG in each (none: no MEG)
    // A direction (theta_deg, phi_deg) where the axial ratio is also read at every frequency.
    std::optional<std::pair<double, double>> direction_deg;
    double ar_threshold_db = ellipsa::ar_threshold_db;  // for the AR beamwidth
};

// An axial ratio read at one direction: ar_db is +inf for a linear field; nullopt with a
// reason when the data have no phase, the direction lies outside the data or the field is zero.
struct ArReading {
    std::optional<double> ar_db;
    Sense sense = Sense::none;
    std::string unavailable_reason;
};
ArReading axial_ratio_at(const FarFieldSet& s, std::size_t freq_index, double theta_deg, double phi_deg);

struct MegReading {
    std::optional<double> meg;  // linear
    std::string unavailable_reason;
};

struct FrequencyFigures {
    std::size_t freq_index = 0;     // into the set's frequencies
    PatternSummary summary;         // peak, directivity, efficiency, HPBW, F/B, AR at the peak
    std::vector<MegReading> meg;    // per BandOptions::environments
    std::optional<ArReading> ar_at_direction;  // when BandOptions::direction_deg is given
    ArBeamwidth ar_beamwidth_elevation;  // around the peak, on the elevation cut through it
    ArBeamwidth ar_beamwidth_azimuth;    // around the peak, on the orthogonal great circle
};

// Every frequency of the set, in ascending order of frequency. Cost per frequency: one
// summarize() (a grid pass and two cuts), two more cuts for the AR beamwidths, one grid pass
// per environment.
std::vector<FrequencyFigures> band_figures(const FarFieldSet& s, const BandOptions& o);
// Every frequency has its peak at a pole (PatternSummary::peak_at_pole): the beam planes are then
// phi = 0 and phi = 90 throughout, and are named so (exports::beam_plane_text). False for none.
bool peaks_at_pole(const std::vector<FrequencyFigures>& figures);

struct PairFrequencyFigures {
    double frequency_hz = 0;
    std::size_t index_a = 0, index_b = 0;  // frequencies of a and b (b's within 0.5 % of a's)
    struct Entry {
        std::optional<double> ecc;                // envelope correlation rho_e
        std::optional<double> diversity_gain_db;  // exact selection combining, 1 % outage (pattern/combining.hpp)
        std::string unavailable_reason;
    };
    std::vector<Entry> per_environment;  // per BandOptions::environments
};
// ECC and diversity gain at every frequency of a that b also holds (within 0.5 %), ascending.
// Frequencies of a that b lacks are left out; an empty result means none are shared.
std::vector<PairFrequencyFigures> band_pair_figures(const FarFieldSet& a, const FarFieldSet& b,
                                                    const std::vector<Environment>& environments);

// A band read off sampled figures: the contiguous run of samples around `anchor` that meet the
// condition, with each edge interpolated linearly between the last sample that meets it and the
// first that does not. An edge whose run reaches the first or last sample (or a sample without
// a value) stays at that sample and is marked open: the true edge lies there or beyond.
struct BandEdges {
    double lower_hz = 0, upper_hz = 0;
    bool lower_open = false, upper_open = false;
    double centre_hz = 0;  // (lower + upper) / 2
    double percent = 0;    // 100 (upper - lower) / centre
    double anchor_hz = 0;  // the sample the band was grown from
    bool interpolated = true;  // always: edges lie between samples by linear interpolation
};
// values: one per frequency (NaN: no value). below: the condition is value <= limit, else
// value >= limit. nullopt when the anchor itself does not meet it. Frequencies ascending.
std::optional<BandEdges> band_edges(const std::vector<double>& frequency_hz, const std::vector<double>& values,
                                    std::size_t anchor, double limit, bool below);

// Gain bandwidth: where the peak (gain, or the set's quantity) stays within drop_db of its largest
// sampled value, grown from that sample. peak_db: one per frequency (ascending). nullopt for fewer
// than two frequencies or unknown (zero) frequencies.
std::optional<BandEdges> gain_bandwidth(const std::vector<double>& frequency_hz, const std::vector<double>& peak_db,
                                        double drop_db);
// Axial-ratio bandwidth at a direction: where AR <= threshold_db, grown from the frequency with
// the lowest axial ratio there. ar_db: one reading per frequency (ascending; NaN without a value,
// +inf for linear). nullopt when no frequency meets the threshold.
std::optional<BandEdges> ar_bandwidth(const std::vector<double>& frequency_hz, const std::vector<double>& ar_db,
                                      double threshold_db = ar_threshold_db);

// The band figures of a multi-frequency set from its summaries (any order; freq_indices[k] is
// the frequency of summaries[k]): the peak within 1 dB and 3 dB of its largest value, and the AR
// bandwidth (AR <= 3 dB) at the direction given, by default the peak of the middle frequency.
// Cost: one interpolation per frequency.
struct BandSummary {
    std::optional<BandEdges> gain_1db, gain_3db, ar;
    double ar_theta_deg = 0, ar_phi_deg = 0;
    std::string ar_unavailable_reason;    // when ar is missing
    std::string gain_unavailable_reason;  // when gain_1db and gain_3db are missing
};
BandSummary band_summary(const FarFieldSet& s, const std::vector<std::size_t>& freq_indices,
                         const std::vector<PatternSummary>& summaries,
                         std::optional<std::pair<double, double>> direction_deg = std::nullopt);
// The same from band_figures().
BandSummary band_summary(const FarFieldSet& s, const std::vector<FrequencyFigures>& band,
                         std::optional<std::pair<double, double>> direction_deg = std::nullopt);

}  // namespace ellipsa
