// terzo-gui's colours: the landing-deviation scale used by the lattice marks and the dyad
// grid, and the fixed colours of the lattice, with a legend that explains the scale.
#pragma once

#include <imgui.h>

namespace terzo::gui {

/// Fill of a degree's node on the lattice (tests count pixels of exactly this colour).
inline constexpr ImU32 node_colour = IM_COL32(70, 130, 200, 255);
inline constexpr ImU32 node_selected_colour = IM_COL32(235, 140, 50, 255);
inline constexpr ImU32 canvas_colour = IM_COL32(22, 24, 30, 255);
/// Background of the panes. The window is cleared to it and the tiled panes draw no
/// background of their own (see begin_pane in layout.cpp).
inline constexpr ImU32 pane_colour = IM_COL32(28, 31, 36, 255);
/// Keys of the keyboard strip: the first degree of each period, and the others.
inline constexpr ImU32 strip_period_key_colour = IM_COL32(92, 102, 128, 255);
inline constexpr ImU32 strip_key_colour = IM_COL32(56, 64, 82, 255);
inline constexpr ImU32 strip_hover_colour = IM_COL32(80, 110, 150, 255);
inline constexpr ImU32 exact_colour = IM_COL32(120, 230, 255, 255);

/// The deviation scale: proven exact is ice blue; otherwise |deviation| runs green (0) ->
/// lime (the landing tolerance) -> amber (10 c, or 2x tolerance) -> red (25 c, or 5x) ->
/// violet (50 c or more, or 10x), so "lands" and "misses badly" read at a glance.
ImU32 deviation_colour(double abs_cents, bool exact, double tolerance);

/// Draws the legend (a gradient bar with its ticks and the symbols) with its top-left at pos;
/// returns its height.
float draw_deviation_legend(ImDrawList* dl, ImVec2 pos, double tolerance, bool with_symbols);

} // namespace terzo::gui
