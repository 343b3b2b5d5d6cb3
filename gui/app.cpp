#include "gui/app.hpp"

#include <algorithm>
#include <cstdlib>

#include <pthread.h>
#include <sched.h>

#include "core/error.hpp"
#include "core/tuning/load.hpp"
#include "core/tuning/recipe.hpp"

namespace terzo::gui {

namespace {

LatticeOptions lattice_options(const SessionSettings& s) {
    return {s.lattice_tolerance_cents, s.odd_limit};
}

ToneOptions tone_options(const SessionSettings& s) {
    ToneOptions o;
    o.order = s.max_order;
    o.partials = s.partials;
    return o;
}

int note_count(const App& app) {
    const SessionTuning* t = current_tuning(app);
    return t ? app.session.settings.span * static_cast<int>(t->scale.size()) + 1 : 0;
}

} // namespace

const SessionTuning* current_tuning(const App& app) {
    const auto& t = app.session.tunings;
    if (t.empty()) return nullptr;
    return &t[static_cast<std::size_t>(std::clamp<int>(app.session.current, 0, int(t.size()) - 1))];
}

std::string tuning_label(const std::string& source) {
    return starts_like_recipe(source) ? source : std::filesystem::path(source).filename().string();
}

bool open_tuning(App& app, const std::string& argument) {
    try {
        if (app.session.tunings.size() >= max_session_tunings)
            fail({argument, 0, 0}, "at most " + std::to_string(max_session_tunings) +
                                       " tunings can be open; close one first");
        Scale scale = load_tuning(argument);
        app.session.tunings.push_back({argument, std::move(scale)});
        switch_tuning(app, static_cast<int>(app.session.tunings.size()) - 1);
        app.status = "opened " + argument;
        app.error.clear();
        return true;
    } catch (const InputError& e) {
        app.error = e.what();
        return false;
    }
}

void close_current(App& app) {
    auto& t = app.session.tunings;
    if (t.empty()) return;
    t.erase(t.begin() + app.session.current);
    switch_tuning(app, std::max(0, app.session.current - 1));
}

void switch_tuning(App& app, int i) {
    app.session.current = app.session.tunings.empty() ? 0 : std::clamp<int>(i, 0, int(app.session.tunings.size()) - 1);
    // A selection names notes of one keyboard; it does not carry over to another tuning.
    app.session.selection.clear();
    app.camera.fit = true;
    touch(app);
}

void touch(App& app) {
    app.stale = true;
    app.dirty = true;
    app.last_change = std::chrono::steady_clock::now();
}

void toggle_note(App& app, int note) {
    auto& sel = app.session.selection;
    auto it = std::find(sel.begin(), sel.end(), note);
    if (it != sel.end()) {
        sel.erase(it);
    } else {
        if (sel.size() >= max_selection) {
            app.error = "at most " + std::to_string(max_selection) + " notes can be selected";
            return;
        }
        sel.insert(std::upper_bound(sel.begin(), sel.end(), note), note);
    }
    touch(app);
}

void select_notes(App& app, std::vector<int> notes) {
    std::sort(notes.begin(), notes.end());
    notes.erase(std::unique(notes.begin(), notes.end()), notes.end());
    if (notes.size() > max_selection) notes.resize(max_selection);
    app.session.selection = std::move(notes);
    touch(app);
}

namespace {

void poll_background(App& app) {
    BackgroundFit& b = app.background;
    if (b.job.valid() && b.job.wait_for(std::chrono::seconds(0)) == std::future_status::ready) {
        BackgroundFit::Result r = b.job.get();
        ++b.completed;
        b.total_ms += r.ms;
        if (r.generation == b.generation) {
            app.analysis.keyboard_fit = r.fit;
            app.analysis.keyboard_fit_error = r.error;
        }
    }
    if (!b.job.valid() && b.wanted && app.analysis.keyboard) {
        b.wanted = false;
        b.job = std::async(std::launch::async, [kb = *app.analysis.keyboard, options = tone_options(app.session.settings),
                                                generation = b.generation] {
            // The whole-keyboard fit only uses time the window does not need: at idle
            // priority, drawing (and software OpenGL's threads) go first while a setting is
            // being dragged, and the fit catches up when the user pauses.
            sched_param idle{};
            pthread_setschedparam(pthread_self(), SCHED_IDLE, &idle);
            BackgroundFit::Result r;
            r.generation = generation;
            auto t0 = std::chrono::steady_clock::now();
            try {
                r.fit = keyboard_fit(kb, options);
            } catch (const InputError& e) {
                r.error = e.what();
            }
            r.ms = std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t0).count();
            return r;
        });
    }
}

} // namespace

