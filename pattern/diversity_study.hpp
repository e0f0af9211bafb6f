// One diversity study: the figures of one or two patterns in one multipath environment, per
// frequency, with the pairing of the two patterns' frequencies. The command (`ellipsa diversity`),
// the viewer's diversity panel, the report's MEG row and the ranking all take their numbers from
// here, so they cannot disagree. Numbers in, numbers out: no text beyond the Errors' reasons.
//
// The environment comes from choose_environment() (pattern/environment.hpp); the figures from
// pattern/diversity.hpp.
#pragma once
#include <iterator>
#include <optional>
#include <string>
#include <vector>

#include "pattern/combining.hpp"
#include "pattern/diversity.hpp"
#include "pattern/environment.hpp"
#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

struct DiversityOptions {
    bool orientations = false;  // also the orientation sweep (about 50 ms per pattern and frequency, 1-deg grid)
    OrientationSweep sweep;
    // Only this frequency (nearest within 0.5 %, pattern/far_field.hpp find_frequency) of every
    // pattern that does not list its own; none: every frequency.
    std::optional<double> frequency_hz;
    // Outage probabilities of the exact two-branch combining figures (pattern/combining.hpp).
    std::vector<double> outages{std::begin(default_outages), std::end(default_outages)};
};

// One pattern to study.
struct StudyPattern {
    const FarFieldSet* set = nullptr;
    std::string path;                      // names the pattern in Errors
    std::vector<std::size_t> frequencies;  // indices to study; empty: as DiversityOptions says
};

// The figures of one pattern at one frequency.
struct FrequencyStudy {
    std::size_t index = 0;  // into the set's frequencies
    double frequency_hz = 0;
    Result<MegFigures> meg = Error{};
    std::optional<Result<OrientationFigures>> orientations;  // when asked for
};

// The two patterns at one frequency of the first: its partner in the second pattern is that
// pattern's only studied frequency (taken as given even when it differs), or the nearest within
// 0.5 %; without one the correlation is an Error saying what the second pattern holds.
struct PairStudy {
    std::size_t index = 0;              // the first pattern's frequency index
    std::optional<std::size_t> index2;  // the partner's, when there is one
    double frequency_hz = 0, frequency2_hz = 0;
    // The partner is the second pattern's only frequency and lies more than 0.5 % away.
    bool frequencies_differ = false;
    Result<CorrelationFigures> correlation = Error{};
    std::optional<double> meg_ratio_db;  // first over second, when both MEG are available and above zero
    // Rayleigh fading with the two MEG as mean branch powers and the ECC as power correlation:
    // exact selection and maximal-ratio combining at each outage (an Error when MEG or ECC is
    // unavailable or a MEG is zero).
    Result<CombiningFigures> combining = Error{};
    // The headline: the exact apparent selection-combining gain at 1 % outage, whatever outages
    // were asked for.
    std::optional<double> selection_gain_1pct_db;
};

struct DiversityStudy {
    Environment environment;
    std::vector<std::vector<FrequencyStudy>> patterns;  // per pattern, per studied frequency
    std::vector<PairStudy> pairs;                       // with two patterns: per studied frequency of the first
};

// Cost: per pattern and frequency one pass over the grid for MEG (plus the orientation sweep when
// asked); per pair one pass for the correlation and well under a millisecond for the combining
// figures. Errors: a pattern without the asked-for frequency (the message lists what it holds), a
// null or empty pattern, more than two patterns, outages outside (0, 1).
Result<DiversityStudy> study_diversity(const Environment& e, const DiversityOptions& o,
                                       const std::vector<StudyPattern>& patterns);

}  // namespace ellipsa
