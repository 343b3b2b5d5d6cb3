// The tuning library: a plain-text list of entries (file name, title, recipe, published
// source) from which every .scl file in scales/ is generated, so the files can be rebuilt
// and checked byte for byte. The list format is described at the top of tools/library.txt.
#pragma once

#include <istream>
#include <string>
#include <vector>

#include "core/tuning/note_names.hpp"

namespace terzo {

struct LibraryEntry {
    std::string file;                 ///< "werckmeister-iii.scl": lower-case letters, digits, '-'
    std::string title;                ///< the .scl description line
    std::string recipe;               ///< the recipe that builds the tuning
    std::vector<std::string> sources; ///< where the definition is published, one line each
    bool letter_names = false;        ///< add a comment naming the 12 degrees C, C#, D, Eb …
    Spelling spelling = Spelling::mixed; ///< how those names spell the black keys
    int line = 0;                        ///< line of the entry's first field in the list
    int recipe_line = 0;                 ///< where the recipe's text starts in the list
    int recipe_column = 0;
};

/// Reads the list; source names it in error messages. Throws InputError for an unknown or
/// repeated field, a missing field, a bad or repeated file name, or a recipe that fails.
std::vector<LibraryEntry> read_library_list(std::istream& in, const std::string& source);
/// The entry's .scl text: write_scl's output with the sources, the recipe and (if asked)
/// the degree names as comment lines after the file-name line.
std::string library_scl_text(const LibraryEntry& entry);

} // namespace terzo
