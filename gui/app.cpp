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
        // A tuning already open is made current instead of opened twice (the first run's demo
        // session holds the demo scale that ./build.sh run also names).
        for (std::size_t i = 0; i < app.session.tunings.size(); ++i)
            if (app.session.tunings[i].scale == scale) {
                if (static_cast<int>(i) != app.session.current) switch_tuning(app, static_cast<int>(i));
                app.status = argument + " is open already";
                return true;
            }
        app.session.tunings.push_back({argument, std::move(scale)});
        switch_tuning(app, static_cast<int>(app.session.tunings.size()) - 1);
        app.status = "opened " + argument;
        app.error.clear();
        return true;
    } catch (const InputError& e) {
        app.error = shown(e);
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

// The whole-keyboard fit of the resultant engine, checking `cancel` between dyads; nullopt
// when cancelled (the engine's own limits and their messages apply as in the CLI).
struct FitCancelled {};
std::optional<Fit> cancellable_keyboard_fit(const Keyboard& kb, const ToneOptions& options, const std::atomic<bool>& cancel) {
    FitSum sum;
    try {
        for_each_keyboard_dyad(kb, options, [&](const DyadTones& d) {
            if (cancel.load(std::memory_order_relaxed)) throw FitCancelled{};
            sum.add(d);
        });
    } catch (const FitCancelled&) {
        return std::nullopt;
    }
    return sum.result();
}

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
        b.cancel = std::make_shared<std::atomic<bool>>(false);
        b.job = std::async(std::launch::async, [kb = *app.analysis.keyboard, options = tone_options(app.session.settings),
                                                generation = b.generation, cancel = b.cancel] {
            // The whole-keyboard fit only uses time the window does not need: at idle
            // priority, drawing (and software OpenGL's threads) go first while a setting is
            // being dragged, and the fit catches up when the user pauses.
            sched_param idle{};
            pthread_setschedparam(pthread_self(), SCHED_IDLE, &idle);
            BackgroundFit::Result r;
            r.generation = generation;
            auto t0 = std::chrono::steady_clock::now();
            try {
                r.fit = cancellable_keyboard_fit(kb, options, *cancel);
            } catch (const InputError& e) {
                r.error = shown(e);
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

namespace {

// The dyad grid (n*n dyads: the largest part of the analysis) is computed only while its view
// is shown, once per change.
void update_grid(App& app) {
    if (!app.grid_stale || app.session.view != "grid" || !app.analysis.keyboard) return;
    app.grid_stale = false;
    Analysis& a = app.analysis;
    a.grid.clear();
    a.grid_error.clear();
    try {
        a.grid = dyad_grid(*a.keyboard, tone_options(app.session.settings));
    } catch (const InputError& e) {
        a.grid_error = shown(e);
    }
}

} // namespace

void refresh(App& app) {
    if (!app.stale && !app.benchmark) {
        update_grid(app);
        poll_background(app);
        return;
    }
    ++app.background.generation;
    if (app.background.cancel) app.background.cancel->store(true); // its result would be dropped
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
        a.error = shown(e);
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
            // Each tone's lattice place is a search over just ratios: the lattice places the
            // first max_placed_tones (lowest partials first) and counts the rest.
            std::size_t placed = 0;
            for (const DyadTones& d : a.selection_tones) {
                std::vector<LatticePlace> places;
                const DyadExact exact(d.low, d.high);
                for (const Tone& tone : d.tones) {
                    if (placed == max_placed_tones) break;
                    ++placed;
                    places.push_back(place_on_lattice(
                        exact.value(tone).value_or(Pitch::from_cents(tone.cents)), lattice_options(s)));
                }
                a.tones_not_placed += d.tones.size() - places.size();
                a.tone_places.push_back(std::move(places));
            }
            a.selection_fit = fit(a.selection_tones);
            a.selection_bass = common_bass(kb, chord);
        }
    } catch (const InputError& e) {
        a.selection_error = shown(e);
    }
    app.grid_stale = true; // computed when the grid view shows (update_grid)
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
        // The sheet of the current tuning, or when it has not 12 notes, of the first open
        // tuning that has (the view says which).
        const SessionTuning* sheet_of = t->scale.size() == 12 ? t : nullptr;
        for (std::size_t i = 0; !sheet_of && i < app.session.tunings.size(); ++i)
            if (app.session.tunings[i].scale.size() == 12) sheet_of = &app.session.tunings[i];
        if (sheet_of) {
            SheetOptions sopt;
            sopt.reference = copt.reference;
            a.sheet = make_sheet(sheet_of->scale, sopt, sheet_of->source);
            a.sheet_name = tuning_label(sheet_of->source);
            if (sheet_of != t)
                a.sheet_note = "The current tuning, " + tuning_label(t->source) + ", has " + std::to_string(t->scale.size()) +
                               " degrees; the tuner's sheet is for 12-note tunings, so this is the sheet of " + a.sheet_name + ".";
        } else {
            a.sheet_error = "The tuner's sheet is for 12-note tunings; " + tuning_label(t->source) + " has " +
                            std::to_string(t->scale.size()) + " degrees. Open one from scales/ (or a recipe such as \"equal 12\").";
        }
    } catch (const InputError& e) {
        a.comparison_error = shown(e);
    }
    // Until the worker answers, the last keyboard fit stays on screen only if it is still
    // valid; the status bar says it is being computed.
    app.analysis = std::move(a);
    update_grid(app);
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
        app.error = shown(e);
        app.session_path.clear(); // stop retrying a failing autosave every frame
        app.session_lock = SessionLock();
        return false;
    }
}

