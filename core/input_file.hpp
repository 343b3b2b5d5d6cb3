// Opening a file that terzo reads (a .scl file, a session, a weights file) with its size
// bounded: only a regular file is opened, so a pipe never blocks and a device such as
// /dev/zero never streams forever, and a file larger than the reader's limit is refused
// before a byte is read. Readers still count what they read, for a file that grows.
#pragma once

#include <cstdint>
#include <filesystem>
#include <fstream>
#include <string>

namespace terzo {

/// Opens path for reading in binary mode. InputError naming path when it does not exist, is
/// a folder, is not a regular file (a pipe, device or socket), is larger than max_bytes, or
/// cannot be opened; `what` names what was expected there ("a .scl file").
std::ifstream open_input_file(const std::filesystem::path& path, std::uintmax_t max_bytes, const std::string& what);

/// "16 MiB", "512 KiB", "100 bytes": a size limit as messages state it.
std::string size_text(std::uintmax_t bytes);

} // namespace terzo
