// Derived data: everything the window shows that is computed from the state (surface mesh,
// glyphs, the cut and its ring on the surface, probe values, headline figures, Poincare cloud,
// diversity figures). Each part is a Keyed<inputs, value>: refresh() compares the inputs it
// needs with those of the last build and rebuilds only what changed, so nothing shown is stale
// and nothing is rebuilt for nothing. Pure code (no GL): the window uploads the geometry that
// refresh() reports as changed.
//
// Adding a part: a key struct of its inputs (with `operator== = default`), a Keyed member
// below, and one update line in refresh() (derived.cpp); a test in tests/unit/test_viewer_derived.cpp.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "pattern/summary.hpp"
#include "viewer/scene/cut_view.hpp"
#include "pattern/band.hpp"
#include "viewer/scene/diversity_view.hpp"
#include "viewer/scene/file_browser.hpp"
#include "viewer/scene/glyphs.hpp"
#include "viewer/scene/poincare.hpp"
#include "viewer/scene/probe.hpp"
#include "viewer/scene/surface_mesh.hpp"
#include "viewer/state/app_state.hpp"
#include "viewer/state/keyed.hpp"

namespace ellipsa::viewer {

// The inputs of each part. Patterns are named by id (0: none) and frequency index.
struct SurfaceKey {
    int a = 0;
    std::size_t fa = 0;
    Component component = Component::total;
    ColorBy color_by = ColorBy::component;
    double range_db = 0;
    ColorMap gain_map = ColorMap::viridis;
    int b = 0;  // only for the difference colouring
    std::size_t fb = 0;
    bool operator==(const SurfaceKey&) const = default;
};
struct GlyphKey {
    SurfaceKey surface;
    bool on = false;
    double spacing_deg = 0;
    bool operator==(const GlyphKey&) const = default;
};
struct CutKey {
    int a = 0, b = 0;
    std::size_t fa = 0, fb = 0;
    int kind = 0;
    double angle_deg = 0;            // kinds 0 and 1
    std::optional<Direction> pin;    // kind 2
    unsigned components = 0;
    bool operator==(const CutKey&) const = default;
};
struct RingKey {
    SurfaceKey surface;
    CutKey cut;
    bool operator==(const RingKey&) const = default;
};
struct ProbeKey {
    int a = 0, b = 0;
    std::size_t fa = 0, fb = 0;
    std::optional<Direction> at;
    bool operator==(const ProbeKey&) const = default;
};
struct SummaryKey {
    int a = 0;
    std::size_t fa = 0;
    bool operator==(const SummaryKey&) const = default;
};
struct PeakKey {
    int a = 0;
    std::size_t fa = 0;
    Component component = Component::total;
    bool operator==(const PeakKey&) const = default;
};
struct PoincareKey {
    int a = 0;
    std::size_t fa = 0;
    double within_db = 0;
    bool operator==(const PoincareKey&) const = default;
};
struct DiversityKey {
    DiversityChoice choice;  // as computed (orientations off while a slider is held)
    int a = 0, b = 0;
    std::size_t fa = 0, fb = 0;
    int a_reference = 0, b_reference = 0;  // LoadedPattern::reference_id: ECC reads the phase
    bool operator==(const DiversityKey&) const = default;
};

struct FolderKey {  // the browser's folder and what it lists
    std::string folder;
    bool all_files = false, hidden = false;
    int reload = 0;
    bool operator==(const FolderKey&) const = default;
};
struct BandKey {
    int a = 0;
    bool operator==(const BandKey&) const = default;
};

// The figures the band panel can plot against frequency, by index (AppState::band_quantity).
// A beam figure names its plane after the label through exports::beam_plane_text (the viewer's
// band_quantity_label): "HPBW, elevation plane", or "HPBW, plane φ = 0°" for a beam at a pole.
struct BandQuantity {
    const char* label;  // menu text (before the plane, for a beam figure)
    const char* unit;   // the y axis's unit; "" for the pattern's own dB unit (db_unit: dBi, or dB for relative data)
    int plane = -1;     // -1 none, 0 the elevation plane through the peak, 1 the plane across it
};
inline constexpr BandQuantity band_quantities[] = {
    {"Peak", ""},          {"Directivity", "dBi"},        {"Radiation efficiency", "%"},
    {"MEG, uniform", "dB"},  {"Axial ratio at the peak", "dB"}, {"HPBW", "\u00b0", 0},
    {"HPBW", "\u00b0", 1}, {"Front-to-back", "dB"}, {"AR beamwidth (3 dB)", "\u00b0", 0}};
inline constexpr int band_quantity_count = int(sizeof band_quantities / sizeof band_quantities[0]);
// The value of quantity q at one frequency (NaN: none there).
double band_value(const FrequencyFigures& f, int q);

// Figures against frequency of A (pattern/band.hpp): every frequency, MEG in the uniform
// environment, the band edges.
struct BandView {
    std::vector<FrequencyFigures> figures;  // ascending frequency
    std::vector<double> frequency_hz;       // of each entry
    BandSummary summary;
    double compute_ms = 0;
};

struct SurfaceView {
    SurfaceMesh mesh;    // no vertices when nothing is shown
    std::string error;   // why the surface cannot be shown ("" when it is)
    double build_ms = 0;
};
// The probe at one direction: A's values, and B's at the same direction when comparing.
struct DirectionProbe {
    ProbeValues a;
    std::optional<ProbeValues> b;
};
struct DiversityView {
    DiversityFigures figures;
    bool computed = false;
    bool sweep_pending = false;  // the orientation sweep waits for the slider's release
    double compute_ms = 0;
    FadingCurves fading;  // the fading panel's curves from these figures
};

struct Derived {
    Keyed<SurfaceKey, SurfaceView> surface;
    Keyed<GlyphKey, LineSet> glyphs;
    Keyed<CutKey, CutData> cut;
    Keyed<RingKey, LineSet> ring;  // the cut drawn on the surface
    Keyed<ProbeKey, std::optional<DirectionProbe>> hover, pinned;
    Keyed<SummaryKey, std::optional<PatternSummary>> summary;
    // The shown component's refined peak in dB (pattern/peak.hpp), the number the view's caption
    // gives (the same as the figures' peak for the total); none without a pattern or when every
    // sample of the component is zero.
    Keyed<PeakKey, std::optional<double>> peak_db;
    Keyed<PoincareKey, std::vector<PoincarePoint>> poincare;
    Keyed<DiversityKey, DiversityView> diversity;  // only while the diversity panel is open
    Keyed<BandKey, BandView> band;                 // only while the band panel is open
    Keyed<FolderKey, FolderListing> folder;        // only while the file browser is open
};

// What the GPU must take again after a refresh.
struct DerivedChanges {
    bool surface = false, glyphs = false, ring = false;
};

// Bring every part up to date with the state. `interacting`: a slider is being dragged (the
// diversity orientation sweep then waits). Cost: the rebuilt parts only (a 1-degree surface
// about 5 ms, glyphs and cut about 1 ms, a diversity sweep about 50 ms); nothing when no
// input changed.
DerivedChanges refresh(Derived& d, const AppState& s, bool interacting = false);

// The point on the shown surface toward a direction (for markers), in view units.
glm::dvec3 surface_point(const AppState& s, const Derived& d, const Direction& at);

}  // namespace ellipsa::viewer
