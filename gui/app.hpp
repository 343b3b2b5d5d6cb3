// The application state terzo-gui owns: the session (what is saved), what the views show
// computed by core from it (rebuilt only when the tuning or a setting changes), and the
// transient interface state. Views draw it; actions below change it.
#pragma once

#include <chrono>
#include <cstdint>
#include <future>
#include <filesystem>
#include <optional>
#include <string>
#include <vector>

#include "core/analysis/chord.hpp"
#include "core/analysis/compare.hpp"
#include "core/analysis/sheet.hpp"
#include "core/analysis/dyad_grid.hpp"
#include "core/analysis/fit.hpp"
#include "core/analysis/keyboard.hpp"
#include "core/analysis/lattice.hpp"
#include "core/report/compare_report.hpp"
#include "core/io/session.hpp"
#include "gui/file_dialog.hpp"

namespace terzo::gui {

/// What core computed for the current tuning and settings.
struct Analysis {
    std::optional<Keyboard> keyboard;
    std::vector<LatticePlace> degree_places;   ///< per degree of the scale
    std::vector<DyadTones> selection_tones;    ///< every pair of the selected notes
    std::vector<std::vector<LatticePlace>> tone_places; ///< per selection_tones[i].tones[j]
    std::optional<Fit> selection_fit;
    std::optional<CommonBass> selection_bass;  ///< for two or more selected notes
    std::vector<DyadCell> grid;                ///< n*n cells of the dyad grid
    std::optional<Fit> keyboard_fit;           ///< every dyad of the whole keyboard (in the background)
    std::string keyboard_fit_error;            ///< why that was refused (a limit)
    std::vector<ComparedTuning> comparison;    ///< every open tuning (keys only for 12 notes)
    std::string comparison_error;
    std::optional<Sheet> sheet;                ///< the current tuning's sheet (12 notes only)
    std::string sheet_error;
    std::string error;                         ///< why a part could not be computed
};

/// The whole-keyboard fit (tens of milliseconds for 88 keys at order 5) runs on a worker
/// thread so the window stays responsive; a result is used only if nothing changed meanwhile.
struct BackgroundFit {
    struct Result {
        std::uint64_t generation = 0;
        std::optional<Fit> fit;
        std::string error;
        double ms = 0.0;
    };
    std::future<Result> job;
    bool wanted = false;           ///< a request is waiting for the worker to be free
    std::uint64_t generation = 0;  ///< bumped by every recomputation of the analysis
    std::size_t completed = 0;     ///< results received (for --bench-frames)
    double total_ms = 0.0;         ///< their total time
};

/// Pan and zoom of the lattice view.
struct LatticeCamera {
    float pan_x = 0.0f, pan_y = 0.0f, zoom = 1.0f;
    bool fit = true; ///< frame the degrees at the next draw (new tuning, Home)
};

class Player;

struct App {
    Session session;
    Player* player = nullptr;  ///< the sound output; none in --screenshot and --bench-frames
    int listen_model = 0;      ///< index into the listen panel's models
    std::string recipe_text;   ///< the recipe being typed in the tunings panel
    std::optional<Scale> recipe_preview; ///< what it builds, updated on every keystroke
    std::string recipe_error;
    std::string listen_message;
    std::filesystem::path session_path; ///< where the session autosaves; empty: nowhere
    Analysis analysis;
    BackgroundFit background;
    bool stale = true;       ///< analysis needs recomputing
    bool dirty = false;      ///< session changed since the last save
    std::chrono::steady_clock::time_point last_change{};
    std::string status;      ///< the last message for the status bar
    std::string error;       ///< the last error (shown until the next action)
    LatticeCamera camera;
    FileDialog dialog;
    bool show_help = false;
    bool view_forced = true; ///< the central tabs follow session.view this frame
    bool quit = false;
    std::string lattice_png;  ///< non-empty: save the lattice canvas to this path this frame
    bool lattice_png_force = false;
    int lattice_png_delay = 0; ///< frames to wait so the closing file dialog is not in the image
    float lattice_rect[4] = {0, 0, 0, 0}; ///< x, y, w, h of the lattice canvas last frame
    bool benchmark = false;  ///< recompute every frame (--bench-frames)
};

/// The current tuning, if any is open.
const SessionTuning* current_tuning(const App& app);
/// How a tuning is named on screen: a file by its name (the full path is in the tooltip),
/// a recipe by its text (a recipe may contain '/').
std::string tuning_label(const std::string& source);
/// Opens a tuning argument (a .scl path) and makes it current; errors go to app.error.
bool open_tuning(App& app, const std::string& argument);
/// Closes the current tuning.
void close_current(App& app);
/// Makes tuning i current.
void switch_tuning(App& app, int i);
/// Marks the session changed: the analysis is recomputed and the session autosaved.
void touch(App& app);
/// Toggles one note (index into the keyboard's notes) in the selection.
void toggle_note(App& app, int note);
/// Replaces the selection.
void select_notes(App& app, std::vector<int> notes);
/// Recomputes the analysis through core when stale (the whole-keyboard fit is requested from
/// the worker), and collects or starts the background fit.
void refresh(App& app);
/// True while the background fit for the current settings is not in yet.
bool background_pending(const App& app);
/// Saves the session now (atomically); errors go to app.error.
bool save_session(App& app);
/// Saves when the session changed more than `delay` ago.
void autosave(App& app, std::chrono::milliseconds delay);
/// The default autosave file: $XDG_STATE_HOME/terzo/session.json or ~/.local/state/...
std::filesystem::path default_session_path();

} // namespace terzo::gui
