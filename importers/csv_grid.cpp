// The grid stages of the CSV reader (csv_grid.hpp).
#include "importers/csv_grid.hpp"

#include <cmath>
#include <sys/mman.h>

#include "importers/text.hpp"
#include "pattern/parallel.hpp"
#include "pattern/polarisation.hpp"

namespace ellipsa::csv {

namespace {

using text::number;

constexpr double angle_tol_deg = 1e-6;  // range checks
constexpr double merge_tol_deg = 1e-7;  // distinct angle values closer than this are one value

// Merge the per-thread sets, sort, and fold values closer than tol (relative when rel).
std::vector<Value> merged(const std::vector<Chunk>& chunks, const DistinctValues Chunk::*set, double tol, bool rel) {
    std::vector<Value> all;
    for (const Chunk& c : chunks)
        for (const auto& [b, off] : (c.*set).first) {
            double v;
            std::memcpy(&v, &b, sizeof v);
            all.push_back({v, off});
        }
    std::sort(all.begin(), all.end(),
              [](const Value& a, const Value& b) { return a.v < b.v || (a.v == b.v && a.line_offset < b.line_offset); });
    std::vector<Value> out;
    for (const Value& x : all) {
        if (!out.empty()) {
            const double t = rel ? tol * std::max(std::abs(out.back().v), std::abs(x.v)) : tol;
            if (x.v - out.back().v <= t) {
                out.back().line_offset = std::min(out.back().line_offset, x.line_offset);
                continue;
            }
        }
        out.push_back(x);
    }
    return out;
}

}  // namespace

bool regular_axis(const std::vector<Value>& v, const char* what, double& start, double& step, Failure& f) {
    start = v.front().v;
    if (v.size() == 1) {
        step = 0;
        return true;
    }
    step = (v.back().v - v.front().v) / double(v.size() - 1);
    const double tol = std::max(1e-9, 1e-4 * step);
    // The smallest gap tells the intended step when one value is missing in between.
    double min_gap = std::numeric_limits<double>::infinity();
    for (std::size_t k = 1; k < v.size(); ++k) min_gap = std::min(min_gap, v[k].v - v[k - 1].v);
    for (std::size_t k = 0; k < v.size(); ++k) {
        if (std::abs(v[k].v - (start + double(k) * step)) <= tol) continue;
        // Report in terms of the smallest gap: "after A expected B, found C".
        std::size_t j = 1;
        while (j < v.size() && std::abs((v[j].v - v[j - 1].v) - min_gap) <= std::max(1e-9, 1e-4 * min_gap)) ++j;
        if (j >= v.size()) j = k;
        f = {true, v[j].line_offset, 0,
             std::string("expected evenly spaced ") + what + " values (step " + number(min_gap) + " deg): after " +
                 number(v[j - 1].v) + " expected " + number(v[j - 1].v + min_gap) + ", found " + number(v[j].v) +
                 " deg (a missing or irregular step)"};
        return false;
    }
    return true;
}

namespace {

// Theta: a regular axis, its ends snapped to the poles when within a ten-thousandth of a step.
Status theta_axis(const std::vector<Value>& tv, const Layout& L, const TextSource& src, const std::string& file,
                  GridPlan& g) {
    Failure af;
    double t0, dt;
    if (!regular_axis(tv, L.az_el ? "theta (90 - elevation)" : "theta", t0, dt, af)) return to_error(src, file, af);
    if (tv.size() == 1) dt = 1;
    else {
        if (std::abs(t0) <= 1e-4 * dt) t0 = 0;
        double t1 = tv.back().v;
        if (std::abs(t1 - 180) <= 1e-4 * dt) t1 = 180;
        dt = (t1 - t0) / double(tv.size() - 1);
    }
    g.grid.theta = {t0, dt, int(tv.size())};
    g.theta0 = t0;
    g.theta_step = dt;
    return Ok{};
}

// Phi as written, in [0, 360] or [-180, 180]; a full circle with or without its seam duplicate
// is stored from its smallest sample in [0, 360).
Status phi_axis(const std::vector<Value>& pv, const Layout& L, const TextSource& src, const std::string& file,
                GridPlan& g) {
    Failure af;
    double p0, dp;
    if (!regular_axis(pv, L.az_el ? "azimuth" : "phi", p0, dp, af)) return to_error(src, file, af);
    int n_phi = int(pv.size());
    bool seam = false;
    if (pv.size() >= 2 && std::abs(pv.back().v - pv.front().v - 360) <= 1e-4 * dp) {
        seam = true;  // 0 and 360, or -180 and 180: one column twice
        n_phi = int(pv.size()) - 1;
        dp = 360.0 / n_phi;
    } else if (pv.size() >= 2 && std::abs(dp * double(pv.size()) - 360) <= 1e-4 * dp) {
        dp = 360.0 / double(pv.size());  // wraps without a duplicate
    }
    // A single phi column is a cut, not a ring: its step is a placeholder (1 deg) so the grid
    // does not wrap and its coverage is zero, as for a single theta row.
    if (n_phi == 1) dp = 1;
    const bool wraps = n_phi > 1 && (seam || std::abs(dp * n_phi - 360) <= 1e-9 * 360);
    g.phi0 = p0;
    g.phi_step = pv.size() == 1 ? 360 : (pv.back().v - pv.front().v) / double(pv.size() - 1);
    g.n_phi_distinct = int(pv.size());
    g.phi_seam = seam;
    double start = wrap360(p0);
    int shift = 0;
    if (wraps) {
        // Turn the columns so the stored start is the smallest sample in [0, 360).
        double k = std::floor(start / dp);
        double s0 = start - k * dp;
        if (s0 >= dp * (1 - 1e-6)) s0 = 0, k += 1;
        if (s0 <= dp * 1e-6) s0 = 0;
        shift = int(std::llround(k)) % n_phi;
        start = s0;
    }
    g.phi_shift = shift;
    g.grid.phi = {start, dp, n_phi};
    return Ok{};
}

// Phi within one of the two windows the stored grid is read from directly: [0, 360] or
// [-180, 180] (any other window, or a span beyond 360, goes through csv_directions.hpp).
bool usual_phi_window(const std::vector<Value>& pv) {
    const double lo = pv.front().v, hi = pv.back().v;
    return (lo >= -angle_tol_deg && hi <= 360 + angle_tol_deg) || (lo >= -180 - angle_tol_deg && hi <= 180 + angle_tol_deg);
}

// The two angle columns as written, each a regular axis (GridPlan::raw).
Status raw_axes(const std::vector<Value>& tv, const std::vector<Value>& pv, const Layout& L, const TextSource& src,
                const std::string& file, GridPlan& g) {
    const bool positioner = L.angles == AngleSystem::az_over_el || L.angles == AngleSystem::el_over_az;
    Failure af;
    double t0, dt, p0, dp;
    if (!regular_axis(tv, positioner ? "elevation" : L.az_el ? "theta (90 - elevation)" : "theta", t0, dt, af) ||
        !regular_axis(pv, L.az_el ? "azimuth" : "phi", p0, dp, af))
        return to_error(src, file, af);
    if (tv.size() == 1) dt = 1;
    g.grid.theta = {t0, dt, int(tv.size())};
    g.theta0 = t0;
    g.theta_step = dt;
    g.grid.phi = {p0, pv.size() == 1 ? 1.0 : dp, int(pv.size())};
    g.phi0 = p0;
    g.phi_step = pv.size() == 1 ? 360 : dp;
    g.n_phi_distinct = int(pv.size());
    return Ok{};
}

// Whether a pole ring (theta 0 or 180 with several phi) can be given by one sample.
bool one_sample_pole(const Grid& grid, int it, FieldContent content) {
    const double th = grid.theta.value_deg(it);
    return grid.phi.count > 1 && content != FieldContent::magnitude_only && (th == 0 || th == 180);
}

std::string grid_text(const Grid& grid, std::size_t n_freq) {
    return "theta " + number(grid.theta.start_deg) + ".." + number(grid.theta.last_deg()) + " step " +
           number(grid.theta.step_deg) + ", phi " + number(grid.phi.start_deg) + " step " + number(grid.phi.step_deg) +
           " x " + std::to_string(grid.phi.count) + ", " + std::to_string(n_freq) + " frequencies";
}

}  // namespace

Result<GridPlan> plan_grid(const std::vector<Chunk>& chunks, const Layout& L, const TextSource& src,
                           const std::string& file) {
    GridPlan g;
    const auto tv = merged(chunks, &Chunk::theta, merge_tol_deg, false), pv = merged(chunks, &Chunk::phi, merge_tol_deg, false);
    g.raw = L.angles == AngleSystem::az_over_el || L.angles == AngleSystem::el_over_az || tv.front().v < 0 ||
            !usual_phi_window(pv);
    if (g.raw) {
        if (Status st = raw_axes(tv, pv, L, src, file, g); !st) return st.error();
    } else {
        if (Status st = theta_axis(tv, L, src, file, g); !st) return st.error();
        if (Status st = phi_axis(pv, L, src, file, g); !st) return st.error();
    }
    // Frequencies: lower_bound with a tolerance in pass 2 needs exact representatives.
    for (const Value& x : merged(chunks, &Chunk::freq, 1e-9, true)) g.freqs.push_back(x.v);
    return g;
}

namespace {

// Sorted distinct values with the gaps of a regular axis filled in (its ends and the smallest
// gap); false when the ends are not a whole number of smallest gaps apart, or when the axis would
// hold more than max_values (two theta values 1e-5 apart in a 1 kB file made a guess of millions
// of values, a 256 MB allocation; fuzz_csv found it).
bool filled_axis(std::vector<Value> v, std::vector<Value>& out, double max_values) {
    if (v.size() < 2) {
        out = std::move(v);
        return true;
    }
    double gap = std::numeric_limits<double>::infinity();
    for (std::size_t k = 1; k < v.size(); ++k) gap = std::min(gap, v[k].v - v[k - 1].v);
    const double span = v.back().v - v.front().v, n = std::round(span / gap);
    if (!(gap > 0) || std::abs(span / gap - n) > 1e-4 || n > 1e7 || n + 1 > max_values) return false;
    out.clear();
    out.reserve(std::size_t(n) + 1);
    for (std::size_t k = 0; k + 1 < std::size_t(n) + 1; ++k)
        out.push_back({v.front().v + span * double(k) / n, v.front().line_offset});
    out.push_back(v.back());
    return true;
}

bool same_axis(const AngleAxis& a, const AngleAxis& b) {
    return a.start_deg == b.start_deg && a.step_deg == b.step_deg && a.count == b.count;
}

}  // namespace

std::optional<GridPlan> guess_plan(const std::vector<Chunk>& samples, const Layout& L, const TextSource& src) {
    std::vector<Value> tv, pv;
    // Each value of a complete axis is written in a row of its own, and a row takes two bytes at
    // the least: an axis with more values than that is no grid this file can fill.
    const double max_values = double(src.size() / 2 + 1);
    if (!filled_axis(merged(samples, &Chunk::theta, merge_tol_deg, false), tv, max_values) ||
        !filled_axis(merged(samples, &Chunk::phi, merge_tol_deg, false), pv, max_values) || tv.empty() || pv.empty())
        return std::nullopt;
    const bool raw = L.angles == AngleSystem::az_over_el || L.angles == AngleSystem::el_over_az || tv.front().v < 0 ||
                     !usual_phi_window(pv);
    GridPlan g;
    if (raw || !theta_axis(tv, L, src, "", g) || !phi_axis(pv, L, src, "", g)) return std::nullopt;
    for (const Value& x : merged(samples, &Chunk::freq, 1e-9, true)) g.freqs.push_back(x.v);
    if (g.freqs.empty()) return std::nullopt;
    return g;
}

bool same_plan(const GridPlan& a, const GridPlan& b) {
    return same_axis(a.grid.theta, b.grid.theta) && same_axis(a.grid.phi, b.grid.phi) && a.grid.sampling == b.grid.sampling &&
           a.theta0 == b.theta0 && a.theta_step == b.theta_step && a.phi0 == b.phi0 && a.phi_step == b.phi_step &&
           a.n_phi_distinct == b.n_phi_distinct && a.phi_shift == b.phi_shift && a.phi_seam == b.phi_seam &&
           a.raw == b.raw && a.freqs == b.freqs;
}

Status check_grid_size(const GridPlan& g, std::size_t rows, FieldContent content, const CsvReadOptions& o,
                       const std::string& file) {
    const long double nf = (long double)g.freqs.size();
    const long double points = (long double)g.grid.size() * nf;
    // Rows a complete file needs at the least: one per point, one per pole ring.
    long double needed = 0;
    for (int it = 0; it < g.grid.theta.count; ++it)
        needed += !g.raw && one_sample_pole(g.grid, it, content) ? 1 : g.grid.phi.count;
    needed *= nf;
    // Arrays large against the input are refused before they are allocated: a grid the rows
    // cannot fill (a small one is allocated so that the completeness check names the missing
    // points), or one where few rows stand for many points. A grid with rows off the poles has
    // fewer than 3 points a row; only rings at the poles, each given by one sample, can have more.
    const bool large = points > 4.0L * (long double)rows + 4096;
    if (large && needed > (long double)rows)
        return Error{file, 0, 0,
                     "expected a value at every point of the grid (" + grid_text(g.grid, g.freqs.size()) + ": " +
                         number(double(points)) + " points, at least " + number(double(needed)) +
                         " rows), found only " + std::to_string(rows) + " data rows"};
    if (large)
        return Error{file, 0, 0,
                     "expected at most 4 grid points per data row, found " + number(double(points)) + " points (" +
                         grid_text(g.grid, g.freqs.size()) + ") from " + std::to_string(rows) +
                         " rows: rows only at the poles, each standing for a ring of many phi values"};
    if (points > 4e9L) return Error{file, 0, 0, "expected at most 4e9 grid points, found " + number(double(points))};
    const long double need = points * (2 * sizeof(cplx) + 1);
    const std::size_t limit = o.memory_limit_bytes ? o.memory_limit_bytes : available_memory_bytes();
    if (limit > 0 && need > (long double)limit)
        return Error{file, 0, 0, "expected a file that fits in memory: its grid needs " + number(double(need / 1e6)) +
                                     " MB, " + number(double(limit) / 1e6) + " MB are available"};
    return Ok{};
}

namespace {

// n zero samples in v, the memory's pages made present in one system call first (MADV_POPULATE_WRITE,
// Linux 5.14; ignored where it is unknown) rather than one page fault per 4 kB while zeroing.
template <class T>
void zeroed(std::vector<T>& v, std::size_t n) {
    v.reserve(n);
#if defined(MADV_POPULATE_WRITE)
    const std::uintptr_t page = 4096, a = (reinterpret_cast<std::uintptr_t>(v.data()) + page - 1) & ~(page - 1),
                         b = (reinterpret_cast<std::uintptr_t>(v.data() + n)) & ~(page - 1);
    if (b > a) ::madvise(reinterpret_cast<void*>(a), b - a, MADV_POPULATE_WRITE);
#endif
    v.assign(n, T{});
}

}  // namespace

void allocate(const GridPlan& g, FarFieldSet& s, SeenPoints& seen, int workers) {
    const std::size_t points = g.grid.size();
    s.grid = g.grid;
    s.frequencies.resize(g.freqs.size());
    seen.assign(g.freqs.size(), {});
    // Making the pages present and zeroing them is most of the cost: one frequency a task on the
    // cores when the arrays are large (each task writes only its own frequency's arrays). From a
    // quarter of a million samples (8 MB of arrays, a few ms of one core against a thread's start
    // of a few tens of microseconds); the bench file's 1 042 560 samples went to one thread when
    // the bar was 2^20, 11 ms of the read's wall time while the other core waited.
    const std::size_t threads =
        points * g.freqs.size() >= (std::size_t(1) << 18) ? std::min(parallel_threads(), std::size_t(std::max(1, workers))) : 1;
    parallel_each(g.freqs.size(), threads, [&](std::size_t k) {
        s.frequencies[k].frequency_hz = g.freqs[k];
        zeroed(s.frequencies[k].e_theta, points);
        zeroed(s.frequencies[k].e_phi, points);
        zeroed(seen[k], points);
    });
}

Status merge_seam(const std::vector<Chunk>& chunks, FarFieldSet& s, SeenPoints& seen, const Layout& L,
                  const TextSource& src, const std::string& file) {
    std::vector<Chunk::Alias> aliases;
    for (const Chunk& c : chunks) aliases.insert(aliases.end(), c.aliases.begin(), c.aliases.end());
    std::sort(aliases.begin(), aliases.end(), [](const auto& a, const auto& b) { return a.line_offset < b.line_offset; });
    const char* phi_word = L.az_el ? "azimuth" : "phi";
    for (const auto& a : aliases) {
        FarField& ff = s.frequencies[a.freq];
        if (!seen[a.freq][a.index]) {
            ff.e_theta[a.index] = a.et;
            ff.e_phi[a.index] = a.ep;
            seen[a.freq][a.index] = 2;
            continue;
        }
        if (same_direction_values(ff.e_theta[a.index], ff.e_phi[a.index], a.et, a.ep, L.duplicate_tolerance)) continue;
        const int it = int(a.index / std::size_t(s.grid.phi.count)), ip = int(a.index % std::size_t(s.grid.phi.count));
        return to_error(src, file,
                        {true, a.line_offset, 1,
                         std::string("expected the ") + phi_word + " seam duplicate to repeat the value at " + phi_word +
                             " " + number(s.grid.phi.value_deg(ip)) + " deg (theta " + number(s.grid.theta.value_deg(it)) +
                             " deg, " + format_frequency(ff.frequency_hz) + "), found a different value"});
    }
    return Ok{};
}

bool fill_poles(FarFieldSet& s, SeenPoints& seen) {
    const int n_phi = s.grid.phi.count;
    bool lone_without_phase = false;
    for (int it : {0, s.grid.theta.count - 1}) {
        const double th = s.grid.theta.value_deg(it);
        if (n_phi == 1 || !(th == 0 || th == 180)) continue;
        for (std::size_t fk = 0; fk < s.frequencies.size(); ++fk) {
            int count = 0, at = -1;
            for (int ip = 0; ip < n_phi; ++ip)
                if (seen[fk][s.grid.index(it, ip)]) ++count, at = ip;
            if (count != 1) continue;
            if (s.content == FieldContent::magnitude_only) {
                lone_without_phase = true;
                continue;
            }
            FarField& ff = s.frequencies[fk];
            const std::size_t k0 = s.grid.index(it, at);
            const double p0r = s.grid.phi.value_deg(at) * deg, tr = th * deg;
            const CVec3 e = ff.e_theta[k0] * theta_hat(tr, p0r) + ff.e_phi[k0] * phi_hat(p0r);
            for (int ip = 0; ip < n_phi; ++ip) {
                const std::size_t k = s.grid.index(it, ip);
                const double pr = s.grid.phi.value_deg(ip) * deg;
                if (s.content == FieldContent::total_only) {
                    ff.e_theta[k] = ff.e_theta[k0];
                    ff.e_phi[k] = 0;
                } else {
                    ff.e_theta[k] = dot(e, theta_hat(tr, pr));
                    ff.e_phi[k] = dot(e, phi_hat(pr));
                }
                seen[fk][k] = 2;
            }
        }
    }
    return lone_without_phase;
}

Status check_complete(const FarFieldSet& s, const SeenPoints& seen, const Layout& L, bool lone_pole_without_phase,
                      const std::string& file) {
    const int n_phi = s.grid.phi.count;
    const bool positioner = L.angles == AngleSystem::az_over_el || L.angles == AngleSystem::el_over_az;
    std::size_t missing = 0;
    std::string first_missing;
    for (std::size_t fk = 0; fk < s.frequencies.size(); ++fk)
        for (std::size_t k = 0; k < s.grid.size(); ++k) {
            if (seen[fk][k] || ++missing > 5) continue;
            const int it = int(k / std::size_t(n_phi)), ip = int(k % std::size_t(n_phi));
            // A positioner table (GridPlan::raw) is named by its own angles as written.
            first_missing += (missing > 1 ? "; " : "") + std::string(positioner ? "elevation " : "theta ") +
                             number(s.grid.theta.value_deg(it)) + (positioner ? ", azimuth " : ", phi ") +
                             number(positioner ? s.grid.phi.value_deg(ip) : wrap360(s.grid.phi.value_deg(ip))) + " deg, " +
                             (L.frequency_column || L.frequency_hz ? format_frequency(s.frequencies[fk].frequency_hz)
                                                                   : "no frequency");
        }
    if (missing == 0) return Ok{};
    return Error{file, 0, 0,
                 "expected a value at every grid point (" + grid_text(s.grid, s.frequencies.size()) + "), found " +
                     std::to_string(missing) + " missing: " + first_missing + (missing > 5 ? "; ..." : "") +
                     (lone_pole_without_phase ? " (one sample at a pole stands for its whole ring only with phase: "
                                                "magnitude-only data must give every phi there)"
                                              : "")};
}

}  // namespace ellipsa::csv
