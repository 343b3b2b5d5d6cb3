// The selection panel: the selected notes, their resultants (every pair), where each lands,
// the selection's fit and its common resultant bass.
#include <string>

#include "core/format.hpp"
#include "gui/colours.hpp"
#include "gui/views.hpp"

namespace terzo::gui {

void draw_selection_panel(App& app) {
    const Analysis& a = app.analysis;
    if (!a.keyboard) return;
    const Keyboard& kb = *a.keyboard;
    const auto& sel = app.session.selection;
    if (sel.empty()) {
        ImGui::TextWrapped("Nothing selected. Click degrees on the lattice, cells of the dyad grid, or keys of the keyboard strip.");
        return;
    }
    for (int n : sel) {
        const Note& nt = kb.notes()[static_cast<std::size_t>(n)];
        ImGui::BulletText("%s  %s  %s Hz", note_label(kb, nt.degree, nt.period).c_str(), nt.pitch.is_exact() ? nt.pitch.str().c_str() : "~", fixed(nt.hz, 2).c_str());
    }
    if (ImGui::SmallButton("clear (Esc)")) select_notes(app, {});
    if (sel.size() < 2) {
        ImGui::TextWrapped("Select a second note to see resultants.");
        return;
    }
    if (a.selection_fit)
        ImGui::Text("fit %s c rms over %zu tones, %zu exact", fixed(a.selection_fit->rms_cents, 3).c_str(), a.selection_fit->tones, a.selection_fit->exact);
    if (a.selection_bass && a.selection_bass->found) {
        const CommonBass& b = *a.selection_bass;
        ImGui::TextWrapped("common resultant bass %s Hz%s, lands on %s %s", fixed(b.hz, 3).c_str(), b.approximate ? " (approximate)" : "",
                           note_label(kb, b.landing.degree, b.landing.period).c_str(), b.landing.exact ? "exactly" : (signed_fixed(b.landing.deviation_cents, 2) + " c").c_str());
    }
    const double tol = app.session.settings.landing_tolerance_cents;
    if (ImGui::BeginTable("tones", 4, ImGuiTableFlags_RowBg | ImGuiTableFlags_ScrollY | ImGuiTableFlags_BordersInnerV, ImVec2(0, ImGui::GetContentRegionAvail().y - 4))) {
        ImGui::TableSetupScrollFreeze(0, 1);
        ImGui::TableSetupColumn("term", ImGuiTableColumnFlags_WidthFixed, 62);
        ImGui::TableSetupColumn("Hz", ImGuiTableColumnFlags_WidthFixed, 72);
        ImGui::TableSetupColumn("lands on degree");
        ImGui::TableSetupColumn("dev. c", ImGuiTableColumnFlags_WidthFixed, 62);
        ImGui::TableHeadersRow();
        for (const DyadTones& d : a.selection_tones) {
            ImGui::TableNextRow();
            ImGui::TableNextColumn();
            ImGui::TextDisabled("dyad");
            ImGui::TableNextColumn();
            ImGui::TextDisabled("%d to %d", d.low.degree, d.high.degree);
            for (const Tone& t : d.tones) {
                ImGui::TableNextRow();
                ImGui::TableNextColumn();
                ImGui::Text("(%d,%d)", t.term.a, t.term.b);
                if (ImGui::IsItemHovered()) ImGui::SetTooltip("%s%s", t.term.name().c_str(), t.low_partial != 1 || t.high_partial != 1 ? (", partials " + std::to_string(t.low_partial) + " and " + std::to_string(t.high_partial)).c_str() : "");
                ImGui::TableNextColumn();
                ImGui::TextUnformatted(fixed(t.hz, 2).c_str());
                ImGui::TableNextColumn();
                std::string on = std::to_string(t.landing.degree);
                if (t.landing.period != 0) on += " (period " + std::to_string(t.landing.period) + ")";
                ImGui::TextUnformatted(on.c_str());
                ImGui::TableNextColumn();
                ImU32 col = deviation_colour(std::abs(t.landing.deviation_cents), t.landing.exact, tol);
                ImGui::PushStyleColor(ImGuiCol_Text, col);
                ImGui::TextUnformatted(t.landing.exact ? "exact" : signed_fixed(t.landing.deviation_cents, 2).c_str());
                ImGui::PopStyleColor();
            }
        }
        ImGui::EndTable();
    }
}

} // namespace terzo::gui
