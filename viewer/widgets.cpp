#include "viewer/widgets.hpp"

#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "exports/figure_text.hpp"

namespace ellipsa::viewer {

void help_marker(const char* text) {
    ImGui::SameLine();
    ImGui::TextDisabled("(?)");
    if (ImGui::IsItemHovered()) {
        ImGui::BeginTooltip();
        ImGui::PushTextWrapPos(ImGui::GetFontSize() * 28);
        ImGui::TextUnformatted(text);
        ImGui::PopTextWrapPos();
        ImGui::EndTooltip();
    }
}

std::vector<std::string> word_lines(const std::string& text, float width, const std::function<float(const std::string&)>& measure) {
    std::vector<std::string> lines;
    std::string line, word;
    auto put = [&] {
        if (word.empty()) return;
        const std::string joined = line.empty() ? word : line + " " + word;
        if (!line.empty() && measure(joined) > width) {
            lines.push_back(line);
            line = word;
        } else {
            line = joined;
        }
        word.clear();
    };
    for (char ch : text) {
        if (ch == ' ' || ch == '\n') {
            put();
            if (ch == '\n') lines.push_back(line), line.clear();
        } else {
            word += ch;
        }
    }
    put();
    if (!line.empty() || lines.empty()) lines.push_back(line);
    return lines;
}

void text_wrapped_at_spaces(const std::string& text, bool disabled) {
    const float width = std::max(1.0f, ImGui::GetContentRegionAvail().x);
    const auto measure = [](const std::string& t) { return ImGui::CalcTextSize(t.c_str()).x; };
    for (const std::string& l : word_lines(text, width, measure)) {
        if (disabled) ImGui::TextDisabled("%s", l.c_str());
        else ImGui::TextUnformatted(l.c_str());
    }
}

void table_row(const char* label, const std::string& value, const char* tip) {
    ImGui::TableNextRow();
    ImGui::TableSetColumnIndex(0);
    ImGui::TextDisabled("%s", label);
    if (tip && ImGui::IsItemHovered()) ImGui::SetTooltip("%s", tip);
    ImGui::TableSetColumnIndex(1);
    text_wrapped_at_spaces(value, false);  // a long value wraps inside its column, never inside a number
}

bool begin_figure_table(const char* id, bool row_bg) {
    if (!ImGui::BeginTable(id, 2, row_bg ? ImGuiTableFlags_RowBg : 0)) return false;
    ImGui::TableSetupColumn("label", ImGuiTableColumnFlags_WidthFixed);
    ImGui::TableSetupColumn("value", ImGuiTableColumnFlags_WidthStretch);
    return true;
}

Intents export_outcome_line(const std::optional<ExportOutcome>& o, ExportTarget target) {
    Intents in;
    if (!o) return in;
    ImGui::PushTextWrapPos(0);
    switch (o->status) {
    case ExportOutcome::Status::written: ImGui::TextDisabled("Wrote %s", o->path.c_str()); break;
    case ExportOutcome::Status::failed: ImGui::TextWrapped("Export failed: %s", o->error.c_str()); break;
    case ExportOutcome::Status::exists:
        ImGui::TextWrapped("%s is already there.", o->path.c_str());
        if (ImGui::SmallButton("Replace it")) {
            if (target == ExportTarget::view) in.push_back(intent::ExportView{o->path, true});
            else in.push_back(intent::ExportCut{o->path, true});
        }
        ImGui::SameLine();
        if (ImGui::SmallButton("Keep it")) in.push_back(intent::DismissExport{target});
        break;
    }
    ImGui::PopTextWrapPos();
    return in;
}

std::string db_text(double v, const std::string& unit) {
    if (!std::isfinite(v)) return v < 0 ? exports::level_text(v, 2, unit) : "n/a";
    char b[64];
    std::snprintf(b, sizeof b, "%.2f %s", v, unit.c_str());
    return b;
}

namespace {
bool continuation(char c) { return (static_cast<unsigned char>(c) & 0xC0) == 0x80; }
}  // namespace

std::string elide_middle(const std::string& text, float width) {
    if (ImGui::CalcTextSize(text.c_str()).x <= width) return text;
    const std::string dots = "\u2026";
    const float room = width - ImGui::CalcTextSize(dots.c_str()).x;
    std::size_t tail = text.size();  // the end: grow it back from the last character
    while (tail > 0) {
        std::size_t t = tail - 1;
        while (t > 0 && continuation(text[t])) --t;
        if (ImGui::CalcTextSize(text.c_str() + t).x > room * 2 / 3) break;
        tail = t;
    }
    std::size_t head = 0;  // the start, in the room the end left
    const float left = room - ImGui::CalcTextSize(text.c_str() + tail).x;
    while (head < tail) {
        std::size_t h = head + 1;
        while (h < tail && continuation(text[h])) ++h;
        if (ImGui::CalcTextSize(text.c_str(), text.c_str() + h).x > left) break;
        head = h;
    }
    return text.substr(0, head) + dots + text.substr(tail);
}

}  // namespace ellipsa::viewer
