// Intents: every change to the viewer's state, as plain values. Panels, keys, the mouse, the
// file loader and finished exports return them; apply() (viewer/state/apply.hpp) carries them
// out in order. Adding one: a struct here, its name in the Intent variant, a handler in
// apply.cpp and a unit test in tests/unit/test_viewer_apply.cpp.
#pragma once
#include <cstddef>
#include <optional>
#include <string>
#include <variant>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/result.hpp"
#include "viewer/state/app_state.hpp"

namespace ellipsa::viewer {
namespace intent {

// --- Patterns and files ---
struct OpenFiles {  // read these files (in the background, one after the other)
    std::vector<std::string> paths;
    std::string map;      // column-map file for them; "" looks beside each file
    bool recent = false;  // the paths are recent-list entries (recent_entry(), scene/settings.hpp)
};
struct CancelLoad {};
struct OpenFileDialog {};  // File > Open: the desktop's dialog when there is one, else the in-window browser
struct ShowBrowser {       // open, change or (nullopt) close the in-window browser
    std::optional<BrowserView> view;
};
struct DesktopDialogClosed {};  // the desktop dialog ended (its choice comes as OpenFiles)
struct LoadStatus {  // from the loader: what is being read now (none: nothing)
    std::optional<LoadingView> now;
};
struct LoadFinished {  // from the loader: a read ended
    std::string path, absolute_path;
    Result<FarFieldSet> result;  // as read; apply() installs it with `install`
    InstallRequest install{};    // the command line's mounting for this file (none from the UI)
    std::vector<std::string> join{};  // the files joined to `path` (FILE::join=OTHER), as given
};
struct AddPatterns {  // built-in or example patterns (no file to remember)
    std::vector<FarFieldSet> sets;
    std::string note;
};
struct ClosePattern { int index = -1; };
struct SelectPattern { int index = 0; };  // becomes A
struct NextPattern {};                    // Tab
struct SetCompare { int index = -1; };    // B; -1 none
struct SetFrequency { std::size_t index = 0; };
struct StepFrequency { int delta = 1; };
struct EditPath { std::string text; };
struct EditMap { std::string text; };
struct DismissLoadError {};
// A new mounting for pattern `index` (pattern/mounting.hpp): `up` replaces the file's own (none:
// the file's own mounting), `turns` follow it, about the world axes, left to right. The phase
// reference stays as asked when the pattern was opened.
struct SetMounting {
    int index = 0;
    std::optional<Vec3> up;
    std::vector<AxisTurn> turns;
};
struct EditTurns { std::string text; };  // the mounting control's turns field being typed
// Pattern `index` installed again with its phase reference moved (pattern/install.hpp, as
// --phase-centre / FILE::phase-centre= do): to the file's origin (keep), the estimated phase
// centre, or a point in metres (world frame). The mounting stays.
struct SetPhaseReference {
    int index = 0;
    PhaseReference reference = PhaseReference::keep;
    Vec3 point_m{};
};
struct EditReferencePoint { Vec3 point_m{}; };  // the phase-reference fields being typed (metres)
// The up axes the mounting control offers (parse_up's text forms).
inline constexpr const char* mounting_up_presets[] = {"+z", "-z", "+x", "-x", "+y", "-y"};

// --- What is shown ---
// Any edit of the persistent settings: the panel edits a copy and returns it whole (one widget
// is active per frame; the key handler folds its toggles into one copy). apply() then makes
// the choices ones the patterns can give.
struct ChangeSettings { ViewerSettings settings; };
struct StepComponent { int delta = 1; };  // next (or previous) component the data can give
struct StepColorBy {};                    // next colouring the data can give

// --- The 3D view ---
struct Orbit { double dx_px = 0, dy_px = 0; };
struct Zoom { double steps = 0; };
struct LookFrom { OrbitCamera::Preset preset = OrbitCamera::Preset::px; };
struct SetView { double azimuth_deg = 0, elevation_deg = 0; };
struct ResetView {};
// The direction under the cursor; none with not_measured: the cursor is over the "not measured"
// region of a partly sampled pattern (no data there, nothing to probe or pin).
struct Hover {
    std::optional<Direction> at;
    bool not_measured = false;
};
struct Pin { Direction at; };
struct Unpin {};
struct Escape {};  // closes the help if it is open, else unpins

// --- Windows ---
struct ShowHelp { bool on = true; };
struct ShowIntro { bool on = true; };
struct DismissIntro {};  // "Got it": hidden and remembered
struct ShowDiversity { bool on = true; };
struct ChangeDiversity { DiversityChoice choice; };
struct ShowBand { bool on = true; };            // figures against frequency
struct ShowFading { bool on = true; };          // fading curves in the diversity environment
struct SetBandQuantity { int index = 0; };      // which figure the band panel plots
struct ShowMap { bool on = true; };             // the 2D map beside the 3D view
struct SetMapProjection { int index = 0; };     // 0 Hammer, 1 theta/phi, 2 azimuth/elevation
struct SelectTab { Tab tab = Tab::cut; };       // bring a tab to the front (opens a closed tool)

// --- Exports and leaving ---
struct SetCutExportFormat { int index = 0; };
struct ExportView { std::string path; bool overwrite = false; };
struct ExportCut { std::string path; bool overwrite = false; };
struct ExportFinished { ExportTarget target = ExportTarget::view; ExportOutcome outcome; };
struct DismissExport { ExportTarget target = ExportTarget::view; };
struct Quit {};

}  // namespace intent

using Intent = std::variant<
    intent::OpenFiles, intent::CancelLoad, intent::LoadStatus, intent::LoadFinished, intent::AddPatterns,
    intent::ClosePattern, intent::SelectPattern, intent::NextPattern, intent::SetCompare, intent::SetFrequency,
    intent::StepFrequency, intent::EditPath, intent::EditMap, intent::DismissLoadError, intent::SetMounting, intent::EditTurns, intent::SetPhaseReference, intent::EditReferencePoint, intent::ChangeSettings,
    intent::StepComponent, intent::StepColorBy, intent::Orbit, intent::Zoom, intent::LookFrom, intent::SetView,
    intent::ResetView, intent::Hover, intent::Pin, intent::Unpin, intent::Escape, intent::ShowHelp, intent::ShowIntro,
    intent::DismissIntro, intent::ShowDiversity, intent::ChangeDiversity, intent::ShowBand, intent::ShowFading, intent::SetBandQuantity, intent::SelectTab, intent::ShowMap, intent::SetMapProjection, intent::SetCutExportFormat,
    intent::ExportView, intent::ExportCut, intent::ExportFinished, intent::DismissExport, intent::Quit,
    intent::OpenFileDialog, intent::ShowBrowser, intent::DesktopDialogClosed>;

using Intents = std::vector<Intent>;

// Append b's intents to a, keeping their order.
inline void append(Intents& a, Intents&& b) {
    for (Intent& i : b) a.push_back(std::move(i));
}

}  // namespace ellipsa::viewer
