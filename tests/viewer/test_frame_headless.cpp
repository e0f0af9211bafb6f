// The window's UI without a GPU: Dear ImGui runs on the CPU alone (no backend, no GL context),
// so the panels, keys and mouse steps of a frame can be driven here. Each frame: input in,
// draw_ui() returns intents, apply() changes the state, refresh() the derived data, as in
// run_viewer(). Checked: odd states draw without asking for anything; a click on the surface
// pins the direction under the pointer and the cut follows; Esc and W act through intents.
#include <catch2/catch.hpp>

#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <filesystem>
#include <fstream>

#include <unistd.h>

#define GLFW_INCLUDE_NONE
#include <GLFW/glfw3.h>

#include "pattern/reference.hpp"
#include "viewer/frame.hpp"
#include "viewer/panels.hpp"
#include "viewer/state/apply.hpp"
#include "viewer/widgets.hpp"

using namespace ellipsa;
using namespace ellipsa::viewer;

namespace {
// One ImGui context with our style and fonts, 1280 x 800, keys mapped as the GLFW backend maps them.
struct Ui {
    UiFonts fonts;
    RendererInfo renderer;
    Ui() {
        ImGui::CreateContext();
        ImGuiIO& io = ImGui::GetIO();
        io.IniFilename = nullptr;
        io.DisplaySize = ImVec2(1280, 800);
        io.DeltaTime = 1.0f / 60;
        io.KeyMap[ImGuiKey_Escape] = GLFW_KEY_ESCAPE;
        io.KeyMap[ImGuiKey_Tab] = GLFW_KEY_TAB;
        io.KeyMap[ImGuiKey_UpArrow] = GLFW_KEY_UP;
        io.KeyMap[ImGuiKey_DownArrow] = GLFW_KEY_DOWN;
        io.KeyMap[ImGuiKey_Enter] = GLFW_KEY_ENTER;
        io.KeyMap[ImGuiKey_Backspace] = GLFW_KEY_BACKSPACE;
        fonts = setup_ui_style(1.0f);
        unsigned char* px = nullptr;
        int w = 0, h = 0;
        io.Fonts->GetTexDataAsRGBA32(&px, &w, &h);  // what a renderer backend would upload
        renderer.renderer = "none (test)";
    }
    ~Ui() { ImGui::DestroyContext(); }
    // One frame as run_viewer() runs it; returns the intents it produced.
    Intents frame(AppState& s, Derived& d) {
        ImGui::NewFrame();
        Layout layout;
        Intents in = draw_ui(s, d, renderer, layout);
        draw_view_overlay(s, d, layout, fonts, renderer);
        ImGui::Render();
        const Intents seen = in;
        apply(s, std::move(in));
        refresh(d, s, ImGui::IsAnyItemActive());
        return seen;
    }
    Layout layout(const AppState& s) {
        // The menu bar is one line of the body font plus padding (as drawn).
        return compute_layout(s.settings, ImGui::GetIO().DisplaySize, ImGui::GetFontSize() + 2 * ImGui::GetStyle().FramePadding.y);
    }
};

FarFieldSet antenna(ReferenceKind kind, double scale = 1) {
    ReferenceAntenna a;
    a.kind = kind;
    FarFieldSet s = synthesize(a, 5, 1e9);
    s.name = to_string(kind);
    for (FarField& f : s.frequencies) {
        for (cplx& v : f.e_theta) v *= scale;
        for (cplx& v : f.e_phi) v *= scale;
    }
    return s;
}

template <class T>
bool has(const Intents& in) {
    return std::any_of(in.begin(), in.end(), [](const Intent& i) { return std::holds_alternative<T>(i); });
}
}  // namespace

