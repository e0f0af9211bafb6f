// The gain surface: a triangle mesh whose radius in each direction is the shown component in dB,
// mapped linearly from (peak - range) -> 0 to peak -> 1, and whose colour is that component or
// another quantity (axial ratio, RHCP minus LHCP, tilt, A minus B). Pure code: no GL.
//
// Layout: one vertex per grid sample, theta rows slow, phi columns fast; when phi goes all the way
// round one extra column repeats phi = 0 so the seam closes. Interleaved floats per vertex:
// position xyz, normal xyz, colour rgb (9 floats). Costs O(grid) time and memory: a 1-degree grid
// (65 thousand samples) builds in a few milliseconds.
#pragma once
#include <cstddef>
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/polarisation.hpp"
#include "pattern/result.hpp"
#include "viewer/scene/colormap.hpp"
#include "viewer/scene/components.hpp"

namespace ellipsa::viewer {

struct SurfaceOptions {
    Component component = Component::total;
    ColorBy color_by = ColorBy::component;
    double range_db = 30;               // dynamic range below the peak that the radius spans
    ColorMap gain_map = ColorMap::viridis;
    double axial_ratio_max_db = 20;     // colour bar top for axial ratio
    double balance_range_db = 30;       // RHCP-LHCP colour bar is -range..+range
    double difference_range_db = 6;     // A-B colour bar is -range..+range
    int wire_step_deg = 10;             // spacing of the wireframe lines
};

// What the colour bar beside the view shows.
struct ColorBar {
    ColorMap map = ColorMap::viridis;
    double min = 0, max = 1;
    std::string title;  // "Gain: Total", "Axial ratio"
    std::string unit;   // "dBi", "dB", "deg"
};

inline constexpr int surface_floats_per_vertex = 9;

// The directions a grid does not sample (a range's upper hemisphere, a sector of phi), shown as a
// quiet "not measured" region instead of an open hole: a neutral grey cap over those directions
// at a fixed small radius (unsampled_radius, below any data that stands out of the floor), a wall
// from the data's edge down to that cap, and the data's edge as a line. It carries no colour-map
// colour and no value: picking tells it from data (viewer/scene/picking.hpp). Empty for a full
// sphere and for cut-only data. Its size is the boundary's plus a coarse cap (5-degree cells).
struct UnsampledRegion {
    std::vector<float> vertices;           // surface_floats_per_vertex per vertex, unsampled_colour
    std::vector<std::uint32_t> triangles;  // three indices a triangle
    std::vector<float> outline;            // the data's edge: xyz rgb per vertex, two vertices a segment
    bool empty() const { return triangles.empty(); }
};
inline constexpr double unsampled_radius = 0.12;
inline constexpr Rgb unsampled_colour{0.80f, 0.80f, 0.78f};
inline constexpr Rgb unsampled_edge_colour{0.30f, 0.31f, 0.34f};

// What the index lists (triangles, coarser levels, wireframe) depend on: the grid's shape and the
// wireframe's spacing in grid lines, never the values. Equal topologies have equal index lists.
struct SurfaceTopology {
    int rows = 0, cols = 0, wire_rows = 0, wire_cols = 0;
    bool operator==(const SurfaceTopology&) const = default;
};

struct SurfaceMesh {
    int rows = 0, cols = 0;  // vertex rows (theta samples) and columns (phi samples + seam column)
    SurfaceTopology topology;  // of the index lists below
    std::vector<float> vertices;        // interleaved, surface_floats_per_vertex per vertex
    std::vector<std::uint32_t> triangles;
    // Coarser triangle lists over the same vertices, taking every 2nd and every 4th grid line
    // (the last row and column always kept): drawn when cells would be smaller than a few pixels.
    std::vector<std::uint32_t> triangles_stride2, triangles_stride4;
    double grid_step_deg = 1;  // finer of the theta and phi steps
    std::vector<std::uint32_t> wire_lines;  // pairs of vertex indices
    double peak_db = 0, floor_db = -30;  // of the shown component
    std::string unit;                    // of the radius
    ColorBar bar;
    // Radius of the surface toward (theta, phi) in degrees (bilinear in the grid), for glyphs and rings.
    std::vector<float> radius;  // per grid sample (theta rows x phi count)
    std::vector<double> value_db;  // the shown component in dB per grid sample (-inf where zero)
    // Per grid sample, the colour value in [0, 1] of a polarisation colouring (axial ratio, RHCP
    // minus LHCP, tilt; NaN: grey), in single precision; empty for the other colourings.
    std::vector<float> colour_value;
    // Bounding boxes of blocks of pick_block x pick_block grid cells (min xyz, max xyz; block rows
    // slow), so that a hover pick tests only the triangles of the blocks its ray crosses.
    std::vector<float> pick_boxes;
    int pick_block_rows = 0, pick_block_cols = 0;
    UnsampledRegion unsampled;  // the directions the grid does not sample (empty: the whole sphere)
};

inline constexpr int pick_block = 16;  // grid cells per side of a picking block

// Radius in [0, 1] of a value in dB: 0 at or below peak - range, 1 at the peak.
inline double radius_from_db(double value_db, double peak_db, double range_db) {
    if (!(value_db > peak_db - range_db)) return 0;  // also NaN and -inf
    const double r = (value_db - (peak_db - range_db)) / range_db;
    return r > 1 ? 1 : r;
}

// Level of detail: the grid stride (1, 2 or 4) whose cells stay at least min_cell_px pixels wide
// for a view of view_height_px pixels, a vertical field of view fov_deg and an eye at `distance`
// (the unit radius spans view_height_px / (2 tan(fov/2) distance) pixels).
int lod_stride(double grid_step_deg, double view_height_px, double fov_deg, double distance, double min_cell_px = 2.5);

// Build the surface of one frequency. `other`, when given, is the B pattern for ColorBy::difference
// (sampled at this set's directions by interpolation when the grids differ). Errors say why a
// component or colouring is unavailable (for example RHCP from magnitude-only data).
// `previous`, a mesh no longer needed (the one shown before a component or frequency change), lends
// its arrays: no fresh memory to fault in and clear, and its index lists are kept as they are when
// the topology is the same (at 0.25 degree they are 30 MB). The result does not depend on it.
Result<SurfaceMesh> build_surface(const FarFieldSet& s, std::size_t freq_index, const SurfaceOptions& o,
                                  const FarFieldSet* other = nullptr, std::size_t other_freq_index = 0,
                                  SurfaceMesh&& previous = SurfaceMesh{});

// The "not measured" region of a grid and the surface built on it (its vertices give the data's
// edge). Called by build_surface; empty when the grid samples the whole sphere or holds cuts only.
UnsampledRegion unsampled_region(const Grid& g, const SurfaceMesh& m);

// Radius of the built surface toward a direction (bilinear in the grid; 0 outside the sampled region).
double surface_radius(const FarFieldSet& s, const SurfaceMesh& m, double theta_deg, double phi_deg);

}  // namespace ellipsa::viewer
