#include "viewer/scene/surface_mesh.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "pattern/interpolate.hpp"

namespace ellipsa::viewer {

namespace {
double db_of(double linear) { return linear > 0 ? 10 * std::log10(linear) : -std::numeric_limits<double>::infinity(); }

std::string quantity_word(Quantity q) {
    switch (q) {
        case Quantity::gain: return "gain";
        case Quantity::directivity: return "directivity";
        case Quantity::relative: return "power";
    }
    return "";
}

// The B pattern's component power at A's grid directions.
std::vector<double> other_power_on_grid(const FarFieldSet& a, const FarFieldSet& b, std::size_t kb, Component c) {
    const bool same_grid = a.grid.theta.start_deg == b.grid.theta.start_deg &&
                           a.grid.theta.step_deg == b.grid.theta.step_deg && a.grid.theta.count == b.grid.theta.count &&
                           a.grid.phi.start_deg == b.grid.phi.start_deg && a.grid.phi.step_deg == b.grid.phi.step_deg &&
                           a.grid.phi.count == b.grid.phi.count;
    if (same_grid) return component_power_grid(b, kb, c);
    std::vector<double> out(a.grid.size(), std::numeric_limits<double>::quiet_NaN());
    for (int i = 0; i < a.grid.theta.count; ++i)
        for (int j = 0; j < a.grid.phi.count; ++j) {
            const double t = a.grid.theta.value_deg(i), p = a.grid.phi.value_deg(j);
            auto f = interpolate(b, kb, t, p);
            if (!f) continue;
            PolarisationState st = decompose(f->e_theta, f->e_phi, p * deg, b.ludwig3_reference);
            out[a.grid.index(i, j)] = component_power(st, c);
        }
    return out;
}
}  // namespace

Result<SurfaceMesh> build_surface(const FarFieldSet& s, std::size_t k, const SurfaceOptions& o,
                                  const FarFieldSet* other, std::size_t kb) {
    if (k >= s.frequencies.size()) return Error{s.source, 0, 0, "frequency index out of range"};
    if (std::string why = unavailable_reason(s, o.component); !why.empty()) return Error{s.source, 0, 0, why};
    if (std::string why = unavailable_reason(s, o.color_by); !why.empty()) return Error{s.source, 0, 0, why};
    if (o.color_by == ColorBy::difference) {
        if (!other) return Error{s.source, 0, 0, "A minus B needs a second pattern chosen as B"};
        if (std::string why = unavailable_reason(*other, o.component); !why.empty())
            return Error{other->source, 0, 0, why};
        if (kb >= other->frequencies.size()) return Error{other->source, 0, 0, "frequency index out of range"};
    }
    if (!(o.range_db > 0)) return Error{"", 0, 0, "dynamic range must be positive"};

    const Grid& g = s.grid;
    const int nt = g.theta.count, np = g.phi.count;
    const bool wraps = g.phi_wraps();
    SurfaceMesh m;
    m.rows = nt;
    m.cols = np + (wraps ? 1 : 0);
    m.unit = db_unit(s.quantity, o.component);

    const std::vector<double> power = component_power_grid(s, k, o.component);
    std::vector<double> value_db(power.size());
    double peak = -std::numeric_limits<double>::infinity();
    for (std::size_t n = 0; n < power.size(); ++n) {
        value_db[n] = db_of(power[n]);
        peak = std::max(peak, value_db[n]);
    }
    if (!std::isfinite(peak)) peak = 0;  // an all-zero component: flat at the origin
    m.peak_db = peak;
    m.floor_db = peak - o.range_db;

    // Colour values and the colour bar.
    std::vector<double> t(power.size());
    ColorBar& bar = m.bar;
    const std::string comp_name = label_of(o.component);
    switch (o.color_by) {
        case ColorBy::component: {
            bar = {o.gain_map, m.floor_db, m.peak_db, comp_name + " " + quantity_word(s.quantity), m.unit};
            for (std::size_t n = 0; n < t.size(); ++n) t[n] = radius_from_db(value_db[n], peak, o.range_db);
            break;
        }
        case ColorBy::axial_ratio:
        case ColorBy::circular_balance:
        case ColorBy::tilt: {
            PolarisationGrid pg = polarisation_grid(s, k);
            if (o.color_by == ColorBy::axial_ratio) {
                bar = {o.gain_map, 0, o.axial_ratio_max_db, "Axial ratio", "dB"};
                for (std::size_t n = 0; n < t.size(); ++n)
                    t[n] = std::isnan(pg.axial_ratio_db[n]) ? pg.axial_ratio_db[n]
                                                            : std::min(pg.axial_ratio_db[n], o.axial_ratio_max_db) / o.axial_ratio_max_db;
            } else if (o.color_by == ColorBy::circular_balance) {
                bar = {ColorMap::diverging, -o.balance_range_db, o.balance_range_db, "RHCP minus LHCP", "dB"};
                for (std::size_t n = 0; n < t.size(); ++n)
                    t[n] = 0.5 + 0.5 * std::clamp(pg.balance_db[n] / o.balance_range_db, -1.0, 1.0);
            } else {
                bar = {ColorMap::cyclic, -90, 90, "Tilt from theta toward phi", "deg"};
                for (std::size_t n = 0; n < t.size(); ++n) t[n] = (pg.tilt_deg[n] + 90) / 180;
            }
            break;
        }
        case ColorBy::difference: {
            const std::vector<double> pb = other_power_on_grid(s, *other, kb, o.component);
            bar = {ColorMap::diverging, -o.difference_range_db, o.difference_range_db,
                   comp_name + ": A minus B", "dB"};
            for (std::size_t n = 0; n < t.size(); ++n) {
                const double d = value_db[n] - db_of(pb[n]);
                // Where A is below the floor the difference is not shown (grey), nor where B is unknown.
                t[n] = (value_db[n] > m.floor_db && std::isfinite(d))
                           ? 0.5 + 0.5 * std::clamp(d / o.difference_range_db, -1.0, 1.0)
                           : std::numeric_limits<double>::quiet_NaN();
            }
            break;
        }
    }

    // Positions.
    m.radius.resize(power.size());
    std::vector<Vec3> pos(std::size_t(nt) * m.cols);
    for (int i = 0; i < nt; ++i) {
        const double th = g.theta.value_deg(i) * deg;
        for (int j = 0; j < m.cols; ++j) {
            const int jj = j % np;
            const double ph = g.phi.value_deg(jj) * deg;
            const std::size_t n = g.index(i, jj);
            const double r = radius_from_db(value_db[n], peak, o.range_db);
            m.radius[n] = float(r);
            pos[std::size_t(i) * m.cols + j] = r * direction(th, ph);
        }
    }
    // Normals from central differences on the grid (one-sided at the edges); where the surface
    // degenerates (poles, the origin) the radial direction stands in.
    auto P = [&](int i, int j) -> const Vec3& { return pos[std::size_t(i) * m.cols + j]; };
    m.vertices.resize(std::size_t(nt) * m.cols * surface_floats_per_vertex);
    for (int i = 0; i < nt; ++i) {
        const int i0 = std::max(i - 1, 0), i1 = std::min(i + 1, nt - 1);
        for (int j = 0; j < m.cols; ++j) {
            int j0, j1;
            if (wraps) {
                j0 = (j % np + np - 1) % np;
                j1 = (j % np + 1) % np;
            } else {
                j0 = std::max(j - 1, 0);
                j1 = std::min(j + 1, m.cols - 1);
            }
            Vec3 n = cross(P(i1, j % m.cols) - P(i0, j % m.cols), P(i, j1) - P(i, j0));
            const Vec3& p = P(i, j);
            const double th = g.theta.value_deg(i) * deg, ph = g.phi.value_deg(j % np) * deg;
            const Vec3 radial = direction(th, ph);
            if (norm(n) < 1e-12) n = radial;
            n = normalized(n);
            if (dot(n, radial) < 0 && norm(p) > 0) n = -1.0 * n;
            const Rgb c = map_color(bar.map, t[g.index(i, j % np)]);
            float* v = &m.vertices[(std::size_t(i) * m.cols + j) * surface_floats_per_vertex];
            v[0] = float(p.x), v[1] = float(p.y), v[2] = float(p.z);
            v[3] = float(n.x), v[4] = float(n.y), v[5] = float(n.z);
            v[6] = c.r, v[7] = c.g, v[8] = c.b;
        }
    }
    // Triangles: two per grid cell.
    m.triangles.reserve(std::size_t(std::max(nt - 1, 0)) * std::max(m.cols - 1, 0) * 6);
    for (int i = 0; i + 1 < nt; ++i)
        for (int j = 0; j + 1 < m.cols; ++j) {
            const std::uint32_t a = std::uint32_t(i * m.cols + j), b = a + 1, c = a + std::uint32_t(m.cols), d = c + 1;
            m.triangles.insert(m.triangles.end(), {a, c, b, b, c, d});
        }
    // Wireframe: meridians and parallels every wire_step_deg (nearest grid lines).
    const int step = std::max(1, int(std::lround(o.wire_step_deg / std::max(g.theta.step_deg, 1e-9))));
    const int pstep = std::max(1, int(std::lround(o.wire_step_deg / std::max(g.phi.step_deg, 1e-9))));
    for (int i = 0; i < nt; i += step)
        for (int j = 0; j + 1 < m.cols; ++j)
            m.wire_lines.insert(m.wire_lines.end(), {std::uint32_t(i * m.cols + j), std::uint32_t(i * m.cols + j + 1)});
    for (int j = 0; j < m.cols; j += pstep)
        for (int i = 0; i + 1 < nt; ++i)
            m.wire_lines.insert(m.wire_lines.end(), {std::uint32_t(i * m.cols + j), std::uint32_t((i + 1) * m.cols + j)});
    return m;
}

double surface_radius(const FarFieldSet& s, const SurfaceMesh& m, double theta_deg, double phi_deg) {
    GridStencil st;
    if (m.radius.size() != s.grid.size() || !grid_stencil(s.grid, theta_deg, phi_deg, st)) return 0;
    double r = 0;
    for (int a = 0; a < 2; ++a)
        for (int b = 0; b < 2; ++b) r += st.w[a][b] * m.radius[s.grid.index(st.i_theta[a], st.i_phi[b])];
    return r;
}

}  // namespace ellipsa::viewer
