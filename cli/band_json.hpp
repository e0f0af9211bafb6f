// What `ellipsa band` computes and writes (the JSON of --out NAME.json, the CSV and the plot),
// shared with the Python module (ellipsa.band, ellipsa.write_band), so both give the same figures
// from the same code.
#pragma once
#include <string>
#include <vector>

#include <CLI/CLI.hpp>

#include "exports/band_figure.hpp"
#include "exports/render.hpp"
#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa::cli {

// The command's choices as written (--environment, --direction, --show, --ar-threshold, --pair,
// --title).
struct BandChoices {
    std::string environments = "uniform", direction, show, title;
    double ar_threshold_db = ellipsa::ar_threshold_db;  // above 0, up to max_ar_threshold_db
    bool pair = false;
};
// The check of --direction (THETA,PHI in degrees, THETA 0..180, PHI -360..360): on the option and
// in band_request (the Python module does not pass through the command line).
CLI::Validator band_direction_check();
// The check of --ar-threshold (dB, above 0 and up to max_ar_threshold_db: an axial ratio of 60 dB is
// a linear wave for every purpose), on the option and in band_request likewise.
inline constexpr double max_ar_threshold_db = 60;
CLI::Validator band_ar_threshold_check();
// The request, or an Error whose message is the command's usage message (naming its option).
Result<exports::BandRequest> band_request(const BandChoices& c, std::size_t patterns);

// The figures of every pattern (labelled "A. name", ... when there are several; `names` the
// pattern's name, else its file) and, with `pair`, of the first two at their shared frequencies
// (an Error naming `files` when they share none).
struct BandRun {
    std::vector<exports::BandSet> sets;
    std::vector<exports::BandPair> pairs;
    std::vector<std::string> names;
};
Result<BandRun> band_run(const std::vector<const FarFieldSet*>& sets, const std::vector<std::string>& names,
                         const std::vector<std::string>& files, bool pair, const exports::BandRequest& r);

// The JSON of `ellipsa band --out NAME.json` (docs/band.md); `files` as the command names them.
std::string band_json(const std::vector<std::string>& files, const BandRun& run, const exports::BandRequest& r);

// The bytes `ellipsa band --out PATH` writes, chosen by the name: .json (band_json), .csv or the
// plot (.svg, .png, .pdf at `size`). Error for any other name.
Result<std::string> band_file(const std::string& path, const std::vector<std::string>& files, const BandRun& run,
                              const exports::BandRequest& r, const exports::RenderSize& size);

}  // namespace ellipsa::cli
