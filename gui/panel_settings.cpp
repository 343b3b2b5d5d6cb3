// Analysis settings: reference pitch, keyboard span, combination-tone order, partials, the
// landing tolerance (what counts as "lands" in the colours) and the lattice search limits.
// Every change is applied at once; core rejects anything out of range.
#include <algorithm>
#include <string>

#include "core/error.hpp"
#include "gui/views.hpp"

namespace terzo::gui {

namespace {
// The labels of the settings core names in its messages (see setting_label).
constexpr const char* ref_hz_label = "reference Hz";
constexpr const char* span_label = "span (periods)";
constexpr const char* order_label = "order |a|+|b|";
constexpr const char* partials_label = "partials";
} // namespace

std::string setting_label(Setting setting) {
    switch (setting) {
    case Setting::order: return std::string("\"") + order_label + "\"";
    case Setting::partials: return std::string("\"") + partials_label + "\"";
    case Setting::span: return std::string("\"") + span_label + "\"";
    case Setting::ref_hz: return std::string("\"") + ref_hz_label + "\"";
    }
    return "a setting";
}

void draw_settings_panel(App& app) {
    SessionSettings& s = app.session.settings;
    SessionSettings before = s;
    ImGui::PushItemWidth(-150);
    ImGui::InputDouble(ref_hz_label, &s.reference_hz, 1.0, 10.0, "%.3f");
    if (ImGui::IsItemHovered()) ImGui::SetTooltip("frequency of degree 0 in the lowest period");
    ImGui::SliderInt(span_label, &s.span, 1, max_span);
    ImGui::SliderInt(order_label, &s.max_order, 2, max_order);
    ImGui::SliderInt(partials_label, &s.partials, 1, 8);
    if (ImGui::IsItemHovered()) ImGui::SetTooltip("1 = pure tones; more adds tones between harmonics");
    const double land_lo = 0.1, land_hi = 50.0, lat_lo = 1.0, lat_hi = 60.0;
    ImGui::SliderScalar("landing tol. (c)", ImGuiDataType_Double, &s.landing_tolerance_cents, &land_lo, &land_hi, "%.1f");
    if (ImGui::IsItemHovered()) ImGui::SetTooltip("a resultant this close to a note counts as landing on it (colours only;\nexact landings are proven, never assumed)");
    ImGui::SliderScalar("lattice tol. (c)", ImGuiDataType_Double, &s.lattice_tolerance_cents, &lat_lo, &lat_hi, "%.1f");
    if (ImGui::IsItemHovered()) ImGui::SetTooltip("how far a tempered or cents-only pitch may be from the\n7-limit ratio that places it on the lattice");
    ImGui::SliderInt("odd limit", &s.odd_limit, 1, 81);
    ImGui::PopItemWidth();
    try {
        check_settings(s, "settings");
    } catch (const InputError& e) {
        app.error = e.what();
        s = before;
        return;
    }
    if (s.reference_hz != before.reference_hz || s.span != before.span || s.max_order != before.max_order ||
        s.partials != before.partials || s.landing_tolerance_cents != before.landing_tolerance_cents ||
        s.lattice_tolerance_cents != before.lattice_tolerance_cents || s.odd_limit != before.odd_limit) {
        if (s.span != before.span) {
            // Notes past the new keyboard's end are dropped from the selection.
            int notes = current_tuning(app) ? s.span * static_cast<int>(current_tuning(app)->scale.size()) + 1 : 0;
            auto& sel = app.session.selection;
            sel.erase(std::remove_if(sel.begin(), sel.end(), [&](int k) { return k >= notes; }), sel.end());
        }
        touch(app);
    }
}

} // namespace terzo::gui
