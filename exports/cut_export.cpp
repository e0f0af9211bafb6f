#include "exports/cut_export.hpp"

#include "io/atomic_write.hpp"

namespace ellipsa::exports {

Result<CutData> export_cut(const FarFieldSet& s, std::size_t fi, const CutExportRequest& r, const std::string& path,
                           bool overwrite) {
    const auto format = format_from_path(path);
    if (!format) return Error{path, 0, 0, "expected a file name ending in .svg, .png, .pdf or .csv"};
    auto cut = compute_cut(s, fi, r.spec, r.components, r.step_deg);
    if (!cut) return cut.error();
    std::string bytes;
    if (*format == FileFormat::csv) {
        bytes = cut_csv(s, *cut);
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
