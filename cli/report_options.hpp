// What `ellipsa report` makes of its options and how it publishes the folder, shared with the
// Python module (ellipsa.write_report), so both write the same report from the same code.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "cli/environment_options.hpp"
#include "exports/report.hpp"
#include "pattern/result.hpp"

namespace ellipsa::cli {

// The command's choices (--title, --frequency, --range, --style, the environment as chosen).
struct ReportChoices {
    std::string title = "Antenna pattern report", style = "polar";
    std::optional<double> frequency_hz;
    double range_db = 40;
};
// The report's options with the provenance line and the date (SOURCE_DATE_EPOCH when set, for a
// reproducible report), or an Error whose message is the
// command's usage message (naming its option). The environment's name gains ", XPR x dB" when
// the XPR was given. The 3D views are the caller's (the command's headless renderer).
Result<exports::ReportOptions> report_options(const ReportChoices& c, const exports::RenderSize& size,
                                             const ChosenEnvironment& environment);

// Build the report and publish it as the folder `out` (replaced only with `force`, and only a
// folder ellipsa made that holds none of `read`, the files the report is made from). Returns the
// number of figure and data files beside index.html and report.md.
Result<std::size_t> publish_report(const std::string& out, const std::vector<exports::ReportInput>& inputs,
                                   const exports::ReportOptions& o, bool force, const std::vector<std::string>& read);

}  // namespace ellipsa::cli
