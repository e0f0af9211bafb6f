// What `ellipsa map` draws and writes, shared with the Python module (Pattern.map,
// Pattern.write_map): the request from the command's choices (the same checks and messages) and
// the bytes of its --out file.
#pragma once
#include <CLI/CLI.hpp>
#include <string>
#include <vector>

#include "exports/map_plot.hpp"
#include "exports/render.hpp"
#include "pattern/result.hpp"

namespace ellipsa::cli {

// The check of --range (dB, from 1 to 200), on the option and in map_request.
CLI::Validator map_range_check();

// The values --show accepts: a component, or a map quantity other than a component or A minus B.
std::vector<std::string> map_show_names();

// The command's choices as written (--show, --minus given, --projection, --levels, --bar,
// --range, --colormap, --title).
struct MapChoices {
    std::string show = "total", projection = "hammer", levels, scale, colormap = "viridis", title;
    bool minus = false;
    double range_db = 40;
};
// The request, or an Error whose message is the command's usage message (naming its option).
Result<exports::MapRequest> map_request(const MapChoices& c);

// The bytes `ellipsa map --out PATH` writes, chosen by the name: the map (.svg, .png, .pdf at
// `size`) or the mapped values (.csv). Error for any other name.
Result<std::string> map_file(const std::string& path, const exports::MapPlot& plot, const exports::RenderSize& size);

}  // namespace ellipsa::cli
