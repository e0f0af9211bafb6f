// The diversity panel: pick a multipath environment, see the incoming-power profile over
// elevation, the mean effective gain and polarisation balance of the shown patterns (A, and B
// when comparing), their envelope correlation and diversity gain, and the orientation curve.
// The figures come from viewer/scene/diversity_view.hpp; this file only draws and edits the choice.
#pragma once
#include "viewer/app_state.hpp"
#include "viewer/scene/diversity_view.hpp"

namespace ellipsa::viewer {

// The panel's own state, owned by the window loop beside AppState.
struct DiversityPanelState {
    bool open = false;
    DiversityChoice choice;
    // Cache: the figures and what they were computed for.
    DiversityFigures figures;
    DiversityChoice computed_for;
    int generation = -1, active = -1, compare = -1;
    std::size_t freq = 0;
    bool computed = false, sweep_pending = false;
    double compute_ms = 0;
};

// A floating window (closable; `open` follows its close button). Recomputes only when the
// patterns, the frequency or the choice change; while a slider is being dragged the orientation
// sweep waits for the release.
void draw_diversity_panel(const AppState& s, DiversityPanelState& d);

}  // namespace ellipsa::viewer
