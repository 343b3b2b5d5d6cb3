// Test support: run a command line through the shell and capture stdout, stderr and the
// exit status, for tests of the `terzo` program itself.
#pragma once

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>

#include <sys/wait.h>
#include <unistd.h>

namespace terzo::test {

struct RunResult {
    int status = -1; ///< exit status, or -1 when the command did not exit normally
    std::string out, err;
};

inline std::string slurp(const std::filesystem::path& p) {
    std::ifstream in(p, std::ios::binary);
    std::ostringstream s;
    s << in.rdbuf();
    return s.str();
}

/// Runs `command` with stdout and stderr captured into files of a fresh temporary folder.
inline RunResult run(const std::string& command) {
    auto dir = std::filesystem::temp_directory_path() /
               ("terzo-run-" + std::to_string(::getpid()) + "-" + std::to_string(std::rand()));
    std::filesystem::create_directories(dir);
    std::string full = command + " >" + (dir / "out").string() + " 2>" + (dir / "err").string() + " </dev/null";
    int raw = std::system(full.c_str());
    RunResult r;
    r.status = WIFEXITED(raw) ? WEXITSTATUS(raw) : -1;
    r.out = slurp(dir / "out");
    r.err = slurp(dir / "err");
    std::filesystem::remove_all(dir);
    return r;
}

/// The built `terzo` program followed by arguments.
inline RunResult run_terzo(const std::string& args) { return run(std::string(TERZO_CLI) + " " + args); }

/// A path inside the source tree.
inline std::string source_path(const std::string& relative) {
    return std::string(TERZO_SOURCE_DIR) + "/" + relative;
}

/// A fresh, empty temporary folder for one test.
inline std::filesystem::path temp_folder(const std::string& name) {
    auto dir = std::filesystem::temp_directory_path() /
               ("terzo-" + name + "-" + std::to_string(::getpid()));
    std::filesystem::remove_all(dir);
    std::filesystem::create_directories(dir);
    return dir;
}

} // namespace terzo::test