bool background_pending(const App& app) {
    return app.background.wanted || app.background.job.valid();
}

void refresh(App& app) {
    if (!app.stale && !app.benchmark) {
        poll_background(app);
        return;
    }
    ++app.background.generation;
    app.background.wanted = true;
    app.stale = false;
    Analysis a;
    const SessionTuning* t = current_tuning(app);
    const SessionSettings& s = app.session.settings;
    if (!t) {
        app.analysis = std::move(a);
        app.background.wanted = false;
        return;
    }
    // Each part is computed on its own, so one refused request (a limit) leaves the others.
    try {
        a.keyboard.emplace(t->scale, s.reference_hz, s.span);
        for (const Pitch& p : t->scale.degrees())
            a.degree_places.push_back(place_on_lattice(p, lattice_options(s)));
    } catch (const InputError& e) {
        a.keyboard.reset();
        a.error = e.what();
        app.analysis = std::move(a);
        app.background.wanted = false;
        return;
    }
    const Keyboard& kb = *a.keyboard;
    const ToneOptions options = tone_options(s);
    try {
        std::vector<Note> chord;
        const int notes = note_count(app);
        for (int n : app.session.selection)
            if (n < notes) chord.push_back(kb.notes()[static_cast<std::size_t>(n)]);
        if (chord.size() >= 2) {
            a.selection_tones = chord_tones(kb, chord, options);
            for (const DyadTones& d : a.selection_tones) {
                std::vector<LatticePlace> places;
                const DyadExact exact(d.low, d.high);
                for (const Tone& tone : d.tones)
                    places.push_back(place_on_lattice(
                        exact.value(tone).value_or(Pitch::from_cents(tone.cents)), lattice_options(s)));
                a.tone_places.push_back(std::move(places));
            }
            a.selection_fit = fit(a.selection_tones);
            a.selection_bass = common_bass(kb, chord);
        }
    } catch (const InputError& e) {
        a.error = e.what();
    }
    try {
        a.grid = dyad_grid(kb, options);
    } catch (const InputError& e) {
        if (a.error.empty()) a.error = e.what();
    }
    // The keys and sheet views: 12-note tunings at the pitch reference, degree 0 on C.
    try {
        CompareOptions copt;
        copt.reference = parse_pitch_reference(s.pitch_reference, {"pitch reference", 0, 0});
        copt.fit_order = s.max_order;
        std::size_t n = std::min(app.session.tunings.size(), max_compared_tunings);
        for (std::size_t i = 0; i < n; ++i) {
            const SessionTuning& st = app.session.tunings[i];
            ComparedTuning c;
            c.name = tuning_label(st.source);
            c.description = st.scale.description();
            c.size = st.scale.size();
            if (st.scale.size() == 12) c.keys = compare_keys(st.scale, copt, st.source);
            if (st.scale.size() <= max_class_degrees) c.classes = interval_classes(st.scale, 7, st.source);
            a.comparison.push_back(std::move(c));
        }
        if (t->scale.size() == 12) {
            SheetOptions sopt;
            sopt.reference = copt.reference;
            a.sheet = make_sheet(t->scale, sopt, t->source);
        } else {
            a.sheet_error = "The tuner's sheet is for 12-note tunings; " + tuning_label(t->source) + " has " +
                            std::to_string(t->scale.size()) + " degrees.";
        }
    } catch (const InputError& e) {
        a.comparison_error = e.what();
    }
    // Until the worker answers, the last keyboard fit stays on screen only if it is still
    // valid; the status bar says it is being computed.
    app.analysis = std::move(a);
    poll_background(app);
}

bool save_session(App& app) {
    if (app.session_path.empty()) return false;
    try {
        std::error_code ec;
        if (app.session_path.has_parent_path())
            std::filesystem::create_directories(app.session_path.parent_path(), ec);
        save_session_file(app.session_path, app.session);
        app.dirty = false;
        return true;
    } catch (const InputError& e) {
        app.error = e.what();
        app.session_path.clear(); // stop retrying a failing autosave every frame
        return false;
    }
}

void autosave(App& app, std::chrono::milliseconds delay) {
    if (app.dirty && std::chrono::steady_clock::now() - app.last_change >= delay) save_session(app);
}

std::filesystem::path default_session_path() {
    if (const char* x = std::getenv("XDG_STATE_HOME"); x && *x)
        return std::filesystem::path(x) / "terzo" / "session.json";
    if (const char* h = std::getenv("HOME"); h && *h)
        return std::filesystem::path(h) / ".local" / "state" / "terzo" / "session.json";
    return {};
}

} // namespace terzo::gui
