// What `ellipsa rank` computes and prints as JSON, shared with the Python module (ellipsa.rank),
// so both give the same ranking from the same code.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include <CLI/CLI.hpp>

#include "cli/environment_options.hpp"
#include "exports/rank_table.hpp"
#include "pattern/rank.hpp"

namespace ellipsa::cli {

// The score named by `text` ("mounted", "random", "worst"), else the message both front ends
// give after the option's name (`--score: ...` on the command line, `score: ...` in Python).
std::optional<std::string> rank_score_problem(const std::string& text, RankScore& out);

// How a candidate is named in the tables: the pattern's name, else its file's name.
std::string rank_display_name(const RankCandidate& c);
// The check of --outage (between 0 and 1, both excluded), on the option and in the Python module's rank.
CLI::Validator rank_outage_check();

// The ranking of the candidates in every environment against the reference (reference_label
// names it in the tables: the dipole's description or the reference's file), with the labels
// the tables, CSV and JSON need.
struct RankRun {
    Ranking ranking;
    exports::RankLabels labels;
};
Result<RankRun> rank_run(const std::vector<RankCandidate>& candidates, const RankCandidate& reference,
                         const std::string& reference_label, const std::vector<ChosenEnvironment>& environments,
                         const RankOptions& o);

// The JSON of `ellipsa rank --json` (docs/diversity.md).
std::string rank_json(const std::vector<ChosenEnvironment>& environments, const std::vector<RankCandidate>& candidates,
                      const Ranking& r, const exports::RankLabels& l);

}  // namespace ellipsa::cli
