// The polarisation panel: the pinned (or hovered) direction's ellipse drawn to scale, and the
// Poincare sphere with the states of every direction within X dB of the peak.
#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "viewer/panels.hpp"
#include "viewer/scene/glyphs.hpp"
#include "viewer/scene/poincare.hpp"

namespace ellipsa::viewer {

namespace {
const ImU32 ink = IM_COL32(34, 38, 46, 255), grid = IM_COL32(190, 192, 190, 255), faint = IM_COL32(215, 216, 213, 255);
const ImU32 right_col = IM_COL32(213, 94, 0, 255), left_col = IM_COL32(0, 77, 140, 255);

void draw_ellipse(ImDrawList* dl, ImVec2 c, float r, cplx et, cplx ep) {
    dl->AddCircle(c, r, faint, 64, 1.0f);
    dl->AddLine(ImVec2(c.x - r * 1.1f, c.y), ImVec2(c.x + r * 1.1f, c.y), grid);
    dl->AddLine(ImVec2(c.x, c.y - r * 1.1f), ImVec2(c.x, c.y + r * 1.1f), grid);
    dl->AddText(ImVec2(c.x + r * 1.1f - 14, c.y + 2), ink, "\u03c6");
    dl->AddText(ImVec2(c.x + 4, c.y - r * 1.1f - 2), ink, "\u03b8");
    const std::vector<PlanePoint> path = ellipse_path(et, ep, 96);
    if (path.empty()) return;
    const Stokes st = stokes(et, ep);
    // The core's sense (linear from linear_axial_ratio_db up), as on the surface glyphs: black, no arrow.
    const Sense sense = sense_of(st);
    const bool linear = sense != Sense::right && sense != Sense::left;
    const ImU32 col = linear ? ink : (sense == Sense::right ? right_col : left_col);
    std::vector<ImVec2> pts;
    for (const PlanePoint& p : path) pts.push_back(ImVec2(c.x + r * float(p.x), c.y - r * float(p.y)));
    dl->AddPolyline(pts.data(), int(pts.size()), col, ImDrawFlags_Closed, 2.0f);
    // Arrow at w t = 0 along the direction of travel.
    if (!linear) {
        ImVec2 a = pts[0], b = pts[3];
        float vx = b.x - a.x, vy = b.y - a.y, len = std::sqrt(vx * vx + vy * vy);
        if (len > 0) {
            vx /= len, vy /= len;
            const float h = 9;
            ImVec2 tip(a.x + vx * 4, a.y + vy * 4);
            dl->AddTriangleFilled(tip, ImVec2(tip.x - h * (vx * 0.9f - vy * 0.5f), tip.y - h * (vy * 0.9f + vx * 0.5f)),
                                  ImVec2(tip.x - h * (vx * 0.9f + vy * 0.5f), tip.y - h * (vy * 0.9f - vx * 0.5f)), col);
        }
    }
}

void draw_poincare(ImDrawList* dl, ImVec2 c, float r, const std::vector<PoincarePoint>& cloud, const PoincarePoint* mark) {
    const double az = 30, el = 20;
    dl->AddCircleFilled(c, r, IM_COL32(252, 252, 250, 255), 64);
    dl->AddCircle(c, r, grid, 64, 1.2f);
    // Equator (linear states) and the s1-s3 / s2-s3 meridians, back halves faint.
    auto curve = [&](auto f, ImU32 front, ImU32 back) {
        ImVec2 prev{};
        bool prev_front = false;
        for (int k = 0; k <= 96; ++k) {
            const double t = 2 * pi * k / 96;
            double x, y, z;
            f(t, x, y, z);
            SpherePoint2 p = view_sphere_point(x, y, z, az, el);
            ImVec2 q(c.x + r * float(p.x), c.y - r * float(p.y));
            if (k) dl->AddLine(prev, q, (p.depth >= 0 && prev_front) ? front : back, 1.0f);
            prev = q;
            prev_front = p.depth >= 0;
        }
    };
    curve([](double t, double& x, double& y, double& z) { x = std::cos(t), y = std::sin(t), z = 0; }, grid, faint);
    curve([](double t, double& x, double& y, double& z) { x = std::cos(t), y = 0, z = std::sin(t); }, faint, faint);
    curve([](double t, double& x, double& y, double& z) { x = 0, y = std::cos(t), z = std::sin(t); }, faint, faint);
    // Back points first, then front points.
    for (int pass = 0; pass < 2; ++pass)
        for (const PoincarePoint& q : cloud) {
            SpherePoint2 p = view_sphere_point(q.s1, q.s2, q.s3, az, el);
            if ((p.depth >= 0) != (pass == 1)) continue;
            const ImU32 col = q.s3 > 0 ? IM_COL32(213, 94, 0, pass ? 150 : 55) : IM_COL32(0, 77, 140, pass ? 150 : 55);
            const ImVec2 at(c.x + r * float(p.x), c.y - r * float(p.y));
            dl->AddRectFilled(ImVec2(at.x - 1.5f, at.y - 1.5f), ImVec2(at.x + 1.5f, at.y + 1.5f), col);
        }
    // Labels outside the disc, so no state is ever drawn under one: the poles above and below it,
    // the two linear references beside it at the height of their points.
    const ImU32 muted = IM_COL32(95, 100, 108, 255);
    auto outside = [&](double x, double y, double z, const char* text) {
        const SpherePoint2 p = view_sphere_point(x, y, z, az, el);
        const ImVec2 ts = ImGui::CalcTextSize(text);
        const float dx = float(p.x), dy = float(p.y), len = std::max(1e-3f, std::sqrt(dx * dx + dy * dy));
        // Out along the point's screen direction to just past the rim, the text centred there.
        const float rr = r + 4 + 0.5f * std::abs(dx / len) * ts.x + 0.5f * std::abs(dy / len) * ts.y;
        dl->AddText(ImVec2(c.x + rr * dx / len - ts.x * 0.5f, c.y - rr * dy / len - ts.y * 0.5f), muted, text);
    };
    outside(0, 0, 1, "RHCP");
    outside(0, 0, -1, "LHCP");
    outside(1, 0, 0, "\u03b8 linear");
    outside(0, 1, 0, "+45\u00b0");
    if (mark) {
        SpherePoint2 p = view_sphere_point(mark->s1, mark->s2, mark->s3, az, el);
        ImVec2 q(c.x + r * float(p.x), c.y - r * float(p.y));
        dl->AddCircleFilled(q, 5, IM_COL32(255, 255, 255, 255));
        dl->AddCircle(q, 5, ink, 12, 2.0f);
    }
}
}  // namespace

Intents draw_polarisation_panel(const AppState& s, const Derived& d) {
    Intents in;
    const LoadedPattern* a = s.active_pattern();
    if (!a) return in;
    if (!a->set.has_phase()) {
        ImGui::TextWrapped("Polarisation needs phase; this file is %s.", to_string(a->set.content));
        return in;
    }
    const std::optional<DirectionProbe>& p = s.pinned ? d.pinned.value() : d.hover.value();
    const PolarisationState* f = p && p->a.polarisation ? &*p->a.polarisation : nullptr;
    // The Poincare sphere as large as the panel allows (drag the handle under the panel, or the View
    // menu, to give it more room); the field's ellipse as an inset at the top left.
    const ImVec2 avail = ImGui::GetContentRegionAvail();
    const float line = ImGui::GetTextLineHeightWithSpacing();
    const float label_w = ImGui::CalcTextSize("\u03b8 linear").x + 8;
    const float r = std::max(30.0f, std::min(avail.x * 0.5f - label_w, (avail.y - 3.2f * line) * 0.5f - line));
    const float inset = std::clamp(avail.x * 0.26f, 50.0f, 110.0f);
    ImDrawList* dl = ImGui::GetWindowDrawList();
    const ImVec2 o = ImGui::GetCursorScreenPos();
    const ImVec2 centre(o.x + avail.x * 0.5f + inset * 0.25f, o.y + line + r + 2);
    const std::vector<PoincarePoint>& cloud = d.poincare.value();
    PoincarePoint mark;
    if (f) mark = poincare_point(f->stokes);
    draw_poincare(dl, centre, r, cloud, f ? &mark : nullptr);
    const ImVec2 ec(o.x + inset * 0.5f, o.y + inset * 0.5f + 2);
    if (f) draw_ellipse(dl, ec, inset * 0.38f, f->e_theta, f->e_phi);
    else dl->AddCircle(ec, inset * 0.38f, faint, 64, 1.0f);
    ImGui::Dummy(ImVec2(avail.x, 2 * r + 2 * line + 6));
    ImGui::PushTextWrapPos(0);
    ImGui::TextDisabled("%s", !p ? "Top left: pin a direction to see its ellipse."
                              : s.pinned ? "Top left: the field at the pin, seen along propagation."
                                         : "Top left: the field under the cursor, seen along propagation.");
    ImGui::PopTextWrapPos();
    // The sphere's states: every direction within this many dB of the peak (a drag field, so no
    // handle sits over the value).
    ViewerSettings st = s.settings;
    float within = float(st.poincare_within_db);
    ImGui::TextDisabled("Sphere: the %zu sampled directions within", cloud.size());
    ImGui::SetNextItemWidth(70);
    if (ImGui::DragFloat("##within", &within, 0.05f, 0.5f, 20, "%.1f dB", ImGuiSliderFlags_AlwaysClamp)) {
        st.poincare_within_db = within;
        in.push_back(intent::ChangeSettings{st});
    }
    ImGui::SameLine();
    ImGui::TextDisabled("of the peak");
    return in;
}

}  // namespace ellipsa::viewer
