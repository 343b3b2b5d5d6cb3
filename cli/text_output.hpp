// What terzo prints on a terminal goes through printable() (core/io/text.hpp): descriptions
// and file names are bytes, and an escape sequence in one must never reach the terminal raw.
#pragma once

#include <iostream>
#include <string>

#include "core/text.hpp"
#include "core/tuning/scale.hpp"

namespace terzo::cli {

/// Prints text on stdout, invalid UTF-8 and control characters (except tab and newline)
/// replaced by U+FFFD.
inline void print_text(const std::string& text) { std::cout << printable(text) << std::flush; }

/// The note printed (on stderr) when a tuning's description is not plain UTF-8 text.
inline std::string description_note(const std::string& source) {
    return "terzo: note: " + printable(source) +
           ": the description holds bytes that are not UTF-8 or are control characters; terminal output "
           "shows each as U+FFFD, JSON replaces the bytes that are not UTF-8 (a .scl file keeps them all)";
}

/// Prints description_note when the scale's description needs it.
inline void note_description(const Scale& scale, const std::string& source) {
    if (!is_printable(scale.description())) std::cerr << description_note(source) << '\n';
}

} // namespace terzo::cli
