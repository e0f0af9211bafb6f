// The polarisation panel: the pinned (or hovered) direction's ellipse drawn to scale, and the
// Poincare sphere with the states of every direction within X dB of the peak.
#include <imgui.h>

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
    auto label = [&](double x, double y, double z, const char* text) {
        SpherePoint2 p = view_sphere_point(x, y, z, az, el);
        dl->AddText(ImVec2(c.x + r * float(p.x) + 3, c.y - r * float(p.y) - 7), IM_COL32(95, 100, 108, 255), text);
    };
    label(0, 0, 1.12, "RHCP");
    label(0, 0, -1.22, "LHCP");
    label(1.15, 0, 0, "\u03b8 lin.");
    label(0, 1.15, 0, "45\u00b0");
    // Back points first, then front points.
    for (int pass = 0; pass < 2; ++pass)
        for (const PoincarePoint& q : cloud) {
            SpherePoint2 p = view_sphere_point(q.s1, q.s2, q.s3, az, el);
            if ((p.depth >= 0) != (pass == 1)) continue;
            const ImU32 col = q.s3 > 0 ? IM_COL32(213, 94, 0, pass ? 150 : 55) : IM_COL32(0, 77, 140, pass ? 150 : 55);
            const ImVec2 at(c.x + r * float(p.x), c.y - r * float(p.y));
            dl->AddRectFilled(ImVec2(at.x - 1.5f, at.y - 1.5f), ImVec2(at.x + 1.5f, at.y + 1.5f), col);
        }
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
    const float w = ImGui::GetContentRegionAvail().x;
    const float size = std::min(w * 0.5f - 6, 170.0f);
    ImDrawList* dl = ImGui::GetWindowDrawList();
    const ImVec2 o = ImGui::GetCursorScreenPos();
    // Left: the ellipse to scale (major + minor axes from the field, on the unit circle of |E|).
    if (f)
        draw_ellipse(dl, ImVec2(o.x + size * 0.5f, o.y + size * 0.5f + 4), size * 0.42f, f->e_theta, f->e_phi);
    else
        dl->AddCircle(ImVec2(o.x + size * 0.5f, o.y + size * 0.5f + 4), size * 0.42f, faint, 64, 1.0f);
    // Right: the Poincare sphere with the states near the peak.
    const std::vector<PoincarePoint>& cloud = d.poincare.value();
    PoincarePoint mark;
    if (f) mark = poincare_point(f->stokes);
    draw_poincare(dl, ImVec2(o.x + w - size * 0.58f, o.y + size * 0.5f + 4), size * 0.38f, cloud, f ? &mark : nullptr);
    ImGui::Dummy(ImVec2(w, size + 8));
    ImGui::PushTextWrapPos(0);
    ImGui::TextDisabled("%s", !p ? "Left: pin a direction to see its ellipse."
                              : s.pinned ? "Left: the field at the pin, seen along propagation."
                                         : "Left: the field under the cursor, seen along propagation.");
    ImGui::PopTextWrapPos();
    ViewerSettings st = s.settings;
    float within = float(st.poincare_within_db);
    ImGui::SetNextItemWidth(-150);
    if (ImGui::SliderFloat("##within", &within, 0.5f, 20, "within %.1f dB of peak", ImGuiSliderFlags_AlwaysClamp)) {
        st.poincare_within_db = within;
        in.push_back(intent::ChangeSettings{st});
    }
    ImGui::SameLine();
    ImGui::TextDisabled("%zu states", cloud.size());
    return in;
}

}  // namespace ellipsa::viewer
