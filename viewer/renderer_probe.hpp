// One line naming the OpenGL renderer the viewer would use and how it was chosen, for
// `ellipsa --version`. It makes a headless EGL context (no display needed), asks GL_RENDERER,
// and drops the context; it never opens a window, so it cannot hang waiting for a display.
#pragma once
#include <string>

namespace ellipsa::viewer {
std::string probe_renderer_line();
}  // namespace ellipsa::viewer
