// The key map in the window: which MIDI key plays which degree of the current tuning (the
// session's KeyMapSpec, laid by core's make_key_map, the same model export and render use).
// Layout, root key, keys per period or a pattern, the reference and the degree order, a
// key-map file to open or save, and a strip of MIDI keys: hover for a key's degree and
// frequency, click to hear it. Degrees written out of order are listed here.
#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <optional>

#include "core/error.hpp"
#include "core/io/atomic_file.hpp"
#include "core/io/key_map_file.hpp"
#include "core/sound/render.hpp"
#include "core/tuning/degree_order.hpp"
#include "gui/audio.hpp"
#include "gui/colours.hpp"
#include "gui/views.hpp"

namespace terzo::gui {

namespace {

constexpr ImU32 silent_key_colour = IM_COL32(42, 45, 52, 255);

void changed(App& app) {
    app.dirty = true;
    app.last_change = std::chrono::steady_clock::now();
}

void play_key(App& app, const KeyMap& map, int key) {
    const auto step = map.step_of(key);
    if (!step || !app.player) return;
    try {
        RenderSettings rs;
        rs.ref_hz = map.root_hz();
        rs.model = Model::none;
        rs.seconds = 1.0;
        const std::vector<double> samples = render(map.scale(), {*step}, rs);
        app.listen_message = app.player->play(samples, rs.sample_rate, app.session.volume);
        if (app.listen_message.empty()) app.listen_message = "playing key " + std::to_string(key);
    } catch (const InputError& e) {
        app.listen_message = e.what();
    }
}

// 37 MIDI keys from an octave below the root key, as one flat rectangle each.
void draw_key_strip(App& app, const KeyMap& map) {
    const int first = std::max(lowest_key, map.root_key() - 12);
    const int last = std::min(highest_key, first + 36);
    const int count = last - first + 1;
    const ImVec2 origin = ImGui::GetCursorScreenPos();
    const float width = std::max(ImGui::GetContentRegionAvail().x, 1.0f), height = 28.0f;
    const float pitch = width / static_cast<float>(count);
    ImGui::InvisibleButton("midi_key_strip", ImVec2(width, height));
    int under = -1;
    if (ImGui::IsItemHovered())
        under = first + std::clamp(static_cast<int>(std::floor((ImGui::GetIO().MousePos.x - origin.x) / pitch)), 0, count - 1);
    if (ImGui::IsItemClicked(ImGuiMouseButton_Left) && under >= 0) play_key(app, map, under);
    ImDrawList* dl = ImGui::GetWindowDrawList();
    for (int key = first; key <= last; ++key) {
        const auto step = map.step_of(key);
        const int degree = step ? static_cast<int>(((*step % static_cast<int>(map.scale().size())) +
                                                     static_cast<int>(map.scale().size())) %
                                                    static_cast<int>(map.scale().size()))
                                : -1;
        ImU32 fill = !step ? silent_key_colour : degree == 0 ? strip_period_key_colour : strip_key_colour;
        if (key == under && step) fill = IM_COL32(80, 110, 150, 255);
        const float x0 = std::round(origin.x + pitch * static_cast<float>(key - first));
        const float x1 = std::max(x0 + 1.0f, std::round(origin.x + pitch * static_cast<float>(key - first + 1)) - 1.0f);
        // Black keys are drawn shorter, so the keyboard reads at a glance.
        const float y1 = origin.y + (is_black_key(key) ? height * 0.62f : height);
        dl->AddRectFilled(ImVec2(x0, origin.y), ImVec2(x1, y1), fill);
        if (step && pitch >= 14.0f) {
            const std::string label = std::to_string(degree);
            const ImVec2 ts = ImGui::CalcTextSize(label.c_str());
            dl->AddText(ImVec2(std::round((x0 + x1 - ts.x) * 0.5f), std::round(y1 - ts.y - 1.0f)),
                        IM_COL32(230, 232, 236, 255), label.c_str());
        }
    }
    if (under >= 0) {
        const MappedKey k = map.at(under);
        const std::string name = note_text(note_of_key(under));
        if (k.sounds)
            ImGui::SetTooltip("key %d (%s): degree %d%s, %.3f Hz\nclick to hear it", under, name.c_str(), k.degree,
                              k.period_count == 0 ? "" : (" (" + std::string(k.period_count > 0 ? "+" : "") +
                                                          std::to_string(k.period_count) + " period)").c_str(),
                              k.hz);
        else
            ImGui::SetTooltip("key %d (%s): silent", under, name.c_str());
    }
}

} // namespace

void draw_key_map_settings(App& app) {
    if (!ImGui::CollapsingHeader("Key map (MIDI keys)", ImGuiTreeNodeFlags_DefaultOpen)) return;
    KeyMapSpec& spec = app.session.key_map;
    const KeyMapSpec before = spec;
    static const KeyLayout layouts[] = {KeyLayout::every_key, KeyLayout::white_keys, KeyLayout::twelve_by_pitch,
                                        KeyLayout::pattern};
    ImGui::PushItemWidth(220);
    if (ImGui::BeginCombo("layout", key_layout_name(spec.layout).c_str())) {
        for (KeyLayout l : layouts)
            if (ImGui::Selectable(key_layout_name(l).c_str(), l == spec.layout)) spec.layout = l;
        ImGui::EndCombo();
    }
    ImGui::InputInt("root key", &spec.root_key);
    spec.root_key = std::clamp(spec.root_key, lowest_key, highest_key);
    if (ImGui::IsItemHovered()) ImGui::SetTooltip("the MIDI key that plays degree 0 (60 is middle C)");
    if (spec.layout == KeyLayout::every_key) {
        ImGui::InputInt("keys per period", &spec.keys_per_period);
        spec.keys_per_period = std::clamp(spec.keys_per_period, 0, max_pattern_keys);
        if (ImGui::IsItemHovered()) ImGui::SetTooltip("0: the tuning's size; more keys than degrees leaves the rest silent");
    }
    if (spec.layout == KeyLayout::pattern) {
        static char text[512];
        if (!ImGui::IsAnyItemActive())
            std::snprintf(text, sizeof text, "%s",
                          spec.pattern.keys.empty() ? "0" : pattern_keys_text(spec.pattern.keys).c_str());
        if (ImGui::InputText("pattern", text, sizeof text, ImGuiInputTextFlags_EnterReturnsTrue)) {
            try {
                std::vector<int> keys = parse_pattern_keys(text, {"pattern", 0, 0});
                check_pattern({keys, 1}, {"pattern", 0, 0});
                spec.pattern.keys = std::move(keys);
            } catch (const InputError& e) {
                app.error = e.what();
            }
        }
        if (ImGui::IsItemHovered()) ImGui::SetTooltip("degree numbers and x (silent) for the keys of one repeat,\nfrom the root key up; press Enter");
        if (spec.pattern.keys.empty()) spec.pattern.keys = {0};
        ImGui::InputInt("degrees a repeat", &spec.pattern.degrees_per_repeat);
        spec.pattern.degrees_per_repeat = std::clamp(spec.pattern.degrees_per_repeat, 0, max_pattern_degree);
        if (ImGui::IsItemHovered()) ImGui::SetTooltip("0: the tuning's size (each repeat is one period)");
    }
    {
        static char ref[32];
        if (!ImGui::IsAnyItemActive()) {
            if (spec.reference)
                std::snprintf(ref, sizeof ref, "%s=%g", note_text(note_of_key(spec.reference->key)).c_str(),
                              spec.reference->hz);
            else
                ref[0] = '\0';
        }
        if (ImGui::InputTextWithHint("reference", "default", ref, sizeof ref, ImGuiInputTextFlags_EnterReturnsTrue)) {
            try {
                if (std::string(ref).empty()) {
                    spec.reference.reset();
                } else {
                    const KeyReference r = key_reference(parse_pitch_reference(ref, {"reference", 0, 0}));
                    if (r.key < lowest_key || r.key > highest_key)
                        fail({"reference", 0, 0}, "the note is not on a MIDI key (C-1 to G9)");
                    spec.reference = r;
                }
            } catch (const InputError& e) {
                app.error = e.what();
            }
        }
        if (ImGui::IsItemHovered())
            ImGui::SetTooltip("NOTE=HZ, such as A4=415; empty: A4=440 for 12 degrees,\nelse the root key at its 12-TET pitch");
    }
    ImGui::Checkbox("keep the written degree order", &spec.keep_file_order);
    ImGui::PopItemWidth();

    static char path[512] = "key-map.json";
    ImGui::SetNextItemWidth(220);
    ImGui::InputText("##key_map_file", path, sizeof path);
    ImGui::SameLine();
    if (ImGui::Button("Open")) {
        try {
            spec = load_key_map_file(path);
            app.status = std::string("opened key map ") + path;
        } catch (const InputError& e) {
            app.error = e.what();
        }
    }
    ImGui::SameLine();
    if (ImGui::Button("Save")) {
        try {
            write_file_atomically(path, [&](std::ostream& out) { write_key_map(out, spec); }, Overwrite::allow);
            app.status = std::string("saved key map ") + path;
        } catch (const InputError& e) {
            app.error = e.what();
        }
    }
    if (!(spec == before)) changed(app);

    const SessionTuning* t = current_tuning(app);
    if (!t) {
        ImGui::TextDisabled("open a tuning to lay it on the keys");
        return;
    }
    try {
        const KeyMap map = make_key_map(t->scale, spec, {"key map", 0, 0});
        ImGui::TextDisabled("%s: %zu keys a repeat, %d degrees a repeat", pattern_keys_text(map.pattern().keys).c_str(),
                            map.pattern().keys.size(), map.pattern().degrees_per_repeat);
        draw_key_strip(app, map);
    } catch (const InputError& e) {
        ImGui::PushTextWrapPos(0.0f);
        ImGui::TextColored(ImVec4(1.0f, 0.45f, 0.4f, 1.0f), "%s", e.message().c_str());
        ImGui::PopTextWrapPos();
    }
    const auto problems = degree_order_problems(t->scale);
    if (!problems.empty()) {
        ImGui::PushTextWrapPos(0.0f);
        ImGui::TextColored(ImVec4(1.0f, 0.75f, 0.35f, 1.0f), "%zu degree(s) out of order; %s", problems.size(),
                           spec.keep_file_order ? "laid as written" : "the keys take them sorted by pitch");
        for (const auto& p : problems) ImGui::BulletText("%s", p.message.c_str());
        ImGui::PopTextWrapPos();
    }
}

} // namespace terzo::gui
