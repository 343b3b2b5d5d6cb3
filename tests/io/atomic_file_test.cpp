#include <catch2/catch.hpp>

#include <filesystem>
#include <fstream>
#include <functional>
#include <string>
#include <vector>
#include <stdexcept>
#include <sys/wait.h>
#include <unistd.h>

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

// A full disk as the kernel reports it to a writer: RLIMIT_FSIZE of 4096 bytes makes write()
// fail with EFBIG (SIGXFSZ ignored), in a child process only. Runs write there and says
// whether it threw an InputError whose message holds every one of the fragments.
bool fails_under_file_limit(const std::function<void()>& write, const std::vector<std::string>& fragments) {
    pid_t child = ::fork();
    REQUIRE(child >= 0);
    if (child == 0) {
        ::signal(SIGXFSZ, SIG_IGN);
        rlimit limit{4096, 4096};
        ::setrlimit(RLIMIT_FSIZE, &limit);
        try {
            write();
        } catch (const InputError& e) {
            bool named = true;
            for (const std::string& f : fragments) named = named && std::string(e.what()).find(f) != std::string::npos;
            ::_exit(named ? 3 : 4);
        }
        ::_exit(0);
    }
    int status = 0;
    ::waitpid(child, &status, 0);
    return WIFEXITED(status) && WEXITSTATUS(status) == 3;
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
                      "/nonexistent-dir/x.txt: error: folder /nonexistent-dir does not exist");
    // /proc takes no new files, whoever asks (also root, whom permissions do not stop).
    CHECK_THROWS_WITH(write_file_atomically("/proc/x.txt", [](std::ostream& o) { o << 1; }),
                      Catch::StartsWith("/proc/x.txt: error: cannot create a file in /proc: "));
    CHECK_THROWS_WITH(write_file_atomically("/tmp", [](std::ostream& o) { o << 1; }, Overwrite::allow),
                      "/tmp: error: is a folder; give a file name");
}

TEST_CASE("a device, or a path under a file, is refused before anything is written", "[atomic_file]") {
    // Regression: renaming over /dev/null with Overwrite::allow replaced the device by a file.
    CHECK_THROWS_WITH(check_target("/dev/null", Overwrite::allow),
                      "/dev/null: error: is not a regular file (a device, pipe or socket); give a file name");
    fs::path dir = test::temp_folder("atomic-target");
    write_file_atomically(dir / "f", [](std::ostream& o) { o << "x"; });
    CHECK_THROWS_WITH(check_target(dir / "f" / "g.txt", Overwrite::refuse),
                      (dir / "f" / "g.txt").string() + ": error: " + (dir / "f").string() +
                          " is a file, not a folder");
    CHECK_THROWS_WITH(check_target(dir / "f", Overwrite::refuse),
                      (dir / "f").string() + ": error: already exists and was not changed (allow overwriting to replace it)");
    CHECK_NOTHROW(check_target(dir / "f", Overwrite::allow));
    CHECK_NOTHROW(check_target(dir / "new.txt", Overwrite::refuse));
    CHECK(test::slurp(dir / "f") == "x");
    fs::remove_all(dir);
}