TEST_CASE("every panel draws odd states without a GPU and asks for nothing by itself", "[viewer][ui]") {
    Ui ui;
    struct Case {
        const char* name;
        std::vector<FarFieldSet> sets;
        Intents setup;
    };
    ViewerSettings cone0;  // theta = 0 cone of a z dipole: no power on the cut
    cone0.cut_kind = 1;
    cone0.cut_angle_deg = 0;
    ViewerSettings through_pin;
    through_pin.cut_kind = 2;
    through_pin.color_by = ColorBy::difference;
    FarFieldSet magnitude = antenna(ReferenceKind::dipole);
    magnitude.content = FieldContent::magnitude_only;
    std::vector<Case> cases;
    cases.push_back({"no pattern", {}, {}});
    cases.push_back({"all-zero pattern, pinned", {antenna(ReferenceKind::short_dipole, 0)}, {}});
    cases.back().setup.push_back(intent::Pin{Direction{0, 0}});
    cases.push_back({"cut with no power", {antenna(ReferenceKind::short_dipole)}, {}});
    cases.back().setup.push_back(intent::ChangeSettings{cone0});
    cases.push_back({"magnitude only", {magnitude}, {}});
    cases.push_back({"A and B, difference, pinned, every window", {antenna(ReferenceKind::crossed_dipoles), antenna(ReferenceKind::small_loop)}, {}});
    for (Intent i : Intents{intent::SetCompare{1}, intent::ChangeSettings{through_pin}, intent::Pin{Direction{30, 40}},
                            intent::ShowHelp{true}, intent::ShowIntro{true}, intent::ShowDiversity{true}, intent::ShowBand{true}, intent::ShowMap{true}, intent::ShowFading{true},
                            intent::ExportFinished{ExportTarget::cut, {ExportOutcome::Status::exists, "c.svg", ""}},
                            intent::ExportFinished{ExportTarget::view, {ExportOutcome::Status::failed, "v.png", "disk full"}}})
        cases.back().setup.push_back(std::move(i));
    {  // figures against frequency over three frequencies, the axial ratio plotted
        FarFieldSet band = antenna(ReferenceKind::crossed_dipoles);
        band.frequencies.push_back(band.frequencies[0]);
        band.frequencies.push_back(band.frequencies[0]);
        band.frequencies[1].frequency_hz = 1.1e9;
        band.frequencies[2].frequency_hz = 1.2e9;
        cases.push_back({"band panel", {band}, {intent::ShowBand{true}, intent::SetBandQuantity{4}, intent::SetFrequency{1}}});
        cases.push_back({"fading panel, one pattern", {band}, {intent::ShowFading{true}}});
        cases.push_back({"map, theta/phi, pinned", {band}, {intent::ShowMap{true}, intent::SetMapProjection{1}, intent::Pin{Direction{40, 10}}}});
    }
    // The mounting control: a mounted pattern with a turns text that does not read (the error is
    // shown, nothing is sent), and a mounting refused for a half sphere (its reason is shown).
    cases.push_back({"mounted, turns being typed wrong", {antenna(ReferenceKind::dipole)},
                     {intent::SetMounting{0, Vec3{1, 0, 0}, {{Axis::z, 30}}}, intent::EditTurns{"z30"}}});
    {
        FarFieldSet half = antenna(ReferenceKind::dipole);
        half.grid.theta.count = half.grid.theta.count / 2;
        for (FarField& f : half.frequencies) {
            f.e_theta.resize(half.grid.size());
            f.e_phi.resize(half.grid.size());
        }
        cases.push_back({"mounting refused", {half}, {intent::SetMounting{0, Vec3{1, 0, 0}, {}}}});
    }
    for (Case& c : cases) {
        INFO(c.name);
        AppState s;
        if (!c.sets.empty()) apply(s, Intents{intent::AddPatterns{std::move(c.sets), ""}});
        apply(s, std::move(c.setup));
        Derived d;
        refresh(d, s);
        for (int k = 0; k < 3; ++k) CHECK(ui.frame(s, d).empty());
    }
}

TEST_CASE("a click on the surface pins the direction under the pointer; Esc unpins; the cut follows", "[viewer][ui]") {
    Ui ui;
    AppState s;
    ViewerSettings st;
    st.cut_kind = 2;  // the cut through the pin
    apply(s, Intents{intent::AddPatterns{{antenna(ReferenceKind::small_loop)}, ""}, intent::ChangeSettings{st}});
    Derived d;
    refresh(d, s);
    ImGuiIO& io = ImGui::GetIO();
    const Layout L = ui.layout(s);
    io.MousePos = ImVec2(L.view_pos.x + L.view_size.x * 0.5f, L.view_pos.y + L.view_size.y * 0.5f);
    ui.frame(s, d);
    ui.frame(s, d);
    REQUIRE(s.hover);  // the middle of the view is on the surface
    CHECK_FALSE(d.cut.value().valid);
    io.MouseDown[0] = true;
    ui.frame(s, d);
    io.MouseDown[0] = false;
    CHECK(has<intent::Pin>(ui.frame(s, d)));
    REQUIRE(s.pinned);
    CHECK(d.cut.value().valid);
    REQUIRE(d.pinned.value());
    io.KeysDown[GLFW_KEY_ESCAPE] = true;
    CHECK(has<intent::Escape>(ui.frame(s, d)));
    io.KeysDown[GLFW_KEY_ESCAPE] = false;
    CHECK_FALSE(s.pinned);
    CHECK_FALSE(d.cut.value().valid);
    io.KeysDown[GLFW_KEY_W] = true;
    CHECK(has<intent::ChangeSettings>(ui.frame(s, d)));
    io.KeysDown[GLFW_KEY_W] = false;
    CHECK(s.settings.wireframe);
}

