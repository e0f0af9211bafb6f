#include "viewer/cut_export_ui.hpp"

#include <filesystem>

#include "exports/cut_figure.hpp"
#include "exports/render.hpp"
#include "io/atomic_write.hpp"

namespace ellipsa::viewer {

std::string export_current_cut(const AppState& s, const std::string& path, bool overwrite) {
    const LoadedPattern* a = s.active_pattern();
    if (!a || !s.cut.valid) return "Nothing to export: no cut is shown";
    const auto format = exports::format_from_path(path);
    if (!format) return "Export failed: " + path + ": expected a .svg, .pdf, .png or .csv file name";
    std::vector<Component> comps;
    for (const CutCurve& c : s.cut.curves)
        if (c.pattern == 0) comps.push_back(c.component);
    auto ca = exports::compute_cut(a->set, s.freq, s.cut.spec, comps);
    if (!ca) return "Export failed: " + ca.error().format();
    std::string bytes;
    if (*format == exports::FileFormat::csv) {
        bytes = exports::cut_csv(a->set, *ca);
    } else {
        exports::FigureOptions fo;
        fo.style = s.settings.polar_plot ? exports::PlotStyle::polar : exports::PlotStyle::rect;
        fo.range_db = s.settings.range_db;
        exports::CutPlot plot = exports::make_cut_plot(a->set, *ca, fo);
        if (const LoadedPattern* b = s.compare_pattern()) {
            std::vector<Component> bc;
            for (Component c : comps)
                if (!exports::component_unavailable(b->set, c)) bc.push_back(c);
            auto cb = exports::compute_cut(b->set, s.freq_for(*b), s.cut.spec, bc);
            if (cb) {
                for (exports::PlotCurve& c : plot.curves) c.label = a->set.name + ": " + c.label;
                exports::add_curves(plot, b->set, *cb, b->set.name + ": ");
            }
        }
        auto img = exports::render_image([&](cairo_t* cr, double w, double h) { exports::draw_cut_plot(cr, plot, w, h); },
                                         *format, exports::RenderSize{}, plot.title);
        if (!img) return "Export failed: " + img.error().format();
        bytes = std::move(*img);
    }
    Status st = io::write_file_atomically(path, bytes, overwrite);
    if (!st) return "Export failed: " + st.error().format();
    return "Wrote " + std::filesystem::absolute(path).string();
}

}  // namespace ellipsa::viewer
