// The dyad grid: one cell per dyad of one period (row: lower degree, column: upper degree,
// a period up on and left of the diagonal), coloured by its resultants' worst landing
// deviation or by its fit. Click a cell to select that dyad everywhere.
#include <cmath>
#include <string>

#include "core/format.hpp"
#include "gui/colours.hpp"
#include "gui/views.hpp"

namespace terzo::gui {

void draw_grid_view(App& app) {
    const Analysis& a = app.analysis;
    const SessionTuning* tuning = current_tuning(app);
    if (!tuning || !a.keyboard) {
        ImGui::TextUnformatted(tuning ? a.error.c_str() : "No tuning open: File > Open tuning... (Ctrl+O)");
        return;
    }
    const Keyboard& kb = *a.keyboard;
    const int n = static_cast<int>(kb.scale().size());
    SessionSettings& s = app.session.settings;
    bool by_fit = s.grid_measure == "fit";
    ImGui::TextUnformatted("colour by");
    ImGui::SameLine();
    if (ImGui::RadioButton("worst landing", !by_fit)) { s.grid_measure = "worst"; touch(app); }
    ImGui::SameLine();
    if (ImGui::RadioButton("fit (weighted rms)", by_fit)) { s.grid_measure = "fit"; touch(app); }
    ImGui::TextDisabled("rows: lower degree; columns: upper degree (a period up on and left of the diagonal)");
    if (a.grid.empty()) {
        ImGui::TextWrapped("%s", a.error.empty() ? "The grid is empty." : a.error.c_str());
        return;
    }

    ImDrawList* dl = ImGui::GetWindowDrawList();
    ImVec2 avail = ImGui::GetContentRegionAvail();
    const float legend_h = ImGui::GetTextLineHeight() * 3.6f + 10;
    const float label = 34.0f;
    float cell = std::floor(std::min((avail.x - label - 10) / n, (avail.y - label - legend_h - 10) / n));
    cell = std::clamp(cell, 6.0f, 64.0f);
    ImVec2 p0 = ImGui::GetCursorScreenPos();
    ImVec2 g0(p0.x + label, p0.y + label);
    ImGui::InvisibleButton("grid_canvas", ImVec2(label + cell * n + 4, label + cell * n + 4));
    const bool hovered = ImGui::IsItemHovered();
    const bool clicked = ImGui::IsItemClicked(ImGuiMouseButton_Left);
    const double tol = s.landing_tolerance_cents;
    const ImU32 text = IM_COL32(230, 230, 235, 255);

    // Which cell is the selected dyad (when exactly two notes of the lowest periods are selected).
    int sel_low = -1, sel_high = -1;
    if (app.session.selection.size() == 2) {
        int lo = app.session.selection[0], hi = app.session.selection[1];
        if (lo < n) {
            sel_low = lo;
            sel_high = hi;
        }
    }
    for (int i = 0; i < n; ++i) {
        std::string t = std::to_string(i);
        // Column labels need about 20 px for two digits; thin out when the cells are smaller.
        if (cell >= 22 || i % (cell >= 11 ? 2 : 4) == 0) {
            dl->AddText(ImVec2(p0.x + 4, g0.y + i * cell + cell * 0.5f - 7), text, t.c_str());
            dl->AddText(ImVec2(g0.x + i * cell + cell * 0.5f - 4, p0.y + 10), text, t.c_str());
        }
    }
    int hover_cell = -1;
    for (int idx = 0; idx < n * n; ++idx) {
        const DyadCell& c = a.grid[static_cast<std::size_t>(idx)];
        ImVec2 q0(g0.x + c.high_degree * cell, g0.y + c.low_degree * cell);
        ImVec2 q1(q0.x + cell - 1, q0.y + cell - 1);
        double measure = by_fit ? c.fit.rms_cents : c.worst_cents;
        bool exact = c.fit.tones > 0 && c.fit.exact == c.fit.tones;
        ImU32 col = c.fit.tones == 0 ? IM_COL32(60, 60, 66, 255) : deviation_colour(measure, exact, tol);
        dl->AddRectFilled(q0, q1, col);
        int note_high = c.high_degree + c.high_period * n;
        if (c.low_degree == sel_low && note_high == sel_high) dl->AddRect(ImVec2(q0.x - 1, q0.y - 1), ImVec2(q1.x + 1, q1.y + 1), IM_COL32(255, 255, 255, 255), 0, 0, 3.0f);
        if (cell >= 34 && c.fit.tones > 0) {
            std::string v = exact ? "0" : fixed(measure, measure < 10 ? 1 : 0);
            ImVec2 ts = ImGui::CalcTextSize(v.c_str());
            dl->AddText(ImVec2(q0.x + (cell - ts.x) * 0.5f, q0.y + (cell - ts.y) * 0.5f), IM_COL32(10, 10, 12, 255), v.c_str());
        }
        ImVec2 m = ImGui::GetIO().MousePos;
        if (hovered && m.x >= q0.x && m.x < q1.x + 1 && m.y >= q0.y && m.y < q1.y + 1) hover_cell = idx;
    }
    draw_deviation_legend(dl, ImVec2(p0.x + 14, g0.y + n * cell + 14), tol, false);
    ImGui::Dummy(ImVec2(1, legend_h));

    if (hover_cell >= 0) {
        const DyadCell& c = a.grid[static_cast<std::size_t>(hover_cell)];
        ImGui::BeginTooltip();
        ImGui::Text("%s to %s", note_label(kb, c.low_degree, 0).c_str(), note_label(kb, c.high_degree, c.high_period).c_str());
        ImGui::Text("interval %s c", fixed(c.interval_cents, 3).c_str());
        ImGui::Text("worst landing %s c, fit %s c rms", fixed(c.worst_cents, 3).c_str(), fixed(c.fit.rms_cents, 3).c_str());
        ImGui::Text("%zu weighted tones, %zu land exactly", c.fit.tones, c.fit.exact);
        ImGui::TextDisabled("click to select this dyad");
        ImGui::EndTooltip();
        if (clicked)
            select_notes(app, {c.low_degree, c.high_degree + c.high_period * n});
    }
}

} // namespace terzo::gui
