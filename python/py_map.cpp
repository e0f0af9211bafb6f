// Pattern.map() and Pattern.write_map(): the whole-sphere map of `ellipsa map`, through the
// command's own code (cli/map_file.hpp, exports/map_plot.hpp): the mapped values as arrays, and
// the file the command's --out writes.
#include <cstdio>

#include "cli/load.hpp"
#include "cli/map_file.hpp"
#include "io/atomic_write.hpp"
#include "python/py_common.hpp"

namespace ellipsa::python {

namespace {

// Numbers as the command line writes a list ("-3,-10"); an empty list is "none".
std::string number_list(const std::vector<double>& v) {
    if (v.empty()) return "none";
    std::string out;
    char text[32];
    for (double x : v) {
        std::snprintf(text, sizeof text, "%.17g", x);
        out += (out.empty() ? "" : ",") + std::string(text);
    }
    return out;
}

struct MapCall {
    std::string show = "total";
    std::optional<PatternPtr> minus;
    std::string projection = "hammer";
    std::optional<std::vector<double>> levels;
    std::optional<std::array<double, 2>> bar;
    double range_db = 40;
    std::string colormap = "viridis";
    std::optional<double> frequency_hz;
    std::string title;
};

// The plot `ellipsa map` draws: B (minus) at A's frequency, as the command.
exports::MapPlot map_plot(const Pattern& p, const MapCall& c) {
    cli::MapChoices ch;
    ch.show = c.show, ch.projection = c.projection, ch.colormap = c.colormap, ch.title = c.title;
    ch.range_db = c.range_db, ch.minus = c.minus && *c.minus;
    if (c.levels) ch.levels = number_list(*c.levels);
    if (c.bar) ch.scale = number_list({(*c.bar)[0], (*c.bar)[1]});
    auto request = cli::map_request(ch);
    if (!request) throw py::value_error(request.error().message);
    const std::string file = p.path.empty() ? label_of(p.set) : p.path;
    check(cli::refuse_cuts(p.set, file, "a map of the sphere"));
    const std::size_t fi = take(cli::pick_frequency(p.set, c.frequency_hz, file, false));
    const FarFieldSet* b = ch.minus ? &(*c.minus)->set : nullptr;
    std::size_t fb = 0;
    if (b) {
        const std::string bfile = (*c.minus)->path.empty() ? label_of(*b) : (*c.minus)->path;
        check(cli::refuse_cuts(*b, bfile, "a map of the sphere"));
        fb = take(find_frequency(*b, p.set.frequencies[fi].frequency_hz, bfile));
    }
    Result<exports::MapPlot> plot = Error{};
    {
        py::gil_scoped_release unlocked;
        plot = exports::make_map_plot(p.set, fi, *request, b, fb);
    }
    if (!plot) raise(Error{file, 0, 0, plot.error().message});
    return std::move(*plot);
}

py::dict map_dict(const Pattern& p, const exports::MapPlot& m, std::optional<double> frequency_hz) {
    const Grid& g = m.grid;
    py::dict d;
    d["title"] = m.title, d["subtitle"] = m.subtitle, d["projection"] = to_string(m.projection);
    d["label"] = m.bar_label, d["unit"] = m.unit, d["quantity"] = m.quantity_key;
    d["frequency_hz"] = p.set.frequencies[take(cli::pick_frequency(p.set, frequency_hz, p.path, false))].frequency_hz;
    std::vector<double> theta(std::size_t(g.theta.count)), phi(std::size_t(g.phi.count));
    for (int i = 0; i < g.theta.count; ++i) theta[std::size_t(i)] = g.theta.value_deg(i);
    for (int j = 0; j < g.phi.count; ++j) phi[std::size_t(j)] = g.phi.value_deg(j);
    d["theta_deg"] = copy(theta), d["phi_deg"] = copy(phi);
    d["values"] = copy(m.values, {g.theta.count, g.phi.count});
    d["bar"] = py::make_tuple(m.lo, m.hi);
    std::vector<double> levels;
    for (const exports::MapPlot::Contour& c : m.contours) levels.push_back(c.level);
    d["contour_levels"] = copy(levels);
    d["mark"] = m.mark ? py::object(py::make_tuple(m.mark->theta_deg, m.mark->phi_deg, m.mark->label)) : py::object(py::none());
    d["notes"] = m.notes;
    return d;
}

}  // namespace

void bind_map(py::module_& m) {
    py::class_<Pattern, PatternPtr> p = py::reinterpret_borrow<py::class_<Pattern, PatternPtr>>(m.attr("Pattern"));
    p.def(
        "map",
        [](const PatternPtr& self, const std::string& show, std::optional<PatternPtr> minus, const std::string& projection,
           std::optional<std::vector<double>> levels, std::optional<std::array<double, 2>> bar, double range_db,
           const std::string& colormap, std::optional<double> frequency_hz) {
            const MapCall c{show, std::move(minus), projection, std::move(levels), bar, range_db, colormap, frequency_hz, ""};
            return map_dict(*self, map_plot(*self, c), frequency_hz);
        },
        py::arg("show") = "total", py::kw_only(), py::arg("minus") = py::none(), py::arg("projection") = "hammer",
        py::arg("levels") = py::none(), py::arg("bar") = py::none(), py::arg("range_db") = 40.0,
        py::arg("colormap") = "viridis", py::arg("frequency_hz") = py::none(),
        "The whole-sphere map `ellipsa map` draws (the same code): show a component, \"axial-ratio\",\n"
        "\"rhcp-minus-lhcp\", \"v-minus-h\" or \"tilt\"; minus=B maps the component of this pattern minus B's (dB).\n"
        "Returns values shaped (theta, phi) in unit (NaN where there is none, inf for a linear field's axial\n"
        "ratio), theta_deg, phi_deg, label, unit, quantity (the CSV column), bar (colour bar ends),\n"
        "contour_levels, mark (theta, phi, label of the peak), notes. levels: contour levels ([] for none),\n"
        "bar=(min, max); frequency_hz nearest within 0.5 % (default the middle one, as the command line).");
    p.def(
        "write_map",
        [](const PatternPtr& self, const std::string& path, const std::string& show, std::optional<PatternPtr> minus,
           const std::string& projection, std::optional<std::vector<double>> levels, std::optional<std::array<double, 2>> bar,
           double range_db, const std::string& colormap, std::optional<double> frequency_hz, const std::string& title,
           std::array<int, 2> size_px, double dpi, bool force) {
            const exports::RenderSize size = render_size(size_px, dpi);
            const MapCall c{show, std::move(minus), projection, std::move(levels), bar, range_db, colormap, frequency_hz, title};
            const exports::MapPlot plot = map_plot(*self, c);
            Status done = Ok{};
            {
                py::gil_scoped_release unlocked;
                auto bytes = cli::map_file(path, plot, size);
                done = bytes ? io::write_file_atomically(path, *bytes, force) : Status(bytes.error());
            }
            check(done);
        },
        py::arg("path"), py::arg("show") = "total", py::kw_only(), py::arg("minus") = py::none(),
        py::arg("projection") = "hammer", py::arg("levels") = py::none(), py::arg("bar") = py::none(),
        py::arg("range_db") = 40.0, py::arg("colormap") = "viridis", py::arg("frequency_hz") = py::none(),
        py::arg("title") = "", py::arg("size_px") = std::array<int, 2>{1200, 720}, py::arg("dpi") = 150.0,
        py::arg("force") = false,
        "Write the map as `ellipsa map --out` does, chosen by the file name: the map (.svg, .png, .pdf) or the\n"
        "mapped values (.csv, one row per sample). The options as in map(). An existing file is replaced only\n"
        "with force=True.");
}

}  // namespace ellipsa::python
