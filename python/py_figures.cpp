// Pattern.info(), Pattern.summary() (the figures of `ellipsa info`, through the command's own JSON),
// Pattern.cut() (the core's cuts and beam figures) and coverage() (`ellipsa coverage`, through the
// command's own code, cli/coverage_json.hpp).
#include "exports/cut_plot.hpp"
#include "importers/text.hpp"
#include "cli/coverage_json.hpp"
#include "cli/info_json.hpp"
#include "cli/load.hpp"
#include "exports/cut_export.hpp"
#include "exports/cut_figure.hpp"
#include "exports/figure_text.hpp"
#include "io/atomic_write.hpp"
#include "pattern/component_phase.hpp"
#include "pattern/summary.hpp"
#include "python/py_common.hpp"

namespace ellipsa::python {

namespace {

// The figures exactly as `ellipsa info --json` gives them (the same code writes the same JSON,
// parsed here): unavailable values are None, with the reason keys beside them.
py::dict info(const Pattern& p, std::optional<double> frequency_hz) {
    std::vector<std::size_t> which;
    if (frequency_hz)
        which.push_back(frequency_index(p, 0, frequency_hz));
    else
        for (std::size_t k = 0; k < p.set.frequencies.size(); ++k) which.push_back(k);
    std::string text;
    {
        py::gil_scoped_release unlocked;
        text = cli::info_json(p.set, which, cli::info_figures(p.set, which));  // as `ellipsa info` does
    }
    return py::module_::import("json").attr("loads")(text);
}

py::dict summary(const Pattern& p, int index, std::optional<double> frequency_hz) {
    const std::size_t fi = frequency_index(p, index, frequency_hz);
    std::string text;
    {
        py::gil_scoped_release unlocked;
        cli::JsonWriter j;
        j.begin_object();
        const cli::InfoFigures f = cli::info_figures(p.set, {fi});
        cli::summary_json(j, p.set, fi, f.summaries[0], f.extras[0]);
        j.end_object();
        text = j.str();
    }
    return py::module_::import("json").attr("loads")(text);
}

py::dict beam_dict(const BeamFigures& b) {
    py::dict d;
    d["shape"] = to_string(b.shape);
    d["peak_angle_deg"] = b.peak_angle_deg, d["peak_db"] = b.peak_db;
    d["hpbw_deg"] = opt(b.hpbw_deg), d["hpbw_reason"] = opt(exports::beamwidth_reason(b));
    d["left_deg"] = opt(b.left_deg), d["right_deg"] = opt(b.right_deg);
    d["ripple_db"] = opt(b.ripple_db), d["half_power_span_deg"] = opt(b.half_power_span_deg);
    d["front_to_back_db"] = opt(b.front_to_back_db), d["front_to_back_above_db"] = opt(b.front_to_back_above_db);
    d["sidelobe_db"] = opt(b.sidelobe_db), d["mirror_beam"] = b.mirror_beam;
    return d;
}

CutSpec cut_spec(const Pattern& p, std::size_t fi, std::optional<double> phi_deg, std::optional<double> theta_deg,
                 std::optional<std::array<double, 2>> through, bool along_phi) {
    if (int(phi_deg.has_value()) + int(theta_deg.has_value()) + int(through.has_value()) > 1)
        throw py::value_error("choose one cut: phi_deg, theta_deg or through");
    if (theta_deg) {
        if (!(*theta_deg >= 0 && *theta_deg <= 180)) throw py::value_error("theta_deg: expected 0..180 deg");
        return CutSpec::theta_cut(*theta_deg);
    }
    if (through) return CutSpec::through((*through)[0], (*through)[1], along_phi);
    if (phi_deg) return CutSpec::phi_cut(*phi_deg);
    // Neither: the elevation cut through the peak of the total power, as `ellipsa cut --through-peak`.
    return CutSpec::phi_cut(std::round(find_peak(p.set, fi, Component::total).phi_deg * 10) / 10);
}

py::dict cut(const Pattern& p, std::optional<double> phi_deg, std::optional<double> theta_deg,
             std::optional<std::array<double, 2>> through, bool along_phi, const std::vector<std::string>& components,
             int index, std::optional<double> frequency_hz, std::optional<double> step_deg) {
    const std::size_t fi = frequency_index(p, index, frequency_hz);
    std::vector<Component> comps;
    for (const std::string& c : components) comps.push_back(component_named(c));
    const CutSpec spec = cut_spec(p, fi, phi_deg, theta_deg, through, along_phi);
    const ComponentCut c = take(compute_cut(p.set, fi, spec, comps, step_deg.value_or(0)));
    py::dict d, power, beams, phases;
    d["label"] = spec.label(), d["angle_name"] = spec.angle_name(), d["step_deg"] = c.samples.step_deg;
    d["frequency_hz"] = p.set.frequencies[fi].frequency_hz;
    d["angle_deg"] = copy(c.samples.angle_deg), d["theta_deg"] = copy(c.samples.theta_deg);
    d["phi_deg"] = copy(c.samples.phi_deg);
    d["e_theta"] = copy(c.samples.e_theta), d["e_phi"] = copy(c.samples.e_phi);
    py::array_t<bool> valid(py::ssize_t(c.samples.valid.size()));
    for (std::size_t k = 0; k < c.samples.valid.size(); ++k) valid.mutable_data()[k] = c.samples.valid[k] != 0;
    d["valid"] = valid;
    for (std::size_t k = 0; k < comps.size(); ++k) {
        power[to_string(comps[k])] = copy(c.power[k]);
        beams[to_string(comps[k])] = beam_dict(c.beams[k]);
        phases[to_string(comps[k])] = copy(cut_phase_deg(p.set, c.samples, comps[k]));  // NaN: no phase (total, no field, no phase data)
    }
    d["power"] = power, d["beam"] = beams, d["phase_deg"] = phases;
    return d;
}

// The cut as a figure (.svg, .pdf, .png) or its plotted values (.csv), as `ellipsa cut --out`.
void write_cut(const Pattern& p, const std::string& path, std::optional<double> phi_deg, std::optional<double> theta_deg,
               std::optional<std::array<double, 2>> through, bool along_phi, const std::vector<std::string>& components,
               int index, std::optional<double> frequency_hz, std::optional<double> step_deg, const std::string& style,
               double range_db, const std::string& title, std::array<int, 2> size_px, double dpi, bool force) {
    const std::size_t fi = frequency_index(p, index, frequency_hz);
    exports::CutExportRequest r;
    r.spec = cut_spec(p, fi, phi_deg, theta_deg, through, along_phi);
    r.components.clear();
    for (const std::string& c : components) r.components.push_back(component_named(c));
    if (!exports::parse_plot_style(style, r.figure.style)) throw py::value_error("style: expected \"polar\" or \"rect\"");
    if (!(range_db >= exports::min_range_db && range_db <= exports::max_range_db))
        throw py::value_error("range_db: expected a number of dB from " + text::number(exports::min_range_db) + " to " +
                              text::number(exports::max_range_db));
    r.figure.range_db = range_db, r.figure.title = title;
    r.size = render_size(size_px, dpi);
    r.step_deg = step_deg.value_or(0);
    Result<exports::CutData> done = Error{};
    {
        py::gil_scoped_release unlocked;
        done = exports::export_cut(p.set, fi, r, path, force);
    }
    take(std::move(done));
}

// One or two patterns' coverage as `ellipsa coverage` computes it: B at A's frequency.
struct CoverageRun {
    std::vector<const FarFieldSet*> sets;
    std::vector<std::string> names;  // the pattern's name, else its file, as the command names it
    std::vector<std::size_t> freq;
    exports::CoverageRequest request;
    std::vector<exports::CoverageSeries> series;
};

CoverageRun coverage_run(const std::vector<PatternPtr>& patterns, const std::optional<std::vector<std::string>>& components,
                         const std::vector<double>& levels_db, std::optional<double> horizon_deg,
                         std::optional<std::pair<double, double>> elevation_deg, std::optional<double> frequency_hz) {
    if (patterns.empty() || patterns.size() > 2) throw py::value_error("patterns: expected one pattern, or two for the best of both");
    CoverageRun run;
    for (const PatternPtr& p : patterns) {
        if (!p) throw py::value_error("patterns: expected ellipsa.Pattern objects");
        const std::string file = p->path.empty() ? label_of(p->set) : p->path;
        check(cli::refuse_cuts(p->set, file, "coverage of the sphere"));
        run.sets.push_back(&p->set);
        run.names.push_back(p->set.name.empty() ? file : p->set.name);
        run.freq.push_back(run.freq.empty() ? take(cli::pick_frequency(p->set, frequency_hz, file, false))
                                            : take(cli::coverage_frequency(p->set, run.sets[0]->frequencies[run.freq[0]].frequency_hz, file)));
    }
    run.request.levels_db = levels_db;
    run.request.band = take(cli::coverage_band(horizon_deg, elevation_deg));
    run.request.components.clear();  // none: the defaults, as the command's
    if (components)
        for (const std::string& c : *components) run.request.components.push_back(component_named(c));
    Result<std::vector<exports::CoverageSeries>> series = Error{};
    {
        py::gil_scoped_release unlocked;
        series = cli::coverage_of(run.sets, run.names, run.freq, run.request);
    }
    run.series = take(std::move(series));
    return run;
}

py::dict coverage(const std::vector<PatternPtr>& patterns, const std::optional<std::vector<std::string>>& components,
                  const std::vector<double>& levels_db, std::optional<double> horizon_deg,
                  std::optional<std::pair<double, double>> elevation_deg, std::optional<double> frequency_hz) {
    const CoverageRun r = coverage_run(patterns, components, levels_db, horizon_deg, elevation_deg, frequency_hz);
    const double f_hz = r.sets[0]->frequencies[r.freq[0]].frequency_hz;
    return py::module_::import("json").attr("loads")(cli::coverage_json(r.series, r.request, f_hz, r.sets));
}

void write_coverage(const std::string& path, const std::vector<PatternPtr>& patterns,
                    const std::optional<std::vector<std::string>>& components, const std::vector<double>& levels_db,
                    std::optional<double> horizon_deg, std::optional<std::pair<double, double>> elevation_deg,
                    std::optional<double> frequency_hz, const std::string& title, std::array<int, 2> size_px, double dpi,
                    bool force) {
    const exports::RenderSize size = render_size(size_px, dpi);
    CoverageRun r = coverage_run(patterns, components, levels_db, horizon_deg, elevation_deg, frequency_hz);
    r.request.title = title;
    const double f_hz = r.sets[0]->frequencies[r.freq[0]].frequency_hz;
    Status done = Ok{};
    {
        py::gil_scoped_release unlocked;
        auto bytes = cli::coverage_file(path, r.series, r.request, f_hz, r.sets, size);
        done = bytes ? io::write_file_atomically(path, *bytes, force) : Status(bytes.error());
    }
    check(done);
}

}  // namespace

void bind_figures(py::module_& m) {
    py::class_<Pattern, PatternPtr> p = py::reinterpret_borrow<py::class_<Pattern, PatternPtr>>(m.attr("Pattern"));
    p.def("info", &info, py::kw_only(), py::arg("frequency_hz") = py::none(),
          "Everything `ellipsa info --json` prints for this pattern, as a dict (the same code writes it): the\n"
          "description, the grid, one entry of \"results\" per frequency (or only frequency_hz) and, for\n"
          "several frequencies, the \"band\" summary. Unavailable figures are None.");
    p.def("summary", &summary, py::arg("index") = 0, py::kw_only(), py::arg("frequency_hz") = py::none(),
          "The headline figures of one frequency, as `ellipsa info --json` gives them in \"results\": peak_db,\n"
          "peak_theta_deg, peak_phi_deg, directivity_dbi, radiation_efficiency, hpbw_elevation_deg,\n"
          "hpbw_azimuth_deg, front_to_back_db, sidelobe_elevation_db, axial_ratio_db, sense, ar_beamwidth_deg, ...\n"
          "(None when unavailable; the *_reason keys say why).");
    p.def("cut", &cut, py::arg("phi_deg") = py::none(), py::arg("theta_deg") = py::none(), py::kw_only(),
          py::arg("through") = py::none(), py::arg("along_phi") = false,
          py::arg("components") = std::vector<std::string>{"total"}, py::arg("index") = 0,
          py::arg("frequency_hz") = py::none(), py::arg("step_deg") = py::none(),
          "One cut, as `ellipsa cut`: phi_deg (the great circle through both poles, angle = theta from -180\n"
          "to 180), theta_deg (a cone, angle = phi), or through=(theta_deg, phi_deg) (the great circle through\n"
          "that direction along theta-hat, or along phi-hat with along_phi=True); none of them: the elevation\n"
          "cut through the peak. Returns a dict of arrays angle_deg, theta_deg, phi_deg, e_theta, e_phi, valid;\n"
          "power[component] (linear, NaN outside the data), phase_deg[component] (deg in (-180, 180], NaN where there is\n"
          "none, as `ellipsa cut --phase`) and beam[component] (HPBW, front-to-back, side lobe).");
    p.def("write_cut", &write_cut, py::arg("path"), py::arg("phi_deg") = py::none(), py::arg("theta_deg") = py::none(),
          py::kw_only(), py::arg("through") = py::none(), py::arg("along_phi") = false,
          py::arg("components") = std::vector<std::string>{"total"}, py::arg("index") = 0,
          py::arg("frequency_hz") = py::none(), py::arg("step_deg") = py::none(), py::arg("style") = "polar",
          py::arg("range_db") = 40.0, py::arg("title") = "", py::arg("size_px") = std::array<int, 2>{1200, 900},
          py::arg("dpi") = 150.0, py::arg("force") = false,
          "Write one cut as `ellipsa cut --out` does: a figure (.svg, .pdf, .png; style \"polar\" or \"rect\",\n"
          "range_db below the top) or the plotted values (.csv), chosen by the file name. The cut as in cut().\n"
          "An existing file is replaced only with force=True.");
    m.def("coverage", &coverage, py::arg("patterns"), py::kw_only(), py::arg("components") = py::none(),
          py::arg("levels_db") = std::vector<double>{0, -3, -6, -10}, py::arg("horizon_deg") = py::none(),
          py::arg("elevation_deg") = py::none(), py::arg("frequency_hz") = py::none(),
          "The share of the sphere, or of an elevation band, where each component is at least each level, as\n"
          "`ellipsa coverage --out NAME.json` writes it (the same code): one pattern, or two for A, B and the best\n"
          "of both in every direction (B at A's frequency; frequency_hz nearest within 0.5 %, default the middle\n"
          "one of A's, as the command line). components: names (default: total, vertical,\n"
          "horizontal, and rhcp, lhcp with phase; for two patterns total); horizon_deg: within that many degrees\n"
          "of the horizon; elevation_deg=(min, max). Returns frequency_hz, mountings, band and series (each with\n"
          "label, component, pattern, unit, sampled_share and at_levels [{level_db, share}]).");
    m.def("write_coverage", &write_coverage, py::arg("path"), py::arg("patterns"), py::kw_only(),
          py::arg("components") = py::none(), py::arg("levels_db") = std::vector<double>{0, -3, -6, -10},
          py::arg("horizon_deg") = py::none(), py::arg("elevation_deg") = py::none(),
          py::arg("frequency_hz") = py::none(), py::arg("title") = "", py::arg("size_px") = std::array<int, 2>{1200, 900},
          py::arg("dpi") = 150.0, py::arg("force") = false,
          "Write the coverage as `ellipsa coverage --out` does, chosen by the file name: the curves as a figure\n"
          "(.svg, .png, .pdf), their values (.csv, 0.1 dB steps) or the figures of coverage() (.json). The\n"
          "patterns and options as in coverage(). An existing file is replaced only with force=True.");
}

}  // namespace ellipsa::python
