#include "viewer/state/apply.hpp"

#include <algorithm>
#include <cmath>
#include <filesystem>
#include <iterator>
#include <type_traits>

#include "pattern/vec3.hpp"
#include "viewer/scene/components.hpp"
#include "viewer/scene/file_browser.hpp"
#include "viewer/state/derived.hpp"

namespace ellipsa::viewer {

const LoadedPattern* AppState::active_pattern() const {
    return active >= 0 && active < int(patterns.size()) ? &patterns[std::size_t(active)] : nullptr;
}

const LoadedPattern* AppState::compare_pattern() const {
    return compare >= 0 && compare < int(patterns.size()) && compare != active ? &patterns[std::size_t(compare)] : nullptr;
}

std::size_t AppState::freq_for(const LoadedPattern& p) const {
    const LoadedPattern* a = active_pattern();
    if (!a || &p == a || freq >= a->set.frequencies.size())
        return std::min(freq, p.set.frequencies.empty() ? 0 : p.set.frequencies.size() - 1);
    return p.set.nearest_frequency(a->set.frequencies[freq].frequency_hz);
}

std::string LoadedPattern::list_name() const {
    if (join.empty()) return set.name.empty() ? std::string("(unnamed)") : set.name;
    std::string out = std::filesystem::path(path).filename().string();
    for (const std::string& j : join) out += " + " + std::filesystem::path(j).filename().string();
    return out;
}

std::optional<Tab> parse_tab(const std::string& name) {
    for (std::size_t k = 0; k < std::size(tab_names); ++k)
        if (name == tab_names[k]) return Tab(k);
    return std::nullopt;
}

namespace {

bool finite(const Direction& d) { return std::isfinite(d.theta_deg) && std::isfinite(d.phi_deg); }

// The shown frequency of A in Hz, if there is one.
std::optional<double> shown_frequency_hz(const AppState& s) {
    const LoadedPattern* a = s.active_pattern();
    if (!a || s.freq >= a->set.frequencies.size()) return std::nullopt;
    return a->set.frequencies[s.freq].frequency_hz;
}

// Make pattern i the A pattern, at the frequency nearest to the one shown before (so switching
// between files of the same band keeps the band). B is dropped if it was i.
void set_active(AppState& s, int i, std::optional<double> keep_hz) {
    if (i != s.active) {  // the mounting and reference controls show the new A's
        s.turns_input.reset(), s.mounting_error.clear();
        s.reference_input.reset(), s.reference_error.clear();
    }
    s.active = i;
    if (s.compare == i) s.compare = -1;
    const LoadedPattern* a = s.active_pattern();
    s.freq = a && keep_hz && !a->set.frequencies.empty() ? a->set.nearest_frequency(*keep_hz) : 0;
}

// Install and add one pattern; an Error (the mounting cannot be applied) adds nothing.
Status add_pattern(AppState& s, FarFieldSet set, std::string path, const InstallRequest& q,
                   std::vector<std::string> join = {}) {
    LoadedPattern p;
    if (Status st = install_loaded(p, std::move(set), q); !st) return st;
    const std::optional<double> hz = shown_frequency_hz(s);
    p.path = std::move(path);
    p.join = std::move(join);
    p.id = s.next_pattern_id++;
    s.patterns.push_back(std::move(p));
    set_active(s, int(s.patterns.size()) - 1, hz);
    return Ok{};
}

// Pattern p installed again from the pattern as read (or as shown when nothing else was kept),
// with the request q.
Status reinstall(LoadedPattern& p, const InstallRequest& q) {
    FarFieldSet source = p.as_read ? *p.as_read : p.set;
    return install_loaded(p, std::move(source), q);
}

// Pattern i installed again from the pattern as read, with a new mounting and a new id.
void set_mounting(AppState& s, const intent::SetMounting& m) {
    if (m.index < 0 || m.index >= int(s.patterns.size())) return;
    LoadedPattern& p = s.patterns[std::size_t(m.index)];
    InstallRequest q = p.install;
    q.up = m.up;
    q.turns = m.turns;
    if (Status st = reinstall(p, q); !st) {
        s.mounting_error = st.error().message;
        return;
    }
    s.mounting_error.clear();
    s.turns_input.reset();
    p.id = s.next_pattern_id++;
}

// Pattern i installed again from the pattern as read with its phase reference moved; the id stays
// (magnitudes and polarisation do not change), the reference id is new.
void set_phase_reference(AppState& s, const intent::SetPhaseReference& r) {
    if (r.index < 0 || r.index >= int(s.patterns.size())) return;
    LoadedPattern& p = s.patterns[std::size_t(r.index)];
    InstallRequest q = p.install;
    q.reference = r.reference;
    q.reference_point_m = r.reference == PhaseReference::point ? r.point_m : Vec3{};
    if (Status st = reinstall(p, q); !st) {
        s.reference_error = st.error().message;
        return;
    }
    s.reference_error.clear();
    s.reference_input.reset();
    p.reference_id = s.next_pattern_id++;
}

void close_pattern(AppState& s, int i) {
    if (i < 0 || i >= int(s.patterns.size())) return;
    const bool was_active = i == s.active;
    const std::optional<double> hz = shown_frequency_hz(s);
    s.patterns.erase(s.patterns.begin() + i);
    if (s.compare == i) s.compare = -1;
    else if (s.compare > i) --s.compare;
    if (s.active > i || (was_active && s.active > 0)) --s.active;
    if (was_active) set_active(s, s.active, hz);
}

// Step through the components (or colourings) the data can give, wrapping round.
template <class T, std::size_t N, class Usable>
T step_choice(const T (&all)[N], T current, int delta, Usable usable) {
    const int n = int(N);
    int i = int(std::distance(all, std::find(all, all + N, current)));
    for (int k = 0; k < n; ++k) {
        i = ((i + delta) % n + n) % n;
        if (usable(all[i])) break;
    }
    return all[i];
}

// After every batch: indices valid, B never A, the frequency exists, the shown component and
// colouring are ones the data can give (as the menus offer them).
void normalise(AppState& s) {
    const int n = int(s.patterns.size());
    if (n == 0) {
        s.active = 0, s.compare = -1, s.freq = 0;
        s.hover.reset();
        s.hover_not_measured = false;
        return;
    }
    s.active = std::clamp(s.active, 0, n - 1);
    if (s.compare >= n || s.compare == s.active || s.compare < -1) s.compare = -1;
    const FarFieldSet& a = s.patterns[std::size_t(s.active)].set;
    if (s.freq >= a.frequencies.size()) s.freq = 0;
    ViewerSettings& st = s.settings;
    if (component_unavailable(a, st.component)) st.component = Component::total;
    if (color_by_unavailable(a, st.color_by)) st.color_by = ColorBy::component;
    if (st.color_by == ColorBy::difference && !s.compare_pattern()) st.color_by = ColorBy::component;
    s.cut_export_format = std::clamp(s.cut_export_format, 0, int(std::size(cut_export_formats)) - 1);
}

// One handler per intent, in the order of the Intent variant.
struct Apply {
    AppState& s;
    Effects& fx;

