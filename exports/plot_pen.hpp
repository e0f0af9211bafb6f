// The drawing kit shared by every figure the exports draw (cut plots, plots against frequency,
// coverage curves, maps): a pen that scales with the figure, numbers with a typographic minus,
// text that fits its box, word wrap and the title block. One look for every figure.
#pragma once
#include <string>
#include <vector>

#include <cairo.h>

#include "exports/fonts.hpp"
#include "exports/palette.hpp"

namespace ellipsa::exports {

inline constexpr double kPi = 3.14159265358979323846;
inline constexpr double kDeg = kPi / 180;

// A number with `decimals` decimals, a typographic minus sign and no "-0".
std::string num(double v, int decimals);
// "30°", "−12.5°".
std::string angle_text(double a_deg, int decimals);

// Drawing state at one layout scale: u is 1 at the reference size of 576 x 432 pt.
struct Pen {
    cairo_t* cr;
    double u;  // layout unit
    double size = 10;

    void font(FontWeight w, double s) {
        size = s * u;
        set_font(cr, w, size);
    }
    void colour(Rgb c, double alpha = 1) { cairo_set_source_rgba(cr, c.r, c.g, c.b, alpha); }
    double width(const std::string& s) const {
        cairo_text_extents_t e;
        cairo_text_extents(cr, s.c_str(), &e);
        return e.x_advance;
    }
    // halign: 0 left, 0.5 centre, 1 right; vcentre: y is the middle of the digits, not the baseline.
    void text(const std::string& s, double x, double y, double halign = 0, bool vcentre = false) {
        const double dx = -halign * width(s);
        const double dy = vcentre ? 0.36 * size : 0;
        cairo_move_to(cr, x + dx, y + dy);
        cairo_show_text(cr, s.c_str());
    }
    void line(double x0, double y0, double x1, double y1) {
        cairo_move_to(cr, x0, y0);
        cairo_line_to(cr, x1, y1);
        cairo_stroke(cr);
    }
    void dash(double on, double off) {
        const double d[2] = {on * u, off * u};
        cairo_set_dash(cr, d, 2, 0);
    }
    void solid() { cairo_set_dash(cr, nullptr, 0, 0); }
    void curve_style(std::size_t i, double line_width) {
        colour(curve_colour(i));
        cairo_set_line_width(cr, line_width);
        const Dash d = curve_dash(i);
        if (d.count == 0) {
            solid();
        } else {
            double v[4];
            for (int k = 0; k < d.count; ++k) v[k] = d.d[k] * line_width;
            cairo_set_dash(cr, v, d.count, 0);
        }
    }
    // A white box behind a label so it stays readable over grid and curves.
    void halo(const std::string& s, double x, double y, double halign, bool vcentre) {
        const double w = width(s), pad = 1.2 * u;
        const double left = x - halign * w - pad;
        const double top = (vcentre ? y - 0.36 * size : y - 0.72 * size) - pad;
        cairo_save(cr);
        cairo_set_source_rgba(cr, 1, 1, 1, 0.85);
        cairo_rectangle(cr, left, top, w + 2 * pad, 0.72 * size + 2 * pad);
        cairo_fill(cr);
        cairo_restore(cr);
    }
};

// Start a figure of w x h points: an opaque white page (print-friendly, readable in dark-themed
// viewers) and a pen scaled to the figure (u = 1 at 576 x 432 pt, clamped to 0.4..4).
Pen begin_page(cairo_t* cr, double w, double h);
// Make `s` fit in `w`: shrink the current font down to `min_size` (layout points), then cut the
// text with an ellipsis. Leaves the font at the size it chose.
std::string fit(Pen& pen, const std::string& s, double w, double min_size);
// Word-wrap `s` into lines no wider than `w` with the current font.
std::vector<std::string> wrap(Pen& pen, const std::string& s, double w);
// Small print at the foot of a figure: the notes wrapped to `width` (6.8 pt, 8.5 pt a line).
struct Footnotes {
    std::vector<std::string> lines;
    double height = 0;  // in points at the pen's scale
};
Footnotes wrap_footnotes(Pen& pen, const std::vector<std::string>& notes, double width);
// Draw them from baseline y down, in the soft ink.
void draw_footnotes(Pen& pen, const Footnotes& f, double x, double y);
// Title (bold) and subtitle at the top left, a rule under them; returns the rule's y.
double draw_header(Pen& pen, const std::string& title, const std::string& subtitle, double w, double m);

// A page with a title block and footnotes across its width (maps, panels against x): begin_page,
// the header, the footnotes wrapped to the width inside the margin m. `top` is `gap_under_header`
// units under the header's rule, `bottom` is `gap_above_notes` units above the footnotes.
struct TitledPage {
    Pen pen;
    double m, top, bottom;
    Footnotes notes;
};
TitledPage begin_titled_page(cairo_t* cr, double w, double h, const std::string& title, const std::string& subtitle,
                             const std::vector<std::string>& notes, double gap_under_header, double gap_above_notes);

}  // namespace ellipsa::exports
