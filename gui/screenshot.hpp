// Pictures of the window: --screenshot saves the whole window, File > Export lattice as PNG
// the lattice canvas. Both read the frame just drawn, before it is displayed.
#pragma once

#include <string>

#include <SFML/Graphics/Image.hpp>
#include <SFML/Graphics/RenderWindow.hpp>

namespace terzo::gui {

/// The pixels of the frame drawn so far (call before window.display()).
sf::Image grab_window(const sf::RenderWindow& window);

/// Saves the whole image as PNG; throws InputError (an existing file without `force`).
void save_window_png(const sf::Image& image, const std::string& path, bool force);

/// Saves the part x, y, w, h of the image (clamped to it) as PNG; throws InputError.
void save_part_png(const sf::Image& image, const float (&rect)[4], const std::string& path, bool force);

/// Starts recording every piece of text the panels draw this frame (call after NewFrame);
/// tree nodes are not opened by it, so the frame looks as it would without.
void begin_frame_text();

/// Stops recording and returns the frame's text, as ImGui lays it out (call after the frame's
/// windows are drawn, before Render).
std::string end_frame_text();

/// Saves text as a file, atomically; throws InputError (an existing file without `force`).
void save_frame_text(const std::string& text, const std::string& path, bool force);

} // namespace terzo::gui
