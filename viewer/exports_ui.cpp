#include "viewer/exports_ui.hpp"

#include "exports/cut_phase.hpp"

#include <algorithm>
#include <ctime>
#include <filesystem>

#include "exports/cut_figure.hpp"
#include "exports/render.hpp"
#include "io/atomic_write.hpp"
#include "pattern/component_phase.hpp"
#include "viewer/snapshot.hpp"

namespace ellipsa::viewer {

namespace {
bool something_at(const std::string& path) {
    std::error_code ec;
    return std::filesystem::exists(std::filesystem::symlink_status(path, ec));
}

// The file from the cut on screen: the same figure value that the panel draws.
Result<std::string> cut_bytes(const AppState& s, const CutData& cut, exports::FileFormat format) {
    const FarFieldSet& set = s.active_pattern()->set;
    if (s.settings.cut_phase && set.has_phase()) {  // the phase view, as `ellipsa cut --phase` writes it
        if (no_phase_component(*cut.a)) return Error{"", 0, 0, no_phase_component_text};
        const auto phases = exports::cut_phases(set, *cut.a);
        if (format == exports::FileFormat::csv) return exports::cut_csv(set, *cut.a, &phases);  // A's, as the gain view's CSV
        const LoadedPattern* b = s.compare_pattern();
        const bool with_b = b && cut.b && b->set.has_phase();  // B as the panel draws it, beside A
        const exports::XyFigure fig =
            with_b ? exports::make_cut_phase_comparison(set, *cut.a, phases, b->set, *cut.b, exports::cut_phases(b->set, *cut.b))
                   : exports::make_cut_phase_figure(set, *cut.a, phases, "");
        return exports::render_image([&](cairo_t* cr, double w, double h) { exports::draw_xy_figure(cr, fig, w, h); }, format,
                                     exports::RenderSize{}, fig.title);
    }
    if (format == exports::FileFormat::csv) return exports::cut_csv(set, *cut.a);
    const exports::CutPlot plot = cut_figure(s, cut);
    return exports::render_image([&](cairo_t* cr, double w, double h) { exports::draw_cut_plot(cr, plot, w, h); }, format,
                                 exports::RenderSize{}, plot.title);
}
}  // namespace

bool no_phase_component(const ComponentCut& cut) {
    return std::none_of(cut.components.begin(), cut.components.end(), [](Component c) { return has_phase(c); });
}

exports::CutPlot cut_figure(const AppState& s, const CutData& cut) {
    const LoadedPattern* a = s.active_pattern();
    exports::FigureOptions fo;
    fo.style = s.settings.polar_plot ? exports::PlotStyle::polar : exports::PlotStyle::rect;
    fo.range_db = s.settings.range_db;
    exports::CutPlot plot = exports::make_cut_plot(a->set, *cut.a, fo);
    const LoadedPattern* b = s.compare_pattern();
    if (b && cut.b) {
        // Both antennas by name in the table, by letter on the plot.
        for (exports::PlotCurve& c : plot.curves) {
            c.label = "A: " + a->set.name + ", " + c.label;
            c.tag = "A " + c.tag;
        }
        exports::add_curves(plot, b->set, *cut.b, "B: " + b->set.name + ", ", "B ");
        plot.title = a->set.name + " (A) and " + b->set.name + " (B)";
    }
    return plot;
}

ExportOutcome write_export(const std::string& path, bool overwrite, const std::function<Status()>& write) {
    if (!overwrite && something_at(path)) return {ExportOutcome::Status::exists, path, ""};
    const Status st = write();
    if (st) {
        std::error_code ec;
        return {ExportOutcome::Status::written, std::filesystem::absolute(path, ec).string(), ""};
    }
    if (!overwrite && something_at(path)) return {ExportOutcome::Status::exists, path, ""};
    return {ExportOutcome::Status::failed, path, st.error().format()};
}

ExportOutcome export_cut_file(const AppState& s, const CutData& cut, const std::string& path, bool overwrite) {
    if (!s.active_pattern() || !cut.a) return {ExportOutcome::Status::failed, path, "no cut is shown"};
    const auto format = exports::format_from_path(path);
    if (!format) return {ExportOutcome::Status::failed, path, path + ": expected a .svg, .pdf, .png or .csv file name"};
    return write_export(path, overwrite, [&]() -> Status {
        auto bytes = cut_bytes(s, cut, *format);
        if (!bytes) return bytes.error();
        return io::write_file_atomically(path, *bytes, overwrite);
    });
}

ExportOutcome export_view_file(const AppState& s, const std::string& path, bool overwrite) {
    const LoadedPattern* a = s.active_pattern();
    if (!a) return {ExportOutcome::Status::failed, path, "no pattern is shown"};
    SnapshotOptions so;
    so.component = s.settings.component;
    so.color_by = s.settings.color_by;
    so.gain_map = s.settings.gain_map;
    so.view_azimuth_deg = s.camera.azimuth_deg;
    so.view_elevation_deg = s.camera.elevation_deg;
    so.frequency_index = s.freq;
    so.range_db = s.settings.range_db;
    so.glyphs = s.settings.glyphs;
    const LoadedPattern* b = s.compare_pattern();
    so.compare = b ? &b->set : nullptr;
    so.compare_frequency_index = b ? s.freq_for(*b) : 0;
    return write_export(path, overwrite, [&] { return render_snapshot_png(a->set, so, path, overwrite); });
}

ExportOutcome export_surface_file(const AppState& s, const SurfaceMesh& mesh, const std::string& path, bool overwrite) {
    const LoadedPattern* a = s.active_pattern();
    if (!a) return {ExportOutcome::Status::failed, path, "no pattern is shown"};
    return write_export(path, overwrite,
                        [&] { return write_surface_file(a->set, s.freq, s.settings.component, mesh, path, overwrite); });
}

std::string timestamped_name(const std::string& stem, const std::string& extension) {
    char b[64];
    const std::time_t t = std::time(nullptr);
    std::tm local{};
    localtime_r(&t, &local);
    std::strftime(b, sizeof b, "-%Y%m%d-%H%M%S.", &local);
    return stem + b + extension;
}

}  // namespace ellipsa::viewer
