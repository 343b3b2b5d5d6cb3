#include "gui/screenshot.hpp"

#include <algorithm>
#include <cstddef>

#include <ostream>

#include <SFML/Graphics/Texture.hpp>
#include <imgui.h>
#include <imgui_internal.h>

#include "core/io/atomic_file.hpp"
#include "gui/image_file.hpp"

namespace terzo::gui {

sf::Image grab_window(const sf::RenderWindow& window) {
    sf::Texture tex;
    tex.create(window.getSize().x, window.getSize().y);
    tex.update(window);
    return tex.copyToImage();
}

void save_window_png(const sf::Image& image, const std::string& path, bool force) {
    const int w = static_cast<int>(image.getSize().x), h = static_cast<int>(image.getSize().y);
    save_png(path, image.getPixelsPtr(), w, h, w * 4, force ? Overwrite::allow : Overwrite::refuse);
}

void save_part_png(const sf::Image& image, const float (&rect)[4], const std::string& path, bool force) {
    const int w = static_cast<int>(image.getSize().x), h = static_cast<int>(image.getSize().y);
    const int x = std::clamp(static_cast<int>(rect[0]), 0, w - 1), y = std::clamp(static_cast<int>(rect[1]), 0, h - 1);
    const int cw = std::clamp(static_cast<int>(rect[2]), 1, w - x), ch = std::clamp(static_cast<int>(rect[3]), 1, h - y);
    save_png(path, image.getPixelsPtr() + (static_cast<std::size_t>(y) * w + x) * 4, cw, ch, w * 4,
             force ? Overwrite::allow : Overwrite::refuse);
}

void begin_frame_text() {
    ImGui::LogToBuffer(0); // depth 0: open no tree node for the log's sake
}

std::string end_frame_text() {
    std::string text = ImGui::GetCurrentContext()->LogBuffer.c_str();
    ImGui::LogFinish();
    return text;
}

void save_frame_text(const std::string& text, const std::string& path, bool force) {
    write_file_atomically(path, [&](std::ostream& out) { out << text; }, force ? Overwrite::allow : Overwrite::refuse);
}

} // namespace terzo::gui
