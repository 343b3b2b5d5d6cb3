// Writing files so that a crash, a full disk or a killed process never leaves a
// half-written file: the content goes to a temporary file in the same folder, is flushed to
// disk, and is then renamed over the target in one step.
#pragma once

#include <filesystem>
#include <functional>
#include <ostream>

namespace terzo {

enum class Overwrite { refuse, allow };

/// Checks that path can be written before anything is: throws InputError naming the path when
/// it is a folder or a special file (a device, a pipe), when its folder does not exist or is
/// a file, or (with Overwrite::refuse) when it exists. write_file_atomically runs it first;
/// callers writing several files run it on all of them so that nothing is written unless
/// every target can be.
void check_target(const std::filesystem::path& path, Overwrite overwrite);

/// Writes path atomically with the bytes that write() puts into the stream, after
/// check_target (with Overwrite::refuse an existing file is left alone). Any failure
/// (unwritable folder, disk full, an exception from write) throws InputError naming the
/// path, removes the temporary file, and leaves an existing file unchanged.
void write_file_atomically(const std::filesystem::path& path,
                           const std::function<void(std::ostream&)>& write,
                           Overwrite overwrite = Overwrite::refuse);

} // namespace terzo
