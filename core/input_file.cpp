#include "core/input_file.hpp"

#include "core/error.hpp"

namespace terzo {

std::string size_text(std::uintmax_t bytes) {
    if (bytes >= (1u << 20) && bytes % (1u << 20) == 0) return std::to_string(bytes >> 20) + " MiB";
    if (bytes >= (1u << 10) && bytes % (1u << 10) == 0) return std::to_string(bytes >> 10) + " KiB";
    return std::to_string(bytes) + " bytes";
}

std::ifstream open_input_file(const std::filesystem::path& path, std::uintmax_t max_bytes, const std::string& what) {
    namespace fs = std::filesystem;
    const SourcePos at{path.string(), 0, 0};
    std::error_code ec;
    const fs::file_status st = fs::status(path, ec);
    if (!fs::exists(st)) fail(at, "no such file");
    if (fs::is_directory(st)) fail(at, "is a folder, not " + what);
    if (!fs::is_regular_file(st))
        fail(at, "is not a regular file (a pipe, device or socket); terzo reads " + what + " only from a file");
    const std::uintmax_t size = fs::file_size(path, ec);
    if (!ec && size > max_bytes)
        fail(at, "is " + std::to_string(size) + " bytes, larger than " + size_text(max_bytes) + ", the most terzo reads as " + what);
    std::ifstream in(path, std::ios::binary);
    if (!in) fail(at, "cannot open the file for reading");
    return in;
}

} // namespace terzo
