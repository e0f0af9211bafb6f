// The design report: for each pattern and frequency the headline figures (pattern/summary.hpp),
// the principal cuts (phi = 0 and phi = 90 elevation cuts, the theta = 90 azimuth cut and the
// elevation cut through the peak) as SVG, PNG and CSV, an optional 3D snapshot, and, when there
// are several patterns, a comparison section (overlaid cuts, side-by-side figures). Written into
// one folder as index.html and report.md built from the same document blocks.
//
// The library knows no viewer and no GL: 3D snapshots and extra figure rows (MEG, which needs a
// multipath environment) come in through callbacks, so the report builds and tests anywhere.
// MEG comes from pattern/diversity.hpp for the environment in the options.
#pragma once
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "exports/cut_plot.hpp"
#include "exports/render.hpp"
#include "pattern/environment.hpp"
#include "pattern/far_field.hpp"
#include "pattern/result.hpp"
#include "pattern/summary.hpp"

namespace ellipsa::exports {

struct ReportInput {
    std::string path;  // as given on the command line (shown in the report)
    FarFieldSet set;
};

// PNG bytes of a 3D view of one pattern at one frequency.
using SnapshotFn = std::function<Result<std::string>(const FarFieldSet& s, std::size_t freq_index)>;

// Extra rows for the figures table: (label, value text) for one pattern at one frequency.
struct ExtraFigure {
    std::string label;
    std::string value;
};
using ExtraFiguresFn = std::function<std::vector<ExtraFigure>(const FarFieldSet& s, std::size_t freq_index)>;

struct ReportOptions {
    std::string title = "Antenna pattern report";
    std::optional<double> frequency_hz;  // only this frequency (nearest within 0.5 %); default all
    RenderSize size;                     // of every cut figure (1200x900 px at 150 dpi)
    double range_db = 40;
    PlotStyle style = PlotStyle::polar;  // of every cut figure
    std::string generator = "ellipsa";   // "ellipsa 0.1.0": provenance line
    std::string generated_utc;           // date line; empty leaves it out (reproducible output)
    SnapshotFn snapshot;                 // empty: no 3D view (snapshot_note says why)
    // A second view coloured by axial ratio, only for data with phase (empty: none).
    SnapshotFn polarisation_snapshot;
    std::string snapshot_note;
    std::optional<Environment> environment;  // MEG row (Taga 1990) in this environment; none: no MEG row
    ExtraFiguresFn extra_figures;        // further rows, appended after MEG
    std::vector<std::string> method_notes;  // extra lines for the method section
};

// Everything that goes into the folder, computed but not yet written.
struct ReportFile {
    std::string name;   // plain file name inside the folder
    std::string bytes;
};
// Build all files of the report (index.html, report.md, the figures). Errors: a pattern lacking
// the asked-for frequency, a rendering failure.
Result<std::vector<ReportFile>> build_report(const std::vector<ReportInput>& inputs, const ReportOptions& o);

// Write the files into an existing folder (each through a temporary name and a rename).
Status write_report_files(const std::string& dir, const std::vector<ReportFile>& files);

// The cut components the report plots for a pattern at one frequency: total with RHCP/LHCP when
// the peak is circularly polarised (axial ratio at the peak up to 6 dB), with the theta/phi
// (vertical/horizontal) parts otherwise, total alone for total-only data.
std::vector<Component> report_components(const FarFieldSet& s, const PatternSummary& r);

}  // namespace ellipsa::exports