TEST_CASE("the layout at 1280x800 and 800x600: panels tile the window, the scene is clear of header and key", "[viewer][ui]") {
    Ui ui;
    ImGuiIO& io = ImGui::GetIO();
    const ViewerSettings st;
    const float menu = 21;
    auto inside = [](ImVec2 p, ImVec2 s, ImVec2 outer_p, ImVec2 outer_s) {
        return p.x >= outer_p.x - 0.5f && p.y >= outer_p.y - 0.5f && p.x + s.x <= outer_p.x + outer_s.x + 0.5f &&
               p.y + s.y <= outer_p.y + outer_s.y + 0.5f;
    };
    for (ImVec2 display : {ImVec2(1280, 800), ImVec2(800, 600), ImVec2(1024, 768)}) {
        INFO(display.x << "x" << display.y);
        const Layout L = compute_layout(st, display, menu);
        CHECK(L.narrow == (display.x < narrow_width || display.y < narrow_height));
        // Columns side by side, every one down to the bottom of the window.
        CHECK(L.left_pos.x == 0);
        CHECK(L.area_pos.x == Approx(L.left_size.x));
        CHECK(L.strip_pos.x == Approx(L.area_pos.x));
        CHECK(L.area_pos.y + L.area_size.y == Approx(L.strip_pos.y));
        CHECK(L.strip_pos.y + L.strip_size.y == Approx(display.y));
        CHECK(L.left_size.y == Approx(display.y - menu));
        // The plot strip keeps room for a cut (at least 250 x 250 px) at both sizes.
        CHECK(L.strip_size.x >= 250);
        CHECK(L.strip_size.y >= 250);
        // The scene and the key strip inside the view's rectangle, side by side, under the header.
        CHECK(inside(L.view_pos, L.view_size, L.area_pos, L.area_size));
        CHECK(inside(L.key_pos, L.key_size, L.area_pos, L.area_size));
        CHECK(L.view_pos.x + L.view_size.x <= L.key_pos.x + 0.5f);
        CHECK(L.view_pos.y >= L.area_pos.y + 2 * menu);
        CHECK(L.key_size.x >= 80);
        if (L.narrow) {
            CHECK(L.polar_size.x == 0);
            CHECK(L.area_pos.x + L.area_size.x == Approx(display.x));
        } else {
            CHECK(L.polar_pos.y + L.polar_size.y == Approx(L.probe_pos.y));
            CHECK(L.probe_pos.y + L.probe_size.y == Approx(display.y));
            CHECK(L.area_pos.x + L.area_size.x == Approx(L.polar_pos.x));
        }
    }
    // The cut plot keeps a usable size in the strip (issue 17: at 800x600 it shrank to about
    // 150 px under its table): the strip's content region is the strip less the window padding
    // and the tab bar, as drawn; the plot is at least 220 px both ways at every size, and when
    // the table is turned the plot has the full height and the column beside it keeps 200 px.
    const ImGuiStyle& style = ImGui::GetStyle();
    for (ImVec2 display : {ImVec2(1280, 800), ImVec2(800, 600), ImVec2(1024, 768)}) {
        INFO("cut panel at " << display.x << "x" << display.y);
        const Layout L = compute_layout(st, display, menu);
        const ImVec2 content(L.strip_size.x - 2 * style.WindowPadding.x,
                             L.strip_size.y - 2 * style.WindowPadding.y - ImGui::GetFrameHeightWithSpacing());
        for (std::size_t curves : {std::size_t(1), std::size_t(2), std::size_t(5)}) {
            const CutPanelLayout c = cut_panel_layout(content, curves, ImGui::GetTextLineHeightWithSpacing(), style.ItemSpacing.x);
            CHECK(std::min(c.plot.x, c.plot.y) >= cut_plot_min);
            CHECK(c.controls_w + style.ItemSpacing.x + c.plot.x <= content.x + 0.5f);
            CHECK(c.top_h <= content.y + 0.5f);
            if (c.turned) {
                CHECK(c.plot.y == Approx(content.y));
                CHECK(c.controls_w >= 200);
            }
        }
        CHECK(cut_panel_layout(content, 2, ImGui::GetTextLineHeightWithSpacing(), style.ItemSpacing.x).turned == (display.x == 800));
    }
    // Every tab draws at 800 x 600 (the narrow layout), without asking for anything by itself.
    io.DisplaySize = ImVec2(800, 600);
    AppState s;
    apply(s, Intents{intent::AddPatterns{{antenna(ReferenceKind::crossed_dipoles), antenna(ReferenceKind::small_loop)}, ""},
                     intent::SetCompare{1}, intent::ShowDiversity{true}, intent::ShowBand{true}, intent::ShowMap{true}});
    Derived d;
    refresh(d, s);
    for (Tab t : {Tab::patterns, Tab::surface, Tab::cut, Tab::probe, Tab::polarisation, Tab::diversity, Tab::band, Tab::map}) {
        INFO(tab_names[int(t)]);
        apply(s, Intents{intent::SelectTab{t}});
        refresh(d, s);
        for (int k = 0; k < 2; ++k) CHECK(ui.frame(s, d).empty());
        CHECK((in_left_column(t) ? s.left_tab : s.strip_tab) == t);
    }
    io.DisplaySize = ImVec2(1280, 800);
}

