// Where the viewer's patterns come from: files (through the schema reader) or, with no file
// given, the bundled example folder; and when that is missing, the built-in demo patterns.
#pragma once
#include <functional>
#include <string>
#include <vector>

#include "importers/far_field_csv.hpp"
#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa::viewer {

// Read one far-field CSV file (importers/far_field_csv.hpp); the set's source is the path.
// map_file: a column-map file for foreign layouts; when empty, a map beside the file is used if
// one names it (find_csv_map_beside: a "<stem>.map", or a .map file in the same folder that
// mentions the file name).
// progress, when given, is called now and then with the fraction read; returning false cancels.
Result<FarFieldSet> load_pattern_file(const std::string& path, const std::string& map_file = "",
                                      std::function<bool(double)> progress = {});

// Read one file with reader options already made (the command line's, importers/far_field_csv.hpp),
// and the files that hold the rest of its pattern (`join`: read_joined_far_field_csv, as every
// command reads FILE::join=OTHER).
Result<FarFieldSet> load_pattern_file(const std::string& path, const CsvReadOptions& options,
                                      const std::vector<std::string>& join = {});

// The example CSV files shipped in examples/, sorted by name, from the first folder that has
// any: $ELLIPSA_EXAMPLES, the installed examples beside the executable's folder
// (../share/ellipsa/examples), the source tree's examples/. Empty when there are none.
std::vector<std::string> example_files();

// Patterns to open with no FILE: the example files that load, or else the built-in demo.
// `note` says which was used.
std::vector<FarFieldSet> default_patterns(std::string& note);

}  // namespace ellipsa::viewer
