#include <catch2/catch.hpp>

#include <filesystem>
#include <stdexcept>

#include "core/error.hpp"
#include "core/io/atomic_file.hpp"
#include "tests/support/run.hpp"

#include <csignal>
#include <sys/resource.h>

using namespace terzo;
namespace fs = std::filesystem;

namespace {
std::size_t files_in(const fs::path& dir) {
    return static_cast<std::size_t>(std::distance(fs::directory_iterator(dir), fs::directory_iterator()));
}
} // namespace

TEST_CASE("a file is written whole and replaces nothing unless allowed", "[atomic_file]") {
    fs::path dir = test::temp_folder("atomic");
    fs::path target = dir / "out.txt";
    write_file_atomically(target, [](std::ostream& o) { o << "first\n"; });
    CHECK(test::slurp(target) == "first\n");
    CHECK(fs::status(target).permissions() == (fs::perms::owner_read | fs::perms::owner_write |
                                               fs::perms::group_read | fs::perms::others_read));
    CHECK_THROWS_WITH(write_file_atomically(target, [](std::ostream& o) { o << "second\n"; }),
                      target.string() + ": error: already exists and was not changed (allow overwriting to replace it)");
    CHECK(test::slurp(target) == "first\n");
    write_file_atomically(target, [](std::ostream& o) { o << "second\n"; }, Overwrite::allow);
    CHECK(test::slurp(target) == "second\n");
    CHECK(files_in(dir) == 1); // no temporary file left behind
    fs::remove_all(dir);
}

TEST_CASE("a writer that fails midway leaves the old file and no temporary file", "[atomic_file]") {
    fs::path dir = test::temp_folder("atomic-fail");
    fs::path target = dir / "keep.txt";
    write_file_atomically(target, [](std::ostream& o) { o << "precious\n"; });
    CHECK_THROWS_AS(write_file_atomically(
                        target,
                        [](std::ostream& o) {
                            o << "half";
                            throw std::runtime_error("boom");
                        },
                        Overwrite::allow),
                    std::runtime_error);
    CHECK(test::slurp(target) == "precious\n");
    CHECK(files_in(dir) == 1);
    fs::remove_all(dir);
}

TEST_CASE("unwritable places are reported by name", "[atomic_file]") {
    CHECK_THROWS_WITH(write_file_atomically("/nonexistent-dir/x.txt", [](std::ostream& o) { o << 1; }),
                      Catch::StartsWith("/nonexistent-dir/x.txt: error: cannot create a file in /nonexistent-dir"));
    CHECK_THROWS_WITH(write_file_atomically("/tmp", [](std::ostream& o) { o << 1; }, Overwrite::allow),
                      "/tmp: error: is a folder; give a file name");
}

TEST_CASE("a write that hits a file size limit leaves the old file intact", "[atomic_file]") {
    // A full disk as the kernel reports it to a writer: RLIMIT_FSIZE makes write() fail with
    // EFBIG once the limit is reached (SIGXFSZ ignored), in a child process only.
    fs::path dir = test::temp_folder("atomic-full");
    fs::path target = dir / "keep.txt";
    write_file_atomically(target, [](std::ostream& o) { o << "precious\n"; });
    pid_t child = ::fork();
    REQUIRE(child >= 0);
    if (child == 0) {
        ::signal(SIGXFSZ, SIG_IGN);
        rlimit limit{4096, 4096};
        ::setrlimit(RLIMIT_FSIZE, &limit);
        try {
            write_file_atomically(target, [](std::ostream& o) { o << std::string(1 << 20, 'x'); },
                                  Overwrite::allow);
        } catch (const InputError& e) {
            bool named = std::string(e.what()).find("cannot write") != std::string::npos;
            ::_exit(named ? 3 : 4);
        }
        ::_exit(0);
    }
    int status = 0;
    ::waitpid(child, &status, 0);
    REQUIRE(WIFEXITED(status));
    CHECK(WEXITSTATUS(status) == 3);
    CHECK(test::slurp(target) == "precious\n");
    CHECK(files_in(dir) == 1);
    fs::remove_all(dir);
}

TEST_CASE("a writer killed midway leaves the old file intact", "[atomic_file]") {
    fs::path dir = test::temp_folder("atomic-kill");
    fs::path target = dir / "keep.txt";
    write_file_atomically(target, [](std::ostream& o) { o << "precious\n"; });
    // The child writes 200 MB and is killed with SIGKILL while the bytes go to disk; whatever
    // moment the signal lands in, the target must hold either the old or the whole new text.
    pid_t child = ::fork();
    REQUIRE(child >= 0);
    if (child == 0) {
        write_file_atomically(target, [](std::ostream& o) { o << std::string(200u << 20, 'x'); },
                              Overwrite::allow);
        ::_exit(0);
    }
    ::usleep(150 * 1000);
    ::kill(child, SIGKILL);
    int status = 0;
    ::waitpid(child, &status, 0);
    std::string now = test::slurp(target);
    CHECK((now == "precious\n" || now.size() == (200u << 20)));
    if (WIFSIGNALED(status)) CHECK(now == "precious\n");
    fs::remove_all(dir);
}
