// The renderer terzo-gui draws ImGui with, and what it adds so that frames stay cheap on software
// OpenGL (llvmpipe under Xvfb, or a machine without a GPU). There every filled pixel costs a
// blended, textured fragment on the CPU; these let the large areas be filled by the bulk
// clear instead, and keep the per-pixel work small. Measured with --bench-frames; the figures
// are in DEVELOPERS.md.
#pragma once

#include <imgui.h>

namespace terzo::gui {

/// Starts ImGui's OpenGL 3 renderer when the context offers OpenGL 3.2 or later (it honours
/// 32-bit vertex offsets, so a pane may hold any number of vertices although Debian's ImGui
/// indexes them with 16 bits), else (or with TERZO_OPENGL2=1 in the environment) the OpenGL 2
/// renderer. Call once after the window exists.
void renderer_init();
/// True when a draw list may hold more than 65,535 vertices (the OpenGL 3 renderer is in use).
bool renderer_has_large_meshes();
/// Whether `dl` can take `vertices` more without passing what the renderer can index. Views
/// that draw an unbounded number of shapes stop (and say so) when this turns false.
bool room_for(const ImDrawList* dl, int vertices);
void renderer_new_frame();
void renderer_render(ImDrawData* data);
void renderer_shutdown();
/// "OpenGL 3 renderer (4.5 (Compatibility Profile) Mesa ...)": for --bench-frames.
const char* renderer_name();

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
