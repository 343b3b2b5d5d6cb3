// Listening. Synthesis belongs in core/sound, which this build does not have yet, so the
// control is shown disabled with the hearing-safety caution it will carry.
#include "gui/views.hpp"

namespace terzo::gui {

void draw_listen_panel(App& app) {
    ImGui::TextColored(ImVec4(1.0f, 0.75f, 0.35f, 1.0f), "Hearing safety");
    ImGui::TextWrapped("Combination tones are heard best when loud, and loud sound harms hearing. "
                       "Start quietly, keep the level moderate, and stop if a sound is uncomfortable.");
    ImGui::BeginDisabled(true);
    float v = static_cast<float>(app.session.volume);
    ImGui::SliderFloat("volume", &v, 0.0f, 1.0f, "%.2f");
    ImGui::Button("Play selection (Space)");
    ImGui::EndDisabled();
    ImGui::TextDisabled("Listening is not built yet: no synthesis in core.");
}

} // namespace terzo::gui
