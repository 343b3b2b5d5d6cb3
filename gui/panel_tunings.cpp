// The tunings panel: the open tunings (click to switch), open/close/export, and the current
// tuning's degrees.
#include <filesystem>
#include <string>

#include <imgui.h>
#include <imgui_stdlib.h>

#include "core/error.hpp"
#include "core/format.hpp"
#include "core/tuning/recipe.hpp"
#include "gui/views.hpp"

namespace terzo::gui {

void draw_tunings_panel(App& app) {
    auto& tunings = app.session.tunings;
    if (ImGui::Button("Open...")) app.dialog.show(FileDialog::Mode::open, FileDialog::Purpose::open_tuning, ".scl", std::filesystem::current_path());
    ImGui::SameLine();
    ImGui::BeginDisabled(tunings.empty());
    if (ImGui::Button("Close")) close_current(app);
    ImGui::SameLine();
    if (ImGui::Button("Export .scl...")) {
        std::string stem = std::filesystem::path(current_tuning(app)->source).stem().string();
        app.dialog.show(FileDialog::Mode::save, FileDialog::Purpose::export_scl, ".scl", std::filesystem::current_path(), stem + "-copy.scl");
    }
    ImGui::EndDisabled();
    ImGui::BeginChild("open_tunings", ImVec2(0, std::min(5, std::max<int>(1, int(tunings.size()))) * ImGui::GetTextLineHeightWithSpacing() + 8), true);
    for (std::size_t i = 0; i < tunings.size(); ++i) {
        std::string name = tuning_label(tunings[i].source) + "##" + std::to_string(i);
        if (ImGui::Selectable(name.c_str(), static_cast<int>(i) == app.session.current)) switch_tuning(app, static_cast<int>(i));
        if (ImGui::IsItemHovered()) ImGui::SetTooltip("%s\n%s", tunings[i].source.c_str(), tunings[i].scale.description().c_str());
    }
    if (tunings.empty()) ImGui::TextDisabled("none open");
    ImGui::EndChild();

    // Recipes: built on every keystroke (core/tuning/recipe.hpp), opened with Enter or Add.
    ImGui::SetNextItemWidth(-60);
    bool enter = ImGui::InputTextWithHint("##recipe", "recipe: equal 31, meantone 1/4 from Eb ...", &app.recipe_text, ImGuiInputTextFlags_EnterReturnsTrue);
    if (ImGui::IsItemEdited()) {
        app.recipe_preview.reset();
        app.recipe_error.clear();
        if (!app.recipe_text.empty()) {
            try {
                app.recipe_preview = build_recipe(app.recipe_text);
            } catch (const InputError& e) {
                app.recipe_error = e.what();
            }
        }
    }
    ImGui::SameLine();
    ImGui::BeginDisabled(!app.recipe_preview);
    if ((ImGui::Button("Add") || enter) && app.recipe_preview) {
        open_tuning(app, app.recipe_text);
        app.recipe_text.clear();
        app.recipe_preview.reset();
    }
    ImGui::EndDisabled();
    if (!app.recipe_error.empty()) {
        ImGui::PushTextWrapPos(0.0f);
        ImGui::TextColored(ImVec4(1.0f, 0.45f, 0.4f, 1.0f), "%s", app.recipe_error.c_str());
        ImGui::PopTextWrapPos();
    } else if (app.recipe_preview) {
        std::string cents;
        for (std::size_t i = 1; i < app.recipe_preview->size() && i < 13; ++i) cents += fixed(app.recipe_preview->degree(i).cents(), 1) + " ";
        if (app.recipe_preview->size() > 13) cents += "...";
        ImGui::PushTextWrapPos(0.0f);
        ImGui::TextDisabled("preview: %zu degrees: %s", app.recipe_preview->size(), cents.c_str());
        ImGui::PopTextWrapPos();
    }

    const SessionTuning* t = current_tuning(app);
    if (!t) return;
    ImGui::TextWrapped("%s", t->scale.description().c_str());
    ImGui::TextDisabled("%zu degrees, period %s, %s", t->scale.size(), t->scale.period().str().c_str(),
                        t->scale.is_rational() ? "all just" : t->scale.is_exact() ? "exact" : "some cents-only");
    if (ImGui::BeginTable("degrees", 3, ImGuiTableFlags_RowBg | ImGuiTableFlags_BordersInnerV | ImGuiTableFlags_ScrollY, ImVec2(0, ImGui::GetContentRegionAvail().y))) {
        ImGui::TableSetupScrollFreeze(0, 1);
        ImGui::TableSetupColumn("degree", ImGuiTableColumnFlags_WidthFixed, 52);
        ImGui::TableSetupColumn("value");
        ImGui::TableSetupColumn("cents", ImGuiTableColumnFlags_WidthFixed, 80);
        ImGui::TableHeadersRow();
        auto row = [](const std::string& idx, const Pitch& p) {
            ImGui::TableNextRow();
            ImGui::TableNextColumn();
            ImGui::TextUnformatted(idx.c_str());
            ImGui::TableNextColumn();
            ImGui::TextUnformatted(p.is_exact() ? p.str().c_str() : "~ (cents only)");
            ImGui::TableNextColumn();
            ImGui::TextUnformatted(fixed(p.cents(), 3).c_str());
        };
        for (std::size_t i = 0; i < t->scale.size(); ++i) row(std::to_string(i), t->scale.degree(i));
        row("period", t->scale.period());
        ImGui::EndTable();
    }
}

} // namespace terzo::gui
