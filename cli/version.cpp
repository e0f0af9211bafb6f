#include "cli/version.hpp"

#ifdef ELLIPSA_HAVE_VIEWER
#include "viewer/renderer_probe.hpp"
#endif

namespace ellipsa::cli {

std::string version_text() {
    std::string s = "ellipsa " ELLIPSA_VERSION "\n";  // project(VERSION) in CMakeLists.txt
#ifdef ELLIPSA_HAVE_VIEWER
    s += "OpenGL: " + viewer::probe_renderer_line() + "\n";
#else
    s += "OpenGL: viewer not built\n";
#endif
    return s;
}

}  // namespace ellipsa::cli