TEST_CASE("a write that hits a file size limit leaves the old file intact", "[atomic_file]") {
    fs::path dir = test::temp_folder("atomic-full");
    fs::path target = dir / "keep.txt";
    write_file_atomically(target, [](std::ostream& o) { o << "precious\n"; });
    CHECK(fails_under_file_limit(
        [&] {
            write_file_atomically(target, [](std::ostream& o) { o << std::string(1 << 20, 'x'); },
                                  Overwrite::allow);
        },
        {"cannot write"}));
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

namespace {
// The id of a process that has ended: a stale temporary carries such an id.
pid_t ended_process() {
    pid_t child = ::fork();
    if (child == 0) ::_exit(0);
    int status = 0;
    ::waitpid(child, &status, 0);
    return child;
}
} // namespace

TEST_CASE("a target name of 255 bytes can be written: the temporary name is short", "[atomic_file]") {
    fs::path dir = test::temp_folder("atomic-long");
    for (std::size_t n : {244u, 250u, 255u}) {
        fs::path target = dir / std::string(n, 'a');
        write_file_atomically(target, [](std::ostream& o) { o << "long\n"; });
        CHECK(test::slurp(target) == "long\n");
    }
    CHECK(files_in(dir) == 3);
    fs::remove_all(dir);
}

TEST_CASE("temporaries left by a killed writer are removed by the next write, others are kept", "[atomic_file]") {
    fs::path dir = test::temp_folder("atomic-stale");
    const std::string dead = ".tz-" + std::to_string(ended_process()) + "-";
    std::ofstream(dir / (dead + "Ab3xYz")) << "half";
    fs::create_directory(dir / (dead + "Folder"));
    std::ofstream(dir / (dead + "Folder") / "rank-01.scl") << "half";
    // A running process (this one's parent) and names that only look alike stay.
    const std::string alive = ".tz-" + std::to_string(::getppid()) + "-Ab3xYz";
    std::ofstream(dir / alive) << "in use";
    std::ofstream(dir / ".tz-notapid") << "mine";
    write_file_atomically(dir / "out.txt", [](std::ostream& o) { o << "new\n"; });
    CHECK_FALSE(fs::exists(dir / (dead + "Ab3xYz")));
    CHECK_FALSE(fs::exists(dir / (dead + "Folder")));
    CHECK(fs::exists(dir / alive));
    CHECK(fs::exists(dir / ".tz-notapid"));
    CHECK(files_in(dir) == 3);
    fs::remove_all(dir);
}

TEST_CASE("a symbolic link is written through: the file it points to changes, the link stays", "[atomic_file]") {
    fs::path dir = test::temp_folder("atomic-link");
    std::ofstream(dir / "real.txt") << "old\n";
    fs::create_symlink("real.txt", dir / "link.txt");
    CHECK_THROWS_WITH(write_file_atomically(dir / "link.txt", [](std::ostream& o) { o << "new\n"; }),
                      (dir / "link.txt").string() + ": error: already exists and was not changed (allow overwriting to replace it)");
    write_file_atomically(dir / "link.txt", [](std::ostream& o) { o << "new\n"; }, Overwrite::allow);
    CHECK(fs::is_symlink(dir / "link.txt"));
    CHECK(test::slurp(dir / "real.txt") == "new\n");
    // A dangling link is an existing name: refused without overwriting, and with it the file
    // it names is created.
    fs::create_symlink("missing.txt", dir / "dangling.txt");
    CHECK_THROWS_WITH(write_file_atomically(dir / "dangling.txt", [](std::ostream& o) { o << "x\n"; }),
                      Catch::Contains("already exists and was not changed"));
    write_file_atomically(dir / "dangling.txt", [](std::ostream& o) { o << "x\n"; }, Overwrite::allow);
    CHECK(fs::is_symlink(dir / "dangling.txt"));
    CHECK(test::slurp(dir / "missing.txt") == "x\n");
    fs::remove_all(dir);
}

TEST_CASE("a set of files is written all together, into a new folder or an existing one", "[atomic_file]") {
    fs::path dir = test::temp_folder("atomic-set");
    const std::vector<FileContent> files{{"a-01.scl", "one\n"}, {"a-02.scl", "two\n"}};
    auto written = write_file_set(dir / "new" / "deeper", files, Overwrite::refuse, "--write-scl");
    REQUIRE(written.size() == 2);
    CHECK(written[1] == dir / "new" / "deeper" / "a-02.scl");
    CHECK(test::slurp(written[0]) == "one\n");
    CHECK(files_in(dir / "new" / "deeper") == 2);
    CHECK(files_in(dir / "new") == 1); // the staging folder became the folder
    CHECK_THROWS_WITH(write_file_set(dir / "new" / "deeper", files, Overwrite::refuse, "--write-scl"),
                      Catch::Contains("already exists and was not changed"));
    const std::vector<FileContent> newer{{"a-01.scl", "ONE\n"}, {"a-02.scl", "TWO\n"}};
    write_file_set(dir / "new" / "deeper", newer, Overwrite::allow, "--write-scl");
    CHECK(test::slurp(dir / "new" / "deeper" / "a-02.scl") == "TWO\n");
    CHECK(files_in(dir / "new" / "deeper") == 2);
    std::ofstream(dir / "plain") << "x";
    CHECK_THROWS_WITH(write_file_set(dir / "plain", files, Overwrite::refuse, "--write-scl"),
                      "--write-scl: error: " + (dir / "plain").string() + " is a file, not a folder (no file was written)");
    fs::remove_all(dir);
}

TEST_CASE("a set that does not fit on the disk changes no file of the folder", "[atomic_file]") {
    fs::path dir = test::temp_folder("atomic-set-full");
    write_file_set(dir, {{"r-01.scl", "old 1\n"}, {"r-02.scl", "old 2\n"}, {"r-03.scl", "old 3\n"}}, Overwrite::refuse, "--write-scl");
    // The first two fit, the third does not.
    CHECK(fails_under_file_limit(
        [&] {
            write_file_set(dir, {{"r-01.scl", "new 1\n"}, {"r-02.scl", "new 2\n"}, {"r-03.scl", std::string(1 << 20, 'x')}},
                           Overwrite::allow, "--write-scl");
        },
        {"r-03.scl: error: cannot write", "no file in the folder was created or changed"}));
    CHECK(test::slurp(dir / "r-01.scl") == "old 1\n");
    CHECK(test::slurp(dir / "r-02.scl") == "old 2\n");
    CHECK(files_in(dir) == 3); // no staging folder left
    fs::remove_all(dir);
}

TEST_CASE("files for several folders are all replaced, or none is when one does not fit", "[atomic_file]") {
    fs::path dir = test::temp_folder("atomic-together");
    fs::create_directories(dir / "a");
    fs::create_directories(dir / "b");
    write_files_together({{dir / "a" / "keys.csv", "old csv\n"}, {dir / "b" / "bulk.syx", "old syx\n"}}, Overwrite::refuse);
    CHECK(test::slurp(dir / "a" / "keys.csv") == "old csv\n");
    CHECK(test::slurp(dir / "b" / "bulk.syx") == "old syx\n");

    // Refused before anything is written: the second target exists and overwriting is not allowed.
    CHECK_THROWS_WITH(write_files_together({{dir / "a" / "new.scl", "x\n"}, {dir / "b" / "bulk.syx", "y\n"}}, Overwrite::refuse),
                      (dir / "b" / "bulk.syx").string() + ": error: already exists and was not changed (allow overwriting to replace it)");
    CHECK_FALSE(fs::exists(dir / "a" / "new.scl"));

    // The first fits, the second does not: the first must not be replaced either.
    CHECK(fails_under_file_limit(
        [&] {
            write_files_together({{dir / "a" / "keys.csv", "new csv\n"}, {dir / "b" / "bulk.syx", std::string(1 << 20, 'x')}},
                                 Overwrite::allow);
        },
        {"bulk.syx: error: cannot write", "none of the 2 files was written"}));
    CHECK(test::slurp(dir / "a" / "keys.csv") == "old csv\n");
    CHECK(test::slurp(dir / "b" / "bulk.syx") == "old syx\n");
    CHECK(files_in(dir / "a") == 1); // no temporary left beside either target
    CHECK(files_in(dir / "b") == 1);

    write_files_together({{dir / "a" / "keys.csv", "new csv\n"}, {dir / "b" / "bulk.syx", "new syx\n"}}, Overwrite::allow);
    CHECK(test::slurp(dir / "a" / "keys.csv") == "new csv\n");
    CHECK(test::slurp(dir / "b" / "bulk.syx") == "new syx\n");
    fs::remove_all(dir);
}
