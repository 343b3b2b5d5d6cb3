#include "core/tuning/load.hpp"

#include <filesystem>

#include "core/io/scl.hpp"

namespace terzo {

Scale load_tuning(const std::string& argument) {
    if (argument.empty()) fail({"TUNING", 0, 0}, "empty tuning argument; give a .scl file");
    std::error_code ec;
    if (std::filesystem::exists(argument, ec)) return read_scl_file(argument);
    fail({argument, 0, 0}, "no such file");
}

} // namespace terzo
