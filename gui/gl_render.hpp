// What terzo-gui adds to ImGui's OpenGL2 renderer so that frames stay cheap on software
// OpenGL (llvmpipe under Xvfb, or a machine without a GPU). There every filled pixel costs a
// blended, textured fragment on the CPU; these let the large areas be filled by the bulk
// clear instead, and keep the per-pixel work small. Measured with --bench-frames; the figures
// are in DEVELOPERS.md.
#pragma once

#include <imgui.h>

namespace terzo::gui {

/// Creates ImGui's font atlas texture and samples it without filtering. The font is built
/// with glyphs at 1:1 and snapped to whole pixels (see the font set-up in main.cpp), and
/// every shape samples a single white texel, so nothing looks different.
void use_unfiltered_font_texture();

/// Waits until OpenGL has drawn everything submitted (for timing only).
void finish_gl();

/// Clears the whole window to an opaque colour (call before rendering ImGui's draw data).
void clear_window(ImU32 colour);

/// Fills the draw list's current clip rectangle with an opaque colour, in draw order, by a
/// scissored clear rather than a filled rectangle.
void add_clear_fill(ImDrawList* dl, ImU32 colour);

} // namespace terzo::gui
