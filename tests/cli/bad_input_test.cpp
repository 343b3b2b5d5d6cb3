// Runs every case of tests/cli/bad_inputs.txt against the built terzo and checks the answer:
// non-zero exit, empty stdout, exactly the expected one-line error, no file created or
// changed. Also checks that the table of bad inputs in docs/errors.md is made from the same
// cases (run with TERZO_UPDATE_DOCS=1 to rewrite that table; TERZO_UPDATE_README=1, its old
// name, still works).
#include <catch2/catch.hpp>

#include <cstdlib>
#include <functional>
#include <map>
#include <vector>

#include "core/io/atomic_file.hpp"
#include "tests/support/run.hpp"

namespace fs = std::filesystem;
using namespace terzo::test;

namespace {

struct Case {
    std::string name, setup, run, error;
    long limit = 0; ///< bytes any one file may grow to (0: no limit), a full disk as writers see it
};

std::vector<Case> load_cases() {
    std::istringstream in(slurp(source_path("tests/cli/bad_inputs.txt")));
    std::vector<Case> cases;
    std::string line;
    while (std::getline(in, line)) {
        if (line.rfind("== ", 0) == 0) cases.push_back({line.substr(3), "", "", "", 0});
        else if (cases.empty() || line.empty() || line[0] == '#') continue;
        else if (line.rfind("setup: ", 0) == 0) cases.back().setup = line.substr(7);
        else if (line.rfind("run: ", 0) == 0) cases.back().run = line.substr(5);
        else if (line.rfind("error: ", 0) == 0) cases.back().error = line.substr(7);
        else if (line.rfind("limit: ", 0) == 0) cases.back().limit = std::stol(line.substr(7));
    }
    return cases;
}

// Every file below dir with its size and content hash.
std::map<std::string, std::pair<std::uintmax_t, std::size_t>> snapshot(const fs::path& dir) {
    std::map<std::string, std::pair<std::uintmax_t, std::size_t>> files;
    for (const auto& e : fs::recursive_directory_iterator(dir)) {
        if (!e.is_regular_file()) continue;
        files[fs::relative(e.path(), dir).string()] = {e.file_size(), std::hash<std::string>{}(slurp(e.path()))};
    }
    return files;
}

std::string cell(const std::string& s) {
    std::string out;
    for (char c : s) {
        if (c == '|') out += '\\';
        out += c;
    }
    return out;
}

std::string readme_table(const std::vector<Case>& cases) {
    std::string t = "| # | bad input | command | terzo's answer (stderr; exit status non-zero) |\n|---|---|---|---|\n";
    int n = 0;
    for (const auto& c : cases)
        t += "| " + std::to_string(++n) + " | " + cell(c.name) + " | `terzo " + cell(c.run) + "` | `" +
             cell(c.error) + "` |\n";
    return t;
}

} // namespace

TEST_CASE("every bad input gets one clear error, a non-zero exit and no file written", "[bad_input]") {
    auto cases = load_cases();
    REQUIRE(cases.size() >= 20);
    for (const auto& c : cases) {
        DYNAMIC_SECTION(c.name) {
            fs::path dir = temp_folder("bad-input");
            REQUIRE(run("cd " + dir.string() + " && { " + c.setup + " ; }").status == 0);
            auto before = snapshot(dir);
            std::string command = std::string(TERZO_CLI) + " " + c.run;
            if (c.limit > 0) {
                // The shell's ulimit -f counts 512-byte blocks; with SIGXFSZ ignored a write past
                // the limit fails with EFBIG instead of killing terzo.
                REQUIRE(c.limit % 512 == 0);
                command = "(trap '' XFSZ; ulimit -f " + std::to_string(c.limit / 512) + "; exec " + command + ")";
            }
            auto r = run("cd " + dir.string() + " && " + command);
            CHECK(r.status != 0);
            CHECK(r.out.empty());
            CHECK(r.err == c.error + "\n");
            CHECK(snapshot(dir) == before);
            fs::remove_all(dir);
        }
    }
}

TEST_CASE("the manual's table of bad inputs is made from the tested cases", "[bad_input]") {
    const std::string begin = "<!-- bad-inputs:begin -->\n", end = "<!-- bad-inputs:end -->";
    fs::path readme = source_path("docs/errors.md");
    std::string text = slurp(readme);
    auto b = text.find(begin), e = text.find(end);
    REQUIRE(b != std::string::npos);
    REQUIRE(e != std::string::npos);
    std::string expected = readme_table(load_cases());
    std::string actual = text.substr(b + begin.size(), e - b - begin.size());
    if (actual != expected && (std::getenv("TERZO_UPDATE_DOCS") || std::getenv("TERZO_UPDATE_README"))) {
        std::string updated = text.substr(0, b + begin.size()) + expected + text.substr(e);
        terzo::write_file_atomically(readme, [&](std::ostream& o) { o << updated; }, terzo::Overwrite::allow);
        actual = expected;
    }
    CHECK(actual == expected);
}
