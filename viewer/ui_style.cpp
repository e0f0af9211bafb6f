#include "viewer/ui_style.hpp"

#include <imgui.h>

#include "exports/font_data.hpp"

namespace ellipsa::viewer {

UiFonts setup_ui_style(float scale) {
    ImGuiIO& io = ImGui::GetIO();
    UiFonts f;
    const exports::FontBytes ttf = exports::bundled_font_bytes(exports::FontWeight::regular);
    if (ttf.size > 0) {
        ImFontConfig cfg;
        cfg.FontDataOwnedByAtlas = false;  // the bytes live in the executable
        cfg.OversampleH = 2;
        static const ImWchar ranges[] = {0x0020, 0x00FF, 0x0370, 0x03FF, 0x2010, 0x2030, 0x2190, 0x21FF, 0x2200, 0x22FF, 0};
        void* data = const_cast<unsigned char*>(ttf.data);
        f.body = io.Fonts->AddFontFromMemoryTTF(data, int(ttf.size), 15.0f * scale, &cfg, ranges);
        f.small = io.Fonts->AddFontFromMemoryTTF(data, int(ttf.size), 13.0f * scale, &cfg, ranges);
        f.title = io.Fonts->AddFontFromMemoryTTF(data, int(ttf.size), 18.0f * scale, &cfg, ranges);
    } else {
        f.body = f.small = f.title = io.Fonts->AddFontDefault();
    }

    ImGuiStyle& s = ImGui::GetStyle();
    ImGui::StyleColorsLight(&s);
    s.WindowRounding = 3;
    s.FrameRounding = 3;
    s.GrabRounding = 3;
    s.WindowBorderSize = 1;
    s.FrameBorderSize = 1;
    s.WindowPadding = ImVec2(10, 8);
    s.FramePadding = ImVec2(6, 3);
    s.ItemSpacing = ImVec2(8, 5);
    s.ScrollbarSize = 12;
    ImVec4* c = s.Colors;
    const ImVec4 ink(0.13f, 0.15f, 0.18f, 1), paper(0.975f, 0.975f, 0.965f, 1), panel(panel_rgb[0], panel_rgb[1], panel_rgb[2], 1);
    const ImVec4 accent(0.16f, 0.36f, 0.55f, 1), accent_soft(0.16f, 0.36f, 0.55f, 0.18f);
    c[ImGuiCol_Text] = ink;
    c[ImGuiCol_TextDisabled] = ImVec4(0.45f, 0.47f, 0.50f, 1);
    c[ImGuiCol_WindowBg] = panel;
    c[ImGuiCol_ChildBg] = ImVec4(0, 0, 0, 0);  // children show their panel's colour
    c[ImGuiCol_PopupBg] = paper;
    c[ImGuiCol_Border] = ImVec4(0.78f, 0.78f, 0.76f, 1);
    c[ImGuiCol_FrameBg] = ImVec4(1, 1, 1, 1);
    c[ImGuiCol_FrameBgHovered] = ImVec4(0.92f, 0.95f, 0.98f, 1);
    c[ImGuiCol_FrameBgActive] = ImVec4(0.86f, 0.91f, 0.96f, 1);
    c[ImGuiCol_TitleBg] = ImVec4(0.88f, 0.89f, 0.88f, 1);
    c[ImGuiCol_TitleBgActive] = ImVec4(0.82f, 0.85f, 0.87f, 1);
    c[ImGuiCol_TitleBgCollapsed] = ImVec4(0.88f, 0.89f, 0.88f, 1);
    c[ImGuiCol_MenuBarBg] = ImVec4(0.91f, 0.91f, 0.90f, 1);
    c[ImGuiCol_CheckMark] = accent;
    c[ImGuiCol_SliderGrab] = ImVec4(0.35f, 0.50f, 0.65f, 1);
    c[ImGuiCol_SliderGrabActive] = accent;
    c[ImGuiCol_Button] = ImVec4(0.90f, 0.91f, 0.91f, 1);
    c[ImGuiCol_ButtonHovered] = ImVec4(0.84f, 0.89f, 0.94f, 1);
    c[ImGuiCol_ButtonActive] = ImVec4(0.76f, 0.84f, 0.92f, 1);
    c[ImGuiCol_Header] = accent_soft;
    c[ImGuiCol_HeaderHovered] = ImVec4(0.16f, 0.36f, 0.55f, 0.26f);
    c[ImGuiCol_HeaderActive] = ImVec4(0.16f, 0.36f, 0.55f, 0.34f);
    c[ImGuiCol_Separator] = ImVec4(0.80f, 0.80f, 0.78f, 1);
    c[ImGuiCol_Tab] = ImVec4(0.88f, 0.89f, 0.88f, 1);
    c[ImGuiCol_TabHovered] = ImVec4(0.84f, 0.89f, 0.94f, 1);
    c[ImGuiCol_TabActive] = paper;
    return f;
}

}  // namespace ellipsa::viewer
