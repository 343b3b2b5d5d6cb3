// terzo-gui's command line: what it asks for, read by CLI11 (in options.cpp only: CLI11 is the
// slowest header to compile).
#pragma once

#include <string>
#include <vector>

namespace terzo::gui {

struct Options {
    std::vector<std::string> tunings; ///< .scl files or recipes to open
    std::string session;              ///< --session FILE; empty: the default file (or none in batch runs)
    std::string view;                 ///< --view; empty: the session's
    std::string screenshot;           ///< --screenshot FILE
    std::string screenshot_text;      ///< --screenshot-text FILE: the words drawn in that frame
    std::string select;               ///< --select N,N,...
    bool fresh = false;
    bool force = false;
    int bench_frames = 0;
    int autosave_ms = 1000;
    /// --screenshot or --bench-frames: no sound, no default session file, exit when done.
    bool batch() const { return !screenshot.empty() || bench_frames > 0; }
};

/// Reads the command line. Prints the help and exits 0 for --help; throws InputError naming
/// the option for anything else wrong.
Options parse_options(int argc, char** argv);

/// "0,4,7" -> {0, 4, 7}: note numbers of the keyboard (0 .. notes - 1), at most max_selection;
/// throws InputError naming --select.
std::vector<int> parse_selection(const std::string& text, int notes);

} // namespace terzo::gui
