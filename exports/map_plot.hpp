// Whole-sphere maps as figures: any component, axial ratio, RHCP minus LHCP, vertical minus
// horizontal, tilt or A minus B, on a rectangular theta/phi or azimuth/elevation map or on
// Hammer's equal-area projection (pattern/sphere_map.hpp), with a labelled colour bar, contour
// lines at chosen levels, the peak marked and the unsampled part hatched. Each grid sample is
// drawn as its whole cell in one colour (nothing is interpolated between samples); contours are
// interpolated linearly between samples. Colour maps are the viewer's (pattern/colormap.hpp):
// sequential for gain and axial ratio, diverging around zero for differences, cyclic for tilt.
#pragma once
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include <cairo.h>

#include "pattern/colormap.hpp"
#include "pattern/far_field.hpp"
#include "pattern/result.hpp"
#include "pattern/sphere_map.hpp"

namespace ellipsa::exports {

struct MapRequest {
    MapQuantity quantity = MapQuantity::component;
    Component component = Component::total;  // for component and difference maps
    MapProjection projection = MapProjection::hammer;
    std::optional<double> scale_min, scale_max;  // colour bar ends (default: see make_map_plot)
    double range_db = 40;                        // component maps: the bar spans top - range .. top
    std::optional<std::vector<double>> levels;   // contour levels in the map's unit (default: see make_map_plot)
    ColorMap sequential = ColorMap::viridis;     // for component and axial-ratio maps
    std::string title;                           // empty: the pattern's name
};

struct MapMark {
    double theta_deg = 0, phi_deg = 0;
    std::string label;
};

// The figure as a value.
struct MapPlot {
    std::string title, subtitle;
    MapProjection projection = MapProjection::hammer;
    Grid grid;
    std::vector<double> values;  // per grid sample, in `unit`
    ColorMap map = ColorMap::viridis;
    double lo = 0, hi = 1;        // colour bar ends
    std::string bar_label, unit;  // "Total gain", "dBi"
    std::string quantity_key;     // CSV column stem, e.g. "total_dbi"
    struct Contour {
        double level;
        std::vector<ContourSegment> segments;
    };
    std::vector<Contour> contours;
    std::optional<MapMark> mark;
    std::vector<std::string> notes;
};

// Defaults: component maps run from the peak rounded up to whole dB down by range_db, with
// contours 3 and 10 dB below the peak; axial ratio 0..20 dB with the 3 dB contour; RHCP minus
// LHCP and V minus H -30..30 dB, A minus B -6..6 dB, each with the 0 dB contour; tilt -90..90 deg,
// no contours. The mark is the component's peak (component maps) or the total power's peak.
// Errors: what map_values() refuses, B lacking the frequency.
Result<MapPlot> make_map_plot(const FarFieldSet& s, std::size_t freq_index, const MapRequest& r,
                              const FarFieldSet* b = nullptr, std::size_t b_freq_index = 0);

// The cells as pixels over the map's bounds (map_bounds), one pixel per 1/4 to 1 degree by the
// grid step (360 ppd x 180 ppd): each the opaque colour (0xAARRGGBB) of the sample whose cell
// holds the pixel's centre, 0 (transparent) outside the map or the sampled region, grey where
// the sample has no value. Cost: one inverse projection and colour lookup per pixel.
struct MapRaster {
    int width = 0, height = 0;
    std::vector<std::uint32_t> argb;  // row-major, top row first
};
MapRaster map_raster(const MapPlot& p);

// Draw into [0, width] x [0, height] points. The cells are painted as an image with one pixel
// per quarter to whole degree (by grid step), scaled without smoothing.
void draw_map_plot(cairo_t* cr, const MapPlot& p, double width_pt, double height_pt);

// One row per grid sample: theta_deg,phi_deg,azimuth_deg,elevation_deg,map_x,map_y,<quantity>
// (17 significant digits; empty where there is no value, inf for a linear field's axial ratio).
std::string map_csv(const MapPlot& p);

}  // namespace ellipsa::exports
