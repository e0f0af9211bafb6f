#include "viewer/scene/surface_mesh.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <mutex>

#include "pattern/colour_math.hpp"
#include "pattern/interpolate.hpp"
#include "pattern/parallel.hpp"

namespace ellipsa::viewer {

namespace {
double db_of(double linear) { return linear > 0 ? 10 * std::log10(linear) : -std::numeric_limits<double>::infinity(); }

// The B pattern's component power at A's grid directions.
std::vector<double> other_power_on_grid(const FarFieldSet& a, const FarFieldSet& b, std::size_t kb, Component c) {
    std::vector<double> out(a.grid.size(), std::numeric_limits<double>::quiet_NaN());
    if (same_grid(a.grid, b.grid)) {
        component_power_grid(b, kb, c, out.data());
        return out;
    }
    for (int i = 0; i < a.grid.theta.count; ++i)
        for (int j = 0; j < a.grid.phi.count; ++j) {
            const double t = a.grid.theta.value_deg(i), p = a.grid.phi.value_deg(j);
            auto f = interpolate(b, kb, t, p);
            if (!f) continue;
            out[a.grid.index(i, j)] = component_power(f->e_theta, f->e_phi, std::cos(p * deg), std::sin(p * deg), b.ludwig3_reference, c);
        }
    return out;
}
// Picking blocks of pick_block x pick_block cells, their boxes empty (filled row by row with the vertices).
void start_pick_boxes(SurfaceMesh& m) {
    const int cells_r = std::max(m.rows - 1, 0), cells_c = std::max(m.cols - 1, 0);
    m.pick_block_rows = (cells_r + pick_block - 1) / pick_block;
    m.pick_block_cols = (cells_c + pick_block - 1) / pick_block;
    m.pick_boxes.resize(std::size_t(m.pick_block_rows) * std::size_t(m.pick_block_cols) * 6);
    for (std::size_t b = 0; b < m.pick_boxes.size(); b += 6)
        for (int a = 0; a < 3; ++a) m.pick_boxes[b + a] = 1e30f, m.pick_boxes[b + 3 + a] = -1e30f;
}

// Row i's positions into the boxes of the blocks holding it: its own block row (`own`) and, for a
// row on a block edge, the block row above (`above`), which share it (corner vertices included).
void add_row_to_boxes(SurfaceMesh& m, std::size_t i, bool own, bool above) {
    const std::size_t cols = std::size_t(m.cols), br = i / pick_block;
    own = own && br < std::size_t(m.pick_block_rows);
    above = above && i % pick_block == 0 && br >= 1;
    if (!own && !above) return;
    const float* row = &m.vertices[i * cols * surface_floats_per_vertex];
    for (std::size_t bc = 0; bc < std::size_t(m.pick_block_cols); ++bc) {
        float lo[3] = {1e30f, 1e30f, 1e30f}, hi[3] = {-1e30f, -1e30f, -1e30f};
        const std::size_t j1 = std::min((bc + 1) * pick_block, cols - 1);
        for (std::size_t j = bc * pick_block; j <= j1; ++j)
            for (std::size_t a = 0; a < 3; ++a) {
                const float x = row[j * surface_floats_per_vertex + a];
                lo[a] = std::min(lo[a], x), hi[a] = std::max(hi[a], x);
            }
        for (std::size_t b : {br, br - 1}) {
            if (b == br ? !own : !above) continue;
            float* box = &m.pick_boxes[(b * std::size_t(m.pick_block_cols) + bc) * 6];
            for (int a = 0; a < 3; ++a) box[a] = std::min(box[a], lo[a]), box[3 + a] = std::max(box[3 + a], hi[a]);
        }
    }
}
}  // namespace

namespace {

std::optional<Error> surface_refusal(const FarFieldSet& s, std::size_t k, const SurfaceOptions& o, const FarFieldSet* other,
                                     std::size_t kb) {
    if (k >= s.frequencies.size()) return Error{s.source, 0, 0, "frequency index out of range"};
    if (auto why = component_unavailable(s, o.component)) return Error{s.source, 0, 0, *why};
    if (auto why = color_by_unavailable(s, o.color_by)) return Error{s.source, 0, 0, *why};
    if (o.color_by == ColorBy::difference) {
        if (!other) return Error{s.source, 0, 0, "A minus B needs a second pattern chosen as B"};
        if (auto why = component_unavailable(*other, o.component)) return Error{other->source, 0, 0, *why};
        if (kb >= other->frequencies.size()) return Error{other->source, 0, 0, "frequency index out of range"};
    }
    if (!(o.range_db > 0)) return Error{"", 0, 0, "dynamic range must be positive"};
    return std::nullopt;
}

constexpr std::size_t min_block = 20000;

// Trigonometry once per row and column, not per sample.
struct GridTrig {
    std::vector<double> sin_t, cos_t, sin_p, cos_p;
    explicit GridTrig(const Grid& g) {
        for (int i = 0; i < g.theta.count; ++i) {
            sin_t.push_back(std::sin(g.theta.value_deg(i) * deg));
            cos_t.push_back(std::cos(g.theta.value_deg(i) * deg));
        }
        for (int j = 0; j < g.phi.count; ++j) {
            sin_p.push_back(std::sin(g.phi.value_deg(j) * deg));
            cos_p.push_back(std::cos(g.phi.value_deg(j) * deg));
        }
    }
    Vec3 radial(std::size_t i, std::size_t j) const { return {sin_t[i] * cos_p[j], sin_t[i] * sin_p[j], cos_t[i]}; }
};

// Colour values in [0, 1] of the polarisation colourings (axial ratio, RHCP minus LHCP, tilt) for
// the np samples from n0 into t (NaN: no value, grey); `r` and `l` are scratch for np powers. The
// colouring is chosen once per row, and the arithmetic is single precision where only a colour
// follows (pattern/colour_math.hpp; the probe's numbers do not come from here).
void polarisation_colour_row(const FarFieldSet& s, std::size_t k, const SurfaceOptions& o, std::size_t n0, std::size_t np, float* t,
                             double* r, double* l) {
    constexpr float nan = std::numeric_limits<float>::quiet_NaN();
    const FarField& f = s.frequencies[k];
    const cplx *et = f.e_theta.data() + n0, *ep = f.e_phi.data() + n0;
    if (o.color_by == ColorBy::tilt) {  // (tilt_deg + 90) / 180, tilt = atan2(U, Q) / 2; the cyclic map wraps at 1
        for (std::size_t j = 0; j < np; ++j) {
            const Stokes st = stokes(et[j], ep[j]);
            t[j] = tilt_defined(st) ? colour_atan2(st.u, st.q) * float(0.5 / pi) + 0.5f : nan;
        }
        return;
    }
    component_power_many(np, et, ep, nullptr, nullptr, s.ludwig3_reference, Component::rhcp, r);
    component_power_many(np, et, ep, nullptr, nullptr, s.ludwig3_reference, Component::lhcp, l);
    if (o.color_by == ColorBy::axial_ratio) {
        const float top = float(o.axial_ratio_max_db), inv_top = 1.f / top;
        for (std::size_t j = 0; j < np; ++j) {
            const double ar = axial_ratio_from_circular(r[j], l[j]);
            t[j] = std::isnan(ar) ? nan : std::min(20.f * colour_log10(ar), top) * inv_top;
        }
        return;
    }
    const float scale = float(10 / o.balance_range_db);  // ColorBy::circular_balance
    for (std::size_t j = 0; j < np; ++j) {
        const float d = scale * colour_log10(std::max(r[j], 1e-300) / std::max(l[j], 1e-300));
        t[j] = (r[j] > 0 || l[j] > 0) ? 0.5f + 0.5f * std::clamp(d, -1.f, 1.f) : nan;
    }
}

bool polarisation_colouring(ColorBy by) { return by == ColorBy::axial_ratio || by == ColorBy::circular_balance || by == ColorBy::tilt; }

// The shown component in dB over the grid into m.value_db (reused: no fresh memory to fault in),
// and a polarisation colouring's values into m.colour_value, row by row while the row's fields are
// in the cache; returns the component's peak (0 for an all-zero component: flat at the origin).
double component_db(const FarFieldSet& s, std::size_t k, const SurfaceOptions& o, const GridTrig& trig, SurfaceMesh& m) {
    const std::size_t np = std::size_t(s.grid.phi.count);
    m.value_db.resize(s.grid.size());
    const bool colours = polarisation_colouring(o.color_by);
    m.colour_value.resize(colours ? s.grid.size() : 0);
    double peak = -std::numeric_limits<double>::infinity();
    std::mutex merge;
    parallel_blocks(std::size_t(s.grid.theta.count), std::max<std::size_t>(1, min_block / np), [&](std::size_t ia, std::size_t ib) {
        std::vector<double> r(colours ? np : 0), l(colours ? np : 0);
        double top = -std::numeric_limits<double>::infinity();
        for (std::size_t i = ia; i < ib; ++i) {
            const FarField& f = s.frequencies[k];
            component_power_many(np, f.e_theta.data() + i * np, f.e_phi.data() + i * np, trig.cos_p.data(), trig.sin_p.data(),
                                 s.ludwig3_reference, o.component, m.value_db.data() + i * np);
            for (std::size_t n = i * np; n < (i + 1) * np; ++n) {
                m.value_db[n] = db_of(m.value_db[n]);
                top = std::max(top, m.value_db[n]);
            }
            if (colours) polarisation_colour_row(s, k, o, i * np, np, m.colour_value.data() + i * np, r.data(), l.data());
        }
        const std::lock_guard<std::mutex> lock(merge);
        peak = std::max(peak, top);
    });
    return std::isfinite(peak) ? peak : 0;
}

ColorBar colour_bar(const FarFieldSet& s, const SurfaceOptions& o, const SurfaceMesh& m) {
    const std::string comp_name = short_label(o.component);
    switch (o.color_by) {
        case ColorBy::component: return {o.gain_map, m.floor_db, m.peak_db, std::string(quantity_label(s.quantity)) + ": " + comp_name, m.unit};
        case ColorBy::axial_ratio: return {o.gain_map, 0, o.axial_ratio_max_db, "Axial ratio", "dB"};
        case ColorBy::circular_balance: return {ColorMap::diverging, -o.balance_range_db, o.balance_range_db, "RHCP minus LHCP", "dB"};
        case ColorBy::tilt: return {ColorMap::cyclic, -90, 90, "Tilt from theta toward phi", "deg"};
        case ColorBy::difference: return {ColorMap::diverging, -o.difference_range_db, o.difference_range_db, comp_name + ": A minus B", "dB"};
    }
    return {};
}

// A's dB minus B's as a colour value in [0, 1] (NaN, grey, where A is below the floor or B is unknown).
float difference_colour(const SurfaceOptions& o, const SurfaceMesh& m, double a_db, double b_power) {
    const float d = float(a_db) - 10.f * colour_log10(b_power);
    return (a_db > m.floor_db && std::isfinite(d)) ? 0.5f + 0.5f * std::clamp(d / float(o.difference_range_db), -1.f, 1.f)
                                                   : std::numeric_limits<float>::quiet_NaN();
}

// What one pass over the grid writes from: the grid's trigonometry, the frequency's fields, the
// options, the colour map resolved, and B's component power on this grid for ColorBy::difference.
struct VertexSource {
    const GridTrig& trig;
    const FarField& field;
    const SurfaceOptions& options;
    ColorLookup colour;
    const std::vector<double>& other_power;  // empty unless ColorBy::difference
    std::size_t np;                          // phi samples (the seam column repeats the first)
    bool wraps;
};

// Row i's positions, radii and colours; the seam column copies phi = 0.
void vertex_row(SurfaceMesh& m, const VertexSource& src, std::size_t i) {
    constexpr std::size_t F = surface_floats_per_vertex;
    float* row = &m.vertices[i * std::size_t(m.cols) * F];
    const ColorBy by = src.options.color_by;
    for (std::size_t j = 0, n = i * src.np; j < src.np; ++j, ++n) {
        const double r = radius_from_db(m.value_db[n], m.peak_db, src.options.range_db);
        m.radius[n] = float(r);
        float* v = row + j * F;
        const Vec3 u = src.trig.radial(i, j);
        v[0] = float(r * u.x), v[1] = float(r * u.y), v[2] = float(r * u.z);
        const double t = by == ColorBy::component    ? r
                         : by == ColorBy::difference ? double(difference_colour(src.options, m, m.value_db[n], src.other_power[n]))
                                                     : double(m.colour_value[n]);
        const Rgb c = src.colour(t);
        v[6] = c.r, v[7] = c.g, v[8] = c.b;
    }
    if (std::size_t(m.cols) > src.np) std::copy_n(row, F, row + src.np * F);
}

struct Point3f {
    float x, y, z;
};
Point3f position_at(const float* v) { return {v[0], v[1], v[2]}; }

// A vertex's normal, the cross product of the differences of its neighbours' positions along theta
// (after - before) and phi (right - left), in single precision like the positions; where the surface
// degenerates (poles, the origin) the radial direction stands in. Points outward.
void put_normal(float* v, Point3f after, Point3f before, Point3f left, Point3f right, Vec3 radial) {
    const float tx = after.x - before.x, ty = after.y - before.y, tz = after.z - before.z;
    const float px = right.x - left.x, py = right.y - left.y, pz = right.z - left.z;
    const float nx = ty * pz - tz * py, ny = tz * px - tx * pz, nz = tx * py - ty * px;
    const float n2 = nx * nx + ny * ny + nz * nz;
    if (!(n2 >= 1e-24f)) {
        const Vec3 u = normalized(radial);
        v[3] = float(u.x), v[4] = float(u.y), v[5] = float(u.z);
        return;
    }
    const double side = nx * radial.x + ny * radial.y + nz * radial.z;
    const float scale = (side < 0 ? -1.f : 1.f) / std::sqrt(n2);
    v[3] = nx * scale, v[4] = ny * scale, v[5] = nz * scale;
}

// Row i's normals from central differences on the grid (one-sided at the edges; across the seam
// when phi wraps); rows i - 1, i and i + 1 must have their positions. Inside a row the neighbours
// are j - 1 and j + 1 (column np - 1's next is the seam column, a copy of phi = 0), so only the
// first and last columns need care. The row's positions are carried along in registers: reading a
// vertex just after writing its normal stalls the load on the store.
void normal_row(SurfaceMesh& m, const VertexSource& src, int i) {
    constexpr std::size_t F = surface_floats_per_vertex;
    const std::size_t cols = std::size_t(m.cols), np = src.np, last = cols - 1;
    const bool wraps = src.wraps;
    const float* before = &m.vertices[std::size_t(std::max(i - 1, 0)) * cols * F];
    const float* after = &m.vertices[std::size_t(std::min(i + 1, m.rows - 1)) * cols * F];
    float* row = &m.vertices[std::size_t(i) * cols * F];
    const std::size_t ii = std::size_t(i);
    // Column j's normal from columns j0 and j1; `u` is column j's phi sample (the seam's is 0).
    auto one = [&](std::size_t j, Point3f left, Point3f right, std::size_t u) {
        put_normal(row + j * F, position_at(after + j * F), position_at(before + j * F), left, right, src.trig.radial(ii, u));
    };
    const Point3f first = position_at(row), end = position_at(row + last * F);
    Point3f prev = first, cur = position_at(row + std::min<std::size_t>(1, last) * F);
    one(0, position_at(row + (wraps ? np - 1 : 0) * F), cur, 0);
    for (std::size_t j = 1; j < last; ++j) {
        const Point3f next = position_at(row + (j + 1) * F);
        one(j, prev, next, j);
        prev = cur, cur = next;
    }
    if (last > 0)
        one(last, wraps ? position_at(row + (np - 1) * F) : position_at(row + (last - 1) * F), wraps ? position_at(row + F) : end, last % np);
}

// Positions, radii, colours, normals and picking boxes in one pass over the rows, so that each
// row's normals and boxes are made while its neighbours are still in the cache (a second pass
// re-read 37 MB at 0.25 degree). The threads take whole block rows of the picking boxes; a
// thread's first row, shared with the block row above, and its first and last rows' normals,
// which need a neighbour of another thread, come after the join.
void fill_vertices(SurfaceMesh& m, const VertexSource& src) {
    const std::size_t cols = std::size_t(m.cols), rows = std::size_t(m.rows);
    m.radius.resize(rows * src.np);
    m.vertices.resize(rows * cols * surface_floats_per_vertex);
    start_pick_boxes(m);
    if (rows == 0 || cols == 0) return;
    std::mutex merge;
    std::vector<std::size_t> edges, firsts;
    const std::size_t groups = (rows + pick_block - 1) / pick_block;
    parallel_blocks(groups, std::max<std::size_t>(1, min_block / (cols * pick_block)), [&](std::size_t ga, std::size_t gb) {
        const std::size_t ia = ga * pick_block, ib = std::min(gb * pick_block, rows);
        for (std::size_t i = ia; i < ib; ++i) {
            vertex_row(m, src, i);
            add_row_to_boxes(m, i, true, i > ia);
            if (i >= ia + 2) normal_row(m, src, int(i - 1));
        }
        const std::lock_guard<std::mutex> lock(merge);
        edges.push_back(ia);
        if (ib - 1 > ia) edges.push_back(ib - 1);
        firsts.push_back(ia);
    });
    for (std::size_t i : edges) normal_row(m, src, int(i));
    for (std::size_t i : firsts) add_row_to_boxes(m, i, false, true);
}

// Triangles: two per grid cell.
void fill_triangles(SurfaceMesh& m) {
    const int nt = m.rows;
    m.triangles.resize(std::size_t(std::max(nt - 1, 0)) * std::size_t(std::max(m.cols - 1, 0)) * 6);
    const std::size_t bands = std::size_t(std::max(nt - 1, 0)), per_band = std::size_t(std::max(m.cols - 1, 0)) * 6;
    parallel_blocks(bands, std::max<std::size_t>(1, 4 * min_block / std::max<std::size_t>(per_band, 1)), [&](std::size_t ia, std::size_t ib) {
        for (std::size_t i = ia; i < ib; ++i) {
            std::uint32_t* tri = m.triangles.data() + i * per_band;
            for (int j = 0; j + 1 < m.cols; ++j) {
                const std::uint32_t a = std::uint32_t(i * std::size_t(m.cols) + std::size_t(j)), b = a + 1, c = a + std::uint32_t(m.cols), d = c + 1;
                tri[0] = a, tri[1] = c, tri[2] = b, tri[3] = b, tri[4] = c, tri[5] = d;
                tri += 6;
            }
        }
    });
}

// A coarser level of detail over the same vertices: every k-th grid line, the last row and column kept.
std::vector<std::uint32_t> coarse_triangles(const SurfaceMesh& m, int k) {
    std::vector<int> rows_k, cols_k;
    for (int i = 0; i < m.rows; i += k) rows_k.push_back(i);
    if (rows_k.back() != m.rows - 1) rows_k.push_back(m.rows - 1);
    for (int j = 0; j < m.cols; j += k) cols_k.push_back(j);
    if (cols_k.back() != m.cols - 1) cols_k.push_back(m.cols - 1);
    std::vector<std::uint32_t> out((rows_k.size() - 1) * (cols_k.size() - 1) * 6);
    std::uint32_t* w = out.data();
    for (std::size_t a = 0; a + 1 < rows_k.size(); ++a)
        for (std::size_t b = 0; b + 1 < cols_k.size(); ++b) {
            const std::uint32_t v00 = std::uint32_t(rows_k[a] * m.cols + cols_k[b]), v01 = std::uint32_t(rows_k[a] * m.cols + cols_k[b + 1]);
            const std::uint32_t v10 = std::uint32_t(rows_k[a + 1] * m.cols + cols_k[b]), v11 = std::uint32_t(rows_k[a + 1] * m.cols + cols_k[b + 1]);
            w[0] = v00, w[1] = v10, w[2] = v01, w[3] = v01, w[4] = v10, w[5] = v11;
            w += 6;
        }
    return out;
}

// The index lists' inputs: the shape and the wireframe spacing in grid lines (nearest to wire_step_deg).
SurfaceTopology topology_of(const SurfaceMesh& m, const Grid& g, int wire_step_deg) {
    return {m.rows, m.cols, std::max(1, int(std::lround(wire_step_deg / std::max(g.theta.step_deg, 1e-9)))),
            std::max(1, int(std::lround(wire_step_deg / std::max(g.phi.step_deg, 1e-9))))};
}

// Wireframe: meridians and parallels every topology.wire_rows / wire_cols grid lines.
void fill_wire(SurfaceMesh& m) {
    const int step = m.topology.wire_rows, pstep = m.topology.wire_cols;
    m.wire_lines.clear();
    for (int i = 0; i < m.rows; i += step)
        for (int j = 0; j + 1 < m.cols; ++j)
            m.wire_lines.insert(m.wire_lines.end(), {std::uint32_t(i * m.cols + j), std::uint32_t(i * m.cols + j + 1)});
    for (int j = 0; j < m.cols; j += pstep)
        for (int i = 0; i + 1 < m.rows; ++i)
            m.wire_lines.insert(m.wire_lines.end(), {std::uint32_t(i * m.cols + j), std::uint32_t((i + 1) * m.cols + j)});
}

}  // namespace

Result<SurfaceMesh> build_surface(const FarFieldSet& s, std::size_t k, const SurfaceOptions& o,
                                  const FarFieldSet* other, std::size_t kb, SurfaceMesh&& previous) {
    if (auto refused = surface_refusal(s, k, o, other, kb)) return *refused;
    const Grid& g = s.grid;
    const bool wraps = g.phi_wraps();
    SurfaceMesh m = std::move(previous);
    m.rows = g.theta.count;
    m.cols = g.phi.count + (wraps ? 1 : 0);
    m.unit = db_unit(s.quantity, o.component);
    const GridTrig trig(g);
    m.peak_db = component_db(s, k, o, trig, m);
    m.floor_db = m.peak_db - o.range_db;
    m.bar = colour_bar(s, o, m);
    std::vector<double> other_power;
    if (o.color_by == ColorBy::difference) other_power = other_power_on_grid(s, *other, kb, o.component);
    fill_vertices(m, VertexSource{trig, s.frequencies[k], o, ColorLookup(m.bar.map), other_power, std::size_t(g.phi.count), wraps});
    m.unsampled = unsampled_region(g, m);
    m.grid_step_deg = std::min(g.theta.step_deg, g.phi.step_deg);
    const SurfaceTopology topology = topology_of(m, g, o.wire_step_deg);
    if (topology == m.topology && !m.triangles.empty()) return m;
    m.topology = topology;
    fill_triangles(m);
    m.triangles_stride2.clear();
    m.triangles_stride4.clear();
    if (m.rows > 8 && m.cols > 8) {
        m.triangles_stride2 = coarse_triangles(m, 2);
        m.triangles_stride4 = coarse_triangles(m, 4);
    }
    fill_wire(m);
    return m;
}

int lod_stride(double step_deg, double view_h, double fov_deg, double distance, double min_cell_px) {
    const double unit_px = view_h / (2 * std::tan(0.5 * fov_deg * deg) * std::max(distance, 1e-6));
    for (int k : {1, 2, 4})
        if (k * step_deg * deg * unit_px >= min_cell_px) return k;
    return 4;
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
