// A terzo-gui session as a JSON file: the open tunings (each stored in full as .scl text, so
// a session survives a moved or deleted file), the analysis settings, the selected notes and
// the view. Reading is strict: every malformed file gets one InputError naming the file and
// the line and column (JSON syntax) or the key (wrong value). Format: see README.md.
#pragma once

#include <filesystem>
#include <istream>
#include <ostream>
#include <string>
#include <vector>

#include "core/analysis/combination.hpp"
#include "core/tuning/key_map.hpp"
#include "core/tuning/scale.hpp"

namespace terzo {

/// Analysis settings every view shares (ranges as in core/analysis: keyboard.hpp and
/// combination.hpp).
struct SessionSettings {
    double reference_hz = default_ref_hz;  ///< degree 0 of the lowest period (C4 at A4 = 440, as the CLI)
    int span = 3;                          ///< keyboard span in periods, 1..max_span
    int max_order = 5;                     ///< largest combination-tone order |a| + |b|
    int partials = 1;                      ///< partials per note (1 = pure tones)
    double landing_tolerance_cents = 5.0;  ///< a resultant this close to a note "lands" on it
    double lattice_tolerance_cents = 20.0; ///< nearest-just search for the lattice
    int odd_limit = 15;                    ///< odd limit of that search
    std::string grid_measure = "fit";      ///< dyad grid colour: "fit" or "worst" deviation
    /// Reference of the keys and sheet views ("A4=415"); degree 0 of a 12-note tuning is C.
    std::string pitch_reference = "A4=440";
};

/// One open tuning.
struct SessionTuning {
    std::string source; ///< what it was opened from (a path, or a name), shown to the user
    Scale scale;        ///< the tuning itself
};

/// Everything terzo-gui restores.
struct Session {
    std::vector<SessionTuning> tunings;
    int current = 0;             ///< index into tunings (0 when there are none)
    SessionSettings settings;
    /// Selected notes as indices into the current keyboard's notes (period * size + degree),
    /// ascending, at most max_selection.
    std::vector<int> selection;
    std::string view = "lattice"; ///< one of session_views
    double volume = 0.1;         ///< listening volume, 0 to 1
    /// How MIDI keys play the current tuning (the window's key strip); sessions written
    /// before key maps existed have none and read as every-key.
    KeyMapSpec key_map;
};

inline constexpr std::size_t max_session_tunings = 64;
inline constexpr std::size_t max_selection = 8;
inline constexpr std::size_t max_session_bytes = 64u << 20;
inline const std::vector<std::string> session_views = {"lattice", "grid", "keys", "sheet"};

/// Throws InputError (source = source) when a setting is outside its documented range.
void check_settings(const SessionSettings& s, const std::string& source);
/// Writes the session as JSON (format "terzo-session", version 1).
void write_session(std::ostream& out, const Session& session);
/// Reads a session; source names it in error messages. Throws InputError.
Session read_session(std::istream& in, const std::string& source);
/// Reads a session file; throws InputError naming the path.
Session load_session_file(const std::filesystem::path& path);
/// Writes a session file atomically, replacing an older one (sessions are saved over).
void save_session_file(const std::filesystem::path& path, const Session& session);
/// Moves an unreadable session file aside to the first free name of "<path>.unreadable",
/// "<path>.unreadable-2" … (an earlier one is never replaced) and returns that name; empty
/// when it could not be moved.
std::filesystem::path keep_unreadable_session(const std::filesystem::path& path);

} // namespace terzo
