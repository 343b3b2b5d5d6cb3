// The platform layer between SFML 2.5 and Dear ImGui 1.86: feeds SFML events (mouse, wheel,
// keys, modifiers, text, focus) into ImGuiIO and sets the display size and frame time. It
// touches no window and no GL, so it can be tested with synthetic sf::Events. ImGui 1.86 reads
// button and key state once per frame, so a press and release that arrive in the same frame
// (a quick tap, or input from a test driver) are spread over two frames instead of being lost.
#pragma once

#include <SFML/Window/Event.hpp>
#include <SFML/System/Vector2.hpp>

struct ImGuiIO;

namespace terzo::gui {

/// Sets the key map and the backend name; with_clipboard routes ImGui's clipboard through
/// sf::Clipboard (needs a display, so tests pass false).
void platform_init(ImGuiIO& io, bool with_clipboard);
/// Frees what platform_init allocated (call before ImGui::DestroyContext).
void platform_shutdown(ImGuiIO& io);
/// Feeds one event into io.
void platform_event(ImGuiIO& io, const sf::Event& event);
/// Before ImGui::NewFrame(): display size (pixels) and seconds since the last frame.
void platform_new_frame(ImGuiIO& io, sf::Vector2u display_size, float seconds);

} // namespace terzo::gui
