// The colour maps live in the core (pattern/colormap.hpp) so that the exports draw maps with the
// same colours as the viewer; the viewer's names for them.
#pragma once
#include "pattern/colormap.hpp"

namespace ellipsa::viewer {

using Rgb = ellipsa::ColorRgb;
using ellipsa::all_color_maps;
using ellipsa::ColorMap;
using ellipsa::is_sequential;
using ellipsa::lab_to_rgb;
using ellipsa::lightness;
using ellipsa::map_color;
using ellipsa::parse_color_map;
using ellipsa::to_string;

}  // namespace ellipsa::viewer
