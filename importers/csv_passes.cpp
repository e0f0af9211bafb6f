// The two passes of the CSV reader over the data rows (csv_passes.hpp). The hot loops: a row
// walk that finds line ends (and NUL bytes in pass 1) 64 bytes at a time, angle and frequency
// cells parsed once per distinct text through a small cache (the text that followed the row
// before's last time is found again by one compare), every other cell parsed straight into its
// final place. A row followed by its line end and 16 readable bytes (all but a window's last) is
// read without bounds checks (fast_decimal_at<true>). DEVELOPERS.md ("Measured") says what was
// tried here and what it cost: small changes to the one pass's code moved its time by 5-15 %
// either way, so measure each in the real build.
#include "importers/csv_passes.hpp"

#include <cmath>
#include <type_traits>
#if defined(__SSE2__)
#include <emmintrin.h>
#endif

#include "importers/csv_number.hpp"
#include "importers/text.hpp"
#include "pattern/polarisation.hpp"

namespace ellipsa::csv {

namespace {

constexpr double angle_tol_deg = 1e-6;  // range checks
constexpr double max_field = 1e150;     // |field| above this is refused (its square must stay finite)
constexpr double max_db = 3000;         // dB above this is refused
constexpr double zero_db = -3000;       // dB at or below this (and -inf) is zero field

// ---- The row walk ----

// The line ends (and, when Nul, the NUL bytes) of a window, found 64 bytes at a time as a bit
// mask and handed out in order: one scan per 64 bytes instead of a 16-byte loop per line, whose
// exit depended on the line's length (about 1 % of a read of the bench file).
template <bool Nul>
struct LineEnds {
    const char* block;  // the 64 bytes the mask describes start here
    const char* end;
    std::uint64_t mask;
    LineEnds(const char* p, const char* e) : block(p), end(e), mask(scan(p, e)) {}
    static std::uint64_t scan(const char* p, const char* e) {
        std::uint64_t m = 0;
#if defined(__SSE2__)
        if (e - p >= 64) {
            const __m128i nl = _mm_set1_epi8('\n'), zero = _mm_setzero_si128();
            for (int i = 0; i < 4; ++i) {
                const __m128i v = _mm_loadu_si128(reinterpret_cast<const __m128i*>(p + 16 * i));
                __m128i hit = _mm_cmpeq_epi8(v, nl);
                if (Nul) hit = _mm_or_si128(hit, _mm_cmpeq_epi8(v, zero));
                m |= std::uint64_t(unsigned(_mm_movemask_epi8(hit))) << (16 * i);
            }
            return m;
        }
#endif
        const std::size_t n = std::size_t(std::min<std::ptrdiff_t>(64, e - p));
        for (std::size_t i = 0; i < n; ++i)
            if (p[i] == '\n' || (Nul && p[i] == 0)) m |= std::uint64_t(1) << i;
        return m;
    }
    // The next line end (or NUL) after the one returned before, or end.
    [[gnu::always_inline]] const char* next() {
        while (mask == 0) {
            block += 64;
            if (block >= end) return end;
            mask = scan(block, end);
        }
        const char* at = block + __builtin_ctzll(mask);
        mask &= mask - 1;
        return at;
    }
};

// A '#' line after the header: a comment, unless it holds a metadata key (refused: it would
// otherwise be ignored silently). Returns false with the failure set.
bool comment_after_header(Chunk& c, const char* line, const char* hash, const char* e, std::size_t line_offset) {
    const char* colon = static_cast<const char*>(std::memchr(hash, ':', std::size_t(e - hash)));
    if (!colon) return true;
    const std::string key = text::normalise_name(std::string_view(hash + 1, std::size_t(colon - hash - 1)));
    if (metadata_key(key) < 0) return true;
    c.failure = {true, line_offset, long(hash - line) + 1,
                 "expected metadata lines before the header row, found \"# " + key + ":\" after it"};
    return false;
}

// Progress, cancelling, once every 4096 rows.
void every_4096_rows(Context& ctx, const Chunk& c, std::size_t done, double progress_base, double progress_span) {
    if (progress_span > 0 && ctx.options->progress) {
        const double f = double(done - c.begin) / double(std::max<std::size_t>(1, c.end - c.begin));
        if (!ctx.options->progress(progress_base + progress_span * f)) ctx.cancelled = true;
    }
}

// Walk the lines of [c.begin, c.end), calling row(line_begin, line_end, line_offset, padded) for
// each data row; padded when the byte at line_end is a line end and the 16 bytes from it may be
// read (fast_decimal_at<true>). Blank lines and '#' lines are skipped (metadata keys after the header are refused
// in pass 1, which also refuses NUL bytes).
template <bool first_pass, class Row>
[[gnu::always_inline]] inline void for_each_row(Context& ctx, Chunk& c, double progress_base,
                                                double progress_span, Row&& row) {
    const char delim = ctx.L->delimiter;
    std::size_t n = 0;
    std::vector<char> buffer;
    for_each_window(*ctx.source, c.begin, c.end, buffer, c.failure, [&](std::string_view w, std::size_t at)
                                                                        __attribute__((always_inline)) {
        const char* const base = w.data();
        const char* p = base;
        const char* const end = base + w.size();
        LineEnds<first_pass> ends(p, end);
        while (p < end) {
            const char* nl = ends.next();
            if (first_pass) {
                // Binary garbage: text never holds a NUL byte. One scan finds the line end and
                // any NUL before it, while the bytes are being parsed anyway.
                if (nl < end && *nl == 0) {
                    c.failure = {true, at + std::size_t(p - base), long(nl - p) + 1,
                                 "expected text, found a NUL byte (a binary file?)"};
                    return false;
                }
            }
            const char* e = nl;  // the line end, or the window's end
            const char* next = nl < end ? nl + 1 : end;
            if (e > p && e[-1] == '\r') --e;
            const char* q = p;
            while (q < e && (*q == ' ' || *q == '\t' || *q == delim)) ++q;
            if (q < e && *q == '#') {
                if (first_pass && !comment_after_header(c, p, q, e, at + std::size_t(p - base))) return false;
            } else if (q < e) {
                // Padded: the line ends in '\n' with at least 16 bytes of the window after it.
                if (!row(p, e, at + std::size_t(p - base), end - nl >= 16)) return false;
                if ((++n & 4095) == 0) {
                    if (ctx.cancelled.load(std::memory_order_relaxed) || ctx.stop.load(std::memory_order_relaxed)) return false;
                    every_4096_rows(ctx, c, at + std::size_t(p - base), progress_base, progress_span);
                }
            }
            p = next;
        }
        return true;
    });
}

// ---- Cells ----

inline void fail_cell(Chunk& c, std::size_t line_offset, const char* line, const char* cell, std::string msg) {
    c.failure = {true, line_offset, long(cell - line) + 1, std::move(msg)};
}

// Why a number cell was refused: not a number (or empty), or beyond the double range.
std::string number_problem(const Layout& L, int role, NumberStatus st, const char* cell, const char* e, char delim) {
    const char* ce = static_cast<const char*>(std::memchr(cell, delim, std::size_t(e - cell)));
    if (!ce) ce = e;
    const std::string_view t(cell, std::size_t(ce - cell));
    const std::string what = "expected a number in column " + column_label(L, role) + ", found ";
    if (st == NumberStatus::overflow) return what + text::quote_found(text::trim(t)) + ", beyond the range of numbers (about 1.8e308)";
    return what + (t.empty() ? std::string("an empty cell") : text::quote_found(t));
}

// The number cell at q of role r, scaled and offset; moves q to the delimiter or e. False, with
// the chunk's failure set, when it is not a number or overflows.
[[gnu::always_inline]] inline bool number_cell(const Layout& L, int r, const char*& q, const char* e, const char* line,
                                               std::size_t line_offset, Chunk& c, double& x) {
    NumberStatus st;
    const char* cell = q;
    q = parse_number_cell(q, e, L.delimiter, L.decimal_comma, x, st);
    if (st != NumberStatus::ok) {
        fail_cell(c, line_offset, line, cell, number_problem(L, r, st, cell, e, L.delimiter));
        return false;
    }
    if (L.transform) x = x * L.scale[std::size_t(r)] + L.offset[std::size_t(r)];
    return true;
}

// Past the delimiter after cell k (false, with a failure, when the row ends early).
[[gnu::always_inline]] inline bool next_cell(Chunk& c, std::size_t line_offset, const char* line, const char* e, const char*& q, int k, int ncells) {
    if (k < ncells - 1) {
        if (q >= e) {
            fail_cell(c, line_offset, line, q,
                      "expected " + std::to_string(ncells) + " cells as in the header row, found " + std::to_string(k + 1));
            return false;
        }
        ++q;
    }
    return true;
}

// ---- Angle and frequency cells, parsed once per distinct text ----

// Angle and frequency cells repeat a few distinct texts over and over ("0", "90", "2.45e9").
// Their raw bytes (up to 16, zero-padded: text holds no NUL) are a key into a small
// direct-mapped cache per role, so each distinct text is parsed and checked once per thread.
struct CellKey {
    std::uint64_t a = 0, b = 0;
    bool operator==(const CellKey& o) const { return a == o.a && b == o.b; }
};

// Key of the cell at p (up to the delimiter or e); false when it is empty, longer than 16 or NUL.
[[gnu::always_inline]] inline bool key_cell(const char* p, const char* e, char delim, CellKey& k, const char*& cell_end) {
    std::size_t n;
#if defined(__SSE2__)
    if (e - p >= 17) {
        // The delimiter among the next 16 bytes in one compare (the 17th tells 16 from longer).
        const __m128i v = _mm_loadu_si128(reinterpret_cast<const __m128i*>(p));
        const unsigned m = unsigned(_mm_movemask_epi8(_mm_cmpeq_epi8(v, _mm_set1_epi8(delim))));
        n = m ? std::size_t(__builtin_ctz(m)) : p[16] == delim ? 16 : 17;
    } else
#endif
    {
        const char* q = p;
        const char* lim = e - p > 17 ? p + 17 : e;
        while (q < lim && *q != delim) ++q;
        n = std::size_t(q - p);
    }
    if (n == 0 || n > 16) return false;
    const char* q = p + n;
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
    return k.a != 0;  // all NUL bytes (a file changed under the reader) would read as an empty slot
}


// What an angle or frequency cell means once parsed: the value (deg, Hz) and, in pass 2, its
// grid index (theta row, phi column, frequency) and whether it is the phi seam duplicate.
struct AngleInfo {
    double value = 0;
    std::int32_t index = 0;
    bool alias = false;
};

// One direct-mapped cache per role, sized so that the distinct texts of a fine grid rarely
// collide: a 0.25-degree grid has 1440 phi texts (a 256-slot cache missed on about half of
// the phi cells of a 1-degree grid, and each miss parses, checks and places the value again).
struct AngleCache {
    struct Entry {  // 32 bytes, two to a cache line; an all-zero key is an empty slot
        CellKey key;
        AngleInfo info;
    };
    static_assert(sizeof(Entry) == 32);
    // A text met in this column with its delimiter (up to 15 bytes and the delimiter,
    // zero-padded; a zero mask when there is none), its meaning and its slot.
    struct Known {
        alignas(16) char text[16] = {};
        unsigned mask = 0;
        std::uint32_t size = 0;
        AngleInfo info;
        std::size_t slot = 0;
        // True, with q moved past the text, when the cell at q holds it.
        template <bool Padded>
        [[gnu::always_inline]] bool found_at(const char*& q, const char* e) const {
#if defined(__SSE2__)
            if (mask == 0 || (!Padded && e - q < 16)) return false;
            const __m128i v = _mm_loadu_si128(reinterpret_cast<const __m128i*>(q));
            const unsigned m = unsigned(_mm_movemask_epi8(_mm_cmpeq_epi8(v, _mm_load_si128(reinterpret_cast<const __m128i*>(text)))));
            if ((m & mask) != mask) return false;
            q += size;
            return true;
#else
            (void)q;
            (void)e;
            return false;
#endif
        }
    };
    std::vector<Entry> slots;
    // The text that followed each slot's text the last time (a phi column steps through its
    // values in the same order row after row; theta and frequency repeat theirs), so the cell
    // is usually found by one 16-byte compare, without its key and slot.
    std::vector<Known> next;
    int shift = 56;
    // This column's text in the row before (null when unknown or longer than 15 bytes): an
    // entry of `next` or `first`, pointed at rather than copied (three columns a row).
    const Known* last = nullptr;
    Known first;  // the text met when no text came before it
    void remember(const CellKey& k, std::size_t n, char delim, const AngleInfo& info, std::size_t at) {
        if (n > 15) {
            last = nullptr;
            return;
        }
        Known t;
        std::memcpy(t.text, &k.a, 8);
        std::memcpy(t.text + 8, &k.b, 8);
        t.text[n] = delim;
        t.mask = (2u << n) - 1;
        t.size = std::uint32_t(n);
        t.info = info;
        t.slot = at;
        Known& to = last ? next[last->slot] : first;
        to = t;
        last = &to;
    }
    // The cell at q is the one that followed the row before's text last time, or that text
    // again: true, with q moved past it and `last` set.
    template <bool Padded>
    [[gnu::always_inline]] bool as_expected(const char*& q, const char* e) {
        if (!last) return false;
        Known& x = next[last->slot];
        if (x.found_at<Padded>(q, e)) {
            last = &x;
            return true;
        }
        if (!last->found_at<Padded>(q, e)) return false;
        x = *last;
        last = &x;
        return true;
    }
    explicit AngleCache(int bits) : slots(std::size_t(1) << bits), next(std::size_t(1) << bits), shift(64 - bits) {}
    AngleCache(const AngleCache&) = delete;  // `last` may point at `first`
    AngleCache& operator=(const AngleCache&) = delete;
    std::size_t slot(const CellKey& k) const {
        return std::size_t(((k.a * 0x9E3779B97F4A7C15ull) ^ (k.b * 0xC2B2AE3D27D4EB4Full)) >> shift);
    }
    // The slot that holds key k (found), or where to put it: the first empty one of the four
    // from its own slot on, else its own slot. Mapped to one slot only, two of the 360 phi texts
    // of a 1-degree grid shared one here and there and evicted each other: about 7 % of the
    // rows of the bench file parsed and placed their phi again.
    std::size_t place(const CellKey& k, bool& found) const {
        const std::size_t home = slot(k), wrap = slots.size() - 1;
        for (std::size_t i = 0; i < 4; ++i) {
            const std::size_t s = (home + i) & wrap;
            found = slots[s].key == k;
            if (found || slots[s].key.a == 0) return s;  // an all-zero key is an empty slot
        }
        return home;
    }
};

// Caches for theta, phi and frequency texts (angle_slot order).
struct AngleCaches {
    AngleCache by_slot[3] = {AngleCache(11), AngleCache(12), AngleCache(8)};
    AngleCache& operator[](int slot) { return by_slot[slot]; }
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

// Convert and check one angle/frequency value (after scale/offset); empty message when fine.
// Theta may run from -180 (the opposite half-plane), phi and azimuth over any window within
// [-360, 720]; the grid stage turns such layouts into the stored grid (csv_directions.hpp).
std::string angle_value(const Layout& L, int role, double raw, double& out) {
    using text::number;
    const bool positioner = L.angles == AngleSystem::az_over_el || L.angles == AngleSystem::el_over_az;
    switch (role) {
        case c_theta: {
            const double t = raw * L.angle_to_deg;
            if (!(t >= -180 - angle_tol_deg && t <= 180 + angle_tol_deg)) return "expected theta in [-180, 180] deg, found " + number(t);
            out = std::clamp(t, -180.0, 180.0);
            return {};
        }
        case c_elevation: {
            const double el = raw * L.angle_to_deg;
            if (positioner) {
                if (!(el >= -360 - angle_tol_deg && el <= 720 + angle_tol_deg))
                    return "expected elevation in [-360, 720] deg, found " + number(el);
                out = el;
                return {};
            }
            if (!(el >= -90 - angle_tol_deg && el <= 90 + angle_tol_deg))
                return "expected elevation in [-90, 90] deg, found " + number(el);
            out = std::clamp(90.0 - el, 0.0, 180.0);
            return {};
        }
        case c_phi:
        case c_azimuth: {
            const double ph = raw * L.angle_to_deg;
            if (!(ph >= -360 - angle_tol_deg && ph <= 720 + angle_tol_deg))
                return std::string("expected ") + (role == c_phi ? "phi" : "azimuth") + " in [-360, 720] deg, found " +
                       number(ph);
            out = ph;
            return {};
        }
        default: {
            const double f = raw * L.hz_per_unit;
            if (std::isfinite(raw) && !std::isfinite(f))
                return "expected a frequency within the range of numbers (about 1.8e308 Hz), found " + number(raw) +
                       " times " + number(L.hz_per_unit) + " Hz, which overflows";
            if (!(f >= 0) || !std::isfinite(f)) return "expected a frequency >= 0, found " + number(raw);
            out = f;
            return {};
        }
    }
}

// The angle or frequency cell at q (role r): from the cache when the same text was met before,
// else parsed, scaled, checked and handed to fresh(value, info), which fills the cache entry
// (false: the value is refused with `refusal`). Moves q to the delimiter or e. Returns the
// cell's meaning, or null with the chunk's failure set.
template <bool Padded = false, class Fresh>
[[gnu::always_inline]] inline const AngleInfo* angle_cell(const Layout& L, AngleCache& cache, int r, const char*& q,
                                                          const char* e, const char* line, std::size_t line_offset,
                                                          Chunk& c, AngleInfo& scratch, const char* refusal,
                                                          Fresh&& fresh) {
    if (cache.as_expected<Padded>(q, e)) return &cache.last->info;
    CellKey key;
    const char* ce = nullptr;
    const bool keyed = key_cell(q, e, L.delimiter, key, ce);
    bool cached = false;
    const std::size_t at = keyed ? cache.place(key, cached) : 0;
    AngleCache::Entry& slot = cache.slots[at];
    if (cached) {
        cache.remember(key, std::size_t(ce - q), L.delimiter, slot.info, at);
        q = ce;
        return &slot.info;
    }
    double x;
    const char* cell = q;
    if (!number_cell(L, r, q, e, line, line_offset, c, x)) return nullptr;
    double y;
    std::string msg = angle_value(L, r, x, y);
    if (!msg.empty()) {
        fail_cell(c, line_offset, line, cell, std::move(msg));
        return nullptr;
    }
    AngleInfo& a = keyed ? slot.info : scratch;
    a.value = y;
    if (!fresh(y, a)) {
        fail_cell(c, line_offset, line, cell, refusal);
        return nullptr;
    }
    if (keyed) {
        slot.key = key;
        cache.remember(key, std::size_t(ce - cell), L.delimiter, a, at);
    }
    return &a;
}

// ---- Pass 2: the grid place of a value, the field of a row, the store ----

// Grid place of a parsed angle/frequency value; false when it is not on the first pass's grid.
inline bool place_on_grid(const GridPlan& g, int slot, double x, AngleInfo& a) {
    if (slot == 0) {
        const double d = (x - g.theta0) / g.theta_step;
        const long it = d > -0.5 && d < 2e9 ? long(d + 0.5) : -1;
        a.index = std::int32_t(it);
        return it >= 0 && it < g.grid.theta.count;
    }
    if (slot == 1) {
        const double d = (x - g.phi0) / g.phi_step;
        long ip = d > -0.5 ? long(d + 0.5) : -1;
        if (ip < 0 || ip >= g.n_phi_distinct) return false;
        a.alias = g.phi_seam && ip == g.n_phi_distinct - 1;
        if (a.alias) ip = 0;
        a.index = std::int32_t((ip + g.phi_shift) % g.grid.phi.count);
        return true;
    }
    auto it = std::lower_bound(g.freqs.begin(), g.freqs.end(), x * (1 - 1e-9));
    a.index = std::int32_t(it - g.freqs.begin());
    return std::size_t(a.index) < g.freqs.size() && std::abs(g.freqs[std::size_t(a.index)] - x) <= 1e-9 * std::max(1.0, x);
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

// A field cell whose value is refused: its role and what was expected there.
struct FieldProblem {
    int role = -1;
    const char* expected = nullptr;
};

// Amplitude and phase columns of a family to complex E_theta, E_phi (conventions.md).
FieldProblem polar_field(const Layout& L, const double* v, double phi_deg, cplx& et, cplx& ep) {
    const bool tp = L.family == CsvFamily::theta_phi_polar, circ = L.family == CsvFamily::circular_polar;
    const int r1 = tp ? c_e_theta_db : circ ? c_e_rhcp_db : c_e_co_db;
    const int p1 = tp ? c_e_theta_phase : circ ? c_e_rhcp_phase : c_e_co_phase;
    const int r2 = tp ? c_e_phi_db : circ ? c_e_lhcp_db : c_e_cross_db;
    const int p2 = tp ? c_e_phi_phase : circ ? c_e_lhcp_phase : c_e_cross_phase;
    double a, b;
    if (!db_amplitude(v[r1], a)) return {r1, "a dB value below 3000"};
    if (!db_amplitude(v[r2], b)) return {r2, "a dB value below 3000"};
    for (int r : {p1, p2})
        if (!std::isfinite(v[r])) return {r, "a finite phase"};
    const double sign = L.minus_iwt ? -1 : 1;
    const cplx c1 = std::polar(a, sign * v[p1] * L.phase_to_rad), c2 = std::polar(b, sign * v[p2] * L.phase_to_rad);
    if (tp) {
        et = c1;
        ep = c2;
    } else if (circ) {
        // Inverse of E_R = (Et + j Ep)/sqrt2, E_L = (Et - j Ep)/sqrt2 (conventions.md):
        // Et = (E_R + E_L)/sqrt2, Ep = (E_R - E_L)/(j sqrt2) = -j (E_R - E_L)/sqrt2.
        et = (c1 + c2) * inv_sqrt2;
        ep = cplx(0, -1) * (c1 - c2) * inv_sqrt2;
    } else {
        const double pr = phi_deg * deg;
        from_ludwig3(c1, c2, std::cos(pr), std::sin(pr), *L.ludwig3_reference, et, ep);
    }
    return {};
}

// E_theta, E_phi of one row from its field cells (v by role) and its phi.
[[gnu::always_inline]] inline FieldProblem row_field(const Layout& L, const double* v, double phi_deg, cplx& et, cplx& ep) {
    switch (L.family) {
        case CsvFamily::complex:
            for (int r : {c_e_theta_re, c_e_theta_im, c_e_phi_re, c_e_phi_im})
                if (!(std::abs(v[r]) <= max_field)) return {r, "a finite field value below 1e150 in magnitude"};
            et = cplx(v[c_e_theta_re], L.minus_iwt ? -v[c_e_theta_im] : v[c_e_theta_im]);
            ep = cplx(v[c_e_phi_re], L.minus_iwt ? -v[c_e_phi_im] : v[c_e_phi_im]);
            return {};
        case CsvFamily::total_db: {
            double a;
            if (!db_amplitude(v[c_e_total_db], a)) return {c_e_total_db, "a dB value below 3000"};
            et = a;
            ep = 0;
            return {};
        }
        case CsvFamily::magnitude_db: {
            double a, b;
            if (!db_amplitude(v[c_e_theta_db], a)) return {c_e_theta_db, "a dB value below 3000"};
            if (!db_amplitude(v[c_e_phi_db], b)) return {c_e_phi_db, "a dB value below 3000"};
            et = a;
            ep = b;
            return {};
        }
        default: return polar_field(L, v, phi_deg, et, ep);
    }
}

// Where pass 2 writes each frequency's points, taken from the context once per pass: read
// through the context's vectors, the pointers were loaded again on every row (the byte store
// of `seen` may alias anything).
struct Targets {
    struct Frequency {
        cplx* e_theta;
        cplx* e_phi;
        unsigned char* seen;  // 0 absent, 1 being written, 2 present
        std::size_t* line;    // the line offset of each point's row (Context::lines), or null
    };
    std::vector<Frequency> by_frequency;
    bool concurrent;
    double tolerance;
    explicit Targets(const Context& ctx) : concurrent(ctx.concurrent), tolerance(ctx.L->duplicate_tolerance) {
        for (std::size_t fk = 0; fk < ctx.out->size(); ++fk)
            by_frequency.push_back({(*ctx.out)[fk].e_theta.data(), (*ctx.out)[fk].e_phi.data(), (*ctx.seen)[fk].data(),
                                    ctx.lines ? (*ctx.lines)[fk].data() : nullptr});
    }
};

// Write one point into the arrays; a second row for a point must agree with the first
// (same_direction_values, csv_passes.hpp). With several workers, the seen byte is the
// lock: 0 absent, 1 being written, 2 present.
[[gnu::always_inline]] inline bool store_point(const Targets& t, Chunk& c, std::size_t fk, std::size_t k, cplx et, cplx ep,
                                               std::size_t line_offset, const AngleInfo* const ang[3]) {
    const Targets::Frequency& f = t.by_frequency[fk];
    unsigned char& seen = f.seen[k];
    if (!t.concurrent) {
        if (seen == 0) {
            f.e_theta[k] = et;
            f.e_phi[k] = ep;
            if (f.line) f.line[k] = line_offset;
            seen = 2;
            return true;
        }
    } else {
        std::atomic_ref<unsigned char> s(seen);
        unsigned char expected = 0;
        if (s.compare_exchange_strong(expected, 1, std::memory_order_acq_rel)) {
            f.e_theta[k] = et;
            f.e_phi[k] = ep;
            if (f.line) f.line[k] = line_offset;
            s.store(2, std::memory_order_release);
            return true;
        }
        // A second row for the same point: wait for the first writer, then compare.
        while (s.load(std::memory_order_acquire) != 2) std::this_thread::yield();
    }
    if (same_direction_values(f.e_theta[k], f.e_phi[k], et, ep, t.tolerance)) return true;
    c.failure = {true, line_offset, 1,
                 "expected at most one value per grid point, found a second one that differs (theta " +
                     text::number(ang[0]->value) + ", phi " + text::number(ang[1]->value) + " deg, " +
                     format_frequency(ang[2]->value) + ")"};
    return false;
}

// The start of cell k of a row read up to its end (every cell of it ended at a delimiter: none
// holds one), for messages.
const char* cell_start(const char* p, const char* e, char delim, int k) {
    for (; k > 0 && p < e; ++p) k -= *p == delim;
    return p;
}

// Only empty cells may follow the last one the header names.
bool rest_is_empty(Chunk& c, const Layout& L, const char* line, const char* q, const char* e, std::size_t line_offset) {
    const char* t = q;
    while (t < e && (*t == ' ' || *t == '\t' || *t == L.delimiter)) ++t;
    if (t == e) return true;
    int extra = 0;
    for (const char* s = q; s < e; ++s) extra += *s == L.delimiter;
    fail_cell(c, line_offset, line, q,
              "expected " + std::to_string(L.cells) + " cells as in the header row, found " + std::to_string(L.cells + extra));
    return false;
}

constexpr const char* changed_message =
    "expected the file to stay as it was while it is read, found a value the first reading did not see "
    "(is it still being written? read it again once it is complete)";

}  // namespace

namespace {

// Pass 1 over [c.begin, c.end) with the caches given.
void pass1_rows(Context& ctx, Chunk& c, bool report_progress, AngleCaches& cache) {
    const Layout& L = *ctx.L;
    AngleInfo scratch;
    DistinctValues* sets[3] = {&c.theta, &c.phi, &c.freq};
    const int upto = L.last_angle_cell;
    for_each_row<true>(ctx, c, 0.0, report_progress ? 0.35 : 0.0, [&](const char* p, const char* e, std::size_t off, bool) __attribute__((always_inline)) {
        const char* q = p;
        for (int k = 0; k <= upto; ++k) {
            const int r = L.role[std::size_t(k)];
            const int slot = angle_slot(r);
            if (slot < 0) {
                const char* ce = static_cast<const char*>(std::memchr(q, L.delimiter, std::size_t(e - q)));
                q = ce ? ce : e;
            } else if (!angle_cell(L, cache[slot], r, q, e, p, off, c, scratch, "", [&](double x, AngleInfo&) {
                           sets[slot]->add(x, off);
                           return true;
                       })) {
                return false;
            }
            if (!next_cell(c, off, p, e, q, k, L.cells)) return false;
        }
        ++c.rows;
        return true;
    });
}

}  // namespace

void pass1(Context& ctx, Chunk& c, bool report_progress) {
    const Layout& L = *ctx.L;
    AngleCaches cache;
    if (!L.frequency_column) c.freq.add(L.frequency_hz ? *L.frequency_hz : 0.0, c.begin);
    pass1_rows(ctx, c, report_progress, cache);
}

void pass1_ranges(Context& ctx, Chunk& c, const std::vector<std::pair<std::size_t, std::size_t>>& ranges) {
    const Layout& L = *ctx.L;
    AngleCaches cache;
    if (!L.frequency_column) c.freq.add(L.frequency_hz ? *L.frequency_hz : 0.0, ranges.empty() ? 0 : ranges[0].first);
    for (const auto& [b, e] : ranges) {
        c.begin = b;
        c.end = e;
        pass1_rows(ctx, c, false, cache);
        if (c.failure.set) return;
    }
}

namespace {

// Pass 2, or (Collect) the single pass on a guessed plan: it also does pass 1's work (NUL bytes,
// metadata after the header, the distinct values, the row count) so that the plan can be
// confirmed from what it saw.
template <bool Collect>
void pass2_impl(Context& ctx, Chunk& c, bool report_progress) {
    const Layout& L = *ctx.L;
    const GridPlan& g = *ctx.plan;
    const int ncells = L.cells;
    AngleCaches cache;
    const Targets targets(ctx);
    // Each cell's role and, for an angle or frequency, its cache (angle_slot), worked out once.
    struct Column {
        int role, slot;
    };
    std::vector<Column> columns(std::size_t(ncells) + 1);
    for (int k = 0; k < ncells; ++k) {
        const int r = L.role[std::size_t(k)];
        columns[std::size_t(k)] = {r, r < 0 ? -1 : angle_slot(r)};
    }
    // Columns a file lacks (the other component of one polarisation part) read as zero field.
    double v[c_count];
    for (int r = 0; r < c_count; ++r) v[r] = is_db_role(r) ? -HUGE_VAL : 0.0;
    AngleInfo fixed_f;  // without a frequency column: the one frequency
    fixed_f.value = g.freqs.empty() ? 0.0 : g.freqs[0];
    DistinctValues* sets[3] = {&c.theta, &c.phi, &c.freq};
    if (Collect && !L.frequency_column) c.freq.add(L.frequency_hz ? *L.frequency_hz : 0.0, c.begin);
    const double progress_base = Collect ? 0.0 : 0.35;
    // Kept in registers: read through L, they were loaded again after every byte store.
    const char delim = L.delimiter;
    const bool decimal_comma = L.decimal_comma, transform = L.transform;
    // One row; Padded as for_each_row says (bounds checks left out of the number and angle cells).
    const auto row = [&](auto padded, const char* p, const char* e, std::size_t off) __attribute__((always_inline)) {
        constexpr bool Padded = decltype(padded)::value;
        const AngleInfo* ang[3] = {nullptr, nullptr, L.frequency_column ? nullptr : &fixed_f};
        AngleInfo fresh[3];
        const char* q = p;
        for (int k = 0; k < ncells; ++k) {
            const int r = columns[std::size_t(k)].role, slot = columns[std::size_t(k)].slot;
            if (r < 0) {
                const char* ce = static_cast<const char*>(std::memchr(q, delim, std::size_t(e - q)));
                q = ce ? ce : e;
            } else if (slot < 0) {
                double x;
                const char* fq = q;
                // The plain number (no spaces, quotes or '+') without parse_number_cell's checks
                // around it; anything else takes number_cell from the cell's start.
                if (fast_decimal_at<Padded>(fq, e, decimal_comma, x) && (fq == e || *fq == delim)) {
                    if (transform) x = x * L.scale[std::size_t(r)] + L.offset[std::size_t(r)];
                    q = fq;
                } else if (!number_cell(L, r, q, e, p, off, c, x)) {
                    return false;
                }
                v[r] = x;
            } else {
                ang[slot] = angle_cell<Padded>(L, cache[slot], r, q, e, p, off, c, fresh[slot], changed_message,
                                       [&](double x, AngleInfo& a) {
                                           if (Collect) sets[slot]->add(x, off);
                                           return place_on_grid(g, slot, x, a);
                                       });
                if (!ang[slot]) return false;
            }
            if (!next_cell(c, off, p, e, q, k, ncells)) return false;
        }
        if (q < e && !rest_is_empty(c, L, p, q, e, off)) return false;
        if (Collect) ++c.rows;
        cplx et, ep;
        if (const FieldProblem bad = row_field(L, v, ang[1]->value, et, ep); bad.expected) {
            fail_cell(c, off, p, cell_start(p, e, L.delimiter, L.column_of[std::size_t(bad.role)]),
                      std::string("expected ") + bad.expected + " in column " + column_label(L, bad.role));
            return false;
        }
        const std::size_t fk = std::size_t(ang[2]->index);
        const std::size_t k = std::size_t(ang[0]->index) * std::size_t(g.grid.phi.count) + std::size_t(ang[1]->index);
        if (ang[1]->alias) {
            c.aliases.push_back({fk, k, et, ep, off});
            return true;
        }
        return store_point(targets, c, fk, k, et, ep, off, ang);
    };
    for_each_row<Collect>(ctx, c, progress_base, report_progress ? 1.0 - progress_base : 0.0,
                          [&](const char* p, const char* e, std::size_t off, bool padded) __attribute__((always_inline)) {
                              return padded ? row(std::true_type{}, p, e, off) : row(std::false_type{}, p, e, off);
                          });
    if (Collect && c.failure.set) ctx.stop = true;
}

}  // namespace

void pass2(Context& ctx, Chunk& c, bool report_progress) { pass2_impl<false>(ctx, c, report_progress); }
void one_pass(Context& ctx, Chunk& c, bool report_progress) { pass2_impl<true>(ctx, c, report_progress); }

std::vector<std::pair<std::size_t, std::size_t>> sample_ranges(const TextSource& src, std::size_t begin) {
    const std::size_t size = src.size(), len = size - begin, n = std::min<std::size_t>(512, len >> 16);
    std::vector<char> buffer;
    auto line_start = [&](std::size_t at) {  // the first line start at or after `at`
        if (at <= begin) return begin;
        if (at >= size) return size;
        for (std::size_t want = 4096;; want = max_line_bytes + 1) {  // a short read first
            auto w = src.view(at - 1, want, buffer);
            const void* nl = w ? std::memchr(w->data(), '\n', w->size()) : nullptr;
            if (nl) return at + std::size_t(static_cast<const char*>(nl) - w->data());
            if (!w || want > max_line_bytes || w->size() < want) return size;
        }
    };
    std::vector<std::pair<std::size_t, std::size_t>> at = {{begin, begin + (256u << 10)}};
    for (std::size_t i = 1; i <= n; ++i) at.push_back({begin + len * i / (n + 1), begin + len * i / (n + 1) + 2048});
    at.push_back({size - std::min(len, std::size_t(256) << 10), size});
    for (auto& [b, e] : at) {
        b = line_start(b);
        e = std::max(b, line_start(e));
    }
    return at;
}

std::vector<Chunk> split(const TextSource& src, std::size_t begin, int n) {
    std::vector<Chunk> cs(std::size_t(std::max(1, n)));
    const std::size_t size = src.size(), len = size - std::min(begin, size);
    std::vector<char> buffer;
    std::size_t a = std::min(begin, size);
    for (std::size_t i = 0; i < cs.size(); ++i) {
        std::size_t b = i + 1 == cs.size() ? size : begin + len * (i + 1) / cs.size();
        if (b < a) b = a;
        if (b < size) {
            // The next line start; with no line end near, one chunk runs to the end (its walk
            // reports the long line, or the read error).
            auto w = src.view(b, max_line_bytes + 1, buffer);
            const void* nl = w ? std::memchr(w->data(), '\n', w->size()) : nullptr;
            b = nl ? b + std::size_t(static_cast<const char*>(nl) - w->data()) + 1 : size;
        }
        cs[i].begin = a;
        cs[i].end = b;
        a = b;
    }
    return cs;
}

const Failure* first_failure(const std::vector<Chunk>& cs) {
    const Failure* best = nullptr;
    for (const Chunk& c : cs)
        if (c.failure.set && (!best || (c.failure.io && !best->io) ||
                              (c.failure.io == best->io && c.failure.line_offset < best->line_offset)))
            best = &c.failure;
    return best;
}

}  // namespace ellipsa::csv
