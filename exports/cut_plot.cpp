#include "exports/cut_plot.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdio>

#include "exports/figure_text.hpp"
#include "exports/fonts.hpp"
#include "exports/palette.hpp"
#include "exports/plot_pen.hpp"

namespace ellipsa::exports {

bool parse_plot_style(std::string_view name, PlotStyle& out) {
    if (name == "polar") {
        out = PlotStyle::polar;
        return true;
    }
    if (name == "rect" || name == "rectangular") {
        out = PlotStyle::rect;
        return true;
    }
    return false;
}

DbScale plot_scale(const CutPlot& p) {
    if (p.top_db) return db_scale_at(*p.top_db, p.range_db);
    double hi = -INFINITY;
    for (const PlotCurve& c : p.curves)
        for (double v : c.value_db)
            if (std::isfinite(v)) hi = std::max(hi, v);
    return db_scale(hi, p.range_db);
}

std::vector<std::pair<double, double>> no_data_ranges(const CutPlot& p) {
    std::vector<std::pair<double, double>> out;
    if (p.curves.empty()) return out;
    const PlotCurve& c0 = p.curves[0];
    const std::size_t n = c0.angle_deg.size();
    if (n < 2) return out;
    for (const PlotCurve& c : p.curves)
        if (c.angle_deg.size() != n) return out;
    auto empty = [&](std::size_t k) {
        for (const PlotCurve& c : p.curves)
            if (!std::isnan(c.value_db[k])) return false;
        return true;
    };
    const double step = c0.angle_deg[1] - c0.angle_deg[0];
    std::size_t k = 0;
    while (k < n) {
        if (!empty(k)) {
            ++k;
            continue;
        }
        std::size_t j = k;
        while (j + 1 < n && empty(j + 1)) ++j;
        // The gap reaches half-way to the neighbouring samples that have data.
        out.emplace_back(c0.angle_deg[k] - (k > 0 ? step / 2 : 0), c0.angle_deg[j] + (j + 1 < n ? step / 2 : step));
        k = j + 1;
    }
    return out;
}

CutTable cut_table(const CutPlot& p) {
    CutTable t;
    t.header = {"curve", "peak", "at " + p.angle_symbol, "HPBW", "F/B", "side lobe"};
    for (const PlotCurve& c : p.curves) {
        if (!c.beam) {
            t.rows.push_back({c.label, "no power", "", "", "", ""});
            continue;
        }
        const BeamFigures& b = *c.beam;
        const double at = shown_cut_angle(b.peak_angle_deg, p.layout == AngleLayout::signed_half, angle_decimals);  // -180 is 180
        const std::string fb = b.front_to_back_db        ? num(*b.front_to_back_db, db_decimals) + " dB"
                               : b.front_to_back_above_db ? "> " + fixed(*b.front_to_back_above_db, 0) + " dB"
                                                          : std::string("n/a");
        t.rows.push_back({c.label, num(b.peak_db, db_decimals) + " " + c.unit, angle_text(at, angle_decimals),
                          beamwidth_cell(b), fb, b.sidelobe_db ? num(*b.sidelobe_db, db_decimals) + " dB" : "none"});
    }
    return t;
}

std::vector<std::string> cut_key_notes(const CutPlot& p) {
    std::vector<std::string> v;
    if (!p.axis_note.empty()) v.push_back(p.axis_note);
    v.push_back("Diamonds: each curve's peak, tagged with its name.");
    if (p.marked_curve >= 0 && std::size_t(p.marked_curve) < p.curves.size() && p.curves[std::size_t(p.marked_curve)].beam &&
        p.curves[std::size_t(p.marked_curve)].beam->hpbw_deg)
        v.push_back("Dots: the half-power (\u22123 dB) points of " + p.curves[std::size_t(p.marked_curve)].tag + ".");
    if (!no_data_ranges(p).empty()) v.push_back("Grey: " + std::string(not_measured_label) + " (outside the sampled region).");
    const DbScale sc = plot_scale(p);
    if (p.style == PlotStyle::polar)
        v.push_back("Radius: " + p.value_label + ", " + num(sc.floor_db(), 0) + " (centre) to " + num(sc.top_db, 0) + " (rim) " +
                    p.value_unit + "; " + num(sc.step_db, 0) + " dB per ring.");
    else
        v.push_back(p.value_label + " from " + num(sc.floor_db(), 0) + " to " + num(sc.top_db, 0) + " " + p.value_unit + "; " +
                    num(sc.step_db, 0) + " dB per line.");
    for (const std::string& n : p.notes) v.push_back(n);
    return v;
}

namespace {

constexpr Rgb no_data_grey{0.93, 0.93, 0.93};

// ---------------------------------------------------------------------------- table, notes ---
// The swatch of curve i: a short line in its style and its peak marker.
void draw_swatch(Pen& pen, std::size_t i, double x, double y);

// The table under the plot; returns its height.
double draw_table(Pen& pen, const CutPlot& p, double x0, double y0, double x1) {
    const double u = pen.u, row_h = 10.5 * u, swatch_w = 26 * u, pad = 9 * u;
    const CutTable t = cut_table(p);
    pen.font(FontWeight::regular, 7.6);
    std::vector<double> col_w(t.header.size(), 0);
    for (std::size_t c = 0; c < t.header.size(); ++c) {
        col_w[c] = pen.width(t.header[c]);
        for (const auto& r : t.rows) col_w[c] = std::max(col_w[c], pen.width(r[c]));
        col_w[c] += pad;
    }
    double numbers_w = 0;
    for (std::size_t c = 1; c < col_w.size(); ++c) numbers_w += col_w[c];
    col_w[0] = std::max(40 * u, std::min(col_w[0], x1 - x0 - swatch_w - numbers_w));  // the name gives way
    pen.colour(grid_major);
    cairo_set_line_width(pen.cr, 0.6 * u);
    pen.line(x0, y0, x1, y0);
    double y = y0 + row_h - 2.5 * u;
    for (int r = -1; r < int(t.rows.size()); ++r) {
        const std::vector<std::string>& cells = r < 0 ? t.header : t.rows[std::size_t(r)];
        double x = x0 + swatch_w;
        if (r >= 0) draw_swatch(pen, std::size_t(r), x0, y - 3 * u);
        for (std::size_t c = 0; c < cells.size(); ++c) {
            pen.colour(r < 0 ? ink_soft : ink);
            pen.font(r < 0 ? FontWeight::bold : FontWeight::regular, 7.6);
            if (c == 0) pen.text(fit(pen, cells[c], col_w[0] - pad, 6.2), x, y);
            else pen.text(cells[c], x + col_w[c] - pad / 2, y, 1.0);
            x += col_w[c];
        }
        if (r < 0) {
            pen.colour(grid_major);
            cairo_set_line_width(pen.cr, 0.4 * u);
            pen.line(x0, y + 3.5 * u, x1, y + 3.5 * u);
        }
        y += row_h;
    }
    return y - y0;
}

double table_height(const CutPlot& p, double u) { return (double(p.curves.size()) + 1) * 10.5 * u + 6 * u; }

// A curve's samples as (angle, fraction) with the loop closed.
template <class Emit>
void walk_curve(const PlotCurve& c, const DbScale& sc, Emit emit) {
    const std::size_t n = c.angle_deg.size();
    for (std::size_t k = 0; k <= n && n > 0; ++k) {
        const std::size_t j = k % n;
        const double a = c.angle_deg[j] + (k == n ? 360.0 : 0.0);
        const double v = c.value_db[j];
        if (std::isnan(v))
            emit(a, -1.0, false);
        else
            emit(a, sc.fraction(v), true);
    }
}


// ----------------------------------------------------------------------------------- polar ---
struct PolarGeom {
    double cx, cy, r;
    AngleLayout layout;
    void at(double a_deg, double frac, double& x, double& y) const {
        const double a = a_deg * kDeg, rr = r * frac;
        if (layout == AngleLayout::signed_half) {
            x = cx + rr * std::sin(a);
            y = cy - rr * std::cos(a);
        } else {
            x = cx + rr * std::cos(a);
            y = cy - rr * std::sin(a);
        }
    }
    // Unit direction on screen of an angle.
    void dir(double a_deg, double& dx, double& dy) const {
        at(a_deg, 1, dx, dy);
        dx = (dx - cx) / r;
        dy = (dy - cy) / r;
    }
};

// Interpolated fraction of a curve at an angle (for label placement); -1 when unknown.
double fraction_at(const PlotCurve& c, const DbScale& sc, double a_deg) {
    const std::size_t n = c.angle_deg.size();
    if (n < 2) return -1;
    const double step = c.angle_deg[1] - c.angle_deg[0];
    double t = (a_deg - c.angle_deg[0]) / step;
    t = std::fmod(t, double(n));
    if (t < 0) t += double(n);
    const std::size_t k = std::size_t(t) % n;
    const double v0 = c.value_db[k], v1 = c.value_db[(k + 1) % n];
    if (std::isnan(v0) || std::isnan(v1)) return -1;
    const double f = t - std::floor(t);
    return (1 - f) * sc.fraction(v0) + f * sc.fraction(v1);
}

// ------------------------------------------------------------------------------- marks ---
// A peak marker: a small diamond in the curve's colour with a dark edge.
void diamond(Pen& pen, std::size_t i, double x, double y) {
    const double d = 3.2 * pen.u;
    cairo_move_to(pen.cr, x, y - d);
    cairo_line_to(pen.cr, x + d, y);
    cairo_line_to(pen.cr, x, y + d);
    cairo_line_to(pen.cr, x - d, y);
    cairo_close_path(pen.cr);
    pen.colour(curve_colour(i));
    cairo_fill_preserve(pen.cr);
    pen.colour(ink);
    cairo_set_line_width(pen.cr, 0.6 * pen.u);
    cairo_stroke(pen.cr);
}

void draw_swatch(Pen& pen, std::size_t i, double x, double y) {
    pen.curve_style(i, 1.6 * pen.u);
    cairo_set_line_cap(pen.cr, CAIRO_LINE_CAP_BUTT);
    pen.line(x, y, x + 20 * pen.u, y);
    pen.solid();
    diamond(pen, i, x + 10 * pen.u, y);
}

// Tags placed so far (boxes), so that the next one moves clear of them.
struct Tags {
    std::vector<std::array<double, 4>> boxes;
    bool clear(double l, double t, double r, double b) const {
        for (const auto& k : boxes)
            if (l < k[2] && r > k[0] && t < k[3] && b > k[1]) return false;
        return true;
    }
    // Put `text` with its anchor at (x, y) (halign as Pen::text, vertically centred), moving by
    // (dx, dy) per try until it is clear of earlier tags.
    void place(Pen& pen, const std::string& text, double x, double y, double halign, double dx, double dy) {
        const double w = pen.width(text), h = 0.9 * pen.size;
        for (int k = 0; k < 6; ++k) {
            const double l = x - halign * w;
            if (clear(l, y - h / 2, l + w, y + h / 2)) break;
            x += dx, y += dy;
        }
        const double l = x - halign * w;
        boxes.push_back({l, y - h / 2, l + w, y + h / 2});
        pen.halo(text, x, y, halign, true);
        pen.colour(ink);
        pen.text(text, x, y, halign, true);
    }
};

// Each curve's peak: a diamond on the curve and its tag beside it. `at` maps (angle, fraction)
// to the page; `inward` gives the unit direction in which the tag moves off the marker.
template <class At, class Inward>
void draw_peak_tags(Pen& pen, const CutPlot& p, const DbScale& sc, At at, Inward inward) {
    Tags tags;
    pen.font(FontWeight::bold, 7.4);
    for (std::size_t i = 0; i < p.curves.size(); ++i) {
        const PlotCurve& c = p.curves[i];
        if (!c.beam) continue;
        double x, y, dx, dy;
        at(c.beam->peak_angle_deg, sc.fraction(c.beam->peak_db), x, y);
        diamond(pen, i, x, y);
        inward(c.beam->peak_angle_deg, dx, dy);
        const double gap = 7 * pen.u;
        const double halign = dx > 0.35 ? 0.0 : dx < -0.35 ? 1.0 : 0.5;
        pen.font(FontWeight::bold, 7.4);
        tags.place(pen, c.tag, x + dx * gap, y + dy * gap, halign, 0, 9 * pen.u);  // a colliding tag steps down a line
    }
}

// The -3 dB points of the marked curve: a dot at each crossing; `level` joins them (dashed).
template <class At, class Level>
void draw_half_power(Pen& pen, const CutPlot& p, const DbScale& sc, At at, Level level) {
    if (p.marked_curve < 0 || std::size_t(p.marked_curve) >= p.curves.size()) return;
    const PlotCurve& c = p.curves[std::size_t(p.marked_curve)];
    if (!c.beam || !c.beam->left_deg || !c.beam->right_deg) return;
    const double f = sc.fraction(c.beam->peak_db - half_power_db);
    const double a0 = *c.beam->left_deg, a1 = *c.beam->right_deg;
    pen.colour(ink);
    cairo_set_line_width(pen.cr, 0.7 * pen.u);
    pen.dash(2.5, 1.8);
    level(a0, a1, f);
    pen.solid();
    for (double a : {a0, a1}) {
        double x, y;
        at(a, f, x, y);
        cairo_new_sub_path(pen.cr);
        cairo_arc(pen.cr, x, y, 2.3 * pen.u, 0, 2 * kPi);
    }
    pen.colour(curve_colour(std::size_t(p.marked_curve)));
    cairo_fill_preserve(pen.cr);
    pen.colour(ink);
    cairo_set_line_width(pen.cr, 0.6 * pen.u);
    cairo_stroke(pen.cr);
}

// ----------------------------------------------------------------------------------- polar ---
void polar_no_data(Pen& pen, const CutPlot& p, const PolarGeom& g) {
    for (const auto& [a0, a1] : no_data_ranges(p)) {
        cairo_move_to(pen.cr, g.cx, g.cy);
        const int n = std::max(2, int(std::ceil(a1 - a0)));
        for (int k = 0; k <= n; ++k) {
            double x, y;
            g.at(a0 + (a1 - a0) * k / n, 1.0, x, y);
            cairo_line_to(pen.cr, x, y);
        }
        cairo_close_path(pen.cr);
    }
    pen.colour(no_data_grey);
    cairo_fill(pen.cr);
}

// Spokes every 10 deg (minor) and 30 deg (major), the rings, the rim with its ticks and the
// angle labels every 30 deg.
void polar_grid(Pen& pen, const CutPlot& p, const PolarGeom& g, const DbScale& sc) {
    cairo_t* cr = pen.cr;
    const double u = pen.u, r = g.r;
    cairo_set_line_cap(cr, CAIRO_LINE_CAP_BUTT);
    for (int a = 0; a < 360; a += 10) {
        double xa, ya, xb, yb;
        g.at(a, 0.0, xa, ya);
        g.at(a, 1.0, xb, yb);
        pen.colour(a % 30 == 0 ? grid_major : grid_minor);
        cairo_set_line_width(cr, (a % 30 == 0 ? 0.5 : 0.4) * u);
        pen.line(xa, ya, xb, yb);
    }
    const std::vector<double> rings = sc.rings();
    for (std::size_t i = 1; i < rings.size(); ++i) {
        cairo_new_sub_path(cr);
        cairo_arc(cr, g.cx, g.cy, r * sc.fraction(rings[i]), 0, 2 * kPi);
    }
    pen.colour(grid_major);
    cairo_stroke(cr);
    pen.colour(ink_soft);
    cairo_set_line_width(cr, 0.8 * u);
    cairo_new_sub_path(cr);
    cairo_arc(cr, g.cx, g.cy, r, 0, 2 * kPi);
    cairo_stroke(cr);
    cairo_set_line_width(cr, 0.5 * u);
    for (int a = 0; a < 360; a += 10) {
        double dx, dy;
        g.dir(a, dx, dy);
        const double len = (a % 30 == 0 ? 4.5 : 2.5) * u;
        pen.line(g.cx + dx * r, g.cy + dy * r, g.cx + dx * (r + len), g.cy + dy * (r + len));
    }
    pen.colour(ink);
    pen.font(FontWeight::regular, 7.8);
    for (int k = 0; k < 12; ++k) {
        double a = 30.0 * k;
        if (p.layout == AngleLayout::signed_half && a > 180) a -= 360;
        const std::string s = angle_text(a, 0);
        double dx, dy;
        g.dir(a, dx, dy);
        const double w = pen.width(s), h = 0.72 * pen.size;
        const double d = r + 7 * u + std::abs(dx) * w / 2 + std::abs(dy) * h / 2;
        pen.text(s, g.cx + dx * d, g.cy + dy * d, 0.5, true);
    }
}

// dB labels of the rings along the half-spoke where the curves come least far out.
void polar_ring_labels(Pen& pen, const CutPlot& p, const PolarGeom& g, const DbScale& sc) {
    double best_a = 15, best_f = 2;
    for (int k = 0; k < 12; ++k) {
        const double a = 15 + 30.0 * k;
        double f = 0;
        for (const PlotCurve& c : p.curves) f = std::max(f, fraction_at(c, sc, a));
        if (f < best_f - 1e-9) best_f = f, best_a = a;
    }
    const std::vector<double> rings = sc.rings();
    pen.font(FontWeight::regular, 7.2);
    for (std::size_t i = 1; i < rings.size(); ++i) {
        double x, y;
        g.at(best_a, sc.fraction(rings[i]), x, y);
        const std::string s = num(rings[i], 0) + (i == 1 ? " " + p.value_unit : "");
        pen.halo(s, x, y, 0.5, true);
        pen.colour(ink_soft);
        pen.text(s, x, y, 0.5, true);
    }
}

void polar_curves(Pen& pen, const CutPlot& p, const PolarGeom& g, const DbScale& sc) {
    cairo_set_line_join(pen.cr, CAIRO_LINE_JOIN_ROUND);
    cairo_set_line_cap(pen.cr, CAIRO_LINE_CAP_ROUND);
    for (std::size_t i = 0; i < p.curves.size(); ++i) {
        if (!p.curves[i].beam) continue;  // no power anywhere on the cut: nothing to draw (the table says so)
        bool pen_down = false;
        walk_curve(p.curves[i], sc, [&](double a, double f, bool ok) {
            if (!ok) {
                pen_down = false;
                return;
            }
            double x, y;
            g.at(a, f, x, y);
            if (pen_down) cairo_line_to(pen.cr, x, y);
            else cairo_move_to(pen.cr, x, y);
            pen_down = true;
        });
        pen.curve_style(i, 1.5 * pen.u);
        cairo_stroke(pen.cr);
    }
    pen.solid();
}

void draw_polar(Pen& pen, const CutPlot& p, double x0, double y0, double x1, double y1) {
    const double u = pen.u;
    const DbScale sc = plot_scale(p);
    const double bottom_caption = p.negative_side.empty() ? 4 * u : 14 * u;
    const double r = std::max(10.0, std::min(x1 - x0, y1 - y0 - bottom_caption) / 2 - 20 * u);
    const PolarGeom g{(x0 + x1) / 2, y0 + (y1 - y0 - bottom_caption) / 2, r, p.layout};
    polar_no_data(pen, p, g);
    polar_grid(pen, p, g, sc);
    polar_curves(pen, p, g, sc);
    auto at = [&](double a, double f, double& x, double& y) { g.at(a, f, x, y); };
    draw_half_power(pen, p, sc, at, [&](double a0, double a1, double f) {
        const int n = std::max(2, int(std::ceil(a1 - a0)));
        for (int k = 0; k <= n; ++k) {
            double x, y;
            g.at(a0 + (a1 - a0) * k / n, f, x, y);
            if (k == 0) cairo_move_to(pen.cr, x, y);
            else cairo_line_to(pen.cr, x, y);
        }
        cairo_stroke(pen.cr);
    });
    polar_ring_labels(pen, p, g, sc);
    // Tags toward the centre, inside the lobe they name.
    draw_peak_tags(pen, p, sc, at, [&](double a, double& dx, double& dy) {
        g.dir(a, dx, dy);
        dx = -dx, dy = -dy;
    });
    pen.font(FontWeight::regular, 7.6);
    pen.colour(ink_soft);
    if (!p.negative_side.empty()) {
        pen.text("\u2190 " + p.negative_side, g.cx - r, y1 - 2 * u, 0.0);
        pen.text(p.positive_side + " \u2192", g.cx + r, y1 - 2 * u, 1.0);
    }
}

// ------------------------------------------------------------------------------ rectangular ---
struct RectGeom {
    double bx0, bx1, by0, by1, a_min, a_max;
    double X(double a) const { return bx0 + (bx1 - bx0) * (a - a_min) / (a_max - a_min); }
    double Y(double f) const { return by1 - (by1 - by0) * f; }
    double wrap(double a) const {
        while (a >= a_max) a -= 360;
        while (a < a_min) a += 360;
        return a;
    }
};

void rect_grid(Pen& pen, const CutPlot& p, const RectGeom& g, const DbScale& sc) {
    cairo_t* cr = pen.cr;
    const double u = pen.u;
    cairo_set_line_cap(cr, CAIRO_LINE_CAP_BUTT);
    for (auto [a0, a1] : no_data_ranges(p)) {
        const double span = a1 - a0;
        a0 = g.wrap(a0), a1 = a0 + span;
        cairo_rectangle(cr, g.X(a0), g.by0, g.X(std::min(a1, g.a_max)) - g.X(a0), g.by1 - g.by0);
        if (a1 > g.a_max) cairo_rectangle(cr, g.X(g.a_min), g.by0, g.X(a1 - 360) - g.X(g.a_min), g.by1 - g.by0);
    }
    pen.colour(no_data_grey);
    cairo_fill(cr);
    for (double a = g.a_min + 10; a < g.a_max; a += 10) {
        const bool major = std::fmod(a - g.a_min, 30) == 0;
        pen.colour(major ? grid_major : grid_minor);
        cairo_set_line_width(cr, (major ? 0.5 : 0.4) * u);
        pen.line(g.X(a), g.by0, g.X(a), g.by1);
    }
    std::vector<double> lines = sc.rings();
    lines.push_back(sc.floor_db());
    for (double v : lines) pen.line(g.bx0, g.Y(sc.fraction(v)), g.bx1, g.Y(sc.fraction(v)));
    pen.colour(ink_soft);
    cairo_set_line_width(cr, 0.8 * u);
    cairo_rectangle(cr, g.bx0, g.by0, g.bx1 - g.bx0, g.by1 - g.by0);
    cairo_stroke(cr);
    cairo_set_line_width(cr, 0.5 * u);
    for (double a = g.a_min; a <= g.a_max + 1e-9; a += 10)
        pen.line(g.X(a), g.by1, g.X(a), g.by1 + (std::fmod(a - g.a_min, 30) == 0 ? 4 : 2) * u);
    for (double v : lines) pen.line(g.bx0 - 4 * u, g.Y(sc.fraction(v)), g.bx0, g.Y(sc.fraction(v)));
    pen.colour(ink);
    pen.font(FontWeight::regular, 7.8);
    const double label_every = pen.width("\u2212180°") * 1.35 > (g.X(30) - g.X(0)) ? 60 : 30;
    for (double a = g.a_min; a <= g.a_max + 1e-9; a += label_every) pen.text(angle_text(a, 0), g.X(a), g.by1 + 13 * u, 0.5);
    for (double v : lines) pen.text(num(v, 0), g.bx0 - 6 * u, g.Y(sc.fraction(v)), 1.0, true);
}

void rect_axis_titles(Pen& pen, const CutPlot& p, const RectGeom& g, double x0) {
    const double u = pen.u;
    pen.font(FontWeight::regular, 8.4);
    pen.colour(ink);
    pen.text(p.angle_symbol + " (deg)", (g.bx0 + g.bx1) / 2, g.by1 + 25 * u, 0.5);
    cairo_save(pen.cr);
    cairo_move_to(pen.cr, 0, 0);
    cairo_translate(pen.cr, x0 + 8 * u, (g.by0 + g.by1) / 2);
    cairo_rotate(pen.cr, -kPi / 2);
    pen.text(p.value_label + " (" + p.value_unit + ")", 0, 0, 0.5);
    cairo_restore(pen.cr);
    if (!p.negative_side.empty()) {
        pen.font(FontWeight::regular, 7.6);
        pen.colour(ink_soft);
        pen.text("\u2190 " + p.negative_side, g.X(g.a_min), g.by1 + 36 * u, 0.0);
        pen.text(p.positive_side + " \u2192", g.X(g.a_max), g.by1 + 36 * u, 1.0);
    }
}

// Curves (angles wrapped into the axis range; a jump back starts a new piece).
void rect_curves(Pen& pen, const CutPlot& p, const RectGeom& g, const DbScale& sc) {
    cairo_t* cr = pen.cr;
    cairo_save(cr);
    cairo_rectangle(cr, g.bx0, g.by0 - 2 * pen.u, g.bx1 - g.bx0, g.by1 - g.by0 + 4 * pen.u);
    cairo_clip(cr);
    cairo_set_line_join(cr, CAIRO_LINE_JOIN_ROUND);
    cairo_set_line_cap(cr, CAIRO_LINE_CAP_ROUND);
    for (std::size_t i = 0; i < p.curves.size(); ++i) {
        if (!p.curves[i].beam) continue;  // no power anywhere on the cut: nothing to draw (the table says so)
        bool pen_down = false;
        double last_a = -1e300;
        walk_curve(p.curves[i], sc, [&](double a, double f, bool ok) {
            if (!ok) {
                pen_down = false;
                return;
            }
            double aw = a;
            while (aw > g.a_max + 1e-9) aw -= 360;
            while (aw < g.a_min - 1e-9) aw += 360;
            if (aw < last_a) pen_down = false;
            last_a = aw;
            if (pen_down) cairo_line_to(cr, g.X(aw), g.Y(f));
            else cairo_move_to(cr, g.X(aw), g.Y(f));
            pen_down = true;
        });
        pen.curve_style(i, 1.5 * pen.u);
        cairo_stroke(cr);
    }
    pen.solid();
    cairo_restore(cr);
}

void draw_rect(Pen& pen, const CutPlot& p, double x0, double y0, double x1, double y1) {
    const double u = pen.u;
    const DbScale sc = plot_scale(p);
    const double a_min = p.layout == AngleLayout::signed_half ? -180 : 0;
    const RectGeom g{x0 + 40 * u, x1 - 14 * u, y0 + 10 * u, y1 - (p.negative_side.empty() ? 30 : 40) * u, a_min, a_min + 360};
    rect_grid(pen, p, g, sc);
    rect_axis_titles(pen, p, g, x0);
    rect_curves(pen, p, g, sc);
    auto at = [&](double a, double f, double& x, double& y) { x = g.X(g.wrap(a)), y = g.Y(f); };
    draw_half_power(pen, p, sc, at, [&](double a0, double a1, double f) {
        const double l = g.wrap(a0), r = g.wrap(a1);
        if (l <= r) {
            pen.line(g.X(l), g.Y(f), g.X(r), g.Y(f));
        } else {  // the beam straddles the ends of the axis
            pen.line(g.X(l), g.Y(f), g.X(g.a_max), g.Y(f));
            pen.line(g.X(g.a_min), g.Y(f), g.X(r), g.Y(f));
        }
    });
    // Tags below their peak (the top of the frame is near), right of it near the left edge.
    draw_peak_tags(pen, p, sc, at, [&](double a, double& dx, double& dy) {
        const double x = (g.X(g.wrap(a)) - g.bx0) / (g.bx1 - g.bx0);
        dx = x < 0.15 ? 0.7 : x > 0.85 ? -0.7 : 0;
        dy = 0.7;
    });
}

}  // namespace

void draw_cut_plot(cairo_t* cr, const CutPlot& p, double w, double h) {
    cairo_save(cr);
    Pen pen = begin_page(cr, w, h);
    const double u = pen.u, m = 16 * u;
    const double top = draw_header(pen, p.title, p.subtitle, w, m) + 4 * u;
    const double table_h = std::min(table_height(p, u), 0.4 * (h - top));
    const std::vector<std::string> notes = cut_key_notes(p);
    if (p.style == PlotStyle::polar) {
        // Small print in a column beside the circle, the table under both.
        const double side_w = std::clamp(0.3 * w, 120 * u, 210 * u);
        draw_polar(pen, p, m, top, w - m - side_w, h - m - table_h);
        const Footnotes fn = wrap_footnotes(pen, notes, side_w);
        draw_footnotes(pen, fn, w - m - side_w, std::max(top + 10 * u, h - m - table_h - fn.height));
    } else {
        const Footnotes fn = wrap_footnotes(pen, notes, w - 2 * m);
        draw_rect(pen, p, m, top, w - m, h - m - table_h - fn.height - 4 * u);
        draw_footnotes(pen, fn, m, h - m - fn.height + 6 * u);
    }
    const Footnotes under = p.style == PlotStyle::polar ? Footnotes{} : wrap_footnotes(pen, notes, w - 2 * m);
    cairo_save(cr);
    cairo_rectangle(cr, 0, 0, w, h - m - under.height + 2 * u);
    cairo_clip(cr);
    draw_table(pen, p, m, h - m - table_h - under.height, w - m);
    cairo_restore(cr);
    cairo_restore(cr);
}

}  // namespace ellipsa::exports
