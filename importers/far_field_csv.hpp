// The neutral far-field CSV schema (version 1), documented in docs/far-field-csv.md.
//
// Reading is strict: any file that does not describe one regular grid per frequency is refused
// with an Error that names file, line, column, what was expected and what was found. Nothing
// partial is ever returned.
#pragma once
#include <cstddef>
#include <functional>
#include <optional>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

// Field column families of the schema; a file holds exactly one.
enum class CsvFamily {
    complex,          // e_theta_re, e_theta_im, e_phi_re, e_phi_im
    theta_phi_polar,  // e_theta_db, e_theta_phase, e_phi_db, e_phi_phase
    circular_polar,   // e_rhcp_db, e_rhcp_phase, e_lhcp_db, e_lhcp_phase
    ludwig3_polar,    // e_co_db, e_co_phase, e_cross_db, e_cross_phase (needs ludwig3-reference)
    magnitude_db,     // e_theta_db, e_phi_db (no phase)
    total_db          // e_total_db (total only)
};
const char* to_string(CsvFamily f);
// The word of the "part" metadata line for one polarisation part: theta, phi, rhcp, lhcp, co, cross.
const char* csv_part_name(FieldPart p);
bool parse_csv_family(std::string_view name, CsvFamily& out);

// Where an option given outside the file came from, for messages: a map file and its line, or
// whatever the caller calls it (the command line says "--map"). The reader repeats it as given
// and adds no wording of its own; unnamed options are called "the column map", "the assumed
// metadata", "the scale" and "the offset".
struct CsvOrigin {
    std::string name;  // a file, or the caller's word for it; may be empty
    long line = 0;     // 1-based line in that file; 0 when not in a file
};

// Read source column `source` as schema column `target` ("ignore" skips it). Source names
// compare case-insensitively, surrounding spaces and quotes ignored. Each source once.
struct CsvColumnMapping {
    std::string source, target;
    CsvOrigin origin;
    CsvColumnMapping(std::string source_, std::string target_, CsvOrigin origin_ = {})
        : source(std::move(source_)), target(std::move(target_)), origin(std::move(origin_)) {}
};

// A metadata value given outside the file: same keys and values as the `# key: value` lines
// (plus `phase-unit`, deg | rad, for foreign files whose phases and angles differ). It replaces
// what the file says. Each key once, over all settings.
struct CsvSetting {
    std::string key, value;
    CsvOrigin origin;
    CsvSetting(std::string key_, std::string value_, CsvOrigin origin_ = {})
        : key(std::move(key_)), value(std::move(value_)), origin(std::move(origin_)) {}
};

// A factor (scale) or an addend (offset) for one schema column; each column once per list.
struct CsvAdjustment {
    std::string column;
    double value = 0;
    CsvOrigin origin;
    CsvAdjustment(std::string column_, double value_, CsvOrigin origin_ = {})
        : column(std::move(column_)), value(value_), origin(std::move(origin_)) {}
};

struct CsvReadOptions {
    // Foreign layouts: which source column is which schema column.
    std::vector<CsvColumnMapping> column_map;
    std::vector<CsvSetting> settings;
    // value = value_in_file * scale + offset for a schema column, applied before units are
    // converted (a dB column gets a dB offset, an angle column an offset in angle-unit).
    std::vector<CsvAdjustment> scale;
    std::vector<CsvAdjustment> offset;
    // Largest heap the final arrays may take; 0: what the system has available now.
    std::size_t memory_limit_bytes = 0;
    // Worker threads; 0: one per core (small inputs always use one).
    int threads = 0;
    // Optional: called now and then with the fraction read (0..1); return false to cancel.
    std::function<bool(double)> progress;
};

// The schema column names, in documentation order (theta, phi, ..., e_total_db).
const std::vector<std::string>& csv_schema_columns();

// Read a small column-map file (see docs/far-field-csv.md, "Map files") into `options`; each
// entry's origin is the file and its line. Only a regular file of at most 1 MB is read.
Status read_csv_map_file(const std::string& path, CsvReadOptions& options);
Status parse_csv_map_text(std::string_view text, const std::string& display_name, CsvReadOptions& options);
// The map file that describes `path` when none is given ("" when none): "<stem>.map" beside it,
// else a .map file in the same folder (at most 64 KiB) that names the file. Every front end
// (the commands, the viewer's File > Open) uses this one rule.
std::string find_csv_map_beside(const std::string& path);

// Read a file: a regular file, read in windows (never memory-mapped, so a file that shrinks or
// changes while it is read ends in an Error, not a signal). The file name is used in messages.
// Costs two passes over the text, each split across the cores at line boundaries (pass 1: the
// angle and frequency cells, to build and check the grid; pass 2: every cell, written straight
// into the final arrays), or one pass when the rows take 8 MB or more and the grid guessed from
// samples of the file is confirmed (else the two passes follow it; the result is the same). Heap: the final arrays plus one byte per grid point plus a 256 KiB
// window per thread. Before anything is allocated, the file size is checked against available
// memory and the grid the angle values imply against the number of rows (a small file never
// makes the reader allocate a large grid). Lines are at most 1 MiB.
Result<FarFieldSet> read_far_field_csv(const std::string& path, const CsvReadOptions& options = {});
// A pattern split over files (FILE::join=OTHER, docs/far-field-csv.md "Data split over files"):
// `path` and each of `join`, read one after the other with the same options, merged by
// merge_sets() (pattern/merge.hpp: its source is "path + other + ..."). With no `join`, the file
// alone. Every front end that reads joined files (the commands through cli/load.cpp, the viewer)
// calls this one.
Result<FarFieldSet> read_joined_far_field_csv(const std::string& path, const std::vector<std::string>& join,
                                              const CsvReadOptions& options = {});
// Parse text already in memory; `display_name` is used in messages. Same rules and costs.
Result<FarFieldSet> parse_far_field_csv(std::string_view text, const std::string& display_name,
                                        const CsvReadOptions& options = {});

struct CsvWriteOptions {
    CsvFamily family = CsvFamily::complex;
    // Reference for the Ludwig-3 family; unset: the set's own.
    std::optional<Ludwig3Reference> ludwig3_reference;
    // true: replace an existing file (keeping its permission bits); false: refuse when anything
    // is at the target (io/atomic_write.hpp: decided atomically with the write).
    bool overwrite = false;
};
// The family that keeps everything a set holds: complex, theta-phi-db or total-db.
CsvFamily natural_family(const FarFieldSet& s);
// Format a set as schema text (shortest round-trip number formatting).
Result<std::string> format_far_field_csv(const FarFieldSet& s, const CsvWriteOptions& options = {});
// Write to `path` through a temporary file in the same folder and a rename, so an interrupted
// write never leaves a broken file in place of a good one.
Status write_far_field_csv(const FarFieldSet& s, const std::string& path, const CsvWriteOptions& options = {});

}  // namespace ellipsa
