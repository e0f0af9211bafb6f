// A ranking of candidate antennas (pattern/rank.hpp) as document blocks (exports/document.hpp:
// the text `ellipsa rank` prints, its Markdown and HTML files, the report's ranking section) and
// as CSV for spreadsheets. Numbers become text only here.
#pragma once
#include <string>
#include <vector>

#include "exports/document.hpp"
#include "pattern/environment.hpp"
#include "pattern/rank.hpp"

namespace ellipsa::exports {

struct RankLabels {
    std::vector<std::string> names;           // per candidate, as given to rank_candidates ("printed dipole")
    std::vector<std::string> files;           // per candidate
    std::vector<double> frequencies_hz;       // per candidate, the frequency ranked
    std::vector<Environment> environments;    // as given to rank_candidates
    std::string reference;                    // what the reference is ("lossless vertical half-wave dipole")
    OrientationSweep sweep;                   // the sweep used (for the definitions)
    bool orientations = true;
};

// "1 %" for 0.01: the outage as people say it.
std::string outage_text(double outage);

// Appends: the ranking table (rank, candidate, file, frequency, score, the advantage per
// environment), one table per environment (MEG, V and H parts, orientation statistics, fading
// levels, advantage; the reference as the last row), the definitions, the reasons for missing
// scores and the cautions. Headings at `level` and below.
void rank_blocks(Document& doc, const Ranking& r, const RankLabels& l, int level);

// One row per candidate and environment, in ranking order, then the reference's rows (rank
// "reference"): rank, file, name, frequency_hz, score_db, environment, outage, meg_db,
// meg_vertical_db, meg_horizontal_db, orientation_median_db, orientation_p10_db,
// orientation_worst_db, fading_level_db, fading_level_random_db, advantage_db,
// random_advantage_db, worst_advantage_db. Numbers with 17 significant digits, an empty field
// where a figure is unavailable.
std::string rank_csv(const Ranking& r, const RankLabels& l);

}  // namespace ellipsa::exports
