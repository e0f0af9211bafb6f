// The JSON of `ellipsa info --json`, shared by the command and the Python module (whose
// Pattern.info() and Pattern.summary() parse this same text), so both say exactly the same.
#pragma once
#include <cstddef>
#include <string>
#include <vector>

#include "cli/band_text.hpp"
#include "cli/json.hpp"
#include "pattern/far_field.hpp"
#include "pattern/phase_centre.hpp"
#include "pattern/summary.hpp"

namespace ellipsa::cli {

// The figures of one frequency beyond its summary: the AR beamwidths and the phase centre.
struct InfoExtras {
    CircularFigures circular;
    Result<PhaseCentre> phase_centre = Error{};
};
// The figures `info` prints for the frequencies in `which`: summaries[k] (summarize()) and
// extras[k] are those of which[k].
struct InfoFigures {
    std::vector<PatternSummary> summaries;
    std::vector<InfoExtras> extras;
};
// One frequency a task on the cores (its summary, then its extras, which need the summary's
// beam planes): one set of threads for both, no wait between them.
InfoFigures info_figures(const FarFieldSet& s, const std::vector<std::size_t>& which);

// One frequency's figures: an object of the "results" array (docs/guide.md, JSON keys).
void summary_json(JsonWriter& j, const FarFieldSet& s, std::size_t freq_index, const PatternSummary& r, const InfoExtras& x);
// The whole object: the set's description, the grid, one result per frequency in `which` (f as
// info_figures gives it) and, for more than one frequency, the band summary.
std::string info_json(const FarFieldSet& s, const std::vector<std::size_t>& which, const InfoFigures& f);

}  // namespace ellipsa::cli
