// The tuning check: listens to the microphone (SFML's sf::SoundRecorder), measures the sound
// with core's LivePitch ten times a second, and shows the note being played, its deviation
// from the current tuning at the current pitch standard as a large number and a needle, and
// the beat rate that the interval just tuned (from the previous note to this one) should
// have beside the one it has. All computation is core's (core/sound/measure,
// core/analysis/measure_match). A clear message replaces it when no capture device exists.
//
// Test hooks: with TERZO_CHECK_WAV=FILE in the environment the panel opens at start and
// listens to that WAV file instead of a microphone, 1/60 s of it per frame whatever the frame
// rate, and prints each new reading to stdout ("check: ..."), so it can be tested under Xvfb;
// TERZO_CHECK_OPEN=1 opens it at start with the microphone, and it prints why it cannot
// listen ("check: ...") when that is so.
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <memory>
#include <mutex>
#include <optional>
#include <string>
#include <vector>

#include <SFML/Audio/SoundRecorder.hpp>

#include "core/analysis/measure_match.hpp"
#include "core/format.hpp"
#include "core/io/wav.hpp"
#include "core/sound/measure.hpp"
#include "gui/views.hpp"

namespace terzo::gui {

namespace {

// Captured samples arrive on SFML's recording thread; the panel takes them each frame.
class Microphone : public sf::SoundRecorder {
  public:
    ~Microphone() override { stop(); }
    std::vector<double> take() {
        std::lock_guard<std::mutex> lock(mutex_);
        std::vector<double> out;
        out.swap(pending_);
        return out;
    }

