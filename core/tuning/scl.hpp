// The .scl scale file format (an open plain-text format): reading with a strict parser that
// names the file, line and column of every problem, and writing so that read -> write ->
// read gives the same degrees exactly.
#pragma once

#include <cstddef>
#include <filesystem>
#include <istream>
#include <ostream>
#include <string>

#include "core/tuning/scale.hpp"

namespace terzo {

/// Largest note count accepted: far beyond any practical tuning, and it keeps every analysis
/// of a scale's dyads bounded in time and memory.
inline constexpr std::size_t max_scale_size = 4096;

/// Reads a .scl text; source names it in error messages. Throws InputError.
Scale read_scl(std::istream& in, const std::string& source);
/// Reads a .scl file; throws InputError naming the path when it cannot be opened or parsed.
Scale read_scl_file(const std::filesystem::path& path);
/// Writes a scale as .scl; file_name goes into the conventional first comment line.
void write_scl(std::ostream& out, const Scale& scale, const std::string& file_name);

/// Cents as .scl text: the shortest decimal that reads back to the same double, with a '.'
/// and at least six decimals ("700.000000", "386.31371386483481").
std::string scl_cents_text(double cents);

} // namespace terzo
