#include "gui/style.hpp"

#include <cstdio>
#include <string>

#include <imgui.h>

#include "gui/app.hpp"
#include "gui/colours.hpp"

namespace terzo::gui {

void set_up_imgui() {
    ImGui::CreateContext();
    ImGuiIO& io = ImGui::GetIO();
    io.IniFilename = nullptr; // the layout is fixed; nothing to remember
    // Latin-1, general punctuation, arrows, maths operators and geometric shapes (legend symbols).
    static const ImWchar ranges[] = {0x0020, 0x00FF, 0x2010, 0x206F, 0x2190, 0x21FF, 0x2200, 0x22FF, 0x25A0, 0x25FF, 0};
    const std::string font = asset("fonts/DejaVuSans.ttf").string();
    // Glyphs rendered once at their screen size and placed on whole pixels, so that the
    // atlas can be sampled without filtering (gl_render.hpp); lines are smoothed by their
    // geometry, not by filtering the atlas.
    ImFontConfig config;
    config.OversampleH = 1;
    config.OversampleV = 1;
    config.PixelSnapH = true;
    if (!io.Fonts->AddFontFromFileTTF(font.c_str(), 16.0f, &config, ranges)) {
        std::fprintf(stderr, "terzo-gui: warning: %s not found; using ImGui's built-in font\n", font.c_str());
        io.Fonts->AddFontDefault();
    }
    ImGui::StyleColorsDark();
    ImGuiStyle& s = ImGui::GetStyle();
    s.WindowRounding = 0.0f;
    s.FrameRounding = 3.0f;
    s.AntiAliasedLinesUseTex = false;
    s.Colors[ImGuiCol_WindowBg] = ImGui::ColorConvertU32ToFloat4(pane_colour);
    s.Colors[ImGuiCol_TitleBg] = s.Colors[ImGuiCol_TitleBgActive] = ImVec4(0.16f, 0.22f, 0.30f, 1.0f);
    s.Colors[ImGuiCol_Tab] = ImVec4(0.18f, 0.22f, 0.28f, 1.0f);
    s.Colors[ImGuiCol_TabActive] = ImVec4(0.27f, 0.45f, 0.66f, 1.0f);
}

} // namespace terzo::gui
