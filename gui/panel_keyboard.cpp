// The keyboard strip: every note of the keyboard (span periods and the closing note) as a key
// across the width of the view; click a key to add or remove its note from the selection, so
// chords can span periods. The keys share the width exactly, so a keyboard of 88 keys or more
// fits without scrolling, and each key is one flat rectangle (cheap on software OpenGL).
#include <algorithm>
#include <cmath>
#include <string>

#include "gui/colours.hpp"
#include "gui/views.hpp"

namespace terzo::gui {

void draw_keyboard_strip(App& app) {
    const Analysis& a = app.analysis;
    if (!a.keyboard) return;
    const auto& notes = a.keyboard->notes();
    const auto& sel = app.session.selection;
    ImGui::TextDisabled("keyboard: click keys to select notes in any period (Esc clears)");
    const ImVec2 origin = ImGui::GetCursorScreenPos();
    const float width = std::max(ImGui::GetContentRegionAvail().x, 1.0f), height = 30.0f;
    const float pitch = width / static_cast<float>(notes.size()); // key plus gap
    const float gap = pitch >= 6.0f ? 2.0f : 1.0f;
    ImGui::InvisibleButton("keyboard_strip", ImVec2(width, height));
    const bool hovered = ImGui::IsItemHovered();
    int under_mouse = -1;
    if (hovered) {
        const float x = ImGui::GetIO().MousePos.x - origin.x;
        under_mouse = std::clamp(static_cast<int>(std::floor(x / pitch)), 0, static_cast<int>(notes.size()) - 1);
    }
    if (ImGui::IsItemClicked(ImGuiMouseButton_Left) && under_mouse >= 0) toggle_note(app, under_mouse);

    ImDrawList* dl = ImGui::GetWindowDrawList();
    const bool labels = pitch >= 18.0f;
    for (std::size_t i = 0; i < notes.size(); ++i) {
        const Note& nt = notes[i];
        const bool on = std::find(sel.begin(), sel.end(), static_cast<int>(i)) != sel.end();
        ImU32 fill = on ? node_selected_colour : nt.degree == 0 ? strip_period_key_colour : strip_key_colour;
        if (static_cast<int>(i) == under_mouse && !on) fill = IM_COL32(80, 110, 150, 255);
        const ImVec2 p0(std::round(origin.x + pitch * static_cast<float>(i)), origin.y);
        const ImVec2 p1(std::max(p0.x + 1.0f, std::round(origin.x + pitch * static_cast<float>(i + 1)) - gap), origin.y + height);
        dl->AddRectFilled(p0, p1, fill);
        if (labels) {
            const std::string label = std::to_string(nt.degree);
            const ImVec2 ts = ImGui::CalcTextSize(label.c_str());
            dl->AddText(ImVec2(std::round((p0.x + p1.x - ts.x) * 0.5f), std::round(p0.y + (height - ts.y) * 0.5f)),
                        IM_COL32(230, 232, 236, 255), label.c_str());
        }
    }
    if (under_mouse >= 0) {
        const Note& nt = notes[static_cast<std::size_t>(under_mouse)];
        ImGui::SetTooltip("%s: %.3f Hz", note_label(*a.keyboard, nt.degree, nt.period).c_str(), nt.hz);
    }
}

} // namespace terzo::gui
