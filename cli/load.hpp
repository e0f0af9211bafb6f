// Loading pattern files for commands, with the options every file-reading command shares.
#pragma once
#include <optional>
#include <string>

#include <CLI/CLI.hpp>

#include "importers/far_field_csv.hpp"
#include "pattern/result.hpp"

namespace ellipsa::cli {

struct LoadOptions {
    std::string map;       // --map "Source=schema,..." (or @FILE for a map file)
    std::string map_file;  // --map-file FILE
    std::string assume;    // --assume "angle-unit=rad,frequency-unit=GHz,..."
    std::string scale;     // --scale "schema_column=factor,..."
    std::string offset;    // --offset "schema_column=value,..."
};
// The one place that adds the import options (--map, --map-file, --assume, --scale, --offset)
// to a subcommand.
void add_load_options(CLI::App* sub, LoadOptions& o);
// The reader options the command-line options describe (a map file is read here).
Result<CsvReadOptions> read_options(const LoadOptions& o);

// Read a pattern file; progress goes to stderr on a terminal for long loads.
Result<FarFieldSet> load_pattern(const std::string& path, const LoadOptions& o);

// The frequency index asked for (nearest within 0.5 %), or the only one; an Error lists what
// the file holds when no frequency matches.
Result<std::size_t> pick_frequency(const FarFieldSet& s, const std::optional<double>& frequency_hz,
                                   const std::string& path);

}  // namespace ellipsa::cli
