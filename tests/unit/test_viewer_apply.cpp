// apply(): the one function that changes the viewer's state. Closing patterns, A/B indices,
// frequencies, components, pins, loads and exports, each as the intents a panel would return.
#include <catch2/catch.hpp>

#include <cmath>

#include "pattern/reference.hpp"
#include "viewer/state/apply.hpp"
#include "viewer/state/derived.hpp"

using namespace ellipsa;
using namespace ellipsa::viewer;

namespace {
// A synthesised antenna at the given frequencies (the field scaled per frequency so the sets differ).
FarFieldSet antenna(ReferenceKind kind, std::vector<double> freqs_hz, const std::string& name) {
    ReferenceAntenna a;
    a.kind = kind;
    FarFieldSet s = synthesize(a, 10, freqs_hz.front());
    s.name = name;
    const FarField f0 = s.frequencies.front();
    s.frequencies.clear();
    for (std::size_t k = 0; k < freqs_hz.size(); ++k) {
        FarField f = f0;
        f.frequency_hz = freqs_hz[k];
        for (cplx& v : f.e_theta) v *= double(k + 1);
        for (cplx& v : f.e_phi) v *= double(k + 1);
        s.frequencies.push_back(std::move(f));
    }
    return s;
}

// Three patterns p0, p1, p2 (ids 1, 2, 3), A = 0.
AppState three() {
    AppState s;
    Intents in;
    in.push_back(intent::AddPatterns{{antenna(ReferenceKind::short_dipole, {1e9}, "p0"),
                                      antenna(ReferenceKind::small_loop, {1e9}, "p1"),
                                      antenna(ReferenceKind::crossed_dipoles, {1e9}, "p2")},
                                     "test"});
    apply(s, std::move(in));
    return s;
}

template <class... I>
Effects run(AppState& s, I... intents) {
    Intents in;
    (in.push_back(std::move(intents)), ...);
    return apply(s, std::move(in));
}

std::string name_of(const AppState& s, int i) { return s.patterns[std::size_t(i)].set.name; }
}  // namespace

TEST_CASE("adding patterns: ids, A and the note", "[viewer][apply]") {
    AppState s = three();
    REQUIRE(s.patterns.size() == 3);
    CHECK(s.active == 0);
    CHECK(s.compare == -1);
    CHECK(s.patterns[0].id == 1);
    CHECK(s.patterns[2].id == 3);
    CHECK(s.note == "test");
}

TEST_CASE("closing patterns keeps A and B on the same patterns", "[viewer][apply]") {
    SECTION("closing one before A and B shifts both") {
        AppState s = three();
        run(s, intent::SelectPattern{1}, intent::SetCompare{2});
        run(s, intent::ClosePattern{0});
        CHECK(name_of(s, s.active) == "p1");
        CHECK(name_of(s, s.compare) == "p2");
    }
    SECTION("closing B drops it") {
        AppState s = three();
        run(s, intent::SelectPattern{2}, intent::SetCompare{0});
        run(s, intent::ClosePattern{0});
        CHECK(name_of(s, s.active) == "p2");
        CHECK(s.compare == -1);
    }
    SECTION("closing A makes the one before it A; B stays on its pattern") {
        AppState s = three();
        run(s, intent::SelectPattern{1}, intent::SetCompare{2});
        run(s, intent::ClosePattern{1});
        CHECK(name_of(s, s.active) == "p0");
        CHECK(name_of(s, s.compare) == "p2");
    }
    SECTION("closing the first pattern while it is A makes the next one A") {
        AppState s = three();
        run(s, intent::SetCompare{1});
        run(s, intent::ClosePattern{0});
        CHECK(name_of(s, s.active) == "p1");
        CHECK(s.compare == -1);  // B was the new A
    }
    SECTION("closing every pattern leaves an empty, consistent state") {
        AppState s = three();
        run(s, intent::Hover{Direction{10, 20}, false}, intent::ClosePattern{2}, intent::ClosePattern{1}, intent::ClosePattern{0});
        CHECK(s.patterns.empty());
        CHECK(s.active_pattern() == nullptr);
        CHECK(s.compare == -1);
        CHECK_FALSE(s.hover);
    }
    SECTION("the cursor over the not-measured region probes nothing and says so") {
        AppState s = three();
        run(s, intent::Hover{Direction{10, 20}, false}, intent::Hover{std::nullopt, true});
        CHECK_FALSE(s.hover);
        CHECK(s.hover_not_measured);
        run(s, intent::Hover{Direction{10, 20}, false});
        CHECK(s.hover);
        CHECK_FALSE(s.hover_not_measured);
        // A direction and the flag together: the direction wins (data there).
        run(s, intent::Hover{Direction{30, 20}, true});
        CHECK_FALSE(s.hover_not_measured);
        run(s, intent::Hover{std::nullopt, true}, intent::ClosePattern{2}, intent::ClosePattern{1}, intent::ClosePattern{0});
        CHECK_FALSE(s.hover_not_measured);
    }
    SECTION("an index out of range changes nothing") {
        AppState s = three();
        run(s, intent::ClosePattern{3}, intent::ClosePattern{-1});
        CHECK(s.patterns.size() == 3);
    }
    SECTION("closing B resets a difference colouring") {
        AppState s = three();
        ViewerSettings st = s.settings;
        st.color_by = ColorBy::difference;
        run(s, intent::SetCompare{1}, intent::ChangeSettings{st});
        CHECK(s.settings.color_by == ColorBy::difference);
        run(s, intent::ClosePattern{1});
        CHECK(s.settings.color_by == ColorBy::component);
    }
}

