// The sheet view: the tuner's sheet of the current 12-note tuning at the pitch reference
// (core/analysis/sheet.hpp, tables of core/report/sheet_report.hpp): notes with offsets and beat
// rates, the tuning order, the circle of fifths, and the advice every sheet carries.
#include "core/report/sheet_report.hpp"
#include "gui/table_view.hpp"
#include "gui/views.hpp"

namespace terzo::gui {

void draw_sheet_view(App& app) {
    const Analysis& a = app.analysis;
    if (!a.comparison_error.empty()) {
        ImGui::TextColored(ImVec4(1.0f, 0.45f, 0.4f, 1.0f), "%s", a.comparison_error.c_str());
        return;
    }
    if (!a.sheet) {
        ImGui::TextWrapped("%s", a.sheet_error.empty() ? "No tuning open." : a.sheet_error.c_str());
        return;
    }
    const Sheet& s = *a.sheet;
    ImGui::BeginChild("sheet_scroll");
    ImGui::PushTextWrapPos(0.0f);
    ImGui::Text("%s at %s (degree 0 on C); change the reference in the Keys view", s.description.c_str(), app.session.settings.pitch_reference.c_str());
    ImGui::TextColored(ImVec4(1.0f, 0.8f, 0.45f, 1.0f), "%s", tuning_advice);
    ImGui::PopTextWrapPos();
    if (ImGui::CollapsingHeader("Notes: Hz, cents from equal temperament, beats of the intervals rising from each", ImGuiTreeNodeFlags_DefaultOpen))
        draw_table("sheet_notes", sheet_notes_table(s));
    if (ImGui::CollapsingHeader("Tuning order", ImGuiTreeNodeFlags_DefaultOpen)) draw_table("sheet_order", sheet_order_table(s));
    if (ImGui::CollapsingHeader("Circle of fifths")) draw_table("sheet_circle", sheet_circle_table(s));
    if (ImGui::CollapsingHeader("Every checked interval")) draw_table("sheet_intervals", sheet_intervals_table(s));
    ImGui::EndChild();
}

} // namespace terzo::gui
