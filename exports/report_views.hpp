// The report's sections beyond the cuts (issue 16's views): figures against frequency for a
// pattern with several frequencies, the whole-sphere map and the sphere coverage per frequency.
// Each adds document blocks and the files they refer to; build_report() calls them.
#pragma once
#include <string>
#include <vector>

#include "exports/document.hpp"
#include "exports/render.hpp"
#include "exports/report.hpp"

namespace ellipsa::exports {

// Render one drawing as SVG and PNG into `files` as base.svg and base.png, and name them in `f`.
Status add_figure_files(const Drawing& draw, const std::string& title, const std::string& base, const RenderSize& size,
                        std::vector<ReportFile>& files, DocFigure& f);

// "Figures against frequency": the band plot, its CSV and the band edges, for a pattern with two
// or more frequencies (nothing otherwise). base: the pattern's file name stem.
Status band_section(Document& doc, std::vector<ReportFile>& files, const FarFieldSet& s, const std::string& base,
                    const std::string& title, const ReportOptions& o);

// The whole-sphere map of the total power at one frequency (Hammer's equal-area projection),
// appended to `figs` with its files base-map.svg/png.
Status map_figure(std::vector<ReportFile>& files, const FarFieldSet& s, std::size_t freq_index, const std::string& base,
                  const std::string& title, const ReportOptions& o, std::vector<DocFigure>& figs);

// "Sphere coverage" at one frequency: the share of the sphere at or above 0, -3, -6 and -10 dB
// per component (total, vertical, horizontal, and RHCP, LHCP with phase) as a table and curves.
Status coverage_section(Document& doc, std::vector<ReportFile>& files, const FarFieldSet& s, std::size_t freq_index,
                        const std::string& base, const std::string& title, const ReportOptions& o);

}  // namespace ellipsa::exports
