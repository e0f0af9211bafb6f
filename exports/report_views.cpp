#include "exports/report_views.hpp"

#include "exports/band_figure.hpp"
#include "exports/coverage_figure.hpp"
#include "exports/cut_figure.hpp"
#include "exports/map_plot.hpp"
#include "exports/plot_pen.hpp"

namespace ellipsa::exports {

Status add_figure_files(const Drawing& draw, const std::string& title, const std::string& base, const RenderSize& size,
                        std::vector<ReportFile>& files, DocFigure& f) {
    for (FileFormat fmt : {FileFormat::svg, FileFormat::png}) {
        auto img = render_image(draw, fmt, size, title);
        if (!img) return img.error();
        const std::string name = base + "." + to_string(fmt);
        files.push_back({name, std::move(*img)});
        (fmt == FileFormat::svg ? f.vector_file : f.raster_file) = name;
    }
    return Ok{};
}

Status band_section(Document& doc, std::vector<ReportFile>& files, const FarFieldSet& s, const std::string& base,
                    const std::string& title, const ReportOptions& o) {
    if (s.frequencies.size() < 2 || o.frequency_hz) return Ok{};
    BandRequest r;
    if (o.environment) r.options.environments.push_back(*o.environment);
    r.title = title;
    r.panels = {BandPanel::gain};
    if (s.quantity == Quantity::gain) r.panels.push_back(BandPanel::efficiency);
    if (o.environment) r.panels.push_back(BandPanel::meg);
    if (s.has_phase()) r.panels.push_back(BandPanel::axial_ratio);
    r.panels.push_back(BandPanel::beamwidth);
    const BandSet b = compute_band_set("", s, r.options);
    const XyFigure fig = make_band_figure({b}, {}, r);
    doc.heading(3, "Figures against frequency");
    DocFigure f;
    f.caption = "Figures at each sampled frequency; the dashed lines are band edges interpolated between samples";
    f.alt = "Figures against frequency of " + title;
    RenderSize size = o.size;
    size.height_px = std::max(size.height_px, size.width_px * 9 / 10);
    Status st = add_figure_files([&](cairo_t* cr, double w, double h) { draw_xy_figure(cr, fig, w, h); }, fig.title,
                                 base + "-band", size, files, f);
    if (!st) return st;
    files.push_back({base + "-band.csv", band_csv({b}, {}, r)});
    doc.figures({f});
    DocTable t;
    t.header = {"Band (edges linear between sampled frequencies)", "Edges"};
    auto row = [&](const std::string& label, const std::optional<BandEdges>& e, const std::string& missing) {
        t.rows.push_back({label, e ? edges_text(*e) : missing});
    };
    row("Peak within 1 dB of its largest value", b.summary.gain_1db, "unavailable");
    row("Peak within 3 dB of its largest value", b.summary.gain_3db, "unavailable");
    row("Axial ratio ≤ 3 dB at θ " + num(b.summary.ar_theta_deg, 1) + "°, φ " + num(b.summary.ar_phi_deg, 1) + "°", b.summary.ar,
        "none (" + b.summary.ar_unavailable_reason + ")");
    doc.table(t);
    doc.note("The values plotted are in " + base + "-band.csv. The axial-ratio band is read at the peak direction of the "
             "middle frequency, the same direction at every frequency.");
    return Ok{};
}

Status map_figure(std::vector<ReportFile>& files, const FarFieldSet& s, std::size_t fi, const std::string& base,
                  const std::string& title, const ReportOptions& o, std::vector<DocFigure>& figs) {
    MapRequest r;
    r.title = title;
    r.range_db = o.range_db;
    auto plot = make_map_plot(s, fi, r);
    if (!plot) return plot.error();
    DocFigure f;
    f.caption = "Whole-sphere map of the total power, " + format_frequency(s.frequencies[fi].frequency_hz) +
                " (Hammer equal-area projection: area on the map is solid angle)";
    f.alt = f.caption + " of " + title;
    RenderSize size = o.size;
    size.height_px = size.width_px * 3 / 5;
    Status st = add_figure_files([&](cairo_t* cr, double w, double h) { draw_map_plot(cr, *plot, w, h); }, plot->title,
                                 base + "-map", size, files, f);
    if (!st) return st;
    figs.push_back(f);
    return Ok{};
}

Status coverage_section(Document& doc, std::vector<ReportFile>& files, const FarFieldSet& s, std::size_t fi,
                        const std::string& base, const std::string& title, const ReportOptions& o) {
    CoverageRequest r;
    r.components.clear();
    for (Component c : {Component::total, Component::vertical, Component::horizontal, Component::rhcp, Component::lhcp})
        if (!component_unavailable(s, c)) r.components.push_back(c);
    r.title = title;
    auto series = coverage_series({&s}, {""}, {fi}, r);
    if (!series) return series.error();
    const std::string f_text = format_frequency(s.frequencies[fi].frequency_hz);
    doc.heading(3, "Sphere coverage at " + f_text);
    DocTable t;
    t.header = {"Share of the sphere at or above"};
    for (double l : r.levels_db) t.header.push_back(num(l, 0) + " " + (*series)[0].unit);
    for (const CoverageSeries& cs : *series) {
        std::vector<std::string> row{cs.label};
        for (double l : r.levels_db) row.push_back(num(100 * share_at_or_above(cs.curve, l), 1) + " %");
        t.rows.push_back(row);
    }
    doc.table(t);
    const XyFigure fig = make_coverage_figure(*series, r, f_text + ", whole sphere");
    DocFigure f;
    f.caption = "Share of the sphere where each component reaches a level, " + f_text;
    f.alt = f.caption + ", " + title;
    Status st = add_figure_files([&](cairo_t* cr, double w, double h) { draw_xy_figure(cr, fig, w, h); }, fig.title,
                                 base + "-coverage", o.size, files, f);
    if (!st) return st;
    files.push_back({base + "-coverage.csv", coverage_csv(*series)});
    doc.figures({f});
    doc.note("Each grid sample counts with its cell's exact solid angle (as every integral here). RHCP and LHCP are in "
             "dBic. The curves' values are in " + base + "-coverage.csv.");
    return Ok{};
}

}  // namespace ellipsa::exports
