// Internal to the CSV reader: the two passes over the data rows, each split across worker
// threads at line boundaries (or, for a large regular file, one pass on a guessed grid).
//   pass 1 reads only the angle and frequency cells and collects their distinct values, from
//          which the grid is planned and checked (csv_grid.hpp);
//   pass 2 reads every cell, converts the field family to complex E_theta/E_phi and writes each
//          row straight into its place in the final arrays.
// No per-row buffer exists, so the heap peak is the final arrays plus one byte per grid point
// (which points were seen) plus one window per worker. Errors carry the byte offset of their
// line; the line number is counted only when one is reported.
#pragma once
#include <algorithm>
#include <cmath>
#include <atomic>
#include <cstdint>
#include <cstring>
#include <limits>
#include <thread>
#include <unordered_map>
#include <vector>

#include "importers/csv_layout.hpp"

namespace ellipsa::csv {

// Two values given for one direction (a duplicate row, the phi seam, a pole at several phi, both
// half-planes) agree when their field vectors differ by at most `tolerance` of the larger one
// (Layout::duplicate_tolerance: 3 % unless `duplicate-tolerance` says otherwise), or both are
// below 1e-6 in amplitude (-120 dB: zero field for any practical purpose).
inline bool same_direction_values(cplx a_theta, cplx a_phi, cplx b_theta, cplx b_phi, double tolerance) {
    const double d = std::sqrt(std::norm(a_theta - b_theta) + std::norm(a_phi - b_phi));
    const double m = std::sqrt(std::max(std::norm(a_theta) + std::norm(a_phi), std::norm(b_theta) + std::norm(b_phi)));
    return d <= tolerance * m || m <= 1e-6;
}

// Distinct values met while scanning, with the offset of the first line holding each.
// A small direct-mapped cache in front of the hash map makes the common case (few distinct
// angles, met again and again) a compare and a branch.
struct DistinctValues {
    std::uint64_t cache[512];
    std::unordered_map<std::uint64_t, std::size_t> first;
    DistinctValues() { std::fill(std::begin(cache), std::end(cache), ~std::uint64_t(0)); }
    void add(double v, std::size_t line_offset) {
        if (v == 0) v = 0;  // -0 is 0
        std::uint64_t b;
        std::memcpy(&b, &v, sizeof b);
        const std::size_t h = std::size_t((b * 0x9E3779B97F4A7C15ull) >> 55);
        if (cache[h] == b) return;
        cache[h] = b;
        auto it = first.find(b);
        if (it == first.end()) first.emplace(b, line_offset);
        else if (line_offset < it->second) it->second = line_offset;
    }
};

// The grid the first pass found, and how a row's angle values find their place in it.
struct GridPlan {
    Grid grid;  // as the set stores it (phi start in [0, 360))
    // Theta as written: value = theta0 + i * theta_step, i < grid.theta.count.
    double theta0 = 0, theta_step = 1;
    // Phi as written: value = phi0 + j * phi_step, j < n_phi_distinct; column j is stored at
    // (j + phi_shift) % grid.phi.count, and the last one is the seam duplicate of the first
    // when phi_seam.
    double phi0 = 0, phi_step = 360;
    int n_phi_distinct = 1, phi_shift = 0;
    bool phi_seam = false;
    // The angles as written form a regular table that is not yet the stored grid (theta below
    // 0, phi beyond one of the two usual windows, a positioner grid): grid.theta and grid.phi
    // are the first and second angle columns as written, and csv_directions.hpp turns the
    // table into the stored grid.
    bool raw = false;
    std::vector<double> freqs;  // Hz, ascending
};

struct Chunk {
    std::size_t begin = 0, end = 0;
    // pass 1
    DistinctValues theta, phi, freq;
    std::size_t rows = 0;
    // pass 2: rows at the phi seam, merged once every row is in place.
    struct Alias {
        std::size_t freq, index;
        cplx et, ep;
        std::size_t line_offset;
    };
    std::vector<Alias> aliases;
    Failure failure;
};

struct Context {
    const TextSource* source = nullptr;
    const Layout* L = nullptr;
    const CsvReadOptions* options = nullptr;
    std::atomic<bool> cancelled{false};
    // A worker of one_pass met something: the others stop (the file is read again in two passes).
    std::atomic<bool> stop{false};
    // pass 2
    const GridPlan* plan = nullptr;
    bool concurrent = false;  // more than one worker writes the arrays
    std::vector<FarField>* out = nullptr;
    std::vector<std::vector<unsigned char>>* seen = nullptr;  // 0 absent, 1 being written, 2 present
    // Raw layouts only (GridPlan::raw): the line offset of each point's row, for messages about
    // directions given twice.
    std::vector<std::vector<std::size_t>>* lines = nullptr;
};

// Samples of the rows [begin, size) for a guessed plan (pass1_ranges), each from a line start to
// a line start: the first and last 256 kB (the ends of the angle axes) and up to 512 windows of
// 2 kB evenly between, one every 64 kB at the least (so a block of rows of one frequency longer
// than the spacing is met). About 1.5 MB at the most whatever the file's size.
std::vector<std::pair<std::size_t, std::size_t>> sample_ranges(const TextSource& src, std::size_t begin);

// Split [begin, size) into n chunks at line starts (fewer when lines are too long to split).
std::vector<Chunk> split(const TextSource& src, std::size_t begin, int n);
// The failure that comes first in the file (a read failure before any other).
const Failure* first_failure(const std::vector<Chunk>& cs);

void pass1(Context& ctx, Chunk& c, bool report_progress);
// Pass 1 over several line-aligned ranges of the rows, [begin, end) each, into one chunk (the
// samples of a guessed plan); the chunk's begin and end are those of the last range.
void pass1_ranges(Context& ctx, Chunk& c, const std::vector<std::pair<std::size_t, std::size_t>>& ranges);
void pass2(Context& ctx, Chunk& c, bool report_progress);
// Pass 2 on a plan guessed from samples of the file (far_field_csv_reader.cpp), doing pass 1's
// work as well: its checks (NUL bytes, metadata after the header), the distinct values and the
// row count, so that plan_grid on its chunks can confirm the guess afterwards.
void one_pass(Context& ctx, Chunk& c, bool report_progress);

// Files whose data rows take at least this many bytes are read in one pass on a guessed plan
// when the guess can be made (below it, or when the guess is not confirmed, in two passes).
// Tests lower or raise it to compare the two ways.
inline std::atomic<std::size_t> one_pass_min_bytes{std::size_t(8) << 20};
// Reads made in one pass so far (a guess confirmed), for the tests that compare the two ways.
inline std::atomic<std::size_t> one_pass_reads{0};

// f(chunk, is_first) on every chunk, the first on this thread and the others on their own.
template <class F>
void run_chunks(std::vector<Chunk>& cs, F&& f) {
    if (cs.size() == 1) {
        f(cs[0], true);
        return;
    }
    std::vector<std::thread> ts;
    for (std::size_t i = 1; i < cs.size(); ++i) ts.emplace_back([&, i] { f(cs[i], false); });
    f(cs[0], true);
    for (auto& t : ts) t.join();
}

}  // namespace ellipsa::csv
