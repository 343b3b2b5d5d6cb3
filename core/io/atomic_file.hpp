// Writing files so that a crash, a full disk or a killed process never leaves a
// half-written file: the content goes to a temporary file in the same folder, is flushed to
// disk, and is then renamed over the target in one step.
#pragma once

#include <filesystem>
#include <functional>
#include <ostream>

namespace terzo {

enum class Overwrite { refuse, allow };

/// Writes path atomically with the bytes that write() puts into the stream. With
/// Overwrite::refuse an existing file is left alone and InputError says so. Any failure
/// (unwritable folder, disk full, an exception from write) throws InputError naming the
/// path, removes the temporary file, and leaves an existing file unchanged.
void write_file_atomically(const std::filesystem::path& path,
                           const std::function<void(std::ostream&)>& write,
                           Overwrite overwrite = Overwrite::refuse);

} // namespace terzo
