#include "viewer/panels.hpp"

#include <imgui.h>

#include <cmath>
#include <cstdio>
#include <filesystem>

#include "exports/figure_text.hpp"
#include "viewer/exports_ui.hpp"
#include "viewer/scene/components.hpp"
#include "viewer/widgets.hpp"

namespace ellipsa::viewer {

namespace {
// A figure with the project's one rounding (exports/figure_text.hpp): dB to 2 decimals, angles to 1.
std::string opt_text(const std::optional<double>& v, const char* unit, const char* none) {
    if (!v) return none;
    const bool angle = std::string(unit) == "\u00b0";
    return exports::with_unit(*v, angle ? exports::angle_decimals : exports::db_decimals, unit);
}

// A text field bound to a state string: returns the edited text when it changed.
std::optional<std::string> text_field(const char* id, const char* hint, const std::string& value, bool* enter = nullptr) {
    char buf[1024];
    std::snprintf(buf, sizeof buf, "%s", value.c_str());
    const bool entered = ImGui::InputTextWithHint(id, hint, buf, sizeof buf, enter ? ImGuiInputTextFlags_EnterReturnsTrue : 0);
    if (enter) *enter = entered;
    if (value != buf) return std::string(buf);
    return std::nullopt;
}

// --- Patterns: opening files ---
void open_controls(const AppState& s, Intents& in) {
    ImGui::PushTextWrapPos(0);
    ImGui::TextDisabled("Open a far-field CSV by path, by browsing, from the recent list, or drop files on the window.");
    ImGui::PopTextWrapPos();
    ImGui::SetNextItemWidth(-70);
    bool enter = false;
    std::string path = s.path_input;
    if (auto t = text_field("##path", "path/to/pattern.csv", s.path_input, &enter)) {
        in.push_back(intent::EditPath{*t});
        path = *t;
    }
    ImGui::SameLine();
    if ((ImGui::Button("Open", ImVec2(-1, 0)) || enter) && !path.empty()) in.push_back(intent::OpenFiles{{path}, s.map_input});
    if (ImGui::TreeNode("Column map for foreign layouts")) {
        ImGui::SetNextItemWidth(-1);
        if (auto t = text_field("##map", "map file (optional)", s.map_input)) in.push_back(intent::EditMap{*t});
        ImGui::PushTextWrapPos(0);
        ImGui::TextDisabled("Without one, a .map file beside the CSV that names it is used.");
        ImGui::PopTextWrapPos();
        ImGui::TreePop();
    }
    if (ImGui::Button("Browse...")) in.push_back(intent::OpenFileDialog{});
    if (ImGui::IsItemHovered()) ImGui::SetTooltip("Choose a file (Ctrl+O): the desktop's dialog, or the window's own");
    if (s.desktop_dialog_open) {
        ImGui::SameLine();
        ImGui::TextDisabled("(file dialog open)");
    }
    if (s.settings.recent_files.empty()) return;
    ImGui::SameLine();
    ImGui::SetNextItemWidth(-1);
    if (ImGui::BeginCombo("##recent", "Recent files", ImGuiComboFlags_HeightLarge)) {
        for (const std::string& f : s.settings.recent_files)
            if (ImGui::Selectable(f.c_str())) in.push_back(intent::OpenFiles{{f}, "", true});
        ImGui::EndCombo();
    }
}

void loading_and_error(const AppState& s, Intents& in) {
    if (s.loading) {
        const std::string name = std::filesystem::path(s.loading->path).filename().string();
        ImGui::TextDisabled("Reading %s%s", name.c_str(), s.loading->waiting ? " (more waiting)" : "");
        ImGui::ProgressBar(float(s.loading->progress), ImVec2(-70, 0));
        ImGui::SameLine();
        if (ImGui::Button("Cancel", ImVec2(-1, 0))) in.push_back(intent::CancelLoad{});
    }
    if (s.load_error.empty()) return;
    ImGui::PushStyleColor(ImGuiCol_ChildBg, ImVec4(0.99f, 0.93f, 0.91f, 1));
    ImGui::BeginChild("loaderror", ImVec2(0, ImGui::GetTextLineHeightWithSpacing() * 4.2f), true);
    ImGui::PushStyleColor(ImGuiCol_Text, ImVec4(0.55f, 0.12f, 0.08f, 1));
    ImGui::TextWrapped("Not loaded: %s", s.load_error.c_str());
    ImGui::PopStyleColor();
    if (ImGui::SmallButton("Dismiss")) in.push_back(intent::DismissLoadError{});
    ImGui::EndChild();
    ImGui::PopStyleColor();
}

// One pattern's name in the list, selectable, wrapped over at most three lines so that the part
// that tells files of one series apart (often the end) stays in view; a longer name keeps its
// start and its end (elide_middle). True when clicked.
bool pattern_name_row(const std::string& name, bool active) {
    const char* mark = active ? "A  " : "   ";
    const float indent = ImGui::CalcTextSize("A  ").x;
    const float w = std::max(ImGui::GetContentRegionAvail().x - indent, 40.0f);
    const float line = ImGui::GetTextLineHeight();
    std::string shown = name;
    if (ImGui::CalcTextSize(shown.c_str(), nullptr, false, w).y > 3.5f * line) shown = elide_middle(name, 2.6f * w);
    const float h = ImGui::CalcTextSize(shown.c_str(), nullptr, false, w).y;
    const ImVec2 at = ImGui::GetCursorScreenPos();
    const bool clicked = ImGui::Selectable("##name", active, 0, ImVec2(0, h));
    ImDrawList* dl = ImGui::GetWindowDrawList();
    const ImU32 ink = ImGui::GetColorU32(ImGuiCol_Text);
    dl->AddText(at, ink, mark);
    dl->AddText(ImGui::GetFont(), ImGui::GetFontSize(), ImVec2(at.x + indent, at.y), ink, shown.c_str(), nullptr, w);
    return clicked;
}

void pattern_table(const AppState& s, Intents& in) {
    text_wrapped_at_spaces("Patterns: A is shown, tick B to compare", true);  // wraps in a narrow panel
    if (!ImGui::BeginTable("patterns", 3, ImGuiTableFlags_RowBg | ImGuiTableFlags_BordersInnerH)) return;
    ImGui::TableSetupColumn("name", ImGuiTableColumnFlags_WidthStretch);
    ImGui::TableSetupColumn("B", ImGuiTableColumnFlags_WidthFixed, 24);
    ImGui::TableSetupColumn("x", ImGuiTableColumnFlags_WidthFixed, 18);
    for (int i = 0; i < int(s.patterns.size()); ++i) {
        const LoadedPattern& p = s.patterns[std::size_t(i)];
        ImGui::PushID(i);
        ImGui::TableNextRow();
        ImGui::TableSetColumnIndex(0);
        if (pattern_name_row(p.list_name(), i == s.active) && i != s.active) in.push_back(intent::SelectPattern{i});
        if (ImGui::IsItemHovered())
            ImGui::SetTooltip("%s\n%s%s%s\n%s, %s, %zu frequenc%s", p.list_name().c_str(),
                              p.path.empty() || !p.join.empty() ? p.set.source.c_str() : p.path.c_str(),
                              p.join.empty() ? "" : "\nname: ", p.join.empty() ? "" : p.set.name.c_str(),
                              to_string(p.set.quantity), to_string(p.set.content), p.set.frequencies.size(),
                              p.set.frequencies.size() == 1 ? "y" : "ies");
        ImGui::TableSetColumnIndex(1);
        bool is_b = s.compare == i;
        if (i != s.active && ImGui::Checkbox("##b", &is_b)) in.push_back(intent::SetCompare{is_b ? i : -1});
        if (ImGui::IsItemHovered()) ImGui::SetTooltip("Compare with A: difference surface and overlaid cuts");
        ImGui::TableSetColumnIndex(2);
        if (ImGui::SmallButton("x")) in.push_back(intent::ClosePattern{i});
        if (ImGui::IsItemHovered()) ImGui::SetTooltip("Close this pattern");
        ImGui::PopID();
    }
    ImGui::EndTable();
}

std::string polarisation_at_peak(const PatternSummary& sm) {
    return sm.sense ? exports::polarisation_text(*sm.sense, sm.axial_ratio_db) : std::string("n/a");
}

void headline_figures(const LoadedPattern& a, const PatternSummary& sm) {
    if (!begin_figure_table("figures")) return;
    const char* u = db_unit(a.set.quantity, Component::total);
    char b[96];
    // The peak and its direction on two rows, so a narrow panel never breaks a number.
    if (sm.zero_field || sm.peak_at_pole) {  // a pole has no phi: named instead
        table_row("Peak", exports::peak_text(sm, u, "\u00b0"), "Largest total value and its direction");
    } else {
        table_row("Peak", exports::with_unit(sm.peak_db, exports::db_decimals, u), "Largest total value (refined between samples)");
        table_row("  toward", "\u03b8 " + exports::with_unit(sm.peak.theta_deg, exports::angle_decimals, "\u00b0") + ", \u03c6 " +
                                  exports::with_unit(sm.peak.phi_deg, exports::angle_decimals, "\u00b0"),
                  "Direction of the peak");
    }
    table_row("Directivity", opt_text(sm.directivity_dbi, "dBi", "needs the full sphere"), "4 pi U_max / P over the whole sphere");
    if (sm.power.radiation_efficiency) {
        std::snprintf(b, sizeof b, "%.1f %%", 100 * *sm.power.radiation_efficiency);
        table_row("Efficiency", b, "Radiated power over 4 pi, from absolute gain data");
        if (sm.efficiency_above_100) table_row("Warning", "efficiency above 100 %", exports::efficiency_warning_text(*sm.power.radiation_efficiency).c_str());
    }
    // The planes by the one wording (exports::beam_plane_text): "elev." / "azim.", or at a pole,
    // where both are elevation planes and the peak's phi means nothing, "φ = 0°" / "φ = 90°".
    const std::string elev = exports::beam_plane_text(sm, false, "\u00b0", true), azim = exports::beam_plane_text(sm, true, "\u00b0", true);
    const char* planes_tip = sm.peak_at_pole ? " (the peak is at a pole: the planes phi = 0 and phi = 90)" : "";
    table_row(("HPBW " + elev).c_str(), exports::beamwidth_text(sm.elevation, "\u03b8", "\u00b0"),
              ("Half-power beamwidth on the phi = const cut through the peak" + std::string(planes_tip)).c_str());
    table_row(("HPBW " + azim).c_str(), exports::beamwidth_text(sm.azimuth, sm.peak_at_pole ? "\u03b8" : "angle", "\u00b0"),
              ("Half-power beamwidth on the great circle across it" + std::string(planes_tip)).c_str());
    table_row(("Side lobe " + elev).c_str(), exports::sidelobe_text(sm.elevation),
              ("Highest lobe outside the main beam on the phi = const cut through the peak (3 dB prominence)" + std::string(planes_tip)).c_str());
    table_row("Front/back", sm.front_to_back_above_db ? "above " + exports::fixed(*sm.front_to_back_above_db, 0) + " dB (null)"
                                                      : opt_text(sm.front_to_back_db, "dB", "n/a"),
              "Peak against the opposite direction");
    table_row("Pol. at peak", polarisation_at_peak(sm), "Sense and axial ratio at the peak (IEEE Std 145)");
    ImGui::EndTable();
}

void frequency_and_figures(const AppState& s, const Derived& d, Intents& in) {
    const LoadedPattern* a = s.active_pattern();
    if (!a) return;
    const std::size_t nf = a->set.frequencies.size();
    if (nf > 1) {
        int f = int(s.freq);
        ImGui::SetNextItemWidth(-1);
        if (ImGui::SliderInt("##freq", &f, 0, int(nf) - 1, format_frequency(a->set.frequencies[s.freq].frequency_hz).c_str(),
                             ImGuiSliderFlags_AlwaysClamp))
            in.push_back(intent::SetFrequency{std::size_t(f)});
    } else {
        ImGui::Text("Frequency  %s", format_frequency(nf ? a->set.frequencies[0].frequency_hz : 0).c_str());
    }
    if (const auto& sm = d.summary.value()) headline_figures(*a, *sm);
}
}  // namespace

Intents draw_patterns_panel(const AppState& s, const Derived& d) {
    Intents in;
    open_controls(s, in);
    loading_and_error(s, in);
    ImGui::Spacing();
    pattern_table(s, in);
    draw_mounting_section(s, in);
    draw_reference_section(s, in);
    ImGui::Spacing();
    frequency_and_figures(s, d, in);
    if (!s.note.empty()) ImGui::TextDisabled("%s", s.note.c_str());
    return in;
}

// --- Surface ---
namespace {
// The radius and colour choices, on a copy of the settings.
void surface_choices(const AppState& s, ViewerSettings& st) {
    const LoadedPattern* a = s.active_pattern();
    ImGui::SetNextItemWidth(-90);
    const Ludwig3Reference l3 = a ? a->set.ludwig3_reference : Ludwig3Reference::x;
    if (ImGui::BeginCombo("Radius", long_label(st.component, l3).c_str())) {
        for (Component c : all_components) {
            const std::string why = a ? component_unavailable(a->set, c).value_or("") : "";
            if (ImGui::Selectable(long_label(c, l3).c_str(), c == st.component, why.empty() ? 0 : ImGuiSelectableFlags_Disabled)) st.component = c;
            if (!why.empty() && ImGui::IsItemHovered(ImGuiHoveredFlags_AllowWhenDisabled)) ImGui::SetTooltip("%s", why.c_str());
        }
        ImGui::EndCombo();
    }
    help_marker("The shown component sets the radius: its dB value from (peak - range) at the centre to the peak at radius 1.");
    ImGui::SetNextItemWidth(-90);
    if (ImGui::BeginCombo("Colour", label_of(st.color_by))) {
        for (ColorBy c : all_color_by) {
            std::string why = a ? color_by_unavailable(a->set, c).value_or("") : "";
            if (c == ColorBy::difference && !s.compare_pattern()) why = "Tick B beside a second pattern first";
            if (ImGui::Selectable(label_of(c), c == st.color_by, why.empty() ? 0 : ImGuiSelectableFlags_Disabled)) st.color_by = c;
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
                if (ImGui::Selectable(to_string(m), m == st.gain_map)) st.gain_map = m;
            ImGui::EndCombo();
        }
    }
}

// Range, wireframe, translucency and the ellipses, on a copy of the settings.
void surface_style(ViewerSettings& st) {
    float range = float(st.range_db);
    ImGui::SetNextItemWidth(-90);
    if (ImGui::SliderFloat("Range", &range, 5, 60, "%.0f dB", ImGuiSliderFlags_AlwaysClamp)) st.range_db = range;
    help_marker("Dynamic range below the peak that the radius spans (also the depth of the cut plot).");
    ImGui::Separator();
    ImGui::Checkbox("Wireframe", &st.wireframe);
    ImGui::SameLine(ImGui::GetContentRegionAvail().x * 0.5f);
    ImGui::Checkbox("Translucent", &st.translucent);
    ImGui::Checkbox("Polarisation ellipses", &st.glyphs);
    help_marker(("Small ellipses on the surface: their shape and tilt are the field's, orange turns right-hand, blue "
                 "left-hand, black is linear (AR " + exports::fixed(linear_axial_ratio_db, 0) + " dB and above). The arrowhead "
                 "shows the sense of rotation seen along the direction of propagation.").c_str());
    if (!st.glyphs) return;
    float sp = float(st.glyph_spacing_deg);
    ImGui::SetNextItemWidth(-90);
    if (ImGui::SliderFloat("Spacing", &sp, 6, 30, "%.0f\u00b0", ImGuiSliderFlags_AlwaysClamp)) st.glyph_spacing_deg = sp;
}

void camera_buttons(Intents& in) {
    ImGui::TextDisabled("Look from");
    const struct {
        const char* label;
        OrbitCamera::Preset p;
    } presets[] = {{"+x", OrbitCamera::Preset::px}, {"-x", OrbitCamera::Preset::nx}, {"+y", OrbitCamera::Preset::py},
                   {"-y", OrbitCamera::Preset::ny}, {"top", OrbitCamera::Preset::pz}, {"bottom", OrbitCamera::Preset::nz}};
    for (int k = 0; k < 6; ++k) {
        if (k) ImGui::SameLine();
        if (ImGui::SmallButton(presets[k].label)) in.push_back(intent::LookFrom{presets[k].p});
        if (ImGui::IsItemHovered()) ImGui::SetTooltip("key %d", k + 1);
    }
    if (ImGui::SmallButton("Reset view")) in.push_back(intent::ResetView{});
    ImGui::SameLine();
    if (ImGui::SmallButton("Export view as PNG")) in.push_back(intent::ExportView{timestamped_name("ellipsa-view", "png"), false});
}
}  // namespace

Intents draw_surface_panel(const AppState& s, const Derived&) {
    Intents in;
    ViewerSettings st = s.settings;
    surface_choices(s, st);
    surface_style(st);
    if (!(st == s.settings)) in.push_back(intent::ChangeSettings{st});
    camera_buttons(in);
    append(in, export_outcome_line(s.view_export, ExportTarget::view));
    return in;
}

// --- Probe ---
namespace {
// One-line definitions with units, for tooltips (IEEE Std 145-2013 terms).
const char* definition(Component c) {
    switch (c) {
    case Component::rhcp:
    case Component::lhcp: return "Circular partial gain, dBic";
    case Component::co:
    case Component::cross: return "Ludwig's third definition (IEEE Trans. AP-21, 1973), with the file's reference";
    case Component::vertical:
    case Component::horizontal: return "Relative to the horizon of an antenna whose up axis is +z: the theta and phi parts";
    default: return nullptr;
    }
}

void polarisation_rows(const PolarisationState& st) {
    table_row("Axial ratio", exports::axial_ratio_text(st.sense, st.axial_ratio_db),
              "Major over minor axis of the polarisation ellipse, in dB; 0 dB is circular; linear at 40 dB and above");
    table_row("Tilt", exports::tilt_text(st.tilt_deg, st.sense, "\u00b0"),
              "Angle of the ellipse's major axis from theta-hat toward phi-hat, degrees in (-90, 90]");
    table_row("Sense", exports::sense_text(st.sense),
              "Right-hand: the field turns clockwise seen along the direction of propagation (IEEE Std 145)");
    char b[96];
    const Stokes& S = st.stokes;
    if (!(S.i > 0)) return;
    std::snprintf(b, sizeof b, "%.4g", S.i);
    table_row("Stokes I", b, "Total power density |E_theta|^2 + |E_phi|^2, linear units of the file's quantity");
    std::snprintf(b, sizeof b, "%+.2f %+.2f %+.2f", S.q / S.i, S.u / S.i, S.v / S.i);
    table_row("Q/I U/I V/I", b, "Normalised Stokes parameters: Q theta-vs-phi linear, U +-45 deg linear, V > 0 right-hand");
}

// The compared pattern at the same direction: its shown component and A minus B.
void compare_rows(const AppState& s, const DirectionProbe& p) {
    const LoadedPattern* b = s.compare_pattern();
    if (!b || !p.b) return;
    const Component c = s.settings.component;
    const std::optional<double> va = p.a.db_of(c), vb = p.b->db_of(c);
    if (!vb) return;
    table_row((std::string("B: ") + short_label(c)).c_str(), db_text(*vb, db_unit(b->set.quantity, c)), "The same component of the compared pattern B");
    if (va && std::isfinite(*va) && std::isfinite(*vb)) {
        char d[48];
        std::snprintf(d, sizeof d, "%+.2f dB", *va - *vb);
        table_row("A minus B", d, "Difference of the shown component, dB");
    }
}

// "-8.01 dBi  \u2220 45.0\u00b0": the level, and its phase where the data have phase and the level is not zero.
std::string level_and_phase(const FarFieldSet& set, const ComponentValue& v) {
    const std::string level = db_text(v.db, db_unit(set.quantity, v.component));
    if (!set.has_phase() || v.component == Component::total || !std::isfinite(v.db)) return level;
    return level + "  \u2220 " + exports::phase_text(v.phase_deg, "\u00b0");
}

void probe_table(const AppState& s, const char* title, const DirectionProbe& p) {
    const LoadedPattern* a = s.active_pattern();
    ImGui::TextUnformatted(title);
    if (!begin_figure_table(title, true)) return;
    char b[96];
    std::snprintf(b, sizeof b, "\u03b8 %.1f\u00b0   \u03c6 %.1f\u00b0", p.a.theta_deg, p.a.phi_deg);
    table_row("Direction", b);
    if (!p.a.inside) {
        table_row("", std::string(exports::not_measured_label) + " (outside the sampled directions)");
    } else {
        for (const ComponentValue& v : p.a.components)
            table_row(short_label(v.component), level_and_phase(a->set, v), definition(v.component));
        if (a->set.has_phase())
            table_row("Phase ref.", exports::phase_reference_text(a->set, std::min(s.freq, a->set.frequencies.size() - 1)),
                      "Phases (\u2220) are relative to this point, exp(+j\u03c9t); --phase-centre or the Mounting panel moves it");
        if (p.a.polarisation) polarisation_rows(*p.a.polarisation);
        else table_row("Polarisation", "needs phase (file is " + std::string(to_string(a->set.content)) + ")");
        compare_rows(s, p);
    }
    ImGui::EndTable();
}
}  // namespace

Intents draw_probe_panel(const AppState& s, const Derived& d) {
    Intents in;
    if (!s.active_pattern()) return in;
    if (const auto& p = d.pinned.value()) {
        probe_table(s, "Pinned direction", *p);
        if (ImGui::SmallButton("Unpin (Esc)")) in.push_back(intent::Unpin{});
        ImGui::Spacing();
    }
    if (const auto& h = d.hover.value())
        probe_table(s, "Under the cursor", *h);
    else if (s.hover_not_measured)
        ImGui::TextWrapped("Under the cursor: %s (the file holds no samples in these directions).", exports::not_measured_label);
    else if (!s.pinned)
        ImGui::TextWrapped("Point at the surface to read every component, the axial ratio, tilt, sense and Stokes "
                           "parameters there. Click to pin a direction.");
    return in;
}

// --- First run ---
Intents draw_intro_overlay(const AppState& s) {
    Intents in;
    if (!s.show_intro) return in;
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
        if (ImGui::Button("Got it", ImVec2(120, 0))) in.push_back(intent::DismissIntro{});
    }
    ImGui::End();
    return in;
}

// --- Help ---
Intents draw_help_overlay(const AppState& s) {
    Intents in;
    if (!s.show_help) return in;
    const ImVec2 d = ImGui::GetIO().DisplaySize;
    ImGui::SetNextWindowPos(ImVec2(d.x * 0.5f, d.y * 0.5f), ImGuiCond_Always, ImVec2(0.5f, 0.5f));
    ImGui::SetNextWindowBgAlpha(0.97f);
    bool open = true;
    if (ImGui::Begin("Keys and mouse", &open, ImGuiWindowFlags_AlwaysAutoResize | ImGuiWindowFlags_NoCollapse | ImGuiWindowFlags_NoSavedSettings)) {
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
            {"Ctrl+O", "open a file (the desktop's dialog or the window's browser)"},
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
    if (!open) in.push_back(intent::ShowHelp{false});
    return in;
}

}  // namespace ellipsa::viewer
