// The views and panels of terzo-gui, one file each. Each draws App and routes input to the
// actions of app.hpp; none computes anything itself.
#pragma once

#include <string>

#include <imgui.h>

#include "gui/app.hpp"

namespace terzo::gui {

void draw_app(App& app);            ///< layout.cpp: menu, panels, central views, status bar

void draw_lattice_view(App& app);   ///< view_lattice.cpp
void draw_grid_view(App& app);      ///< view_grid.cpp
void draw_keys_view(App& app);      ///< view_keys.cpp
void draw_sheet_view(App& app);     ///< view_sheet.cpp
void draw_keyboard_strip(App& app); ///< panel_keyboard.cpp: pick notes in any period

void draw_tunings_panel(App& app);   ///< panel_tunings.cpp
void draw_settings_panel(App& app);  ///< panel_settings.cpp
void draw_key_map_settings(App& app); ///< panel_key_map.cpp: the key map and its MIDI key strip (keys view)
void draw_selection_panel(App& app); ///< panel_selection.cpp: the selected notes' resultants
void draw_listen_panel(App& app);    ///< panel_listen.cpp
void play_selection(App& app);       ///< panel_listen.cpp: render the selection and play it
void draw_help_panel(App& app);      ///< panel_help.cpp
void draw_check_panel(App& app);     ///< panel_check.cpp: the microphone tuning check (a window)
void open_check_panel();             ///< panel_check.cpp

/// "degree 4" or "degree 4 (+1 period)": how notes are named on screen.
std::string note_label(const Keyboard& kb, int degree, int period);

} // namespace terzo::gui
