// The report's 3D views (cli/report_3d.hpp).
#include "cli/report_3d.hpp"

#include <cstdint>
#include <memory>
#include <string>
#include <mutex>  // viewer::snapshot_turn(): reports drawn from two threads take turns
#include <vector>

#include "exports/png.hpp"
#ifdef ELLIPSA_HAVE_VIEWER
#include "viewer/snapshot.hpp"
#endif

namespace ellipsa::cli {

#ifdef ELLIPSA_HAVE_VIEWER
namespace {

// One renderer for every 3D view of a report: its context and compiled shaders are kept between
// views, and dropped with the report's options.
struct SharedRenderer {
    std::unique_ptr<viewer::SnapshotRenderer> renderer = std::make_unique<viewer::SnapshotRenderer>();
    SharedRenderer() = default;
    SharedRenderer(const SharedRenderer&) = delete;
    SharedRenderer& operator=(const SharedRenderer&) = delete;
    ~SharedRenderer() {
        std::lock_guard<std::mutex> turn(viewer::snapshot_turn());
        renderer.reset();
    }
};

}  // namespace
#endif

void add_report_3d_views(exports::ReportOptions& o, const exports::RenderSize& size) {
#ifdef ELLIPSA_HAVE_VIEWER
    auto shared = std::make_shared<SharedRenderer>();
    auto view = [size, shared](viewer::ColorBy colour) {
        return [size, colour, shared](const FarFieldSet& s, std::size_t fi) -> Result<std::string> {
            viewer::SnapshotOptions so;
            so.frequency_index = fi;
            so.width = size.width_px;
            so.height = size.height_px;
            so.color_by = colour;
            Result<std::vector<std::uint8_t>> rgba = Error{};
            {
                std::lock_guard<std::mutex> turn(viewer::snapshot_turn());
                rgba = shared->renderer->render(s, so);
            }
            if (!rgba) return rgba.error();
            return exports::encode_png(rgba->data(), so.width, so.height, 4, std::size_t(so.width) * 4);
        };
    };
    o.snapshot = view(viewer::ColorBy::component);
    o.polarisation_snapshot = view(viewer::ColorBy::axial_ratio);
#else
    (void)size;
    o.snapshot_note = std::string("3D views are not included: ") + no_viewer_reason + ".";
#endif
}

}  // namespace ellipsa::cli
