// What a scripted run (`view --frames N`) does, in one place: hold the pointer where --cursor
// says, stop after N frames, and write what the last frame shows (--export-cut, --screenshot,
// --export-view). Files are replaced only with --force, like every other command.
// For benchmarks, ELLIPSA_BENCH_STEP_FREQUENCY=1 shows the next frequency on every frame of a
// scripted run (as if the frequency slider were dragged through a sweep without pause).
#pragma once
#include "viewer/app.hpp"
#include "viewer/state/app_state.hpp"
#include "viewer/state/derived.hpp"
#include "viewer/state/intents.hpp"
#include "viewer/window.hpp"

namespace ellipsa::viewer {

class ScriptedRun {
public:
    explicit ScriptedRun(const ViewerOptions& o);
    // Before each frame's events: the pointer at --cursor (the window may only now be mapped).
    void place_pointer(Window& w) const;
    bool is_last(int frame) const { return o_.frames > 0 && frame + 1 >= o_.frames; }
    // This frame's scripted intents (none unless a benchmark asks for them).
    Intents frame_intents(const AppState& s) const;
    // After the last frame is drawn, before it is shown (the screenshot reads the back buffer).
    // Problems go to stderr; returns the exit code (0, or 1 when a file was not written).
    int finish(const AppState& s, const Derived& d, Window& w) const;

private:
    const ViewerOptions& o_;
    bool step_frequency_ = false;
};

}  // namespace ellipsa::viewer
