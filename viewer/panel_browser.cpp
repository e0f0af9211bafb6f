// The in-window file browser (File > Open when the desktop has no dialog, or File > Open in this
// window): a folder's listing (Derived::folder, viewer/scene/file_browser.hpp) with type-to-filter,
// arrows to move, Enter to open a file or go into a folder, Backspace on an empty filter to go up
// a folder, Esc to close; recent folders from the recent files; CSV and map files or every file.
// A .map file chosen here becomes the column map for the next file opened.
#include <imgui.h>

#include <algorithm>
#include <cstdio>
#include <cstdlib>

#include "viewer/panels.hpp"
#include "viewer/scene/file_browser.hpp"

namespace ellipsa::viewer {

namespace {
bool key(ImGuiKey k) { return ImGui::IsKeyPressed(ImGui::GetKeyIndex(k), true); }

// Go into a folder (the filter and selection start afresh).
BrowserView into(const BrowserView& b, const std::string& folder) {
    BrowserView n = b;
    n.folder = folder;
    n.typed.clear();
    n.selected = 0;
    return n;
}

// Enter or a double click on an entry: into a folder, or open the file (a map file sets the map).
void activate(const BrowserView& b, const FolderListing& l, const FolderEntry& e, Intents& in) {
    const std::string path = join_path(l.folder, e.name);
    if (e.folder) {
        in.push_back(intent::ShowBrowser{into(b, path)});
        return;
    }
    if (is_map_file_name(e.name)) in.push_back(intent::EditMap{path});
    else in.push_back(intent::OpenFiles{{path}, ""});
    in.push_back(intent::ShowBrowser{std::nullopt});
}

// The folder line: Up, Home, recent folders, the folder itself.
void folder_row(const AppState& s, const BrowserView& b, const FolderListing& l, Intents& in) {
    if (ImGui::Button("Up")) in.push_back(intent::ShowBrowser{into(b, parent_folder(l.folder))});
    if (ImGui::IsItemHovered()) ImGui::SetTooltip("The folder above (Backspace)");
    ImGui::SameLine();
    if (const char* home = std::getenv("HOME"); home && *home && ImGui::Button("Home")) in.push_back(intent::ShowBrowser{into(b, home)});
    ImGui::SameLine();
    const std::vector<std::string> recent = recent_folders(s.settings.recent_files, 8);
    ImGui::SetNextItemWidth(-1);
    if (ImGui::BeginCombo("##where", l.folder.c_str(), ImGuiComboFlags_HeightLarge)) {
        if (recent.empty()) ImGui::TextDisabled("(no recent folders yet)");
        for (const std::string& f : recent)
            if (ImGui::Selectable(f.c_str(), f == l.folder)) in.push_back(intent::ShowBrowser{into(b, f)});
        ImGui::EndCombo();
    }
    if (ImGui::IsItemHovered()) ImGui::SetTooltip("Recent folders (those of the recent files)");
}

// The filter field and the keys that act on the list.
void filter_row(const BrowserView& b, const FolderListing& l, const std::vector<std::size_t>& m, Intents& in) {
    char buf[256];
    std::snprintf(buf, sizeof buf, "%s", b.typed.c_str());
    if (ImGui::IsWindowAppearing()) ImGui::SetKeyboardFocusHere();
    ImGui::SetNextItemWidth(-1);
    const bool enter = ImGui::InputTextWithHint("##typed", "type to filter; arrows, Enter, Backspace = up", buf, sizeof buf,
                                                ImGuiInputTextFlags_EnterReturnsTrue);
    if (ImGui::IsItemDeactivated() || enter) ImGui::SetKeyboardFocusHere(-1);  // keep typing after Enter
    BrowserView n = b;
    if (b.typed != buf) n.typed = buf, n.selected = 0;
    const int count = int(m.size());
    if (key(ImGuiKey_DownArrow)) n.selected = std::min(count - 1, n.selected + 1);
    if (key(ImGuiKey_UpArrow)) n.selected = std::max(0, n.selected - 1);
    if (key(ImGuiKey_Backspace) && b.typed.empty()) n = into(b, parent_folder(l.folder));
    if (enter && n.selected < count) {
        activate(b, l, l.entries[m[std::size_t(n.selected)]], in);
        return;
    }
    if (!(n == b)) in.push_back(intent::ShowBrowser{n});
}

void entry_list(const BrowserView& b, const FolderListing& l, const std::vector<std::size_t>& m, Intents& in) {
    const float foot = ImGui::GetFrameHeightWithSpacing() * 2 + 4;
    ImGui::BeginChild("entries", ImVec2(0, -foot), true);
    if (!l.error.empty()) ImGui::TextWrapped("%s", l.error.c_str());
    else if (m.empty()) ImGui::TextDisabled(b.typed.empty() ? "No CSV or map files here." : "Nothing matches.");
    ImGuiListClipper clip;  // a folder of 100 000 files draws only the visible rows
    clip.Begin(int(m.size()));
    while (clip.Step())
        for (int r = clip.DisplayStart; r < clip.DisplayEnd; ++r) {
            const FolderEntry& e = l.entries[m[std::size_t(r)]];
            const std::string label = e.folder ? e.name + "/" : e.name;
            if (ImGui::Selectable(label.c_str(), r == b.selected, ImGuiSelectableFlags_AllowDoubleClick)) {
                if (ImGui::IsMouseDoubleClicked(0)) activate(b, l, e, in);
                else if (r != b.selected) {
                    BrowserView n = b;
                    n.selected = r;
                    in.push_back(intent::ShowBrowser{n});
                }
            }
        }
    // Keep the keyboard's selection in sight.
    const float row = ImGui::GetTextLineHeightWithSpacing(), y = float(b.selected) * row;
    if (key(ImGuiKey_DownArrow) || key(ImGuiKey_UpArrow)) {
        if (y < ImGui::GetScrollY()) ImGui::SetScrollY(y);
        else if (y + row > ImGui::GetScrollY() + ImGui::GetWindowHeight() - 2 * row) ImGui::SetScrollY(y + 2 * row - ImGui::GetWindowHeight());
    }
    ImGui::EndChild();
}

void footer(const BrowserView& b, const FolderListing& l, const std::vector<std::size_t>& m, Intents& in) {
    BrowserView n = b;
    const char* filters[] = {"CSV and map files (*.csv, *.map)", "All files"};
    int f = b.all_files ? 1 : 0;
    // As wide as its longer text and the arrow, so the choice shown is never cut off.
    ImGui::SetNextItemWidth(ImGui::CalcTextSize(filters[0]).x + ImGui::GetFrameHeight() + 2 * ImGui::GetStyle().FramePadding.x);
    if (ImGui::Combo("##filter", &f, filters, 2)) n.all_files = f == 1, n.selected = 0;
    ImGui::SameLine();
    ImGui::Checkbox("hidden", &n.hidden);
    if (l.truncated) {
        ImGui::SameLine();
        ImGui::TextDisabled("first %zu entries only", l.scanned);
    }
    if (!(n == b)) in.push_back(intent::ShowBrowser{n});
    const bool can_open = b.selected < int(m.size());
    if (ImGui::Button("Open", ImVec2(90, 0)) && can_open) activate(b, l, l.entries[m[std::size_t(b.selected)]], in);
    ImGui::SameLine();
    if (ImGui::Button("Cancel", ImVec2(90, 0)) || key(ImGuiKey_Escape)) in.push_back(intent::ShowBrowser{std::nullopt});
}
}  // namespace

Intents draw_file_browser(const AppState& s, const Derived& d) {
    Intents in;
    if (!s.browser) return in;
    const BrowserView& b = *s.browser;
    const FolderListing& l = d.folder.value();
    const ImVec2 ds = ImGui::GetIO().DisplaySize;
    const ImVec2 size(std::min(720.0f, ds.x * 0.92f), std::min(520.0f, ds.y * 0.86f));
    ImGui::SetNextWindowPos(ImVec2((ds.x - size.x) * 0.5f, (ds.y - size.y) * 0.5f), ImGuiCond_Appearing);
    ImGui::SetNextWindowSize(size, ImGuiCond_Appearing);
    bool open = true;
    if (!ImGui::Begin("Open a far-field pattern", &open, ImGuiWindowFlags_NoCollapse)) {
        ImGui::End();
        return in;
    }
    const std::vector<std::size_t> m = matching_entries(l, b.typed);
    folder_row(s, b, l, in);
    filter_row(b, l, m, in);
    entry_list(b, l, m, in);
    footer(b, l, m, in);
    ImGui::End();
    if (!open) in.push_back(intent::ShowBrowser{std::nullopt});
    return in;
}

}  // namespace ellipsa::viewer