// Values wrap at spaces only (issue 17: ImGui's own wrapping broke "axial ratio 9.47 dB" after
// "9."): a number never splits, a word longer than the line keeps its own line.
TEST_CASE("long values wrap at spaces, never inside a number", "[viewer][ui]") {
    const auto chars = [](const std::string& t) { return float(t.size()); };  // one unit a byte
    const std::vector<std::string> l = word_lines("right-hand, axial ratio 9.47 dB", 26, chars);
    REQUIRE(l.size() == 2);
    CHECK(l[0] == "right-hand, axial ratio");
    CHECK(l[1] == "9.47 dB");
    CHECK(word_lines("9.47", 2, chars) == std::vector<std::string>{"9.47"});
    CHECK(word_lines("a\nb c", 10, chars) == std::vector<std::string>{"a", "b c"});
    CHECK(word_lines("", 10, chars) == std::vector<std::string>{""});
}

// File > Open in the window (issue 14): the folder listed (folders first, CSV and map files),
// typing filters, arrows move, Enter opens the file or goes into the folder, Backspace on an
// empty filter goes up, Esc closes. Common practice for a keyboard-friendly file chooser.
TEST_CASE("the in-window file browser is driven by the keyboard", "[viewer][ui][browser]") {
    namespace fs = std::filesystem;
    char t[] = "/tmp/ellipsa-ui-browse-XXXXXX";
    const fs::path root = ::mkdtemp(t);
    for (const char* f : {"b.csv", "a.csv", "notes.txt"}) std::ofstream(root / f) << "x";
    fs::create_directory(root / "sub");
    Ui ui;
    ImGuiIO& io = ImGui::GetIO();
    auto press = [&](AppState& s, Derived& d, int k) {
        io.KeysDown[k] = true;
        Intents in = ui.frame(s, d);
        io.KeysDown[k] = false;
        append(in, ui.frame(s, d));
        return in;
    };
    AppState s;
    apply(s, Intents{intent::ShowBrowser{BrowserView::at(root.string())}});
    Derived d;
    refresh(d, s);
    const FolderListing& l = d.folder.value();
    REQUIRE(l.entries.size() == 3);
    CHECK(l.entries[0].name == "sub");
    CHECK(l.entries[1].name == "a.csv");
    for (int k = 0; k < 3; ++k) ui.frame(s, d);  // the filter field takes the keyboard
    press(s, d, GLFW_KEY_DOWN);
    REQUIRE(s.browser);
    CHECK(s.browser->selected == 1);
    io.AddInputCharacter('b');
    ui.frame(s, d);
    ui.frame(s, d);
    REQUIRE(s.browser);
    CHECK(s.browser->typed == "b");
    CHECK(s.browser->selected == 0);
    Intents in = press(s, d, GLFW_KEY_ENTER);
    CHECK_FALSE(s.browser);
    bool opened = false;
    for (const Intent& i : in)
        if (const auto* o = std::get_if<intent::OpenFiles>(&i)) opened = o->paths == std::vector<std::string>{(root / "b.csv").string()};
    CHECK(opened);
    apply(s, Intents{intent::ShowBrowser{BrowserView::at((root / "sub").string())}});
    refresh(d, s);
    for (int k = 0; k < 3; ++k) ui.frame(s, d);
    press(s, d, GLFW_KEY_BACKSPACE);
    REQUIRE(s.browser);
    CHECK(s.browser->folder == root.string());
    apply(s, Intents{intent::Escape{}});
    CHECK_FALSE(s.browser);
    fs::remove_all(root);
}

