// terzo-gui: set-up, the frame loop and shut-down. The options are read in options.cpp, the
// pictures saved by screenshot.cpp, frames timed by benchmark.cpp; everything drawn is in
// layout.cpp and the view/panel files; everything computed comes from core.
#include <chrono>
#include <csignal>
#include <cstdio>
#include <cstdlib>
#include <memory>
#include <optional>
#include <string>

#include <SFML/Graphics/RenderWindow.hpp>
#include <SFML/Window/Event.hpp>
#include <imgui.h>

#include "core/error.hpp"
#include "gui/app.hpp"
#include "gui/audio.hpp"
#include "gui/benchmark.hpp"
#include "gui/colours.hpp"
#include "gui/gl_render.hpp"
#include "gui/imgui_sfml.hpp"
#include "gui/options.hpp"
#include "gui/screenshot.hpp"
#include "gui/style.hpp"
#include "gui/views.hpp"

namespace {

using namespace terzo;
using namespace terzo::gui;

volatile std::sig_atomic_t stop_requested = 0;
extern "C" void on_signal(int) { stop_requested = 1; }

// The messages a batch run (--screenshot, --bench-frames) leaves on stderr: what the window
// would have shown in red or in its status bar.
void print_batch_messages(const App& app) {
    const Analysis& a = app.analysis;
    for (const std::string* m : {&app.notice, &app.error, &a.error, &a.selection_error, &a.grid_error, &a.keyboard_fit_error})
        if (!m->empty()) std::fprintf(stderr, "terzo-gui: %s\n", m->c_str());
}

} // namespace

int main(int argc, char** argv) {
    Options opt;
    try {
        opt = parse_options(argc, argv);
    } catch (const InputError& e) {
        std::fprintf(stderr, "%s\n", e.what());
        return 2;
    }
    // SFML aborts the process when it cannot reach a display: check first.
    const char* display = std::getenv("DISPLAY");
    if (!display || !*display) {
        std::fputs("terzo-gui: no display (DISPLAY is not set). Run it on a desktop; for --screenshot or\n"
                   "--bench-frames without a screen use xvfb-run -a -s \"-screen 0 1280x800x24\" terzo-gui ...\n",
                   stderr);
        return 1;
    }
    const bool batch = opt.batch();
    // SIGTERM and Ctrl-C end the loop at the next frame; the session is saved on the way out.
    std::signal(SIGTERM, on_signal);
    std::signal(SIGINT, on_signal);

    App app;
    start_session(app, !opt.session.empty() ? std::filesystem::path(opt.session) : batch ? std::filesystem::path() : default_session_path(),
                  opt.fresh);
    for (const std::string& t : opt.tunings) {
        if (!open_tuning(app, t) && batch) {
            std::fprintf(stderr, "terzo-gui: %s\n", app.error.c_str());
            return 1;
        }
    }
    if (!opt.view.empty()) app.session.view = opt.view;
    if (opt.bench_frames && !set_up_benchmark(app)) {
        std::fputs("terzo-gui: --bench-frames needs a tuning\n", stderr);
        return 1;
    }
    try {
        if (!opt.select.empty()) {
            const SessionTuning* t = current_tuning(app);
            int notes = t ? app.session.settings.span * static_cast<int>(t->scale.size()) + 1 : 0;
            select_notes(app, parse_selection(opt.select, notes));
        }
    } catch (const InputError& e) {
        std::fprintf(stderr, "terzo-gui: %s\n", e.what());
        return 2;
    }
    touch(app);
    app.dirty = !opt.tunings.empty() || !opt.select.empty();

    sf::RenderWindow window(sf::VideoMode(1280, 800), "terzo", sf::Style::Default);
    window.setPosition({0, 0}); // with no window manager SFML would open it at (0, 240)
    window.setVerticalSyncEnabled(false);
    if (!batch) window.setFramerateLimit(60);
    set_up_imgui();
    ImGuiIO& io = ImGui::GetIO();
    platform_init(io, true);
    renderer_init();
    use_unfiltered_font_texture();

    // Sound only in interactive runs, created before the loop (no device is opened until Play).
    std::unique_ptr<Player> player;
    if (!batch) {
        player = std::make_unique<Player>();
        app.player = player.get();
    }

    std::optional<FrameBench> bench;
    if (opt.bench_frames) bench.emplace(opt.bench_frames);
    sf::Clock clock;
    int frame = 0;
    int exit_code = 0;
    const int screenshot_frame = 6; // layout and tab selection settle within a few frames
    std::string frame_text;         // --screenshot-text: the words of the frame just drawn
    while (window.isOpen() && !app.quit && !stop_requested) {
        FrameBench::Marks m;
        m.start = FrameBench::Clock::now();
        sf::Event event;
        while (window.pollEvent(event)) {
            platform_event(io, event);
            if (event.type == sf::Event::Closed) app.quit = true;
        }
        platform_new_frame(io, window.getSize(), clock.restart().asSeconds());
        renderer_new_frame();
        ImGui::NewFrame();
        const bool record_text = !opt.screenshot_text.empty();
        if (record_text) begin_frame_text();
        m.analysis = FrameBench::Clock::now();
        refresh(app);
        m.drawing = FrameBench::Clock::now();
        draw_app(app);
        if (record_text) frame_text = end_frame_text();
        ImGui::Render();
        m.rasterising = FrameBench::Clock::now();
        window.setActive(true);
        clear_window(pane_colour);
        window.pushGLStates();
        renderer_render(ImGui::GetDrawData());
        window.popGLStates();
        if (bench) finish_gl(); // so that rasterising is timed apart from display
        m.rasterised = FrameBench::Clock::now();

        // The first stable frame: layout settled and the background fit in.
        const bool shoot = !opt.screenshot.empty() && frame >= screenshot_frame && !background_pending(app);
        const bool export_lattice = !app.lattice_png.empty() && app.lattice_png_delay-- <= 0;
        if (shoot || export_lattice) {
            const sf::Image image = grab_window(window);
            try {
                if (shoot) {
                    save_window_png(image, opt.screenshot, opt.force);
                    if (!opt.screenshot_text.empty()) save_frame_text(frame_text, opt.screenshot_text, opt.force);
                    std::printf("saved %s (%ux%u, view %s)\n", opt.screenshot.c_str(), image.getSize().x, image.getSize().y,
                                app.session.view.c_str());
                    app.quit = true;
                } else {
                    save_part_png(image, app.lattice_rect, app.lattice_png, app.lattice_png_force);
                    app.status = "exported " + app.lattice_png;
                }
            } catch (const InputError& e) {
                if (shoot) {
                    std::fprintf(stderr, "terzo-gui: %s\n", e.what());
                    exit_code = 1;
                    app.quit = true;
                }
                app.error = e.what();
            }
            if (export_lattice) app.lattice_png.clear();
        }
        window.display();
        autosave(app, std::chrono::milliseconds(opt.autosave_ms));
        m.end = FrameBench::Clock::now();
        if (bench) {
            bench->record(m, ImGui::GetDrawData());
            if (bench->done()) app.quit = true;
        }
        ++frame;
    }
    stop_background(app);
    if (app.dirty) save_session(app);
    app.player = nullptr;
    player.reset();
    renderer_shutdown();
    platform_shutdown(io);
    ImGui::DestroyContext();
    window.close();

    if (bench) bench->print(app);
    if (batch) print_batch_messages(app);
    return exit_code;
}
