// Reader for the neutral far-field CSV schema, version 1 (docs/far-field-csv.md).
//
// Two passes over the (memory-mapped) text, each split across worker threads at line
// boundaries:
//   pass 1 reads only the angle and frequency cells and collects their distinct values, from
//          which the regular grid is built and checked;
//   pass 2 reads every cell, converts the field family to complex E_theta/E_phi and writes each
//          row straight into its place in the final arrays.
// No per-row buffer exists, so the heap peak is the final arrays plus one byte per grid point
// (which points were seen). Errors carry the byte offset of their line; the line number is
// counted only when one is reported.
#include <algorithm>
#include <atomic>
#include <cmath>
#include <cstring>
#include <limits>
#include <thread>
#include <cstdint>
#include <unordered_map>
#if defined(__SSE2__)
#include <emmintrin.h>
#endif
#include <sys/stat.h>

#include "importers/csv_layout.hpp"
#include "importers/far_field_csv.hpp"
#include "importers/mapped_file.hpp"
#include "pattern/polarisation.hpp"

namespace ellipsa {

const std::vector<std::string>& csv_schema_columns() {
    static const std::vector<std::string> v = [] {
        std::vector<std::string> o;
        for (int k = 0; k < csv::c_count; ++k) o.emplace_back(csv::column_name(k));
        return o;
    }();
    return v;
}

namespace {

using namespace csv;

constexpr double angle_tol_deg = 1e-6;     // range checks
constexpr double merge_tol_deg = 1e-7;     // distinct angle values closer than this are one value
constexpr double max_field = 1e150;        // |field| above this is refused (its square must stay finite)
constexpr double max_db = 3000;            // dB above this is refused
constexpr double zero_db = -3000;          // dB at or below this (and -inf) is zero field

std::uint64_t bits_of(double v) {
    std::uint64_t b;
    std::memcpy(&b, &v, sizeof b);
    return b;
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
        const std::uint64_t b = bits_of(v);
        const std::size_t h = std::size_t((b * 0x9E3779B97F4A7C15ull) >> 55);
        if (cache[h] == b) return;
        cache[h] = b;
        auto it = first.find(b);
        if (it == first.end()) first.emplace(b, line_offset);
        else if (line_offset < it->second) it->second = line_offset;
    }
};

struct Value {
    double v;
    std::size_t line_offset;
};

// Merge the per-thread sets, sort, and fold values closer than tol (relative when rel).
std::vector<Value> merged(const std::vector<const DistinctValues*>& sets, double tol, bool rel) {
    std::vector<Value> all;
    for (const DistinctValues* s : sets)
        for (const auto& [b, off] : s->first) {
            double v;
            std::memcpy(&v, &b, sizeof v);
            all.push_back({v, off});
        }
    std::sort(all.begin(), all.end(), [](const Value& a, const Value& b) { return a.v < b.v || (a.v == b.v && a.line_offset < b.line_offset); });
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

struct Chunk {
    std::size_t begin = 0, end = 0;
    // pass 1
    DistinctValues theta, phi, freq;
    std::size_t rows = 0;
    double phi_min = std::numeric_limits<double>::infinity(), phi_max = -std::numeric_limits<double>::infinity();
    std::size_t phi_min_offset = 0, phi_max_offset = 0;
    // pass 2
    struct Alias {
        std::size_t freq, index;
        cplx et, ep;
        std::size_t line_offset;
    };
    std::vector<Alias> aliases;
    Failure failure;
};

struct Context {
    std::string_view text;
    const std::string* file;
    const Layout* L;
    const CsvReadOptions* options;
    const MappedFile* mapped = nullptr;
    std::atomic<bool> cancelled{false};
    bool concurrent = false;  // more than one worker writes the arrays
    // grid (pass 2)
    double theta0 = 0, theta_step = 1, phi0 = 0, phi_step = 360;
    int n_theta = 1, n_phi = 1, phi_shift = 0;
    bool phi_seam = false;  // the last distinct phi is the seam duplicate of the first
    int n_phi_distinct = 1;
    std::vector<double> freqs;
    std::vector<FarField>* out = nullptr;
    std::vector<std::vector<unsigned char>>* seen = nullptr;
};

// First '\n' or NUL byte in [p, end), or end. SSE2 (x86-64 baseline), 16 bytes a step.
inline const char* find_newline_or_nul(const char* p, const char* end) {
#if defined(__SSE2__)
    const __m128i nl = _mm_set1_epi8('\n'), zero = _mm_setzero_si128();
    while (end - p >= 16) {
        const __m128i v = _mm_loadu_si128(reinterpret_cast<const __m128i*>(p));
        const int m = _mm_movemask_epi8(_mm_or_si128(_mm_cmpeq_epi8(v, nl), _mm_cmpeq_epi8(v, zero)));
        if (m) return p + __builtin_ctz(unsigned(m));
        p += 16;
    }
#endif
    while (p < end && *p != '\n' && *p != 0) ++p;
    return p;
}

// Walk the lines of [c.begin, c.end), calling row(line_begin, line_end) for each data row.
// Blank lines and '#' lines are skipped (metadata keys after the header are refused).
template <class Row>
void for_each_row(Context& ctx, Chunk& c, bool first_pass, double progress_base, double progress_span, Row&& row) {
    const char* const base = ctx.text.data();
    const char* p = base + c.begin;
    const char* const end = base + c.end;
    const char delim = ctx.L->delimiter;
    std::size_t n = 0;
    std::size_t released = c.begin;
    while (p < end) {
        const char* nl;
        if (first_pass) {
            // Binary garbage: text never holds a NUL byte. One scan finds the line end and any
            // NUL before it, while the pages are being parsed anyway.
            nl = find_newline_or_nul(p, end);
            if (nl < end && *nl == 0) {
                c.failure = {true, std::size_t(p - base), long(nl - p) + 1,
                             "expected text, found a NUL byte (a binary file?)"};
                return;
            }
            if (nl == end) nl = nullptr;
        } else {
            nl = static_cast<const char*>(std::memchr(p, '\n', std::size_t(end - p)));
        }
        const char* e = nl ? nl : end;
        const char* next = nl ? nl + 1 : end;
        if (e > p && e[-1] == '\r') --e;
        const char* q = p;
        while (q < e && (*q == ' ' || *q == '\t' || *q == delim)) ++q;
        if (q == e) {
            p = next;
            continue;
        }
        if (*q == '#') {
            if (first_pass) {
                const char* colon = static_cast<const char*>(std::memchr(q, ':', std::size_t(e - q)));
                if (colon) {
                    std::string key = normalise_name(std::string_view(q + 1, std::size_t(colon - q - 1)));
                    static const char* keys[] = {"quantity", "time-convention", "angle-unit", "frequency-unit",
                                                 "frequency", "ludwig3-reference", "name", "source", "note"};
                    for (const char* k : keys)
                        if (key == k) {
                            c.failure = {true, std::size_t(p - base), long(q - p) + 1,
                                         "expected metadata lines before the header row, found \"# " + key +
                                             ":\" after it"};
                            return;
                        }
                }
            }
            p = next;
            continue;
        }
        if (!row(p, e)) return;
        if ((++n & 4095) == 0) {
            if (ctx.cancelled.load(std::memory_order_relaxed)) return;
            const std::size_t done = std::size_t(p - base);
            if (ctx.mapped && done - released > (2u << 20)) {
                ctx.mapped->release(released, done - released);
                released = done;
                ctx.mapped->prefetch(done, std::min<std::size_t>(c.end - done, 2u << 20));
            }
            if (progress_span > 0 && ctx.options->progress) {
                const double f = double(done - c.begin) / double(std::max<std::size_t>(1, c.end - c.begin));
                if (!ctx.options->progress(progress_base + progress_span * f)) ctx.cancelled = true;
            }
        }
        p = next;
    }
    if (ctx.mapped) ctx.mapped->release(released, c.end - released);
}

// Angle and frequency cells repeat a few distinct texts over and over ("0", "90", "2.45e9").
// Their raw bytes (up to 16, zero-padded: text holds no NUL) are a key into a small
// direct-mapped cache per role, so each distinct text is parsed and checked once per thread.
struct CellKey {
    std::uint64_t a = 0, b = 0;
    bool operator==(const CellKey& o) const { return a == o.a && b == o.b; }
};

// Key of the cell at p (up to the delimiter or e); false when it is empty or longer than 16.
inline bool key_cell(const char* p, const char* e, char delim, CellKey& k, const char*& cell_end) {
    const char* q = p;
    const char* lim = e - p > 17 ? p + 17 : e;
    while (q < lim && *q != delim) ++q;
    const std::size_t n = std::size_t(q - p);
    if (n == 0 || n > 16) return false;
    if (e - p >= 16) {
        // Two unaligned loads, then clear the bytes past the cell.
        std::memcpy(&k.a, p, 8);
        std::memcpy(&k.b, p + 8, 8);
        if (n < 8) {
            k.a &= (std::uint64_t(1) << (8 * n)) - 1;
            k.b = 0;
        } else if (n < 16) {
            k.b &= n == 8 ? 0 : (std::uint64_t(1) << (8 * (n - 8))) - 1;
        }
    } else {
        char buf[16] = {};
        for (std::size_t i = 0; i < n; ++i) buf[i] = p[i];
        std::memcpy(&k.a, buf, 8);
        std::memcpy(&k.b, buf + 8, 8);
    }
    cell_end = q;
    return true;
}

inline std::size_t key_slot(const CellKey& k) {
    return std::size_t(((k.a * 0x9E3779B97F4A7C15ull) ^ (k.b * 0xC2B2AE3D27D4EB4Full)) >> 56);
}

// What an angle or frequency cell means once parsed: the value (deg, Hz) and, in pass 2, its
// grid index (theta row, phi column, frequency) and whether it is the phi seam duplicate.
struct AngleInfo {
    double value = 0;
    long index = 0;
    bool alias = false;
};

struct AngleCache {
    CellKey key[256];
    bool used[256] = {};
    AngleInfo info[256];
};

// Which part of the grid a role gives: 0 theta, 1 phi, 2 frequency; -1 a field column.
inline int angle_slot(int role) {
    switch (role) {
        case c_theta:
        case c_elevation: return 0;
        case c_phi:
        case c_azimuth: return 1;
        case c_frequency: return 2;
        default: return -1;
    }
}

std::string fmtv(double v) {
    char b[32];
    std::snprintf(b, sizeof b, "%.9g", v);
    return b;
}

// Convert and check one angle/frequency value (after scale/offset); empty message when fine.
std::string angle_value(const Layout& L, int role, double raw, double& out) {
    switch (role) {
        case c_theta: {
            const double t = raw * L.angle_to_deg;
            if (!(t >= -angle_tol_deg && t <= 180 + angle_tol_deg)) return "expected theta in [0, 180] deg, found " + fmtv(t);
            out = std::clamp(t, 0.0, 180.0);
            return {};
        }
        case c_elevation: {
            const double el = raw * L.angle_to_deg;
            if (!(el >= -90 - angle_tol_deg && el <= 90 + angle_tol_deg))
                return "expected elevation in [-90, 90] deg, found " + fmtv(el);
            out = std::clamp(90.0 - el, 0.0, 180.0);
            return {};
        }
        case c_phi:
        case c_azimuth: {
            const double ph = raw * L.angle_to_deg;
            if (!(ph >= -180 - angle_tol_deg && ph <= 360 + angle_tol_deg))
                return std::string("expected ") + (role == c_phi ? "phi" : "azimuth") +
                       " in [0, 360] or [-180, 180] deg, found " + fmtv(ph);
            out = ph;
            return {};
        }
        default: {
            const double f = raw * L.hz_per_unit;
            if (!(f >= 0) || !std::isfinite(f)) return "expected a frequency >= 0, found " + fmtv(raw);
            out = f;
            return {};
        }
    }
}

inline void fail_cell(Chunk& c, const char* base, const char* line, const char* cell, std::string msg) {
    c.failure = {true, std::size_t(line - base), long(cell - line) + 1, std::move(msg)};
}

inline std::string not_a_number(int role, const char* cell, const char* e, char delim) {
    const char* ce = static_cast<const char*>(std::memchr(cell, delim, std::size_t(e - cell)));
    if (!ce) ce = e;
    return std::string("expected a number in column \"") + column_name(role) + "\", found " +
           (cell == ce ? std::string("an empty cell") : quote_found(std::string_view(cell, std::size_t(ce - cell))));
}

// Past the delimiter after cell k (false, with a failure, when the row ends early).
inline bool next_cell(Chunk& c, const char* base, const char* line, const char* e, const char*& q, int k, int ncells) {
    if (k < ncells - 1) {
        if (q >= e) {
            fail_cell(c, base, line, q,
                      "expected " + std::to_string(ncells) + " cells as in the header row, found " + std::to_string(k + 1));
            return false;
        }
        ++q;
    }
    return true;
}

void pass1(Context& ctx, Chunk& c, bool report_progress) {
    const Layout& L = *ctx.L;
    const char* const base = ctx.text.data();
    AngleCache cache[3];
    DistinctValues* sets[3] = {&c.theta, &c.phi, &c.freq};
    if (!L.frequency_column) c.freq.add(L.frequency_hz ? *L.frequency_hz : 0.0, c.begin);
    const int upto = L.last_angle_cell;
    for_each_row(ctx, c, true, 0.0, report_progress ? 0.35 : 0.0, [&](const char* p, const char* e) {
        const char* q = p;
        for (int k = 0; k <= upto; ++k) {
            const int r = L.role[std::size_t(k)];
            const int slot = angle_slot(r);
            if (slot < 0) {
                const char* ce = static_cast<const char*>(std::memchr(q, L.delimiter, std::size_t(e - q)));
                q = ce ? ce : e;
            } else {
                CellKey key;
                const char* ce = nullptr;
                const bool keyed = key_cell(q, e, L.delimiter, key, ce);
                const std::size_t h = keyed ? key_slot(key) : 0;
                if (keyed && cache[slot].used[h] && cache[slot].key[h] == key) {
                    q = ce;
                } else {
                    NumberStatus st;
                    double v;
                    const char* cell = q;
                    q = parse_number_cell(q, e, L.delimiter, L.decimal_comma, v, st);
                    if (st != NumberStatus::ok) {
                        fail_cell(c, base, p, cell, not_a_number(r, cell, e, L.delimiter));
                        return false;
                    }
                    if (L.transform) v = v * L.scale[std::size_t(r)] + L.offset[std::size_t(r)];
                    double x;
                    std::string msg = angle_value(L, r, v, x);
                    if (!msg.empty()) {
                        fail_cell(c, base, p, cell, std::move(msg));
                        return false;
                    }
                    const std::size_t off = std::size_t(p - base);
                    sets[slot]->add(x, off);
                    if (slot == 1) {
                        if (x < c.phi_min) c.phi_min = x, c.phi_min_offset = off;
                        if (x > c.phi_max) c.phi_max = x, c.phi_max_offset = off;
                    }
                    if (keyed) {
                        cache[slot].used[h] = true;
                        cache[slot].key[h] = key;
                    }
                }
            }
            if (!next_cell(c, base, p, e, q, k, L.cells)) return false;
        }
        ++c.rows;
        return true;
    });
}

// 10^(db/20), with -inf and very low values as exact zero.
inline bool db_amplitude(double db, double& a) {
    if (db <= zero_db) {
        a = 0;
        return true;
    }
    if (!(db <= max_db)) return false;
    a = std::exp(db * (2.302585092994045684 / 20.0));
    return true;
}

void pass2(Context& ctx, Chunk& c, bool report_progress) {
    const Layout& L = *ctx.L;
    const char* const base = ctx.text.data();
    const int ncells = L.cells;
    AngleCache cache[3];
    std::vector<const char*> cell_at(std::size_t(ncells) + 1);
    double v[c_count];
    const std::size_t nf = ctx.freqs.size();
    AngleInfo fixed_f;  // without a frequency column: the one frequency
    fixed_f.value = ctx.freqs.empty() ? 0.0 : ctx.freqs[0];
    // Grid place of a parsed angle/frequency value; false when it is not on the first pass's grid.
    auto place = [&](int slot, double x, AngleInfo& a) {
        a.value = x;
        if (slot == 0) {
            const double d = (x - ctx.theta0) / ctx.theta_step;
            a.index = d > -0.5 ? long(d + 0.5) : -1;
            return a.index >= 0 && a.index < ctx.n_theta;
        }
        if (slot == 1) {
            const double d = (x - ctx.phi0) / ctx.phi_step;
            long ip = d > -0.5 ? long(d + 0.5) : -1;
            if (ip < 0 || ip >= ctx.n_phi_distinct) return false;
            a.alias = ctx.phi_seam && ip == ctx.n_phi_distinct - 1;
            if (a.alias) ip = 0;
            a.index = (ip + ctx.phi_shift) % ctx.n_phi;
            return true;
        }
        auto it = std::lower_bound(ctx.freqs.begin(), ctx.freqs.end(), x * (1 - 1e-9));
        a.index = long(it - ctx.freqs.begin());
        return std::size_t(a.index) < nf && std::abs(ctx.freqs[std::size_t(a.index)] - x) <= 1e-9 * std::max(1.0, x);
    };
    for_each_row(ctx, c, false, 0.35, report_progress ? 0.65 : 0.0, [&](const char* p, const char* e) {
        const AngleInfo* ang[3] = {nullptr, nullptr, L.frequency_column ? nullptr : &fixed_f};
        AngleInfo fresh[3];
        const char* q = p;
        for (int k = 0; k < ncells; ++k) {
            cell_at[std::size_t(k)] = q;
            const int r = L.role[std::size_t(k)];
            if (r < 0) {
                const char* ce = static_cast<const char*>(std::memchr(q, L.delimiter, std::size_t(e - q)));
                q = ce ? ce : e;
            } else {
                const int slot = angle_slot(r);
                CellKey key;
                const char* ce = nullptr;
                const bool keyed = slot >= 0 && key_cell(q, e, L.delimiter, key, ce);
                const std::size_t h = keyed ? key_slot(key) : 0;
                if (keyed && cache[slot].used[h] && cache[slot].key[h] == key) {
                    ang[slot] = &cache[slot].info[h];
                    q = ce;
                } else {
                    NumberStatus st;
                    double x;
                    const char* cell = q;
                    q = parse_number_cell(q, e, L.delimiter, L.decimal_comma, x, st);
                    if (st != NumberStatus::ok) {
                        fail_cell(c, base, p, cell, not_a_number(r, cell, e, L.delimiter));
                        return false;
                    }
                    if (L.transform) x = x * L.scale[std::size_t(r)] + L.offset[std::size_t(r)];
                    if (slot < 0) {
                        v[r] = x;
                    } else {
                        double y;
                        std::string msg = angle_value(L, r, x, y);
                        if (!msg.empty()) {
                            fail_cell(c, base, p, cell, std::move(msg));
                            return false;
                        }
                        AngleInfo& a = keyed ? cache[slot].info[h] : fresh[slot];
                        if (!place(slot, y, a)) {
                            fail_cell(c, base, p, cell, "internal: value not on the first pass's grid");
                            return false;
                        }
                        if (keyed) {
                            cache[slot].used[h] = true;
                            cache[slot].key[h] = key;
                        }
                        ang[slot] = &a;
                    }
                }
            }
            if (!next_cell(c, base, p, e, q, k, ncells)) return false;
        }
        if (q < e) {
            // Only empty trailing cells may follow.
            const char* t = q;
            while (t < e && (*t == ' ' || *t == '\t' || *t == L.delimiter)) ++t;
            if (t < e) {
                int extra = 0;
                for (const char* s = q; s < e; ++s) extra += *s == L.delimiter;
                fail_cell(c, base, p, q,
                          "expected " + std::to_string(ncells) + " cells as in the header row, found " +
                              std::to_string(ncells + extra));
                return false;
            }
        }
        auto fail_at = [&](int role, std::string msg) {
            fail_cell(c, base, p, cell_at[std::size_t(L.column_of[std::size_t(role)])], std::move(msg));
            return false;
        };
        const std::size_t fk = std::size_t(ang[2]->index);
        const std::size_t k = std::size_t(ang[0]->index) * std::size_t(ctx.n_phi) + std::size_t(ang[1]->index);
        const bool alias = ang[1]->alias;
        const double t = ang[0]->value, ph = ang[1]->value, f = ang[2]->value;

        // Field values.
        cplx et, ep;
        switch (L.family) {
            case CsvFamily::complex: {
                for (int r : {c_e_theta_re, c_e_theta_im, c_e_phi_re, c_e_phi_im})
                    if (!(std::abs(v[r]) <= max_field))
                        return fail_at(r, std::string("expected a finite field value below 1e150 in magnitude in column \"") +
                                              column_name(r) + "\"");
                et = cplx(v[c_e_theta_re], L.minus_iwt ? -v[c_e_theta_im] : v[c_e_theta_im]);
                ep = cplx(v[c_e_phi_re], L.minus_iwt ? -v[c_e_phi_im] : v[c_e_phi_im]);
                break;
            }
            case CsvFamily::total_db: {
                double a;
                if (!db_amplitude(v[c_e_total_db], a)) return fail_at(c_e_total_db, "expected a dB value below 3000 in column \"e_total_db\"");
                et = a;
                ep = 0;
                break;
            }
            case CsvFamily::magnitude_db: {
                double a, b;
                if (!db_amplitude(v[c_e_theta_db], a)) return fail_at(c_e_theta_db, "expected a dB value below 3000 in column \"e_theta_db\"");
                if (!db_amplitude(v[c_e_phi_db], b)) return fail_at(c_e_phi_db, "expected a dB value below 3000 in column \"e_phi_db\"");
                et = a;
                ep = b;
                break;
            }
            default: {
                // Amplitude and phase columns of the two components of this family.
                const bool tp = L.family == CsvFamily::theta_phi_polar;
                const bool circ = L.family == CsvFamily::circular_polar;
                const int r1 = tp ? c_e_theta_db : circ ? c_e_rhcp_db : c_e_co_db;
                const int p1 = tp ? c_e_theta_phase : circ ? c_e_rhcp_phase : c_e_co_phase;
                const int r2 = tp ? c_e_phi_db : circ ? c_e_lhcp_db : c_e_cross_db;
                const int p2 = tp ? c_e_phi_phase : circ ? c_e_lhcp_phase : c_e_cross_phase;
                double a, b;
                if (!db_amplitude(v[r1], a)) return fail_at(r1, std::string("expected a dB value below 3000 in column \"") + column_name(r1) + "\"");
                if (!db_amplitude(v[r2], b)) return fail_at(r2, std::string("expected a dB value below 3000 in column \"") + column_name(r2) + "\"");
                for (int r : {p1, p2})
                    if (!std::isfinite(v[r])) return fail_at(r, std::string("expected a finite phase in column \"") + column_name(r) + "\"");
                double ph1 = v[p1] * L.phase_to_rad, ph2 = v[p2] * L.phase_to_rad;
                if (L.minus_iwt) {
                    ph1 = -ph1;
                    ph2 = -ph2;
                }
                const cplx c1 = std::polar(a, ph1), c2 = std::polar(b, ph2);
                if (L.family == CsvFamily::theta_phi_polar) {
                    et = c1;
                    ep = c2;
                } else if (L.family == CsvFamily::circular_polar) {
                    // Inverse of E_R = (Et + j Ep)/sqrt2, E_L = (Et - j Ep)/sqrt2 (conventions.md):
                    // Et = (E_R + E_L)/sqrt2, Ep = (E_R - E_L)/(j sqrt2) = -j (E_R - E_L)/sqrt2.
                    et = (c1 + c2) * inv_sqrt2;
                    ep = cplx(0, -1) * (c1 - c2) * inv_sqrt2;
                } else {
                    const double pr = ph * deg;
                    from_ludwig3(c1, c2, std::cos(pr), std::sin(pr), *L.ludwig3_reference, et, ep);
                }
            }
        }
        const double pw = std::norm(et) + std::norm(ep);
        if (alias) {
            c.aliases.push_back({fk, k, et, ep, std::size_t(p - base)});
            return true;
        }
        unsigned char& seen = (*ctx.seen)[fk][k];
        if (!ctx.concurrent) {
            if (seen == 0) {
                (*ctx.out)[fk].e_theta[k] = et;
                (*ctx.out)[fk].e_phi[k] = ep;
                seen = 2;
                return true;
            }
        } else {
            std::atomic_ref<unsigned char> s(seen);
            unsigned char expected = 0;
            if (s.compare_exchange_strong(expected, 1, std::memory_order_acq_rel)) {
                (*ctx.out)[fk].e_theta[k] = et;
                (*ctx.out)[fk].e_phi[k] = ep;
                s.store(2, std::memory_order_release);
                return true;
            }
            // A second row for the same point: wait for the first writer, then compare.
            while (s.load(std::memory_order_acquire) != 2) std::this_thread::yield();
        }
        const cplx a = (*ctx.out)[fk].e_theta[k], b = (*ctx.out)[fk].e_phi[k];
        const double d = std::sqrt(std::norm(a - et) + std::norm(b - ep));
        const double m = std::sqrt(std::max(std::norm(a) + std::norm(b), pw));
        if (!(d <= 1e-3 * m || m <= 1e-6)) {
            char buf[200];
            std::snprintf(buf, sizeof buf, "expected at most one value per grid point, found a second one that differs "
                                           "(theta %.9g, phi %.9g deg, %.9g Hz)", t, ph, f);
            c.failure = {true, std::size_t(p - base), 1, buf};
            return false;
        }
        return true;
    });
}

// Split [begin, end) into n chunks at line starts.
std::vector<Chunk> split(std::string_view text, std::size_t begin, int n) {
    std::vector<Chunk> cs(std::size_t(std::max(1, n)));
    const std::size_t len = text.size() - begin;
    std::size_t a = begin;
    for (std::size_t i = 0; i < cs.size(); ++i) {
        std::size_t b = i + 1 == cs.size() ? text.size() : begin + len * (i + 1) / cs.size();
        if (b < a) b = a;
        if (b < text.size()) {
            const void* nl = std::memchr(text.data() + b, '\n', text.size() - b);
            b = nl ? std::size_t(static_cast<const char*>(nl) - text.data()) + 1 : text.size();
        }
        cs[i].begin = a;
        cs[i].end = b;
        a = b;
    }
    return cs;
}

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

const Failure* first_failure(const std::vector<Chunk>& cs) {
    const Failure* best = nullptr;
    for (const Chunk& c : cs)
        if (c.failure.set && (!best || c.failure.line_offset < best->line_offset)) best = &c.failure;
    return best;
}

std::string fmt(double v) {
    char b[32];
    std::snprintf(b, sizeof b, "%.9g", v);
    return b;
}

std::string freq_text(double hz) {
    if (hz >= 1e9) return fmt(hz / 1e9) + " GHz";
    if (hz >= 1e6) return fmt(hz / 1e6) + " MHz";
    if (hz >= 1e3) return fmt(hz / 1e3) + " kHz";
    return fmt(hz) + " Hz";
}

// Build a regular axis from sorted distinct values; on failure sets `f` at the first value off.
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
        const double want = start + double(k) * step;
        if (std::abs(v[k].v - want) > tol) {
            // Report in terms of the smallest gap: "after A expected B, found C".
            std::size_t j = 1;
            while (j < v.size() && std::abs((v[j].v - v[j - 1].v) - min_gap) <= std::max(1e-9, 1e-4 * min_gap)) ++j;
            if (j >= v.size()) j = k;
            f = {true, v[j].line_offset, 0,
                 std::string("expected evenly spaced ") + what + " values (step " + fmt(min_gap) + " deg): after " +
                     fmt(v[j - 1].v) + " expected " + fmt(v[j - 1].v + min_gap) + ", found " + fmt(v[j].v) +
                     " deg (a missing or irregular step)"};
            return false;
        }
    }
    return true;
}

}  // namespace

