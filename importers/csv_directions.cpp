// Angle layouts onto the stored grid (csv_directions.hpp).
#include "importers/csv_directions.hpp"

#include <algorithm>
#include <cmath>

#include "importers/text.hpp"
#include "pattern/positioner.hpp"

namespace ellipsa::csv {

namespace {

using text::number;

constexpr double fold_tol_deg = 1e-6;  // directions closer than this in an angle are one value

bool is_positioner(const Layout& L) { return L.angles == AngleSystem::az_over_el || L.angles == AngleSystem::el_over_az; }
PositionerGrid positioner_of(const Layout& L) {
    return L.angles == AngleSystem::az_over_el ? PositionerGrid::az_over_el : PositionerGrid::el_over_az;
}

// One sample of the table as written: its direction, the unit vectors its two field columns are
// given in (Cartesian field = E1 a + E2 b), and the sign that turns them onto theta-hat/phi-hat
// when that needs no projection (theta below 0: -1).
struct Sample {
    double theta_deg = 0, phi_deg = 0;  // the direction, phi in [0, 360)
    bool pole = false;
    Vec3 a, b;
    double sign = 1;
};

// The first angle column as written is raw.grid.theta (elevation for azimuth/elevation columns),
// the second raw.grid.phi (azimuth).
std::vector<Sample> samples_of(const Grid& raw, const Layout& L) {
    std::vector<Sample> out(raw.size());
    for (int i = 0; i < raw.theta.count; ++i)
        for (int j = 0; j < raw.phi.count; ++j) {
            Sample& s = out[raw.index(i, j)];
            const double t = raw.theta.value_deg(i), p = raw.phi.value_deg(j);
            if (!is_positioner(L)) {
                s.theta_deg = std::abs(t);
                s.phi_deg = wrap360(t < 0 ? p + 180 : p);
                s.sign = t < 0 ? -1 : 1;
                if (s.theta_deg <= fold_tol_deg || s.theta_deg >= 180 - fold_tol_deg) {  // only poles are turned
                    s.a = theta_hat(t * deg, p * deg);  // at negative theta: -theta-hat(|t|, p + 180)
                    s.b = phi_hat(p * deg);
                }
            } else {
                const PositionerFrame f = positioner_frame(positioner_of(L), p * deg, t * deg);
                const double rho = std::hypot(f.r.x, f.r.y);
                s.theta_deg = std::atan2(rho, f.r.z) / deg;
                s.phi_deg = rho > 0 ? wrap360(std::atan2(f.r.y, f.r.x) / deg) : 0;
                s.a = f.az_hat;
                s.b = f.el_hat;
            }
            if (std::abs(s.theta_deg) <= fold_tol_deg) s.theta_deg = 0;
            if (std::abs(s.theta_deg - 180) <= fold_tol_deg) s.theta_deg = 180;
            s.pole = s.theta_deg == 0 || s.theta_deg == 180;
            if (s.pole && is_positioner(L)) s.phi_deg = 0;
        }
    return out;
}

// Sorted distinct values (closer than fold_tol_deg folded), each with the first line holding it.
std::vector<Value> distinct(std::vector<Value> v) {
    std::sort(v.begin(), v.end(), [](const Value& x, const Value& y) { return x.v < y.v; });
    std::vector<Value> out;
    for (const Value& x : v) {
        if (!out.empty() && x.v - out.back().v <= fold_tol_deg) {
            out.back().line_offset = std::min(out.back().line_offset, x.line_offset);
            continue;
        }
        out.push_back(x);
    }
    return out;
}

// Phi values in [0, 360) as an axis: a full circle from its smallest value, or an arc that starts
// after the widest gap (so -30..30 is 330..390). Values above the start are unwrapped past 360.
std::vector<Value> phi_as_arc(std::vector<Value> pv) {
    if (pv.size() < 2) return pv;
    std::size_t after = 0;
    double widest = pv.front().v + 360 - pv.back().v;
    for (std::size_t k = 1; k < pv.size(); ++k)
        if (pv[k].v - pv[k - 1].v > widest * (1 + 1e-9)) widest = pv[k].v - pv[k - 1].v, after = k;
    std::rotate(pv.begin(), pv.begin() + std::ptrdiff_t(after), pv.end());
    for (std::size_t k = 1; k < pv.size(); ++k)
        if (pv[k].v < pv[0].v) pv[k].v += 360;
    return pv;
}

// The stored grid the directions fall on exactly, if they do: false (with `f`) when the theta or
// phi values are not evenly spaced.
bool exact_grid(const std::vector<Sample>& smp, const std::vector<std::size_t>& lines, Grid& g, Failure& f) {
    std::vector<Value> tv, pv;
    for (std::size_t k = 0; k < smp.size(); ++k) {
        tv.push_back({smp[k].theta_deg, lines[k]});
        if (!smp[k].pole) pv.push_back({smp[k].phi_deg, lines[k]});
    }
    if (pv.empty())  // only poles: their own phi
        for (std::size_t k = 0; k < smp.size(); ++k) pv.push_back({smp[k].phi_deg, lines[k]});
    tv = distinct(std::move(tv));
    pv = phi_as_arc(distinct(std::move(pv)));
    double t0, dt, p0 = 0, dp = 360;
    if (!regular_axis(tv, "theta", t0, dt, f)) return false;
    if (!pv.empty() && !regular_axis(pv, "phi", p0, dp, f)) return false;
    const int np = std::max<int>(1, int(pv.size()));
    if (np > 1 && std::abs(dp * np - 360) <= 1e-4 * dp) dp = 360.0 / np;
    g.theta = {t0, tv.size() == 1 ? 1.0 : dt, int(tv.size())};
    g.phi = {p0, np == 1 ? 1.0 : dp, np};
    // A grid much larger than the table would hold mostly missing points (positioner directions
    // that happen to be evenly spaced in theta and in phi but not on their product).
    return double(tv.size()) * np <= 4.0 * double(smp.size()) + 4096;
}

// The set being filled, with what each point holds so far.
struct Target {
    FarFieldSet* s;
    double tolerance;  // Layout::duplicate_tolerance
    SeenPoints seen;
    std::vector<std::vector<std::size_t>> line;
};

void allocate_target(FarFieldSet& s, Target& t) {
    t.s = &s;
    t.seen.assign(s.frequencies.size(), std::vector<unsigned char>(s.grid.size(), 0));
    t.line.assign(s.frequencies.size(), std::vector<std::size_t>(s.grid.size(), 0));
    for (FarField& ff : s.frequencies) {
        ff.e_theta.assign(s.grid.size(), cplx(0, 0));
        ff.e_phi.assign(s.grid.size(), cplx(0, 0));
    }
}

// The refusal of a direction given twice with fields that differ (the later row's line in `f`).
Failure differing_repeat(const TextSource& src, std::size_t line, std::size_t first_line, double theta_deg, double phi_deg,
                         double frequency_hz) {
    return {true, line, 1,
            "expected one field per direction, found two that differ: this row and line " +
                std::to_string(src.line_number_at(first_line)) + " both give theta " + number(theta_deg) + ", phi " +
                number(wrap360(phi_deg)) + " deg (" + format_frequency(frequency_hz) + ")"};
}

// Store one point, or check a second value for it (same_direction_values, csv_passes.hpp).
bool put(Target& t, std::size_t fk, std::size_t k, cplx et, cplx ep, std::size_t line, const TextSource& src, Failure& f) {
    FarField& ff = t.s->frequencies[fk];
    if (!t.seen[fk][k]) {
        ff.e_theta[k] = et;
        ff.e_phi[k] = ep;
        t.seen[fk][k] = 2;
        t.line[fk][k] = line;
        return true;
    }
    if (same_direction_values(ff.e_theta[k], ff.e_phi[k], et, ep, t.tolerance)) return true;
    const Grid& g = t.s->grid;
    const int it = int(k / std::size_t(g.phi.count)), ip = int(k % std::size_t(g.phi.count));
    f = differing_repeat(src, line, t.line[fk][k], g.theta.value_deg(it), g.phi.value_deg(ip), ff.frequency_hz);
    return false;
}

// Column of phi on the grid, or -1.
int phi_column(const Grid& g, double phi_deg) {
    if (g.phi.count == 1) return std::abs(wrap360(phi_deg - g.phi.start_deg + 180) - 180) <= 1e-6 ? 0 : -1;
    const double d = wrap360(phi_deg - g.phi.start_deg + g.phi.step_deg / 2) - g.phi.step_deg / 2;
    const long j = std::lround(d / g.phi.step_deg);
    return j >= 0 && j < g.phi.count && std::abs(d - double(j) * g.phi.step_deg) <= 1e-4 * g.phi.step_deg ? int(j) : -1;
}

// Place one sample of one frequency: a pole sample on its whole ring (turned), any other at its
// own point.
bool place_sample(Target& t, std::size_t fk, const Sample& s, cplx e1, cplx e2, std::size_t line, const Layout& L,
                  const TextSource& src, Failure& f) {
    const Grid& g = t.s->grid;
    const int it = int(std::lround((s.theta_deg - g.theta.start_deg) / g.theta.step_deg));
    const FieldContent content = t.s->content;
    const CVec3 e = e1 * s.a + e2 * s.b;
    if (s.pole && content != FieldContent::magnitude_only) {
        for (int ip = 0; ip < g.phi.count; ++ip) {
            const double pr = g.phi.value_deg(ip) * deg;
            const cplx et = content == FieldContent::total_only ? e1 : dot(e, theta_hat(s.theta_deg * deg, pr));
            const cplx ep = content == FieldContent::total_only ? cplx(0) : dot(e, phi_hat(pr));
            if (!put(t, fk, g.index(it, ip), et, ep, line, src, f)) return false;
        }
        return true;
    }
    const int ip = phi_column(g, s.phi_deg);
    if (ip < 0) return true;  // a pole of magnitude-only data at another phi: its own column is checked for
    cplx et = e1, ep = e2;
    if (is_positioner(L) && content == FieldContent::complex) {
        const double pr = g.phi.value_deg(ip) * deg;
        et = dot(e, theta_hat(s.theta_deg * deg, pr));
        ep = dot(e, phi_hat(pr));
    } else if (content == FieldContent::complex) {
        et *= s.sign;
        ep *= s.sign;
    }
    return put(t, fk, g.index(it, ip), et, ep, line, src, f);
}

// ---- Resampling a positioner grid ----

// Fractional index of angle v on axis ax (v taken modulo 360; across the wrap when the axis is a
// full circle without its duplicate); false when outside.
bool axis_position(const AngleAxis& ax, double v, double& f) {
    const bool circle = ax.count > 1 && std::abs(ax.step_deg * ax.count - 360) <= 1e-6 * 360;
    const double lim = ax.count - 1 + (circle ? 1 : 0);
    for (int k = -2; k <= 2; ++k) {
        const double x = (v + 360.0 * k - ax.start_deg) / ax.step_deg;
        if (x >= -1e-6 && x <= lim + 1e-6) {
            f = std::clamp(x, 0.0, lim);
            return true;
        }
    }
    return false;
}

struct Stencil {
    std::size_t k[4];
    double w[4];
};

// Bilinear stencil in the table as written for direction r, trying both (az, el) of r.
bool table_stencil(const Grid& raw, PositionerGrid pg, Vec3 r, Stencil& st) {
    double az, el;
    positioner_angles(pg, r, az, el);
    const double alt_az = pg == PositionerGrid::az_over_el ? az + 180 : 180 - az;
    const double alt_el = pg == PositionerGrid::az_over_el ? 180 - el : el + 180;
    for (int rep = 0; rep < 2; ++rep) {
        double fi, fj;
        if (!axis_position(raw.theta, rep ? alt_el : el, fi) || !axis_position(raw.phi, rep ? alt_az : az, fj)) continue;
        const int i0 = std::min(int(fi), std::max(0, raw.theta.count - 2)), j0 = int(fj);
        const int i1 = std::min(i0 + 1, raw.theta.count - 1), j1 = (j0 + 1) % raw.phi.count;
        const double u = std::clamp(fi - i0, 0.0, 1.0), v = std::clamp(fj - j0, 0.0, 1.0);
        const int jj0 = j0 % raw.phi.count;
        st = {{raw.index(i0, jj0), raw.index(i0, j1), raw.index(i1, jj0), raw.index(i1, j1)},
              {(1 - u) * (1 - v), (1 - u) * v, u * (1 - v), u * v}};
        return true;
    }
    return false;
}

// The stored grid of a resampled positioner table: the table's finer step (dividing 180), theta
// from 0 to the widest cone about +z inside the scan. Zero theta rows when +z is outside it.
Grid resample_grid(const Grid& raw, PositionerGrid pg) {
    double h = 180;
    for (const AngleAxis* ax : {&raw.theta, &raw.phi})
        if (ax->count > 1) h = std::min(h, std::abs(ax->step_deg));
    // No finer than the table's own density: about twice its samples over the sphere.
    const double most = std::floor(std::sqrt((2.0 * double(raw.size()) + 4096) / 2));
    h = 180.0 / std::min(most, std::ceil(180.0 / h - 1e-9));
    Grid g;
    g.phi = {0, h, int(std::lround(360 / h))};
    int rows = 0;
    Stencil st;
    for (int it = 0; it * h <= 180 + 1e-9; ++it, ++rows) {
        bool inside = true;
        for (int ip = 0; ip < g.phi.count && inside; ++ip)
            inside = table_stencil(raw, pg, direction(it * h * deg, ip * h * deg), st);
        if (!inside) break;
    }
    g.theta = {0, h, rows};
    return g;
}

Status resample(const FarFieldSet& raw, const std::vector<Sample>& smp, const Layout& L, FarFieldSet& s,
                const std::string& file) {
    const PositionerGrid pg = positioner_of(L);
    s.grid = resample_grid(raw.grid, pg);
    if (s.grid.theta.count < 2)
        return Error{file, 0, 0,
                     "expected a positioner scan around boresight (+z) on a grid of at least 2 by 2 angles, found one that "
                     "does not cover the directions within " + number(s.grid.theta.step_deg) + " deg of +z"};
    for (std::size_t fk = 0; fk < s.frequencies.size(); ++fk) {
        const FarField& in = raw.frequencies[fk];
        FarField& out = s.frequencies[fk];
        out.e_theta.assign(s.grid.size(), cplx(0));
        out.e_phi.assign(s.grid.size(), cplx(0));
        for (int it = 0; it < s.grid.theta.count; ++it)
            for (int ip = 0; ip < s.grid.phi.count; ++ip) {
                const double tr = s.grid.theta.value_deg(it) * deg, pr = s.grid.phi.value_deg(ip) * deg;
                Stencil st;
                table_stencil(raw.grid, pg, direction(tr, pr), st);
                CVec3 e{};
                double p = 0;
                for (int q = 0; q < 4; ++q) {
                    const std::size_t k = st.k[q];
                    e = e + st.w[q] * (in.e_theta[k] * smp[k].a + in.e_phi[k] * smp[k].b);
                    p += st.w[q] * std::norm(in.e_theta[k]);
                }
                const std::size_t k = s.grid.index(it, ip);
                out.e_theta[k] = s.content == FieldContent::total_only ? cplx(std::sqrt(p)) : dot(e, theta_hat(tr, pr));
                out.e_phi[k] = s.content == FieldContent::total_only ? cplx(0) : dot(e, phi_hat(pr));
            }
    }
    return Ok{};
}

// A resampled positioner table still gives some directions more than once (its elevation pole at
// every azimuth, both ends of a full circle, a direction reached from both sides of the pole): their
// fields must agree as the placed layouts' repeats do (same_direction_values, on the Cartesian field
// written in the direction's theta-hat and phi-hat). Repeats are found by sorting the directions,
// rounded to 1e-6 deg (a heap of 24 bytes a sample, no hash table).
Status check_repeats(const FarFieldSet& raw, const std::vector<Sample>& smp, const std::vector<std::vector<std::size_t>>& lines,
                     const Layout& L, const TextSource& src, const std::string& file) {
    if (raw.content == FieldContent::magnitude_only) return Ok{};
    struct Key {
        long long t, p;
        std::size_t k;
    };
    std::vector<Key> keys(smp.size());
    for (std::size_t k = 0; k < smp.size(); ++k) {
        const long long p = std::llround(smp[k].phi_deg * 1e6);
        keys[k] = {std::llround(smp[k].theta_deg * 1e6), p >= 360000000LL ? p - 360000000LL : p, k};
    }
    std::sort(keys.begin(), keys.end(), [](const Key& a, const Key& b) { return a.t != b.t ? a.t < b.t : a.p != b.p ? a.p < b.p : a.k < b.k; });
    for (std::size_t fk = 0; fk < raw.frequencies.size(); ++fk) {
        const FarField& in = raw.frequencies[fk];
        auto field = [&](std::size_t k, cplx& et, cplx& ep) {
            const Sample& s = smp[k];
            if (raw.content == FieldContent::total_only) {
                et = in.e_theta[k], ep = 0;
                return;
            }
            const CVec3 e = in.e_theta[k] * s.a + in.e_phi[k] * s.b;
            et = dot(e, theta_hat(s.theta_deg * deg, s.phi_deg * deg));
            ep = dot(e, phi_hat(s.phi_deg * deg));
        };
        for (std::size_t a = 0, b = 1; b < keys.size(); ++b) {
            if (keys[b].t != keys[a].t || keys[b].p != keys[a].p) {
                a = b;
                continue;
            }
            cplx t1, p1, t2, p2;
            field(keys[a].k, t1, p1);
            field(keys[b].k, t2, p2);
            if (same_direction_values(t1, p1, t2, p2, L.duplicate_tolerance)) continue;
            const std::size_t first = std::min(lines[fk][keys[a].k], lines[fk][keys[b].k]);
            const std::size_t later = std::max(lines[fk][keys[a].k], lines[fk][keys[b].k]);
            const Sample& s = smp[keys[a].k];
            return to_error(src, file, differing_repeat(src, later, first, s.theta_deg, s.phi_deg, in.frequency_hz));
        }
    }
    return Ok{};
}

const char* layout_words(const Layout& L) {
    return L.angles == AngleSystem::az_over_el ? "azimuth over elevation" : "elevation over azimuth";
}

// Exact placement of every sample of every frequency, then the completeness check; a positioner
// table whose directions leave points of the grid empty is `incomplete` (it is resampled).
Status place_exactly(const FarFieldSet& raw, const std::vector<Sample>& smp, const std::vector<std::vector<std::size_t>>& lines,
                     const Layout& L, FarFieldSet& s, const TextSource& src, const std::string& file, bool& incomplete) {
    Target t;
    allocate_target(s, t);
    t.tolerance = L.duplicate_tolerance;
    Failure f;
    for (std::size_t fk = 0; fk < s.frequencies.size(); ++fk)
        for (std::size_t k = 0; k < smp.size(); ++k)
            if (!place_sample(t, fk, smp[k], raw.frequencies[fk].e_theta[k], raw.frequencies[fk].e_phi[k], lines[fk][k], L,
                              src, f))
                return to_error(src, file, f);
    for (const auto& seen : t.seen)
        incomplete = incomplete || (is_positioner(L) && std::find(seen.begin(), seen.end(), 0) != seen.end());
    return incomplete ? Status(Ok{}) : check_complete(s, t.seen, L, false, file);
}

}  // namespace

Result<FarFieldSet> place_directions(FarFieldSet table, const std::vector<std::vector<std::size_t>>& lines, const Layout& L,
                                     const TextSource& src, const std::string& file) {
    FarFieldSet s = std::move(table), raw;
    raw.grid = s.grid;
    raw.frequencies = std::move(s.frequencies);
    s.frequencies.assign(raw.frequencies.size(), FarField{});
    for (std::size_t k = 0; k < raw.frequencies.size(); ++k) s.frequencies[k].frequency_hz = raw.frequencies[k].frequency_hz;
    const std::vector<Sample> smp = samples_of(raw.grid, L);
    Failure f;
    bool incomplete = false;
    const bool exact = exact_grid(smp, lines[0], s.grid, f);
    if (exact)
        if (Status st = place_exactly(raw, smp, lines, L, s, src, file, incomplete); !st) return st.error();
    if (exact && !incomplete) {
        s.reading_notes.push_back(is_positioner(L) ? std::string("read as ") + layout_words(L) +
                                                         ": every direction falls on the theta/phi grid, placed exactly"
                                  : raw.grid.theta.start_deg < 0
                                      ? "theta below 0 read as the opposite half-plane: (-theta, phi) is (theta, phi + 180), "
                                        "E_theta and E_phi negated"
                                      : "phi read modulo 360 (written " + number(raw.grid.phi.start_deg) + ".." +
                                            number(raw.grid.phi.last_deg()) + " deg)");
        return s;
    }
    if (!is_positioner(L))
        return to_error(src, file,
                        {true, f.line_offset, 0,
                         "the directions (theta below 0 read as theta, phi + 180): " +
                             (f.message.empty() ? std::string("expected a regular theta/phi grid") : f.message)});
    if (Status st = check_repeats(raw, smp, lines, L, src, file); !st) return st.error();
    if (Status st = resample(raw, smp, L, s, file); !st) return st.error();
    s.reading_notes.push_back(std::string("read as ") + layout_words(L) + " and resampled onto theta 0.." +
                              number(s.grid.theta.last_deg()) + " step " + number(s.grid.theta.step_deg) + ", phi step " +
                              number(s.grid.phi.step_deg) + " deg (bilinear on the Cartesian field" +
                              (s.grid.theta.last_deg() < 180 ? "; the scan covers no wider cone about +z)" : ")"));
    return s;
}

}  // namespace ellipsa::csv
