// apply(): the one function that changes the viewer's state. Pure: no I/O, no GL, no clock.
// What needs the outside world (reading files, writing exports) comes back as Effects for the
// loop to carry out; their outcomes return as intents (LoadFinished, ExportFinished).
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "viewer/state/app_state.hpp"
#include "viewer/state/intents.hpp"

namespace ellipsa::viewer {

struct Effects {
    struct Load {
        std::string path, map;
        bool recent = false;  // `path` is a recent-list entry (split_recent_entry reads it)
    };
    std::vector<Load> load;  // files to read, in order
    bool cancel_load = false;
    std::optional<intent::ExportView> export_view;
    std::optional<intent::ExportCut> export_cut;
    std::optional<std::string> file_dialog;  // show the desktop's file dialog in this folder (the window falls back to its own)
};

// Install `as_read` with request `q` (pattern/install_pattern, the command line's function) into
// p.set, p.install and p.as_read; on an Error p is unchanged. Cost: a phase-centre estimate per
// frequency, and a rotation of the pattern when the mounting is not the identity.
Status install_loaded(LoadedPattern& p, FarFieldSet as_read, const InstallRequest& q);

// Carry out the intents in order. Afterwards the state is consistent whatever came in: A and B
// are valid indices (B never equals A), the frequency exists, and the shown component and
// colouring are ones the active pattern (and B) can give. Cost: small, except adding patterns
// (a move and install_loaded), closing one (a list erase) and a new mounting (install_loaded,
// once per change: the pattern gets a new id, so every derived view is rebuilt once).
Effects apply(AppState& s, Intents intents);

}  // namespace ellipsa::viewer