TEST_CASE("B is never A", "[viewer][apply]") {
    AppState s = three();
    run(s, intent::SetCompare{0});
    CHECK(s.compare == -1);
    run(s, intent::SetCompare{2}, intent::SelectPattern{2});
    CHECK(s.active == 2);
    CHECK(s.compare == -1);
    run(s, intent::SetCompare{7});
    CHECK(s.compare == -1);
}

TEST_CASE("frequencies: in range, stepped, and kept across patterns by nearest frequency", "[viewer][apply]") {
    AppState s;
    run(s, intent::AddPatterns{{antenna(ReferenceKind::short_dipole, {2.40e9, 2.45e9, 2.50e9}, "a"),
                                antenna(ReferenceKind::small_loop, {2.44e9, 2.51e9}, "b")},
                               ""});
    run(s, intent::SetFrequency{2});
    CHECK(s.freq == 2);
    run(s, intent::SetFrequency{3});  // there is no fourth
    CHECK(s.freq == 2);
    run(s, intent::StepFrequency{1});
    CHECK(s.freq == 2);
    run(s, intent::StepFrequency{-5});
    CHECK(s.freq == 0);
    run(s, intent::SetFrequency{2}, intent::SelectPattern{1});  // 2.50 GHz: b's nearest is 2.51 GHz
    CHECK(s.freq == 1);
    run(s, intent::SetFrequency{0}, intent::NextPattern{});  // 2.44 GHz: a's nearest is 2.45 GHz
    CHECK(s.active == 0);
    CHECK(s.freq == 1);
    CHECK(s.freq_for(s.patterns[1]) == 0);  // B at A's 2.45 GHz: 2.44 GHz
}

TEST_CASE("components: only ones the data can give", "[viewer][apply]") {
    AppState s = three();
    s.patterns[0].set.content = FieldContent::magnitude_only;  // no phase: no circular or Ludwig-3 parts
    ViewerSettings st = s.settings;
    st.component = Component::rhcp;
    run(s, intent::ChangeSettings{st});
    CHECK(s.settings.component == Component::total);
    st.component = Component::phi;
    run(s, intent::ChangeSettings{st});
    CHECK(s.settings.component == Component::phi);
    run(s, intent::StepComponent{1}, intent::StepComponent{1});  // vertical, horizontal
    CHECK(s.settings.component == Component::horizontal);
    run(s, intent::StepComponent{1});  // co, cross, rhcp, lhcp need phase: round to total
    CHECK(s.settings.component == Component::total);
    run(s, intent::StepComponent{-1});
    CHECK(s.settings.component == Component::horizontal);
    // A pattern with phase offers them again.
    run(s, intent::SelectPattern{2}, intent::StepComponent{1});
    CHECK(s.settings.component == Component::co);
}

TEST_CASE("colourings: the difference only with a B", "[viewer][apply]") {
    AppState s = three();
    run(s, intent::SelectPattern{2});  // crossed dipoles: every colouring but the difference
    for (int k = 0; k < 4; ++k) run(s, intent::StepColorBy{});
    CHECK(s.settings.color_by == ColorBy::component);  // wrapped past the difference
    run(s, intent::SetCompare{0});
    for (int k = 0; k < 4; ++k) run(s, intent::StepColorBy{});
    CHECK(s.settings.color_by == ColorBy::difference);
}

