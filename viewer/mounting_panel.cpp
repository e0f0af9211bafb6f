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
}  // namespace

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
