// One call from a pattern to a cut file: what `ellipsa cut` runs and what the viewer's
// "export cut" button should run, so both give the same figure. The format comes from the file
// name (.svg, .pdf, .png: the figure; .csv: the plotted values); the file is written through a
// temporary name and a rename.
#pragma once
#include <string>
#include <vector>

#include "exports/cut_figure.hpp"
#include "exports/render.hpp"

namespace ellipsa::exports {

struct CutExportRequest {
    CutSpec spec;
    std::vector<Component> components{Component::total};
    FigureOptions figure;  // style, range, title
    RenderSize size;       // pixels and dpi (SVG/PDF get the same physical size)
    double step_deg = 0;   // cut sample step; 0: default_cut_step(grid)
    // The phase of each component instead of its gain (exports/cut_phase.hpp): a rectangular
    // phase figure, or the CSV with a phase column after each gain column. figure.style is not used.
    bool phase = false;
};

// Returns the cut that was plotted (for readouts). Errors: unknown extension, a component the
// data cannot give (with `phase`: whose phase it cannot give, phase_unavailable()'s words), the file exists and overwrite is false, the write failed (the message names
// the file; an existing file is left as it was).
Result<CutData> export_cut(const FarFieldSet& s, std::size_t freq_index, const CutExportRequest& r,
                           const std::string& path, bool overwrite);

}  // namespace ellipsa::exports
