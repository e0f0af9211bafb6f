// Headless 3D snapshots for `ellipsa render`, reports and the viewer's "export view": the gain
// surface of one component, coloured by it or by another quantity, seen from a given azimuth and
// elevation, with a labelled colour bar, axis labels and a caption. Rendered through the headless
// EGL context (no display needed) into a 4x multisampled offscreen target.
//
// Cost: one context (about 50 ms with llvmpipe) plus one frame; a 1200 x 900 image of a 1-degree
// grid takes well under a second on a 2-core machine.
#pragma once
#include <cstdint>
#include <memory>
#include <mutex>
#include <string>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/polarisation.hpp"
#include "pattern/result.hpp"
#include "viewer/scene/colormap.hpp"
#include "viewer/scene/components.hpp"

namespace ellipsa::viewer {

struct SnapshotOptions {
    Component component = Component::total;
    ColorBy color_by = ColorBy::component;
    ColorMap gain_map = ColorMap::viridis;
    double view_azimuth_deg = 35;    // where the eye is: azimuth from +x toward +y
    double view_elevation_deg = 22;  // and elevation above the xy-plane
    int width = 1200, height = 900;
    std::size_t frequency_index = 0;
    double range_db = 30;
    bool glyphs = false;             // polarisation ellipses on the surface (needs phase)
    bool software = false;           // force Mesa's software renderer
    std::string title;               // default: the set's name and frequency
    const FarFieldSet* compare = nullptr;  // B pattern for ColorBy::difference
    std::size_t compare_frequency_index = 0;
};

// Render to RGBA8 pixels (top row first), width * height * 4 bytes. Makes and drops its own
// headless context: a caller with a current window context must release it first (GLVND allows
// one window-system API per thread at a time) and make it current again afterwards.
Result<std::vector<std::uint8_t>> render_snapshot_rgba(const FarFieldSet& s, const SnapshotOptions& o);

// Many snapshots in a row (a report's 3D views) through one headless context, offscreen target,
// scene renderer and ImGui font atlas: llvmpipe compiles every shader on its first use in a
// context, which was about half the CPU time of one 1200 x 900 view. The same pixels as
// render_snapshot_rgba. A new size or renderer choice starts afresh; the same thread only, with
// the same rule about a caller's current window context.
class SnapshotRenderer {
public:
    SnapshotRenderer();
    ~SnapshotRenderer();
    SnapshotRenderer(const SnapshotRenderer&) = delete;
    SnapshotRenderer& operator=(const SnapshotRenderer&) = delete;
    Result<std::vector<std::uint8_t>> render(const FarFieldSet& s, const SnapshotOptions& o);

private:
    struct Gl;
    Status start(const SnapshotOptions& o);
    std::unique_ptr<Gl> gl_;
};

// Dear ImGui's current context is one pointer for the whole process: callers that may draw from
// several threads at once (the Python module releases its lock while it writes a report or a
// view) hold this one mutex while they render and while they drop a renderer.
std::mutex& snapshot_turn();

// Render and write a PNG through a temporary file and a rename. overwrite = false refuses when
// `path` exists (the message says to use --force).
Status render_snapshot_png(const FarFieldSet& s, const SnapshotOptions& o, const std::string& path,
                           bool overwrite = false);

}  // namespace ellipsa::viewer
