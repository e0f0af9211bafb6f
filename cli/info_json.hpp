// The JSON of `ellipsa info --json`, shared by the command and the Python module (whose
// Pattern.info() and Pattern.summary() parse this same text), so both say exactly the same.
#pragma once
#include <cstddef>
#include <string>
#include <vector>

#include "cli/json.hpp"
#include "pattern/far_field.hpp"
#include "pattern/summary.hpp"

namespace ellipsa::cli {

// One frequency's figures: an object of the "results" array (docs/guide.md, JSON keys).
void summary_json(JsonWriter& j, const FarFieldSet& s, std::size_t freq_index, const PatternSummary& r);
// The whole object: the set's description, the grid, one result per frequency in `which` (rs[k]
// summarises which[k]) and, for more than one frequency, the band summary.
std::string info_json(const FarFieldSet& s, const std::vector<std::size_t>& which, const std::vector<PatternSummary>& rs);

}  // namespace ellipsa::cli
