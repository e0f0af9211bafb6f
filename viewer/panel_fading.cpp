// The fading panel: the distribution of the received power of A, of B and of their selection and
// maximal-ratio combination, in the environment chosen in the diversity panel. The curves are
// analytic (Derived::diversity's FadingCurves: Rayleigh from each MEG, exact combining from MEG and
// ECC), so the panel is cheap; `ellipsa fading` simulates the field itself. This file only draws.
#include <imgui.h>

#include <cmath>
#include <cstdio>
#include <string>

#include "pattern/combining.hpp"
#include "viewer/panels.hpp"
#include "viewer/plot_widgets.hpp"

namespace ellipsa::viewer {

namespace {

std::string level_text(double linear) {
    char b[32];
    std::snprintf(b, sizeof b, "%.2f dBi", to_db(linear));
    return b;
}

void levels_table(const DiversityFigures& f) {
    if (!f.combining) return;
    if (!ImGui::BeginTable("##fading_levels", 5, ImGuiTableFlags_SizingFixedFit)) return;
    for (const char* h : {"outage", "A", "B", "selection", "max. ratio"}) ImGui::TableSetupColumn(h);
    ImGui::TableHeadersRow();
    for (const OutageFigures& o : f.combining->outages) {
        ImGui::TableNextRow();
        ImGui::TableNextColumn();
        ImGui::Text("%g %%", 100 * o.outage);
        for (double v : {o.branch1_level, o.branch2_level, o.selection_level, o.mrc_level}) {
            ImGui::TableNextColumn();
            ImGui::TextUnformatted(level_text(v).c_str());
        }
    }
    ImGui::EndTable();
}

void legend(const DiversityFigures& f) {
    legend_swatch(v_col, "A");
    if (!f.has_b) return;
    ImGui::SameLine();
    legend_swatch(h_col, "B");
    if (!f.combining) return;
    ImGui::SameLine();
    legend_swatch(green_col, "selection");
    ImGui::SameLine();
    legend_swatch(purple_col, "maximal ratio");
}

}  // namespace

Intents draw_fading_panel(const AppState& s, const Derived& d) {
    const DiversityView& v = d.diversity.value();
    const DiversityFigures& f = v.figures;
    const FadingCurves& c = v.fading;
    ImGui::TextWrapped("Received power in Rayleigh fading, %s environment (set in the Diversity tool)%s.",
                       s.diversity.preset.c_str(), f.has_b ? "" : "; compare a second pattern for B and the combination");
    if (c.level_db.empty()) {
        ImGui::TextDisabled("No curves: %s", f.a.meg_error.empty() ? (f.environment_error.empty() ? "no pattern" : f.environment_error.c_str())
                                                                   : f.a.meg_error.c_str());
        return {};
    }
    line_plot("##fading", c.level_db, {{&c.a, v_col, 2.0f}, {&c.b, h_col, 2.0f}, {&c.selection, green_col, 2.0f}, {&c.mrc, purple_col, 2.0f}},
              c.level_lo_db, c.level_hi_db, 10, -4, 0, "level (dBi)", "log10 P(power <= level)");
    legend(f);
    levels_table(f);
    if (f.has_b && !f.combining) ImGui::TextDisabled("Combination unavailable: %s", f.combining_error.c_str());
    ImGui::TextDisabled("Analytic: Rayleigh with mean = MEG; selection and maximal ratio exact with ECC%s.",
                        f.correlation ? "" : " (unavailable)");
    ImGui::PushTextWrapPos(0);
    for (const char* caution : outage_cautions) ImGui::TextDisabled("%s", caution);
    ImGui::PopTextWrapPos();
    return {};
}

}  // namespace ellipsa::viewer
