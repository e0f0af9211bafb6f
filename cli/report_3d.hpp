// The report's 3D views, shared by `ellipsa report` and the Python module's write_report, so both
// draw the same views through the same code and say the same when they cannot.
#pragma once
#include "exports/render.hpp"
#include "exports/report.hpp"

namespace ellipsa::cli {

// Why a build without the viewer (ELLIPSA_VIEWER=OFF) has no 3D views: the report's note, the
// refusal of `view` and `render` (cli/cmd_no_viewer.cpp) and Python's write_view say it alike.
inline constexpr const char* no_viewer_reason = "this build has no viewer (ELLIPSA_VIEWER=OFF)";

// Sets the report's 3D views (viewer/snapshot.hpp: one headless EGL renderer for every view,
// gain-coloured, and for data with phase also coloured by axial ratio), each `size` pixels. A
// build without the viewer sets the note saying why the report has none; where no GL context can
// be made, the report notes each view as unavailable with the reason (exports/report.cpp).
void add_report_3d_views(exports::ReportOptions& o, const exports::RenderSize& size);

}  // namespace ellipsa::cli
