#include "viewer/plot_widgets.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace ellipsa::viewer {

void line_plot(const char* id, const std::vector<double>& x, const std::vector<Series>& series, double x0, double x1,
               double xtick, double y0, double y1, const char* xlabel, const char* ylabel,
               const std::vector<double>* band_lo, const std::vector<double>* band_hi) {
    // The y label above the frame and the x label under the tick labels, both clear of the curves.
    const float w = std::max(160.0f, ImGui::GetContentRegionAvail().x), line = ImGui::GetTextLineHeight(), h = 110 + line;
    const ImVec2 o = ImGui::GetCursorScreenPos();
    ImGui::InvisibleButton(id, ImVec2(w, h + 2 * line + 6));
    ImDrawList* dl = ImGui::GetWindowDrawList();
    char ylo[16], yhi[16];
    std::snprintf(ylo, sizeof ylo, "%.3g", y0);
    std::snprintf(yhi, sizeof yhi, "%.3g", y1);
    const float margin = std::max(ImGui::CalcTextSize(ylo).x, ImGui::CalcTextSize(yhi).x) + 10;
    const ImVec2 p0(o.x + margin, o.y + line + 4), p1(o.x + w - 8, o.y + h);
    auto X = [&](double v) { return p0.x + float((v - x0) / (x1 - x0)) * (p1.x - p0.x); };
    auto Y = [&](double v) {
        const double t = y1 > y0 ? (v - y0) / (y1 - y0) : 0.5;
        return p1.y - float(std::clamp(t, 0.0, 1.0)) * (p1.y - p0.y);
    };
    dl->AddRect(p0, p1, grid);
    for (double t = x0; t <= x1 + 1e-9; t += xtick) {
        dl->AddLine(ImVec2(X(t), p0.y), ImVec2(X(t), p1.y), grid);
        char b[16];
        std::snprintf(b, sizeof b, "%g", t);
        const ImVec2 ts = ImGui::CalcTextSize(b);
        dl->AddText(ImVec2(X(t) - ts.x * 0.5f, p1.y + 2), muted, b);
    }
    for (double v : {y0, y1}) {
        char b[16];
        std::snprintf(b, sizeof b, "%.3g", v);
        const ImVec2 ts = ImGui::CalcTextSize(b);
        dl->AddText(ImVec2(p0.x - ts.x - 4, Y(v) - ts.y * 0.5f), muted, b);
    }
    const ImVec2 xs = ImGui::CalcTextSize(xlabel);
    dl->AddText(ImVec2(0.5f * (p0.x + p1.x) - xs.x * 0.5f, p1.y + line + 4), muted, xlabel);
    dl->AddText(ImVec2(o.x + 4, o.y), muted, ylabel);
    if (band_lo && band_hi && band_lo->size() == x.size() && band_hi->size() == x.size())
        for (std::size_t k = 0; k + 1 < x.size(); ++k)
            dl->AddQuadFilled(ImVec2(X(x[k]), Y((*band_lo)[k])), ImVec2(X(x[k + 1]), Y((*band_lo)[k + 1])),
                              ImVec2(X(x[k + 1]), Y((*band_hi)[k + 1])), ImVec2(X(x[k]), Y((*band_hi)[k])), band);
    for (const Series& s : series) {
        std::vector<ImVec2> pts;
        for (std::size_t k = 0; k < x.size() && k < s.y->size(); ++k)
            if (std::isfinite((*s.y)[k])) pts.push_back(ImVec2(X(x[k]), Y((*s.y)[k])));
        if (pts.size() > 1) dl->AddPolyline(pts.data(), int(pts.size()), s.color, 0, s.thickness);
    }
}

void legend_swatch(ImU32 c, const char* label) {
    const ImVec2 p = ImGui::GetCursorScreenPos();
    const float hgt = ImGui::GetTextLineHeight();
    ImGui::GetWindowDrawList()->AddLine(ImVec2(p.x, p.y + hgt * 0.5f), ImVec2(p.x + 18, p.y + hgt * 0.5f), c, 2.5f);
    ImGui::Dummy(ImVec2(22, hgt));
    ImGui::SameLine();
    ImGui::TextUnformatted(label);
}

}  // namespace ellipsa::viewer
