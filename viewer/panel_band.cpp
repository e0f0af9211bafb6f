// The band panel: one figure of A against frequency (points at the samples, thin lines only
// joining them), a cursor at the frequency shown, a click moves the frequency to the nearest
// sample; the band edges (interpolated between samples, and saying so) below.
#include <algorithm>
#include <cmath>
#include <cstdio>

#include <imgui.h>

#include "exports/band_figure.hpp"
#include "exports/figure_text.hpp"
#include "exports/xy_plot.hpp"
#include "viewer/panels.hpp"

namespace ellipsa::viewer {

namespace {

struct PlotBox {
    ImVec2 p0, p1;
    double x0, x1, y0, y1;
    float X(double x) const { return p0.x + float((x - x0) / (x1 - x0)) * (p1.x - p0.x); }
    float Y(double y) const { return p1.y - float((y - y0) / (y1 - y0)) * (p1.y - p0.y); }
};

// The plot of quantity q; returns the frequency index clicked, if any.
std::optional<std::size_t> draw_plot(const AppState& s, const BandView& v, int q) {
    std::vector<double> y;
    double lo = INFINITY, hi = -INFINITY;
    for (const FrequencyFigures& f : v.figures) {
        y.push_back(band_value(f, q));
        if (std::isfinite(y.back())) lo = std::min(lo, y.back()), hi = std::max(hi, y.back());
    }
    const ImVec2 avail = ImGui::GetContentRegionAvail();
    const ImVec2 size(std::max(200.0f, avail.x), std::clamp(avail.y - 4, 100.0f, 360.0f));
    const float line = ImGui::GetTextLineHeight();
    const ImVec2 at = ImGui::GetCursorScreenPos();
    ImGui::InvisibleButton("band plot", size);
    const bool clicked = ImGui::IsItemClicked();
    ImDrawList* dl = ImGui::GetWindowDrawList();
    if (!std::isfinite(lo)) {
        dl->AddText(ImVec2(at.x + 10, at.y + size.y / 2), ImGui::GetColorU32(ImGuiCol_TextDisabled), "no values for this figure");
        return std::nullopt;
    }
    if (hi - lo < 1e-9) lo -= 0.5, hi += 0.5;
    const double pad = 0.04 * (v.frequency_hz.back() - v.frequency_hz.front());
    PlotBox b{ImVec2(at.x + 48, at.y + line + 6), ImVec2(at.x + size.x - 8, at.y + size.y - 22), v.frequency_hz.front() - pad,
              v.frequency_hz.back() + pad, lo - 0.08 * (hi - lo), hi + 0.08 * (hi - lo)};
    const ImU32 ink = ImGui::GetColorU32(ImGuiCol_Text), grid = ImGui::GetColorU32(ImGuiCol_Border);
    dl->AddRect(b.p0, b.p1, grid);
    char t[48];
    for (double ty : exports::nice_ticks(b.y0, b.y1, 4)) {
        dl->AddLine(ImVec2(b.p0.x, b.Y(ty)), ImVec2(b.p1.x, b.Y(ty)), grid);
        std::snprintf(t, sizeof t, "%g", ty);
        dl->AddText(ImVec2(at.x, b.Y(ty) - 7), ink, t);
    }
    const double scale = v.frequency_hz.back() >= 1e9 ? 1e9 : 1e6;
    for (double tx : exports::nice_ticks(b.x0 / scale, b.x1 / scale, 5)) {
        std::snprintf(t, sizeof t, "%g", tx);
        dl->AddText(ImVec2(b.X(tx * scale) - 12, b.p1.y + 3), ink, t);
    }
    dl->AddText(ImVec2(at.x, b.p1.y + 3), ink, scale == 1e9 ? "GHz" : "MHz");
    // The unit above the y axis's numbers, as the other plots have it.
    const char* unit = *band_quantities[q].unit ? band_quantities[q].unit : db_unit(s.active_pattern()->set.quantity, Component::total);
    dl->AddText(ImVec2(at.x, at.y), ImGui::GetColorU32(ImGuiCol_TextDisabled), unit);
    // The cursor at the frequency shown.
    for (std::size_t k = 0; k < v.figures.size(); ++k)
        if (v.figures[k].freq_index == s.freq)
            dl->AddLine(ImVec2(b.X(v.frequency_hz[k]), b.p0.y), ImVec2(b.X(v.frequency_hz[k]), b.p1.y), IM_COL32(230, 159, 0, 255), 2);
    for (std::size_t k = 1; k < y.size(); ++k)
        if (std::isfinite(y[k - 1]) && std::isfinite(y[k]))
            dl->AddLine(ImVec2(b.X(v.frequency_hz[k - 1]), b.Y(y[k - 1])), ImVec2(b.X(v.frequency_hz[k]), b.Y(y[k])),
                        IM_COL32(0, 114, 178, 150), 1);
    for (std::size_t k = 0; k < y.size(); ++k)
        if (std::isfinite(y[k])) dl->AddCircleFilled(ImVec2(b.X(v.frequency_hz[k]), b.Y(y[k])), 3.5f, IM_COL32(0, 114, 178, 255));
    if (!clicked) return std::nullopt;
    // The nearest sampled frequency to the click.
    const float mx = ImGui::GetIO().MousePos.x;
    std::size_t best = 0;
    for (std::size_t k = 1; k < v.figures.size(); ++k)
        if (std::abs(b.X(v.frequency_hz[k]) - mx) < std::abs(b.X(v.frequency_hz[best]) - mx)) best = k;
    return v.figures[best].freq_index;
}

// The menu text of quantity q: a beam figure with its plane in the one wording.
std::string band_quantity_label(int q, bool at_pole) {
    const BandQuantity& b = band_quantities[q];
    return b.plane < 0 ? std::string(b.label) : std::string(b.label) + ", " + exports::beam_plane_text(at_pole, b.plane == 1, "\u00b0");
}

void edges_line(const char* label, const std::optional<BandEdges>& e, const std::string& missing) {
    ImGui::TextWrapped("%s: %s", label, e ? exports::edges_text(*e).c_str() : missing.c_str());
}

}  // namespace

Intents draw_band_panel(const AppState& s, const Derived& d) {
    Intents in;
    const BandView& v = d.band.value();
    if (!s.active_pattern() || v.figures.size() < 2) {
        ImGui::TextWrapped("Needs a pattern with two or more frequencies.");
        return in;
    }
    int q = s.band_quantity;
    const bool at_pole = peaks_at_pole(v.figures);
    ImGui::SetNextItemWidth(std::min(260.0f, ImGui::GetContentRegionAvail().x * 0.6f));
    if (ImGui::BeginCombo("##figure", band_quantity_label(q, at_pole).c_str())) {
        for (int k = 0; k < band_quantity_count; ++k)
            if (ImGui::Selectable(band_quantity_label(k, at_pole).c_str(), k == q)) in.push_back(intent::SetBandQuantity{k});
        ImGui::EndCombo();
    }
    // The plot, and the notes beside it in a wide strip or under it in a narrow one.
    const ImVec2 avail = ImGui::GetContentRegionAvail();
    const bool beside = avail.x >= 560;
    ImGui::BeginChild("bandplot", ImVec2(beside ? avail.x * 0.62f : 0, beside ? 0 : std::max(140.0f, avail.y - 80)), false);
    if (auto f = draw_plot(s, v, q)) in.push_back(intent::SetFrequency{*f});
    ImGui::EndChild();
    if (beside) ImGui::SameLine();
    ImGui::BeginChild("bandnotes", ImVec2(0, 0), false);
    edges_line("Peak within 1 dB", v.summary.gain_1db, "unavailable");
    edges_line("AR <= 3 dB", v.summary.ar, "none (" + v.summary.ar_unavailable_reason + ")");
    ImGui::PushTextWrapPos(0);
    ImGui::TextDisabled("Points: the sampled frequencies (lines only join them); click to show one. Band edges: "
                        "interpolated linearly between samples.");
    ImGui::PopTextWrapPos();
    ImGui::EndChild();
    return in;
}

}  // namespace ellipsa::viewer
