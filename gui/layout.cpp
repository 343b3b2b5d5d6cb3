// The window layout: a menu bar; the tunings and settings on the left; the central views
// (lattice, dyad grid, keys, sheet) over the keyboard strip; the selection's resultants and
// listening on the right; a status bar. Also the keyboard shortcuts and the file actions.
#include <filesystem>
#include <fstream>
#include <string>

#include <SFML/Window/Keyboard.hpp>

#include "core/error.hpp"
#include "core/io/atomic_file.hpp"
#include "core/format.hpp"
#include "core/tuning/scl.hpp"
#include "core/report/sheet_report.hpp"
#include "gui/views.hpp"

namespace terzo::gui {

namespace {

constexpr float left_width = 330.0f;
constexpr float right_width = 350.0f;
constexpr float strip_height = 66.0f;
constexpr ImGuiWindowFlags fixed_window = ImGuiWindowFlags_NoMove | ImGuiWindowFlags_NoResize | ImGuiWindowFlags_NoCollapse |
                                          ImGuiWindowFlags_NoBringToFrontOnFocus | ImGuiWindowFlags_NoSavedSettings;

/// Begins one of the panes that tile the window. The window is cleared to pane_colour, so the
/// panes draw no background: with software OpenGL, filling the million pixels of the window a
/// second time costs about 3 ms a frame (measured with --bench-frames).
void begin_pane(const char* name, ImVec2 pos, ImVec2 size, ImGuiWindowFlags extra = 0) {
    ImGui::SetNextWindowPos(pos);
    ImGui::SetNextWindowSize(size);
    ImGui::SetNextWindowBgAlpha(0.0f);
    ImGui::Begin(name, nullptr, fixed_window | extra);
}

void set_view(App& app, const char* v) {
    if (app.session.view != v) {
        app.session.view = v;
        app.dirty = true;
        app.last_change = std::chrono::steady_clock::now();
    }
    app.view_forced = true;
}

void open_dialog(App& app, FileDialog::Purpose p) {
    auto cwd = std::filesystem::current_path();
    const SessionTuning* t = current_tuning(app);
    std::string stem = t ? std::filesystem::path(t->source).stem().string() : "tuning";
    switch (p) {
    case FileDialog::Purpose::open_tuning: app.dialog.show(FileDialog::Mode::open, p, ".scl", cwd); break;
    case FileDialog::Purpose::export_scl: app.dialog.show(FileDialog::Mode::save, p, ".scl", cwd, stem + "-copy.scl"); break;
    case FileDialog::Purpose::export_lattice_png: app.dialog.show(FileDialog::Mode::save, p, ".png", cwd, stem + "-lattice.png"); break;
    case FileDialog::Purpose::save_session_as: app.dialog.show(FileDialog::Mode::save, p, ".json", cwd, "session.json"); break;
    case FileDialog::Purpose::export_sheet_svg: // the sheet shown may be another tuning's (view_sheet.cpp)
        app.dialog.show(FileDialog::Mode::save, p, ".svg", cwd, std::filesystem::path(app.analysis.sheet_name).stem().string() + "-sheet.svg");
        break;
    case FileDialog::Purpose::export_comparison_csv: app.dialog.show(FileDialog::Mode::save, p, ".csv", cwd, "comparison.csv"); break;
    }
}

void save_now(App& app) {
    if (app.session_path.empty()) {
        open_dialog(app, FileDialog::Purpose::save_session_as);
        return;
    }
    if (save_session(app)) app.status = "session saved to " + app.session_path.string();
}

// Acts on a path chosen in the file dialog; on failure the dialog comes back with the reason.
void dialog_chosen(App& app, const std::filesystem::path& path) {
    FileDialog& d = app.dialog;
    auto again = [&](const std::string& why) {
        d.visible = true;
        d.message = why;
    };
    try {
        switch (d.purpose) {
        case FileDialog::Purpose::open_tuning:
            if (!open_tuning(app, path.string())) again(app.error);
            break;
        case FileDialog::Purpose::export_scl: {
            const SessionTuning* t = current_tuning(app);
            if (!t) return;
            write_file_atomically(path, [&](std::ostream& out) { write_scl(out, t->scale, path.filename().string()); },
                                  d.replace ? Overwrite::allow : Overwrite::refuse);
            app.status = "exported " + path.string();
            break;
        }
        case FileDialog::Purpose::export_lattice_png:
            set_view(app, "lattice");
            app.lattice_png = path.string();
            app.lattice_png_force = d.replace;
            app.lattice_png_delay = 2;
            break;
        case FileDialog::Purpose::export_sheet_svg: {
            if (!app.analysis.sheet) return;
            std::string svg = sheet_svg(*app.analysis.sheet, paper_a4());
            write_file_atomically(path, [&](std::ostream& out) { out << svg; }, d.replace ? Overwrite::allow : Overwrite::refuse);
            app.status = "exported " + path.string();
            break;
        }
        case FileDialog::Purpose::export_comparison_csv: {
            Table t = keys_long_table(app.analysis.comparison, Spelling::mixed);
            Table c = classes_table(app.analysis.comparison);
            write_file_atomically(path, [&](std::ostream& out) { write_csv(out, t.rows.empty() ? c : t); },
                                  d.replace ? Overwrite::allow : Overwrite::refuse);
            app.status = "exported " + path.string();
            break;
        }
        case FileDialog::Purpose::save_session_as:
            if (std::filesystem::exists(path) && !d.replace) fail({path.string(), 0, 0}, "already exists; tick \"replace\" to write over it");
            adopt_session_path(app, path);
            save_now(app);
            break;
        }
    } catch (const InputError& e) {
        again(shown(e));
    }
}

void shortcuts(App& app) {
    ImGuiIO& io = ImGui::GetIO();
    if (io.WantTextInput || app.dialog.visible) return;
    auto pressed = [](sf::Keyboard::Key k) { return ImGui::IsKeyPressed(k, false); };
    if (io.KeyCtrl) {
        if (pressed(sf::Keyboard::O)) open_dialog(app, FileDialog::Purpose::open_tuning);
        if (pressed(sf::Keyboard::S)) save_now(app);
        if (pressed(sf::Keyboard::E) && current_tuning(app)) open_dialog(app, FileDialog::Purpose::export_scl);
        if (pressed(sf::Keyboard::P) && current_tuning(app)) open_dialog(app, FileDialog::Purpose::export_lattice_png);
        if (pressed(sf::Keyboard::Q)) app.quit = true;
        if (pressed(sf::Keyboard::Tab) && !app.session.tunings.empty())
            switch_tuning(app, (app.session.current + 1) % static_cast<int>(app.session.tunings.size()));
        return;
    }
    if (pressed(sf::Keyboard::Num1)) set_view(app, "lattice");
    if (pressed(sf::Keyboard::Num2)) set_view(app, "grid");
    if (pressed(sf::Keyboard::Num3)) set_view(app, "keys");
    if (pressed(sf::Keyboard::Num4)) set_view(app, "sheet");
    if (pressed(sf::Keyboard::F1)) app.show_help = !app.show_help;
    if (pressed(sf::Keyboard::Space)) play_selection(app);
    if (pressed(sf::Keyboard::Escape) && !app.session.selection.empty()) select_notes(app, {});
    LatticeCamera& c = app.camera;
    if (ImGui::IsKeyPressed(sf::Keyboard::Equal) || ImGui::IsKeyPressed(sf::Keyboard::Add)) c.zoom = std::min(4.0f, c.zoom * 1.15f);
    if (ImGui::IsKeyPressed(sf::Keyboard::Hyphen) || ImGui::IsKeyPressed(sf::Keyboard::Subtract)) c.zoom = std::max(0.25f, c.zoom / 1.15f);
    if (ImGui::IsKeyPressed(sf::Keyboard::Left)) c.pan_x += 40;
    if (ImGui::IsKeyPressed(sf::Keyboard::Right)) c.pan_x -= 40;
    if (ImGui::IsKeyPressed(sf::Keyboard::Up)) c.pan_y += 40;
    if (ImGui::IsKeyPressed(sf::Keyboard::Down)) c.pan_y -= 40;
    if (pressed(sf::Keyboard::Home)) c = LatticeCamera{}; // fit = true: frame the degrees
}

void menu_bar(App& app) {
    if (!ImGui::BeginMainMenuBar()) return;
    if (ImGui::BeginMenu("File")) {
        if (ImGui::MenuItem("Open tuning...", "Ctrl+O")) open_dialog(app, FileDialog::Purpose::open_tuning);
        if (ImGui::MenuItem("Close tuning", nullptr, false, current_tuning(app) != nullptr)) close_current(app);
        ImGui::Separator();
        if (ImGui::MenuItem("Save session", "Ctrl+S")) save_now(app);
        if (ImGui::MenuItem("Save session as...")) open_dialog(app, FileDialog::Purpose::save_session_as);
        ImGui::Separator();
        if (ImGui::MenuItem("Export tuning as .scl...", "Ctrl+E", false, current_tuning(app) != nullptr)) open_dialog(app, FileDialog::Purpose::export_scl);
        if (ImGui::MenuItem("Export lattice as PNG...", "Ctrl+P", false, current_tuning(app) != nullptr)) open_dialog(app, FileDialog::Purpose::export_lattice_png);
        if (ImGui::MenuItem("Export sheet as SVG...", nullptr, false, app.analysis.sheet.has_value())) open_dialog(app, FileDialog::Purpose::export_sheet_svg);
        if (ImGui::MenuItem("Export comparison as CSV...", nullptr, false, !app.analysis.comparison.empty())) open_dialog(app, FileDialog::Purpose::export_comparison_csv);
        ImGui::Separator();
        if (ImGui::MenuItem("Quit", "Ctrl+Q")) app.quit = true;
        ImGui::EndMenu();
    }
    if (ImGui::BeginMenu("View")) {
        if (ImGui::MenuItem("Lattice", "1", app.session.view == "lattice")) set_view(app, "lattice");
        if (ImGui::MenuItem("Dyad grid", "2", app.session.view == "grid")) set_view(app, "grid");
        if (ImGui::MenuItem("Keys", "3", app.session.view == "keys")) set_view(app, "keys");
        if (ImGui::MenuItem("Sheet", "4", app.session.view == "sheet")) set_view(app, "sheet");
        ImGui::Separator();
        if (ImGui::MenuItem("Centre the lattice", "Home")) app.camera = LatticeCamera{};
        if (ImGui::MenuItem("Tuning check (microphone)")) open_check_panel();
        ImGui::EndMenu();
    }
    if (ImGui::BeginMenu("Help")) {
        if (ImGui::MenuItem("Shortcuts and help", "F1")) app.show_help = true;
        ImGui::EndMenu();
    }
    ImGui::EndMainMenuBar();
}

void central(App& app, ImVec2 pos, ImVec2 size) {
    ImGui::PushStyleVar(ImGuiStyleVar_WindowPadding, ImVec2(4, 4));
    begin_pane("##views", pos, size, ImGuiWindowFlags_NoTitleBar);
    ImGui::PopStyleVar();
    struct Tab {
        const char* id;
        const char* label;
        void (*draw)(App&);
        const char* help; ///< one plain line on the tab's hover: what the view shows, trade terms kept
    };
    static const Tab tabs[] = {
        {"lattice", "Lattice", draw_lattice_view,
         "Notes as points: a pure fifth is one step right, a pure major third one step up. The faint "
         "extra tones two notes make together (resultants) are marked where they land."},
        {"grid", "Dyad grid", draw_grid_view,
         "Every pair of notes (a dyad): how far, in cents, the extra tones the pair makes (resultants) "
         "land from the nearest note of the tuning; 0 is exactly on a note."},
        {"keys", "Keys", draw_keys_view,
         "Each major and minor key of a 12-note tuning: how far its fifth and thirds are from pure, and "
         "how many times a second they beat."},
        {"sheet", "Sheet", draw_sheet_view,
         "Tuning by ear: the order in which to set the notes, and the beats per second each interval "
         "should make at the chosen pitch."}};
    // A shortcut or menu (view_forced) selects the tab; otherwise a clicked tab sets the view.
    const bool forced = app.view_forced;
    app.view_forced = false;
    if (ImGui::BeginTabBar("view_tabs")) {
        for (const Tab& t : tabs) {
            ImGuiTabItemFlags f = forced && app.session.view == t.id ? ImGuiTabItemFlags_SetSelected : 0;
            const bool open = ImGui::BeginTabItem(t.label, nullptr, f);
            if (ImGui::IsItemHovered()) {
                ImGui::BeginTooltip();
                ImGui::PushTextWrapPos(ImGui::GetFontSize() * 32);
                ImGui::TextUnformatted(t.help);
                ImGui::PopTextWrapPos();
                ImGui::EndTooltip();
            }
            if (open) {
                if (!forced && app.session.view != t.id) {
                    set_view(app, t.id);
                    app.view_forced = false;
                }
                ImGui::BeginChild("view_body", ImVec2(0, -strip_height), false, ImGuiWindowFlags_NoScrollbar | ImGuiWindowFlags_NoScrollWithMouse);
                t.draw(app);
                ImGui::EndChild();
                ImGui::EndTabItem();
            }
        }
        ImGui::EndTabBar();
    }
    draw_keyboard_strip(app);
    ImGui::End();
}

void status_bar(App& app, ImVec2 pos, ImVec2 size) {
    ImGui::PushStyleVar(ImGuiStyleVar_WindowPadding, ImVec2(8, 4));
    begin_pane("##status", pos, size, ImGuiWindowFlags_NoTitleBar | ImGuiWindowFlags_NoScrollbar);
    ImGui::PopStyleVar();
    const Analysis& a = app.analysis;
    if (!app.notice.empty()) {
        // Stays for the whole run: this window does not save where the user may think it does.
        ImGui::TextColored(ImVec4(1.0f, 0.8f, 0.45f, 1.0f), "read-only:");
        ImGui::SameLine();
        if (!app.error.empty()) ImGui::TextColored(ImVec4(1.0f, 0.45f, 0.4f, 1.0f), "%s", app.error.c_str());
        else ImGui::TextUnformatted(app.notice.c_str());
        if (ImGui::IsItemHovered()) ImGui::SetTooltip("%s", app.notice.c_str());
    } else if (!app.error.empty()) {
        ImGui::TextColored(ImVec4(1.0f, 0.45f, 0.4f, 1.0f), "%s", app.error.c_str());
    } else if (a.keyboard) {
        std::string fit = a.keyboard_fit ? "fit of every keyboard dyad " + fixed(a.keyboard_fit->rms_cents, 2) + " c rms (" +
                                               std::to_string(a.keyboard_fit->tones) + " tones, " + std::to_string(a.keyboard_fit->exact) + " exact)"
                          : !a.keyboard_fit_error.empty() ? a.keyboard_fit_error
                                                          : "computing the fit of every keyboard dyad...";
        ImGui::Text("%zu notes from %s Hz, order %d  |  %s  |  %s", a.keyboard->notes().size(), fixed(a.keyboard->ref_hz(), 3).c_str(),
                    app.session.settings.max_order, fit.c_str(), app.status.empty() ? "F1: help" : app.status.c_str());
    } else {
        ImGui::TextUnformatted(app.status.empty() ? "Open a tuning: File > Open tuning... (Ctrl+O). F1: help" : app.status.c_str());
    }
    ImGui::End();
}

} // namespace

void draw_app(App& app) {
    shortcuts(app);
    menu_bar(app);
    ImGuiIO& io = ImGui::GetIO();
    const float top = ImGui::GetFrameHeight();
    const float status_h = ImGui::GetFrameHeight() + 6;
    const float h = io.DisplaySize.y - top - status_h;
    const float centre_w = io.DisplaySize.x - left_width - right_width;

    begin_pane("Tunings", ImVec2(0, top), ImVec2(left_width, h * 0.62f));
    draw_tunings_panel(app);
    ImGui::End();
    begin_pane("Analysis settings", ImVec2(0, top + h * 0.62f), ImVec2(left_width, h * 0.38f));
    draw_settings_panel(app);
    ImGui::End();

    central(app, ImVec2(left_width, top), ImVec2(centre_w, h));

    const float listen_h = 262.0f;
    begin_pane("Selection and its resultants", ImVec2(left_width + centre_w, top), ImVec2(right_width, h - listen_h));
    draw_selection_panel(app);
    ImGui::End();
    begin_pane("Listen", ImVec2(left_width + centre_w, top + h - listen_h), ImVec2(right_width, listen_h));
    draw_listen_panel(app);
    ImGui::End();

    status_bar(app, ImVec2(0, io.DisplaySize.y - status_h), ImVec2(io.DisplaySize.x, status_h));
    draw_help_panel(app);
    draw_check_panel(app);
    std::filesystem::path chosen;
    if (draw_file_dialog(app.dialog, chosen)) dialog_chosen(app, chosen);
}

} // namespace terzo::gui
