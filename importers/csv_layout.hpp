// Internal to the CSV reader: what the metadata lines and the header row say about a file
// (delimiter, column roles, family, units, settings given outside it), and the walk over the
// text in windows of whole lines that every stage of the reader uses.
// Not part of the importer API; far_field_csv.hpp is.
#pragma once
#include <array>
#include <cstddef>
#include <cstring>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "importers/far_field_csv.hpp"
#include "importers/text_source.hpp"

namespace ellipsa::csv {

// Column roles of the schema. The order is the documentation order.
enum Col : int {
    c_frequency, c_theta, c_phi, c_azimuth, c_elevation,
    c_e_theta_re, c_e_theta_im, c_e_phi_re, c_e_phi_im,
    c_e_theta_db, c_e_theta_phase, c_e_phi_db, c_e_phi_phase,
    c_e_rhcp_db, c_e_rhcp_phase, c_e_lhcp_db, c_e_lhcp_phase,
    c_e_co_db, c_e_co_phase, c_e_cross_db, c_e_cross_phase,
    c_e_total_db,
    c_count
};
inline constexpr int c_ignore = -1;
inline constexpr bool is_db_role(int r) {
    return r == c_e_theta_db || r == c_e_phi_db || r == c_e_rhcp_db || r == c_e_lhcp_db || r == c_e_co_db ||
           r == c_e_cross_db || r == c_e_total_db;
}
const char* column_name(int role);
int column_role(std::string_view lower_name);  // -1 when unknown
struct Layout;
// A column in messages as the file names it: "e_az_re" (the positioner's own names for its field
// columns, never the theta/phi roles they stand in for), or "Eaz re" (e_az_re) when a column map
// gave the file's column that role; quotes included.
std::string column_label(const Layout& L, int role);

// Index of a metadata key of the file (quantity, ..., note) in a fixed table, or -1. With
// `settings_too`, also the keys only settings may give (phase-unit).
int metadata_key(std::string_view lower_key, bool settings_too = false);

// Bytes a reader window holds, and the longest line the reader accepts (a longer "line" is
// binary data or a file without line ends; refusing it bounds the work before a refusal).
inline constexpr std::size_t window_bytes = std::size_t(256) << 10;
inline constexpr std::size_t max_line_bytes = std::size_t(1) << 20;

// A failure found while scanning, located by the byte offset of its line (line numbers are
// counted only when an error is reported, so worker threads need not know them). `io`: the
// file could not be read as it was (it shrank, a read failed); such a failure outranks any
// finding in the text.
struct Failure {
    bool set = false;
    std::size_t line_offset = 0;
    long column = 0;  // 1-based byte column in the line; 0 when not tied to one
    std::string message;
    bool io = false;
};
Error to_error(const TextSource& src, const std::string& file, const Failure& f);

// Walk [begin, end) of `src` in windows that start at a line start and end after a '\n' (or at
// `end`): f(window, offset_of_window) for each, false from f stops. A line longer than
// max_line_bytes, or a read error, sets `failure` and stops. Returns false when stopped.
// Cost: the bytes once (plus one copy from the page cache for a file) and a memrchr a window.
template <class F>
[[gnu::always_inline]] inline bool for_each_window(const TextSource& src, std::size_t begin, std::size_t end, std::vector<char>& buffer,
                     Failure& failure, F&& f) {
    std::size_t pos = begin, want = window_bytes;
    while (pos < end) {
        auto w = src.view(pos, std::min(want, end - pos), buffer);
        if (!w) {
            failure = {true, pos, 0, w.error().message, true};
            return false;
        }
        std::size_t use = w->size();
        if (pos + use < end) {
            const void* nl = ::memrchr(w->data(), '\n', use);
            if (!nl && want <= max_line_bytes) {
                want = std::min(want * 4, max_line_bytes + 1);  // one long line: a larger window
                continue;
            }
            if (!nl) {
                failure = {true, pos, 0,
                           "expected lines of at most " + std::to_string(max_line_bytes) +
                               " bytes, found a longer one (a binary file, or no line ends?)"};
                return false;
            }
            use = std::size_t(static_cast<const char*>(nl) - w->data()) + 1;
        }
        if (!f(w->substr(0, use), pos)) return false;
        pos += use;
        want = window_bytes;
    }
    return true;
}

// How the two angle columns give a direction (docs/far-field-csv.md, "Angle layouts").
enum class AngleSystem {
    theta_phi,   // theta (0..180, or -180..180: the opposite half-plane) and phi in any window
    horizon,     // elevation above the xy-plane, azimuth about z: theta = 90 - el, phi = az
    az_over_el,  // positioner grids (pattern/positioner.hpp)
    el_over_az
};

struct Layout {
    char delimiter = ',';
    bool decimal_comma = false;     // allowed when the delimiter is not a comma
    std::size_t header_offset = 0;  // byte offset of the header line
    std::size_t data_offset = 0;    // first byte after the header line
    long header_line = 0;           // 1-based line number of the header
    long skipped_lines = 0;         // free text before the header (skip-lines, or a preamble before the mapped names)
    int cells = 0;                  // header cells (trailing empty ones dropped)
    std::vector<int> role;          // per header cell: Col or c_ignore
    std::vector<long> header_column;  // 1-based byte column of each header cell
    std::vector<std::string> header_text;  // each header cell as written (trimmed), for messages
    std::array<int, c_count> column_of{};  // header cell of each role, -1 when absent
    CsvFamily family = CsvFamily::complex;
    FieldPart part = FieldPart::whole;  // one component of the family only: the other is zero
    bool az_el = false;
    AngleSystem angles = AngleSystem::theta_phi;
    bool positioner_components = false;  // field columns named e_az_*, e_el_*
    bool frequency_column = false;
    int last_angle_cell = 0;  // highest header cell index pass 1 needs

    // metadata
    Quantity quantity = Quantity::gain;
    bool minus_iwt = false;
    double angle_to_deg = 1.0;      // deg per angle-unit
    double phase_to_rad = pi / 180;  // rad per phase unit
    double hz_per_unit = 1.0;
    // same_direction_values (csv_passes.hpp); `duplicate-tolerance`. The default, 3 %, is what a
    // far-field range repeats one direction to (docs/far-field-csv.md, "Tolerance": a receiver's
    // +-0.1 dB and +-1 deg give 2.1 %, a positioner's +-0.05 deg on a 10-degree beam's flank 0.7 %;
    // common practice, values from memory); a layout read wrongly differs by tens of per cent.
    double duplicate_tolerance = 0.03;
    std::optional<double> frequency_hz;  // from metadata
    std::optional<Ludwig3Reference> ludwig3_reference;
    std::string name, source, note;
    Mounting mounting;  // mounting-up, mounting-turns (identity when absent)
    std::optional<Sampling> sampling;  // "sampling: cuts|surface"; absent: inferred_sampling(grid)

    bool transform = false;  // any scale/offset set
    std::array<double, c_count> scale{};
    std::array<double, c_count> offset{};
};

// Read the metadata lines and the header row, apply the column map, the settings, the scale and
// the offset. Errors carry file, line and column (or the origin of an option). Cost: the lines
// up to the header once; the first window is checked for NUL bytes before anything else.
Result<Layout> read_layout(const TextSource& src, const std::string& file, const CsvReadOptions& o);

}  // namespace ellipsa::csv
