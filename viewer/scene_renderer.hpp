// Draws the 3D scene with OpenGL 3.3 core: the gain surface (optionally translucent, with a
// wireframe), its "not measured" region (hatched grey, with the data's edge as a line), the
// polarisation glyphs, the active cut ring and the axes. Geometry comes ready-made
// from the pure scene code (viewer/scene/); this class only owns GPU buffers and shaders.
// Uploading a 1-degree surface costs one buffer copy (about 2.4 MB); drawing is one call per layer.
#pragma once
#include <cstdint>
#include <optional>

#include "pattern/result.hpp"
#include "viewer/scene/camera.hpp"
#include "viewer/scene/colormap.hpp"
#include "viewer/scene/glyphs.hpp"
#include "viewer/scene/surface_mesh.hpp"

namespace ellipsa::viewer {

struct SceneStyle {
    bool wireframe = false;
    bool translucent = false;
    bool glyphs = true;
    bool cut_ring = true;
    bool axes = true;
    bool full_detail = false;  // every grid line however small its cells (ELLIPSA_FULL_DETAIL=1; comparisons, benchmarks)
    Rgb background{0.97f, 0.97f, 0.96f};
};

class SceneRenderer {
public:
    SceneRenderer() = default;
    ~SceneRenderer();
    SceneRenderer(const SceneRenderer&) = delete;
    SceneRenderer& operator=(const SceneRenderer&) = delete;

    // Compile the embedded shaders; needs a current GL context.
    Status init();
    void set_surface(const SurfaceMesh& m);
    void clear_surface();
    void set_glyphs(const LineSet& l) { upload_lines(glyphs_, l); }
    void set_cut_ring(const LineSet& l) { upload_lines(ring_, l); }
    void set_axes(const LineSet& l) { upload_lines(axes_, l); }

    // Draw into the bound framebuffer, in the viewport (x, y from the bottom-left, w, h pixels).
    // clear: fill the viewport with the background first.
    void draw(const OrbitCamera& cam, int x, int y, int w, int h, const SceneStyle& style, bool clear = true);
    // The level of detail used by the last draw (1: every grid line).
    int last_stride() const { return last_stride_; }

private:
    struct Lines {
        unsigned vao = 0, vbo = 0;
        int count = 0;  // vertices
    };
    void upload_lines(Lines& l, const LineSet& set);
    void upload_lines(Lines& l, const std::vector<float>& vertices);
    void upload_unsampled(const UnsampledRegion& r);
    void draw_unsampled(int h);
    void draw_surface(const OrbitCamera& cam, int h, const glm::mat4& proj, const SceneStyle& st);
    void draw_lines(const Lines& l, float width);

    unsigned surface_program_ = 0, line_program_ = 0;
    unsigned surface_vao_ = 0, surface_vbo_ = 0, surface_ibo_ = 0, wire_vao_ = 0, wire_ibo_ = 0;
    int surface_index_count_ = 0, wire_index_count_ = 0;
    unsigned unsampled_vao_ = 0, unsampled_vbo_ = 0, unsampled_ibo_ = 0;  // the "not measured" region
    int unsampled_index_count_ = 0;
    int lod_count_[3] = {0, 0, 0};            // triangles x3 for stride 1, 2, 4
    std::size_t lod_offset_[3] = {0, 0, 0};   // byte offsets in the index buffer
    double grid_step_deg_ = 1;
    std::optional<SurfaceTopology> uploaded_topology_;  // of the index lists in the buffers
    int last_stride_ = 1;
    Lines glyphs_, ring_, axes_, edge_;  // edge_: the data's edge beside the "not measured" region
    // Uniform locations.
    int s_view_ = -1, s_proj_ = -1, s_alpha_ = -1, s_hatch_ = -1, l_view_ = -1, l_proj_ = -1, l_tint_ = -1, l_cull_ = -1;
    const float* view_ = nullptr;
    const float* proj_ = nullptr;
};

// An offscreen colour + depth target (headless rendering and snapshots). Multisampled when
// samples > 1; resolve() copies into a single-sampled target for reading pixels.
class OffscreenTarget {
public:
    ~OffscreenTarget();
    Status create(int w, int h, int samples);
    void bind() const;
    // Read the pixels as RGBA8, top row first.
    std::vector<std::uint8_t> read_rgba() const;
    int width() const { return w_; }
    int height() const { return h_; }

private:
    unsigned fbo_ = 0, color_ = 0, depth_ = 0;
    unsigned resolve_fbo_ = 0, resolve_color_ = 0;
    int w_ = 0, h_ = 0, samples_ = 1;
};

}  // namespace ellipsa::viewer
