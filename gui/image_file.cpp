#include "gui/image_file.hpp"

#include <ostream>

#include <stb_image_write.h> // implementation in Debian's libstb

#include "core/error.hpp"

namespace terzo::gui {

void save_png(const std::filesystem::path& path, const std::uint8_t* rgba, int w, int h, int stride, Overwrite overwrite) {
    write_file_atomically(
        path,
        [&](std::ostream& out) {
            auto sink = [](void* ctx, void* data, int size) { static_cast<std::ostream*>(ctx)->write(static_cast<const char*>(data), size); };
            if (!stbi_write_png_to_func(sink, &out, w, h, 4, rgba, stride))
                fail({path.string(), 0, 0}, "could not encode the image as PNG");
        },
        overwrite);
}

} // namespace terzo::gui
