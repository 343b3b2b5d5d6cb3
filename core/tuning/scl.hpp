// The .scl scale file format (an open plain-text format): reading with a strict parser that
// names the file, line and column of every problem, and writing so that read -> write ->
// read gives the same degrees exactly.
#pragma once

#include <cstddef>
#include <cstdint>
#include <filesystem>
#include <istream>
#include <ostream>
#include <string>
#include <vector>

#include "core/tuning/scale.hpp"

namespace terzo {

/// Largest note count accepted: far beyond any practical tuning, and it keeps every analysis
/// of a scale's dyads bounded in time and memory.
inline constexpr std::size_t max_scale_size = 4096;

/// Most bytes read as one .scl file (or text): the largest scale, 4096 pitches of up to about
/// 330 characters with comments, takes under 2 MiB; the limit bounds the time and memory a
/// wrong file (a log, a disk image) can cost.
inline constexpr std::uintmax_t max_scl_bytes = 16u << 20;

/// Reads a .scl text, line by line (memory for one line at a time); source names it in error messages. Throws InputError.
Scale read_scl(std::istream& in, const std::string& source);
/// Reads a .scl file; throws InputError naming the path when it cannot be opened or parsed.
Scale read_scl_file(const std::filesystem::path& path);
/// Line numbers of the pitch lines of a .scl text (degree 1 first, the period last), for
/// messages about a scale that read without error; stops early on a malformed file.
std::vector<int> scl_pitch_lines(std::istream& in);
/// Writes a scale as .scl; file_name goes into the conventional first comment line, and each
/// of `comments` into a comment line after it ("! " + text, line breaks made spaces).
void write_scl(std::ostream& out, const Scale& scale, const std::string& file_name,
               const std::vector<std::string>& comments = {});

/// Cents as .scl text: the shortest decimal that reads back to the same double, with a '.'
/// and at least six decimals ("700.000000", "386.31371386483481").
std::string scl_cents_text(double cents);

} // namespace terzo
