// 2D annotations drawn over the 3D view with ImGui draw lists: the labelled colour bar, the
// axis labels and the caption. Shared by the window and by headless snapshots, so an exported
// image looks like the screen.
#pragma once
#include <imgui.h>

#include <string>

#include "viewer/scene/camera.hpp"
#include "viewer/scene/surface_mesh.hpp"

namespace ellipsa::viewer {

// A vertical colour bar in the rectangle [pos, pos + size] (the gradient strip; labels go to its
// right): the title and unit above it, left-aligned with the strip and wrapped at title_width
// pixels; 5 to 7 tick labels. Returns the height the title takes above pos.y.
float color_bar_title_height(const ColorBar& bar, ImFont* title_font, float title_width);
void draw_color_bar(ImDrawList* dl, ImVec2 pos, ImVec2 size, const ColorBar& bar, ImFont* font, ImFont* title_font,
                    float title_width);

// The key to the polarisation ellipses on the surface: a small ellipse in each colour with its
// name (right-hand, left-hand, linear), top-left at pos, one entry a line. Returns its height.
float draw_ellipse_key(ImDrawList* dl, ImVec2 pos, ImFont* font, ImU32 text_colour);

// The key to the "not measured" region (SurfaceMesh::unsampled): a hatched grey swatch as the
// view draws it and its name (exports::not_measured_label), top-left at pos. Returns its height.
float draw_unsampled_key(ImDrawList* dl, ImVec2 pos, ImFont* font, ImU32 text_colour);

// The surface's radial scale as a ruler, left end at pos: as long on screen as the unit radius
// at the origin's depth, ticked every grid step (pattern/db_scale.hpp) in dB below the peak,
// titled with the peak and the range. Returns its height.
float draw_radial_scale(ImDrawList* dl, const OrbitCamera& cam, ImVec2 view_size, ImVec2 pos, double peak_db,
                        double range_db, const std::string& unit, ImFont* font, ImU32 colour);

// Labels "x", "y", "z" (with theta/phi hints) at the tips of the axes of the given length,
// projected with the camera into the view rectangle [origin, origin + size].
void draw_axis_labels(ImDrawList* dl, const OrbitCamera& cam, ImVec2 origin, ImVec2 size, double length, ImFont* font);

// Which way is up in the world frame (the mounting applied, pattern/mounting.hpp): a dotted
// horizon ring of the given radius round the surface in the xy-plane, and a small gizmo centred at
// gizmo_centre (window pixels): the horizon as the camera sees it and an arrow "up" to the zenith.
void draw_world_up(ImDrawList* dl, const OrbitCamera& cam, ImVec2 origin, ImVec2 size, double radius, ImFont* font,
                   ImVec2 gizmo_centre, float gizmo_radius);

inline ImU32 to_u32(const Rgb& c, float a = 1) { return ImGui::ColorConvertFloat4ToU32(ImVec4(c.r, c.g, c.b, a)); }

}  // namespace ellipsa::viewer
