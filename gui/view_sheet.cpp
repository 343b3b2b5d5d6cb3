// The sheet view: the tuner's sheet for the current tuning and reference pitch. The sheet is
// not in core yet, so the view says so instead of computing anything itself.
#include "core/io/format.hpp"
#include "gui/views.hpp"

namespace terzo::gui {

void draw_sheet_view(App& app) {
    ImGui::Spacing();
    ImGui::TextColored(ImVec4(1.0f, 0.8f, 0.4f, 1.0f), "The sheet view is not built yet.");
    ImGui::TextWrapped("It will show the tuner's sheet (per-note offsets, beat rates, a tuning order) for the "
                       "current tuning at the reference pitch (%s Hz now) once the sheet is in core.",
                       fixed(app.session.settings.reference_hz, 3).c_str());
}

} // namespace terzo::gui
