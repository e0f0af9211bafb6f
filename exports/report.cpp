#include "exports/report.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdio>

#include "exports/cut_figure.hpp"
#include "exports/document.hpp"
#include "exports/figure_text.hpp"
#include "exports/report_link.hpp"
#include "exports/report_views.hpp"
#include "io/atomic_write.hpp"
#include "pattern/cut.hpp"
#include "pattern/diversity_study.hpp"
#include "pattern/integrate.hpp"

namespace ellipsa::exports {

std::vector<Component> report_components(const FarFieldSet& s, const PatternSummary& r) {
    if (s.content == FieldContent::total_only) return {Component::total};
    if (s.has_phase() && r.sense && (*r.sense == Sense::right || *r.sense == Sense::left) && r.axial_ratio_db &&
        *r.axial_ratio_db <= 6.0)
        return {Component::total, Component::rhcp, Component::lhcp};
    return {Component::total, Component::theta, Component::phi};
}

namespace {


std::string slug(const std::string& s) {
    std::string o;
    for (unsigned char c : s) {
        if (std::isalnum(c))
            o += char(std::tolower(c));
        else if (!o.empty() && o.back() != '-')
            o += '-';
        if (o.size() >= 32) break;
    }
    while (!o.empty() && o.back() == '-') o.pop_back();
    return o.empty() ? "pattern" : o;
}
std::string basename_of(const std::string& p) {
    const std::size_t s = p.rfind('/');
    std::string b = s == std::string::npos ? p : p.substr(s + 1);
    const std::size_t dot = b.rfind('.');
    return dot == std::string::npos || dot == 0 ? b : b.substr(0, dot);
}
std::string freq_tag(double hz, std::size_t fi) {
    if (!(hz > 0)) return "f" + std::to_string(fi + 1);
    char b[48];
    std::snprintf(b, sizeof b, "%gMHz", std::round(hz / 1e3) / 1e3);
    return b;
}
// "A", "B", ... "Z", "A2", ...
std::string letter(std::size_t i) {
    return std::string(1, char('A' + i % 26)) + (i >= 26 ? std::to_string(i / 26 + 1) : "");
}

// Figures tables: one row per figure, one column per label; at most five value columns per table
// so that the page stays readable with many frequencies or patterns.
void figures_tables(Document& doc, const std::vector<std::string>& labels,
                    const std::vector<std::vector<std::pair<std::string, std::string>>>& cols) {
    constexpr std::size_t per_table = 5;
    for (std::size_t c0 = 0; c0 < cols.size(); c0 += per_table) {
        const std::size_t c1 = std::min(cols.size(), c0 + per_table);
        DocTable t;
        t.header = {"Figure"};
        for (std::size_t c = c0; c < c1; ++c) t.header.push_back(labels[c]);
        for (std::size_t r = 0; r < cols[c0].size(); ++r) {
            std::vector<std::string> row{cols[c0][r].first};
            for (std::size_t c = c0; c < c1; ++c) row.push_back(r < cols[c].size() ? cols[c][r].second : "");
            t.rows.push_back(row);
        }
        doc.table(t);
    }
}

std::string display_name(const ReportInput& in) { return in.set.name.empty() ? basename_of(in.path) : in.set.name; }

const char* quantity_word(Quantity q) {
    switch (q) {
        case Quantity::gain: return "Peak gain";
        case Quantity::directivity: return "Peak directivity";
        case Quantity::relative: return "Peak (relative)";
    }
    return "Peak";
}

// One figures column: label -> value, in a fixed row order.
std::vector<std::pair<std::string, std::string>> figure_rows(const FarFieldSet& s, std::size_t fi, const PatternSummary& r,
                                                            const ReportOptions& o) {
    std::vector<std::pair<std::string, std::string>> v;
    v.emplace_back(std::string(quantity_word(s.quantity)) + (s.quantity == Quantity::relative ? " (dB)" : " (dBi)"),
                   r.zero_field ? std::string("none (zero field)") : fixed(r.peak_db, db_decimals));
    v.emplace_back("Peak direction", r.zero_field ? std::string("none (zero field)")
                                                  : "θ " + fixed(r.peak.theta_deg, angle_decimals) + "°, φ " +
                                                        fixed(r.peak.phi_deg, angle_decimals) + "°");
    std::string d;
    if (r.directivity_dbi)
        d = fixed(*r.directivity_dbi, 2);
    else if (r.power.directivity_sampled_only)
        d = "unavailable (partial sphere; " + fixed(to_db(*r.power.directivity_sampled_only), 2) +
            " if nothing radiates outside the sampled region)";
    else
        d = needs_sphere_text(s.grid);
    v.emplace_back("Directivity (dBi)", d);
    v.emplace_back("Radiation efficiency (%)",
                   r.power.radiation_efficiency ? fixed(100 * *r.power.radiation_efficiency, percent_decimals) +
                                                      (r.efficiency_above_100 ? " (" + efficiency_warning_text(*r.power.radiation_efficiency) + ")" : "")
                   : s.grid.sampling == Sampling::cuts ? needs_sphere_text(s.grid)
                   : s.quantity == Quantity::gain      ? std::string("unavailable (partial sphere)")
                                                       : std::string("unavailable (needs absolute gain data)"));
    v.emplace_back("HPBW, " + beam_plane_text(r, false, "°") + " through the peak (°)", r.zero_field ? std::string("none (zero field)") : beamwidth_text(r.elevation, "θ", ""));
    v.emplace_back("HPBW, " + beam_plane_text(r, true, "°") + " through the peak (°)", r.zero_field ? std::string("none (zero field)") : beamwidth_text(r.azimuth, "angle", ""));
    v.emplace_back("Side lobe, " + beam_plane_text(r, false, "°") + " (dB)", r.zero_field ? std::string("none (zero field)") : sidelobe_text(r.elevation));
    // Beyond null_ratio_bound_db the back direction is a null, not a measurable level.
    v.emplace_back("Front-to-back (dB)", r.front_to_back_above_db ? "above " + fixed(*r.front_to_back_above_db, 0) + " (the back is a null)"
                                         : r.front_to_back_db     ? fixed(*r.front_to_back_db, db_decimals)
                                                                  : std::string("unavailable (back outside the data)"));
    v.emplace_back("Polarisation at the peak", r.sense ? polarisation_text(*r.sense, r.axial_ratio_db)
                                                       : "unavailable (" + r.unavailable_reason + ")");
    if (o.environment) {
        // The one diversity study (pattern/diversity_study.hpp), as `ellipsa diversity` computes it.
        auto st = study_diversity(*o.environment, DiversityOptions{}, {StudyPattern{&s, s.name, {fi}}});
        const Result<MegFigures> m = st ? st->patterns.front().front().meg : Result<MegFigures>(st.error());
        std::string val;
        if (!m)
            val = "unavailable (" + m.error().message + ")";
        else {
            val = fixed(to_db(m->meg), 2);
            if (!m->assumption.empty()) val += " (" + m->assumption + ")";
            if (m->sampled_share < 1 - 1e-9)
                val += " (counts only the " + fixed(100 * m->sampled_share, 1) + " % of incoming power that arrives inside the data)";
        }
        v.emplace_back("MEG, " + o.environment->name + " environment (dB)", val);
    }
    if (o.extra_figures)
        for (const ExtraFigure& e : o.extra_figures(s, fi)) v.emplace_back(e.label, e.value);
    return v;
}

struct CutDef {
    std::string tag;      // file name part
    std::string caption;  // figure caption
    CutSpec spec;
};

// Which of n frequencies get cuts, maps and 3D views: all of up to max_detail_frequencies, else
// the lowest, the centre (the coverage section's) and the highest. Hundreds of figure files for
// a long sweep took minutes and said less than the band figures, which cover every frequency.
constexpr std::size_t max_detail_frequencies = 5;
std::vector<std::size_t> detail_positions(std::size_t n) {
    std::vector<std::size_t> v;
    if (n <= max_detail_frequencies) {
        for (std::size_t j = 0; j < n; ++j) v.push_back(j);
        return v;
    }
    return {0, n / 2, n - 1};
}

std::vector<CutDef> principal_cuts(const PatternSummary& r, std::string* peak_note) {
    std::vector<CutDef> v{{"phi0", "Elevation cut φ = 0° (xz-plane)", CutSpec::phi_cut(0)},
                          {"phi90", "Elevation cut φ = 90° (yz-plane)", CutSpec::phi_cut(90)},
                          {"theta90", "Azimuth cut θ = 90° (xy-plane)", CutSpec::theta_cut(90)}};
    const double pp = std::round(wrap360(r.peak.phi_deg) * 10) / 10;
    // The phi-cut planes phi and phi + 180 are the same cut.
    const double plane = std::fmod(pp, 180.0);
    if (std::abs(plane) < 0.05 || std::abs(plane - 180) < 0.05)
        *peak_note = "The peak lies in the φ = 0° plane: its elevation cut is the φ = 0° cut.";
    else if (std::abs(plane - 90) < 0.05)
        *peak_note = "The peak lies in the φ = 90° plane: its elevation cut is the φ = 90° cut.";
    else {
        char c[96];
        std::snprintf(c, sizeof c, "Elevation cut through the peak, φ = %g°", pp);
        v.push_back({"peak", c, CutSpec::phi_cut(pp)});
    }
    return v;
}

struct Renderer {
    const ReportOptions& o;
    std::vector<ReportFile>& files;

