// Loading pattern files for commands, with the options every file-reading command shares.
#pragma once
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include <CLI/CLI.hpp>

#include "cli/mounting_options.hpp"
#include "importers/far_field_csv.hpp"
#include "pattern/result.hpp"

namespace ellipsa::cli {

struct FileOptions {
    std::string map;       // --map "Source=schema,..." (or @FILE for a map file)
    std::string map_file;  // --map-file FILE
    std::string assume;    // --assume "angle-unit=rad,frequency-unit=GHz,..."
    std::string scale;     // --scale "schema_column=factor,..."
    std::string offset;    // --offset "schema_column=value,..."
    MountingOptions mounting;  // --up, --rotate, --phase-centre (cli/mounting_options.hpp)
    // Files that hold the rest of this file's pattern (FILE::join=OTHER, repeatable): other
    // frequencies, or the other polarisation part; read with the same options and merged
    // (pattern/merge.hpp). Only for one file's own options.
    std::vector<std::string> join;
};
// True when any option is set (the mounting's turn_fields aside).
bool has_options(const FileOptions& o);
struct LoadOptions : FileOptions {
    // Set by commands that produce only whole-sphere figures (a map, 3D, coverage, MEG): what they
    // make, e.g. "a map". load_pattern then refuses cut-only data (pattern/far_field.hpp,
    // Sampling) naming the file and the cuts, instead of a figure over no solid angle.
    const char* whole_sphere_figure = nullptr;
};
// The one place that adds the import options (--map, --map-file, --assume, --scale, --offset)
// and the mounting options (--up, --rotate, --phase-centre) to a subcommand; they apply to every pattern file of the command. Call it after the options
// that name pattern files (the positionals FILE, FILE2, IN and --minus, --partner, --reference): those accept
// "PATH::key=value", checked while parsing, and keep each mention whole (its options travel with it, so
// one file named twice with different options is read once per mention); name it by file_path().
void add_load_options(CLI::App* sub, LoadOptions& o);
// The reader options the command-line options describe (a map file is read here). A --map value
// without '=' names a map file (a column map always has one), as does "@FILE".
Result<CsvReadOptions> read_options(const FileOptions& o);

// One FILE argument with options of its own (docs/far-field-csv.md, "Options for one file"):
//   PATH::key=value[::key=value...]   keys: map, map-file, assume, scale, offset, angles, the
//   mounting's up, rotate, phase-centre (values as --up, --rotate, --phase-centre; checked here),
//   and join (repeatable)
// e.g. "range.csv::map=range.map::offset=e_total_db=7.5", "x.csv::up=+x::rotate=z:30,x:10".
// A PATH that exists as given is taken whole, even with "::" in it.
struct FileArgument {
    std::string path;
    FileOptions own;
};
Result<FileArgument> parse_file_argument(const std::string& arg);
// The file's path alone (for messages): what parse_file_argument would give, else `arg`.
std::string file_path(const std::string& arg);

// What one FILE argument (one mention) is read with: the command's options, then the mention's own;
// a key given
// in both is refused naming both places. When neither names a map, the map file beside the
// file (find_csv_map_beside) is used and named in `beside_map`.
struct PreparedLoad {
    std::string path;
    CsvReadOptions options;
    std::string beside_map;
    MountingOptions mounting;  // the command's --up/--rotate/--phase-centre, or the file's own keys
    std::vector<std::string> join;  // further files of the same pattern (FileOptions::join)
};
Result<PreparedLoad> prepare_load(const std::string& arg, const LoadOptions& o);

// Read a pattern file (a FILE argument as above), merge the files it joins (pattern/merge.hpp),
// and install it (pattern/install.hpp: the file's
// mounting or the options', the phase centres, a moved phase reference); progress goes to stderr
// on a terminal for long loads, and a map file found beside the file is named there.
Result<FarFieldSet> load_pattern(const std::string& arg, const LoadOptions& o);
// The refusal of cut-only data (Sampling::cuts) for a whole-sphere `figure` ("a map"), naming
// the file and the cuts; load_pattern applies it with LoadOptions::whole_sphere_figure, the
// Python module to a pattern it already holds.
Status refuse_cuts(const FarFieldSet& s, const std::string& path, const std::string& figure);

// The one rule for the frequency of a command whose output holds one frequency (cut, map,
// probe, coverage, fading, rank, render; docs/guide.md, "Which frequency"): the one asked for
// (nearest within 0.5 %; an Error lists what the file holds when none matches), else the only
// one, else the middle one of the file's list (of an even count the lower of the two middle
// ones), named in a note on stderr. Commands whose output holds every frequency (info, band,
// diversity, report, convert, gain-transfer) use them all instead. The Python module passes
// note=false (it returns the frequency used instead of printing it).
Result<std::size_t> pick_frequency(const FarFieldSet& s, const std::optional<double>& frequency_hz,
                                   const std::string& path, bool note = true);

}  // namespace ellipsa::cli