TEST_CASE("settings edits keep every number within its limits", "[viewer][apply]") {
    AppState s = three();
    ViewerSettings st = s.settings;
    st.range_db = NAN;  // ImGui's typed slider input can give anything
    st.cut_panel_height = INFINITY;
    st.glyph_spacing_deg = 20;
    run(s, intent::ChangeSettings{st});
    CHECK(s.settings.range_db == ViewerSettings{}.range_db);
    CHECK(s.settings.cut_panel_height == ViewerSettings{}.cut_panel_height);
    CHECK(s.settings.glyph_spacing_deg == 20);
}

TEST_CASE("pin, unpin and Esc", "[viewer][apply]") {
    AppState s = three();
    run(s, intent::Pin{Direction{45, -30}});
    REQUIRE(s.pinned);
    CHECK(s.pinned->phi_deg == 330);
    run(s, intent::Unpin{});  // the probe panel's button
    CHECK_FALSE(s.pinned);
    run(s, intent::Pin{Direction{NAN, NAN}}, intent::Pin{Direction{190, 0}});
    CHECK_FALSE(s.pinned);
    run(s, intent::Pin{Direction{10, 10}}, intent::ShowHelp{true}, intent::Escape{});
    CHECK_FALSE(s.show_help);  // Esc closes the help first
    CHECK(s.pinned);
    run(s, intent::Escape{});
    CHECK_FALSE(s.pinned);
}

TEST_CASE("loading: files go out as effects, results come back as intents", "[viewer][apply]") {
    AppState s = three();
    const Effects fx = run(s, intent::OpenFiles{{"a.csv", "", "b.csv"}, "m.map"}, intent::CancelLoad{});
    REQUIRE(fx.load.size() == 2);
    CHECK(fx.load[1].path == "b.csv");
    CHECK(fx.load[1].map == "m.map");
    CHECK_FALSE(fx.load[1].recent);  // typed or dropped: read as a FILE argument
    CHECK(fx.cancel_load);
    // From the recent list: marked, so the entry is read back by split_recent_entry.
    const Effects recent = run(s, intent::OpenFiles{{"/d/a::b.csv"}, "", true});
    REQUIRE(recent.load.size() == 1);
    CHECK(recent.load[0].recent);
    CHECK(recent.load[0].path == "/d/a::b.csv");
    run(s, intent::LoadFinished{"bad.csv", "/x/bad.csv", Error{"bad.csv", 3, 1, "expected a number"}});
    CHECK(s.patterns.size() == 3);
    CHECK(s.load_error == "bad.csv:3:1: expected a number");
    run(s, intent::LoadFinished{"d.csv", "/x/d.csv", antenna(ReferenceKind::dipole, {1e9}, "d")});
    CHECK(s.patterns.size() == 4);
    CHECK(s.active == 3);
    CHECK(s.patterns[3].path == "d.csv");
    CHECK(s.load_error.empty());
    CHECK(s.note.empty());
    CHECK(s.settings.recent_files.front() == "/x/d.csv");
}

TEST_CASE("loading: a joined pattern is named by its files and remembered with them", "[viewer][apply]") {
    AppState s = three();
    // What the loader sends for "ellipsa view range/co.csv::join=range/cross.csv" (the set merged).
    run(s, intent::LoadFinished{"range/co.csv", "/r/range/co.csv::join=/r/range/cross.csv",
                                antenna(ReferenceKind::dipole, {1e9}, "co"), {}, {"range/cross.csv"}});
    REQUIRE(s.patterns.size() == 4);
    const LoadedPattern& p = s.patterns[3];
    CHECK(p.path == "range/co.csv");
    CHECK(p.join == std::vector<std::string>{"range/cross.csv"});
    CHECK(p.list_name() == "co.csv + cross.csv");  // as `info` names the files it read
    CHECK(s.patterns[0].list_name() == "p0");       // a single file: the set's name
    // The recent list keeps the whole FILE argument, so opening it again joins the files again.
    CHECK(s.settings.recent_files.front() == "/r/range/co.csv::join=/r/range/cross.csv");
}

TEST_CASE("exports: asked for, answered, replaced only when asked", "[viewer][apply]") {
    AppState s = three();
    Effects fx = run(s, intent::ExportCut{"c.svg", false});
    REQUIRE(fx.export_cut);
    CHECK_FALSE(fx.export_cut->overwrite);
    run(s, intent::ExportFinished{ExportTarget::cut, {ExportOutcome::Status::exists, "c.svg", ""}});
    REQUIRE(s.cut_export);
    CHECK(s.cut_export->status == ExportOutcome::Status::exists);
    fx = run(s, intent::ExportCut{"c.svg", true});  // "Replace it"
    CHECK(fx.export_cut->overwrite);
    CHECK_FALSE(s.cut_export);  // the old message goes while the new export runs
    run(s, intent::ExportFinished{ExportTarget::view, {ExportOutcome::Status::written, "/x/v.png", ""}},
        intent::DismissExport{ExportTarget::cut});
    CHECK(s.view_export->status == ExportOutcome::Status::written);
    CHECK_FALSE(s.cut_export);
}

