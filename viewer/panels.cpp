#include "viewer/panels.hpp"

#include <imgui.h>

#include <cmath>
#include <cstdio>
#include <filesystem>
#include <cstdlib>

#include "pattern/interpolate.hpp"
#include "pattern/polarisation.hpp"
#include "viewer/scene/components.hpp"

namespace ellipsa::viewer {

void Intents::merge(const Intents& o) {
    open.insert(open.end(), o.open.begin(), o.open.end());
    if (!o.open_map.empty()) open_map = o.open_map;
    if (o.close >= 0) close = o.close;
    cancel_load |= o.cancel_load;
    rebuild_surface |= o.rebuild_surface;
    rebuild_glyphs |= o.rebuild_glyphs;
    recut |= o.recut;
    reset_view |= o.reset_view;
    export_view |= o.export_view;
    if (!o.export_cut.empty()) export_cut = o.export_cut;
}

namespace {
std::string opt_text(const std::optional<double>& v, const char* unit, const char* none) {
    if (!v) return none;
    char b[64];
    std::snprintf(b, sizeof b, "%.2f %s", *v, unit);
    return b;
}
void help_marker(const char* text) {
    ImGui::SameLine();
    ImGui::TextDisabled("(?)");
    if (ImGui::IsItemHovered()) {
        ImGui::BeginTooltip();
        ImGui::PushTextWrapPos(ImGui::GetFontSize() * 28);
        ImGui::TextUnformatted(text);
        ImGui::PopTextWrapPos();
        ImGui::EndTooltip();
    }
}
// One-line definitions with units, for tooltips (IEEE Std 145-2013 terms).
const char* definition(const std::string& label) {
    if (label == "Axial ratio") return "Major over minor axis of the polarisation ellipse, in dB; 0 dB is circular, infinite is linear";
    if (label == "Tilt") return "Angle of the ellipse's major axis from theta-hat toward phi-hat, degrees in (-90, 90]";
    if (label == "Sense") return "Right-hand: the field turns clockwise seen along the direction of propagation (IEEE Std 145)";
    if (label == "Stokes I") return "Total power density |E_theta|^2 + |E_phi|^2, linear units of the file's quantity";
    if (label == "Q/I U/I V/I") return "Normalised Stokes parameters: Q theta-vs-phi linear, U +-45 deg linear, V > 0 right-hand";
    if (label == "RHCP" || label == "LHCP") return "Circular partial gain, dBic";
    if (label.rfind("Co-polar", 0) == 0 || label.rfind("Cross-polar", 0) == 0)
        return "Ludwig's third definition (IEEE Trans. AP-21, 1973), with the file's reference";
    if (label == "Vertical" || label == "Horizontal") return "Relative to the horizon of an antenna whose up axis is +z: the theta and phi parts";
    return nullptr;
}

void row(const char* label, const std::string& value, const char* tip = nullptr) {
    ImGui::TableNextRow();
    ImGui::TableSetColumnIndex(0);
    ImGui::TextDisabled("%s", label);
    if (tip && ImGui::IsItemHovered()) ImGui::SetTooltip("%s", tip);
    ImGui::TableSetColumnIndex(1);
    ImGui::TextUnformatted(value.c_str());
}
}  // namespace

// --- Patterns ---------------------------------------------------------------------------------
Intents draw_patterns_panel(AppState& s) {
    Intents in;
    ImGui::PushTextWrapPos(0);
    ImGui::TextDisabled("Open a far-field CSV by path, from the recent list, or drop files on the window.");
    ImGui::PopTextWrapPos();
    char buf[1024];
    std::snprintf(buf, sizeof buf, "%s", s.path_input.c_str());
    ImGui::SetNextItemWidth(-70);
    const bool enter = ImGui::InputTextWithHint("##path", "path/to/pattern.csv", buf, sizeof buf,
                                                ImGuiInputTextFlags_EnterReturnsTrue);
    s.path_input = buf;
    ImGui::SameLine();
    if ((ImGui::Button("Open", ImVec2(-1, 0)) || enter) && !s.path_input.empty()) {
        in.open.push_back(s.path_input);
        in.open_map = s.map_input;
    }
    if (ImGui::TreeNode("Column map for foreign layouts")) {
        std::snprintf(buf, sizeof buf, "%s", s.map_input.c_str());
        ImGui::SetNextItemWidth(-1);
        ImGui::InputTextWithHint("##map", "map file (optional)", buf, sizeof buf);
        s.map_input = buf;
        ImGui::PushTextWrapPos(0);
        ImGui::TextDisabled("Without one, a .map file beside the CSV that names it is used.");
        ImGui::PopTextWrapPos();
        ImGui::TreePop();
    }
    if (!s.settings.recent_files.empty()) {
        ImGui::SetNextItemWidth(-1);
        if (ImGui::BeginCombo("##recent", "Recent files", ImGuiComboFlags_HeightLarge)) {
            for (const std::string& f : s.settings.recent_files)
                if (ImGui::Selectable(f.c_str())) in.open.push_back(f);
            ImGui::EndCombo();
        }
    }
    if (s.loading) {
        const std::string name = std::filesystem::path(s.loading->path).filename().string();
        ImGui::TextDisabled("Reading %s%s", name.c_str(), s.to_load.empty() ? "" : " (more waiting)");
        ImGui::ProgressBar(float(s.loading->progress.load()), ImVec2(-70, 0));
        ImGui::SameLine();
        if (ImGui::Button("Cancel", ImVec2(-1, 0))) in.cancel_load = true;
    }
    if (!s.load_error.empty()) {
        ImGui::PushStyleColor(ImGuiCol_ChildBg, ImVec4(0.99f, 0.93f, 0.91f, 1));
        ImGui::BeginChild("loaderror", ImVec2(0, ImGui::GetTextLineHeightWithSpacing() * 4.2f), true);
        ImGui::PushStyleColor(ImGuiCol_Text, ImVec4(0.55f, 0.12f, 0.08f, 1));
        ImGui::TextWrapped("Not loaded: %s", s.load_error.c_str());
        ImGui::PopStyleColor();
        if (ImGui::SmallButton("Dismiss")) s.load_error.clear();
        ImGui::EndChild();
        ImGui::PopStyleColor();
    }
    ImGui::Spacing();
    ImGui::TextDisabled("Patterns: A is shown, tick B to compare");
    if (ImGui::BeginTable("patterns", 3, ImGuiTableFlags_RowBg | ImGuiTableFlags_BordersInnerH)) {
        ImGui::TableSetupColumn("name", ImGuiTableColumnFlags_WidthStretch);
        ImGui::TableSetupColumn("B", ImGuiTableColumnFlags_WidthFixed, 24);
        ImGui::TableSetupColumn("x", ImGuiTableColumnFlags_WidthFixed, 18);
        for (int i = 0; i < int(s.patterns.size()); ++i) {
            ImGui::PushID(i);
            ImGui::TableNextRow();
            ImGui::TableSetColumnIndex(0);
            const LoadedPattern& p = s.patterns[std::size_t(i)];
            std::string label = (i == s.active ? "A  " : "   ") + (p.set.name.empty() ? std::string("(unnamed)") : p.set.name);
            if (ImGui::Selectable(label.c_str(), i == s.active)) {
                if (s.active != i) {
                    s.active = i;
                    if (s.compare == i) s.compare = -1;
                    in.rebuild_surface = in.recut = true;
                }
            }
            if (ImGui::IsItemHovered())
                ImGui::SetTooltip("%s\n%s, %s, %zu frequenc%s", p.path.empty() ? p.set.source.c_str() : p.path.c_str(),
                                  to_string(p.set.quantity), to_string(p.set.content), p.set.frequencies.size(),
                                  p.set.frequencies.size() == 1 ? "y" : "ies");
            ImGui::TableSetColumnIndex(1);
            bool is_b = s.compare == i;
            if (i != s.active && ImGui::Checkbox("##b", &is_b)) {
                s.compare = is_b ? i : -1;
                in.rebuild_surface = in.recut = true;
            }
            if (ImGui::IsItemHovered()) ImGui::SetTooltip("Compare with A: difference surface and overlaid cuts");
            ImGui::TableSetColumnIndex(2);
            if (ImGui::SmallButton("x")) in.close = i;
            if (ImGui::IsItemHovered()) ImGui::SetTooltip("Close this pattern");
            ImGui::PopID();
        }
        ImGui::EndTable();
    }
    const LoadedPattern* a = s.active_pattern();
    if (!a) return in;
    const std::size_t nf = a->set.frequencies.size();
    if (nf > 1) {
        int f = int(s.freq);
        ImGui::SetNextItemWidth(-1);
        if (ImGui::SliderInt("##freq", &f, 0, int(nf) - 1, format_frequency(a->set.frequencies[std::size_t(f)].frequency_hz).c_str())) {
            s.freq = std::size_t(f);
            in.rebuild_surface = in.recut = true;
        }
    } else {
        ImGui::Text("Frequency  %s", format_frequency(a->set.frequencies.empty() ? 0 : a->set.frequencies[0].frequency_hz).c_str());
    }
    if (const PatternSummary* sm = s.summary()) {
        const char* u = a->set.quantity == Quantity::relative ? "dB" : "dBi";
        if (ImGui::BeginTable("figures", 2, ImGuiTableFlags_SizingStretchProp)) {
            char b[96];
            std::snprintf(b, sizeof b, "%.2f %s  (\u03b8 %.0f\u00b0, \u03c6 %.0f\u00b0)", sm->peak_db, u, sm->peak.theta_deg,
                          sm->peak.phi_deg);
            row("Peak", b, "Largest total value and its direction");
            row("Directivity", opt_text(sm->directivity_dbi, "dBi", "needs the full sphere"),
                "4 pi U_max / P over the whole sphere");
            if (sm->power.radiation_efficiency) {
                std::snprintf(b, sizeof b, "%.1f %%", 100 * *sm->power.radiation_efficiency);
                row("Efficiency", b, "Radiated power over 4 pi, from absolute gain data");
            }
            row("HPBW elev.", opt_text(sm->hpbw_elevation_deg, "\u00b0", "none"), "Half-power beamwidth on the phi = const cut through the peak");
            row("HPBW azim.", opt_text(sm->hpbw_azimuth_deg, "\u00b0", "none (omni)"), "Half-power beamwidth across it");
            row("Front/back", opt_text(sm->front_to_back_db, "dB", "n/a"), "Peak against the opposite direction");
            std::string pol = "n/a";
            if (sm->sense) {
                if (*sm->sense == Sense::linear) pol = "linear (AR infinite)";
                else if (*sm->sense == Sense::none) pol = "no field";
                else if (sm->axial_ratio_db && *sm->axial_ratio_db > 40)  // as the glyphs and the pinned ellipse
                    pol = "nearly linear, AR " + opt_text(sm->axial_ratio_db, "dB", "?");
                else pol = std::string(to_string(*sm->sense)) + "-hand, AR " + opt_text(sm->axial_ratio_db, "dB", "?");
            }
            row("Pol. at peak", pol, "Sense and axial ratio at the peak (IEEE Std 145)");
            ImGui::EndTable();
        }
    }
    if (!s.note.empty()) ImGui::TextDisabled("%s", s.note.c_str());
    return in;
}

// --- Surface ----------------------------------------------------------------------------------
Intents draw_surface_panel(AppState& s) {
    Intents in;
    ViewerSettings& st = s.settings;
    const LoadedPattern* a = s.active_pattern();
    ImGui::SetNextItemWidth(-90);
    if (ImGui::BeginCombo("Radius", label_of(st.component))) {
        for (Component c : all_components) {
            const std::string why = a ? unavailable_reason(a->set, c) : "";
            if (ImGui::Selectable(label_of(c), c == st.component, why.empty() ? 0 : ImGuiSelectableFlags_Disabled)) {
                st.component = c;
                in.rebuild_surface = in.recut = true;
            }
            if (!why.empty() && ImGui::IsItemHovered(ImGuiHoveredFlags_AllowWhenDisabled)) ImGui::SetTooltip("%s", why.c_str());
        }
        ImGui::EndCombo();
    }
    help_marker("The shown component sets the radius: its dB value from (peak - range) at the centre to the peak at radius 1.");
    ImGui::SetNextItemWidth(-90);
    if (ImGui::BeginCombo("Colour", label_of(st.color_by))) {
        for (ColorBy c : all_color_by) {
            std::string why = a ? unavailable_reason(a->set, c) : "";
            if (c == ColorBy::difference && !s.compare_pattern()) why = "Tick B beside a second pattern first";
            if (ImGui::Selectable(label_of(c), c == st.color_by, why.empty() ? 0 : ImGuiSelectableFlags_Disabled)) {
                st.color_by = c;
                in.rebuild_surface = true;
            }
            if (!why.empty() && ImGui::IsItemHovered(ImGuiHoveredFlags_AllowWhenDisabled)) ImGui::SetTooltip("%s", why.c_str());
        }
        ImGui::EndCombo();
    }
    help_marker("Axial ratio: 0 dB is circular. RHCP minus LHCP: positive where right-hand dominates. Tilt: angle of the "
                "ellipse's major axis from theta-hat toward phi-hat (cyclic colours). A minus B: the same component of the two "
                "patterns, in dB.");
    if (st.color_by == ColorBy::component || st.color_by == ColorBy::axial_ratio) {
        ImGui::SetNextItemWidth(-90);
        if (ImGui::BeginCombo("Map", to_string(st.gain_map))) {
            for (ColorMap m : {ColorMap::viridis, ColorMap::cividis, ColorMap::magma})
                if (ImGui::Selectable(to_string(m), m == st.gain_map)) {
                    st.gain_map = m;
                    in.rebuild_surface = true;
                }
            ImGui::EndCombo();
        }
    }
    float range = float(st.range_db);
    ImGui::SetNextItemWidth(-90);
    if (ImGui::SliderFloat("Range", &range, 5, 60, "%.0f dB")) {
        st.range_db = range;
        in.rebuild_surface = in.recut = true;
    }
    help_marker("Dynamic range below the peak that the radius spans (also the depth of the cut plot).");
    ImGui::Separator();
    if (ImGui::Checkbox("Wireframe", &st.wireframe)) {}
    ImGui::SameLine(ImGui::GetContentRegionAvail().x * 0.5f);
    ImGui::Checkbox("Translucent", &st.translucent);
    if (ImGui::Checkbox("Polarisation ellipses", &st.glyphs)) in.rebuild_glyphs = true;
    help_marker("Small ellipses on the surface: their shape and tilt are the field's, orange turns right-hand, blue "
                "left-hand, black is linear (AR above 40 dB). The arrowhead shows the sense of rotation seen along the "
                "direction of propagation.");
    if (st.glyphs) {
        float sp = float(st.glyph_spacing_deg);
        ImGui::SetNextItemWidth(-90);
        if (ImGui::SliderFloat("Spacing", &sp, 6, 30, "%.0f\u00b0")) {
            st.glyph_spacing_deg = sp;
            in.rebuild_glyphs = true;
        }
    }
    ImGui::TextDisabled("Look from");
    const struct {
        const char* label;
        OrbitCamera::Preset p;
    } presets[] = {{"+x", OrbitCamera::Preset::px}, {"-x", OrbitCamera::Preset::nx}, {"+y", OrbitCamera::Preset::py},
                   {"-y", OrbitCamera::Preset::ny}, {"top", OrbitCamera::Preset::pz}, {"bottom", OrbitCamera::Preset::nz}};
    for (int k = 0; k < 6; ++k) {
        if (k) ImGui::SameLine();
        if (ImGui::SmallButton(presets[k].label)) s.camera.look_from(presets[k].p);
        if (ImGui::IsItemHovered()) ImGui::SetTooltip("key %d", k + 1);
    }
    if (ImGui::SmallButton("Reset view")) in.reset_view = true;
    ImGui::SameLine();
    if (ImGui::SmallButton("Export view as PNG")) in.export_view = true;
    if (!s.export_message.empty()) ImGui::TextWrapped("%s", s.export_message.c_str());
    return in;
}

// --- Probe ---
void draw_probe_panel(AppState& s) {
    const LoadedPattern* a = s.active_pattern();
    if (!a) return;
    const LoadedPattern* b = s.compare_pattern();
    auto show = [&](const char* title, const Pick& p) {
        ImGui::TextUnformatted(title);
        if (ImGui::BeginTable(title, 2, ImGuiTableFlags_SizingStretchProp | ImGuiTableFlags_RowBg)) {
            for (const ProbeRow& r : probe_rows(a->set, s.freq, p.theta_deg, p.phi_deg)) row(r.label.c_str(), r.value, definition(r.label));
            if (b) {
                // The compared pattern at the same direction: its shown component and A minus B.
                const Component c = s.settings.component;
                const std::vector<ProbeRow> rb = probe_rows(b->set, s.freq_for(*b), p.theta_deg, p.phi_deg);
                const std::vector<ProbeRow> ra = probe_rows(a->set, s.freq, p.theta_deg, p.phi_deg);
                for (const ProbeRow& r : rb)
                    if (r.label == label_of(c)) {
                        row(("B: " + r.label).c_str(), r.value, "The same component of the compared pattern B");
                        for (const ProbeRow& q : ra)
                            if (q.label == r.label) {
                                const double va = std::atof(q.value.c_str()), vb = std::atof(r.value.c_str());
                                char d[48];
                                std::snprintf(d, sizeof d, "%+.2f dB", va - vb);
                                if (q.value.find("inf") == std::string::npos && r.value.find("inf") == std::string::npos)
                                    row("A minus B", d, "Difference of the shown component, dB");
                            }
                    }
            }
            ImGui::EndTable();
        }
    };
    if (s.pinned) {
        show("Pinned direction", *s.pinned);
        if (ImGui::SmallButton("Unpin (Esc)")) s.pinned.reset();
        ImGui::Spacing();
    }
    if (s.hover)
        show("Under the cursor", *s.hover);
    else if (!s.pinned)
        ImGui::TextWrapped("Point at the surface to read every component, the axial ratio, tilt, sense and Stokes "
                           "parameters there. Click to pin a direction.");
}

// --- First run ---
void draw_intro_overlay(AppState& s) {
    if (!s.show_intro) return;
    const ImVec2 d = ImGui::GetIO().DisplaySize;
    ImGui::SetNextWindowPos(ImVec2(d.x * 0.5f, d.y * 0.45f), ImGuiCond_Always, ImVec2(0.5f, 0.5f));
    ImGui::SetNextWindowSize(ImVec2(std::min(560.0f, d.x - 40), 0), ImGuiCond_Always);
    ImGui::SetNextWindowBgAlpha(0.98f);
    if (ImGui::Begin("What you are looking at", nullptr,
                     ImGuiWindowFlags_NoCollapse | ImGuiWindowFlags_NoSavedSettings | ImGuiWindowFlags_AlwaysAutoResize)) {
        ImGui::PushTextWrapPos(0);
        const char* lines[][2] = {
            {"3D view", "The gain surface: its radius is the chosen component in dB, from the range floor at the centre to "
                        "the peak. Drag to turn, wheel to zoom, click to pin a direction."},
            {"Patterns", "The loaded files (A is shown; tick B to compare), the frequency and the headline figures."},
            {"Surface", "What sets the radius, what sets the colour (axial ratio, RHCP minus LHCP, tilt, A minus B), "
                        "the dynamic range and the polarisation ellipses."},
            {"Probe", "Every component, the axial ratio, tilt, sense and Stokes parameters under the cursor or at the pin."},
            {"Polarisation", "The pinned field's ellipse seen along propagation, and the Poincare sphere with the states "
                             "of all directions near the peak: a wide cloud means the polarisation varies over the beam."},
            {"Cut", "A polar or rectangular cut with -3 dB marks, HPBW and front-to-back; the cut shows as a ring "
                    "on the surface."},
        };
        for (auto& l : lines) {
            ImGui::TextUnformatted(l[0]);
            ImGui::SameLine(110);
            ImGui::TextDisabled("%s", l[1]);
        }
        ImGui::Spacing();
        ImGui::TextDisabled("F1 lists the keys. This note appears once.");
        ImGui::PopTextWrapPos();
        if (ImGui::Button("Got it", ImVec2(120, 0))) {
            s.show_intro = false;
            s.settings.seen_intro = true;
        }
    }
    ImGui::End();
}

// --- Help -------------------------------------------------------------------------------------
void draw_help_overlay(AppState& s) {
    if (!s.show_help) return;
    const ImVec2 d = ImGui::GetIO().DisplaySize;
    ImGui::SetNextWindowPos(ImVec2(d.x * 0.5f, d.y * 0.5f), ImGuiCond_Always, ImVec2(0.5f, 0.5f));
    ImGui::SetNextWindowBgAlpha(0.97f);
    if (ImGui::Begin("Keys and mouse", &s.show_help,
                     ImGuiWindowFlags_AlwaysAutoResize | ImGuiWindowFlags_NoCollapse | ImGuiWindowFlags_NoSavedSettings)) {
        const char* keys[][2] = {
            {"drag (left)", "turn the pattern"},
            {"wheel", "zoom"},
            {"double-click", "reset the view"},
            {"click", "pin the direction under the cursor"},
            {"Esc", "unpin / close this help"},
            {"1 2 3 4 5 6", "look from +x, -x, +y, -y, top, bottom"},
            {"R", "reset the view"},
            {"W", "wireframe on/off"},
            {"T", "translucent surface on/off"},
            {"G", "polarisation ellipses on/off"},
            {"C / Shift+C", "next / previous component"},
            {"V", "next colouring"},
            {"P", "polar / rectangular cut plot"},
            {"Page Up / Down", "previous / next frequency"},
            {"Tab", "next pattern"},
            {"Ctrl+E", "export the 3D view as PNG"},
            {"F1 or ?", "this help"},
        };
        if (ImGui::BeginTable("keys", 2, ImGuiTableFlags_SizingFixedFit)) {
            for (auto& k : keys) {
                ImGui::TableNextRow();
                ImGui::TableSetColumnIndex(0);
                ImGui::TextUnformatted(k[0]);
                ImGui::TableSetColumnIndex(1);
                ImGui::TextDisabled("%s", k[1]);
            }
            ImGui::EndTable();
        }
    }
    ImGui::End();
}

}  // namespace ellipsa::viewer
