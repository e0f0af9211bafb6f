// What `ellipsa coverage` computes and writes as JSON, shared with the Python module
// (ellipsa.coverage), so both give the same figures from the same code.
#pragma once
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include <CLI/CLI.hpp>

#include "exports/coverage_figure.hpp"
#include "exports/render.hpp"
#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa::cli {

// The band: the whole sphere, within horizon_deg of the horizon (0 < deg <= 90), or between two
// elevations (-90 <= min < max <= 90); not both. Errors name the command's options (the Python
// module gives the same message).
// The check of --horizon (deg, above 0 and up to 90), on the option and in coverage_band.
CLI::Validator coverage_horizon_check();
Result<ElevationBand> coverage_band(const std::optional<double>& horizon_deg,
                                    const std::optional<std::pair<double, double>>& elevation_deg);

// Default components: for one pattern total, vertical and horizontal (and RHCP, LHCP with
// phase), as far as the data can give them; for two patterns the total alone (three curves).
std::vector<Component> default_coverage_components(const std::vector<const FarFieldSet*>& sets);

// The series of one or two patterns (A and B labelled "A. name", "B. name" with `names`, each
// pattern's name or else its file), after the default components when the request lists none.
// freq_indices: A's frequency, B's at A's frequency (coverage_frequency).
Result<std::vector<exports::CoverageSeries>> coverage_of(const std::vector<const FarFieldSet*>& sets,
                                                         const std::vector<std::string>& names,
                                                         const std::vector<std::size_t>& freq_indices,
                                                         exports::CoverageRequest& r);

// B's frequency: A's (nearest within 0.5 %, else an Error naming B's file `path`).
Result<std::size_t> coverage_frequency(const FarFieldSet& b, double a_frequency_hz, const std::string& path);

// The JSON of `ellipsa coverage --out NAME.json` (docs/views.md).
std::string coverage_json(const std::vector<exports::CoverageSeries>& series, const exports::CoverageRequest& r,
                          double frequency_hz, const std::vector<const FarFieldSet*>& sets);

// The bytes `ellipsa coverage --out PATH` writes, chosen by the name: .json (coverage_json),
// .csv (the curves, 0.1 dB steps) or the figure (.svg, .png, .pdf at `size`). Error for any
// other name.
Result<std::string> coverage_file(const std::string& path, const std::vector<exports::CoverageSeries>& series,
                                  const exports::CoverageRequest& r, double frequency_hz,
                                  const std::vector<const FarFieldSet*>& sets, const exports::RenderSize& size);

}  // namespace ellipsa::cli
