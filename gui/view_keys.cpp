// The keys view: the key-by-key comparison of two or more tunings. The comparison engine is
// not in core yet, so the view says so instead of computing anything itself.
#include "gui/views.hpp"

namespace terzo::gui {

void draw_keys_view(App& app) {
    ImGui::Spacing();
    ImGui::TextColored(ImVec4(1.0f, 0.8f, 0.4f, 1.0f), "The keys view is not built yet.");
    ImGui::TextWrapped("It will compare the open tunings key by key (every key's fifths, thirds and resultant fit) "
                       "once the comparison is in core. %zu tuning(s) are open now.", app.session.tunings.size());
}

} // namespace terzo::gui
