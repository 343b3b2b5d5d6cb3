// terzo-gui: set-up, the frame loop and shut-down. Everything drawn is in layout.cpp and the
// view/panel files; everything computed comes from core.
#include <algorithm>
#include <chrono>
#include <memory>
#include <csignal>
#include <numeric>
#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <string>
#include <system_error>
#include <vector>

#include <SFML/Graphics/RenderWindow.hpp>
#include <SFML/Graphics/Texture.hpp>
#include <SFML/Window/Event.hpp>
#include <backends/imgui_impl_opengl2.h>
#include <imgui.h>

#include "bench/steal.hpp"
#include "core/error.hpp"
#include "core/format.hpp"
#include "gui/app.hpp"
#include "gui/audio.hpp"
#include "gui/colours.hpp"
#include "gui/gl_render.hpp"
#include "gui/image_file.hpp"
#include "gui/imgui_sfml.hpp"
#include "gui/views.hpp"

namespace {

using namespace terzo;
using namespace terzo::gui;

volatile std::sig_atomic_t stop_requested = 0;
extern "C" void on_signal(int) { stop_requested = 1; }

const char* usage =
    "usage: terzo-gui [options] [TUNING...]\n"
    "  TUNING                a .scl file to open (several may be given)\n"
    "  --session FILE        the session file to restore and autosave (default:\n"
    "                        $XDG_STATE_HOME/terzo/session.json or ~/.local/state/terzo/session.json)\n"
    "  --fresh               do not restore the last session\n"
    "  --view V              start in view lattice, grid, keys or sheet\n"
    "  --select N,N,...      select notes (numbers on the keyboard, 0 = degree 0 of the lowest period)\n"
    "  --screenshot FILE     render the first stable frame, save it as PNG and exit\n"
    "  --bench-frames N      render N frames recomputing every view (keyboard of at least 88\n"
    "                        notes, order 5) and print milliseconds per frame\n"
    "  --force               let --screenshot replace an existing file\n"
    "  --autosave-ms N       save the session N ms after the last change (default 1000)\n"
    "  --help                this text\n";

struct Options {
    std::vector<std::string> tunings;
    std::string session, view, screenshot, select;
    bool fresh = false, force = false;
    int bench_frames = 0;
    int autosave_ms = 1000;
};

Options parse(int argc, char** argv) {
    Options o;
    for (int i = 1; i < argc; ++i) {
        std::string a = argv[i];
        auto value = [&]() -> std::string {
            if (i + 1 >= argc) fail({a, 0, 0}, "needs a value");
            return argv[++i];
        };
        if (a == "--help" || a == "-h") {
            std::fputs(usage, stdout);
            std::exit(0);
        } else if (a == "--session") o.session = value();
        else if (a == "--view") {
            o.view = value();
            if (std::find(session_views.begin(), session_views.end(), o.view) == session_views.end())
                fail({a, 0, 0}, "\"" + o.view + "\" is not a view; use lattice, grid, keys or sheet");
        } else if (a == "--select") o.select = value();
        else if (a == "--screenshot") o.screenshot = value();
        else if (a == "--bench-frames") {
            std::string v = value();
            char* end = nullptr;
            long n = std::strtol(v.c_str(), &end, 10);
            if (v.empty() || *end || n < 1 || n > 100000) fail({a, 0, 0}, "\"" + v + "\" is not a frame count from 1 to 100000");
            o.bench_frames = static_cast<int>(n);
        } else if (a == "--autosave-ms") {
            std::string v = value();
            char* end = nullptr;
            long n = std::strtol(v.c_str(), &end, 10);
            if (v.empty() || *end || n < 0 || n > 3600000) fail({a, 0, 0}, "\"" + v + "\" is not a delay from 0 to 3600000 ms");
            o.autosave_ms = static_cast<int>(n);
        } else if (a == "--fresh") o.fresh = true;
        else if (a == "--force") o.force = true;
        else if (a.size() > 1 && a[0] == '-') fail({a, 0, 0}, "unknown option; see terzo-gui --help");
        else o.tunings.push_back(a);
    }
    if (!o.screenshot.empty() && o.bench_frames) fail({"--screenshot", 0, 0}, "cannot be combined with --bench-frames");
    return o;
}

std::vector<int> parse_notes(const std::string& text, int notes) {
    std::vector<int> out;
    std::size_t start = 0;
    while (start <= text.size()) {
        std::size_t comma = text.find(',', start);
        std::string item = text.substr(start, comma == std::string::npos ? std::string::npos : comma - start);
        char* end = nullptr;
        long n = std::strtol(item.c_str(), &end, 10);
        if (item.empty() || *end || n < 0 || n >= notes)
            fail({"--select", 0, 0}, "\"" + item + "\" is not a note number from 0 to " + std::to_string(notes - 1));
        out.push_back(static_cast<int>(n));
        if (comma == std::string::npos) break;
        start = comma + 1;
    }
    if (out.size() > max_selection) fail({"--select", 0, 0}, "at most " + std::to_string(max_selection) + " notes can be selected");
    return out;
}

// The folder of the font (and demo): $TERZO_ASSETS, else share/terzo/assets beside an
// installed program (PREFIX/bin/terzo-gui), else the source tree's assets/ the build names.
std::string assets_dir() {
    const char* env = std::getenv("TERZO_ASSETS");
    if (env && *env) return env;
    std::error_code ec;
    const std::filesystem::path exe = std::filesystem::read_symlink("/proc/self/exe", ec);
    const std::filesystem::path installed = exe.parent_path().parent_path() / "share/terzo/assets";
    if (!ec && std::filesystem::is_directory(installed, ec)) return installed.string();
    return TERZO_ASSETS_DIR;
}

void set_up_imgui() {
    ImGui::CreateContext();
    ImGuiIO& io = ImGui::GetIO();
    io.IniFilename = nullptr; // the layout is fixed; nothing to remember
    // Latin-1, general punctuation, arrows, maths operators and geometric shapes (legend symbols).
    static const ImWchar ranges[] = {0x0020, 0x00FF, 0x2010, 0x206F, 0x2190, 0x21FF, 0x2200, 0x22FF, 0x25A0, 0x25FF, 0};
    std::string font = assets_dir() + "/fonts/DejaVuSans.ttf";
    // Glyphs rendered once at their screen size and placed on whole pixels, so that the
    // atlas can be sampled without filtering (gl_render.hpp); lines are smoothed by their
    // geometry, not by filtering the atlas.
    ImFontConfig config;
    config.OversampleH = 1;
    config.OversampleV = 1;
    config.PixelSnapH = true;
    if (!io.Fonts->AddFontFromFileTTF(font.c_str(), 16.0f, &config, ranges)) {
        std::fprintf(stderr, "terzo-gui: warning: %s not found; using ImGui's built-in font\n", font.c_str());
        io.Fonts->AddFontDefault();
    }
    ImGui::StyleColorsDark();
    ImGuiStyle& s = ImGui::GetStyle();
    s.WindowRounding = 0.0f;
    s.FrameRounding = 3.0f;
    s.AntiAliasedLinesUseTex = false;
    s.Colors[ImGuiCol_WindowBg] = ImGui::ColorConvertU32ToFloat4(pane_colour);
    s.Colors[ImGuiCol_TitleBg] = s.Colors[ImGuiCol_TitleBgActive] = ImVec4(0.16f, 0.22f, 0.30f, 1.0f);
    s.Colors[ImGuiCol_Tab] = ImVec4(0.18f, 0.22f, 0.28f, 1.0f);
    s.Colors[ImGuiCol_TabActive] = ImVec4(0.27f, 0.45f, 0.66f, 1.0f);
}

} // namespace

