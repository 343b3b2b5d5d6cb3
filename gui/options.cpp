#include "gui/options.hpp"

#include <algorithm>
#include <cstdio>
#include <cstdlib>

#include <CLI/CLI.hpp>

#include "core/error.hpp"
#include "core/io/session.hpp"

namespace terzo::gui {

Options parse_options(int argc, char** argv) {
    Options o;
    CLI::App app{"terzo-gui: the window of terzo. Opens tunings (.scl files or recipes such as "
                 "\"equal 31\"), restores the last session and saves it as you work.",
                 "terzo-gui"};
    app.add_option("TUNING", o.tunings, "A .scl file or a recipe to open (several may be given)");
    app.add_option("--session", o.session,
                   "The session file to restore and autosave (default: $XDG_STATE_HOME/terzo/session.json "
                   "or ~/.local/state/terzo/session.json). Another window holding it opens it read-only");
    app.add_flag("--fresh", o.fresh, "Do not restore the last session");
    app.add_option("--view", o.view, "Start in view lattice, grid, keys or sheet")
        ->check(CLI::IsMember(session_views));
    app.add_option("--select", o.select, "Select notes (numbers on the keyboard, 0 = degree 0 of the lowest period)");
    auto* shot = app.add_option("--screenshot", o.screenshot, "Render the first stable frame, save it as PNG and exit");
    app.add_option("--screenshot-text", o.screenshot_text,
                   "With --screenshot: also save the text of that frame's panels and tables, one line per "
                   "row as laid out (what tests read instead of the pixels)")
        ->needs(shot);
    app.add_option("--bench-frames", o.bench_frames,
                   "Render N frames recomputing every view (keyboard of at least 88 notes, order 5) and "
                   "print milliseconds per frame")
        ->check(CLI::Range(1, 100000))
        ->excludes("--screenshot");
    app.add_flag("--force", o.force, "Let --screenshot replace an existing file");
    app.add_option("--autosave-ms", o.autosave_ms, "Save the session N ms after the last change")
        ->check(CLI::Range(0, 3600000))
        ->capture_default_str();
    try {
        app.parse(argc, argv);
    } catch (const CLI::ParseError& e) {
        if (e.get_exit_code() == 0) std::exit(app.exit(e)); // --help
        fail({"terzo-gui", 0, 0}, std::string(e.what()) + " (see terzo-gui --help)");
    }
    return o;
}

std::vector<int> parse_selection(const std::string& text, int notes) {
    std::vector<int> out;
    std::size_t start = 0;
    while (start <= text.size()) {
        std::size_t comma = text.find(',', start);
        std::string item = text.substr(start, comma == std::string::npos ? std::string::npos : comma - start);
        char* end = nullptr;
        long n = std::strtol(item.c_str(), &end, 10);
        if (item.empty() || *end || n < 0 || n >= notes)
            fail({"--select", 0, 0}, excerpt(item) + " is not a note number from 0 to " + std::to_string(notes - 1));
        out.push_back(static_cast<int>(n));
        if (comma == std::string::npos) break;
        start = comma + 1;
    }
    if (out.size() > max_selection) fail({"--select", 0, 0}, "at most " + std::to_string(max_selection) + " notes can be selected");
    return out;
}

} // namespace terzo::gui
