// The help panel: what the screen shows and the keyboard shortcuts.
#include "gui/views.hpp"

namespace terzo::gui {

void draw_help_panel(App& app) {
    if (!app.show_help) return;
    ImGuiIO& io = ImGui::GetIO();
    ImGui::SetNextWindowPos(ImVec2(io.DisplaySize.x * 0.5f, io.DisplaySize.y * 0.5f), ImGuiCond_Appearing, ImVec2(0.5f, 0.5f));
    ImGui::SetNextWindowSize(ImVec2(560, 0), ImGuiCond_Appearing);
    if (!ImGui::Begin("Help", &app.show_help, ImGuiWindowFlags_NoCollapse)) {
        ImGui::End();
        return;
    }
    ImGui::TextWrapped("terzo shows where the combination tones (resultants) of the notes you select land against the "
                       "tuning's own notes. Select two or more notes; each resultant appears on the lattice as a mark "
                       "coloured by its deviation in cents from the nearest note (the legend explains the colours).");
    ImGui::Separator();
    static const char* keys[][2] = {
        {"Ctrl+O", "open a tuning (.scl)"},        {"Ctrl+S", "save the session now"},
        {"Ctrl+E", "export the tuning as .scl"},  {"Ctrl+P", "export the lattice as PNG"},
        {"Ctrl+Tab", "next open tuning"},         {"1 2 3 4", "lattice, dyad grid, keys, sheet"},
        {"Esc", "clear the selection"},           {"Space", "play the selection (mind the volume)"},           {"+ / -", "zoom the lattice"},
        {"arrows", "pan the lattice"},            {"Home", "centre the lattice"},
        {"F1", "this help"},                      {"Ctrl+Q", "quit (the session is saved)"},
        {"mouse", "click: select; drag: pan; wheel: zoom"},
    };
    if (ImGui::BeginTable("keys", 2, ImGuiTableFlags_RowBg)) {
        ImGui::TableSetupColumn("key", ImGuiTableColumnFlags_WidthFixed, 110);
        ImGui::TableSetupColumn("action");
        for (auto& k : keys) {
            ImGui::TableNextRow();
            ImGui::TableNextColumn();
            ImGui::TextUnformatted(k[0]);
            ImGui::TableNextColumn();
            ImGui::TextUnformatted(k[1]);
        }
        ImGui::EndTable();
    }
    ImGui::Separator();
    ImGui::TextWrapped("The session (open tunings, settings, selection) is saved automatically a second after every "
                       "change, and restored at the next start.");
    ImGui::End();
}

} // namespace terzo::gui
