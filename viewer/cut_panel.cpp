// The cut panel: polar or rectangular plot of the active cut with several components (and the B
// pattern) overlaid, a legend, dB grid labels, -3 dB markers and the HPBW / front-to-back readout.
#include <imgui.h>

#include "exports/cut_phase.hpp"
#include "exports/cut_plot.hpp"
#include "exports/figure_text.hpp"
#include "exports/palette.hpp"

#include <cmath>
#include <algorithm>
#include <cstdio>
#include <iterator>

#include "viewer/exports_ui.hpp"
#include "viewer/panels.hpp"
#include "viewer/widgets.hpp"
#include "viewer/scene/components.hpp"
#include "pattern/component_phase.hpp"
#include "pattern/db_scale.hpp"

namespace ellipsa::viewer {

namespace {
const ImU32 ink = IM_COL32(34, 38, 46, 255), grid = IM_COL32(205, 206, 203, 255), grid_minor = IM_COL32(228, 229, 226, 255),
            muted = IM_COL32(95, 100, 108, 255), no_data = IM_COL32(226, 226, 224, 255);

// Room for the angle labels around a polar plot: beside it (the widest, "-150°") and above/below.
const ImVec2 polar_label_room(44, 22);

// The figures' curve colours (exports/palette.hpp), so screen and file colour a curve alike.

ImU32 curve_u32(std::size_t i) {
    const exports::Rgb c = exports::curve_colour(i);
    return IM_COL32(int(c.r * 255 + 0.5), int(c.g * 255 + 0.5), int(c.b * 255 + 0.5), 255);
}
float curve_width(std::size_t i) { return i == 0 ? 2.2f : 1.6f; }

void diamond(ImDrawList* dl, ImVec2 p, std::size_t i) {
    const float d = 4.5f;
    dl->AddQuadFilled(ImVec2(p.x, p.y - d), ImVec2(p.x + d, p.y), ImVec2(p.x, p.y + d), ImVec2(p.x - d, p.y), curve_u32(i));
    dl->AddQuad(ImVec2(p.x, p.y - d), ImVec2(p.x + d, p.y), ImVec2(p.x, p.y + d), ImVec2(p.x - d, p.y), ink, 1.0f);
}

// Text with a pale box behind it, so it stays readable over grid and curves.
void halo_text(ImDrawList* dl, ImVec2 p, ImU32 col, const char* text) {
    const ImVec2 ts = ImGui::CalcTextSize(text);
    dl->AddRectFilled(ImVec2(p.x - 2, p.y), ImVec2(p.x + ts.x + 2, p.y + ts.y), IM_COL32(255, 255, 255, 215), 2.0f);
    dl->AddText(p, col, text);
}

// Where a figure's (angle, fraction) lands on screen, and the unit direction its tag moves off.
struct PlotFrame {
    bool polar = true, full_turn = false;
    ImVec2 c;  // polar centre
    float R = 1;
    ImVec2 p0, p1;  // rectangular frame
    double a0 = -180;
    ImVec2 at(double angle_deg, double f) const {
        if (!polar) {
            const double a = a0 + std::fmod(std::fmod(angle_deg - a0, 360.0) + 360.0, 360.0);
            return ImVec2(p0.x + float((a - a0) / 360) * (p1.x - p0.x), p1.y - float(f) * (p1.y - p0.y));
        }
        const float a = float(angle_deg * pi / 180), r = R * float(f);
        return full_turn ? ImVec2(c.x + r * std::cos(a), c.y - r * std::sin(a)) : ImVec2(c.x + r * std::sin(a), c.y - r * std::cos(a));
    }
    ImVec2 inward(double angle_deg) const {
        if (!polar) return ImVec2(0, 1);
        const ImVec2 q = at(angle_deg, 1);
        return ImVec2((c.x - q.x) / R, (c.y - q.y) / R);
    }
};

// Grey where no curve has data, as the exported figure shades it.
void draw_no_data(ImDrawList* dl, const PlotFrame& f, const exports::CutPlot& fig) {
    for (auto [b0, b1] : exports::no_data_ranges(fig)) {
        if (!f.polar) {
            for (double a = b0; a < b1; a += 1) {  // one band a degree, wrapped into the axis
                const ImVec2 q0 = f.at(a, 1), q1 = f.at(std::min(a + 1, b1), 0);
                if (q1.x > q0.x) dl->AddRectFilled(q0, q1, no_data);
            }
            continue;
        }
        for (double a = b0; a < b1; a += 30) {  // convex wedges
            const double e = std::min(a + 30, b1);
            dl->PathLineTo(f.c);
            for (int k = 0; k <= 8; ++k) dl->PathLineTo(f.at(a + (e - a) * k / 8, 1));
            dl->PathFillConvex(no_data);
        }
    }
}

void polar_grid(ImDrawList* dl, const PlotFrame& f, const DbScale& sc, bool signed_half) {
    for (int a = 0; a < 360; a += 10) dl->AddLine(f.c, f.at(a, 1), a % 30 == 0 ? grid : grid_minor);
    for (double lv : sc.rings()) dl->AddCircle(f.c, f.R * float(sc.fraction(lv)), grid, 72, 1.0f);
    dl->AddCircle(f.c, f.R, muted, 96, 1.2f);
    for (int a = 0; a < 360; a += 30) {
        char b[16];
        std::snprintf(b, sizeof b, "%d\u00b0", signed_half && a > 180 ? a - 360 : a);
        const ImVec2 ts = ImGui::CalcTextSize(b), q = f.at(a, 1);
        const float dx = (q.x - f.c.x) / f.R, dy = (q.y - f.c.y) / f.R;
        dl->AddText(ImVec2(q.x + dx * (8 + ts.x * 0.5f) - ts.x * 0.5f, q.y + dy * (6 + ts.y * 0.5f) - ts.y * 0.5f), muted, b);
    }
}

// The rings' values along the half-spoke (15, 45, ... deg) where the curves reach least far out.
void polar_ring_labels(ImDrawList* dl, const PlotFrame& f, const exports::CutPlot& fig, const DbScale& sc) {
    double best_a = 15, best_f = 2;
    for (int k = 0; k < 12; ++k) {
        const double a = 15 + 30.0 * k;
        double reach = 0;
        for (const exports::PlotCurve& c : fig.curves) {
            const std::size_t n = c.angle_deg.size();
            if (n < 2) continue;
            const double step = c.angle_deg[1] - c.angle_deg[0];
            const long j = std::lround((a - c.angle_deg[0]) / step);
            const double v = c.value_db[std::size_t(((j % long(n)) + long(n)) % long(n))];
            if (!std::isnan(v)) reach = std::max(reach, sc.fraction(v));
        }
        for (const exports::PlotCurve& c : fig.curves)  // keep clear of the peaks' tags
            if (c.beam && std::abs(std::remainder(a - c.beam->peak_angle_deg, 360.0)) < 25) reach = std::max(reach, 1.5);
        if (reach < best_f - 1e-9) best_f = reach, best_a = a;
    }
    const std::vector<double> rings = sc.rings();
    ImVec4 last(0, 0, -1, -1);  // the last label's box; a label that would touch it is left out
    for (std::size_t i = 1; i < rings.size(); ++i) {
        char b[24];
        std::snprintf(b, sizeof b, i == 1 ? "%g %s" : "%g", rings[i], fig.value_unit.c_str());
        const ImVec2 q = f.at(best_a, sc.fraction(rings[i])), ts = ImGui::CalcTextSize(b);
        const ImVec4 box(q.x - ts.x * 0.5f - 3, q.y - ts.y * 0.5f - 1, q.x + ts.x * 0.5f + 3, q.y + ts.y * 0.5f + 1);
        const bool touches = box.x < last.z && box.z > last.x && box.y < last.w && box.w > last.y;
        if (f.R * sc.fraction(rings[i]) <= 12 || touches) continue;
        halo_text(dl, ImVec2(q.x - ts.x * 0.5f, q.y - ts.y * 0.5f), muted, b);
        last = box;
    }
}

void rect_grid(ImDrawList* dl, const PlotFrame& f, const DbScale& sc, const std::string& unit) {
    std::vector<double> lines = sc.rings();
    lines.push_back(sc.floor_db());
    for (double lv : lines) {
        const float y = f.at(f.a0, sc.fraction(lv)).y;
        dl->AddLine(ImVec2(f.p0.x, y), ImVec2(f.p1.x, y), grid);
        char b[16];
        std::snprintf(b, sizeof b, "%g", lv);
        const ImVec2 ts = ImGui::CalcTextSize(b);
        dl->AddText(ImVec2(f.p0.x - ts.x - 4, y - ts.y * 0.5f), muted, b);
    }
    const int xstep = (f.p1.x - f.p0.x) / 8 < 48 ? 90 : 45;
    dl->AddText(ImVec2(f.p0.x - 36, f.p0.y - 17), muted, unit.c_str());
    for (int a = int(f.a0); a <= int(f.a0) + 360; a += xstep) {
        const float x = f.p0.x + float(a - f.a0) / 360 * (f.p1.x - f.p0.x);
        dl->AddLine(ImVec2(x, f.p0.y), ImVec2(x, f.p1.y), grid);
        char b[16];
        std::snprintf(b, sizeof b, "%d\u00b0", a);
        const ImVec2 ts = ImGui::CalcTextSize(b);
        dl->AddText(ImVec2(x - ts.x * 0.5f, f.p1.y + 2), muted, b);
    }
    dl->AddRect(f.p0, f.p1, IM_COL32(160, 160, 160, 255));
}

void draw_curves(ImDrawList* dl, const PlotFrame& f, const exports::CutPlot& fig, const DbScale& sc) {
    for (std::size_t k = 0; k < fig.curves.size(); ++k) {
        const exports::PlotCurve& cv = fig.curves[k];
        std::vector<ImVec2> pts;
        auto flush = [&] {
            if (pts.size() > 1) dl->AddPolyline(pts.data(), int(pts.size()), curve_u32(k), 0, curve_width(k));
            pts.clear();
        };
        const std::size_t n = cv.angle_deg.size();
        double last_x = -1e30;
        for (std::size_t i = 0; i <= n && n > 0; ++i) {
            const std::size_t j = i % n;
            if (std::isnan(cv.value_db[j]) || (!f.polar && i == n)) {
                flush();
                continue;
            }
            const ImVec2 q = f.at(cv.angle_deg[j], sc.fraction(cv.value_db[j]));
            if (!f.polar && q.x < last_x) flush();  // wrapped round the axis
            last_x = q.x;
            pts.push_back(q);
        }
        flush();
    }
}

// The marked curve's half-power points (dots), each curve's peak (diamond) with its tag.
void draw_marks(ImDrawList* dl, const PlotFrame& f, const exports::CutPlot& fig, const DbScale& sc) {
    if (fig.marked_curve >= 0 && std::size_t(fig.marked_curve) < fig.curves.size()) {
        const std::optional<BeamFigures>& b = fig.curves[std::size_t(fig.marked_curve)].beam;
        if (b && b->left_deg && b->right_deg)
            for (double a : {*b->left_deg, *b->right_deg}) {
                const ImVec2 q = f.at(a, sc.fraction(b->peak_db - half_power_db));
                dl->AddCircleFilled(q, 3.5f, curve_u32(std::size_t(fig.marked_curve)), 12);
                dl->AddCircle(q, 3.5f, ink, 12, 1.0f);
            }
    }
    std::vector<ImVec4> placed;
    for (std::size_t k = 0; k < fig.curves.size(); ++k) {
        const std::optional<BeamFigures>& b = fig.curves[k].beam;
        if (!b) continue;
        const ImVec2 q = f.at(b->peak_angle_deg, sc.fraction(b->peak_db)), d = f.inward(b->peak_angle_deg);
        diamond(dl, q, k);
        const char* tag = fig.curves[k].tag.c_str();
        const ImVec2 ts = ImGui::CalcTextSize(tag);
        ImVec2 t(q.x + d.x * 9 - ts.x * (d.x > 0.35f ? 0.0f : d.x < -0.35f ? 1.0f : 0.5f), q.y + d.y * 9 - ts.y * 0.5f);
        for (int tries = 0; tries < 6; ++tries) {  // clear of earlier tags
            bool clear = true;
            for (const ImVec4& r : placed) clear = clear && (t.x > r.z || t.x + ts.x < r.x || t.y > r.w || t.y + ts.y < r.y);
            if (clear) break;
            t.y += ts.y + 2;  // a colliding tag steps down a line
        }
        placed.push_back(ImVec4(t.x, t.y, t.x + ts.x, t.y + ts.y));
        halo_text(dl, t, ink, tag);
    }
}

// The figure's table (exports::cut_table, as in the files) under the plot: a swatch, the curve
// and the figures.
void figure_table(const exports::CutPlot& fig) {
    const exports::CutTable t = exports::cut_table(fig);
    ImGui::PushStyleVar(ImGuiStyleVar_CellPadding, ImVec2(5, 1));
    const bool open = ImGui::BeginTable("cutfigures", int(t.header.size()) + 1,
                           ImGuiTableFlags_SizingFixedFit | ImGuiTableFlags_BordersInnerH | ImGuiTableFlags_NoHostExtendX);
    ImGui::PopStyleVar();
    if (!open) return;
    ImGui::TableSetupColumn("##swatch");
    for (const std::string& h : t.header) ImGui::TableSetupColumn(h.c_str());
    ImGui::TableHeadersRow();
    for (std::size_t r = 0; r < t.rows.size(); ++r) {
        ImGui::TableNextRow();
        ImGui::TableNextColumn();
        const ImVec2 p = ImGui::GetCursorScreenPos();
        const float y = p.y + ImGui::GetTextLineHeight() * 0.5f;
        ImGui::GetWindowDrawList()->AddLine(ImVec2(p.x, y), ImVec2(p.x + 22, y), curve_u32(r), curve_width(r));
        diamond(ImGui::GetWindowDrawList(), ImVec2(p.x + 11, y), r);
        ImGui::Dummy(ImVec2(24, ImGui::GetTextLineHeight()));
        for (std::size_t c = 0; c < t.rows[r].size(); ++c) {
            ImGui::TableNextColumn();
            ImGui::TextUnformatted(t.rows[r][c].c_str());
        }
    }
    ImGui::EndTable();
}

// The same table turned for a narrow panel: a row per figure, a column per curve headed by its
// swatch and tag (the full name on hover); scrolls sideways when many curves are shown.
void figure_table_turned(const exports::CutPlot& fig) {
    const exports::CutTable t = exports::cut_table(fig);
    const bool many = t.rows.size() > 2;  // more than two curves scroll sideways
    ImGui::PushStyleVar(ImGuiStyleVar_CellPadding, ImVec2(5, 1));
    const float h = ImGui::GetTextLineHeightWithSpacing() * float(t.header.size() + (many ? 1 : 0));
    const bool open = ImGui::BeginTable("cutfiguresturned", int(t.rows.size()) + 1,
                                        ImGuiTableFlags_SizingFixedFit | ImGuiTableFlags_BordersInnerH | (many ? ImGuiTableFlags_ScrollX : 0),
                                        ImVec2(0, many ? h : 0));
    ImGui::PopStyleVar();
    if (!open) return;
    if (many) ImGui::TableSetupScrollFreeze(1, 0);
    ImGui::TableNextRow();  // the curves' tags in their colours (the full name on hover)
    for (std::size_t r = 0; r < t.rows.size(); ++r) {
        ImGui::TableSetColumnIndex(int(r) + 1);
        ImGui::PushStyleColor(ImGuiCol_Text, curve_u32(r));
        ImGui::TextUnformatted(fig.curves[r].tag.c_str());
        ImGui::PopStyleColor();
        if (ImGui::IsItemHovered()) ImGui::SetTooltip("%s", t.rows[r][0].c_str());
    }
    for (std::size_t c = 1; c < t.header.size(); ++c) {
        ImGui::TableNextRow();
        ImGui::TableSetColumnIndex(0);
        ImGui::TextDisabled("%s", t.header[c].c_str());
        for (std::size_t r = 0; r < t.rows.size(); ++r) {
            ImGui::TableSetColumnIndex(int(r) + 1);
            ImGui::TextUnformatted(t.rows[r][c].c_str());
        }
    }
    ImGui::EndTable();
}

// The key to the marks under the table: the axis in words, the rest on hover.
void figure_key(const exports::CutPlot& fig) {
    ImGui::BeginGroup();
    text_wrapped_at_spaces(fig.axis_note, true);
    ImGui::EndGroup();
    if (ImGui::IsItemHovered()) {
        std::string all;
        for (const std::string& n : exports::cut_key_notes(fig)) all += n + "\n";
        ImGui::SetTooltip("%s", all.c_str());
    }
}

// The cut's kind and angle (or what the pin cut follows), on a copy of the settings, a line each.
void cut_kind_rows(const AppState& s, ViewerSettings& st) {
    const char* kinds[] = {"\u03c6 = const (elevation cut)", "\u03b8 = const (conical cut)", "through the pinned direction"};
    ImGui::SetNextItemWidth(-1);
    ImGui::Combo("##kind", &st.cut_kind, kinds, 3);
    if (st.cut_kind < 2) {
        float ang = float(st.cut_angle_deg);
        ImGui::SetNextItemWidth(-1);
        if (ImGui::SliderFloat("##ang", &ang, 0, 180, st.cut_kind == 0 ? "\u03c6 = %.0f\u00b0" : "\u03b8 = %.0f\u00b0",
                               ImGuiSliderFlags_AlwaysClamp))
            st.cut_angle_deg = std::round(ang);
    } else if (!s.pinned) {  // once pinned, the axis note under the controls says what the cut follows
        ImGui::TextDisabled("click the surface to pin");
    }
}

// What the plot shows: the gains on a polar or a rectangular plot, or each component's phase
// (rectangular: a phase has no radius). One small combo, so it fits beside "Components..".
void plot_view_combo(ViewerSettings& st, bool key_hint) {
    const char* views[] = {"polar", "rect", "phase"};
    int v = st.cut_phase ? 2 : st.polar_plot ? 0 : 1;
    ImGui::SetNextItemWidth(ImGui::CalcTextSize("phase").x + ImGui::GetFrameHeight() + 2 * ImGui::GetStyle().FramePadding.x);
    if (ImGui::Combo("##plotview", &v, views, 3)) {
        st.cut_phase = v == 2;
        if (v < 2) st.polar_plot = v == 0;
    }
    if (ImGui::IsItemHovered())
        ImGui::SetTooltip("polar / rect: the gain of each component (key P switches)\n"
                          "phase: the phase of each component along the cut, deg, relative to the\n"
                          "phase reference that the Probe panel names (total has none)");
    if (!key_hint) return;
    ImGui::SameLine();
    ImGui::TextDisabled("plot (P)");
}

void cut_export_row(const AppState& s, Intents& in) {
    if (ImGui::SmallButton("Export cut as"))
        in.push_back(intent::ExportCut{timestamped_name("ellipsa-cut", cut_export_formats[s.cut_export_format]), false});
    if (ImGui::IsItemHovered()) ImGui::SetTooltip("Write this cut to the current folder, as with 'ellipsa cut'");
    ImGui::SameLine();
    ImGui::SetNextItemWidth(70);
    int fmt = s.cut_export_format;
    if (ImGui::Combo("##fmt", &fmt, cut_export_formats, int(std::size(cut_export_formats)))) in.push_back(intent::SetCutExportFormat{fmt});
}

// A checkbox per component the data can give, in two columns of `width`.
void component_checks(const FarFieldSet& a, ViewerSettings& st, float width) {
    int shown = 0;
    for (Component c : all_components) {
        if (c == Component::vertical || c == Component::horizontal) continue;  // same as theta and phi here
        if (component_unavailable(a, c)) continue;
        bool on = (st.cut_components >> unsigned(c)) & 1u;
        if (shown++ % 2) ImGui::SameLine(width * 0.5f);
        if (ImGui::Checkbox(short_label(c), &on)) st.cut_components ^= 1u << unsigned(c);
    }
}

// The controls as a column beside the plot; the components as checkboxes when the column is
// tall enough (leaving `keep` px under them), else in a popup beside the polar switch.
void cut_controls(const AppState& s, const FarFieldSet& a, float width, float keep, Intents& in) {
    ViewerSettings st = s.settings;
    cut_kind_rows(s, st);
    cut_export_row(s, in);
    append(in, export_outcome_line(s.cut_export, ExportTarget::cut));
    if (ImGui::GetContentRegionAvail().y >= 6 * ImGui::GetFrameHeightWithSpacing() + keep) {
        plot_view_combo(st, true);
        ImGui::Separator();
        ImGui::TextDisabled("Components");
        component_checks(a, st, width);
    } else {
        if (ImGui::SmallButton("Components..")) ImGui::OpenPopup("cutcomponents");
        if (ImGui::BeginPopup("cutcomponents")) {
            component_checks(a, st, 220);
            ImGui::EndPopup();
        }
        ImGui::SameLine();
        plot_view_combo(st, false);
    }
    if (!(st == s.settings)) in.push_back(intent::ChangeSettings{st});
}

// Why there is no cut to show, or nothing.
std::optional<std::string> no_cut_text(const AppState& s, const CutData& cd) {
    if (cd.a && cd.peak_db && s.settings.cut_phase && !s.active_pattern()->set.has_phase())
        return "No phase: the data are " + std::string(to_string(s.active_pattern()->set.content)) +
               " (no phase). Untick \"phase\" to see the gains.";
    if (cd.a && cd.peak_db && s.settings.cut_phase && no_phase_component(*cd.a)) return std::string(no_phase_component_text);
    if (cd.a && cd.peak_db) return std::nullopt;
    if (!cd.why.empty()) return "No cut: " + cd.why + ".";
    return !cd.valid && s.settings.cut_kind == 2 ? "Pin a direction to cut through it."
           : !cd.valid                            ? "Choose at least one component."
                                                  : "No power on this cut: every chosen component is zero here.";
}

// The phase view's grid: -180..180 deg, a line every 45 deg, labels every 90; angles as rect_grid.
void phase_grid(ImDrawList* dl, const PlotFrame& f) {
    for (double v = exports::phase_axis_lo_deg; v <= exports::phase_axis_hi_deg; v += exports::phase_tick_deg) {
        const float y = f.at(f.a0, (v - exports::phase_axis_lo_deg) / 360).y;
        dl->AddLine(ImVec2(f.p0.x, y), ImVec2(f.p1.x, y), std::fmod(v, 90) == 0 ? grid : grid_minor);
        if (std::fmod(v, 90) != 0) continue;
        char b[16];
        std::snprintf(b, sizeof b, "%g\u00b0", v);
        const ImVec2 ts = ImGui::CalcTextSize(b);
        dl->AddText(ImVec2(f.p0.x - ts.x - 4, y - ts.y * 0.5f), muted, b);
    }
    const int xstep = (f.p1.x - f.p0.x) / 8 < 48 ? 90 : 45;
    for (int a = int(f.a0); a <= int(f.a0) + 360; a += xstep) {
        const float x = f.p0.x + float(a - f.a0) / 360 * (f.p1.x - f.p0.x);
        dl->AddLine(ImVec2(x, f.p0.y), ImVec2(x, f.p1.y), grid);
        char b[16];
        std::snprintf(b, sizeof b, "%d\u00b0", a);
        const ImVec2 ts = ImGui::CalcTextSize(b);
        dl->AddText(ImVec2(x - ts.x * 0.5f, f.p1.y + 2), muted, b);
    }
    dl->AddRect(f.p0, f.p1, IM_COL32(160, 160, 160, 255));
}

// One phase line in curve k's colour, broken where there is no phase, at wraps
// (exports::break_at_wraps, as in the files) and where the angle axis wraps round.
void phase_curve(ImDrawList* dl, const PlotFrame& f, const std::vector<double>& angle, const std::vector<double>& phase,
                 std::size_t k) {
    std::vector<double> x, y;
    exports::break_at_wraps(angle, phase, x, y);
    std::vector<ImVec2> pts;
    auto flush = [&] {
        if (pts.size() > 1) dl->AddPolyline(pts.data(), int(pts.size()), curve_u32(k), 0, curve_width(k));
        pts.clear();
    };
    for (std::size_t i = 0; i < x.size(); ++i) {
        if (std::isnan(y[i])) {
            flush();
            continue;
        }
        const ImVec2 q = f.at(x[i], (y[i] - exports::phase_axis_lo_deg) / 360);
        if (!pts.empty() && q.x < pts.back().x) flush();
        pts.push_back(q);
    }
    flush();
}

// The phase view: A's components, then B's, in the colours of the gain view's curves.
void phase_plot(const AppState& s, const CutData& cd, const exports::CutPlot& fig, const PlotFrame& f) {
    ImDrawList* dl = ImGui::GetWindowDrawList();
    draw_no_data(dl, f, fig);
    phase_grid(dl, f);
    std::size_t k = 0;
    const LoadedPattern* b = s.compare_pattern();
    for (const auto& [set, cut] : {std::pair{&s.active_pattern()->set, &cd.a}, std::pair{b ? &b->set : nullptr, &cd.b}}) {
        if (!set || !*cut) continue;
        for (const std::vector<double>& ph : exports::cut_phases(*set, **cut)) phase_curve(dl, f, (*cut)->samples.angle_deg, ph, k++);
    }
    const FarFieldSet& a = s.active_pattern()->set;
    std::string ref = "\u2220 relative to " + exports::phase_reference_text(a, cd.a->freq_index);
    if (ImGui::CalcTextSize(ref.c_str()).x >= f.p1.x - f.p0.x - 8)  // the point itself is in the Probe panel
        ref = exports::reference_shift_text(a, cd.a->freq_index).empty() ? "\u2220 re the file's origin" : "\u2220 re the moved reference";
    const ImVec2 ts = ImGui::CalcTextSize(ref.c_str());
    if (ts.x < f.p1.x - f.p0.x - 8) halo_text(dl, ImVec2(f.p1.x - ts.x - 4, f.p0.y - ts.y - 1), muted, ref.c_str());
}

// The plot, filling the current child: the figure the export writes.
void cut_plot(const AppState& s, const CutData& cd, const exports::CutPlot& fig) {
    const DbScale sc = exports::plot_scale(fig);
    const ImVec2 o = ImGui::GetCursorScreenPos(), avail = ImGui::GetContentRegionAvail();
    ImDrawList* dl = ImGui::GetWindowDrawList();
    PlotFrame f;
    const bool phase = s.settings.cut_phase;
    f.polar = s.settings.polar_plot && !phase;
    f.full_turn = cd.spec.kind == CutKind::theta_const;
    f.a0 = cd.angle_deg.front();
    if (f.polar) {
        f.R = std::max(20.0f, std::min(avail.x * 0.5f - polar_label_room.x, avail.y * 0.5f - polar_label_room.y));
        f.c = ImVec2(o.x + avail.x * 0.5f, o.y + avail.y * 0.5f);
    } else {
        f.p0 = ImVec2(o.x + 40, o.y + 18);
        f.p1 = ImVec2(o.x + avail.x - 14, o.y + avail.y - 20);
    }
    if (phase) return phase_plot(s, cd, fig, f);
    draw_no_data(dl, f, fig);
    if (f.polar) polar_grid(dl, f, sc, !f.full_turn);
    else rect_grid(dl, f, sc, fig.value_unit);
    draw_curves(dl, f, fig, sc);
    if (f.polar) polar_ring_labels(dl, f, fig, sc);
    draw_marks(dl, f, fig, sc);
}
}  // namespace

CutPanelLayout cut_panel_layout(ImVec2 avail, std::size_t curves, float line, float gap) {
    CutPanelLayout L;
    const float below = curves ? line * (float(curves) + 1) + 6 : 0;  // the table: its header and a row per curve
    L.turned = avail.x < 560 || avail.y - below < cut_plot_min;
    if (L.turned) {  // the plot over the full height, as wide as its labels need; the rest beside it
        const float w = std::max(0.0f, std::min(avail.y + 2 * (polar_label_room.x - polar_label_room.y), avail.x - gap - 230));
        L.controls_w = avail.x - gap - w;
        L.top_h = avail.y;
        L.plot = ImVec2(w, avail.y);
        return L;
    }
    L.top_h = avail.y - below;
    L.controls_w = std::clamp(avail.x * 0.36f, 180.0f, 228.0f);
    L.plot = ImVec2(std::max(0.0f, avail.x - gap - L.controls_w), L.top_h);
    return L;
}

// Controls beside the plot, with the axis in words under them; the figure's table under both,
// or, in a narrow panel, turned in the controls' column so the plot keeps the full height.
Intents draw_cut_panel(const AppState& s, const Derived& d) {
    Intents in;
    const LoadedPattern* a = s.active_pattern();
    if (!a) return in;
    const CutData& cd = d.cut.value();
    const std::optional<std::string> none = no_cut_text(s, cd);
    std::optional<exports::CutPlot> fig;
    if (!none) fig = cut_figure(s, cd);
    const CutPanelLayout L = cut_panel_layout(ImGui::GetContentRegionAvail(), fig ? fig->curves.size() : 0,
                                              ImGui::GetTextLineHeightWithSpacing(), ImGui::GetStyle().ItemSpacing.x);
    ImGui::BeginChild("cutcontrols", ImVec2(L.controls_w, L.top_h), false);
    // Room kept under the controls: the axis note (three lines), and in a narrow panel the table.
    const float line = ImGui::GetTextLineHeightWithSpacing();
    cut_controls(s, a->set, L.controls_w, 3 * line + (L.turned && fig ? line * 6 : 0), in);
    if (fig) figure_key(*fig);
    if (fig && L.turned) figure_table_turned(*fig);
    ImGui::EndChild();
    ImGui::SameLine();
    ImGui::BeginChild("cutplot", L.plot, false, ImGuiWindowFlags_NoScrollbar);
    if (fig) cut_plot(s, cd, *fig);
    else ImGui::TextWrapped("%s", none->c_str());
    ImGui::EndChild();
    if (fig && !L.turned) figure_table(*fig);
    return in;
}

}  // namespace ellipsa::viewer
