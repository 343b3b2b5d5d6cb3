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

} // namespace terzo::gui
