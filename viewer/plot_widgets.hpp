// The small line plots the docked tools draw with ImGui (the diversity panel's profile and
// orientation curves, the fading panel's distribution curves), and their colours.
#pragma once
#include <imgui.h>

#include <vector>

namespace ellipsa::viewer {

// Okabe-Ito colours as in the cut panel: vertical blue, horizontal vermilion; then green and purple.
inline const ImU32 v_col = IM_COL32(0, 114, 178, 255), h_col = IM_COL32(213, 94, 0, 255);
inline const ImU32 green_col = IM_COL32(0, 158, 115, 255), purple_col = IM_COL32(204, 121, 167, 255);
inline const ImU32 ink = IM_COL32(34, 38, 46, 255), grid = IM_COL32(205, 206, 203, 255), muted = IM_COL32(95, 100, 108, 255);
inline const ImU32 band = IM_COL32(0, 114, 178, 50);

struct Series {
    const std::vector<double>* y;
    ImU32 color;
    float thickness;
};

// A small line plot with a frame, x ticks and labels. y is drawn from y0 to y1 (clamped); points
// that are not finite are left out.
void line_plot(const char* id, const std::vector<double>& x, const std::vector<Series>& series, double x0, double x1,
               double xtick, double y0, double y1, const char* xlabel, const char* ylabel,
               const std::vector<double>* band_lo = nullptr, const std::vector<double>* band_hi = nullptr);
// A short line of colour c and its label, for a legend.
void legend_swatch(ImU32 c, const char* label);

}  // namespace ellipsa::viewer
