// Pattern.write_view(): one 3D view as `ellipsa render --out` writes it, through the command's own
// code (cli/render_options.hpp: the same checks, messages and defaults; the headless renderer of
// viewer/snapshot.hpp for .png, the surface file of viewer/surface_file.hpp for .glb and .ply).
#include <array>

#include "cli/load.hpp"
#include "cli/report_3d.hpp"
#include "python/py_common.hpp"
#ifdef ELLIPSA_HAVE_VIEWER
#include "cli/render_options.hpp"
#include "io/atomic_write.hpp"
#endif

namespace ellipsa::python {

namespace {

#ifdef ELLIPSA_HAVE_VIEWER
// The command's usage messages begin with the option's name ("--size: expected ..."); a Python
// caller gave a keyword, so the message names that keyword instead (the rest is the command's).
std::string in_keyword_words(const std::string& message) {
    static const std::pair<const char*, const char*> keyword_of[] = {
        {"--component", "component"}, {"--color-by", "color_by"}, {"--view", "view_deg"}, {"--size", "size_px"},
        {"--range", "range_db"},      {"--colormap", "colormap"},  {"--out", "path"}};
    for (const auto& [option, keyword] : keyword_of) {
        const std::string head = std::string(option) + ":";
        if (message.rfind(head, 0) == 0) return keyword + message.substr(head.size() - 1);
    }
    return message;
}

void write_view(const Pattern& p, const std::string& path, const std::string& component, const std::string& color_by,
                const std::array<double, 2>& view_deg, const std::array<int, 2>& size_px,
                const std::optional<double>& frequency_hz, double range_db, const std::string& colormap, bool glyphs,
                bool software, bool force) {
    const cli::RenderChoices c{component,  color_by, colormap, cli::pair_text(view_deg[0], view_deg[1], ','),
                               cli::pair_text(size_px[0], size_px[1], 'x'), range_db, glyphs, software};
    auto o = cli::render_options(c);
    if (!o) throw py::value_error(in_keyword_words(o.error().message));  // the command's usage message
    if (Status st = cli::check_render_out(path); !st) throw py::value_error(in_keyword_words(st.error().message));
    check(io::check_destination(path, force));
    const std::string name = p.path.empty() ? label_of(p.set) : p.path;
    check(cli::refuse_cuts(p.set, name, "a 3D view"));
    o->frequency_index = take(cli::pick_frequency(p.set, frequency_hz, name, false));
    Result<std::string> done = Error{};
    {
        py::gil_scoped_release unlocked;  // the renderer takes its turn (viewer::snapshot_turn)
        done = cli::write_render(p.set, *o, path, force);
    }
    take(std::move(done));
}
#endif

}  // namespace

void bind_view(py::module_& m) {
    py::class_<Pattern, PatternPtr> cls = py::reinterpret_borrow<py::class_<Pattern, PatternPtr>>(m.attr("Pattern"));
#ifdef ELLIPSA_HAVE_VIEWER
    const viewer::SnapshotOptions d;  // the command's defaults
    cls.def("write_view", &write_view, py::arg("path"), py::kw_only(), py::arg("component") = to_string(d.component),
            py::arg("color_by") = viewer::to_string(d.color_by),
            py::arg("view_deg") = std::array<double, 2>{d.view_azimuth_deg, d.view_elevation_deg},
            py::arg("size_px") = std::array<int, 2>{d.width, d.height}, py::arg("frequency_hz") = py::none(),
            py::arg("range_db") = d.range_db, py::arg("colormap") = to_string(d.gain_map), py::arg("glyphs") = false,
            py::arg("software") = false, py::arg("force") = false,
            "Write one 3D view as `ellipsa render --out` does (the same code and bytes), chosen by the file\n"
            "name: .png a snapshot (headless, no display needed) or .glb/.ply the gain surface itself. The\n"
            "keywords are the command's options: component (the radius), color_by, view_deg=(azimuth,\n"
            "elevation) of the eye, size_px, frequency_hz (nearest within 0.5 %; default the middle one),\n"
            "range_db (below the peak), colormap, glyphs (polarisation ellipses), software (Mesa's software\n"
            "renderer). A bad value raises ValueError with the command's message, naming the keyword; an\n"
            "existing file is replaced only with force=True.");
#else
    cls.def("write_view", [](const Pattern&, const std::string&, const py::kwargs&) {
        raise(Error{"", 0, 0, std::string("3D views are not available: ") + cli::no_viewer_reason});
    }, py::arg("path"), "Not in this build: it has no viewer (ELLIPSA_VIEWER=OFF).");
#endif
}

}  // namespace ellipsa::python
