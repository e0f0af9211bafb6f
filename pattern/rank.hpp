// Ranking candidate antennas for a link without line of sight: every candidate in every chosen
// multipath environment, against one reference antenna, sorted by one documented score. What
// `ellipsa rank`, its Markdown/HTML/CSV tables and the report's ranking section show. Numbers in,
// numbers out: no text beyond the Errors' reasons and the definitions below.
//
// Per candidate and environment (each from the one diversity study, pattern/diversity_study.hpp,
// so MEG here is identical to `ellipsa diversity`'s):
//   MEG and its vertical and horizontal parts (Taga, IEEE Trans. VT-39, 1990);
//   orientation statistics over the sweep (median, the 10th percentile over random orientations,
//     the worst orientation; pattern/diversity.hpp orientation_robustness);
//   the fading level at the outage (default 1 %): the received power one realisation in a hundred
//     falls below in Rayleigh fading, MEG (-ln(1 - p)) as mounted (conventions.md, "Fading and
//     combining"), and, with the orientation random as well, the p-quantile of the mixture
//     sum_i w_i (1 - exp(-x / MEG_i)) over the swept orientations with their solid-angle weights;
//   the advantage over the reference in dB: each figure minus the reference's same figure in the
//     same environment. Since a Rayleigh level is proportional to its mean, the as-mounted fading
//     advantage equals the MEG advantage.
// The score (RankScore) is the mean over the environments, in dB, of one of these advantages;
// candidates without it (a figure unavailable in some environment) come last, in input order.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "pattern/diversity.hpp"
#include "pattern/environment.hpp"
#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

// Which advantage the score averages over the environments.
enum class RankScore {
    mounted,  // fading level at the outage as mounted (= MEG) over the reference's: fixed installations
    random,   // fading level at the outage with the orientation random too: hand-held and loose devices
    worst     // MEG at the worst swept orientation over the reference's worst: careless mounting
};
const char* to_string(RankScore s);
bool parse_rank_score(const std::string& name, RankScore& out);
// One sentence per score, for outputs that state their method.
const char* rank_score_definition(RankScore s);

struct RankOptions {
    RankScore score = RankScore::mounted;
    // The orientation sweep; by default every orientation (tilt up to 180 deg), 15-deg steps.
    OrientationSweep sweep{15, 180, 15};
    bool orientations = true;  // false: no sweep (faster); the random and worst scores need it
    // Round each candidate's roll step to the nearest whole number of its grid's phi steps, so
    // that rolls are exact column shifts (about 3x faster than the general path at 2 degrees).
    bool fit_roll_to_grid = true;
    double outage = 0.01;      // of the fading levels, in (0, 1)
    int threads = 1;           // candidates x environments in parallel (the result does not depend on it)
};
// Checks the outage, the sweep, the threads (1 .. 64), and that the score has the sweep it needs.
Status validate(const RankOptions& o);

// One antenna to rank: a set and the frequency to use.
struct RankCandidate {
    const FarFieldSet* set = nullptr;
    std::string path;  // names it in Errors
    std::size_t freq_index = 0;
};

// One antenna in one environment. Linear powers (gain); advantages in dB.
struct RankFigures {
    Result<MegFigures> meg = Error{};
    std::optional<Result<OrientationFigures>> orientations;  // when the sweep was asked for
    std::optional<double> level;         // fading level at the outage as mounted
    std::optional<double> random_level;  // with the orientation random too; 0 when nulls alone reach the outage
    std::optional<double> advantage_db;         // level (= MEG) over the reference's
    std::optional<double> random_advantage_db;  // random_level over the reference's
    std::optional<double> worst_advantage_db;   // worst-orientation MEG over the reference's
};
// The advantage a score takes from one environment's figures.
std::optional<double> score_part_db(const RankFigures& f, RankScore s);

struct RankRow {
    std::size_t input = 0;  // index into the candidates
    std::vector<RankFigures> environments;  // in the order of the environments given
    std::optional<double> score_db;
    std::string unavailable_reason;  // why there is no score
};

struct Ranking {
    RankScore score = RankScore::mounted;
    double outage = 0.01;
    std::vector<RankFigures> reference;  // per environment (its advantages are 0 by definition)
    std::vector<RankRow> rows;           // by score_db descending; ties and rows without a score in input order
};

// The default reference: a lossless vertical half-wave dipole (Balanis sec. 4.5, D = 2.15 dBi)
// sampled on grid g, so that it meets the same discretisation as the candidates.
FarFieldSet reference_dipole(const Grid& g, double frequency_hz);
inline constexpr const char* reference_dipole_description = "lossless vertical half-wave dipole";

// Cost: per antenna (candidates and the reference) and environment one MEG pass over the grid and,
// with orientations, the sweep (about 0.1 s on a 1-degree grid for the default 15-degree steps over
// every orientation). Errors: no candidate, no environment, a null set, a frequency index out of
// range, invalid options or environments, and the reference's MEG unavailable in an environment.
Result<Ranking> rank_candidates(const std::vector<RankCandidate>& candidates, const RankCandidate& reference,
                                const std::vector<Environment>& environments, const RankOptions& o);

}  // namespace ellipsa