  private:
    bool onProcessSamples(const sf::Int16* samples, std::size_t n) override {
        std::lock_guard<std::mutex> lock(mutex_);
        const std::size_t channels = std::max<unsigned>(1, getChannelCount());
        for (std::size_t i = 0; i + channels <= n; i += channels) pending_.push_back(samples[i] / 32768.0);
        if (pending_.size() > 48000 * 4) pending_.erase(pending_.begin(), pending_.end() - 48000 * 4);
        return true;
    }
    std::mutex mutex_;
    std::vector<double> pending_;
};

// The panel's own state, like the state ImGui keeps for a window.
struct CheckState {
    bool open = false, started = false;
    std::string problem; ///< why there is nothing to listen to
    std::unique_ptr<Microphone> mic;
    std::optional<WavAudio> wav; ///< the test hook's recording
    std::string wav_name;
    std::size_t wav_pos = 0;
    std::unique_ptr<LivePitch> live;
    double since_measure = 0;
    std::optional<NoteCheck> now;      ///< the latest reading
    std::optional<NoteCheck> previous; ///< the last reading of another note
    std::optional<NoteCheck> held;     ///< the note now sounding (the latest reading's note)
};

CheckState& state() {
    static CheckState s;
    return s;
}

void start(CheckState& s) {
    s.started = true;
    if (const char* path = std::getenv("TERZO_CHECK_WAV"); path && *path) {
        try {
            s.wav = read_wav(path);
            s.wav_name = path;
            s.live = std::make_unique<LivePitch>(s.wav->sample_rate);
        } catch (const InputError& e) {
            s.problem = e.what();
        }
        return;
    }
    // OpenAL may list a capture device that then cannot be opened (no sound card): both
    // end in the same message.
    const char* none = "No sound capture device (microphone) could be opened, so there is nothing to listen "
                       "to. Connect one and reopen this panel, or record the notes and run "
                       "`terzo measure FILE.wav`.";
    if (!sf::SoundRecorder::isAvailable()) {
        s.problem = none;
        return;
    }
    s.mic = std::make_unique<Microphone>();
    if (!s.mic->start(48000)) {
        s.problem = none;
        s.mic.reset();
        return;
    }
    s.live = std::make_unique<LivePitch>(s.mic->getSampleRate() > 0 ? s.mic->getSampleRate() : 48000);
}

void stop(CheckState& s) {
    s.mic.reset();
    s.live.reset();
    s.wav.reset();
    s.started = false;
    s.problem.clear();
    s.now = s.previous = s.held = std::nullopt;
}

// A needle of our own: a horizontal scale from -50 to +50 cents with ticks every 10, a green
// band within 2 cents, and a pointer at the deviation (pinned at the ends beyond them).
void draw_needle(double cents) {
    ImDrawList* dl = ImGui::GetWindowDrawList();
    const ImVec2 p = ImGui::GetCursorScreenPos();
    const float w = std::max(200.0f, ImGui::GetContentRegionAvail().x), h = 46.0f;
    const float mid = p.x + w / 2, scale = (w - 20) / 100.0f, y = p.y + h / 2;
    dl->AddRectFilled(ImVec2(mid - 2 * scale, p.y + 6), ImVec2(mid + 2 * scale, p.y + h - 6),
                      IM_COL32(60, 140, 80, 255));
    dl->AddLine(ImVec2(mid - 50 * scale, y), ImVec2(mid + 50 * scale, y), IM_COL32(170, 170, 170, 255), 1.5f);
    for (int c = -50; c <= 50; c += 10)
        dl->AddLine(ImVec2(mid + c * scale, y - (c == 0 ? 12 : 6)), ImVec2(mid + c * scale, y + (c == 0 ? 12 : 6)),
                    IM_COL32(170, 170, 170, 255), 1.0f);
    const float x = mid + float(std::clamp(cents, -50.0, 50.0)) * scale;
    const ImU32 colour = std::abs(cents) <= 2.0 ? IM_COL32(110, 220, 130, 255) : IM_COL32(240, 170, 60, 255);
    dl->AddTriangleFilled(ImVec2(x, y - 4), ImVec2(x - 7, p.y), ImVec2(x + 7, p.y), colour);
    dl->AddLine(ImVec2(x, p.y), ImVec2(x, p.y + h), colour, 3.0f);
    ImGui::Dummy(ImVec2(w, h));
}

} // namespace

void open_check_panel() {
    state().open = true;
}

void draw_check_panel(App& app) {
    CheckState& s = state();
    static bool open_at_start = [] {
        const char* wav = std::getenv("TERZO_CHECK_WAV");
        const char* open = std::getenv("TERZO_CHECK_OPEN");
        return (wav && *wav) || (open && std::string(open) == "1");
    }();
    if (open_at_start) s.open = true, open_at_start = false;
    if (!s.open) {
        if (s.started) stop(s);
        return;
    }
    if (!s.started) {
        start(s);
        if (!s.problem.empty() && (std::getenv("TERZO_CHECK_OPEN") || std::getenv("TERZO_CHECK_WAV"))) {
            std::printf("check: %s\n", s.problem.c_str());
            std::fflush(stdout);
        }
    }

    ImGui::SetNextWindowSize(ImVec2(420, 330), ImGuiCond_FirstUseEver);
    ImGui::SetNextWindowPos(ImVec2(380, 120), ImGuiCond_FirstUseEver);
    if (!ImGui::Begin("Tuning check", &s.open)) {
        ImGui::End();
        return;
    }
    ImGui::TextWrapped("What terzo measures is advice: tuning a historical instrument (its pitch and string "
                       "tension) is the owner's and the maker's decision.");
    ImGui::Separator();

    const SessionTuning* t = current_tuning(app);
    std::optional<NoteMap> map;
    std::string why;
    if (!t) {
        why = "Open a 12-note tuning to check against.";
    } else if (t->scale.size() != 12) {
        why = "The check is for 12-note tunings; this one has " + std::to_string(t->scale.size()) + " degrees.";
    } else {
        try {
            map.emplace(t->scale, 0, parse_pitch_reference(app.session.settings.pitch_reference, {"pitch", 0, 0}),
                        t->source);
        } catch (const InputError& e) {
            why = e.what();
        }
    }

    if (!s.problem.empty()) {
        ImGui::TextWrapped("%s", s.problem.c_str());
    } else if (!map) {
        ImGui::TextWrapped("%s", why.c_str());
    } else {
        // Feed what arrived: the microphone's samples, or the test hook's next 1/60 s.
        if (s.mic) {
            const std::vector<double> got = s.mic->take();
            s.live->feed(got.data(), got.size());
        } else if (s.wav) {
            const std::size_t n = std::size_t(s.wav->sample_rate / 60);
            const std::size_t end = std::min(s.wav->samples.size(), s.wav_pos + n);
            s.live->feed(s.wav->samples.data() + s.wav_pos, end - s.wav_pos);
            s.wav_pos = end;
        }
        const double dt = s.wav ? 1.0 / 60.0 : double(ImGui::GetIO().DeltaTime);
        s.since_measure += dt;
        if (s.since_measure >= 0.1) {
            s.since_measure = 0;
            if (auto p = s.live->measure(); p && p->confidence > 0.5) {
                const NoteCheck c = check_note(*map, p->hz);
                if (s.held && !(s.held->note == c.note)) s.previous = s.held;
                s.held = c;
                s.now = c;
                if (s.wav) {
                    std::printf("check: %.2f s %s %s c %s Hz", double(s.wav_pos) / s.wav->sample_rate,
                                note_text(c.note).c_str(), signed_fixed(c.deviation_cents, 2).c_str(),
                                fixed(c.hz, 3).c_str());
                    if (s.previous)
                        if (auto i = check_interval(*map, *s.previous, c))
                            std::printf("; %s %s-%s target %s beats/s, played %s", i->kind->name.c_str(),
                                        note_text(i->low).c_str(), note_text(i->high).c_str(),
                                        fixed(i->target.hz, 2).c_str(), fixed(i->measured.hz, 2).c_str());
                    std::printf("\n");
                    std::fflush(stdout);
                }
            } else {
                s.now.reset();
            }
        }

        ImGui::Text("Against %s at %s", tuning_label(t->source).c_str(),
                    app.session.settings.pitch_reference.c_str());
        ImGui::Text("%s", s.mic ? "Listening to the microphone" : ("Listening to " + s.wav_name).c_str());
        if (s.now) {
            ImGui::SetWindowFontScale(2.6f);
            ImGui::Text("%s  %s c", note_text(s.now->note).c_str(), signed_fixed(s.now->deviation_cents, 1).c_str());
            ImGui::SetWindowFontScale(1.0f);
            draw_needle(s.now->deviation_cents);
            ImGui::Text("%s Hz played, %s Hz target", fixed(s.now->hz, 2).c_str(), fixed(s.now->target_hz, 2).c_str());
        } else {
            ImGui::SetWindowFontScale(2.6f);
            ImGui::TextDisabled("--");
            ImGui::SetWindowFontScale(1.0f);
            draw_needle(0.0);
            ImGui::TextDisabled("Play a single note.");
        }
        if (s.previous && s.held) {
            if (auto i = check_interval(*map, *s.previous, *s.held))
                ImGui::TextWrapped("%s %s-%s: should beat %s per second (%s), beats %s", i->kind->name.c_str(),
                                   note_text(i->low).c_str(), note_text(i->high).c_str(),
                                   fixed(i->target.hz, 2).c_str(), tempering_name(i->target.tempering).c_str(),
                                   fixed(i->measured.hz, 2).c_str());
        }
    }
    ImGui::End();
}

} // namespace terzo::gui
