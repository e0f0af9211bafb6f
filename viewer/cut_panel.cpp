// The cut panel: polar or rectangular plot of the active cut with several components (and the B
// pattern) overlaid, a legend, dB grid labels, -3 dB markers and the HPBW / front-to-back readout.
#include <imgui.h>

#include "exports/figure_text.hpp"

#include <cmath>
#include <algorithm>
#include <cstdio>
#include <iterator>

#include "viewer/exports_ui.hpp"
#include "viewer/panels.hpp"
#include "viewer/widgets.hpp"
#include "viewer/scene/components.hpp"
#include "pattern/db_scale.hpp"

namespace ellipsa::viewer {

namespace {
// Okabe-Ito colours (colour-blind safe), in the order curves are added.
const ImU32 curve_colors[] = {IM_COL32(0, 114, 178, 255), IM_COL32(213, 94, 0, 255),  IM_COL32(0, 158, 115, 255),
                              IM_COL32(204, 121, 167, 255), IM_COL32(86, 180, 233, 255), IM_COL32(230, 159, 0, 255),
                              IM_COL32(90, 90, 90, 255),   IM_COL32(240, 228, 66, 255), IM_COL32(0, 0, 0, 255)};
const ImU32 ink = IM_COL32(34, 38, 46, 255), grid = IM_COL32(205, 206, 203, 255), muted = IM_COL32(95, 100, 108, 255);

void plot_polar(ImDrawList* dl, ImVec2 c, float R, const CutData& cd, const DbScale& sc) {
    const std::vector<double> rings = sc.rings();
    for (double lv : rings) {
        const float r = R * float(sc.fraction(lv));
        dl->AddCircle(c, r, grid, 72, 1.0f);
        if (r < 14) continue;
        char b[16];
        std::snprintf(b, sizeof b, "%g", lv);
        // Ring labels just inside each ring, beside the 0-degree spoke.
        dl->AddText(ImVec2(c.x + 3, c.y - r + 1), muted, b);
    }
    const bool full_turn = cd.spec.kind == CutKind::theta_const;
    // Screen position of a cut angle: elevation-like cuts put 0 at the top and turn clockwise (a side
    // view with +z up); theta = const cuts put phi = 0 at the right and turn counter-clockwise (the
    // xy-plane seen from +z), as the exported figures do.
    auto at = [&](double angle_deg, float r) {
        const float a = float(angle_deg * pi / 180);
        return full_turn ? ImVec2(c.x + r * std::cos(a), c.y - r * std::sin(a)) : ImVec2(c.x + r * std::sin(a), c.y - r * std::cos(a));
    };
    for (int a = 0; a < 360; a += 30) {
        const ImVec2 u = at(a, 1);
        const float x = u.x - c.x, y = u.y - c.y;
        dl->AddLine(c, ImVec2(c.x + R * x, c.y + R * y), grid);
        char b[16];
        const int shown = cd.spec.kind == CutKind::theta_const ? a : (a > 180 ? a - 360 : a);
        std::snprintf(b, sizeof b, "%d\u00b0", shown);
        const ImVec2 ts = ImGui::CalcTextSize(b);
        dl->AddText(ImVec2(c.x + (R + 12) * x - ts.x * 0.5f, c.y + (R + 10) * y - ts.y * 0.5f), muted, b);
    }
    for (std::size_t k = 0; k < cd.curves.size(); ++k) {
        const CutCurve& cv = cd.curves[k];
        std::vector<ImVec2> pts;
        auto flush = [&] {
            if (pts.size() > 1) dl->AddPolyline(pts.data(), int(pts.size()), curve_colors[k % 9], 0, cv.pattern == 0 ? 2.0f : 1.5f);
            pts.clear();
        };
        for (std::size_t i = 0; i <= cd.angle_deg.size(); ++i) {
            const std::size_t j = i % cd.angle_deg.size();
            const double v = cv.db[j];
            if (std::isnan(v)) {
                flush();
                continue;
            }
            pts.push_back(at(cd.angle_deg[j], R * float(sc.fraction(v))));
        }
        flush();
    }
    // -3 dB markers of the first curve.
    if (!cd.figures()) return;
    const BeamFigures& bf = *cd.figures();
    for (const std::optional<double>& x : {bf.left_deg, bf.right_deg})
        if (x) {
            const ImVec2 p = at(*x, R * float(sc.fraction(bf.peak_db - half_power_db)));
            dl->AddLine(c, p, IM_COL32(120, 120, 120, 200), 1.0f);
            dl->AddCircle(p, 4, ink, 12, 1.5f);
        }
}

void plot_rect(ImDrawList* dl, ImVec2 p0, ImVec2 p1, const CutData& cd, const DbScale& sc) {
    const double a0 = cd.angle_deg.front(), a1 = cd.angle_deg.front() + 360;
    auto X = [&](double a) { return p0.x + float((a - a0) / (a1 - a0)) * (p1.x - p0.x); };
    auto Y = [&](double db) { return p1.y - float(sc.fraction(db)) * (p1.y - p0.y); };
    std::vector<double> lines = sc.rings();
    lines.push_back(sc.floor_db());
    for (double lv : lines) {
        dl->AddLine(ImVec2(p0.x, Y(lv)), ImVec2(p1.x, Y(lv)), grid);
        char b[16];
        std::snprintf(b, sizeof b, "%g", lv);
        const ImVec2 ts = ImGui::CalcTextSize(b);
        dl->AddText(ImVec2(p0.x - ts.x - 4, Y(lv) - ts.y * 0.5f), muted, b);
    }
    const int xstep = (p1.x - p0.x) / 8 < 48 ? 90 : 45;
    dl->AddText(ImVec2(p0.x - 36, p0.y - 17), muted, cd.unit.c_str());
    for (int a = int(a0); a <= int(a1); a += xstep) {
        dl->AddLine(ImVec2(X(a), p0.y), ImVec2(X(a), p1.y), grid);
        char b[16];
        std::snprintf(b, sizeof b, "%d\u00b0", a);
        const ImVec2 ts = ImGui::CalcTextSize(b);
        dl->AddText(ImVec2(X(a) - ts.x * 0.5f, p1.y + 2), muted, b);
    }
    dl->AddRect(p0, p1, IM_COL32(160, 160, 160, 255));
    for (std::size_t k = 0; k < cd.curves.size(); ++k) {
        const CutCurve& cv = cd.curves[k];
        std::vector<ImVec2> pts;
        auto flush = [&] {
            if (pts.size() > 1) dl->AddPolyline(pts.data(), int(pts.size()), curve_colors[k % 9], 0, cv.pattern == 0 ? 2.0f : 1.5f);
            pts.clear();
        };
        for (std::size_t i = 0; i < cd.angle_deg.size(); ++i) {
            if (std::isnan(cv.db[i])) {
                flush();
                continue;
            }
            pts.push_back(ImVec2(X(cd.angle_deg[i]), Y(cv.db[i])));
        }
        flush();
    }
    if (!cd.figures()) return;
    const BeamFigures& bf = *cd.figures();
    const float y3 = Y(bf.peak_db - half_power_db);
    for (const std::optional<double>& x : {bf.left_deg, bf.right_deg})
        if (x && std::isfinite(*x)) {
            const double a = a0 + std::fmod(std::fmod(*x - a0, 360.0) + 360.0, 360.0);  // into [a0, a0 + 360)
            dl->AddLine(ImVec2(X(a), y3 - 8), ImVec2(X(a), y3 + 8), ink, 1.5f);
        }
    if (bf.left_deg || bf.right_deg) dl->AddLine(ImVec2(p0.x, y3), ImVec2(p1.x, y3), IM_COL32(150, 150, 150, 140), 1.0f);
}


// The cut's kind, angle, style and components, on a copy of the settings; the export row.
void cut_controls(const AppState& s, const FarFieldSet& a, float width, Intents& in) {
    ViewerSettings st = s.settings;
    const char* kinds[] = {"\u03c6 = const (elevation cut)", "\u03b8 = const (conical cut)", "through the pinned direction"};
    ImGui::SetNextItemWidth(-1);
    ImGui::Combo("##kind", &st.cut_kind, kinds, 3);
    if (st.cut_kind < 2) {
        float ang = float(st.cut_angle_deg);
        ImGui::SetNextItemWidth(-1);
        if (ImGui::SliderFloat("##ang", &ang, 0, 180, st.cut_kind == 0 ? "\u03c6 = %.0f\u00b0" : "\u03b8 = %.0f\u00b0",
                               ImGuiSliderFlags_AlwaysClamp))
            st.cut_angle_deg = std::round(ang);
    } else {
        ImGui::TextDisabled(s.pinned ? "along \u03b8-hat (the meridian) through the pin" : "click the surface to pin");
    }
    ImGui::Checkbox("polar plot", &st.polar_plot);
    ImGui::SameLine();
    ImGui::TextDisabled("(P)");
    if (ImGui::SmallButton("Export cut as"))
        in.push_back(intent::ExportCut{timestamped_name("ellipsa-cut", cut_export_formats[s.cut_export_format]), false});
    if (ImGui::IsItemHovered()) ImGui::SetTooltip("Write this cut to the current folder, as with 'ellipsa cut'");
    ImGui::SameLine();
    ImGui::SetNextItemWidth(70);
    int fmt = s.cut_export_format;
    if (ImGui::Combo("##fmt", &fmt, cut_export_formats, int(std::size(cut_export_formats)))) in.push_back(intent::SetCutExportFormat{fmt});
    append(in, export_outcome_line(s.cut_export, ExportTarget::cut));
    ImGui::Separator();
    ImGui::TextDisabled("Components");
    int shown = 0;
    for (Component c : all_components) {
        if (c == Component::vertical || c == Component::horizontal) continue;  // same as theta and phi here
        if (component_unavailable(a, c)) continue;
        bool on = (st.cut_components >> unsigned(c)) & 1u;
        if (shown++ % 2) ImGui::SameLine(width * 0.5f);
        const char* short_name = short_label(c);
        if (ImGui::Checkbox(short_name, &on)) st.cut_components ^= 1u << unsigned(c);
    }
    if (!(st == s.settings)) in.push_back(intent::ChangeSettings{st});
}

// Legend and beam figures to the right of the plot.
void cut_legend(const AppState& s, const CutData& cd, ImDrawList* dl, float lx, float ly) {
    const std::string title = cd.spec.kind == CutKind::great_circle ? std::string("through the pin") : cd.spec.label();
    dl->AddText(ImVec2(lx, ly), ink, title.c_str());
    ly += 20;
    for (std::size_t k = 0; k < cd.curves.size(); ++k) {
        const CutCurve& cv = cd.curves[k];
        dl->AddLine(ImVec2(lx, ly + 8), ImVec2(lx + 22, ly + 8), curve_colors[k % 9], cv.pattern == 0 ? 2.5f : 1.5f);
        const std::string name = std::string(short_label(cv.component)) + (s.compare_pattern() ? (cv.pattern == 0 ? " (A)" : " (B)") : "");
        dl->AddText(ImVec2(lx + 28, ly), ink, name.c_str());
        ly += 18;
    }
    ly += 6;
    if (!cd.figures()) {
        dl->AddText(ImVec2(lx, ly), ink, "first curve: no power on this cut");
        return;
    }
    const BeamFigures& bf = *cd.figures();
    char b[128];
    std::snprintf(b, sizeof b, "peak %.2f %s at %.1f\u00b0", bf.peak_db, cd.unit.c_str(), bf.peak_angle_deg);
    dl->AddText(ImVec2(lx, ly), ink, b);
    ly += 18;
    if (bf.hpbw_deg) std::snprintf(b, sizeof b, s.settings.polar_plot ? "HPBW %.1f\u00b0 (circles)" : "HPBW %.1f\u00b0 (ticks)", *bf.hpbw_deg);
    else std::snprintf(b, sizeof b, "HPBW %s", exports::beamwidth_text(bf, cd.spec.angle_name(), "\u00b0").c_str());
    dl->AddText(ImVec2(lx, ly), ink, b);
    ly += 18;
    dl->AddText(ImVec2(lx, ly), ink, ("F/B " + exports::front_to_back_text(bf.front_to_back_db, bf.front_to_back_above_db)).c_str());
    ly += 18;
    dl->AddText(ImVec2(lx, ly), ink, ("side lobe " + exports::sidelobe_text(bf)).c_str());
}

void cut_plot(const AppState& s, const CutData& cd) {
    const ViewerSettings& st = s.settings;
    if (!cd.valid || cd.angle_deg.empty() || !cd.peak_db) {
        if (!cd.why.empty()) {
            ImGui::TextWrapped("No cut: %s.", cd.why.c_str());
            return;
        }
        ImGui::TextDisabled(!cd.valid && st.cut_kind == 2 ? "Pin a direction to cut through it."
                            : !cd.valid                   ? "Choose at least one component."
                                                          : "No power on this cut: every chosen component is zero here.");
        return;
    }
    const ImVec2 o = ImGui::GetCursorScreenPos(), avail = ImGui::GetContentRegionAvail();
    ImDrawList* dl = ImGui::GetWindowDrawList();
    const DbScale sc = db_scale(*cd.peak_db, st.range_db);
    // The legend beside the plot, or below it when the panel is narrow.
    const bool below = avail.x < 380;
    const float legend_w = below ? 0 : std::max(150.0f, std::min(230.0f, avail.x - avail.y));
    const float legend_h = below ? 20.0f + 18.0f * float(cd.curves.size()) + 6 + 4 * 18.0f : 0;
    const float plot_w = avail.x - legend_w, plot_h = std::max(60.0f, avail.y - legend_h);
    if (st.polar_plot) {
        const float R = std::max(20.0f, std::min(plot_w, plot_h) * 0.5f - 24);
        plot_polar(dl, ImVec2(o.x + plot_w * 0.5f, o.y + plot_h * 0.5f), R, cd, sc);
    } else {
        plot_rect(dl, ImVec2(o.x + 40, o.y + 18), ImVec2(o.x + plot_w - 14, o.y + plot_h - 24), cd, sc);
    }
    if (below) cut_legend(s, cd, dl, o.x + 4, o.y + plot_h + 4);
    else cut_legend(s, cd, dl, o.x + plot_w + 6, o.y + 4);
}
}  // namespace

Intents draw_cut_panel(const AppState& s, const Derived& d) {
    Intents in;
    const LoadedPattern* a = s.active_pattern();
    if (!a) return in;
    // Controls on the left, plot on the right (the controls narrower in a narrow panel).
    const float controls_w = std::clamp(ImGui::GetContentRegionAvail().x * 0.42f, 160.0f, 228.0f);
    ImGui::BeginChild("cutcontrols", ImVec2(controls_w, 0), false, ImGuiWindowFlags_NoScrollbar);
    cut_controls(s, a->set, controls_w, in);
    ImGui::EndChild();
    ImGui::SameLine();
    ImGui::BeginChild("cutplot", ImVec2(0, 0), false);
    cut_plot(s, d.cut.value());
    ImGui::EndChild();
    return in;
}

}  // namespace ellipsa::viewer
