#include "core/tuning/library.hpp"

#include <algorithm>
#include <sstream>

#include "core/error.hpp"
#include "core/tuning/scl.hpp"
#include "core/tuning/note_names.hpp"
#include "core/tuning/recipe.hpp"

namespace terzo {

namespace {

bool valid_file_name(const std::string& f) {
    if (f.size() < 5 || f.compare(f.size() - 4, 4, ".scl") != 0) return false;
    return std::all_of(f.begin(), f.end() - 4, [](char c) {
        return (c >= 'a' && c <= 'z') || (c >= '0' && c <= '9') || c == '-';
    });
}

void finish(std::vector<LibraryEntry>& out, LibraryEntry& e, const std::string& source) {
    if (e.line == 0) return;
    SourcePos pos{source, e.line, 1};
    if (e.file.empty()) fail(pos, "the entry has no \"file:\" line");
    if (e.title.empty()) fail(pos, "the entry for " + e.file + " has no \"title:\" line");
    if (e.recipe.empty()) fail(pos, "the entry for " + e.file + " has no \"recipe:\" line");
    if (e.sources.empty()) fail(pos, "the entry for " + e.file + " has no \"source:\" line");
    for (const auto& other : out)
        if (other.file == e.file)
            fail(pos,
                 e.file + " is listed twice (first on line " + std::to_string(other.line) + ")");
    try {
        build_recipe(e.recipe);
    } catch (const InputError& err) {
        fail({source, e.recipe_line, e.recipe_column + std::max(err.pos().column, 1) - 1},
             "in the recipe of " + e.file + ": " + err.message());
    }
    out.push_back(std::move(e));
    e = LibraryEntry();
}

} // namespace

std::vector<LibraryEntry> read_library_list(std::istream& in, const std::string& source) {
    std::vector<LibraryEntry> out;
    LibraryEntry current;
    std::string text;
    int number = 0;
    while (std::getline(in, text)) {
        ++number;
        if (!text.empty() && text.back() == '\r') text.pop_back();
        if (!text.empty() && text[0] == '#') continue;
        if (text.find_first_not_of(' ') == std::string::npos) {
            finish(out, current, source);
            continue;
        }
        auto colon = text.find(": ");
        if (colon == std::string::npos)
            fail({source, number, 1},
                 "expected \"field: value\" (file, title, recipe, source or names)");
        std::string field = text.substr(0, colon), value = text.substr(colon + 2);
        SourcePos pos{source, number, static_cast<int>(colon) + 3};
        if (current.line == 0) current.line = number;
        auto set_once = [&](std::string& slot) {
            if (!slot.empty())
                fail({source, number, 1}, "\"" + field + ":\" is given twice in this entry");
            slot = value;
        };
        if (field == "file") {
            if (!valid_file_name(value))
                fail(pos, "file name \"" + value +
                              "\" must be lower-case letters, digits and '-', ending in .scl");
            set_once(current.file);
        } else if (field == "title") {
            set_once(current.title);
        } else if (field == "recipe") {
            set_once(current.recipe);
            current.recipe_line = number;
            current.recipe_column = pos.column;
        } else if (field == "source") {
            current.sources.push_back(value);
        } else if (field == "names") {
            current.spelling = parse_spelling(value, pos);
            current.letter_names = true;
        } else {
            fail({source, number, 1},
                 "unknown field \"" + field + "\"; use file, title, recipe, source or names");
        }
    }
    finish(out, current, source);
    return out;
}

std::string library_scl_text(const LibraryEntry& entry) {
    Scale built = build_recipe(entry.recipe);
    std::vector<Pitch> above(built.degrees().begin() + 1, built.degrees().end());
    Scale scale(entry.title, std::move(above), built.period());

    std::ostringstream comments;
    for (std::size_t i = 0; i < entry.sources.size(); ++i)
        comments << (i == 0 ? "! Source: " : "!         ") << entry.sources[i] << "\n";
    comments << "! Recipe: " << entry.recipe << "\n";
    if (entry.letter_names) {
        TERZO_ASSERT(scale.size() == 12);
        comments << "! Degrees 0-11:";
        for (int pc = 0; pc < 12; ++pc)
            comments << ' ' << pitch_class_name(pc, entry.spelling);
        comments << "\n";
    }
    comments << "! Tags: [S] source read, [M] from memory (not re-read), [CP] common practice, no "
                "source.\n";
    comments << "! Computed by terzo from the recipe above; not copied from any scale archive.\n";

    std::ostringstream scl;
    write_scl(scl, scale, entry.file);
    std::string text = scl.str();
    auto first_line_end = text.find('\n');
    TERZO_ASSERT(first_line_end != std::string::npos);
    text.insert(first_line_end + 1, comments.str());
    return text;
}

} // namespace terzo
