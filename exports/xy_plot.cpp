#include "exports/xy_plot.hpp"

#include <algorithm>
#include <cmath>

#include "exports/palette.hpp"
#include "exports/plot_pen.hpp"

namespace ellipsa::exports {

std::vector<double> nice_ticks(double lo, double hi, int target) {
    std::vector<double> t;
    if (!(hi > lo) || !std::isfinite(lo) || !std::isfinite(hi)) return t;
    const double raw = (hi - lo) / std::max(1, target);
    const double p = std::pow(10.0, std::floor(std::log10(raw)));
    double step = p;
    for (double m : {1.0, 2.0, 5.0, 10.0})
        if (m * p >= raw * 0.999) {
            step = m * p;
            break;
        }
    // Whole multiples of the step (no accumulated rounding).
    for (long k = long(std::ceil(lo / step - 1e-9)); double(k) * step <= hi + 1e-9 * step; ++k) t.push_back(double(k) * step);
    return t;
}

std::vector<double> step_ticks(double lo, double hi, double step) {
    std::vector<double> t;
    if (!(hi > lo) || !(step > 0) || !std::isfinite(lo) || !std::isfinite(hi)) return t;
    for (long k = long(std::ceil(lo / step - 1e-9)); double(k) * step <= hi + 1e-9 * step; ++k) t.push_back(double(k) * step);
    return t;
}

namespace {

// Decimals that show a tick step exactly (0 for steps of 1 and more).
int decimals_for(const std::vector<double>& ticks) {
    if (ticks.size() < 2) return 1;
    const double step = ticks[1] - ticks[0];
    return std::clamp(int(std::ceil(-std::log10(step) - 1e-9)), 0, 6);
}

struct Range {
    double lo, hi;
};

// A log-y panel as a linear one in log10 units (draw_frame labels its decades).
XyPanel in_decades(const XyPanel& p) {
    XyPanel q = p;
    auto lg = [](double v) { return v > 0 ? std::log10(v) : NAN; };
    for (XySeries& s : q.series)
        for (double& v : s.y) v = lg(v);
    for (double& r : q.y_references) r = lg(r);
    if (q.y_min) q.y_min = lg(*q.y_min);
    if (q.y_max) q.y_max = lg(*q.y_max);
    return q;
}

Range y_range(const XyPanel& p) {
    double lo = INFINITY, hi = -INFINITY;
    for (const XySeries& s : p.series)
        for (double v : s.y)
            if (std::isfinite(v)) lo = std::min(lo, v), hi = std::max(hi, v);
    for (double r : p.y_references) lo = std::min(lo, r), hi = std::max(hi, r);
    if (!std::isfinite(lo)) lo = 0, hi = 1;
    if (hi - lo < 1e-9) lo -= 0.5, hi += 0.5;
    if (p.log_y) return {p.y_min.value_or(std::floor(lo + 1e-9)), p.y_max.value_or(std::ceil(hi - 1e-9))};
    const std::vector<double> t = nice_ticks(lo, hi);
    const double step = t.size() > 1 ? t[1] - t[0] : (hi - lo);
    lo = std::floor(lo / step + 1e-9) * step;
    hi = std::ceil(hi / step - 1e-9) * step;
    if (hi <= lo) hi = lo + step;
    return {p.y_min.value_or(lo), p.y_max.value_or(hi)};
}

Range x_range(const XyFigure& f) {
    double lo = INFINITY, hi = -INFINITY;
    for (const XyPanel& p : f.panels)
        for (const XySeries& s : p.series)
            for (double v : s.x)
                if (std::isfinite(v)) lo = std::min(lo, v), hi = std::max(hi, v);
    if (!std::isfinite(lo)) lo = 0, hi = 1;
    const double pad = hi > lo ? 0.04 * (hi - lo) : std::max(std::abs(lo) * 0.01, 1.0);
    return {f.x_min.value_or(lo - pad), f.x_max.value_or(hi + pad)};
}

struct Box {
    double x0, y0, x1, y1;
    Range xr, yr;
    double X(double x) const { return x0 + (x1 - x0) * (x - xr.lo) / (xr.hi - xr.lo); }
    double Y(double y) const { return y1 - (y1 - y0) * (y - yr.lo) / (yr.hi - yr.lo); }
};

// The dash pattern of curve_dash(index) at a line width.
void dash_as(Pen& pen, int index, double line_width) {
    const Dash d = curve_dash(std::size_t(index));
    double v[4];
    for (int k = 0; k < d.count; ++k) v[k] = d.d[k] * line_width;
    cairo_set_dash(pen.cr, d.count ? v : nullptr, d.count, 0);
}

// One series: thin lines between consecutive samples with values, then a marker at each sample.
void draw_series(Pen& pen, const Box& b, const XySeries& s) {
    cairo_t* cr = pen.cr;
    const double u = pen.u;
    if (s.lines) {
        bool down = false;
        for (std::size_t k = 0; k < s.x.size() && k < s.y.size(); ++k) {
            if (!std::isfinite(s.y[k]) || !std::isfinite(s.x[k])) {
                down = false;
                continue;
            }
            const double x = b.X(s.x[k]), y = b.Y(std::clamp(s.y[k], b.yr.lo, b.yr.hi));
            if (down)
                cairo_line_to(cr, x, y);
            else
                cairo_move_to(cr, x, y);
            down = true;
        }
        pen.curve_style(std::size_t(s.style), (s.points ? 0.9 : 1.5) * u * s.width);
        if (s.dash >= 0) dash_as(pen, s.dash, (s.points ? 0.9 : 1.5) * u * s.width);
        cairo_stroke(cr);
        pen.solid();
    }
    if (!s.points) return;
    for (std::size_t k = 0; k < s.x.size() && k < s.y.size(); ++k) {
        if (!std::isfinite(s.y[k]) || s.y[k] < b.yr.lo || s.y[k] > b.yr.hi) continue;
        cairo_new_sub_path(cr);
        cairo_arc(cr, b.X(s.x[k]), b.Y(s.y[k]), 2.1 * u, 0, 2 * kPi);
    }
    pen.colour(curve_colour(std::size_t(s.style)));
    cairo_fill_preserve(cr);
    pen.colour(ink);
    cairo_set_line_width(cr, 0.4 * u);
    cairo_stroke(cr);
}

// Frame, grid, y ticks and labels of one panel; x tick labels only when `x_labels`.
void draw_frame(Pen& pen, const Box& b, const XyFigure& f, const XyPanel& p, bool x_labels) {
    cairo_t* cr = pen.cr;
    const double u = pen.u;
    const std::vector<double> xt = f.x_tick_step ? step_ticks(b.xr.lo / f.x_scale, b.xr.hi / f.x_scale, *f.x_tick_step)
                                                 : nice_ticks(b.xr.lo / f.x_scale, b.xr.hi / f.x_scale, 6);
    std::vector<double> yt = p.y_tick_step ? step_ticks(b.yr.lo, b.yr.hi, *p.y_tick_step) : nice_ticks(b.yr.lo, b.yr.hi, 4);
    if (p.log_y) {
        yt.clear();
        for (double k = std::ceil(b.yr.lo - 1e-9); k <= b.yr.hi + 1e-9; ++k) yt.push_back(k);
    }
    cairo_set_line_width(cr, 0.5 * u);
    pen.colour(grid_major);
    for (double v : xt) pen.line(b.X(v * f.x_scale), b.y0, b.X(v * f.x_scale), b.y1);
    for (double v : yt) pen.line(b.x0, b.Y(v), b.x1, b.Y(v));
    pen.colour(ink_soft);
    cairo_set_line_width(cr, 0.8 * u);
    cairo_rectangle(cr, b.x0, b.y0, b.x1 - b.x0, b.y1 - b.y0);
    cairo_stroke(cr);
    pen.colour(ink);
    pen.font(FontWeight::regular, 7.4);
    const int yd = decimals_for(yt), xd = decimals_for(xt);
    for (double v : yt)
        pen.text(p.log_y ? num(std::pow(10.0, v), std::max(0, int(-v))) : num(v, yd), b.x0 - 4 * u, b.Y(v), 1.0, true);
    if (x_labels)
        for (double v : xt) pen.text(num(v, xd), b.X(v * f.x_scale), b.y1 + 11 * u, 0.5);
    // y label, rotated, left of the tick labels.
    pen.font(FontWeight::regular, 8.0);
    cairo_save(cr);
    cairo_translate(cr, b.x0 - 34 * u, (b.y0 + b.y1) / 2);
    cairo_rotate(cr, -kPi / 2);
    const std::string yl = p.y_unit.empty() ? p.y_label : p.y_label + " (" + p.y_unit + ")";
    pen.text(fit(pen, yl, b.y1 - b.y0, 6.0), 0, 0, 0.5);
    cairo_restore(cr);
}

// The legend above a panel: a sample line and the label per series, in as many rows as it
// takes (rows go up from the box). Returns the number of rows; draws only when `draw`.
int draw_legend(Pen& pen, const Box& b, const std::vector<XySeries>& series, bool draw) {
    const double u = pen.u, row_h = 11 * u;
    pen.font(FontWeight::regular, 7.2);
    // Lay out first (rows top-down), then draw with the last row just above the box.
    std::vector<std::pair<int, double>> at;  // (row, x) per series
    int row = 0;
    double x = b.x0;
    for (const XySeries& s : series) {
        if (s.label.empty()) {  // not in the legend
            at.emplace_back(-1, 0.0);
            continue;
        }
        const double wdt = 17 * u + std::min(pen.width(s.label), b.x1 - b.x0 - 30 * u) + 10 * u;
        if (x > b.x0 && x + wdt > b.x1) {
            ++row;
            x = b.x0;
        }
        at.emplace_back(row, x);
        x += wdt;
    }
    const int rows = series.empty() ? 0 : row + 1;
    if (!draw) return rows;
    for (std::size_t i = 0; i < series.size(); ++i) {
        if (at[i].first < 0) continue;
        const double y = b.y0 - 5 * u - row_h * double(rows - 1 - at[i].first), x0 = at[i].second;
        pen.curve_style(std::size_t(series[i].style), 1.4 * u);
        if (series[i].dash >= 0) dash_as(pen, series[i].dash, 1.4 * u);
        pen.line(x0, y - 2.5 * u, x0 + 14 * u, y - 2.5 * u);
        pen.solid();
        pen.colour(ink);
        pen.font(FontWeight::regular, 7.2);
        pen.text(fit(pen, series[i].label, b.x1 - b.x0 - 30 * u, 5.5), x0 + 17 * u, y);
    }
    return rows;
}

// References, markers and the panel's legend (above the box).
void draw_overlays(Pen& pen, const Box& b, const XyPanel& p) {
    cairo_t* cr = pen.cr;
    const double u = pen.u;
    cairo_set_line_width(cr, 0.7 * u);
    pen.colour(ink_soft);
    pen.dash(1.0, 1.6);
    for (double r : p.y_references)
        if (r >= b.yr.lo && r <= b.yr.hi) pen.line(b.x0, b.Y(r), b.x1, b.Y(r));
    pen.dash(3.0, 2.0);
    pen.font(FontWeight::regular, 6.6);
    for (const XyMarker& m : p.markers) {
        if (m.x < b.xr.lo || m.x > b.xr.hi) continue;
        pen.colour(ink_soft);
        pen.line(b.X(m.x), b.y0, b.X(m.x), b.y1);
        // The label beside the line, on the side with room.
        const bool left = b.X(m.x) + 2 * u + pen.width(m.label) > b.x1;
        pen.halo(m.label, b.X(m.x) + (left ? -2 : 2) * u, b.y0 + 8 * u, left ? 1.0 : 0.0, false);
        pen.colour(ink_soft);
        pen.text(m.label, b.X(m.x) + (left ? -2 : 2) * u, b.y0 + 8 * u, left ? 1.0 : 0.0);
    }
    pen.solid();
    draw_legend(pen, b, p.series, true);
}

}  // namespace

void draw_xy_figure(cairo_t* cr, const XyFigure& f, double w, double h) {
    cairo_save(cr);
    TitledPage page = begin_titled_page(cr, w, h, f.title, f.subtitle, f.notes, 6, 24);
    Pen& pen = page.pen;
    const double u = pen.u, m = page.m, top = page.top, bottom = page.bottom;
    const Footnotes& notes = page.notes;
    const std::size_t np = std::max<std::size_t>(1, f.panels.size());
    // Each panel's gap above it holds its legend rows.
    const Range xr = x_range(f);
    std::vector<double> gaps;
    double gap_sum = 0;
    for (const XyPanel& p : f.panels) {
        const Box probe{m + 46 * u, 0, w - m - 6 * u, 1, xr, {0, 1}};
        gaps.push_back(9 * u + 11 * u * double(std::max(1, draw_legend(pen, probe, p.series, false))));
        gap_sum += gaps.back();
    }
    const double ph = (bottom - top - gap_sum) / double(np);
    double y0 = top;
    for (std::size_t i = 0; i < f.panels.size(); ++i) {
        const XyPanel p = f.panels[i].log_y ? in_decades(f.panels[i]) : f.panels[i];
        y0 += gaps[i];
        const Box b{m + 46 * u, y0, w - m - 6 * u, y0 + ph, xr, y_range(p)};
        y0 += ph;
        draw_frame(pen, b, f, p, i + 1 == f.panels.size());
        cairo_save(cr);
        cairo_rectangle(cr, b.x0, b.y0 - 3 * u, b.x1 - b.x0, b.y1 - b.y0 + 6 * u);
        cairo_clip(cr);
        bool any = false;
        for (const XySeries& s : p.series) {
            draw_series(pen, b, s);
            for (double v : s.y) any = any || std::isfinite(v);
        }
        cairo_restore(cr);
        draw_overlays(pen, b, p);
        if (!any && !p.empty_text.empty()) {
            pen.colour(ink_soft);
            pen.font(FontWeight::regular, 7.6);
            pen.text(fit(pen, p.empty_text, b.x1 - b.x0 - 8 * u, 6.0), (b.x0 + b.x1) / 2, (b.y0 + b.y1) / 2, 0.5, true);
        }
    }
    pen.colour(ink);
    pen.font(FontWeight::regular, 8.0);
    pen.text(f.x_unit.empty() ? f.x_label : f.x_label + " (" + f.x_unit + ")", (m + 46 * u + w - m) / 2, bottom + 22 * u, 0.5);
    draw_footnotes(pen, notes, m, bottom + 34 * u);
    cairo_restore(cr);
}

}  // namespace ellipsa::exports