TEST_CASE("the pointer over the not-measured region of a hemisphere probes nothing and pins nothing", "[viewer][ui]") {
    Ui ui;
    AppState s;
    FarFieldSet upper = antenna(ReferenceKind::small_loop);  // theta 0..90 of the 5-degree grid
    upper.grid.theta.count = 19;
    for (FarField& f : upper.frequencies) {
        f.e_theta.resize(upper.grid.size());
        f.e_phi.resize(upper.grid.size());
    }
    apply(s, Intents{intent::AddPatterns{{upper}, ""}, intent::SetView{30, -80}});  // from below
    Derived d;
    refresh(d, s);
    REQUIRE_FALSE(d.surface.value().mesh.unsampled.empty());
    ImGuiIO& io = ImGui::GetIO();
    const Layout L = ui.layout(s);
    io.MousePos = ImVec2(L.view_pos.x + L.view_size.x * 0.5f, L.view_pos.y + L.view_size.y * 0.5f);
    ui.frame(s, d);
    ui.frame(s, d);
    CHECK_FALSE(s.hover);
    CHECK(s.hover_not_measured);
    CHECK_FALSE(d.hover.value());
    io.MouseDown[0] = true;
    ui.frame(s, d);
    io.MouseDown[0] = false;
    CHECK_FALSE(has<intent::Pin>(ui.frame(s, d)));
    CHECK_FALSE(s.pinned);
    // From above, the same pointer is over data again.
    apply(s, Intents{intent::SetView{30, 80}});
    ui.frame(s, d);
    ui.frame(s, d);
    CHECK(s.hover);
    CHECK_FALSE(s.hover_not_measured);
}

// A long pattern name in the Patterns list keeps its start and its end (common practice: a middle
// ellipsis, as file managers shorten names), fits the width, and is cut between UTF-8 characters.
TEST_CASE("long names keep their start and end, cut between characters", "[viewer][ui]") {
    Ui ui;
    ImGui::NewFrame();
    const std::string name = "Patch antenna on ground plane, revision B, 2450 MHz, measured 2026-11-03";
    CHECK(elide_middle("short", 200) == "short");
    const std::string e = elide_middle(name, 150);
    CHECK(ImGui::CalcTextSize(e.c_str()).x <= 150);
    CHECK(e.rfind("Patch", 0) == 0);
    CHECK(e.size() > 10);
    CHECK(e.substr(e.size() - 5) == "11-03");
    CHECK(e.find("\u2026") != std::string::npos);
    std::string phis;
    for (int k = 0; k < 40; ++k) phis += "\u03c6";
    const std::string g = elide_middle(phis, 80);
    std::size_t chars = 0;
    for (char c : g) chars += (static_cast<unsigned char>(c) & 0xC0) != 0x80;
    CHECK(g.size() == (chars - 1) * 2 + 3);  // whole two-byte phis and the three-byte ellipsis
    ImGui::Render();
    // The list and the phase-reference control draw such a name and ask for nothing by themselves.
    AppState s;
    Derived d;
    FarFieldSet a = antenna(ReferenceKind::dipole);
    a.name = name;
    apply(s, Intents{intent::AddPatterns{{a, antenna(ReferenceKind::small_loop)}, ""}, intent::SelectTab{Tab::patterns}});
    refresh(d, s);
    for (int k = 0; k < 2; ++k) {
        const Intents in = ui.frame(s, d);
        CHECK_FALSE(has<intent::SelectPattern>(in));
        CHECK_FALSE(has<intent::SetPhaseReference>(in));
    }
}
