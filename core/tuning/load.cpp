#include "core/tuning/load.hpp"

#include <cctype>
#include <filesystem>

#include "core/tuning/scl.hpp"
#include "core/tuning/recipe.hpp"

namespace terzo {

namespace {

// An argument that is not a recipe and looks like a path was probably meant as a file.
bool looks_like_path(const std::string& a) {
    auto ends_with = [&](const char* suffix) {
        std::string s = suffix;
        if (a.size() < s.size()) return false;
        for (std::size_t i = 0; i < s.size(); ++i)
            if (std::tolower(static_cast<unsigned char>(a[a.size() - s.size() + i])) != s[i])
                return false;
        return true;
    };
    return ends_with(".scl") || a.find('/') != std::string::npos ||
           a.find('\\') != std::string::npos || a.find('.') != std::string::npos;
}

} // namespace

Scale load_tuning(const std::string& argument) {
    if (argument.empty())
        fail({"TUNING", 0, 0},
             "empty tuning argument; give a .scl file or a recipe such as \"equal 12\"");
    std::error_code ec;
    if (std::filesystem::exists(argument, ec)) return read_scl_file(argument);
    if (starts_like_recipe(argument)) return build_recipe(argument);
    if (looks_like_path(argument))
        fail({argument, 0, 0},
             "no such file (a TUNING is a .scl file or a recipe such as \"equal 12\")");
    return build_recipe(argument); // explains that the first word is not a recipe kind
}

} // namespace terzo
