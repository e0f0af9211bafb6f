#include "cli/version.hpp"

#ifdef ELLIPSA_HAVE_VIEWER
#include "viewer/renderer_probe.hpp"
#endif

namespace ellipsa::cli {

std::string version_line() {
    return "ellipsa " ELLIPSA_VERSION;  // project(VERSION) in CMakeLists.txt
}

std::string version_text() {
    std::string s = version_line() + "\n";
#ifdef ELLIPSA_HAVE_VIEWER
    s += "OpenGL: " + viewer::probe_renderer_line() + "\n";
#else
    s += "OpenGL: viewer not built\n";
#endif
    return s;
}

}  // namespace ellipsa::cli