Result<FarFieldSet> parse_far_field_text(std::string_view text, const std::string& name, const CsvReadOptions& o,
                                         const MappedFile* mapped);

Result<FarFieldSet> parse_far_field_csv(std::string_view text, const std::string& name, const CsvReadOptions& o) {
    return parse_far_field_text(text, name, o, nullptr);
}

Result<FarFieldSet> parse_far_field_text(std::string_view text, const std::string& name, const CsvReadOptions& o,
                                         const MappedFile* mapped) {
    auto layout = read_layout(text, name, o);
    if (!layout) return layout.error();
    const Layout& L = *layout;

    Context ctx;
    ctx.text = text;
    ctx.file = &name;
    ctx.L = &L;
    ctx.options = &o;
    ctx.mapped = mapped;
    int threads = o.threads > 0 ? o.threads : int(std::max(1u, std::thread::hardware_concurrency()));
    threads = std::min(threads, 8);
    if (o.threads <= 0 && text.size() - L.data_offset < (std::size_t(4) << 20)) threads = 1;
    std::vector<Chunk> chunks = split(text, L.data_offset, threads);

    // Pass 1: angles and frequencies.
    run_chunks(chunks, [&](Chunk& c, bool first) { pass1(ctx, c, first); });
    if (ctx.cancelled) return Error{name, 0, 0, "reading cancelled"};
    if (const Failure* f = first_failure(chunks)) return to_error(text, name, *f);
    std::size_t rows = 0;
    for (const Chunk& c : chunks) rows += c.rows;
    if (rows == 0)
        return Error{name, line_number_at(text, L.header_offset), 0, "expected data rows after the header row, found none"};

    std::vector<const DistinctValues*> ts, ps, fs;
    double phi_min = std::numeric_limits<double>::infinity(), phi_max = -phi_min;
    std::size_t phi_min_off = 0, phi_max_off = 0;
    for (const Chunk& c : chunks) {
        ts.push_back(&c.theta);
        ps.push_back(&c.phi);
        fs.push_back(&c.freq);
        if (c.phi_min < phi_min) phi_min = c.phi_min, phi_min_off = c.phi_min_offset;
        if (c.phi_max > phi_max) phi_max = c.phi_max, phi_max_off = c.phi_max_offset;
    }
    const char* phi_word = L.az_el ? "azimuth" : "phi";
    if (phi_min < -angle_tol_deg && phi_max > 180 + angle_tol_deg) {
        const std::size_t later = std::max(phi_min_off, phi_max_off);
        return to_error(text, name, {true, later, 0,
                                     std::string("expected ") + phi_word + " in [0, 360) or in [-180, 180], found both " +
                                         fmt(phi_min) + " (line " + std::to_string(line_number_at(text, phi_min_off)) +
                                         ") and " + fmt(phi_max) + " (line " +
                                         std::to_string(line_number_at(text, phi_max_off)) + ")"});
    }
    std::vector<Value> tv = merged(ts, merge_tol_deg, false);
    std::vector<Value> pv = merged(ps, merge_tol_deg, false);
    std::vector<Value> fv = merged(fs, 1e-9, true);

    FarFieldSet s;
    s.name = L.name.empty() ? name : L.name;
    s.source = L.source.empty() ? name : L.source;
    s.note = L.note;
    s.quantity = L.quantity;
    s.ludwig3_reference = L.ludwig3_reference ? *L.ludwig3_reference : Ludwig3Reference::x;
    s.time_convention_converted = L.minus_iwt;
    s.content = L.family == CsvFamily::magnitude_db ? FieldContent::magnitude_only
                : L.family == CsvFamily::total_db   ? FieldContent::total_only
                                                    : FieldContent::complex;

    // Theta axis.
    Failure af;
    double t0, dt;
    if (!regular_axis(tv, L.az_el ? "theta (90 - elevation)" : "theta", t0, dt, af)) return to_error(text, name, af);
    if (tv.size() == 1) dt = 1;
    else {
        if (std::abs(t0) <= 1e-4 * dt) t0 = 0;
        double t1 = tv.back().v;
        if (std::abs(t1 - 180) <= 1e-4 * dt) t1 = 180;
        dt = (t1 - t0) / double(tv.size() - 1);
    }
    s.grid.theta = {t0, dt, int(tv.size())};
    // Phi axis: values as written, in [0, 360] or [-180, 180].
    double p0, dp;
    if (!regular_axis(pv, phi_word, p0, dp, af)) return to_error(text, name, af);
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
    ctx.phi0 = p0;
    ctx.phi_step = pv.size() == 1 ? 360 : (pv.back().v - pv.front().v) / double(pv.size() - 1);
    ctx.n_phi_distinct = int(pv.size());
    ctx.phi_seam = seam;
    // Stored start in [0, 360); a full circle starts at its smallest non-negative sample.
    double start = wrap360(p0);
    int shift = 0;
    if (wraps && n_phi > 1) {
        // Turn the columns so the stored start is the smallest sample in [0, 360).
        double k = std::floor(start / dp);
        double s0 = start - k * dp;
        if (s0 >= dp * (1 - 1e-6)) s0 = 0, k += 1;
        if (s0 <= dp * 1e-6) s0 = 0;
        shift = int(std::llround(k)) % n_phi;
        start = s0;
    }
    ctx.phi_shift = shift;
    s.grid.phi = {start, dp, n_phi};
    ctx.theta0 = t0;
    ctx.theta_step = dt;
    ctx.n_theta = s.grid.theta.count;
    ctx.n_phi = n_phi;
    for (const Value& x : fv) ctx.freqs.push_back(x.v);
    // lower_bound with a tolerance needs exact representatives: use the merged values.

    // Memory: the final arrays plus one byte per point.
    const std::size_t points = s.grid.size();
    const long double need = (long double)points * (long double)ctx.freqs.size() * (2 * sizeof(cplx) + 1);
    const std::size_t limit = o.memory_limit_bytes ? o.memory_limit_bytes : available_memory_bytes();
    const long double grid_points = (long double)points * (long double)ctx.freqs.size();
    if (limit > 0 && need > (long double)limit) {
        if (grid_points > (long double)rows)
            return Error{name, 0, 0, "expected a value at every point of the grid (" + fmt(double(grid_points)) +
                                         " points), found only " + std::to_string(rows) + " data rows"};
        return Error{name, 0, 0, "expected a file that fits in memory: its grid needs " + fmt(double(need / 1e6)) +
                                     " MB, " + fmt(double(limit) / 1e6) + " MB are available"};
    }
    if (grid_points > 4e9) return Error{name, 0, 0, "expected at most 4e9 grid points, found " + fmt(double(grid_points))};

    s.frequencies.resize(ctx.freqs.size());
    std::vector<std::vector<unsigned char>> seen(ctx.freqs.size());
    for (std::size_t k = 0; k < ctx.freqs.size(); ++k) {
        s.frequencies[k].frequency_hz = ctx.freqs[k];
        s.frequencies[k].e_theta.assign(points, cplx(0, 0));
        s.frequencies[k].e_phi.assign(points, cplx(0, 0));
        seen[k].assign(points, 0);
    }
    ctx.out = &s.frequencies;
    ctx.seen = &seen;

    // Pass 2: every cell, straight into place.
    ctx.concurrent = chunks.size() > 1;
    for (Chunk& c : chunks) c.failure = {};
    run_chunks(chunks, [&](Chunk& c, bool first) { pass2(ctx, c, first); });
    if (ctx.cancelled) return Error{name, 0, 0, "reading cancelled"};
    if (const Failure* f = first_failure(chunks)) return to_error(text, name, *f);

    // Seam duplicates: merge when consistent, fill when the canonical column is absent.
    std::vector<Chunk::Alias> aliases;
    for (Chunk& c : chunks) aliases.insert(aliases.end(), c.aliases.begin(), c.aliases.end());
    std::sort(aliases.begin(), aliases.end(), [](const auto& a, const auto& b) { return a.line_offset < b.line_offset; });
    for (const auto& a : aliases) {
        FarField& ff = s.frequencies[a.freq];
        if (seen[a.freq][a.index]) {
            const cplx x = ff.e_theta[a.index], y = ff.e_phi[a.index];
            const double d = std::sqrt(std::norm(x - a.et) + std::norm(y - a.ep));
            const double m = std::sqrt(std::max(std::norm(x) + std::norm(y), std::norm(a.et) + std::norm(a.ep)));
            if (!(d <= 1e-3 * m || m <= 1e-6)) {
                const int it = int(a.index / std::size_t(n_phi));
                const int ip = int(a.index % std::size_t(n_phi));
                return to_error(text, name,
                                {true, a.line_offset, 1,
                                 "expected the " + std::string(phi_word) + " seam duplicate to repeat the value at " +
                                     phi_word + " " + fmt(s.grid.phi.value_deg(ip)) + " deg (theta " +
                                     fmt(s.grid.theta.value_deg(it)) + " deg, " + freq_text(ctx.freqs[a.freq]) +
                                     "), found a different value"});
            }
        } else {
            ff.e_theta[a.index] = a.et;
            ff.e_phi[a.index] = a.ep;
            seen[a.freq][a.index] = 2;
        }
    }

    // Poles: a single sample at theta = 0 or 180 stands for the whole ring. The field there has
    // no z part; its Cartesian vector is turned onto the theta/phi basis of every other phi.
    bool lone_pole_without_phase = false;
    if (n_phi > 1 && s.content == FieldContent::magnitude_only) {
        for (int it : {0, s.grid.theta.count - 1}) {
            const double th = s.grid.theta.value_deg(it);
            if (!(th == 0 || th == 180)) continue;
            for (std::size_t fk = 0; fk < s.frequencies.size(); ++fk) {
                int count = 0;
                for (int ip = 0; ip < n_phi; ++ip) count += seen[fk][s.grid.index(it, ip)] != 0;
                if (count == 1) lone_pole_without_phase = true;
            }
        }
    }
    if (n_phi > 1 && s.content != FieldContent::magnitude_only) {
        for (int it : {0, s.grid.theta.count - 1}) {
            const double th = s.grid.theta.value_deg(it);
            if (!(th == 0 || th == 180)) continue;
            for (std::size_t fk = 0; fk < s.frequencies.size(); ++fk) {
                int count = 0, at = -1;
                for (int ip = 0; ip < n_phi; ++ip)
                    if (seen[fk][s.grid.index(it, ip)]) ++count, at = ip;
                if (count != 1) continue;
                FarField& ff = s.frequencies[fk];
                const std::size_t k0 = s.grid.index(it, at);
                const double p0r = s.grid.phi.value_deg(at) * deg, tr = th * deg;
                if (s.content == FieldContent::total_only) {
                    for (int ip = 0; ip < n_phi; ++ip) {
                        ff.e_theta[s.grid.index(it, ip)] = ff.e_theta[k0];
                        ff.e_phi[s.grid.index(it, ip)] = 0;
                        seen[fk][s.grid.index(it, ip)] = 2;
                    }
                    continue;
                }
                const CVec3 e = ff.e_theta[k0] * theta_hat(tr, p0r) + ff.e_phi[k0] * phi_hat(p0r);
                for (int ip = 0; ip < n_phi; ++ip) {
                    const std::size_t k = s.grid.index(it, ip);
                    const double pr = s.grid.phi.value_deg(ip) * deg;
                    ff.e_theta[k] = dot(e, theta_hat(tr, pr));
                    ff.e_phi[k] = dot(e, phi_hat(pr));
                    seen[fk][k] = 2;
                }
            }
        }
    }

    // Every point present?
    std::size_t missing = 0;
    std::string first_missing;
    for (std::size_t fk = 0; fk < s.frequencies.size(); ++fk)
        for (std::size_t k = 0; k < points; ++k)
            if (!seen[fk][k]) {
                if (++missing <= 5) {
                    const int it = int(k / std::size_t(n_phi)), ip = int(k % std::size_t(n_phi));
                    first_missing += (missing > 1 ? "; " : "") + std::string("theta ") + fmt(s.grid.theta.value_deg(it)) +
                                     ", phi " + fmt(wrap360(s.grid.phi.value_deg(ip))) + " deg, " +
                                     (L.frequency_column || L.frequency_hz ? freq_text(ctx.freqs[fk]) : "no frequency");
                }
            }
    if (missing > 0) {
        char head[256];
        std::snprintf(head, sizeof head,
                      "expected a value at every grid point (theta %s..%s step %s, phi %s step %s x %d, %zu "
                      "frequencies), found %zu missing: ",
                      fmt(s.grid.theta.start_deg).c_str(), fmt(s.grid.theta.last_deg()).c_str(),
                      fmt(s.grid.theta.step_deg).c_str(), fmt(s.grid.phi.start_deg).c_str(),
                      fmt(s.grid.phi.step_deg).c_str(), n_phi, s.frequencies.size(), missing);
        return Error{name, 0, 0,
                     head + first_missing + (missing > 5 ? "; ..." : "") +
                         (lone_pole_without_phase ? " (one sample at a pole stands for its whole ring only with phase: "
                                                    "magnitude-only data must give every phi there)"
                                                  : "")};
    }
    if (o.progress) o.progress(1.0);
    return s;
}

Result<FarFieldSet> read_far_field_csv(const std::string& path, const CsvReadOptions& o) {
    // Before mapping: a first guess from the size. The arrays take about half the file's size
    // for the usual layouts (32 bytes per point, 60-90 bytes per row); a file more than four
    // times the available memory cannot fit whatever its layout. The exact check follows pass 1.
    struct stat st {};
    if (::stat(path.c_str(), &st) == 0 && S_ISREG(st.st_mode)) {
        const std::size_t limit = o.memory_limit_bytes ? o.memory_limit_bytes : available_memory_bytes();
        if (limit > 0 && std::size_t(st.st_size) / 4 > limit)
            return Error{path, 0, 0, "expected a file that fits in memory: it holds " + fmt(double(st.st_size) / 1e6) +
                                         " MB, " + fmt(double(limit) / 1e6) + " MB are available"};
    }
    auto m = MappedFile::open(path);
    if (!m) return m.error();
    return parse_far_field_text(m->text(), path, o, &*m);
}

}  // namespace ellipsa
