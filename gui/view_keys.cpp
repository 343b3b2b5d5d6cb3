// The keys view: the open tunings compared key by key (from core/analysis/compare.hpp, the
// tables of core/report/compare_report.hpp): a summary across tunings, wolves, the current
// tuning's 24 triads, and the interval classes of any tuning.
#include <filesystem>

#include "core/format.hpp"
#include "gui/table_view.hpp"
#include "gui/views.hpp"

namespace terzo::gui {

void draw_keys_view(App& app) {
    const Analysis& a = app.analysis;
    SessionSettings& s = app.session.settings;
    ImGui::SetNextItemWidth(120);
    static char ref[32];
    if (!ImGui::IsAnyItemActive()) std::snprintf(ref, sizeof ref, "%s", s.pitch_reference.c_str());
    if (ImGui::InputText("pitch reference (NOTE=HZ; degree 0 is C)", ref, sizeof ref, ImGuiInputTextFlags_EnterReturnsTrue)) {
        try {
            parse_pitch_reference(ref, {"pitch reference", 0, 0});
            s.pitch_reference = ref;
            touch(app);
        } catch (const InputError& e) {
            app.error = e.what();
        }
    }
    if (!a.comparison_error.empty()) {
        ImGui::TextColored(ImVec4(1.0f, 0.45f, 0.4f, 1.0f), "%s", a.comparison_error.c_str());
        return;
    }
    if (a.comparison.empty()) {
        ImGui::TextUnformatted("Open tunings to compare them: File > Open tuning... (Ctrl+O).");
        return;
    }
    bool any12 = false;
    for (const auto& c : a.comparison) any12 = any12 || c.keys.has_value();
    ImGui::BeginChild("keys_scroll");
    if (any12) {
        ImGui::TextDisabled("|cents| from pure over the 24 major and minor triads; fit = resultant fit (order %d)", s.max_order);
        draw_table("summary", summary_table(a.comparison));
        Table w = wolves_table(a.comparison, Spelling::mixed);
        ImGui::Text("Wolves (fifths beyond %s c, thirds beyond %s c from pure): %s", fixed(wolf_fifth_cents, 3).c_str(),
                    fixed(wolf_third_cents, 3).c_str(), w.rows.empty() ? "none" : "");
        if (!w.rows.empty()) draw_table("wolves", w);
    } else {
        ImGui::TextWrapped("The key-by-key comparison needs 12-note tunings (open some from scales/, or recipes). "
                           "The interval classes below work for any size.");
    }
    std::size_t cur = static_cast<std::size_t>(app.session.current);
    if (cur < a.comparison.size()) {
        const ComparedTuning& c = a.comparison[cur];
        if (c.keys && ImGui::CollapsingHeader(("Keys of " + c.name + "##keys").c_str(), ImGuiTreeNodeFlags_DefaultOpen))
            draw_table("keys_current", key_table(*c.keys, Spelling::mixed));
        if (ImGui::CollapsingHeader("Interval classes of the open tunings (nearest ratio of odd limit 7)"))
            draw_table("classes", classes_table(a.comparison));
    }
    ImGui::EndChild();
}

} // namespace terzo::gui
