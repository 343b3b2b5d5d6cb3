// Listening: the selected notes rendered by core/sound (render) and played through SFML
// audio, behind the hearing-safety caution. The volume starts low; the render itself ramps
// every envelope and caps the peak at -12 dBFS before the volume is applied.
#include "core/error.hpp"
#include "core/sound/render.hpp"
#include "gui/audio.hpp"
#include "gui/views.hpp"

namespace terzo::gui {

namespace {

struct ModelChoice {
    const char* label;
    Model model;
    const char* help;
};
// "predicted" first: it makes the resultants audible without loud primaries.
const ModelChoice models[] = {
    {"notes + predicted resultants", Model::predicted, "the notes, plus the engine's predicted combination tones as quiet sines"},
    {"notes only", Model::none, "the notes alone; at safe levels your ear adds little"},
    {"notes through an ear-like nonlinearity", Model::poly, "the mix through y = x + c2 x^2 + c3 x^3"},
};

} // namespace

void play_selection(App& app) {
    const SessionTuning* t = current_tuning(app);
    if (!app.player) {
        app.listen_message = "listening is off in this mode";
        return;
    }
    if (!t || app.session.selection.empty()) {
        app.listen_message = "select one or more notes first";
        return;
    }
    try {
        RenderSettings rs;
        rs.ref_hz = app.session.settings.reference_hz;
        rs.model = models[app.listen_model].model;
        rs.timbre.partials = app.session.settings.partials;
        std::vector<double> samples = render(t->scale, app.session.selection, rs);
        app.listen_message = app.player->play(samples, rs.sample_rate, app.session.volume);
        if (app.listen_message.empty()) app.listen_message = "playing " + std::to_string(app.session.selection.size()) + " note(s)";
    } catch (const InputError& e) {
        app.listen_message = shown(e);
    }
}

void draw_listen_panel(App& app) {
    ImGui::TextColored(ImVec4(1.0f, 0.75f, 0.35f, 1.0f), "Hearing safety");
    ImGui::PushTextWrapPos(0.0f);
    ImGui::TextUnformatted(hearing_caution());
    ImGui::PopTextWrapPos();
    ImGui::BeginDisabled(app.player == nullptr);
    float v = static_cast<float>(app.session.volume);
    ImGui::SetNextItemWidth(-70);
    if (ImGui::SliderFloat("volume", &v, 0.0f, 1.0f, "%.2f")) {
        app.session.volume = v;
        if (app.player) app.player->set_volume(v);
        app.dirty = true;
        app.last_change = std::chrono::steady_clock::now();
    }
    ImGui::SetNextItemWidth(-1);
    if (ImGui::BeginCombo("##model", models[app.listen_model].label)) {
        for (int i = 0; i < 3; ++i) {
            if (ImGui::Selectable(models[i].label, i == app.listen_model)) app.listen_model = i;
            if (ImGui::IsItemHovered()) ImGui::SetTooltip("%s", models[i].help);
        }
        ImGui::EndCombo();
    }
    if (ImGui::Button("Play selection (Space)")) play_selection(app);
    ImGui::SameLine();
    if (ImGui::Button("Stop") && app.player) app.player->stop();
    ImGui::EndDisabled();
    if (!app.player) ImGui::TextDisabled("no sound in --screenshot and --bench-frames runs");
    else if (!app.listen_message.empty()) ImGui::TextWrapped("%s", app.listen_message.c_str());
}

} // namespace terzo::gui
