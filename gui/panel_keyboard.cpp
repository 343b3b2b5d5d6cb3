// The keyboard strip: every note of the keyboard (span periods and the closing note) as a key
// across the width of the view; click a key to add or remove its note from the selection, so
// chords can span periods. The keys share the width exactly, so a keyboard of 88 keys or more
// fits without scrolling, and each key is one flat rectangle (cheap on software OpenGL); keys
// narrower than 3 pixels are drawn a pixel column at a time.
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
    auto fill_of = [&](std::size_t first, std::size_t last) { // keys first..last share one mark
        bool on = false, period = false, mouse = false;
        for (std::size_t i = first; i <= last; ++i) {
            on = on || std::find(sel.begin(), sel.end(), static_cast<int>(i)) != sel.end();
            period = period || notes[i].degree == 0;
            mouse = mouse || static_cast<int>(i) == under_mouse;
        }
        if (on) return node_selected_colour;
        if (mouse) return strip_hover_colour;
        return period ? strip_period_key_colour : strip_key_colour;
    };
    if (pitch >= 3.0f) {
        const bool labels = pitch >= 18.0f;
        for (std::size_t i = 0; i < notes.size(); ++i) {
            const ImVec2 p0(std::round(origin.x + pitch * static_cast<float>(i)), origin.y);
            const ImVec2 p1(std::max(p0.x + 1.0f, std::round(origin.x + pitch * static_cast<float>(i + 1)) - gap), origin.y + height);
            dl->AddRectFilled(p0, p1, fill_of(i, i));
            if (labels) {
                const std::string label = std::to_string(notes[i].degree);
                const ImVec2 ts = ImGui::CalcTextSize(label.c_str());
                dl->AddText(ImVec2(std::round((p0.x + p1.x - ts.x) * 0.5f), std::round(p0.y + (height - ts.y) * 0.5f)),
                            IM_COL32(230, 232, 236, 255), label.c_str());
            }
        }
    } else {
        // Keys narrower than 3 pixels (a big tuning over several periods): one mark per pixel
        // column, showing the most telling of its keys (selected, under the mouse, a period's
        // first degree), and runs of equal columns drawn as one rectangle. However many keys,
        // the strip stays a few hundred shapes.
        const int columns = static_cast<int>(width);
        int run_start = 0;
        ImU32 run_colour = 0;
        for (int x = 0; x <= columns; ++x) {
            ImU32 c = 0;
            if (x < columns) {
                const auto first = static_cast<std::size_t>(std::floor(static_cast<float>(x) / pitch));
                const auto last = std::min(notes.size() - 1, static_cast<std::size_t>(std::floor((static_cast<float>(x) + 0.999f) / pitch)));
                c = fill_of(std::min(first, notes.size() - 1), last);
            }
            if (x == columns || c != run_colour) {
                if (x > run_start && run_colour != 0)
                    dl->AddRectFilled(ImVec2(origin.x + static_cast<float>(run_start), origin.y),
                                      ImVec2(origin.x + static_cast<float>(x), origin.y + height), run_colour);
                run_start = x;
                run_colour = c;
            }
        }
    }
    if (under_mouse >= 0) {
        const Note& nt = notes[static_cast<std::size_t>(under_mouse)];
        ImGui::SetTooltip("%s: %.3f Hz", note_label(*a.keyboard, nt.degree, nt.period).c_str(), nt.hz);
    }
}

} // namespace terzo::gui
