#include "viewer/snapshot.hpp"

#include <imgui.h>
#include <imgui_impl_opengl3.h>

#include <algorithm>
#include <cstdio>
#include <memory>

#include "exports/figure_text.hpp"
#include "exports/png.hpp"
#include "io/atomic_write.hpp"
#include "pattern/peak.hpp"
#include "viewer/gl.hpp"
#include "viewer/overlay.hpp"
#include "viewer/render_context.hpp"
#include "viewer/scene/glyphs.hpp"
#include "viewer/scene_renderer.hpp"
#include "viewer/ui_style.hpp"

namespace ellipsa::viewer {

namespace {

// Makes `mine` the current ImGui context and restores the caller's afterwards (the viewer window
// may be exporting). A context destroyed meanwhile is never restored: ImGui counts every
// allocation through its current context, so a dangling one was written to after it was freed,
// which corrupted the heap (Mesa's llvmpipe crashed later, in eglDestroyContext).
struct ImGuiContextSwitch {
    ImGuiContext* saved = ImGui::GetCurrentContext();
    explicit ImGuiContextSwitch(ImGuiContext* mine) { ImGui::SetCurrentContext(mine); }
    ~ImGuiContextSwitch() { ImGui::SetCurrentContext(saved); }
};

// The caption, axis labels, colour bar, ellipse key and radial scale, drawn with ImGui draw lists
// over the rendered scene; when a mounting applies, its text (exports::mounting_text) under the
// caption and the world-up gizmo at the top right of the view.
void draw_annotations(const FarFieldSet& s, const SnapshotOptions& o, const SurfaceMesh& mesh, const OrbitCamera& cam,
                      int view_w, float bar_strip, float scale, const UiFonts& fonts) {
    ImDrawList* dl = ImGui::GetBackgroundDrawList();
    const ImU32 ink = IM_COL32(34, 38, 46, 255), muted = IM_COL32(95, 100, 108, 255);
    const std::string title = !o.title.empty() ? o.title
                              : (s.name.empty() ? std::string("pattern") : s.name) + "  \u00b7  " +
                                    format_frequency(s.frequencies[o.frequency_index].frequency_hz);
    dl->AddText(fonts.title, fonts.title->FontSize, ImVec2(16 * scale, 12 * scale), ink, title.c_str());
    const Peak pk = find_peak(s, o.frequency_index, o.component);
    const std::string caption = exports::radius_caption(short_label(o.component), pk.value > 0 ? std::optional(to_db(pk.value)) : std::nullopt,
                                                        mesh.unit, o.range_db);
    dl->AddText(fonts.small, fonts.small->FontSize, ImVec2(16 * scale, 12 * scale + fonts.title->FontSize * 1.35f), muted, caption.c_str());
    char line[256];
    std::snprintf(line, sizeof line, "view from azimuth %g\u00b0, elevation %g\u00b0", o.view_azimuth_deg, o.view_elevation_deg);
    dl->AddText(fonts.small, fonts.small->FontSize, ImVec2(16 * scale, o.height - fonts.small->FontSize * 1.8f), muted, line);
    draw_axis_labels(dl, cam, ImVec2(0, 0), ImVec2(float(view_w), float(o.height)), 1.3, fonts.small);
    const ImVec2 bar_pos(view_w + 18 * scale, o.height * 0.22f), bar_size(20 * scale, o.height * 0.56f);
    draw_color_bar(dl, bar_pos, bar_size, mesh.bar, fonts.small, fonts.small, bar_strip - 28 * scale);
    // The key to the ellipses (when drawn) under the bar, the radial scale at the bottom left.
    float key_y = bar_pos.y + bar_size.y + 24 * scale;
    if (!mesh.unsampled.empty()) key_y += draw_unsampled_key(dl, ImVec2(bar_pos.x, key_y), fonts.small, ink) + 8 * scale;
    if (o.glyphs && s.has_phase()) draw_ellipse_key(dl, ImVec2(bar_pos.x, key_y), fonts.small, ink);
    draw_radial_scale(dl, cam, ImVec2(float(view_w), float(o.height)),
                      ImVec2(16 * scale, o.height - fonts.small->FontSize * 6.2f), mesh.peak_db, o.range_db, mesh.unit,
                      fonts.small, muted);
    if (is_identity(s.mounting) && is_identity(s.file_mounting)) return;
    const std::string mounting = "mounting: " + exports::mounting_text(s);
    dl->AddText(fonts.small, fonts.small->FontSize, ImVec2(16 * scale, 12 * scale + fonts.title->FontSize * 1.35f +
                                                                          fonts.small->FontSize * 1.3f),
                muted, mounting.c_str(), nullptr, float(view_w) - 32 * scale);
    const float gr = 20 * scale;
    draw_world_up(dl, cam, ImVec2(0, 0), ImVec2(float(view_w), float(o.height)), 1.3, fonts.small,
                  ImVec2(float(view_w) - gr - 70 * scale, 12 * scale + 2 * gr), gr);
}

}  // namespace

// What one image size and renderer choice keep from one snapshot to the next. Members are
// destroyed in reverse order, the context last, after everything that holds GL objects in it.
struct SnapshotRenderer::Gl {
    int width = 0, height = 0;
    bool software = false;
    std::unique_ptr<RenderContext> context;
    OffscreenTarget target;
    SceneRenderer scene;
    ImGuiContext* imgui = nullptr;
    UiFonts fonts;
    float scale = 1;
    ~Gl() {
        if (!imgui) return;
        context->make_current();
        ImGuiContextSwitch sw(imgui);
        if (sw.saved == imgui) sw.saved = nullptr;
        ImGui_ImplOpenGL3_Shutdown();
        ImGui::DestroyContext(imgui);
    }
};

SnapshotRenderer::SnapshotRenderer() = default;
SnapshotRenderer::~SnapshotRenderer() = default;

Status SnapshotRenderer::start(const SnapshotOptions& o) {
    if (gl_ && gl_->width == o.width && gl_->height == o.height && gl_->software == o.software) {
        gl_->context->make_current();
        return Ok{};
    }
    gl_.reset();
    auto gl = std::make_unique<Gl>();
    gl->width = o.width;
    gl->height = o.height;
    gl->software = o.software;
    ContextRequest req;
    req.software = o.software;
    req.width = o.width;
    req.height = o.height;
    auto ctx = create_headless_context(req);
    if (!ctx) return ctx.error();
    gl->context = std::move(*ctx);
    if (Status st = gl->target.create(o.width, o.height, 4); !st) return st.error();
    if (Status st = gl->scene.init(); !st) return st.error();
    // CreateContext makes the new context current when none is: the switch restores the caller's.
    ImGuiContextSwitch sw(nullptr);
    gl->imgui = ImGui::CreateContext();
    ImGui::SetCurrentContext(gl->imgui);
    ImGuiIO& io = ImGui::GetIO();
    io.IniFilename = nullptr;
    io.LogFilename = nullptr;
    gl->scale = std::clamp(o.height / 800.0f, 0.8f, 3.0f);
    gl->fonts = setup_ui_style(gl->scale);
    io.DisplaySize = ImVec2(float(o.width), float(o.height));
    io.DeltaTime = 1.0f / 60;
    if (!ImGui_ImplOpenGL3_Init("#version 330")) {
        ImGui::DestroyContext(gl->imgui);
        gl->imgui = nullptr;
        return Error{"", 0, 0, "cannot start the ImGui OpenGL renderer"};
    }
    gl_ = std::move(gl);
    return Ok{};
}

Result<std::vector<std::uint8_t>> SnapshotRenderer::render(const FarFieldSet& s, const SnapshotOptions& o) {
    if (o.width < 64 || o.height < 64 || o.width > 8192 || o.height > 8192)
        return Error{"", 0, 0, "image size must be between 64x64 and 8192x8192, found " + std::to_string(o.width) + "x" +
                                   std::to_string(o.height)};
    if (o.frequency_index >= s.frequencies.size()) return Error{s.source, 0, 0, "frequency index out of range"};
    SurfaceOptions so;
    so.component = o.component;
    so.color_by = o.color_by;
    so.range_db = o.range_db;
    so.gain_map = o.gain_map;
    auto mesh = build_surface(s, o.frequency_index, so, o.compare, o.compare_frequency_index);
    if (!mesh) return mesh.error();
    if (Status st = start(o); !st) return st.error();
    Gl& gl = *gl_;

    gl.scene.set_surface(*mesh);
    gl.scene.set_axes(build_axes(1.3));
    gl.scene.set_glyphs(o.glyphs && s.has_phase() ? build_glyphs(s, o.frequency_index, *mesh, GlyphOptions{}) : LineSet{});

    // Layout: the 3D view on the left, the colour bar in a strip on the right.
    const float bar_strip = std::max(150.0f, o.width * 0.16f);
    const int view_w = o.width - int(bar_strip);
    OrbitCamera cam;
    cam.azimuth_deg = o.view_azimuth_deg;
    cam.elevation_deg = std::clamp(o.view_elevation_deg, -89.5, 89.5);
    SceneStyle style;
    style.background = {1, 1, 1};
    style.cut_ring = false;
    gl.target.bind();
    glViewport(0, 0, o.width, o.height);
    glClearColor(1, 1, 1, 1);
    glClear(GL_COLOR_BUFFER_BIT | GL_DEPTH_BUFFER_BIT);
    gl.scene.draw(cam, 0, 0, view_w, o.height, style, true);

    // Annotations with ImGui draw lists.
    ImGuiContextSwitch sw(gl.imgui);
    ImGui_ImplOpenGL3_NewFrame();
    ImGui::NewFrame();
    draw_annotations(s, o, *mesh, cam, view_w, bar_strip, gl.scale, gl.fonts);
    ImGui::Render();
    gl.target.bind();
    glViewport(0, 0, o.width, o.height);
    ImGui_ImplOpenGL3_RenderDrawData(ImGui::GetDrawData());
    return gl.target.read_rgba();
}

std::mutex& snapshot_turn() {
    static std::mutex m;
    return m;
}

Result<std::vector<std::uint8_t>> render_snapshot_rgba(const FarFieldSet& s, const SnapshotOptions& o) {
    SnapshotRenderer r;
    return r.render(s, o);
}

Status render_snapshot_png(const FarFieldSet& s, const SnapshotOptions& o, const std::string& path, bool overwrite) {
    auto px = render_snapshot_rgba(s, o);
    if (!px) return px.error();
    auto png = exports::encode_png(px->data(), o.width, o.height, 4, std::size_t(o.width) * 4);
    if (!png) return png.error();
    return io::write_file_atomically(path, *png, overwrite);
}

}  // namespace ellipsa::viewer
