// The mounting control of the Patterns panel: which axis of A's file points up, and turns about
// the world axes (pattern/mounting.hpp, the semantics of --up and --rotate). A change goes out as
// SetMounting; apply() installs the pattern again through install_pattern, once.
#include <imgui.h>

#include <cstdio>

#include "exports/figure_text.hpp"
#include "viewer/panels.hpp"
#include "viewer/widgets.hpp"

namespace ellipsa::viewer {

namespace {
// The combo's text for an up direction: the file's own (none), a preset axis, or a direction.
std::string up_label(const std::optional<Vec3>& up, const Mounting& file_mounting) {
    if (!up) return is_identity(file_mounting) ? "as in the file (+z up)" : "as the file declares (" + format_up(file_mounting.up) + " up)";
    return format_up(*up) + " of the file points up";
}

void up_combo(const LoadedPattern& p, int index, const std::vector<AxisTurn>& turns, Intents& in) {
    const Mounting& own = p.set.file_mounting;
    ImGui::SetNextItemWidth(-1);
    if (!ImGui::BeginCombo("##up", up_label(p.install.up, own).c_str())) return;
    if (ImGui::Selectable(up_label(std::nullopt, own).c_str(), !p.install.up))
        in.push_back(intent::SetMounting{index, std::nullopt, turns});
    for (const char* axis : intent::mounting_up_presets) {
        const Vec3 up = *parse_up(axis);
        const bool chosen = p.install.up && format_up(*p.install.up) == axis;
        if (ImGui::Selectable(up_label(up, own).c_str(), chosen)) in.push_back(intent::SetMounting{index, up, turns});
    }
    ImGui::EndCombo();
}

// The turns field: "z:30,x:10", applied with Enter or the button; a typing error is shown, not sent.
void turns_field(const AppState& s, const LoadedPattern& p, Intents& in) {
    const std::string shown = s.turns_input ? *s.turns_input : format_turns(p.install.turns);
    char buf[256];
    std::snprintf(buf, sizeof buf, "%s", shown.c_str());
    ImGui::SetNextItemWidth(-70);
    const bool enter = ImGui::InputTextWithHint("##turns", "turns, e.g. z:30,x:10", buf, sizeof buf,
                                                ImGuiInputTextFlags_EnterReturnsTrue);
    if (shown != buf) in.push_back(intent::EditTurns{buf});
    if (ImGui::IsItemHovered())
        ImGui::SetTooltip("Turns of the installed antenna about the world axes, applied left to right (as --rotate)");
    ImGui::SameLine();
    const bool button = ImGui::Button("Turn", ImVec2(-1, 0));
    auto turns = parse_turns(buf);
    if (!turns) {
        ImGui::PushTextWrapPos(0);
        ImGui::TextColored(ImVec4(0.55f, 0.12f, 0.08f, 1), "%s", turns.error().message.c_str());
        ImGui::PopTextWrapPos();
    } else if (enter || button) {
        in.push_back(intent::SetMounting{s.active, p.install.up, *turns});
    }
}
// The next small button beside the last item when it fits in the panel, else on the next line.
void same_line_if_fits(const char* label) {
    const float w = ImGui::CalcTextSize(label).x + 2 * ImGui::GetStyle().FramePadding.x;
    const float right = ImGui::GetItemRectMax().x + ImGui::GetStyle().ItemSpacing.x + w;
    if (right <= ImGui::GetWindowPos().x + ImGui::GetWindowContentRegionMax().x) ImGui::SameLine();
}

// Which phase reference is in use, in the words of `info` (exports::reference_shift_text).
std::string reference_label(const LoadedPattern& p, std::size_t freq) {
    const std::string moved = freq < p.set.frequencies.size() ? exports::reference_shift_text(p.set, freq) : "";
    if (p.install.reference == PhaseReference::phase_centre)
        return "at the estimated phase centre" + (moved.empty() ? std::string() : ", " + moved);
    return moved.empty() ? "at the file's origin" : moved;
}

// X, Y, Z in metres (world frame, as --phase-centre takes them) and the three choices.
void reference_controls(const AppState& s, const LoadedPattern& p, Intents& in) {
    const Vec3 shown = s.reference_input ? *s.reference_input
                       : p.install.reference == PhaseReference::point ? p.install.reference_point_m : Vec3{};
    double v[3] = {shown.x, shown.y, shown.z};
    const float w = (ImGui::GetContentRegionAvail().x - 3 * ImGui::GetStyle().ItemSpacing.x - ImGui::CalcTextSize("m").x) / 3;
    const char* ids[3] = {"##rx", "##ry", "##rz"};
    const char* names[3] = {"x", "y", "z"};
    bool changed = false;
    for (int k = 0; k < 3; ++k) {
        if (k > 0) ImGui::SameLine();
        ImGui::SetNextItemWidth(w);
        char fmt[16];
        std::snprintf(fmt, sizeof fmt, "%s %%.4f", names[k]);
        changed |= ImGui::InputDouble(ids[k], &v[k], 0, 0, fmt);
        if (ImGui::IsItemHovered()) ImGui::SetTooltip("%s of the new phase reference, metres (world frame, after the mounting)", names[k]);
    }
    ImGui::SameLine();
    ImGui::TextUnformatted("m");
    if (changed) in.push_back(intent::EditReferencePoint{Vec3{v[0], v[1], v[2]}});
    if (ImGui::SmallButton("Move here")) in.push_back(intent::SetPhaseReference{s.active, PhaseReference::point, Vec3{v[0], v[1], v[2]}});
    same_line_if_fits("Phase centre");
    if (ImGui::SmallButton("Phase centre")) in.push_back(intent::SetPhaseReference{s.active, PhaseReference::phase_centre, {}});
    if (ImGui::IsItemHovered()) ImGui::SetTooltip("Move the reference onto the estimated phase centre (as --phase-centre auto)");
    same_line_if_fits("File's origin");
    if (ImGui::SmallButton("File's origin")) in.push_back(intent::SetPhaseReference{s.active, PhaseReference::keep, {}});
}
}  // namespace

void draw_reference_section(const AppState& s, Intents& in) {
    const LoadedPattern* a = s.active_pattern();
    if (!a) return;
    // Folded by default, so the frequency and the figures below stay in view; a moved reference is
    // named under the fold all the same.
    const bool open = ImGui::TreeNodeEx("Phase reference of A", ImGuiTreeNodeFlags_SpanAvailWidth);
    ImGui::SameLine();
    help_marker("The point the phases are measured from (as --phase-centre). Moving it changes only the phase: "
                "gain, axial ratio and the cuts stay; the correlation (ECC) between two antennas changes, since "
                "it needs one common reference.");
    ImGui::PushTextWrapPos(0);
    if (open && !a->set.has_phase()) ImGui::TextDisabled("needs phase (the file is %s)", to_string(a->set.content));
    else if (open) reference_controls(s, *a, in);
    if (open) ImGui::TreePop();
    if (a->set.has_phase() && (open || a->install.reference != PhaseReference::keep))
        ImGui::TextDisabled("in use: %s", reference_label(*a, s.freq).c_str());
    if (!s.reference_error.empty())
        ImGui::TextColored(ImVec4(0.55f, 0.12f, 0.08f, 1), "Phase reference not moved: %s", s.reference_error.c_str());
    ImGui::PopTextWrapPos();
}

void draw_mounting_section(const AppState& s, Intents& in) {
    const LoadedPattern* a = s.active_pattern();
    if (!a) return;
    ImGui::TextDisabled("Mounting of A");
    ImGui::SameLine();
    help_marker("How the antenna is installed: the file's axis that points up (the world's +z, the zenith), then "
                "turns about the world axes. MEG, the vertical/horizontal split, cuts and every figure refer to "
                "the installed antenna.");
    std::vector<AxisTurn> turns = a->install.turns;  // a new up axis keeps the turns typed
    if (s.turns_input)
        if (auto t = parse_turns(*s.turns_input)) turns = *t;
    up_combo(*a, s.active, turns, in);
    turns_field(s, *a, in);
    ImGui::PushTextWrapPos(0);
    ImGui::TextDisabled("%s", exports::mounting_text(a->set).c_str());
    ImGui::PopTextWrapPos();
    if (!s.mounting_error.empty()) {
        ImGui::PushTextWrapPos(0);
        ImGui::TextColored(ImVec4(0.55f, 0.12f, 0.08f, 1), "Mounting not applied: %s", s.mounting_error.c_str());
        ImGui::PopTextWrapPos();
    }
}

}  // namespace ellipsa::viewer
