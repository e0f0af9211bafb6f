// Headless snapshots one after another in one process (a Python session writing several views,
// the viewer exporting twice): each makes and drops its own ImGui context, and must leave the
// caller's current context as it found it. A dropped context left current was written to by
// ImGui's next allocation after it was freed (valgrind: "invalid read ... ImGui::MemAlloc"),
// which corrupted the heap; llvmpipe then crashed in eglDestroyContext in about one Python
// session in four (tests/python/test_view.py). ImGui 1.86 (imgui.cpp): CreateContext makes the
// new context current when none is; DestroyContext clears the current one only if it is that one.
#include <catch2/catch.hpp>

#include <imgui.h>

#include "pattern/reference.hpp"
#include "viewer/snapshot.hpp"

using namespace ellipsa;
using namespace ellipsa::viewer;

namespace {
FarFieldSet crossed_dipoles() {
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    return synthesize(a, 10, 2.45e9);
}
}  // namespace

TEST_CASE("snapshots leave the caller's ImGui context current and draw the same pixels each time") {
    const FarFieldSet s = crossed_dipoles();
    SnapshotOptions o;
    o.width = 96, o.height = 72;
    for (ImGuiContext* caller : {static_cast<ImGuiContext*>(nullptr), ImGui::CreateContext()}) {
        ImGui::SetCurrentContext(caller);
        auto first = render_snapshot_rgba(s, o);
        if (!first) {  // no EGL here at all: nothing to check
            WARN("no headless GL context: " << first.error().message);
            if (caller) ImGui::DestroyContext(caller);
            return;
        }
        CHECK(ImGui::GetCurrentContext() == caller);
        {
            SnapshotRenderer kept;  // a renderer that keeps its context between views (a report's)
            for (int k = 0; k < 4; ++k) {
                auto again = k % 2 ? kept.render(s, o) : render_snapshot_rgba(s, o);
                REQUIRE(again);
                CHECK(*again == *first);
                CHECK(ImGui::GetCurrentContext() == caller);
            }
        }
        CHECK(ImGui::GetCurrentContext() == caller);  // after the kept renderer is dropped too
        if (caller) ImGui::DestroyContext(caller);
    }
}
