// The report's "Link reliability" section, in the report's environment: the fading of the first
// two patterns (the random-field simulation's distribution curves with the closed forms dashed
// beside them, exports/fading_figure.hpp), their exact two-branch combining, and with two or more
// patterns the ranking against the reference dipole (exports/rank_table.hpp); the cautions beside
// every outage figure. build_report() calls it.
#pragma once
#include <string>
#include <vector>

#include "exports/document.hpp"
#include "exports/report.hpp"

namespace ellipsa::exports {

struct LinkInput {
    const FarFieldSet* set = nullptr;
    std::string path;
    std::string name;  // as the report names it ("A. printed dipole")
    std::size_t freq_index = 0;
};

// Realisations of the report's fading simulation (seed 1): 95 % intervals of about +-0.2 dB on
// the 1 % level; the closed forms beside them are exact.
inline constexpr std::size_t report_fading_realisations = 20000;

// Nothing without an environment in the options. Figures that cannot be computed (data without
// phase, a partial sphere) become notes saying why.
Status link_section(Document& doc, std::vector<ReportFile>& files, const std::vector<LinkInput>& inputs,
                    const ReportOptions& o);

}  // namespace ellipsa::exports
