#include "viewer/overlay.hpp"

#include "exports/figure_text.hpp"
#include "pattern/db_scale.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "viewer/scene/glyphs.hpp"

namespace ellipsa::viewer {

namespace {
double nice_step(double span, int target) {
    const double raw = span / target;
    const double p = std::pow(10.0, std::floor(std::log10(raw)));
    for (double m : {1.0, 2.0, 2.5, 5.0, 10.0})
        if (raw <= m * p) return m * p;
    return 10 * p;
}
}  // namespace

float color_bar_title_height(const ColorBar& bar, ImFont* title_font, float title_width) {
    ImFont* tf = title_font ? title_font : ImGui::GetFont();
    const std::string title = bar.title + " (" + bar.unit + ")";
    return tf->CalcTextSizeA(tf->FontSize, 1e9f, title_width, title.c_str()).y + tf->FontSize * 0.5f;
}

void draw_color_bar(ImDrawList* dl, ImVec2 pos, ImVec2 size, const ColorBar& bar, ImFont* font, ImFont* title_font,
                    float title_width) {
    const ImU32 ink = IM_COL32(34, 38, 46, 255);
    // Title and unit above the strip, wrapped to the width given: "Gain: Total (dBi)".
    ImFont* tf = title_font ? title_font : ImGui::GetFont();
    const std::string title = bar.title + " (" + bar.unit + ")";
    const float th = color_bar_title_height(bar, tf, title_width);
    dl->AddText(tf, tf->FontSize, ImVec2(pos.x, pos.y - th), ink, title.c_str(), nullptr, title_width);
    // Gradient in 64 bands, top = max.
    const int bands = 64;
    for (int b = 0; b < bands; ++b) {
        const float y0 = pos.y + size.y * b / bands, y1 = pos.y + size.y * (b + 1) / bands + 0.5f;
        const double t = 1.0 - (b + 0.5) / bands;
        dl->AddRectFilled(ImVec2(pos.x, y0), ImVec2(pos.x + size.x, y1), to_u32(map_color(bar.map, t)));
    }
    dl->AddRect(pos, ImVec2(pos.x + size.x, pos.y + size.y), IM_COL32(90, 90, 90, 255));
    // Ticks.
    ImFont* f = font ? font : ImGui::GetFont();
    const double span = bar.max - bar.min;
    if (!(span > 0)) return;
    const double step = bar.map == ColorMap::cyclic ? 45.0 : nice_step(span, 6);
    const double first = std::ceil(bar.min / step - 1e-9) * step;
    for (double v = first; v <= bar.max + 1e-9 * span; v += step) {
        const float y = pos.y + float((bar.max - v) / span) * size.y;
        dl->AddLine(ImVec2(pos.x + size.x, y), ImVec2(pos.x + size.x + 5, y), ink, 1.0f);
        char buf[32];
        std::snprintf(buf, sizeof buf, "%g", std::abs(v) < 1e-9 * span ? 0.0 : v);
        dl->AddText(f, f->FontSize, ImVec2(pos.x + size.x + 8, y - f->FontSize * 0.5f), ink, buf);
    }
}

float draw_ellipse_key(ImDrawList* dl, ImVec2 pos, ImFont* font, ImU32 text_colour) {
    ImFont* f = font ? font : ImGui::GetFont();
    const float line = f->FontSize * 1.35f, rx = f->FontSize * 0.55f, ry = f->FontSize * 0.3f;
    const GlyphOptions g;
    const struct {
        Rgb colour;
        const char* name;
        bool flat;
    } entries[] = {{g.right, "right-hand", false}, {g.left, "left-hand", false}, {g.linear, "linear", true}};
    dl->AddText(f, f->FontSize, pos, text_colour, "Ellipses");
    float y = pos.y + line;
    for (const auto& e : entries) {
        const ImVec2 c(pos.x + rx + 1, y + f->FontSize * 0.5f);
        if (e.flat) dl->AddLine(ImVec2(c.x - rx, c.y + ry), ImVec2(c.x + rx, c.y - ry), to_u32(e.colour), 2.0f);
        else {
            ImVec2 pts[24];  // a tilted ellipse (ImGui 1.86 has no ellipse primitive)
            for (int k = 0; k < 24; ++k) {
                const float t = 6.2831853f * float(k) / 24, x = rx * std::cos(t), yy = ry * std::sin(t);
                pts[k] = ImVec2(c.x + 0.94f * x + 0.34f * yy, c.y - 0.34f * x + 0.94f * yy);
            }
            dl->AddPolyline(pts, 24, to_u32(e.colour), ImDrawFlags_Closed, 2.0f);
        }
        dl->AddText(f, f->FontSize, ImVec2(pos.x + 2 * rx + 7, y), text_colour, e.name);
        y += line;
    }
    return y - pos.y;
}

float draw_unsampled_key(ImDrawList* dl, ImVec2 pos, ImFont* font, ImU32 text_colour) {
    ImFont* f = font ? font : ImGui::GetFont();
    const float side = f->FontSize, gap = std::max(3.0f, side * 0.3f);
    const ImVec2 a(pos.x + 1, pos.y + 1), b(pos.x + 1 + side * 1.1f, pos.y + side);
    dl->AddRectFilled(a, b, to_u32(unsampled_colour));
    dl->PushClipRect(a, b, true);
    for (float x = a.x - side; x < b.x; x += gap)  // the view's hatching
        dl->AddLine(ImVec2(x, b.y), ImVec2(x + side, b.y - side), to_u32(Rgb{0.62f, 0.62f, 0.60f}), 1.0f);
    dl->PopClipRect();
    dl->AddRect(a, b, to_u32(unsampled_edge_colour), 0, 0, 1.0f);
    dl->AddText(f, f->FontSize, ImVec2(b.x + 7, pos.y), text_colour, exports::not_measured_label);
    return f->FontSize * 1.35f;
}

float draw_radial_scale(ImDrawList* dl, const OrbitCamera& cam, ImVec2 view_size, ImVec2 pos, double peak_db,
                        double range_db, const std::string& unit, ImFont* font, ImU32 colour) {
    ImFont* f = font ? font : ImGui::GetFont();
    const glm::dvec3 eye(cam.eye());
    glm::dvec3 right = glm::cross(glm::dvec3(0, 0, 1), eye);
    right = glm::length(right) < 1e-9 ? glm::dvec3(1, 0, 0) : glm::normalize(right);
    const Projected o = project(cam, glm::dvec3(0), view_size.x, view_size.y), r = project(cam, right, view_size.x, view_size.y);
    const float len = float(std::hypot(r.x - o.x, r.y - o.y));
    if (!o.visible || !r.visible || !(len > 8)) return 0;
    char title[160];
    std::snprintf(title, sizeof title, "Radius: centre %.2f, largest sample %.2f %s; ticks in dB below it", peak_db - range_db, peak_db,
                  unit.c_str());
    dl->AddText(f, f->FontSize, pos, colour, title);
    const float y = pos.y + f->FontSize * 1.6f;
    dl->AddLine(ImVec2(pos.x, y), ImVec2(pos.x + len, y), colour, 1.5f);
    const DbScale sc = db_scale_at(0, range_db);
    std::vector<double> ticks = sc.rings();
    ticks.push_back(sc.floor_db());
    for (double v : ticks) {
        const float x = pos.x + len * float(sc.fraction(v));
        dl->AddLine(ImVec2(x, y - 4), ImVec2(x, y + 4), colour, 1.2f);
        char b[16];
        std::snprintf(b, sizeof b, "%g", v);
        const ImVec2 ts = f->CalcTextSizeA(f->FontSize, 1e9f, 0, b);
        dl->AddText(f, f->FontSize, ImVec2(x - ts.x * 0.5f, y + 6), colour, b);
    }
    return y + 6 + f->FontSize - pos.y;
}

void draw_axis_labels(ImDrawList* dl, const OrbitCamera& cam, ImVec2 origin, ImVec2 size, double length, ImFont* font) {
    struct Axis {
        glm::dvec3 tip;
        const char* label;
        ImU32 col;
    } axes[] = {{{length, 0, 0}, "x  (\u03b8 90\u00b0, \u03c6 0\u00b0)", IM_COL32(150, 50, 40, 255)},
                {{0, length, 0}, "y  (\u03c6 90\u00b0)", IM_COL32(40, 110, 55, 255)},
                {{0, 0, length}, "z  (\u03b8 0\u00b0)", IM_COL32(40, 75, 150, 255)}};
    ImFont* f = font ? font : ImGui::GetFont();
    for (const Axis& a : axes) {
        Projected p = project(cam, a.tip * 1.04, size.x, size.y);
        if (!p.visible) continue;
        // On a light, translucent card: the tip of an axis pointing at the viewer lies over the
        // surface, where the bare text was lost among the colours and ellipses.
        const ImVec2 at(origin.x + float(p.x) + 3, origin.y + float(p.y) - f->FontSize * 0.5f);
        const ImVec2 ts = f->CalcTextSizeA(f->FontSize, 1e9f, 0, a.label);
        dl->AddRectFilled(ImVec2(at.x - 2, at.y - 1), ImVec2(at.x + ts.x + 2, at.y + ts.y + 1), IM_COL32(255, 255, 255, 200), 3.0f);
        dl->AddText(f, f->FontSize, at, a.col, a.label);
    }
}

void draw_world_up(ImDrawList* dl, const OrbitCamera& cam, ImVec2 origin, ImVec2 size, double radius, ImFont* font,
                   ImVec2 gizmo_centre, float gizmo_radius) {
    const ImU32 ring = IM_COL32(70, 110, 150, 150), arrow = IM_COL32(40, 75, 150, 255);
    auto at = [&](glm::dvec3 p, bool& visible) {
        const Projected q = project(cam, p, size.x, size.y);
        visible = q.visible;
        return ImVec2(origin.x + float(q.x), origin.y + float(q.y));
    };
    constexpr double two_pi = 6.283185307179586;
    constexpr int n = 72;  // every other 5-degree step drawn: a dotted ring round the surface
    for (int k = 0; k < n; k += 2) {
        const double a0 = two_pi * k / n, a1 = two_pi * (k + 1) / n;
        bool v0 = false, v1 = false;
        const ImVec2 p0 = at({radius * std::cos(a0), radius * std::sin(a0), 0}, v0);
        const ImVec2 p1 = at({radius * std::cos(a1), radius * std::sin(a1), 0}, v1);
        if (v0 && v1) dl->AddLine(p0, p1, ring, 1.5f);
    }
    // The gizmo: the horizon as an ellipse and the zenith as an arrow, as the camera sees them,
    // scaled so that a unit length at the origin is gizmo_radius pixels.
    bool v = false;
    const ImVec2 o = at({0, 0, 0}, v);
    auto offset = [&](glm::dvec3 p) {
        bool vis = false;
        const ImVec2 q = at(p, vis);
        return ImVec2(q.x - o.x, q.y - o.y);
    };
    const ImVec2 ex = offset({1, 0, 0}), ey = offset({0, 1, 0}), ez = offset({0, 0, 1});
    auto len = [](ImVec2 a) { return std::sqrt(a.x * a.x + a.y * a.y); };
    const float unit = std::max({len(ex), len(ey), len(ez), 1e-3f}), k = gizmo_radius / unit;
    ImVec2 prev{};
    for (int i = 0; i <= 48; ++i) {
        const double a = two_pi * i / 48;
        const ImVec2 q(gizmo_centre.x + k * float(std::cos(a) * ex.x + std::sin(a) * ey.x),
                       gizmo_centre.y + k * float(std::cos(a) * ex.y + std::sin(a) * ey.y));
        if (i > 0) dl->AddLine(prev, q, ring, 1.5f);
        prev = q;
    }
    const ImVec2 tip(gizmo_centre.x + k * ez.x, gizmo_centre.y + k * ez.y);
    const float dx = tip.x - gizmo_centre.x, dy = tip.y - gizmo_centre.y, l = len(ImVec2(dx, dy));
    dl->AddCircleFilled(gizmo_centre, 2.5f, arrow);
    ImFont* f = font ? font : ImGui::GetFont();
    if (l >= 4) {  // looking straight down the vertical, the ellipse is a circle round the dot
        const float ux = dx / l, uy = dy / l, head = std::min(8.0f, l * 0.45f);
        dl->AddLine(gizmo_centre, ImVec2(tip.x - ux * head, tip.y - uy * head), arrow, 2.0f);
        dl->AddTriangleFilled(tip, ImVec2(tip.x - ux * head - uy * head * 0.5f, tip.y - uy * head + ux * head * 0.5f),
                              ImVec2(tip.x - ux * head + uy * head * 0.5f, tip.y - uy * head - ux * head * 0.5f), arrow);
    }
    dl->AddText(f, f->FontSize, ImVec2(tip.x + 4, tip.y - f->FontSize * 0.8f), arrow, "up");
    dl->AddText(f, f->FontSize, ImVec2(gizmo_centre.x + gizmo_radius + 4, gizmo_centre.y - f->FontSize * 0.1f), ring,
                "horizon");
}

}  // namespace ellipsa::viewer
