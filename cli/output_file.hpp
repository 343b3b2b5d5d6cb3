// The check every command runs on a file it is about to write, before any work is done, so
// that a refused file costs nothing and says what to do. The atomic write checks again when
// it replaces the file.
#pragma once

#include <filesystem>
#include <system_error>

#include "core/error.hpp"
#include "core/io/atomic_file.hpp"

namespace terzo::cli {

/// Throws InputError naming path when it exists and --force was not given, or when it cannot
/// be written at all (a folder, a special file, a missing folder).
inline void check_output_file(const std::filesystem::path& path, bool force) {
    std::error_code ec;
    // symlink_status: a dangling symbolic link is an existing name too (--force writes the
    // file it points to; see atomic_file.hpp).
    if (!force && std::filesystem::exists(std::filesystem::symlink_status(path, ec)))
        fail({path.string(), 0, 0}, "already exists and was not changed; give --force to replace it");
    check_target(path, Overwrite::allow);
}

} // namespace terzo::cli
