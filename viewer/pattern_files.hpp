// Where the viewer's patterns come from: files (through the schema reader) or, with no file
// given, the bundled example folder; and when that is missing, the built-in demo patterns.
#pragma once
#include <string>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa::viewer {

// Read one far-field CSV file (importers/far_field_csv.hpp); the set's source is the path.
Result<FarFieldSet> load_pattern_file(const std::string& path);

// The example CSV files shipped in examples/ (next to the executable's source tree or in
// $ELLIPSA_EXAMPLES), sorted by name; empty when there are none.
std::vector<std::string> example_files();

// Patterns to open with no FILE: the example files that load, or else the built-in demo.
// `note` says which was used.
std::vector<FarFieldSet> default_patterns(std::string& note);

}  // namespace ellipsa::viewer
