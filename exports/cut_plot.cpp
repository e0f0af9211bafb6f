#include "exports/cut_plot.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

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

namespace {

// The peak readout of a curve, "2.15 dBi at θ = 90.0°".
std::string peak_text(const CutPlot& p, const PlotCurve& c) {
    if (!c.beam) return "no power on this cut";
    return "peak " + num(c.beam->peak_db, 2) + " " + c.unit + " at " + p.angle_symbol + " = " +
           angle_text(c.beam->peak_angle_deg, 1);
}
std::string beam_text(const PlotCurve& c) {
    if (!c.beam) return "";
    const BeamFigures& b = *c.beam;
    std::string s = "HPBW " + (b.hpbw_deg                            ? angle_text(*b.hpbw_deg, 1)
                               : b.shape == BeamShape::omnidirectional ? std::string("none (omnidirectional)")
                                                                       : std::string("none"));
    // Beyond null_ratio_bound_db the back is a null, not a measurable level (the core decides).
    const auto& fb = b.front_to_back_db;
    s += "   F/B " + (b.front_to_back_above_db ? "> " + num(*b.front_to_back_above_db, 0) + " dB"
                      : !fb                    ? std::string("n/a")
                                               : num(*fb, 1) + " dB");
    return s;
}

// Angle ranges [a0, a1] where no curve has data (outside the sampled region), from the first
// curve's samples (all curves of one cut share them; overlays with other steps are skipped).
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
constexpr Rgb no_data_grey{0.93, 0.93, 0.93};

// ---------------------------------------------------------------------------------- legend ---
void draw_legend(Pen& pen, const CutPlot& p, double x0, double y0, double x1, double y1) {
    const double u = pen.u;
    double y = y0 + 12 * u;
    // Many curves: one readout line per curve instead of two.
    const bool compact = p.curves.size() > 5;
    const double text_w = x1 - x0 - 30 * u;
    for (std::size_t i = 0; i < p.curves.size(); ++i) {
        const PlotCurve& c = p.curves[i];
        pen.curve_style(i, 1.6 * u);
        cairo_set_line_cap(pen.cr, CAIRO_LINE_CAP_BUTT);
        pen.line(x0, y - 3 * u, x0 + 24 * u, y - 3 * u);
        pen.solid();
        pen.colour(ink);
        pen.font(FontWeight::bold, compact ? 8.2 : 8.8);
        pen.text(fit(pen, c.label, text_w, 6.5), x0 + 30 * u, y);
        pen.colour(ink_soft);
        pen.font(FontWeight::regular, compact ? 7.0 : 7.6);
        const std::string b = beam_text(c);
        if (compact) {
            std::string line = c.beam ? num(c.beam->peak_db, 2) + " " + c.unit + " at " + angle_text(c.beam->peak_angle_deg, 1)
                                      : peak_text(p, c);
            if (!b.empty()) line += "  " + b;
            pen.text(fit(pen, line, text_w, 6.2), x0 + 30 * u, y + 9.5 * u);
            y += 24 * u;
        } else {
            pen.text(fit(pen, peak_text(p, c), text_w, 6.0), x0 + 30 * u, y + 10.5 * u);
            if (!b.empty()) pen.text(b, x0 + 30 * u, y + 20 * u);
            y += (b.empty() ? 26 : 35) * u;
        }
        if (y > y1) return;
    }
    // Marker key and small print.
    y += 2 * u;
    pen.font(FontWeight::regular, 7.0);
    const double wrap_w = x1 - x0;
    std::vector<std::string> lines;
    if (p.marked_curve >= 0 && std::size_t(p.marked_curve) < p.curves.size() && p.curves[std::size_t(p.marked_curve)].beam &&
        p.curves[std::size_t(p.marked_curve)].beam->hpbw_deg)
        for (auto& l : wrap(pen, "Dots and dashed line: the −3 dB (half-power) points of " +
                                     p.curves[std::size_t(p.marked_curve)].label + ".", wrap_w))
            lines.push_back(l);
    if (!no_data_ranges(p).empty())
        for (auto& l : wrap(pen, "Grey: outside the sampled region (no data).", wrap_w)) lines.push_back(l);
    if (p.style == PlotStyle::polar) {
        const DbScale sc = plot_scale(p);
        for (auto& l : wrap(pen, "Radius: " + p.value_label + ", " + num(sc.floor_db(), 0) + " (centre) to " + num(sc.top_db, 0) +
                                     " (rim) " + p.value_unit + "; " + num(sc.step_db, 0) + " dB per ring.",
                            wrap_w))
            lines.push_back(l);
    }
    for (const std::string& n : p.notes)
        for (auto& l : wrap(pen, n, wrap_w)) lines.push_back(l);
    // Put the small print at the bottom of the panel when there is room, else right below.
    const double line_h = 9 * u;
    double ys = std::max(y + 4 * u, y1 - line_h * double(lines.size()));
    pen.colour(ink_soft);
    for (const std::string& l : lines) {
        if (ys > y1 + 2 * u) break;
        pen.text(l, x0, ys);
        ys += line_h;
    }
}

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

void draw_polar(Pen& pen, const CutPlot& p, double x0, double y0, double x1, double y1) {
    cairo_t* cr = pen.cr;
    const double u = pen.u;
    const DbScale sc = plot_scale(p);
    const double bottom_caption = p.negative_side.empty() ? 10 * u : 14 * u;
    const double margin = 24 * u;
    const double r = std::max(10.0, std::min(x1 - x0, y1 - y0 - bottom_caption) / 2 - margin);
    const PolarGeom g{(x0 + x1) / 2, y0 + (y1 - y0 - bottom_caption) / 2, r, p.layout};

    // Outside the sampled region: light grey wedges.
    for (const auto& [a0, a1] : no_data_ranges(p)) {
        cairo_move_to(cr, g.cx, g.cy);
        const int n = std::max(2, int(std::ceil(a1 - a0)));
        for (int k = 0; k <= n; ++k) {
            double x, y;
            g.at(a0 + (a1 - a0) * k / n, 1.0, x, y);
            cairo_line_to(cr, x, y);
        }
        cairo_close_path(cr);
    }
    pen.colour(no_data_grey);
    cairo_fill(cr);

    // Minor spokes every 10 deg (outer part only), major every 30 deg, rings every `step` dB.
    cairo_set_line_cap(cr, CAIRO_LINE_CAP_BUTT);
    cairo_set_line_width(cr, 0.4 * u);
    pen.colour(grid_minor);
    for (int a = 0; a < 360; a += 10) {
        if (a % 30 == 0) continue;
        double xa, ya, xb, yb;
        g.at(a, 0.0, xa, ya);
        g.at(a, 1.0, xb, yb);
        pen.line(xa, ya, xb, yb);
    }
    pen.colour(grid_major);
    cairo_set_line_width(cr, 0.5 * u);
    for (int a = 0; a < 360; a += 30) {
        double xb, yb;
        g.at(a, 1.0, xb, yb);
        pen.line(g.cx, g.cy, xb, yb);
    }
    // Rings at whole multiples of the grid step; the rim is the top of the scale.
    const std::vector<double> rings = sc.rings();
    for (std::size_t i = 1; i < rings.size(); ++i) {
        cairo_new_sub_path(cr);
        cairo_arc(cr, g.cx, g.cy, r * sc.fraction(rings[i]), 0, 2 * kPi);
    }
    cairo_stroke(cr);
    // Rim: a darker circle with 10-degree ticks outside it.
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
    // Angle labels every 30 deg.
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

    // Curves.
    cairo_set_line_join(cr, CAIRO_LINE_JOIN_ROUND);
    cairo_set_line_cap(cr, CAIRO_LINE_CAP_ROUND);
    for (std::size_t i = 0; i < p.curves.size(); ++i) {
        if (!p.curves[i].beam) continue;  // no power anywhere on the cut: nothing to draw (the legend says so)
        bool pen_down = false;
        walk_curve(p.curves[i], sc, [&](double a, double f, bool ok) {
            if (!ok) {
                pen_down = false;
                return;
            }
            double x, y;
            g.at(a, f, x, y);
            if (pen_down)
                cairo_line_to(cr, x, y);
            else
                cairo_move_to(cr, x, y);
            pen_down = true;
        });
        pen.curve_style(i, 1.5 * u);
        cairo_stroke(cr);
    }
    pen.solid();

    // -3 dB markers of the marked curve: a dashed arc at the half-power level between the two
    // crossings, and a dot at each crossing.
    if (p.marked_curve >= 0 && std::size_t(p.marked_curve) < p.curves.size()) {
        const PlotCurve& c = p.curves[std::size_t(p.marked_curve)];
        if (c.beam && c.beam->left_deg && c.beam->right_deg) {
            const double f = sc.fraction(c.beam->peak_db - 10 * std::log10(2.0));
            const double a0 = *c.beam->left_deg, a1 = *c.beam->right_deg;
            const int n = std::max(2, int(std::ceil((a1 - a0) / 1.0)));
            for (int k = 0; k <= n; ++k) {
                double x, y;
                g.at(a0 + (a1 - a0) * k / n, f, x, y);
                if (k == 0)
                    cairo_move_to(cr, x, y);
                else
                    cairo_line_to(cr, x, y);
            }
            pen.colour(ink);
            cairo_set_line_width(cr, 0.7 * u);
            pen.dash(2.5, 1.8);
            cairo_stroke(cr);
            pen.solid();
            for (double a : {a0, a1}) {
                double x, y;
                g.at(a, f, x, y);
                cairo_new_sub_path(cr);
                cairo_arc(cr, x, y, 2.3 * u, 0, 2 * kPi);
            }
            pen.colour(curve_colour(std::size_t(p.marked_curve)));
            cairo_fill_preserve(cr);
            pen.colour(ink);
            cairo_set_line_width(cr, 0.6 * u);
            cairo_stroke(cr);
        }
    }

    // dB labels along the spoke (between major spokes) where the curves come least far out.
    double best_a = 15, best_f = 2;
    for (int k = 0; k < 12; ++k) {
        const double a = 15 + 30.0 * k;
        double f = 0;
        for (const PlotCurve& c : p.curves) f = std::max(f, fraction_at(c, sc, a));
        if (f < best_f - 1e-9) {
            best_f = f;
            best_a = a;
        }
    }
    // The rim's value is in the legend's scale note; the rings carry theirs, the outermost with the unit.
    pen.font(FontWeight::regular, 7.2);
    for (std::size_t i = 1; i < rings.size(); ++i) {
        double x, y;
        g.at(best_a, sc.fraction(rings[i]), x, y);
        const std::string s = num(rings[i], 0) + (i == 1 ? " " + p.value_unit : "");
        pen.halo(s, x, y, 0.5, true);
        pen.colour(ink_soft);
        pen.text(s, x, y, 0.5, true);
    }

    // Captions under the circle.
    pen.font(FontWeight::regular, 7.6);
    pen.colour(ink_soft);
    const double yc = y1 - 2 * u;
    if (!p.negative_side.empty()) {
        pen.text("\u2190 " + p.negative_side, g.cx - r, yc, 0.0);
        pen.text(p.positive_side + " \u2192", g.cx + r, yc, 1.0);
    }

}

// ------------------------------------------------------------------------------ rectangular ---
void draw_rect(Pen& pen, const CutPlot& p, double x0, double y0, double x1, double y1) {
    cairo_t* cr = pen.cr;
    const double u = pen.u;
    const DbScale sc = plot_scale(p);
    const double a_min = p.layout == AngleLayout::signed_half ? -180 : 0, a_max = a_min + 360;
    const double bx0 = x0 + 40 * u, bx1 = x1 - 14 * u, by0 = y0 + 10 * u;
    const double by1 = y1 - (p.negative_side.empty() ? 30 : 40) * u;
    auto X = [&](double a) { return bx0 + (bx1 - bx0) * (a - a_min) / (a_max - a_min); };
    auto Y = [&](double f) { return by1 - (by1 - by0) * f; };

    cairo_set_line_cap(cr, CAIRO_LINE_CAP_BUTT);
    // Outside the sampled region: light grey bands.
    for (auto [a0, a1] : no_data_ranges(p)) {
        while (a0 >= a_max) a0 -= 360, a1 -= 360;
        while (a0 < a_min) a0 += 360, a1 += 360;
        cairo_rectangle(cr, X(a0), by0, X(std::min(a1, a_max)) - X(a0), by1 - by0);
        if (a1 > a_max) cairo_rectangle(cr, X(a_min), by0, X(a1 - 360) - X(a_min), by1 - by0);
    }
    pen.colour(no_data_grey);
    cairo_fill(cr);
    // Grid.
    cairo_set_line_width(cr, 0.4 * u);
    pen.colour(grid_minor);
    for (double a = a_min + 10; a < a_max; a += 10)
        if (std::fmod(a - a_min, 30) != 0) pen.line(X(a), by0, X(a), by1);
    pen.colour(grid_major);
    cairo_set_line_width(cr, 0.5 * u);
    for (double a = a_min + 30; a < a_max; a += 30) pen.line(X(a), by0, X(a), by1);
    std::vector<double> rings = sc.rings();
    rings.push_back(sc.floor_db());  // the bottom of the frame
    for (double v : rings) pen.line(bx0, Y(sc.fraction(v)), bx1, Y(sc.fraction(v)));
    // Frame and ticks.
    pen.colour(ink_soft);
    cairo_set_line_width(cr, 0.8 * u);
    cairo_rectangle(cr, bx0, by0, bx1 - bx0, by1 - by0);
    cairo_stroke(cr);
    cairo_set_line_width(cr, 0.5 * u);
    for (double a = a_min; a <= a_max + 1e-9; a += 10) pen.line(X(a), by1, X(a), by1 + (std::fmod(a - a_min, 30) == 0 ? 4 : 2) * u);
    for (double v : rings) pen.line(bx0 - 4 * u, Y(sc.fraction(v)), bx0, Y(sc.fraction(v)));
    // Labels.
    pen.colour(ink);
    pen.font(FontWeight::regular, 7.8);
    const double label_every = pen.width("\u2212180°") * 1.35 > (X(30) - X(0)) ? 60 : 30;
    for (double a = a_min; a <= a_max + 1e-9; a += label_every) pen.text(angle_text(a, 0), X(a), by1 + 13 * u, 0.5);
    for (double v : rings) pen.text(num(v, 0), bx0 - 6 * u, Y(sc.fraction(v)), 1.0, true);
    pen.font(FontWeight::regular, 8.4);
    pen.text(p.angle_symbol + " (deg)", (bx0 + bx1) / 2, by1 + 25 * u, 0.5);
    cairo_save(cr);
    cairo_move_to(cr, 0, 0);
    cairo_translate(cr, x0 + 8 * u, (by0 + by1) / 2);
    cairo_rotate(cr, -kPi / 2);
    pen.text(p.value_label + " (" + p.value_unit + ")", 0, 0, 0.5);
    cairo_restore(cr);
    if (!p.negative_side.empty()) {
        pen.font(FontWeight::regular, 7.6);
        pen.colour(ink_soft);
        pen.text("\u2190 " + p.negative_side, X(a_min), by1 + 36 * u, 0.0);
        pen.text(p.positive_side + " \u2192", X(a_max), by1 + 36 * u, 1.0);
    }

    // Curves (angles wrapped into the axis range; a jump back starts a new piece).
    cairo_save(cr);
    cairo_rectangle(cr, bx0, by0 - 2 * u, bx1 - bx0, by1 - by0 + 4 * u);
    cairo_clip(cr);
    cairo_set_line_join(cr, CAIRO_LINE_JOIN_ROUND);
    cairo_set_line_cap(cr, CAIRO_LINE_CAP_ROUND);
    for (std::size_t i = 0; i < p.curves.size(); ++i) {
        if (!p.curves[i].beam) continue;  // no power anywhere on the cut: nothing to draw (the legend says so)
        bool pen_down = false;
        double last_a = -1e300;
        walk_curve(p.curves[i], sc, [&](double a, double f, bool ok) {
            if (!ok) {
                pen_down = false;
                return;
            }
            double aw = a;
            while (aw > a_max + 1e-9) aw -= 360;
            while (aw < a_min - 1e-9) aw += 360;
            if (aw < last_a) pen_down = false;
            last_a = aw;
            if (pen_down)
                cairo_line_to(cr, X(aw), Y(f));
            else
                cairo_move_to(cr, X(aw), Y(f));
            pen_down = true;
        });
        pen.curve_style(i, 1.5 * u);
        cairo_stroke(cr);
    }
    pen.solid();
    cairo_restore(cr);

    // -3 dB markers: dashed level line between the crossings, dashed verticals, dots.
    if (p.marked_curve >= 0 && std::size_t(p.marked_curve) < p.curves.size()) {
        const PlotCurve& c = p.curves[std::size_t(p.marked_curve)];
        if (c.beam && c.beam->left_deg && c.beam->right_deg) {
            const double f = sc.fraction(c.beam->peak_db - 10 * std::log10(2.0));
            auto wrap_a = [&](double a) {
                while (a >= a_max) a -= 360;
                while (a < a_min) a += 360;
                return a;
            };
            const double l = wrap_a(*c.beam->left_deg), rr = wrap_a(*c.beam->right_deg);
            pen.colour(ink);
            cairo_set_line_width(cr, 0.7 * u);
            pen.dash(2.5, 1.8);
            if (l <= rr) {
                pen.line(X(l), Y(f), X(rr), Y(f));
            } else {  // the beam straddles the ends of the axis
                pen.line(X(l), Y(f), X(a_max), Y(f));
                pen.line(X(a_min), Y(f), X(rr), Y(f));
            }
            cairo_set_line_width(cr, 0.5 * u);
            pen.dash(1.2, 1.8);
            pen.line(X(l), Y(f), X(l), by1);
            pen.line(X(rr), Y(f), X(rr), by1);
            pen.solid();
            for (double a : {l, rr}) {
                cairo_new_sub_path(cr);
                cairo_arc(cr, X(a), Y(f), 2.3 * u, 0, 2 * kPi);
            }
            pen.colour(curve_colour(std::size_t(p.marked_curve)));
            cairo_fill_preserve(cr);
            pen.colour(ink);
            cairo_set_line_width(cr, 0.6 * u);
            cairo_stroke(cr);
        }
    }
}

}  // namespace

void draw_cut_plot(cairo_t* cr, const CutPlot& p, double w, double h) {
    cairo_save(cr);
    Pen pen = begin_page(cr, w, h);
    const double u = pen.u, m = 16 * u;

    const double header = draw_header(pen, p.title, p.subtitle, w, m);
    const double legend_w = std::clamp(0.33 * w, 150 * u, 230 * u);
    const double lx0 = w - m - legend_w;
    if (p.style == PlotStyle::polar)
        draw_polar(pen, p, m, header + 4 * u, lx0 - 8 * u, h - m);
    else
        draw_rect(pen, p, m, header + 4 * u, lx0 - 8 * u, h - m);
    draw_legend(pen, p, lx0 + 4 * u, header + 8 * u, w - m, h - m);
    cairo_restore(cr);
}

}  // namespace ellipsa::exports
