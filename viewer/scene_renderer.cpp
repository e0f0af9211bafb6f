#include "viewer/scene_renderer.hpp"

#include <glm/gtc/type_ptr.hpp>
#include <cstdlib>
#include <string>
#include <tuple>
#include <vector>

#include "viewer/embedded.hpp"
#include "viewer/gl.hpp"

namespace ellipsa::viewer {

namespace {
Result<unsigned> compile(GLenum type, const char* name) {
    const std::string_view src = embedded_file(name);
    if (src.empty()) return Error{name, 0, 0, "shader not embedded in the build"};
    const unsigned sh = glCreateShader(type);
    const char* p = src.data();
    const GLint len = GLint(src.size());
    glShaderSource(sh, 1, &p, &len);
    glCompileShader(sh);
    GLint ok = 0;
    glGetShaderiv(sh, GL_COMPILE_STATUS, &ok);
    if (!ok) {
        char log[2048] = {};
        glGetShaderInfoLog(sh, sizeof log, nullptr, log);
        glDeleteShader(sh);
        return Error{name, 0, 0, std::string("shader does not compile: ") + log};
    }
    return sh;
}

Result<unsigned> program(const char* vs_name, const char* fs_name) {
    auto vs = compile(GL_VERTEX_SHADER, vs_name);
    if (!vs) return vs.error();
    auto fs = compile(GL_FRAGMENT_SHADER, fs_name);
    if (!fs) return fs.error();
    const unsigned p = glCreateProgram();
    glAttachShader(p, *vs);
    glAttachShader(p, *fs);
    glLinkProgram(p);
    glDeleteShader(*vs);
    glDeleteShader(*fs);
    GLint ok = 0;
    glGetProgramiv(p, GL_LINK_STATUS, &ok);
    if (!ok) {
        char log[2048] = {};
        glGetProgramInfoLog(p, sizeof log, nullptr, log);
        glDeleteProgram(p);
        return Error{vs_name, 0, 0, std::string("shaders do not link: ") + log};
    }
    return p;
}
}  // namespace

SceneRenderer::~SceneRenderer() {
    for (unsigned b : {surface_vbo_, surface_ibo_, wire_ibo_, unsampled_vbo_, unsampled_ibo_, glyphs_.vbo, ring_.vbo, axes_.vbo, edge_.vbo})
        if (b) glDeleteBuffers(1, &b);
    for (unsigned a : {surface_vao_, wire_vao_, unsampled_vao_, glyphs_.vao, ring_.vao, axes_.vao, edge_.vao})
        if (a) glDeleteVertexArrays(1, &a);
    if (surface_program_) glDeleteProgram(surface_program_);
    if (line_program_) glDeleteProgram(line_program_);
}

Status SceneRenderer::init() {
    auto sp = program("surface.vert", "surface.frag");
    if (!sp) return sp.error();
    auto lp = program("lines.vert", "lines.frag");
    if (!lp) return lp.error();
    surface_program_ = *sp;
    line_program_ = *lp;
    s_view_ = glGetUniformLocation(surface_program_, "u_view");
    s_proj_ = glGetUniformLocation(surface_program_, "u_projection");
    s_alpha_ = glGetUniformLocation(surface_program_, "u_alpha");
    s_hatch_ = glGetUniformLocation(surface_program_, "u_hatch");
    l_view_ = glGetUniformLocation(line_program_, "u_view");
    l_proj_ = glGetUniformLocation(line_program_, "u_projection");
    l_tint_ = glGetUniformLocation(line_program_, "u_tint");
    l_cull_ = glGetUniformLocation(line_program_, "u_cull");

    glGenVertexArrays(1, &surface_vao_);
    glGenVertexArrays(1, &wire_vao_);
    glGenVertexArrays(1, &unsampled_vao_);
    glGenBuffers(1, &surface_vbo_);
    glGenBuffers(1, &surface_ibo_);
    glGenBuffers(1, &wire_ibo_);
    glGenBuffers(1, &unsampled_vbo_);
    glGenBuffers(1, &unsampled_ibo_);
    const GLsizei stride = surface_floats_per_vertex * sizeof(float);
    for (auto [vao, vbo, ibo] : {std::tuple{surface_vao_, surface_vbo_, surface_ibo_}, std::tuple{unsampled_vao_, unsampled_vbo_, unsampled_ibo_}}) {
        glBindVertexArray(vao);
        glBindBuffer(GL_ARRAY_BUFFER, vbo);
        glBindBuffer(GL_ELEMENT_ARRAY_BUFFER, ibo);
        for (int a = 0; a < 3; ++a) {
            glEnableVertexAttribArray(a);
            glVertexAttribPointer(a, 3, GL_FLOAT, GL_FALSE, stride, reinterpret_cast<void*>(std::size_t(a) * 3 * sizeof(float)));
        }
    }
    glBindVertexArray(wire_vao_);
    glBindBuffer(GL_ARRAY_BUFFER, surface_vbo_);
    glBindBuffer(GL_ELEMENT_ARRAY_BUFFER, wire_ibo_);
    glEnableVertexAttribArray(0);
    glVertexAttribPointer(0, 3, GL_FLOAT, GL_FALSE, stride, nullptr);
    glEnableVertexAttribArray(1);
    glVertexAttribPointer(1, 3, GL_FLOAT, GL_FALSE, stride, reinterpret_cast<void*>(6 * sizeof(float)));
    glBindVertexArray(0);
    for (Lines* l : {&glyphs_, &ring_, &axes_, &edge_}) {
        glGenVertexArrays(1, &l->vao);
        glGenBuffers(1, &l->vbo);
        glBindVertexArray(l->vao);
        glBindBuffer(GL_ARRAY_BUFFER, l->vbo);
        glEnableVertexAttribArray(0);
        glVertexAttribPointer(0, 3, GL_FLOAT, GL_FALSE, 6 * sizeof(float), nullptr);
        glEnableVertexAttribArray(1);
        glVertexAttribPointer(1, 3, GL_FLOAT, GL_FALSE, 6 * sizeof(float), reinterpret_cast<void*>(3 * sizeof(float)));
    }
    glBindVertexArray(0);
    return Ok{};
}

void SceneRenderer::set_surface(const SurfaceMesh& m) {
    glBindVertexArray(0);
    glBindBuffer(GL_ARRAY_BUFFER, surface_vbo_);
    glBufferData(GL_ARRAY_BUFFER, GLsizeiptr(m.vertices.size() * sizeof(float)), m.vertices.data(), GL_STATIC_DRAW);
    surface_index_count_ = int(m.triangles.size());
    wire_index_count_ = int(m.wire_lines.size());
    grid_step_deg_ = m.grid_step_deg;
    upload_unsampled(m.unsampled);
    // A component or frequency change keeps the index lists (about 30 MB at 0.25 degree).
    if (uploaded_topology_ && *uploaded_topology_ == m.topology) return;
    uploaded_topology_ = m.topology;
    glBindBuffer(GL_ELEMENT_ARRAY_BUFFER, surface_ibo_);
    const std::vector<std::uint32_t>* levels[3] = {&m.triangles, &m.triangles_stride2, &m.triangles_stride4};
    std::size_t total = 0;
    for (int k = 0; k < 3; ++k) {
        lod_offset_[k] = total * sizeof(std::uint32_t);
        lod_count_[k] = int(levels[k]->size());
        total += levels[k]->size();
    }
    glBufferData(GL_ELEMENT_ARRAY_BUFFER, GLsizeiptr(total * sizeof(std::uint32_t)), nullptr, GL_STATIC_DRAW);
    for (int k = 0; k < 3; ++k)
        if (lod_count_[k])
            glBufferSubData(GL_ELEMENT_ARRAY_BUFFER, GLintptr(lod_offset_[k]), GLsizeiptr(levels[k]->size() * sizeof(std::uint32_t)),
                            levels[k]->data());
    glBindBuffer(GL_ELEMENT_ARRAY_BUFFER, wire_ibo_);
    glBufferData(GL_ELEMENT_ARRAY_BUFFER, GLsizeiptr(m.wire_lines.size() * sizeof(std::uint32_t)), m.wire_lines.data(),
                 GL_STATIC_DRAW);
    glBindBuffer(GL_ELEMENT_ARRAY_BUFFER, 0);
}

void SceneRenderer::upload_unsampled(const UnsampledRegion& r) {
    glBindVertexArray(0);
    glBindBuffer(GL_ARRAY_BUFFER, unsampled_vbo_);
    glBufferData(GL_ARRAY_BUFFER, GLsizeiptr(r.vertices.size() * sizeof(float)), r.vertices.data(), GL_DYNAMIC_DRAW);
    glBindBuffer(GL_ELEMENT_ARRAY_BUFFER, unsampled_ibo_);
    glBufferData(GL_ELEMENT_ARRAY_BUFFER, GLsizeiptr(r.triangles.size() * sizeof(std::uint32_t)), r.triangles.data(), GL_DYNAMIC_DRAW);
    glBindBuffer(GL_ELEMENT_ARRAY_BUFFER, 0);
    unsampled_index_count_ = int(r.triangles.size());
    upload_lines(edge_, r.outline);
}

void SceneRenderer::clear_surface() {
    surface_index_count_ = wire_index_count_ = unsampled_index_count_ = 0;
    glyphs_.count = ring_.count = edge_.count = 0;
}

void SceneRenderer::upload_lines(Lines& l, const LineSet& set) { upload_lines(l, set.vertices); }

void SceneRenderer::upload_lines(Lines& l, const std::vector<float>& vertices) {
    glBindVertexArray(0);
    glBindBuffer(GL_ARRAY_BUFFER, l.vbo);
    glBufferData(GL_ARRAY_BUFFER, GLsizeiptr(vertices.size() * sizeof(float)), vertices.data(), GL_DYNAMIC_DRAW);
    l.count = int(vertices.size() / 6);
}

// The "not measured" region: hatched neutral grey, both sides lit (its wall faces either way), as
// opaque or translucent as the surface; the surface program's matrices are already set.
void SceneRenderer::draw_unsampled(int h) {
    if (!unsampled_index_count_) return;
    glDisable(GL_CULL_FACE);
    glUniform1f(s_hatch_, std::max(7.0f, float(h) / 75.0f));
    glBindVertexArray(unsampled_vao_);
    glDrawElements(GL_TRIANGLES, unsampled_index_count_, GL_UNSIGNED_INT, nullptr);
    glUniform1f(s_hatch_, 0.0f);
}

void SceneRenderer::draw_lines(const Lines& l, float width) {
    if (!l.count) return;
    glLineWidth(width);
    glBindVertexArray(l.vao);
    glDrawArrays(GL_LINES, 0, l.count);
}

// The surface (opaque or translucent, at the level of detail its size on screen needs), its
// wireframe, the glyphs and the cut ring. The line program's matrices are already set.
void SceneRenderer::draw_surface(const OrbitCamera& cam, int h, const glm::mat4& proj, const SceneStyle& st) {
    glUseProgram(surface_program_);
    glUniformMatrix4fv(s_view_, 1, GL_FALSE, glm::value_ptr(cam.view()));
    glUniformMatrix4fv(s_proj_, 1, GL_FALSE, glm::value_ptr(proj));
    glEnable(GL_POLYGON_OFFSET_FILL);
    glPolygonOffset(1.0f, 1.0f);
    // The surface is star-shaped about the origin with outward (counter-clockwise) triangles and
    // the eye stays outside it, so the first surface met by any view ray faces the eye: back faces
    // can be culled when the surface is opaque (this halves llvmpipe's rasterising work).
    if (!st.translucent) glEnable(GL_CULL_FACE);
    if (st.translucent) {
        glEnable(GL_BLEND);
        glBlendFunc(GL_SRC_ALPHA, GL_ONE_MINUS_SRC_ALPHA);
        glDepthMask(GL_FALSE);
        glUniform1f(s_alpha_, 0.45f);
    } else {
        glUniform1f(s_alpha_, 1.0f);
    }
    glBindVertexArray(surface_vao_);
    // Level of detail: skip grid lines whose cells would be under a few pixels wide.
    int level = 0;
    const int stride = st.full_detail ? 1 : lod_stride(grid_step_deg_, h, cam.fov_deg, cam.distance, 3.0);
    if (stride >= 4 && lod_count_[2]) level = 2;
    else if (stride >= 2 && lod_count_[1]) level = 1;
    last_stride_ = 1 << level;
    glDrawElements(GL_TRIANGLES, lod_count_[level], GL_UNSIGNED_INT, reinterpret_cast<void*>(lod_offset_[level]));
    draw_unsampled(h);
    glDepthMask(GL_TRUE);
    glDisable(GL_CULL_FACE);
    glDisable(GL_POLYGON_OFFSET_FILL);
    glUseProgram(line_program_);
    if (st.wireframe && wire_index_count_) {
        glEnable(GL_BLEND);
        glBlendFunc(GL_SRC_ALPHA, GL_ONE_MINUS_SRC_ALPHA);
        glUniform4f(l_tint_, 0.15f, 0.15f, 0.18f, 0.35f);
        glLineWidth(1.0f);
        glBindVertexArray(wire_vao_);
        glDrawElements(GL_LINES, wire_index_count_, GL_UNSIGNED_INT, nullptr);
        glUniform4f(l_tint_, 0, 0, 0, 0);
    }
    glDisable(GL_BLEND);
    // Through a translucent surface the glyphs of the far side are clutter: hide those whose
    // radial direction faces away from the eye (the near side's stay).
    const glm::vec3 eye = cam.eye();
    glUniform4f(l_cull_, eye.x, eye.y, eye.z, st.translucent ? 1.0f : 0.0f);
    if (st.glyphs) draw_lines(glyphs_, 1.6f);
    glUniform4f(l_cull_, 0, 0, 0, 0);
    if (st.cut_ring) draw_lines(ring_, 2.5f);
    draw_lines(edge_, 1.5f);
}

void SceneRenderer::draw(const OrbitCamera& cam, int x, int y, int w, int h, const SceneStyle& st, bool clear) {
    if (w <= 0 || h <= 0) return;
    const glm::mat4 view = cam.view(), proj = cam.projection(double(w) / h);
    glViewport(x, y, w, h);
    glEnable(GL_SCISSOR_TEST);
    glScissor(x, y, w, h);
    if (clear) {
        glClearColor(st.background.r, st.background.g, st.background.b, 1);
        glClear(GL_COLOR_BUFFER_BIT | GL_DEPTH_BUFFER_BIT);
    } else {
        glClear(GL_DEPTH_BUFFER_BIT);
    }
    glEnable(GL_DEPTH_TEST);
    glDepthFunc(GL_LEQUAL);
    glDisable(GL_CULL_FACE);
    glDisable(GL_BLEND);

    glUseProgram(line_program_);
    glUniformMatrix4fv(l_view_, 1, GL_FALSE, glm::value_ptr(view));
    glUniformMatrix4fv(l_proj_, 1, GL_FALSE, glm::value_ptr(proj));
    glUniform4f(l_tint_, 0, 0, 0, 0);
    if (st.axes) draw_lines(axes_, 2.0f);

    if (surface_index_count_) draw_surface(cam, h, proj, st);
    glBindVertexArray(0);
    glUseProgram(0);
    glDisable(GL_DEPTH_TEST);
    glDisable(GL_SCISSOR_TEST);
}

// --- Offscreen target ------------------------------------------------------------------------
OffscreenTarget::~OffscreenTarget() {
    for (unsigned f : {fbo_, resolve_fbo_})
        if (f) glDeleteFramebuffers(1, &f);
    for (unsigned r : {color_, depth_, resolve_color_})
        if (r) glDeleteRenderbuffers(1, &r);
}

Status OffscreenTarget::create(int w, int h, int samples) {
    GLint max_size = 0;
    glGetIntegerv(GL_MAX_RENDERBUFFER_SIZE, &max_size);
    if (w <= 0 || h <= 0 || w > max_size || h > max_size)
        return Error{"", 0, 0, "image size " + std::to_string(w) + "x" + std::to_string(h) + " is outside 1.." + std::to_string(max_size)};
    GLint max_samples = 1;
    glGetIntegerv(GL_MAX_SAMPLES, &max_samples);
    w_ = w, h_ = h, samples_ = std::max(1, std::min(samples, int(max_samples)));
    glGenFramebuffers(1, &fbo_);
    glGenRenderbuffers(1, &color_);
    glGenRenderbuffers(1, &depth_);
    glBindRenderbuffer(GL_RENDERBUFFER, color_);
    glRenderbufferStorageMultisample(GL_RENDERBUFFER, samples_ > 1 ? samples_ : 0, GL_RGBA8, w, h);
    glBindRenderbuffer(GL_RENDERBUFFER, depth_);
    glRenderbufferStorageMultisample(GL_RENDERBUFFER, samples_ > 1 ? samples_ : 0, GL_DEPTH24_STENCIL8, w, h);
    glBindFramebuffer(GL_FRAMEBUFFER, fbo_);
    glFramebufferRenderbuffer(GL_FRAMEBUFFER, GL_COLOR_ATTACHMENT0, GL_RENDERBUFFER, color_);
    glFramebufferRenderbuffer(GL_FRAMEBUFFER, GL_DEPTH_STENCIL_ATTACHMENT, GL_RENDERBUFFER, depth_);
    if (glCheckFramebufferStatus(GL_FRAMEBUFFER) != GL_FRAMEBUFFER_COMPLETE)
        return Error{"", 0, 0, "the offscreen framebuffer is incomplete"};
    if (samples_ > 1) {
        glGenFramebuffers(1, &resolve_fbo_);
        glGenRenderbuffers(1, &resolve_color_);
        glBindRenderbuffer(GL_RENDERBUFFER, resolve_color_);
        glRenderbufferStorage(GL_RENDERBUFFER, GL_RGBA8, w, h);
        glBindFramebuffer(GL_FRAMEBUFFER, resolve_fbo_);
        glFramebufferRenderbuffer(GL_FRAMEBUFFER, GL_COLOR_ATTACHMENT0, GL_RENDERBUFFER, resolve_color_);
        if (glCheckFramebufferStatus(GL_FRAMEBUFFER) != GL_FRAMEBUFFER_COMPLETE)
            return Error{"", 0, 0, "the resolve framebuffer is incomplete"};
    }
    glBindFramebuffer(GL_FRAMEBUFFER, fbo_);
    return Ok{};
}

void OffscreenTarget::bind() const { glBindFramebuffer(GL_FRAMEBUFFER, fbo_); }

std::vector<std::uint8_t> OffscreenTarget::read_rgba() const {
    std::vector<std::uint8_t> px(std::size_t(w_) * h_ * 4);
    unsigned src = fbo_;
    if (samples_ > 1) {
        glBindFramebuffer(GL_READ_FRAMEBUFFER, fbo_);
        glBindFramebuffer(GL_DRAW_FRAMEBUFFER, resolve_fbo_);
        glBlitFramebuffer(0, 0, w_, h_, 0, 0, w_, h_, GL_COLOR_BUFFER_BIT, GL_NEAREST);
        src = resolve_fbo_;
    }
    glBindFramebuffer(GL_READ_FRAMEBUFFER, src);
    glPixelStorei(GL_PACK_ALIGNMENT, 1);
    glReadPixels(0, 0, w_, h_, GL_RGBA, GL_UNSIGNED_BYTE, px.data());
    // GL rows start at the bottom; images start at the top.
    const std::size_t row = std::size_t(w_) * 4;
    std::vector<std::uint8_t> tmp(row);
    for (int y = 0; y < h_ / 2; ++y) {
        std::uint8_t* a = px.data() + std::size_t(y) * row;
        std::uint8_t* b = px.data() + std::size_t(h_ - 1 - y) * row;
        std::copy(a, a + row, tmp.data());
        std::copy(b, b + row, a);
        std::copy(tmp.data(), tmp.data() + row, b);
    }
    glBindFramebuffer(GL_FRAMEBUFFER, fbo_);
    return px;
}

}  // namespace ellipsa::viewer