TEST_CASE("the band panel: opened, closed, and only known figures chosen", "[viewer][apply]") {
    AppState s;
    run(s, intent::ShowBand{true});
    CHECK(s.band_open);
    run(s, intent::SetBandQuantity{4});
    CHECK(s.band_quantity == 4);
    run(s, intent::SetBandQuantity{band_quantity_count}, intent::SetBandQuantity{-1});  // no such figures
    CHECK(s.band_quantity == 4);
    run(s, intent::ShowBand{false});
    CHECK_FALSE(s.band_open);
}

TEST_CASE("the fading panel: a docked tool opened in front, closed back to the cut, by name", "[viewer][apply]") {
    AppState s;
    run(s, intent::ShowFading{true});
    CHECK(s.fading_open);
    CHECK(s.strip_tab == Tab::fading);
    run(s, intent::ShowFading{false});
    CHECK_FALSE(s.fading_open);
    CHECK(s.strip_tab == Tab::cut);
    run(s, intent::SelectTab{Tab::fading});
    CHECK(s.fading_open);
    CHECK(std::string(tab_names[int(Tab::fading)]) == "fading");
}

TEST_CASE("the map panel: opened, closed, and only the three projections", "[viewer][apply]") {
    AppState s;
    run(s, intent::ShowMap{true}, intent::SetMapProjection{2});
    CHECK(s.map_open);
    CHECK(s.map_projection == 2);
    run(s, intent::SetMapProjection{3}, intent::SetMapProjection{-1});
    CHECK(s.map_projection == 2);
    run(s, intent::ShowMap{false});
    CHECK_FALSE(s.map_open);
}

TEST_CASE("tabs: a docked tool opens in front, closing it brings the cut back, names parse", "[viewer][apply]") {
    AppState s;
    CHECK(s.strip_tab == Tab::cut);
    CHECK(s.left_tab == Tab::patterns);
    run(s, intent::ShowDiversity{true});
    CHECK(s.diversity_open);
    CHECK(s.strip_tab == Tab::diversity);
    run(s, intent::ShowBand{true});
    CHECK(s.strip_tab == Tab::band);
    run(s, intent::SelectTab{Tab::diversity});
    CHECK(s.strip_tab == Tab::diversity);
    run(s, intent::ShowBand{false});  // not in front: the front tab stays
    CHECK(s.strip_tab == Tab::diversity);
    run(s, intent::ShowDiversity{false});  // in front: the cut comes back
    CHECK(s.strip_tab == Tab::cut);
    run(s, intent::SelectTab{Tab::band});  // selecting a closed tool opens it
    CHECK(s.band_open);
    CHECK(s.strip_tab == Tab::band);
    run(s, intent::SelectTab{Tab::surface});  // the left column's tabs are its own
    CHECK(s.left_tab == Tab::surface);
    CHECK(s.strip_tab == Tab::band);
    run(s, intent::ShowMap{true});
    CHECK(s.strip_tab == Tab::map);
    CHECK(parse_tab("polarisation") == Tab::polarisation);
    CHECK(parse_tab("Cut") == std::nullopt);
    CHECK(parse_tab("") == std::nullopt);
}

// File > Open asks for the desktop's dialog in the folder of the latest file (one at a time); the
// in-window browser opens, changes and closes through ShowBrowser, and Esc closes it before it unpins.
TEST_CASE("File > Open: the desktop dialog once, in the latest file's folder; the browser by intent", "[viewer][apply][browser]") {
    AppState s;
    s.settings.remember_file("/data/range/meas.csv");
    Effects fx = apply(s, Intents{intent::OpenFileDialog{}});
    REQUIRE(fx.file_dialog);
    CHECK(*fx.file_dialog == "/data/range");
    CHECK(s.desktop_dialog_open);
    CHECK_FALSE(apply(s, Intents{intent::OpenFileDialog{}}).file_dialog);  // one at a time
    apply(s, Intents{intent::DesktopDialogClosed{}});
    CHECK_FALSE(s.desktop_dialog_open);
    s.pinned = Direction{10, 20};
    apply(s, Intents{intent::ShowBrowser{BrowserView::at("/data")}});
    REQUIRE(s.browser);
    CHECK(s.browser->folder == "/data");
    apply(s, Intents{intent::Escape{}});
    CHECK_FALSE(s.browser);
    CHECK(s.pinned);  // the first Esc only closed the browser
}
