#include "gui/table_view.hpp"

#include <imgui.h>

namespace terzo::gui {

void draw_table(const char* id, const Table& t, float height) {
    const int cols = static_cast<int>(t.header.size());
    if (cols == 0 || cols > 64) return; // ImGui tables take at most 64 columns
    ImGuiTableFlags flags = ImGuiTableFlags_RowBg | ImGuiTableFlags_BordersInnerV | ImGuiTableFlags_SizingFixedFit;
    if (height > 0) flags |= ImGuiTableFlags_ScrollY | ImGuiTableFlags_ScrollX;
    if (!ImGui::BeginTable(id, cols, flags, ImVec2(0, height))) return;
    ImGui::TableSetupScrollFreeze(1, 1);
    for (const std::string& h : t.header) ImGui::TableSetupColumn(h.c_str());
    ImGui::TableHeadersRow();
    // Only the rows in view are drawn: a table may have hundreds (interval classes of a
    // 256-note tuning) and every glyph is four vertices.
    ImGuiListClipper clipper;
    clipper.Begin(static_cast<int>(t.rows.size()));
    while (clipper.Step()) {
        for (int r = clipper.DisplayStart; r < clipper.DisplayEnd; ++r) {
            const auto& row = t.rows[static_cast<std::size_t>(r)];
            ImGui::TableNextRow();
            for (int c = 0; c < cols && c < static_cast<int>(row.size()); ++c) {
                ImGui::TableSetColumnIndex(c);
                const std::string& cell = row[static_cast<std::size_t>(c)];
                bool right = c < static_cast<int>(t.align.size()) && t.align[static_cast<std::size_t>(c)] == Table::Align::right;
                if (right) {
                    float w = ImGui::CalcTextSize(cell.c_str()).x;
                    float avail = ImGui::GetColumnWidth();
                    if (avail > w) ImGui::SetCursorPosX(ImGui::GetCursorPosX() + avail - w - ImGui::GetStyle().CellPadding.x);
                }
                ImGui::TextUnformatted(cell.c_str());
            }
        }
    }
    ImGui::EndTable();
}

} // namespace terzo::gui
