// terzo-library: writes the tuning library (scales/) from its list (tools/library.txt).
//   terzo-library LIST FOLDER           write every entry's .scl file into FOLDER
//   terzo-library --check LIST FOLDER   compare instead; exit 1 and name each file that differs
// Each file is written atomically and only when its content changes. .scl files in FOLDER that
// the list does not name are reported (and make --check fail), never deleted.
#include <filesystem>
#include <fstream>
#include <iostream>
#include <set>
#include <sstream>
#include <string>

#include "core/error.hpp"
#include "core/io/atomic_file.hpp"
#include "core/tuning/library.hpp"

namespace {

std::string slurp(const std::filesystem::path& p) {
    std::ifstream in(p, std::ios::binary);
    std::ostringstream s;
    s << in.rdbuf();
    return s.str();
}

} // namespace

int main(int argc, char** argv) {
    bool check = argc == 4 && std::string(argv[1]) == "--check";
    if (argc != 3 && !check) {
        std::cerr << "usage: terzo-library [--check] LIST FOLDER\n";
        return 2;
    }
    std::string list_path = argv[check ? 2 : 1];
    std::filesystem::path folder = argv[check ? 3 : 2];
    try {
        std::ifstream list(list_path);
        if (!list) terzo::fail({list_path, 0, 0}, "cannot open the list for reading");
        auto entries = terzo::read_library_list(list, list_path);
        int differing = 0, written = 0;
        std::set<std::string> named;
        for (const auto& e : entries) {
            named.insert(e.file);
            std::string text = terzo::library_scl_text(e);
            auto path = folder / e.file;
            if (std::filesystem::exists(path) && slurp(path) == text) continue;
            if (check) {
                std::cerr << path.string() << ": differs from its entry on line " << e.line
                          << " of " << list_path << "\n";
                ++differing;
            } else {
                terzo::write_file_atomically(
                    path, [&](std::ostream& out) { out << text; }, terzo::Overwrite::allow);
                ++written;
            }
        }
        for (const auto& f : std::filesystem::directory_iterator(folder)) {
            if (f.path().extension() == ".scl" && !named.count(f.path().filename().string())) {
                std::cerr << f.path().string() << ": not in " << list_path << "\n";
                ++differing;
            }
        }
        std::cout << entries.size() << " entries, " << (check ? differing : written)
                  << (check ? " files differ\n" : " files written\n");
        return differing ? 1 : 0;
    } catch (const terzo::InputError& e) {
        std::cerr << e.what() << '\n';
        return 1;
    }
}
