// Test support: run a command line through the shell and capture stdout, stderr and the
// exit status, for tests of the `terzo` program itself.
#pragma once

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>
#include <system_error>

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

/// The same, run inside folder `dir` (relative paths in args are relative to it).
inline RunResult run_terzo_in(const std::filesystem::path& dir, const std::string& args) {
    return run("cd '" + dir.string() + "' && " + TERZO_CLI + " " + args);
}

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

/// A fresh temporary folder that is removed, with what it holds, when the object goes out of
/// scope. Each object has its own folder, also within one process.
class ScratchFolder {
public:
    explicit ScratchFolder(const std::string& name) : path(temp_folder(name + "-" + std::to_string(next_number()))) {}
    ~ScratchFolder() {
        std::error_code ec;
        std::filesystem::remove_all(path, ec);
    }
    ScratchFolder(const ScratchFolder&) = delete;
    ScratchFolder& operator=(const ScratchFolder&) = delete;

    const std::filesystem::path path;

private:
    static int next_number() {
        static int n = 0;
        return ++n;
    }
};

/// Standard output of a command that must succeed, without the trailing newlines and spaces;
/// the output is empty and the failure is visible in the returned text when it does not.
inline std::string output_of(const std::string& command) {
    RunResult r = run(command);
    if (r.status != 0) return "(exit status " + std::to_string(r.status) + ": " + r.err + ")";
    while (!r.out.empty() && (r.out.back() == '\n' || r.out.back() == ' ')) r.out.pop_back();
    return r.out;
}

} // namespace terzo::test
