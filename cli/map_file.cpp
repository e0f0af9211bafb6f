// What `ellipsa map` draws and writes (cli/map_file.hpp).
#include "cli/map_file.hpp"

#include <cmath>

#include "cli/number_list.hpp"
#include "cli/usage.hpp"

namespace ellipsa::cli {

CLI::Validator map_range_check() { return number_from_to(1, 200); }


using namespace ellipsa::exports;

// The values of --show: a component, or a map quantity other than those two.
std::vector<std::string> map_show_names() {
    std::vector<std::string> out = names_of(all_components);
    for (const std::string& q : names_of(all_map_quantities, +[](MapQuantity q) {
             return q != MapQuantity::component && q != MapQuantity::difference;
         }))
        out.push_back(q);
    return out;
}

Result<MapRequest> map_request(const MapChoices& a) {
    MapRequest r;
    r.title = a.title;
    r.range_db = a.range_db;
    if (!parse_component(a.show.c_str(), r.component)) {
        if (!parse_map_quantity(a.show.c_str(), r.quantity) || r.quantity == MapQuantity::component ||
            r.quantity == MapQuantity::difference)
            return Error{"", 0, 0, "--show: " + not_one_of(map_show_names(), a.show)};
    }
    if (a.minus) {
        if (r.quantity != MapQuantity::component) return Error{"", 0, 0, "--minus: a difference map needs a component for --show"};
        r.quantity = MapQuantity::difference;
    }
    if (!parse_map_projection(a.projection.c_str(), r.projection))
        return Error{"", 0, 0, "--projection: " + not_one_of(names_of(all_map_projections), a.projection)};
    if (!parse_color_map(a.colormap, r.sequential) || !is_sequential(r.sequential))
        return Error{"", 0, 0, "--colormap: " + not_one_of(names_of(all_color_maps, is_sequential), a.colormap)};
    if (!a.levels.empty()) {
        r.levels = parse_number_list(a.levels, true);
        if (!r.levels) return Error{"", 0, 0, "--levels: expected numbers separated by commas, or none; found \"" + a.levels + "\""};
    }
    if (!a.scale.empty()) {
        const auto s = parse_number_list(a.scale);
        if (!s || s->size() != 2 || !((*s)[0] < (*s)[1]))
            return Error{"", 0, 0, "--bar: expected MIN,MAX with MIN < MAX; found \"" + a.scale + "\""};
        r.scale_min = (*s)[0];
        r.scale_max = (*s)[1];
    }
    if (const std::string bad = check_number(map_range_check(), a.range_db); !bad.empty()) return Error{"", 0, 0, "--range: " + bad};
    return r;
}

Result<std::string> map_file(const std::string& path, const MapPlot& plot, const RenderSize& size) {
    const auto format = format_from_path(path);
    if (!format) return Error{"", 0, 0, path + ": expected a file name ending in .svg, .png, .pdf or .csv"};
    if (*format == FileFormat::csv) return map_csv(plot);
    return render_image([&](cairo_t* cr, double w, double h) { draw_map_plot(cr, plot, w, h); }, *format, size, plot.title);
}

}  // namespace ellipsa::cli
