#include "exports/plot_pen.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace ellipsa::exports {

std::string num(double v, int decimals) {
    if (std::abs(v) < 0.5 * std::pow(10.0, -decimals)) v = 0;
    char b[48];
    std::snprintf(b, sizeof b, "%.*f", decimals, v);
    std::string s = b;
    if (!s.empty() && s[0] == '-') s = "\u2212" + s.substr(1);
    return s;
}
std::string angle_text(double a_deg, int decimals) { return num(a_deg, decimals) + "°"; }

Pen begin_page(cairo_t* cr, double w, double h) {
    cairo_set_source_rgb(cr, 1, 1, 1);
    cairo_rectangle(cr, 0, 0, w, h);
    cairo_fill(cr);
    return Pen{cr, std::clamp(std::min(w / 576.0, h / 432.0), 0.4, 4.0)};
}

std::string fit(Pen& pen, const std::string& s, double w, double min_size) {
    double size = pen.size / pen.u;
    while (pen.width(s) > w && size > min_size + 1e-9) {
        size = std::max(min_size, size - 0.5);
        pen.size = size * pen.u;
        cairo_set_font_size(pen.cr, pen.size);
    }
    if (pen.width(s) <= w) return s;
    // Cut at UTF-8 character boundaries.
    std::string t = s;
    while (!t.empty() && pen.width(t + "…") > w) {
        t.pop_back();
        while (!t.empty() && (static_cast<unsigned char>(t.back()) & 0xC0) == 0x80) t.pop_back();
        if (!t.empty() && (static_cast<unsigned char>(t.back()) & 0xC0) == 0xC0) t.pop_back();
    }
    return t + "…";
}

std::vector<std::string> wrap(Pen& pen, const std::string& s, double w) {
    std::vector<std::string> out;
    std::string cur;
    std::size_t pos = 0;
    while (pos < s.size()) {
        std::size_t sp = s.find(' ', pos);
        std::string word = s.substr(pos, sp == std::string::npos ? std::string::npos : sp - pos);
        pos = sp == std::string::npos ? s.size() : sp + 1;
        std::string trial = cur.empty() ? word : cur + " " + word;
        if (!cur.empty() && pen.width(trial) > w) {
            out.push_back(cur);
            cur = word;
        } else {
            cur = trial;
        }
    }
    if (!cur.empty()) out.push_back(cur);
    return out;
}

double draw_header(Pen& pen, const std::string& title, const std::string& subtitle, double w, double m) {
    const double u = pen.u;
    pen.colour(ink);
    pen.font(FontWeight::bold, 13);
    pen.text(fit(pen, title, w - 2 * m, 9.5), m, m + 11 * u);
    pen.colour(ink_soft);
    pen.font(FontWeight::regular, 9);
    pen.text(fit(pen, subtitle, w - 2 * m, 7.5), m, m + 25 * u);
    const double y = m + 32 * u;
    cairo_set_line_width(pen.cr, 0.5 * u);
    pen.colour(grid_major);
    pen.line(m, y, w - m, y);
    return y;
}

Footnotes wrap_footnotes(Pen& pen, const std::vector<std::string>& notes, double width) {
    pen.font(FontWeight::regular, 6.8);
    Footnotes f;
    for (const std::string& n : notes)
        for (const std::string& l : wrap(pen, n, width)) f.lines.push_back(l);
    f.height = 8.5 * pen.u * double(f.lines.size());
    return f;
}

void draw_footnotes(Pen& pen, const Footnotes& f, double x, double y) {
    pen.colour(ink_soft);
    pen.font(FontWeight::regular, 6.8);
    for (const std::string& l : f.lines) {
        pen.text(l, x, y);
        y += 8.5 * pen.u;
    }
}

TitledPage begin_titled_page(cairo_t* cr, double w, double h, const std::string& title, const std::string& subtitle,
                             const std::vector<std::string>& notes, double gap_under_header, double gap_above_notes) {
    TitledPage page{begin_page(cr, w, h), 0, 0, 0, {}};
    Pen& pen = page.pen;
    page.m = 16 * pen.u;
    page.top = draw_header(pen, title, subtitle, w, page.m) + gap_under_header * pen.u;
    page.notes = wrap_footnotes(pen, notes, w - 2 * page.m);
    page.bottom = h - page.m - page.notes.height - gap_above_notes * pen.u;
    return page;
}

}  // namespace ellipsa::exports
