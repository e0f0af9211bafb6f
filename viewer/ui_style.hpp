// The look of every ImGui surface we draw (window and snapshots): the bundled DejaVu Sans font
// and a calm, light, print-friendly palette of our own.
#pragma once


struct ImFont;

namespace ellipsa::viewer {

struct UiFonts {
    ImFont* body = nullptr;   // 15 px (times scale)
    ImFont* small = nullptr;  // 13 px
    ImFont* title = nullptr;  // 18 px
};

// Load the embedded font into the current ImGui context's atlas and set our colours and spacing.
// Call after ImGui::CreateContext() and before the renderer backend builds the font texture.
UiFonts setup_ui_style(float scale = 1.0f);

// The panel colour. The window clears the framebuffer to it and draws the tiled panels without a
// background of their own: a clear is far cheaper than blended fragments for llvmpipe.
inline constexpr float panel_rgb[3] = {0.95f, 0.95f, 0.94f};

}  // namespace ellipsa::viewer
