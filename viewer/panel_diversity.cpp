// The diversity panel: pick a multipath environment, see the incoming-power profile over
// elevation, the mean effective gain and polarisation balance of the shown patterns (A, and B
// when comparing), their envelope correlation and diversity gain, and the orientation curve.
// The figures come from Derived::diversity (viewer/scene/diversity_view.hpp computes them); this
// file only draws them and edits a copy of the choice.
#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "exports/figure_text.hpp"
#include "viewer/panels.hpp"
#include "viewer/plot_widgets.hpp"
#include "viewer/widgets.hpp"

namespace ellipsa::viewer {

namespace {

// A linear power in dB, in the core's words ("none (zero field)" for a purely vertical antenna's
// horizontal part, never "-inf dBi").
std::string db_text(double linear, const char* unit = "dBi") { return exports::level_text(to_db(linear), 2, unit); }

// A titled separator (ImGui 1.86 has no SeparatorText).
void section(const std::string& title) {
    ImGui::Spacing();
    ImGui::Separator();
    ImGui::TextUnformatted(title.c_str());
}

void row(const char* label, const std::string& value) {
    // The value column starts at 170 px or 45 % of a narrow panel, and long values wrap in it.
    const float x = std::min(170.0f, ImGui::GetContentRegionAvail().x * 0.45f);
    ImGui::TextDisabled("%s", label);
    ImGui::SameLine(x);
    ImGui::BeginGroup();
    text_wrapped_at_spaces(value);
    ImGui::EndGroup();
}


// The environment choice, edited on a copy (`c`); the profile plot of the figures.
void draw_environment(DiversityChoice& c, const DiversityFigures& f) {
    const std::vector<std::string> names = diversity_choice_names();
    const float label_w = ImGui::CalcTextSize("environment").x + ImGui::GetStyle().ItemInnerSpacing.x + 4;
    ImGui::SetNextItemWidth(std::max(80.0f, ImGui::GetContentRegionAvail().x - label_w));
    if (ImGui::BeginCombo("environment", c.preset.c_str())) {
        for (const std::string& n : names)
            if (ImGui::Selectable(n.c_str(), n == c.preset)) {
                DiversityChoice fresh = choice_from_preset(n);
                fresh.orientations = c.orientations;
                fresh.sweep = c.sweep;
                if (n == "gaussian") {  // start the custom model from the current angles
                    fresh.v_mean_deg = c.v_mean_deg, fresh.v_spread_deg = c.v_spread_deg;
                    fresh.h_mean_deg = c.h_mean_deg, fresh.h_spread_deg = c.h_spread_deg;
                    fresh.xpr_db = c.xpr_db;
                }
                c = fresh;
            }
        ImGui::EndCombo();
    }
    float xpr = float(c.xpr_db);
    const float v_only_w = ImGui::CalcTextSize("XPR  V only").x + ImGui::GetFrameHeight() + 24;
    ImGui::SetNextItemWidth(std::max(80.0f, ImGui::GetContentRegionAvail().x - v_only_w));
    ImGui::BeginDisabled(c.vertical_only);
    if (ImGui::SliderFloat("XPR", &xpr, -10, 20, "%.1f dB", ImGuiSliderFlags_AlwaysClamp)) c.xpr_db = std::round(double(xpr) * 10) / 10;
    ImGui::EndDisabled();
    ImGui::SameLine();
    ImGui::Checkbox("V only", &c.vertical_only);
    if (ImGui::IsItemHovered()) ImGui::SetTooltip("XPR = +inf: all incoming power vertically polarised");
    const bool gaussian = c.preset != "uniform";
    if (gaussian) {
        auto angle = [](const char* label, double& v, float lo, float hi) {
            float f = float(v);
            ImGui::SetNextItemWidth(std::max(80.0f, ImGui::GetContentRegionAvail().x - ImGui::CalcTextSize("V mean elevation").x - 12));
            if (ImGui::SliderFloat(label, &f, lo, hi, "%.1f deg", ImGuiSliderFlags_AlwaysClamp)) v = std::round(double(f) * 10) / 10;
        };
        angle("V mean elevation", c.v_mean_deg, -45, 60);
        angle("V spread", c.v_spread_deg, 0.5, 60);
        angle("H mean elevation", c.h_mean_deg, -45, 60);
        angle("H spread", c.h_spread_deg, 0.5, 60);
    }
    if (f.environment) {
        ImGui::PushTextWrapPos(0);
        ImGui::TextDisabled("%s", f.environment->source.c_str());
        ImGui::PopTextWrapPos();
    } else if (!f.environment_error.empty()) {
        ImGui::TextWrapped("Environment not usable: %s", f.environment_error.c_str());
    }
    // The incoming-power densities over elevation (per steradian, both normalised to 1 over the sphere).
    // V is drawn wide under a thin H so both stay visible where they coincide.
    if (!f.curve.elevation_deg.empty()) {
        double top = 0;
        for (double v : f.curve.p_v) top = std::max(top, v);
        for (double v : f.curve.p_h) top = std::max(top, v);
        ImGui::TextUnformatted("Incoming power over elevation");
        line_plot("##profile", f.curve.elevation_deg, {{&f.curve.p_v, v_col, 4.0f}, {&f.curve.p_h, h_col, 1.8f}}, -90, 90,
                  30, 0, top > 0 ? top * 1.05 : 1, "elevation, deg", "density, 1/sr");
        legend_swatch(v_col, "P_theta (vertical)");
        ImGui::SameLine(0, 18);
        legend_swatch(h_col, "P_phi (horizontal)");
    }
}

void draw_pattern(const char* tag, const LoadedPattern* p, const PatternDiversity& f) {
    if (!p) return;
    section(std::string(tag) + ": " + (p->set.name.empty() ? p->path : p->set.name));
    if (!f.meg) {
        ImGui::TextWrapped("MEG unavailable: %s", f.meg_error.c_str());
        return;
    }
    const MegFigures& m = *f.meg;
    row("MEG", db_text(m.meg));
    char b[96];
    if (m.meg_vertical && m.vertical_share) {
        row("  vertical part", exports::part_text(*m.meg_vertical, m.vertical_share, "dBi", ""));
        row("  horizontal part", exports::part_text(*m.meg_horizontal, m.horizontal_share, "dBi", ""));
    }
    if (m.balanced_share) {
        std::snprintf(b, sizeof b, "%.1f %% of the incoming power", 100 * *m.balanced_share);
        row("V, H within 3 dB", b);
    }
    ImGui::PushTextWrapPos(0);
    if (!m.assumption.empty()) ImGui::TextDisabled("%s", m.assumption.c_str());
    for (const std::string& n : m.notes) ImGui::TextDisabled("%s", n.c_str());
    ImGui::PopTextWrapPos();
}

void draw_orientations(const char* tag, const PatternDiversity& f, const OrientationSweep& sw, bool pending) {
    if (!f.meg) return;
    if (!f.orientations) {
        if (!f.orientation_error.empty()) ImGui::TextWrapped("%s orientations unavailable: %s", tag, f.orientation_error.c_str());
        return;
    }
    const OrientationFigures& o = *f.orientations;
    char b[160];
    std::snprintf(b, sizeof b, "%s / %s / %s", db_text(o.min, "").c_str(), db_text(o.median, "").c_str(),
                  db_text(o.max).c_str());
    ImGui::Text("%s%s", tag, pending ? "  (updating when the slider is released)" : "");
    row("min / median / max", b);
    std::snprintf(b, sizeof b, "%s at tilt %g, roll %g deg", db_text(o.worst.meg).c_str(), o.worst.tilt_deg,
                  o.worst.roll_deg);
    row("worst", to_db(o.max) - to_db(o.min) < 0.005 ? std::string("every orientation within 0.01 dB") : b);
    std::snprintf(b, sizeof b, "%s mean, 90 %% reach %s", db_text(o.random_mean).c_str(), db_text(o.random_p10).c_str());
    row("random orientation", b);
    // The orientation curve: mean over the rolls per tilt, with the min..max band.
    std::vector<double> t, lo, mean, hi;
    for (const TiltRow& r : o.by_tilt) {
        t.push_back(r.tilt_deg);
        lo.push_back(to_db(r.min));
        mean.push_back(to_db(r.mean));
        hi.push_back(to_db(r.max));
    }
    double y0 = 1e300, y1 = -1e300;
    for (double v : lo)
        if (std::isfinite(v)) y0 = std::min(y0, v);
    for (double v : hi)
        if (std::isfinite(v)) y1 = std::max(y1, v);
    if (!(y1 > y0)) y0 -= 0.5, y1 += 0.5;
    const double pad = 0.1 * (y1 - y0);
    line_plot((std::string("##orient") + tag).c_str(), t, {{&mean, ink, 2.0f}}, 0, sw.tilt_max_deg,
              sw.tilt_max_deg > 90 ? 30 : 15, std::floor(y0 - pad), std::ceil(y1 + pad), "tilt, deg",
              "MEG, dBi (mean; band: min..max over roll)", &lo, &hi);
}

void draw_correlation(const DiversityFigures& f) {
    section("A with B");
    if (!f.correlation) {
        ImGui::TextWrapped("Correlation unavailable: %s", f.correlation_error.c_str());
        return;
    }
    char v[64];
    std::snprintf(v, sizeof v, "%.4f", f.correlation->ecc);
    row("envelope correlation", v);
    if (f.combining) {
        for (const OutageFigures& o : f.combining->outages) {
            char label[48];
            std::snprintf(label, sizeof label, "gain at %g %% outage", 100 * o.outage);
            std::snprintf(v, sizeof v, "%.2f dB selection, %.2f dB max. ratio", o.selection_gain_db, o.mrc_gain_db);
            row(label, v);
        }
        if (ImGui::IsItemHovered())
            ImGui::SetTooltip("Exact two-branch combining in Rayleigh fading with the MEG of A and B as branch powers\n"
                              "and the ECC as power correlation, over the stronger branch (docs/diversity.md).\n"
                              "Statistical environments, not a site survey; add the receiver's own figures.");
    } else {
        ImGui::TextWrapped("Diversity gain unavailable: %s", f.combining_error.c_str());
    }
    if (f.meg_ratio_db) {
        std::snprintf(v, sizeof v, "%.2f dB", *f.meg_ratio_db);
        row("MEG ratio A / B", v);
    }
}

// The figures of the shown patterns (the choice is edited on `c`).
void draw_figures(const AppState& s, const DiversityView& v, DiversityChoice& c) {
    const DiversityFigures& f = v.figures;
    const LoadedPattern* a = s.active_pattern();
    if (!a) {
        ImGui::TextDisabled("Open a pattern to see its figures.");
        return;
    }
    draw_pattern("A", a, f.a);
    if (f.has_b) {
        draw_pattern("B", s.compare_pattern(), f.b);
        draw_correlation(f);
    } else {
        ImGui::TextDisabled("Tick a B pattern to see the envelope correlation and diversity gain.");
    }
    section("Orientation");
    ImGui::Checkbox("turn the antenna", &c.orientations);
    if (ImGui::IsItemHovered())
        ImGui::SetTooltip("Roll about the antenna's own z axis, then tilt about the world's horizontal x axis:\n"
                          "R = R_x(tilt) R_z(roll), tilt 0..%g deg by %g, roll by %g deg",
                          c.sweep.tilt_max_deg, c.sweep.tilt_step_deg, c.sweep.roll_step_deg);
    if (c.orientations) {
        draw_orientations("A", f.a, c.sweep, v.sweep_pending);
        if (f.has_b) draw_orientations("B", f.b, c.sweep, v.sweep_pending);
    }
    ImGui::TextDisabled("computed in %.0f ms", v.compute_ms);
}
}  // namespace

Intents draw_diversity_panel(const AppState& s, const Derived& d) {
    Intents in;
    DiversityChoice c = s.diversity;
    // Side by side when the strip is wide enough: the environment on the left, the figures on the right.
    const ImVec2 avail = ImGui::GetContentRegionAvail();
    const bool two = avail.x >= 620;
    ImGui::BeginChild("environment", ImVec2(two ? avail.x * 0.46f : 0, two ? 0 : 0), false);
    draw_environment(c, d.diversity.value().figures);
    if (two) ImGui::EndChild();
    if (two) {
        ImGui::SameLine();
        ImGui::BeginChild("figures", ImVec2(0, 0), false);
    }
    draw_figures(s, d.diversity.value(), c);
    ImGui::EndChild();
    if (!(c == s.diversity)) in.push_back(intent::ChangeDiversity{c});
    return in;
}

}  // namespace ellipsa::viewer
