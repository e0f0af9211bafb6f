#include "exports/cut_export.hpp"

#include "exports/cut_phase.hpp"
#include "io/atomic_write.hpp"
#include "pattern/component_phase.hpp"

namespace ellipsa::exports {

Result<CutData> export_cut(const FarFieldSet& s, std::size_t fi, const CutExportRequest& r, const std::string& path,
                           bool overwrite) {
    const auto format = format_from_path(path);
    if (!format) return Error{path, 0, 0, "expected a file name ending in .svg, .png, .pdf or .csv"};
    if (r.phase)
        for (Component c : r.components)
            if (auto why = phase_unavailable(s, c)) return Error{"", 0, 0, *why};
    auto cut = compute_cut(s, fi, r.spec, r.components, r.step_deg);
    if (!cut) return cut.error();
    std::string bytes;
    const std::vector<std::vector<double>> phases = r.phase ? cut_phases(s, *cut) : std::vector<std::vector<double>>{};
    if (*format == FileFormat::csv) {
        bytes = cut_csv(s, *cut, r.phase ? &phases : nullptr);
    } else if (r.phase) {
        const XyFigure fig = make_cut_phase_figure(s, *cut, phases, r.figure.title);
        auto img = render_image([&](cairo_t* cr, double w, double h) { draw_xy_figure(cr, fig, w, h); }, *format, r.size,
                                fig.title);
        if (!img) return Error{path, 0, 0, img.error().message};
        bytes = std::move(*img);
    } else {
        const CutPlot plot = make_cut_plot(s, *cut, r.figure);
        auto img = render_image([&](cairo_t* cr, double w, double h) { draw_cut_plot(cr, plot, w, h); }, *format, r.size,
                                plot.title);
        if (!img) return Error{path, 0, 0, img.error().message};
        bytes = std::move(*img);
    }
    Status w = io::write_file_atomically(path, bytes, overwrite);
    if (!w) return w.error();
    return cut;
}

}  // namespace ellipsa::exports
