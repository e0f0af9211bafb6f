#include "exports/map_plot.hpp"

#include <algorithm>
#include <cmath>
#include <cstdint>

#include "exports/csv_text.hpp"
#include "exports/cut_figure.hpp"
#include "exports/plot_pen.hpp"
#include "exports/xy_plot.hpp"
#include "pattern/peak.hpp"
#include "pattern/polarisation.hpp"

namespace ellipsa::exports {

namespace {

std::string lower(std::string s) {
    for (char& c : s)
        if (c >= 'A' && c <= 'Z') c = char(c - 'A' + 'a');
    return s;
}

// Label, unit, colour map, bar ends and default contour levels of a map.
void set_scale(MapPlot& p, const FarFieldSet& s, const MapRequest& r, double peak_db) {
    const std::string comp = long_label(r.component, s.ludwig3_reference);
    std::vector<double> levels;
    switch (r.quantity) {
        case MapQuantity::component: {
            p.bar_label = comp;
            p.unit = db_unit(s.quantity, r.component);
            p.map = r.sequential;
            p.hi = std::ceil(peak_db - 1e-9);
            p.lo = p.hi - r.range_db;
            levels = {peak_db - 3, peak_db - 10};
            break;
        }
        case MapQuantity::axial_ratio:
            p.bar_label = "Axial ratio", p.unit = "dB", p.map = r.sequential, p.lo = 0, p.hi = 20, levels = {3};
            break;
        case MapQuantity::circular_balance:
            p.bar_label = "RHCP minus LHCP", p.unit = "dB", p.map = ColorMap::diverging, p.lo = -30, p.hi = 30, levels = {0};
            break;
        case MapQuantity::linear_balance:
            p.bar_label = "Vertical minus horizontal", p.unit = "dB", p.map = ColorMap::diverging, p.lo = -30, p.hi = 30;
            levels = {0};
            break;
        case MapQuantity::tilt:
            p.bar_label = "Tilt from θ̂ toward φ̂", p.unit = "°", p.map = ColorMap::cyclic, p.lo = -90, p.hi = 90;
            break;
        case MapQuantity::difference:
            p.bar_label = comp + ": A minus B", p.unit = "dB", p.map = ColorMap::diverging, p.lo = -6, p.hi = 6, levels = {0};
            break;
    }
    if (r.scale_min) p.lo = *r.scale_min;
    if (r.scale_max) p.hi = *r.scale_max;
    if (r.levels) levels = *r.levels;
    if (r.quantity != MapQuantity::tilt)
        for (double l : levels) p.contours.push_back({l, contour_segments(p.grid, p.values, l)});
    p.quantity_key = (r.quantity == MapQuantity::component ? std::string(to_string(r.component))
                                                            : std::string(to_string(r.quantity))) +
                     "_" + lower(p.unit == "°" ? "deg" : p.unit);
    for (char& c : p.quantity_key)
        if (c == '-') c = '_';
}

}  // namespace

Result<MapPlot> make_map_plot(const FarFieldSet& s, std::size_t fi, const MapRequest& r, const FarFieldSet* b, std::size_t fb) {
    auto v = map_values(s, fi, r.quantity, r.component, b, fb);
    if (!v) return v.error();
    MapPlot p;
    p.projection = r.projection;
    p.grid = s.grid;
    p.values = std::move(*v);
    const Component marked = r.quantity == MapQuantity::component ? r.component : Component::total;
    const Peak pk = find_peak(s, fi, marked);
    set_scale(p, s, r, to_db(pk.value));
    p.title = r.title.empty() ? s.name : r.title;
    p.subtitle = p.bar_label + ", " + format_frequency(s.frequencies[fi].frequency_hz) + ", " +
                 (r.projection == MapProjection::hammer ? "Hammer equal-area projection (area = solid angle)"
                  : r.projection == MapProjection::theta_phi ? "θ/φ map"
                                                             : "azimuth/elevation map");
    if (pk.value > 0)
        p.mark = MapMark{pk.theta_deg, pk.phi_deg,
                         (r.quantity == MapQuantity::component ? "peak " : "peak of the total, ") + num(to_db(pk.value), 2) +
                             " " + db_unit(s.quantity, marked)};
    std::string cl;
    for (const MapPlot::Contour& c : p.contours) cl += (cl.empty() ? "" : ", ") + num(c.level, 1) + " " + p.unit;
    if (!cl.empty())
        p.notes.push_back("Contours at " + cl + (r.quantity == MapQuantity::component && !r.levels ? " (3 and 10 dB below the peak)" : "") +
                          ", solid then dashed, interpolated linearly between samples.");
    p.notes.push_back("Each grid sample colours its whole cell; hatched: outside the sampled region; grey: no value "
                      "(zero field). Values beyond the colour bar take its end colours.");
    if (r.quantity == MapQuantity::axial_ratio) p.notes.push_back("A linear field (infinite axial ratio) takes the top colour.");
    if (r.quantity == MapQuantity::tilt)  // the grey cells of a near-circular beam are not nulls
        p.notes.push_back("Grey also where the tilt is undefined: axial ratio below " + num(circular_axial_ratio_db, 1) +
                          " dB (nearly circular).");
    if (b) p.notes.push_back("B: " + b->name + " at " + format_frequency(b->frequencies[fb].frequency_hz) + ".");
    return p;
}

namespace {

struct MapBox {
    double x0, y0, x1, y1;  // drawing area in points
    MapBounds b;
    double X(double x) const { return x0 + (x1 - x0) * (x - b.x_min) / (b.x_max - b.x_min); }
    double Y(double y) const { return y1 - (y1 - y0) * (y - b.y_min) / (b.y_max - b.y_min); }
};

std::uint32_t argb(ColorRgb c) {
    auto q = [](float v) { return std::uint32_t(std::lround(std::clamp(v, 0.0f, 1.0f) * 255)); };
    return 0xFF000000u | (q(c.r) << 16) | (q(c.g) << 8) | q(c.b);
}

double colour_t(const MapPlot& p, double v) {
    if (std::isinf(v)) return v > 0 ? 1.0 : 0.0;
    const double t = (v - p.lo) / (p.hi - p.lo);
    return p.map == ColorMap::cyclic ? t : std::clamp(t, 0.0, 1.0);
}

// The raster behind the map (see map_raster) drawn into the box without smoothing.
void paint_cells(cairo_t* cr, const MapBox& box, const MapPlot& p) {
    const MapRaster r = map_raster(p);
    cairo_surface_t* img = cairo_image_surface_create(CAIRO_FORMAT_ARGB32, r.width, r.height);
    cairo_surface_flush(img);
    unsigned char* data = cairo_image_surface_get_data(img);
    const int stride = cairo_image_surface_get_stride(img);
    for (int py = 0; py < r.height; ++py)
        std::copy_n(r.argb.data() + std::size_t(py) * std::size_t(r.width), r.width,
                    reinterpret_cast<std::uint32_t*>(data + std::ptrdiff_t(py) * stride));
    cairo_surface_mark_dirty(img);
    cairo_save(cr);
    cairo_translate(cr, box.x0, box.y0);
    cairo_scale(cr, (box.x1 - box.x0) / r.width, (box.y1 - box.y0) / r.height);
    cairo_set_source_surface(cr, img, 0, 0);
    cairo_pattern_set_filter(cairo_get_source(cr), CAIRO_FILTER_NEAREST);
    cairo_paint(cr);
    cairo_restore(cr);
    cairo_surface_destroy(img);
}

// The map's outline as the current path (a rectangle, or Hammer's ellipse).
void outline_path(cairo_t* cr, const MapBox& box, MapProjection pr) {
    if (pr != MapProjection::hammer) {
        cairo_rectangle(cr, box.x0, box.y0, box.x1 - box.x0, box.y1 - box.y0);
        return;
    }
    cairo_save(cr);
    cairo_translate(cr, (box.x0 + box.x1) / 2, (box.y0 + box.y1) / 2);
    cairo_scale(cr, (box.x1 - box.x0) / 2, (box.y1 - box.y0) / 2);
    cairo_new_sub_path(cr);
    cairo_arc(cr, 0, 0, 1, 0, 2 * kPi);
    cairo_restore(cr);
}

// Light diagonal hatching over the whole map: shows through where no cell is painted.
void hatch(Pen& pen, const MapBox& box) {
    cairo_t* cr = pen.cr;
    pen.colour(Rgb{0.95, 0.95, 0.95});
    cairo_rectangle(cr, box.x0, box.y0, box.x1 - box.x0, box.y1 - box.y0);
    cairo_fill(cr);
    pen.colour(Rgb{0.72, 0.72, 0.72});
    cairo_set_line_width(cr, 0.5 * pen.u);
    const double d = 5 * pen.u, hgt = box.y1 - box.y0;
    for (double x = box.x0 - hgt; x < box.x1; x += d) pen.line(x, box.y1, x + hgt, box.y0);
}

// Project a polyline of directions and stroke it, breaking where it jumps across the map's seam.
template <class F>
void stroke_directions(cairo_t* cr, const MapBox& box, MapProjection pr, int n, F dir) {
    bool down = false;
    double last_x = 0;
    for (int k = 0; k <= n; ++k) {
        const auto [t, ph] = dir(double(k) / n);
        const MapPoint m = project(pr, t, ph);
        const double x = box.X(m.x), y = box.Y(m.y);
        if (down && std::abs(x - last_x) > 0.5 * (box.x1 - box.x0)) down = false;
        if (down)
            cairo_line_to(cr, x, y);
        else
            cairo_move_to(cr, x, y);
        down = true;
        last_x = x;
    }
    cairo_stroke(cr);
}

void draw_graticule(Pen& pen, const MapBox& box, MapProjection pr) {
    cairo_t* cr = pen.cr;
    const double u = pen.u;
    cairo_set_line_width(cr, 0.45 * u);
    cairo_set_source_rgba(cr, 1, 1, 1, 0.55);
    const bool hammer = pr == MapProjection::hammer;
    // Parallels (elevation) every 30 deg, meridians (azimuth) every 30 deg.
    for (int el = -60; el <= 60; el += 30)
        stroke_directions(cr, box, pr, 120, [&](double f) { return std::pair{90.0 - el, hammer || pr == MapProjection::azimuth_elevation ? -179.999 + 359.998 * f : 0.001 + 359.998 * f}; });
    for (int az = -150; az <= 180; az += 30)
        stroke_directions(cr, box, pr, 90, [&](double f) { return std::pair{0.001 + 179.998 * f, double(az)}; });
    pen.colour(ink_soft);
    cairo_set_line_width(cr, 0.8 * u);
    outline_path(cr, box, pr);
    cairo_stroke(cr);
    // Labels: elevation (or theta) on the left, azimuth (or phi) below or along the equator.
    pen.colour(ink);
    pen.font(FontWeight::regular, 7.0);
    for (int el = -90; el <= 90; el += 30) {
        if (hammer && std::abs(el) == 90) continue;
        const MapPoint m = project(pr, 90.0 - el, pr == MapProjection::theta_phi ? 0.0 : -180.0);
        const std::string s = pr == MapProjection::theta_phi ? angle_text(90 - el, 0) : angle_text(el, 0);
        pen.text(s, box.X(m.x) - 4 * u, box.Y(m.y), 1.0, true);
    }
    for (int az = pr == MapProjection::theta_phi ? 0 : -180; az <= (pr == MapProjection::theta_phi ? 360 : 180); az += 60) {
        if (hammer) {
            const MapPoint m = project(pr, 90, az == 180 ? 179.999 : az);
            pen.halo(angle_text(az, 0), box.X(m.x), box.Y(m.y) + 9 * u, 0.5, false);
            pen.colour(ink);
            pen.text(angle_text(az, 0), box.X(m.x), box.Y(m.y) + 9 * u, 0.5);
        } else {
            const double x = box.X(double(az));
            pen.text(angle_text(az, 0), x, box.y1 + 11 * u, 0.5);
        }
    }
    pen.font(FontWeight::regular, 7.8);
    const std::string xl = pr == MapProjection::theta_phi ? "φ" : "azimuth", yl = pr == MapProjection::theta_phi ? "θ" : "elevation";
    pen.text(xl + " (deg)  →", (box.x0 + box.x1) / 2, box.y1 + (hammer ? 12 : 23) * u, 0.5);
    cairo_save(cr);
    cairo_translate(cr, box.x0 - 30 * u, (box.y0 + box.y1) / 2);
    cairo_rotate(cr, -kPi / 2);
    pen.text(yl + " (deg)", 0, 0, 0.5);
    cairo_restore(cr);
}

void line_piece(cairo_t* cr, const MapBox& box, MapProjection pr, double t0, double a0, double t1, double a1) {
    const MapPoint u = project_unwrapped(pr, t0, a0), w = project_unwrapped(pr, t1, a1);
    cairo_move_to(cr, box.X(u.x), box.Y(u.y));
    cairo_line_to(cr, box.X(w.x), box.Y(w.y));
}

// One contour segment; one that crosses the map's left/right edge is split there.
void contour_piece(cairo_t* cr, const MapBox& box, MapProjection pr, const ContourSegment& s) {
    const double lo = pr == MapProjection::theta_phi ? 0 : -180, hi = lo + 360;
    const double a0 = map_x_angle(pr, s.phi0_deg), a1 = a0 + std::remainder(s.phi1_deg - s.phi0_deg, 360.0);
    if (a1 >= lo && a1 <= hi) {
        line_piece(cr, box, pr, s.theta0_deg, a0, s.theta1_deg, a1);
        return;
    }
    const double edge = a1 > hi ? hi : lo, f = (edge - a0) / (a1 - a0);
    const double tm = s.theta0_deg + f * (s.theta1_deg - s.theta0_deg), wrap = a1 > hi ? -360.0 : 360.0;
    line_piece(cr, box, pr, s.theta0_deg, a0, tm, edge);
    line_piece(cr, box, pr, tm, edge + wrap, s.theta1_deg, a1 + wrap);
}

void draw_contours(Pen& pen, const MapBox& box, const MapPlot& p) {
    cairo_t* cr = pen.cr;
    cairo_set_line_cap(cr, CAIRO_LINE_CAP_ROUND);
    for (std::size_t i = 0; i < p.contours.size(); ++i) {
        for (const ContourSegment& s : p.contours[i].segments) contour_piece(cr, box, p.projection, s);
        // White under black keeps the line visible on dark and light colours alike.
        cairo_set_source_rgba(cr, 1, 1, 1, 0.8);
        cairo_set_line_width(cr, 1.6 * pen.u);
        pen.solid();
        cairo_stroke_preserve(cr);
        pen.colour(ink);
        cairo_set_line_width(cr, 0.7 * pen.u);
        if (i > 0) pen.dash(2.5, 1.8);
        cairo_stroke(cr);
        pen.solid();
    }
}

void draw_mark(Pen& pen, const MapBox& box, const MapPlot& p) {
    if (!p.mark) return;
    cairo_t* cr = pen.cr;
    const double u = pen.u;
    const MapPoint m = project(p.projection, p.mark->theta_deg, p.mark->phi_deg);
    const double x = box.X(m.x), y = box.Y(m.y);
    cairo_new_sub_path(cr);
    cairo_arc(cr, x, y, 3.2 * u, 0, 2 * kPi);
    cairo_set_source_rgb(cr, 1, 1, 1);
    cairo_set_line_width(cr, 2.2 * u);
    cairo_stroke_preserve(cr);
    pen.colour(ink);
    cairo_set_line_width(cr, 1.0 * u);
    cairo_stroke(cr);
    pen.font(FontWeight::bold, 7.4);
    const bool left = x + 6 * u + pen.width(p.mark->label) > box.x1;
    const double tx = left ? x - 6 * u : x + 6 * u;
    pen.halo(p.mark->label, tx, y - 5 * u, left ? 1.0 : 0.0, false);
    pen.colour(ink);
    pen.text(p.mark->label, tx, y - 5 * u, left ? 1.0 : 0.0);
}

void draw_colour_bar(Pen& pen, double x0, double y0, double x1, double y1, const MapPlot& p) {
    cairo_t* cr = pen.cr;
    const double u = pen.u;
    const int n = 256;
    for (int k = 0; k < n; ++k) {
        const ColorRgb c = map_color(p.map, (k + 0.5) / n);
        cairo_set_source_rgb(cr, c.r, c.g, c.b);
        const double ya = y1 - (y1 - y0) * k / n, yb = y1 - (y1 - y0) * (k + 1) / n;
        cairo_rectangle(cr, x0, yb, x1 - x0, ya - yb + 0.3 * u);
        cairo_fill(cr);
    }
    pen.colour(ink_soft);
    cairo_set_line_width(cr, 0.6 * u);
    cairo_rectangle(cr, x0, y0, x1 - x0, y1 - y0);
    cairo_stroke(cr);
    auto Y = [&](double v) { return y1 - (y1 - y0) * (v - p.lo) / (p.hi - p.lo); };
    const std::vector<double> ticks = nice_ticks(p.lo, p.hi, 6);
    pen.font(FontWeight::regular, 7.0);
    pen.colour(ink);
    const int dec = ticks.size() > 1 && ticks[1] - ticks[0] < 1 ? 1 : 0;
    for (double t : ticks) {
        pen.line(x1, Y(t), x1 + 3 * u, Y(t));
        pen.text(num(t, dec), x1 + 5 * u, Y(t), 0.0, true);
    }
    // Contour levels: a black tick across the bar, in the contour's line style.
    for (std::size_t i = 0; i < p.contours.size(); ++i) {
        const double l = p.contours[i].level;
        if (l < p.lo || l > p.hi) continue;
        cairo_set_line_width(cr, 1.0 * u);
        if (i > 0) pen.dash(2.0, 1.2);
        pen.line(x0 - 3 * u, Y(l), x1, Y(l));
        pen.solid();
    }
    pen.font(FontWeight::regular, 7.8);
    cairo_save(cr);
    cairo_translate(cr, x1 + 34 * u, (y0 + y1) / 2);
    cairo_rotate(cr, -kPi / 2);
    pen.text(fit(pen, p.bar_label + " (" + p.unit + ")", y1 - y0, 6.0), 0, 0, 0.5);
    cairo_restore(cr);
}

}  // namespace

MapRaster map_raster(const MapPlot& p) {
    const double step = std::min(p.grid.theta.step_deg, p.grid.phi.step_deg);
    const int ppd = std::clamp(int(std::ceil(2 / step)), 1, 4);
    MapRaster r;
    r.width = 360 * ppd;
    r.height = 180 * ppd;
    r.argb.assign(std::size_t(r.width) * std::size_t(r.height), 0u);
    const MapBounds b = map_bounds(p.projection);
    for (int py = 0; py < r.height; ++py) {
        const double y = b.y_max - (py + 0.5) * (b.y_max - b.y_min) / r.height;
        for (int px = 0; px < r.width; ++px) {
            const double x = b.x_min + (px + 0.5) * (b.x_max - b.x_min) / r.width;
            const auto dir = unproject(p.projection, x, y);
            if (!dir) continue;
            const auto k = sample_of(p.grid, dir->first, dir->second);
            if (!k) continue;
            const double v = p.values[*k];
            r.argb[std::size_t(py) * std::size_t(r.width) + std::size_t(px)] =
                argb(map_color(p.map, std::isnan(v) ? v : colour_t(p, v)));
        }
    }
    return r;
}

void draw_map_plot(cairo_t* cr, const MapPlot& p, double w, double h) {
    cairo_save(cr);
    TitledPage page = begin_titled_page(cr, w, h, p.title, p.subtitle, p.notes, 10, 30);
    Pen& pen = page.pen;
    const double u = pen.u, m = page.m, top = page.top, bottom = page.bottom;
    const Footnotes& notes = page.notes;
    // The map keeps its 2:1 shape inside the space left of the colour bar.
    const double avail_w = w - 2 * m - 40 * u - 60 * u, avail_h = bottom - top;
    const double mw = std::min(avail_w, 2 * avail_h), mh = mw / 2;
    const double x0 = m + 40 * u + (avail_w - mw) / 2, y0 = top + (avail_h - mh) / 2;
    const MapBox box{x0, y0, x0 + mw, y0 + mh, map_bounds(p.projection)};
    cairo_save(cr);
    outline_path(cr, box, p.projection);
    cairo_clip(cr);
    hatch(pen, box);
    paint_cells(cr, box, p);
    draw_contours(pen, box, p);
    cairo_restore(cr);
    draw_graticule(pen, box, p.projection);
    draw_mark(pen, box, p);
    draw_colour_bar(pen, w - m - 48 * u, y0, w - m - 38 * u, y0 + mh, p);
    draw_footnotes(pen, notes, m, bottom + 30 * u);
    cairo_restore(cr);
}

std::string map_csv(const MapPlot& p) {
    std::string out = "theta_deg,phi_deg,azimuth_deg,elevation_deg,map_x,map_y," + p.quantity_key + "\n";
    const Grid& g = p.grid;
    for (int i = 0; i < g.theta.count; ++i)
        for (int j = 0; j < g.phi.count; ++j) {
            const double t = g.theta.value_deg(i), ph = g.phi.value_deg(j);
            const MapPoint mp = project(p.projection, t, ph);
            const MapPoint ae = project(MapProjection::azimuth_elevation, t, ph);
            for (double v : {t, ph, ae.x, ae.y, mp.x, mp.y}) {
                append_csv_number(out, v);
                out += ",";
            }
            append_csv_number(out, p.values[g.index(i, j)]);
            out += "\n";
        }
    return out;
}

}  // namespace ellipsa::exports
