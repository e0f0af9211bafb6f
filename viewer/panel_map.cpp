// The map panel: the 3D surface's colouring (each grid sample's cell in its vertex colour, as
// the surface shows it) on a whole-sphere map (pattern/sphere_map.hpp), with the hovered and
// pinned directions marked. Hovering returns Hover, a click returns Pin: the probe works here as
// on the 3D view.
#include <algorithm>
#include <cmath>

#include <imgui.h>

#include "pattern/sphere_map.hpp"
#include "viewer/panels.hpp"

namespace ellipsa::viewer {

namespace {

constexpr const char* projection_names[] = {"Hammer (equal-area)", "θ/φ", "azimuth/elevation"};
MapProjection projection_of(int i) {
    return i == 1 ? MapProjection::theta_phi : i == 2 ? MapProjection::azimuth_elevation : MapProjection::hammer;
}

struct MapArea {
    ImVec2 p0, p1;
    MapBounds b;
    ImVec2 at(MapPoint m) const {
        return {p0.x + float((m.x - b.x_min) / (b.x_max - b.x_min)) * (p1.x - p0.x),
                p1.y - float((m.y - b.y_min) / (b.y_max - b.y_min)) * (p1.y - p0.y)};
    }
};

// The grey of directions outside the data; outside the projection's outline nothing is drawn, so
// the corners of an equal-area map are not taken for missing data.
constexpr ImU32 outside_data = IM_COL32(200, 200, 200, 255);

// The cells as runs of equal colour along raster rows (a few thousand rectangles).
void draw_cells(ImDrawList* dl, const MapArea& a, MapProjection pr, const FarFieldSet& set, const SurfaceMesh& m) {
    const int w = std::clamp(int(a.p1.x - a.p0.x) / 2, 90, 360), h = w / 2;
    const float cw = (a.p1.x - a.p0.x) / float(w), ch = (a.p1.y - a.p0.y) / float(h);
    for (int py = 0; py < h; ++py) {
        const double y = a.b.y_max - (py + 0.5) * (a.b.y_max - a.b.y_min) / h;
        int run_start = 0;
        ImU32 run = 0;
        for (int px = 0; px <= w; ++px) {
            ImU32 c = 0;
            if (px < w) {
                const double x = a.b.x_min + (px + 0.5) * (a.b.x_max - a.b.x_min) / w;
                if (const auto dir = unproject(pr, x, y)) {
                    c = outside_data;  // a direction of the sphere the data do not cover, until found
                    if (const auto k = sample_of(set.grid, dir->first, dir->second)) {
                        const int i = int(*k / std::size_t(set.grid.phi.count)), j = int(*k % std::size_t(set.grid.phi.count));
                        const float* v = &m.vertices[(std::size_t(i) * std::size_t(m.cols) + std::size_t(j)) * surface_floats_per_vertex];
                        c = ImGui::ColorConvertFloat4ToU32(ImVec4(v[6], v[7], v[8], 1));
                    }
                }
            }
            if (px == w || c != run) {
                if (run != 0)
                    dl->AddRectFilled(ImVec2(a.p0.x + cw * float(run_start), a.p0.y + ch * float(py)),
                                      ImVec2(a.p0.x + cw * float(px), a.p0.y + ch * float(py + 1)), run);
                run = c;
                run_start = px;
            }
        }
    }
}

void mark(ImDrawList* dl, const MapArea& a, MapProjection pr, const std::optional<Direction>& d, ImU32 colour) {
    if (!d) return;
    const ImVec2 p = a.at(project(pr, d->theta_deg, d->phi_deg));
    dl->AddCircle(p, 5, IM_COL32(255, 255, 255, 255), 12, 3);
    dl->AddCircle(p, 5, colour, 12, 1.5f);
}

}  // namespace

Intents draw_map_panel(const AppState& s, const Derived& d) {
    Intents in;
    {
        const LoadedPattern* p = s.active_pattern();
        const SurfaceMesh& m = d.surface.value().mesh;
        if (!p || m.vertices.empty() || m.cols < p->set.grid.phi.count) {
            ImGui::TextWrapped("No surface to map.");
        } else {
            int proj = s.map_projection;
            ImGui::SetNextItemWidth(std::min(200.0f, ImGui::GetContentRegionAvail().x * 0.45f));
            if (ImGui::Combo("##projection", &proj, projection_names, 3)) in.push_back(intent::SetMapProjection{proj});
            ImGui::SameLine();
            ImGui::PushTextWrapPos(0);
            ImGui::TextDisabled("colour: %s (%s)", m.bar.title.c_str(), m.bar.unit.c_str());
            ImGui::PopTextWrapPos();
            const MapProjection pr = projection_of(s.map_projection);
            const ImVec2 avail = ImGui::GetContentRegionAvail();
            const float mw = std::max(160.0f, std::min(avail.x, 2 * (avail.y - 2 * ImGui::GetTextLineHeightWithSpacing())));
            const ImVec2 at = ImGui::GetCursorScreenPos();
            ImGui::InvisibleButton("map", ImVec2(mw, mw / 2));
            const MapArea a{at, ImVec2(at.x + mw, at.y + mw / 2), map_bounds(pr)};
            ImDrawList* dl = ImGui::GetWindowDrawList();
            draw_cells(dl, a, pr, p->set, m);
            mark(dl, a, pr, s.pinned, IM_COL32(20, 20, 20, 255));
            mark(dl, a, pr, s.hover, IM_COL32(230, 159, 0, 255));
            if (ImGui::IsItemHovered()) {
                const ImVec2 mp = ImGui::GetIO().MousePos;
                const double x = a.b.x_min + (mp.x - a.p0.x) / (a.p1.x - a.p0.x) * (a.b.x_max - a.b.x_min);
                const double y = a.b.y_max - (mp.y - a.p0.y) / (a.p1.y - a.p0.y) * (a.b.y_max - a.b.y_min);
                const auto dir = unproject(pr, x, y);
                if (dir) in.push_back(intent::Hover{Direction{dir->first, dir->second}, false});
                if (dir && ImGui::IsItemClicked()) in.push_back(intent::Pin{Direction{dir->first, dir->second}});
            }
            ImGui::PushTextWrapPos(0);
            ImGui::TextDisabled("Each grid sample's cell in the surface's colour; grey: outside the data. Hover to probe, click to pin.");
            ImGui::PopTextWrapPos();
        }
    }
    return in;
}

}  // namespace ellipsa::viewer
