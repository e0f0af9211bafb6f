// The interactive viewer: one GLFW window with the 3D view, the cut plot and the side panels.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "importers/far_field_csv.hpp"
#include "pattern/install.hpp"
#include "viewer/file_loader.hpp"

namespace ellipsa::viewer {

struct ViewerOptions {
    std::vector<std::string> files;  // empty: the bundled example (or the built-in demo)
    // The reader options of each file, made by the command line (cli/load.hpp); a file without
    // an entry here is read as File > Open reads it (a map file beside it when one names it).
    std::vector<CsvReadOptions> file_options;
    // The mounting of each file (--up, --rotate, --phase-centre or FILE::up=..., pattern/install.hpp);
    // a file without an entry is installed with its own mounting.
    std::vector<InstallRequest> file_installs;
    // The files joined to each file (FILE::join=OTHER): read with its options and merged.
    std::vector<std::vector<std::string>> file_joins;
    // How a file named in the window is read (viewer/file_loader.hpp); unset: the file alone.
    PrepareFile prepare;
    bool software = false;
    int width = 0, height = 0;       // 0: from the saved settings (default 1280 x 800)
    int frames = 0;                  // > 0: run this many frames and exit
    std::string screenshot;          // with frames: write the last frame as PNG
    bool frame_stats = false;        // print one JSON line of frame times (vsync off)
    bool save_settings = true;       // false for scripted runs (--frames)
    // Optional starting state (for scripted screenshots); unset values come from the settings.
    std::string component, color_by;  // names as in `ellipsa render`
    bool has_pin = false;
    double pin_theta_deg = 0, pin_phi_deg = 0;
    bool has_view = false;
    double view_azimuth_deg = 0, view_elevation_deg = 0;
    int compare = -1;                 // index of the B pattern among the files
    bool wireframe = false, translucent = false;
    int cut_style = -1;               // 0 polar, 1 rectangular, 2 phase (rectangular), -1 from the settings
    std::optional<unsigned> cut_components;  // bit per Component; none: from the settings
    bool has_cursor = false;          // place the pointer at (cursor_x, cursor_y) window pixels each frame
    double cursor_x = 0, cursor_y = 0;
    std::string export_view;          // with frames: export the 3D view of the last frame (headless snapshot)
    std::string export_cut;           // with frames: write the cut shown in the last frame (.svg/.png/.pdf/.csv)
    bool diversity_panel = false;     // start with the diversity panel open
    bool band_panel = false;          // start with the figures-against-frequency panel open
    bool force = false;               // the files above may replace existing ones
    std::optional<double> frequency_hz;  // start at this frequency of the first file (within 0.5 %)
    std::string tab;                  // start with this tab in front (tab_names), "" as before
    std::string browse;               // start with the in-window file browser open in this folder ("" closed)
};

// Runs until the window closes (or `frames` frames). Returns a process exit code (0 ok,
// 1 when no window could be made, a file given to a scripted run (frames > 0) could not be
// read, or the screenshot could not be written).
int run_viewer(const ViewerOptions& o);

}  // namespace ellipsa::viewer