int main(int argc, char** argv) {
    Options opt;
    try {
        opt = parse(argc, argv);
    } catch (const InputError& e) {
        std::fprintf(stderr, "terzo-gui: %s\n", e.what());
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
    const bool batch = !opt.screenshot.empty() || opt.bench_frames > 0;

    App app;
    app.session_path = !opt.session.empty() ? std::filesystem::path(opt.session) : batch ? std::filesystem::path() : default_session_path();
    std::error_code ec;
    if (!opt.fresh && !app.session_path.empty() && std::filesystem::exists(app.session_path, ec)) {
        try {
            app.session = load_session_file(app.session_path);
            app.status = "restored " + app.session_path.string();
        } catch (const InputError& e) {
            // Keep the unreadable file for the user and start afresh beside it.
            auto kept = app.session_path;
            kept += ".unreadable";
            std::filesystem::rename(app.session_path, kept, ec);
            app.error = std::string(e.what()) + " (kept as " + kept.string() + "; started a fresh session)";
        }
    }
    for (const std::string& t : opt.tunings) {
        if (!open_tuning(app, t) && batch) {
            std::fprintf(stderr, "terzo-gui: %s\n", app.error.c_str());
            return 1;
        }
    }
    if (!opt.view.empty()) app.session.view = opt.view;
    if (opt.bench_frames) {
        if (!current_tuning(app)) {
            std::fputs("terzo-gui: --bench-frames needs a tuning\n", stderr);
            return 1;
        }
        // At least 88 notes (like a piano keyboard) at order 5.
        int size = static_cast<int>(current_tuning(app)->scale.size());
        app.session.settings.span = std::clamp((87 + size - 1) / size, 1, max_span);
        app.session.settings.max_order = 5;
        app.benchmark = true;
    }
    try {
        if (!opt.select.empty()) {
            const SessionTuning* t = current_tuning(app);
            int notes = t ? app.session.settings.span * static_cast<int>(t->scale.size()) + 1 : 0;
            select_notes(app, parse_notes(opt.select, notes));
        }
    } catch (const InputError& e) {
        std::fprintf(stderr, "terzo-gui: %s\n", e.what());
        return 2;
    }
    touch(app);
    app.dirty = !opt.tunings.empty() || !opt.select.empty();

    std::signal(SIGTERM, on_signal);
    std::signal(SIGINT, on_signal);

    sf::RenderWindow window(sf::VideoMode(1280, 800), "terzo", sf::Style::Default);
    window.setPosition({0, 0}); // with no window manager SFML would open it at (0, 240)
    window.setVerticalSyncEnabled(false);
    if (!batch) window.setFramerateLimit(60);
    set_up_imgui();
    ImGuiIO& io = ImGui::GetIO();
    platform_init(io, true);
    ImGui_ImplOpenGL2_Init();
    use_unfiltered_font_texture();

    // Sound only in interactive runs, created before the loop (no device is opened until Play).
    std::unique_ptr<Player> player;
    if (!batch) {
        player = std::make_unique<Player>();
        app.player = player.get();
    }

    sf::Clock clock;
    const bench::CpuTicks ticks_before = bench::machine_cpu_ticks();
    std::vector<double> frame_ms;
    double part_ms[3] = {0, 0, 0}; // analysis (refresh), ImGui drawing and rasterising, summed over measured frames
    int draw_calls = 0;           // ImGui draw commands in the last measured frame
    int vertices = 0;           // ImGui vertices in the last measured frame
    int frame = 0;
    int exit_code = 0;
    const int screenshot_frame = 6; // layout and tab selection settle within a few frames
    const int warm_up = 3;
    while (window.isOpen() && !app.quit && !stop_requested) {
        auto t0 = std::chrono::steady_clock::now();
        sf::Event event;
        while (window.pollEvent(event)) {
            platform_event(io, event);
            if (event.type == sf::Event::Closed) app.quit = true;
        }
        platform_new_frame(io, window.getSize(), clock.restart().asSeconds());
        ImGui_ImplOpenGL2_NewFrame();
        ImGui::NewFrame();
        auto t1 = std::chrono::steady_clock::now();
        refresh(app);
        auto t2 = std::chrono::steady_clock::now();
        draw_app(app);
        ImGui::Render();
        auto t3 = std::chrono::steady_clock::now();
        window.setActive(true);
        clear_window(pane_colour);
        window.pushGLStates();
        ImGui_ImplOpenGL2_RenderDrawData(ImGui::GetDrawData());
        window.popGLStates();
        if (opt.bench_frames) finish_gl(); // so that rasterising is timed apart from display
        auto t4 = std::chrono::steady_clock::now();

        // The first stable frame: layout settled and the background fit in.
        const bool shoot = !opt.screenshot.empty() && frame >= screenshot_frame && !background_pending(app);
        const bool export_lattice = !app.lattice_png.empty() && app.lattice_png_delay-- <= 0;
        if (shoot || export_lattice) {
            sf::Texture tex;
            tex.create(window.getSize().x, window.getSize().y);
            tex.update(window);
            sf::Image img = tex.copyToImage();
            const int w = static_cast<int>(img.getSize().x), h = static_cast<int>(img.getSize().y);
            try {
                if (shoot) {
                    save_png(opt.screenshot, img.getPixelsPtr(), w, h, w * 4, opt.force ? Overwrite::allow : Overwrite::refuse);
                    std::printf("saved %s (%dx%d, view %s)\n", opt.screenshot.c_str(), w, h, app.session.view.c_str());
                    app.quit = true;
                } else {
                    int x = std::clamp(static_cast<int>(app.lattice_rect[0]), 0, w - 1), y = std::clamp(static_cast<int>(app.lattice_rect[1]), 0, h - 1);
                    int cw = std::clamp(static_cast<int>(app.lattice_rect[2]), 1, w - x), ch = std::clamp(static_cast<int>(app.lattice_rect[3]), 1, h - y);
                    save_png(app.lattice_png, img.getPixelsPtr() + (static_cast<std::size_t>(y) * w + x) * 4, cw, ch, w * 4,
                             app.lattice_png_force ? Overwrite::allow : Overwrite::refuse);
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

        if (opt.bench_frames) {
            double ms = std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t0).count();
            if (frame >= warm_up) {
                frame_ms.push_back(ms);
                part_ms[0] += std::chrono::duration<double, std::milli>(t2 - t1).count();
                part_ms[1] += std::chrono::duration<double, std::milli>(t3 - t2).count();
                part_ms[2] += std::chrono::duration<double, std::milli>(t4 - t3).count();
                const ImDrawData* dd = ImGui::GetDrawData();
                vertices = dd->TotalVtxCount;
                draw_calls = 0;
                for (int i = 0; i < dd->CmdListsCount; ++i) draw_calls += dd->CmdLists[i]->CmdBuffer.Size;
            }
            if (static_cast<int>(frame_ms.size()) >= opt.bench_frames) app.quit = true;
        }
        ++frame;
    }
    if (app.dirty) save_session(app);
    app.player = nullptr;
    player.reset();
    ImGui_ImplOpenGL2_Shutdown();
    platform_shutdown(io);
    ImGui::DestroyContext();
    window.close();

    if (opt.bench_frames) {
        std::vector<double> sorted = frame_ms;
        std::sort(sorted.begin(), sorted.end());
        const Analysis& a = app.analysis;
        std::printf("frames %zu (after %d warm-up), keyboard %zu notes, order %d, %zu selected notes\n", sorted.size(), warm_up,
                    a.keyboard ? a.keyboard->notes().size() : 0, app.session.settings.max_order, app.session.selection.size());
        if (!sorted.empty())
            std::printf("ms per frame: median %s, worst %s\n", fixed(sorted[sorted.size() / 2], 3).c_str(), fixed(sorted.back(), 3).c_str());
        if (!sorted.empty()) {
            const double n = static_cast<double>(sorted.size());
            const double all = std::accumulate(sorted.begin(), sorted.end(), 0.0) / n;
            std::printf("mean per frame %s ms (%d ImGui vertices, %d draw commands): analysis %s, ImGui drawing %s, OpenGL rasterising %s, "
                        "the rest (events, display) %s\n",
                        fixed(all, 3).c_str(), vertices, draw_calls, fixed(part_ms[0] / n, 3).c_str(), fixed(part_ms[1] / n, 3).c_str(),
                        fixed(part_ms[2] / n, 3).c_str(), fixed(all - (part_ms[0] + part_ms[1] + part_ms[2]) / n, 3).c_str());
        }
        bench::print_steal_since(ticks_before);
        if (!a.error.empty()) std::printf("analysis: %s\n", a.error.c_str());
        const BackgroundFit& b = app.background;
        if (b.completed)
            std::printf("whole-keyboard fit on the worker thread (idle priority): %zu recomputations, mean %s ms each (wall clock)\n", b.completed,
                        fixed(b.total_ms / static_cast<double>(b.completed), 3).c_str());
    }
    if (!app.error.empty() && batch) std::fprintf(stderr, "terzo-gui: %s\n", app.error.c_str());
    return exit_code;
}