void start_session(App& app, const std::filesystem::path& path, bool fresh) {
    app.session_path = path;
    if (path.empty()) return;
    app.session_lock = SessionLock(path);
    const bool read_only = app.session_lock.busy();
    std::error_code ec;
    if (!fresh && !std::filesystem::exists(path, ec) && !read_only) {
        // The first run starts from the demo session, so that every view has something to show.
        try {
            app.session = load_session_file(asset("demo-session.json"));
            app.status = "first run: the demo session (File > Close tuning to clear it)";
        } catch (const InputError& e) {
            app.error = shown(e);
        }
    } else if (!fresh && std::filesystem::exists(path, ec)) {
        try {
            app.session = load_session_file(path);
            app.status = "restored " + path.string();
        } catch (const InputError& e) {
            if (read_only) {
                app.error = shown(e) + " (started a fresh session)";
            } else {
                // Keep the unreadable file for the user and start afresh beside it.
                const auto kept = keep_unreadable_session(path);
                app.error = shown(e) + (kept.empty() ? " (could not move it aside" : " (kept as " + kept.string()) +
                            "; started a fresh session)";
            }
        }
    }
    if (read_only) {
        // The other window keeps saving its own work there; two writers would lose one's.
        app.session_path.clear();
        app.notice = path.string() + " is open in another terzo window: this window shows it read-only and saves nothing "
                                     "there (File > Save session as... keeps this window's work in a file of its own)";
    }
}

void adopt_session_path(App& app, const std::filesystem::path& path) {
    if (path == app.session_path) return;
    SessionLock lock(path);
    if (lock.busy()) fail({path.string(), 0, 0}, "is open in another terzo window; choose another file");
    app.session_lock = std::move(lock);
    app.session_path = path;
    app.notice.clear();
}

void stop_background(App& app) {
    BackgroundFit& b = app.background;
    if (b.cancel) b.cancel->store(true);
    if (b.job.valid()) b.job.wait();
    b.wanted = false;
}

// The assets folder (font, demo session): $TERZO_ASSETS, else share/terzo/assets beside an
// installed program (PREFIX/bin/terzo-gui), else the source tree's assets/ the build names.
std::filesystem::path asset(const std::string& name) {
    const char* env = std::getenv("TERZO_ASSETS");
    if (env && *env) return std::filesystem::path(env) / name;
    std::error_code ec;
    const std::filesystem::path exe = std::filesystem::read_symlink("/proc/self/exe", ec);
    const std::filesystem::path installed = exe.parent_path().parent_path() / "share/terzo/assets";
    if (!ec && std::filesystem::is_directory(installed, ec)) return installed / name;
    return std::filesystem::path(TERZO_ASSETS_DIR) / name;
}

std::string shown(const InputError& e) { return worded(e, setting_label); }

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
