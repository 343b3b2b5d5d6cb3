// terzo-gui's ImGui context: the font (with the glyph ranges the views use) and the style.
#pragma once

namespace terzo::gui {

/// Creates the ImGui context, loads the font from TERZO_ASSETS (or the source tree's assets/)
/// and sets the style. Call once, before the renderer starts.
void set_up_imgui();

} // namespace terzo::gui
