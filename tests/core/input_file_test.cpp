#include <catch2/catch.hpp>

#include <filesystem>
#include <fstream>
#include <sys/stat.h>

#include "core/error.hpp"
#include "core/input_file.hpp"
#include "tests/support/run.hpp"

using namespace terzo;
namespace fs = std::filesystem;

TEST_CASE("only a regular file within the size limit is opened", "[input_file]") {
    fs::path dir = test::temp_folder("input-file");
    std::ofstream(dir / "small.txt") << "hello\n";
    std::ifstream in = open_input_file(dir / "small.txt", 6, "a text file");
    std::string line;
    REQUIRE(std::getline(in, line));
    CHECK(line == "hello");
    CHECK_THROWS_WITH(open_input_file(dir / "small.txt", 5, "a text file"),
                      (dir / "small.txt").string() + ": error: is 6 bytes, larger than 5 bytes, the most terzo reads as a text file");
    CHECK_THROWS_WITH(open_input_file(dir, 5, "a text file"), dir.string() + ": error: is a folder, not a text file");
    CHECK_THROWS_WITH(open_input_file(dir / "none.txt", 5, "a text file"), (dir / "none.txt").string() + ": error: no such file");
    // A pipe would block the reader until someone writes; a device may never end.
    REQUIRE(::mkfifo((dir / "pipe").c_str(), 0600) == 0);
    CHECK_THROWS_WITH(open_input_file(dir / "pipe", 5, "a text file"),
                      (dir / "pipe").string() +
                          ": error: is not a regular file (a pipe, device or socket); terzo reads a text file only from a file");
    CHECK_THROWS_WITH(open_input_file("/dev/zero", 5, "a text file"), Catch::Contains("is not a regular file"));
    fs::remove_all(dir);
}

TEST_CASE("size limits are stated in the largest whole unit", "[input_file]") {
    CHECK(size_text(16u << 20) == "16 MiB");
    CHECK(size_text(1u << 10) == "1 KiB");
    CHECK(size_text(1500) == "1500 bytes");
}
