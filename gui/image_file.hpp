// Saving RGBA pixels as a PNG file, written atomically like every file terzo writes.
#pragma once

#include <cstdint>
#include <filesystem>

#include "core/io/atomic_file.hpp"

namespace terzo::gui {

/// Writes w x h RGBA pixels (rows top to bottom, stride w*4) as PNG; throws InputError.
void save_png(const std::filesystem::path& path, const std::uint8_t* rgba, int w, int h, int stride, Overwrite overwrite);

} // namespace terzo::gui
