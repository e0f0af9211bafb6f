// Everything the viewer window knows, in one value: the loaded patterns, what is shown, the
// camera, the hovered and pinned directions, the persistent settings and what the panels show
// besides (text being typed, messages, open windows). Pure data: no GL, no ImGui, no threads.
//
// One channel changes it: panels and the loop read a const AppState and return intents
// (viewer/state/intents.hpp); apply() (viewer/state/apply.hpp) is the only code that writes it.
// Whatever is computed from it (surface, cut, probe, ...) lives in Derived
// (viewer/state/derived.hpp), rebuilt when its inputs change.
#pragma once
#include <cstddef>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/install.hpp"
#include "viewer/scene/camera.hpp"
#include "viewer/scene/diversity_view.hpp"
#include "viewer/scene/settings.hpp"

namespace ellipsa::viewer {

struct LoadedPattern {
    FarFieldSet set;   // installed (pattern/install.hpp): every figure and view uses this one
    std::string path;  // empty for built-in patterns
    std::vector<std::string> join;  // the files joined to `path` (FILE::join=OTHER), as given
    int id = 0;        // unique in the window's life; derived data is keyed on it, not on the list position
    // Changes (with a value unique in the window's life) when only the phase reference moves: the
    // magnitudes and the polarisation stay, so only what reads the absolute phase (the diversity
    // figures: ECC, and the fading curves from them) is keyed on it besides `id`.
    int reference_id = 0;
    // The mounting asked for (the command line's --up/--rotate/--phase-centre or FILE::up=...,
    // then the mounting control), and the pattern as read when `set` differs from it (a mounting
    // or a moved phase reference applied; null when `set` is the file's pattern as read). A new
    // mounting installs the pattern as read again (install_loaded, viewer/state/apply.hpp).
    InstallRequest install;
    std::shared_ptr<const FarFieldSet> as_read;
    // The name the Patterns list shows: a joined pattern's file names, "co.csv + cross.csv" (as
    // `info` names the files it read), else the set's name ("(unnamed)" when it has none).
    std::string list_name() const;
};

// A direction on the sphere, degrees.
struct Direction {
    double theta_deg = 0, phi_deg = 0;
    bool operator==(const Direction&) const = default;
};

// The file being read in the background, as the patterns panel shows it.
struct LoadingView {
    std::string path;
    double progress = 0;      // 0..1
    std::size_t waiting = 0;  // files queued behind it
};

// What became of an export (3D view or cut): the panel formats it, a scripted run turns it into
// an exit code. `exists` means nothing was written because the file is there: the panel offers
// to replace it.
struct ExportOutcome {
    enum class Status { written, exists, failed };
    Status status = Status::failed;
    std::string path;   // absolute when written; as asked otherwise
    std::string error;  // when failed
};
enum class ExportTarget { view, cut };

// The tabbed places of the window. The plot strip under the 3D view holds the cut and the docked
// tools (diversity, band, map), and in a narrow window the probe and the polarisation panel too; in a
// narrow window Patterns and Surface share the left column as tabs.
enum class Tab { patterns, surface, cut, probe, polarisation, diversity, band, map, fading };
inline constexpr const char* tab_names[] = {"patterns", "surface", "cut", "probe", "polarisation", "diversity", "band", "map", "fading"};
// The tab for a name of tab_names (as `view --tab` takes it); nullopt for any other name.
std::optional<Tab> parse_tab(const std::string& name);
// Patterns and Surface live in the left column; every other tab in the plot strip.
inline bool in_left_column(Tab t) { return t == Tab::patterns || t == Tab::surface; }

// The in-window file browser (File > Open when no desktop dialog is there): what it shows.
struct BrowserView {
    std::string folder;     // listed folder (the listing itself is derived: Derived::folder)
    std::string typed;      // type-to-filter text
    int selected = 0;       // index into the entries that match `typed`
    bool all_files = false;  // every file, not only .csv and .map
    bool hidden = false;     // names starting with '.'
    int reload = 0;          // bumped to list the folder again
    static BrowserView at(std::string folder) {
        BrowserView b;
        b.folder = std::move(folder);
        return b;
    }
    bool operator==(const BrowserView&) const = default;
};

struct AppState {
    std::vector<LoadedPattern> patterns;
    int next_pattern_id = 1;
    int active = 0;    // A (meaningless while there are no patterns)
    int compare = -1;  // B for the difference view and the overlaid cuts; -1 none
    std::size_t freq = 0;  // frequency index of A
    ViewerSettings settings;
    OrbitCamera camera;
    std::optional<Direction> hover, pinned;
    bool hover_not_measured = false;  // the cursor is over the "not measured" region (hover is empty)

    std::string path_input, map_input;  // the patterns panel's text fields
    std::optional<LoadingView> loading;
    std::string load_error;  // last failed load, shown until dismissed
    std::string mounting_error;  // why the last mounting asked for was not applied ("" none)
    // The mounting control's turns as typed, not yet applied (none: A's turns are shown).
    std::optional<std::string> turns_input;
    std::optional<Vec3> reference_input;  // the phase-reference point as typed, not yet applied (metres)
    std::string reference_error;          // why the last phase reference asked for was not applied
    std::string note;        // e.g. "built-in demo"
    bool show_help = false, show_intro = false;
    bool diversity_open = false;
    bool band_open = false;  // figures against frequency
    bool fading_open = false;  // fading curves of A, B and their combination (the diversity environment)
    Tab left_tab = Tab::patterns;  // shown in the left column when it holds tabs
    Tab strip_tab = Tab::cut;      // shown in the plot strip
    int band_quantity = 0;   // index into band_quantities (viewer/state/derived.hpp)
    bool map_open = false;   // the 2D map of the surface's colouring
    int map_projection = 0;  // MapProjection: 0 Hammer (equal-area), 1 theta/phi, 2 azimuth/elevation
    DiversityChoice diversity;
    int cut_export_format = 0;  // index into cut_export_formats
    std::optional<ExportOutcome> view_export, cut_export;
    std::optional<BrowserView> browser;  // the in-window file browser, while open
    bool desktop_dialog_open = false;    // a desktop file dialog (zenity, kdialog) is being shown
    bool quit = false;

    const LoadedPattern* active_pattern() const;
    const LoadedPattern* compare_pattern() const;  // none when B is unset or equals A
    // The frequency index to use for pattern p: A's own, or the one nearest to A's frequency.
    std::size_t freq_for(const LoadedPattern& p) const;
};

inline constexpr const char* cut_export_formats[] = {"svg", "png", "pdf", "csv"};

}  // namespace ellipsa::viewer
