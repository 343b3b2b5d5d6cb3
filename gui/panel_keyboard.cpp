// The keyboard strip: every note of the keyboard (span periods and the closing note) as a small
// key; click to add or remove it from the selection, so chords can span periods.
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
    float avail = ImGui::GetContentRegionAvail().x;
    float w = std::clamp(avail / static_cast<float>(notes.size()) - 2.0f, 8.0f, 34.0f);
    ImGui::PushStyleVar(ImGuiStyleVar_ItemSpacing, ImVec2(2, 2));
    for (std::size_t i = 0; i < notes.size(); ++i) {
        const Note& nt = notes[i];
        bool on = std::find(sel.begin(), sel.end(), static_cast<int>(i)) != sel.end();
        ImGui::PushID(static_cast<int>(i));
        ImVec4 base = nt.degree == 0 ? ImVec4(0.36f, 0.40f, 0.50f, 1) : ImVec4(0.22f, 0.25f, 0.32f, 1);
        ImGui::PushStyleColor(ImGuiCol_Button, on ? ImGui::ColorConvertU32ToFloat4(node_selected_colour) : base);
        std::string label = w >= 18 ? std::to_string(nt.degree) : "";
        if (ImGui::Button(label.c_str(), ImVec2(w, 30))) toggle_note(app, static_cast<int>(i));
        if (ImGui::IsItemHovered())
            ImGui::SetTooltip("%s: %.3f Hz", note_label(*a.keyboard, nt.degree, nt.period).c_str(), nt.hz);
        ImGui::PopStyleColor();
        ImGui::PopID();
        if (i + 1 < notes.size()) ImGui::SameLine();
    }
    ImGui::PopStyleVar();
}

} // namespace terzo::gui