    Status figure(const CutPlot& plot, const std::string& base, DocFigure& f) {
        return add_figure_files([&](cairo_t* cr, double w, double h) { draw_cut_plot(cr, plot, w, h); }, plot.title, base,
                                o.size, files, f);
    }
};

std::string components_text(const std::vector<Component>& comps, Ludwig3Reference ref) {
    std::string s;
    for (std::size_t i = 0; i < comps.size(); ++i)
        s += (i == 0 ? "" : i + 1 == comps.size() ? " and " : ", ") + long_label(comps[i], ref);
    return s;
}

using Freqs = std::vector<std::vector<std::size_t>>;

// The frequencies each pattern reports: the one asked for, or all of them.
Result<Freqs> report_frequencies(const std::vector<ReportInput>& inputs, const ReportOptions& o) {
    Freqs freqs(inputs.size());
    for (std::size_t i = 0; i < inputs.size(); ++i) {
        const FarFieldSet& s = inputs[i].set;
        if (s.frequencies.empty()) return Error{inputs[i].path, 0, 0, "holds no frequency"};
        if (o.frequency_hz) {
            auto k = find_frequency(s, *o.frequency_hz, inputs[i].path);
            if (!k) return k.error();
            freqs[i].push_back(*k);
        } else {
            for (std::size_t k = 0; k < s.frequencies.size(); ++k) freqs[i].push_back(k);
        }
    }
    return freqs;
}

// Who made the report, from which files, at which frequencies.
void intro_section(Document& doc, const std::vector<ReportInput>& inputs, const Freqs& freqs, const ReportOptions& o) {
    std::string intro = "Generated by " + o.generator;
    if (!o.generated_utc.empty()) intro += " on " + o.generated_utc;
    intro += " from " + std::to_string(inputs.size()) + (inputs.size() == 1 ? " pattern file." : " pattern files.");
    doc.paragraph(intro);
    DocTable t;
    t.header = {"", "Pattern", "File", "Frequencies"};
    t.numeric = {false, false, false, false};
    for (std::size_t i = 0; i < inputs.size(); ++i) {
        std::string fl;
        for (std::size_t k : freqs[i]) fl += (fl.empty() ? "" : ", ") + format_frequency(inputs[i].set.frequencies[k].frequency_hz);
        t.rows.push_back({letter(i), display_name(inputs[i]), inputs[i].path, fl});
    }
    doc.table(t);
}

// A pattern's file, source, quantity, grid and mounting in one paragraph.
std::string about_text(const ReportInput& in) {
    const FarFieldSet& s = in.set;
    std::string about = "File " + in.path + ". ";
    if (!s.source.empty() && s.source != in.path) about += "Source: " + s.source + ". ";
    char grid[240];
    std::snprintf(grid, sizeof grid,
                  "Quantity %s, %s data; grid θ %g..%g° step %g°, φ %g..%g° step %g°; coverage ",
                  to_string(s.quantity), to_string(s.content), s.grid.theta.start_deg, s.grid.theta.last_deg(),
                  s.grid.theta.step_deg, s.grid.phi.start_deg, s.grid.phi.last_deg(), s.grid.phi.step_deg);
    about += grid + coverage_text(s.grid) + ".";
    if (!is_identity(s.mounting) || !is_identity(s.file_mounting)) about += " Mounting: " + mounting_text(s) + ".";
    return about;
}

// File names for one frequency; frequencies that round to the same tag get their index too.
std::string frequency_base(const FarFieldSet& s, const std::vector<std::size_t>& fl, std::size_t j, const std::string& base) {
    const std::size_t fi = fl[j];
    std::string fbase = base + "-" + freq_tag(s.frequencies[fi].frequency_hz, fi);
    for (std::size_t jj = 0; jj < j; ++jj)
        if (freq_tag(s.frequencies[fl[jj]].frequency_hz, fl[jj]) == freq_tag(s.frequencies[fi].frequency_hz, fi)) {
            fbase += "-f" + std::to_string(fi + 1);
            break;
        }
    return fbase;
}

// One 3D snapshot as a figure, or a note saying why there is none.
void snapshot_figure(Document& doc, std::vector<ReportFile>& files, const SnapshotFn& shot, const FarFieldSet& s,
                     std::size_t fi, const std::string& caption, const std::string& file, const std::string& what,
                     std::vector<DocFigure>& figs) {
    auto png = shot(s, fi);
    if (!png) {
        doc.note(what + " unavailable: " + png.error().message);
        return;
    }
    DocFigure f;
    f.caption = caption + ", " + format_frequency(s.frequencies[fi].frequency_hz);
    f.raster_file = file;
    files.push_back({f.raster_file, std::move(*png)});
    figs.push_back(f);
}

// One pattern's principal cuts, map and 3D views at one of its frequencies (position j of its list).
Status detail_section(Document& doc, Renderer& rd, const ReportInput& in, const std::vector<std::size_t>& fl, std::size_t j,
                      const PatternSummary& r, const std::string& base) {
    const ReportOptions& o = rd.o;
    const FarFieldSet& s = in.set;
    const std::size_t fi = fl[j];
    const std::string fbase = frequency_base(s, fl, j, base);
    doc.heading(3, "Cuts at " + format_frequency(s.frequencies[fi].frequency_hz));
    const std::vector<Component> comps = report_components(s, r);
    std::string peak_note;
    std::vector<DocFigure> figs;
    for (const CutDef& cd : principal_cuts(r, &peak_note)) {
        auto cut = compute_cut(s, fi, cd.spec, comps);
        if (!cut) {
            doc.note(cd.caption + ": " + cut.error().message);
            continue;
        }
        FigureOptions fo;
        fo.range_db = o.range_db;
        fo.style = o.style;
        fo.title = display_name(in);
        const CutPlot plot = make_cut_plot(s, *cut, fo);
        DocFigure f;
        f.caption = cd.caption + ", " + format_frequency(s.frequencies[fi].frequency_hz);
        f.alt = f.caption + " of " + display_name(in);
        if (Status st = rd.figure(plot, fbase + "-" + cd.tag, f); !st) return st;
        rd.files.push_back({fbase + "-" + cd.tag + ".csv", cut_csv(s, *cut)});
        figs.push_back(f);
    }
    if (Status st = map_figure(rd.files, s, fi, fbase, display_name(in), o, figs); !st) return st;
    if (o.snapshot)
        snapshot_figure(doc, rd.files, o.snapshot, s, fi, "3D view of the total pattern", fbase + "-3d.png", "3D view", figs);
    if (o.polarisation_snapshot && s.has_phase())
        snapshot_figure(doc, rd.files, o.polarisation_snapshot, s, fi, "3D view of the total pattern coloured by axial ratio",
                        fbase + "-3d-axial-ratio.png", "3D axial-ratio view", figs);
    doc.figures(figs);
    doc.note("Curves: " + components_text(comps, s.ludwig3_reference) +
             (comps.size() > 1 && comps[1] == Component::rhcp
                  ? " (the peak is circularly polarised: axial ratio up to 6 dB)."
                  : comps.size() > 1 ? " (θ and φ are the vertical and horizontal parts in the world frame, +z up; mounting: " +
                                           mounting_text(s) + ")."
                                     : ".") +
             (peak_note.empty() ? "" : " " + peak_note) + " Each cut's plotted values are in the CSV file beside its image.");
    return Ok{};
}

// One pattern: what it is, its figures over frequency, band and coverage, then the detail views.
Status pattern_section(Document& doc, Renderer& rd, const ReportInput& in, std::size_t i, const std::vector<std::size_t>& fl) {
    const ReportOptions& o = rd.o;
    const FarFieldSet& s = in.set;
    const std::string base = "p" + std::to_string(i + 1) + "-" + slug(display_name(in));
    doc.heading(2, letter(i) + ". " + display_name(in), base);
    doc.paragraph(about_text(in));
    if (!s.note.empty()) doc.note(s.note);

    const std::vector<PatternSummary> summaries = summarize_each(s, fl);
    // Figures table: one column per frequency.
    std::vector<std::string> labels;
    std::vector<std::vector<std::pair<std::string, std::string>>> cols;
    for (std::size_t j = 0; j < fl.size(); ++j) {
        labels.push_back(format_frequency(s.frequencies[fl[j]].frequency_hz));
        cols.push_back(figure_rows(s, fl[j], summaries[j], o));
    }
    doc.heading(3, "Figures");
    figures_tables(doc, labels, cols);
    if (!summaries.empty() && !summaries[0].unavailable_reason.empty()) doc.note(summaries[0].unavailable_reason);
    if (Status st = band_section(doc, rd.files, s, base, display_name(in), o); !st) return st;
    if (Status st = coverage_section(doc, rd.files, s, fl[fl.size() / 2], base, display_name(in), o); !st) return st;

    const std::vector<std::size_t> detail = detail_positions(fl.size());
    if (detail.size() < fl.size())
        doc.note("Cuts, maps and 3D views at the lowest, centre and highest of the " + std::to_string(fl.size()) +
                 " frequencies; the figures table and the band figures cover every one (ask for another with --frequency).");
    for (const std::size_t j : detail)
        if (Status st = detail_section(doc, rd, in, fl, j, summaries[j], base); !st) return st;
    return Ok{};
}

// The comparison's frequency: the one asked for, or the middle one of the first pattern's (the design
// frequency of a band sweep).
double comparison_frequency(const std::vector<ReportInput>& inputs, const Freqs& freqs, const ReportOptions& o) {
    return o.frequency_hz ? *o.frequency_hz : inputs[0].set.frequencies[freqs[0][freqs[0].size() / 2]].frequency_hz;
}

// One principal cut of total power with every pattern's curve; false when no pattern has it.
bool comparison_plot(const std::vector<ReportInput>& inputs, const std::vector<std::size_t>& cfi, const CutDef& cd, bool same_f,
                     const ReportOptions& o, CutPlot& plot) {
    bool first = true;
    for (std::size_t i = 0; i < inputs.size(); ++i) {
        auto cut = compute_cut(inputs[i].set, cfi[i], cd.spec, {Component::total});
        if (!cut) continue;
        const std::string prefix = letter(i) + ". " + display_name(inputs[i]) + " ";
        if (first) {
            FigureOptions fo;
            fo.range_db = o.range_db;
            fo.style = o.style;
            fo.title = "Comparison, total power";
            plot = make_cut_plot(inputs[i].set, *cut, fo);
            plot.curves.clear();
            plot.notes.clear();
            plot.notes.push_back("F/B: peak against the point 180° further round this cut.");
            if (!same_f) plot.subtitle = describe_cut(cd.spec) + "  ·  " + plot.value_label + " (" + plot.value_unit + ")";
            first = false;
        }
        add_curves(plot, inputs[i].set, *cut, prefix, "");
        plot.curves.back().label = letter(i) + ". " + display_name(inputs[i]);
        plot.curves.back().tag = letter(i);
        if (!same_f) plot.curves.back().label += " (" + format_frequency(inputs[i].set.frequencies[cfi[i]].frequency_hz) + ")";
    }
    plot.marked_curve = -1;
    return !first;
}

// All patterns side by side at one frequency: their figures and the principal cuts of total power.
Status comparison_section(Document& doc, Renderer& rd, const std::vector<ReportInput>& inputs, const Freqs& freqs) {
    const ReportOptions& o = rd.o;
    doc.heading(2, "Comparison", "comparison");
    const double f0 = comparison_frequency(inputs, freqs, o);
    std::vector<std::size_t> cfi(inputs.size());
    std::vector<PatternSummary> cs;
    bool same_f = true;
    for (std::size_t i = 0; i < inputs.size(); ++i) {
        cfi[i] = inputs[i].set.nearest_frequency(f0);
        cs.push_back(summarize(inputs[i].set, cfi[i]));
        if (std::abs(inputs[i].set.frequencies[cfi[i]].frequency_hz - f0) > 0.005 * std::abs(f0)) same_f = false;
    }
    doc.paragraph(same_f ? "All patterns at " + format_frequency(f0) + "."
                         : "The patterns hold different frequencies; each is taken at its frequency nearest " +
                               format_frequency(f0) + " (see the table header).");
    std::vector<std::string> labels;
    std::vector<std::vector<std::pair<std::string, std::string>>> cols;
    for (std::size_t i = 0; i < inputs.size(); ++i) {
        labels.push_back(letter(i) + ". " + display_name(inputs[i]) + " (" +
                         format_frequency(inputs[i].set.frequencies[cfi[i]].frequency_hz) + ")");
        cols.push_back(figure_rows(inputs[i].set, cfi[i], cs[i], o));
    }
    figures_tables(doc, labels, cols);
    std::vector<DocFigure> figs;
    std::string dummy;
    for (const CutDef& cd : principal_cuts(cs[0], &dummy)) {
        if (cd.tag == "peak") continue;  // peaks differ between patterns
        CutPlot plot;
        if (!comparison_plot(inputs, cfi, cd, same_f, o, plot)) continue;
        DocFigure f;
        f.caption = "Comparison: " + cd.caption + ", total power";
        if (Status st = rd.figure(plot, "compare-" + cd.tag, f); !st) return st;
        figs.push_back(f);
    }
    doc.figures(figs);
    return Ok{};
}

// The world frame and each pattern's mounting in it (exports::mounting_text, the words of every output).
std::string mounting_paragraph(const std::vector<ReportInput>& inputs) {
    std::string t = "Frame: every figure refers to the installed antenna in the world frame, +z up (the zenith) and the "
                    "horizon at θ = 90°; a file's axes are turned into it by the mounting (docs/conventions.md, \"The "
                    "mounting frame\"). Mounting applied: ";
    for (std::size_t i = 0; i < inputs.size(); ++i)
        t += (i ? "; " : "") + (inputs.size() > 1 ? letter(i) + ". " : std::string()) + mounting_text(inputs[i].set);
    return t + ".";
}

// How the figures were computed, with the sources.
void method_section(Document& doc, const std::vector<ReportInput>& inputs, const ReportOptions& o) {
    doc.heading(2, "Method", "method");
    doc.paragraph(mounting_paragraph(inputs));
    doc.paragraph("Directions: θ from +z, φ from +x toward +y, in the world frame. Elevation cuts run θ from −180° to 180° in the plane φ "
                  "(negative θ is the half-plane φ + 180°); the azimuth cut runs φ round the horizon θ = 90°.");
    doc.paragraph("HPBW: the width between the two −3.01 dB crossings around the peak of a cut, interpolated between "
                  "samples. Front-to-back: the peak against the opposite direction (θ → 180° − θ, φ → φ + 180°) in the "
                  "figures table, and against the point 180° further round the cut in the figure legends.");
    doc.paragraph("Directivity = 4π U_max / P with P integrated over the sphere; radiation efficiency = P / 4π from "
                  "absolute gain data. Both need the full sphere. Axial ratio and sense follow IEEE Std 145-2013 "
                  "(exp(+jωt), right-hand when the field turns clockwise looking along the direction of propagation).");
    if (o.environment)
        doc.paragraph("MEG: mean effective gain after T. Taga (IEEE Trans. VT-39, 1990), the integral of "
                      "[XPR/(1+XPR) G_θ P_θ + 1/(1+XPR) G_φ P_φ] over the sphere, each antenna as mounted (Frame, above), in the environment " +
                      describe(*o.environment) + ". Parameters: " + o.environment->source + ".");
    for (const std::string& n : o.method_notes) doc.paragraph(n);
    doc.note("Curve colours: Okabe–Ito palette, with a different dash for each curve so the figures also read in grey.");
}

}  // namespace

Result<std::vector<ReportFile>> build_report(const std::vector<ReportInput>& inputs, const ReportOptions& o) {
    std::vector<ReportFile> files;
    Renderer rd{o, files};
    Document doc;
    doc.title = o.title;
    if (inputs.empty()) return Error{"", 0, 0, "no pattern to report on"};
    auto freqs = report_frequencies(inputs, o);
    if (!freqs) return freqs.error();

    intro_section(doc, inputs, *freqs, o);
    for (std::size_t i = 0; i < inputs.size(); ++i)
        if (Status st = pattern_section(doc, rd, inputs[i], i, (*freqs)[i]); !st) return st.error();
    if (!o.snapshot && !o.snapshot_note.empty()) doc.note(o.snapshot_note);
    if (inputs.size() > 1)
        if (Status st = comparison_section(doc, rd, inputs, *freqs); !st) return st.error();

    // Link reliability at the comparison's frequency.
    const double f0 = comparison_frequency(inputs, *freqs, o);
    std::vector<LinkInput> link;
    for (std::size_t i = 0; i < inputs.size(); ++i)
        link.push_back({&inputs[i].set, inputs[i].path, letter(i) + ". " + display_name(inputs[i]), inputs[i].set.nearest_frequency(f0)});
    if (Status st = link_section(doc, files, link, o); !st) return st.error();

    method_section(doc, inputs, o);
    files.push_back({"index.html", to_html(doc)});
    files.push_back({"report.md", to_markdown(doc)});
    return files;
}

Status write_report_files(const std::string& dir, const std::vector<ReportFile>& files) {
    for (const ReportFile& f : files) {
        Status st = io::write_file_atomically(dir + "/" + f.name, f.bytes, true);
        if (!st) return st;
    }
    return Ok{};
}

}  // namespace ellipsa::exports
