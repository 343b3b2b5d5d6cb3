// Writing files so that a crash, a full disk or a killed process never leaves a
// half-written file: the content goes to a temporary file in the same folder, is flushed to
// disk, and is then renamed over the target in one step. Temporary names are short
// (".tz-<process id>-XXXXXX", so a target may have the longest name the folder allows) and a
// temporary that a killed terzo left behind is removed by the next write into that folder.
// A target that is a symbolic link is written through: the file it points to is replaced
// (created, for a dangling link) and the link is kept.
#pragma once

#include <filesystem>
#include <functional>
#include <ostream>
#include <string>
#include <vector>

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

/// A file to write: where, and its bytes.
struct FileAt {
    std::filesystem::path path;
    std::string data;
};

/// Writes several files in different folders all or nothing, as far as a file system allows:
/// checks every target (check_target), writes and flushes every file beside its target under
/// a temporary name, and only then renames them into place, so a full disk, an unwritable
/// folder or a killed process leaves every target as it was. Only a rename failing (a change
/// on disk since the checks) can leave some files in place; the message then says which.
/// Throws InputError naming the file.
void write_files_together(const std::vector<FileAt>& files, Overwrite overwrite);

/// One file of a set: its name inside the set's folder and its bytes.
struct FileContent {
    std::string name;
    std::string data;
};

/// Writes every file into folder (created with its parents when missing) or none: all are
/// written and flushed in a temporary folder first (inside folder, or beside it when folder is
/// new) and moved into place only when complete, so a full disk or a killed process changes
/// nothing. Runs check_target on every file first. `option` names the folder in messages
/// (e.g. "--write-scl"). Returns the paths written, in order.
std::vector<std::filesystem::path> write_file_set(const std::filesystem::path& folder,
                                                  const std::vector<FileContent>& files,
                                                  Overwrite overwrite, const std::string& option);

/// Removes the temporary files and folders that terzo processes which no longer run left in
/// folder (a killed write); those of running processes are kept. Errors are ignored.
void remove_stale_temporaries(const std::filesystem::path& folder);

} // namespace terzo