    void operator()(intent::OpenFiles& i) {
        for (std::string& p : i.paths)
            if (!p.empty()) fx.load.push_back({std::move(p), i.map, i.recent});
    }
    void operator()(intent::CancelLoad&) { fx.cancel_load = true; }
    void operator()(intent::LoadStatus& i) { s.loading = std::move(i.now); }
    void operator()(intent::LoadFinished& i) {
        if (!i.result) {
            s.load_error = i.result.error().format();  // the loaded patterns and the view stay as they were
            return;
        }
        if (Status st = add_pattern(s, std::move(*i.result), i.path, i.install, std::move(i.join)); !st) {
            s.load_error = Error{i.path, 0, 0, st.error().message}.format();
            return;
        }
        s.load_error.clear();
        s.note.clear();
        s.settings.remember_file(i.absolute_path);
    }
    void operator()(intent::AddPatterns& i) {  // the first of them becomes A
        const int first = int(s.patterns.size());
        const std::optional<double> hz = shown_frequency_hz(s);
        for (FarFieldSet& f : i.sets)
            if (Status st = add_pattern(s, std::move(f), "", {}); !st) s.load_error = st.error().format();
        if (first < int(s.patterns.size())) set_active(s, first, hz);
        s.note = i.note;
    }
    void operator()(intent::ClosePattern& i) { close_pattern(s, i.index); }
    void operator()(intent::SelectPattern& i) {
        if (i.index >= 0 && i.index < int(s.patterns.size()) && i.index != s.active) set_active(s, i.index, shown_frequency_hz(s));
    }
    void operator()(intent::NextPattern&) {
        if (s.patterns.size() > 1) set_active(s, (s.active + 1) % int(s.patterns.size()), shown_frequency_hz(s));
    }
    void operator()(intent::SetCompare& i) {
        if (i.index == -1 || (i.index >= 0 && i.index < int(s.patterns.size()) && i.index != s.active)) s.compare = i.index;
    }
    void operator()(intent::SetFrequency& i) {
        if (const LoadedPattern* a = s.active_pattern(); a && i.index < a->set.frequencies.size()) s.freq = i.index;
    }
    void operator()(intent::StepFrequency& i) {
        const LoadedPattern* a = s.active_pattern();
        if (!a || a->set.frequencies.empty()) return;
        const long last = long(a->set.frequencies.size()) - 1;
        s.freq = std::size_t(std::clamp(long(s.freq) + i.delta, 0L, last));
    }
    void operator()(intent::EditPath& i) { s.path_input = std::move(i.text); }
    void operator()(intent::EditMap& i) { s.map_input = std::move(i.text); }
    void operator()(intent::DismissLoadError&) { s.load_error.clear(); }
    void operator()(intent::SetMounting& i) { set_mounting(s, i); }
    void operator()(intent::EditTurns& i) { s.turns_input = std::move(i.text); }
    void operator()(intent::SetPhaseReference& i) { set_phase_reference(s, i); }
    void operator()(intent::EditReferencePoint& i) {
        if (std::isfinite(i.point_m.x) && std::isfinite(i.point_m.y) && std::isfinite(i.point_m.z)) s.reference_input = i.point_m;
    }
    void operator()(intent::ChangeSettings& i) { s.settings = within_limits(std::move(i.settings), s.settings); }
    void operator()(intent::StepComponent& i) {
        const LoadedPattern* a = s.active_pattern();
        if (!a) return;
        s.settings.component = step_choice(all_components, s.settings.component, i.delta,
                                           [&](Component c) { return !component_unavailable(a->set, c); });
    }
    void operator()(intent::StepColorBy&) {
        const LoadedPattern* a = s.active_pattern();
        if (!a) return;
        s.settings.color_by = step_choice(all_color_by, s.settings.color_by, 1, [&](ColorBy c) {
            return !color_by_unavailable(a->set, c) && (c != ColorBy::difference || s.compare_pattern());
        });
    }
    void operator()(intent::Orbit& i) {
        if (std::isfinite(i.dx_px) && std::isfinite(i.dy_px)) s.camera.orbit(i.dx_px, i.dy_px);
    }
    void operator()(intent::Zoom& i) {
        if (std::isfinite(i.steps)) s.camera.zoom(i.steps);
    }
    void operator()(intent::LookFrom& i) { s.camera.look_from(i.preset); }
    void operator()(intent::SetView& i) {
        if (!std::isfinite(i.azimuth_deg) || !std::isfinite(i.elevation_deg)) return;
        s.camera.azimuth_deg = i.azimuth_deg;
        s.camera.elevation_deg = std::clamp(i.elevation_deg, -89.5, 89.5);
    }
    void operator()(intent::ResetView&) { s.camera.reset(); }
    void operator()(intent::Hover& i) {
        if (i.at && !finite(*i.at)) i.at.reset();
        s.hover = i.at;
        s.hover_not_measured = !i.at && i.not_measured;
    }
    void operator()(intent::Pin& i) {
        if (finite(i.at) && i.at.theta_deg >= 0 && i.at.theta_deg <= 180)
            s.pinned = Direction{i.at.theta_deg, wrap360(i.at.phi_deg)};
    }
    void operator()(intent::Unpin&) { s.pinned.reset(); }
    void operator()(intent::Escape&) {
        if (s.browser) s.browser.reset();
        else if (s.show_help) s.show_help = false;
        else s.pinned.reset();
    }
    void operator()(intent::OpenFileDialog&) {
        if (s.desktop_dialog_open) return;  // one at a time
        const std::vector<std::string> recent = recent_folders(s.settings.recent_files, 1);
        fx.file_dialog = recent.empty() ? std::string(".") : recent[0];  // where the last file came from
        s.desktop_dialog_open = true;
    }
    void operator()(intent::ShowBrowser& i) {
        s.browser = std::move(i.view);
        if (s.browser) s.browser->selected = std::max(0, s.browser->selected);
    }
    void operator()(intent::DesktopDialogClosed&) { s.desktop_dialog_open = false; }
    void operator()(intent::ShowHelp& i) { s.show_help = i.on; }
    void operator()(intent::ShowIntro& i) { s.show_intro = i.on; }
    void operator()(intent::DismissIntro&) {
        s.show_intro = false;
        s.settings.seen_intro = true;
    }
    void operator()(intent::ShowDiversity& i) { show_tool(s.diversity_open, Tab::diversity, i.on); }
    void operator()(intent::ChangeDiversity& i) { s.diversity = std::move(i.choice); }
    void operator()(intent::ShowBand& i) { show_tool(s.band_open, Tab::band, i.on); }
    void operator()(intent::ShowMap& i) { show_tool(s.map_open, Tab::map, i.on); }
    void operator()(intent::ShowFading& i) { show_tool(s.fading_open, Tab::fading, i.on); }
    void operator()(intent::SetMapProjection& i) {
        if (i.index >= 0 && i.index <= 2) s.map_projection = i.index;
    }
    void operator()(intent::SetBandQuantity& i) {
        if (i.index >= 0 && i.index < band_quantity_count) s.band_quantity = i.index;
    }
    void operator()(intent::SelectTab& i) {
        if (i.tab == Tab::diversity) s.diversity_open = true;
        if (i.tab == Tab::band) s.band_open = true;
        if (i.tab == Tab::map) s.map_open = true;
        if (i.tab == Tab::fading) s.fading_open = true;
        (in_left_column(i.tab) ? s.left_tab : s.strip_tab) = i.tab;
    }
    // A docked tool opens in front of the strip; closing the one in front brings the cut back.
    void show_tool(bool& open, Tab tab, bool on) {
        open = on;
        if (on) s.strip_tab = tab;
        else if (s.strip_tab == tab) s.strip_tab = Tab::cut;
    }
    void operator()(intent::SetCutExportFormat& i) { s.cut_export_format = i.index; }
    void operator()(intent::ExportView& i) {
        s.view_export.reset();
        fx.export_view = std::move(i);
    }
    void operator()(intent::ExportCut& i) {
        s.cut_export.reset();
        fx.export_cut = std::move(i);
    }
    void operator()(intent::ExportFinished& i) {
        (i.target == ExportTarget::view ? s.view_export : s.cut_export) = std::move(i.outcome);
    }
    void operator()(intent::DismissExport& i) { (i.target == ExportTarget::view ? s.view_export : s.cut_export).reset(); }
    void operator()(intent::Quit&) { s.quit = true; }
};

}  // namespace

Status install_loaded(LoadedPattern& p, FarFieldSet as_read, const InstallRequest& q) {
    // The pattern as read is kept only when the installed one differs from it.
    const bool same = q.turn_fields && q.reference == PhaseReference::keep &&
                      is_identity(resolve_mounting(as_read.file_mounting, q.up, q.turns));
    std::shared_ptr<const FarFieldSet> keep;
    Result<FarFieldSet> r = Error{"", 0, 0, ""};
    if (same) {
        r = install_pattern(std::move(as_read), q);
    } else {
        keep = std::make_shared<const FarFieldSet>(std::move(as_read));
        r = install_pattern(*keep, q);
    }
    if (!r) return r.error();
    p.set = std::move(*r);
    p.install = q;
    p.as_read = std::move(keep);
    return Ok{};
}

Effects apply(AppState& s, Intents intents) {
    Effects fx;
    Apply one{s, fx};
    for (Intent& i : intents) {
        std::visit(one, i);
        normalise(s);  // each intent sees a consistent state (e.g. StepColorBy after SetCompare)
    }
    return fx;
}

}  // namespace ellipsa::viewer
