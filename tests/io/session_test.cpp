#include "core/io/session.hpp"

#include <catch2/catch.hpp>

#include <csignal>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <sstream>
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

#include "core/error.hpp"
#include "core/tuning/scl.hpp"
#include "tests/support/run.hpp"

using namespace terzo;

namespace {

Scale demo_scale() {
    std::istringstream in("demo\n 3\n 5/4\n 701.955\n 2/1\n");
    return read_scl(in, "demo.scl");
}

Session sample() {
    Session s;
    s.tunings.push_back({"scales/demo.scl", demo_scale()});
    s.tunings.push_back({"other.scl", demo_scale()});
    s.current = 1;
    s.settings.reference_hz = 415.0;
    s.settings.max_order = 3;
    s.settings.pitch_reference = "A4=415";
    s.settings.landing_tolerance_cents = 2.5;
    s.selection = {0, 2, 3};
    s.view = "grid";
    s.volume = 0.25;
    return s;
}

std::string text_of(const Session& s) {
    std::ostringstream out;
    write_session(out, s);
    return out.str();
}

Session parse(const std::string& text) {
    std::istringstream in(text);
    return read_session(in, "s.json");
}

// The sample's text with one exact substring replaced.
std::string edited(const std::string& from, const std::string& to) {
    std::string t = text_of(sample());
    auto at = t.find(from);
    REQUIRE(at != std::string::npos);
    return t.replace(at, from.size(), to);
}

Session parse_edited(const std::string& from, const std::string& to) {
    return parse(edited(from, to));
}

} // namespace

TEST_CASE("a session reads back exactly as it was written", "[session]") {
    Session s = sample();
    Session back = parse(text_of(s));
    REQUIRE(back.tunings.size() == 2);
    CHECK(back.tunings[0].source == "scales/demo.scl");
    CHECK(back.tunings[0].scale == s.tunings[0].scale);
    CHECK(back.tunings[1].scale.degree(1).ratio() == Ratio(5, 4));
    CHECK_FALSE(back.tunings[1].scale.degree(2).is_exact());
    CHECK(back.current == 1);
    CHECK(back.settings.reference_hz == 415.0);
    CHECK(back.settings.max_order == 3);
    CHECK(back.settings.landing_tolerance_cents == 2.5);
    CHECK(back.settings.span == 3);
    CHECK(back.settings.grid_measure == "fit");
    CHECK(back.settings.pitch_reference == "A4=415");
    CHECK(back.selection == std::vector<int>{0, 2, 3});
    CHECK(back.view == "grid");
    CHECK(back.volume == 0.25);
    CHECK(text_of(back) == text_of(s));
}

TEST_CASE("the session format is the documented JSON", "[session]") {
    std::string t = text_of(sample());
    CHECK(t.rfind("{\n  \"format\": \"terzo-session\",\n  \"version\": 1,\n  \"tunings\": [", 0) == 0);
    CHECK(t.find("\"reference_hz\": 415.0") != std::string::npos);
    CHECK(t.find("\"selection\": [\n    0,\n    2,\n    3\n  ]") != std::string::npos);
}

TEST_CASE("an empty session is valid", "[session]") {
    Session back = parse(text_of(Session{}));
    CHECK(back.tunings.empty());
    CHECK(back.current == 0);
    CHECK(back.view == "lattice");
}

TEST_CASE("session files are written atomically and replaced on save", "[session]") {
    test::ScratchFolder dir("session");
    const auto path = dir.path / "s.json";
    save_session_file(path, sample());
    const std::string first = test::slurp(path);
    Session again = sample();
    again.view = "sheet";
    save_session_file(path, again);
    CHECK(load_session_file(path).view == "sheet");
    const std::string second = test::slurp(path);

    // Atomically: a save that fails midway leaves the saved file as it was and no temporary
    // file beside it. The failure is a full disk as the kernel reports it to a writer:
    // RLIMIT_FSIZE makes write() fail with EFBIG past 16 bytes (SIGXFSZ ignored), in a child.
    pid_t child = ::fork();
    REQUIRE(child >= 0);
    if (child == 0) {
        ::signal(SIGXFSZ, SIG_IGN);
        rlimit limit{16, 16};
        ::setrlimit(RLIMIT_FSIZE, &limit);
        try {
            save_session_file(path, sample());
        } catch (const InputError&) {
            ::_exit(3);
        }
        ::_exit(0);
    }
    int status = 0;
    ::waitpid(child, &status, 0);
    REQUIRE(WIFEXITED(status));
    CHECK(WEXITSTATUS(status) == 3); // the failed save was reported
    CHECK(test::slurp(path) == second);
    CHECK(second != first);
    CHECK(std::distance(std::filesystem::directory_iterator(dir.path),
                        std::filesystem::directory_iterator()) == 1);
}

TEST_CASE("malformed session files are rejected with one clear message", "[session]") {
    SECTION("JSON syntax errors give line and column") {
        REQUIRE_THROWS_WITH(parse("{\n  \"format\": x\n}"),
                            "s.json:2:13: error: not valid JSON: syntax error while parsing value "
                            "- invalid literal; last read: '\"format\": x'");
        REQUIRE_THROWS_WITH(parse(""), Catch::StartsWith("s.json:1:1: error: not valid JSON:"));
    }
    SECTION("the wrong kind of file") {
        REQUIRE_THROWS_WITH(parse("[1, 2]"), "s.json: error: the session must be a JSON object");
        REQUIRE_THROWS_WITH(parse("{\"format\": \"other\"}"),
                            "s.json: error: not a terzo session: \"format\" must be \"terzo-session\"");
        REQUIRE_THROWS_WITH(parse("{}"), "s.json: error: missing key \"format\"");
        REQUIRE_THROWS_WITH(parse_edited("\"version\": 1", "\"version\": 2"),
                            "s.json: error: session version 2 is not supported; this terzo reads "
                            "version 1");
    }
    SECTION("missing, unknown and mistyped keys") {
        REQUIRE_THROWS_WITH(parse_edited("\"view\": \"grid\",", ""),
                            "s.json: error: missing key \"view\"");
        REQUIRE_THROWS_WITH(parse_edited("\"view\": \"grid\"", "\"view\": \"grid\", \"colour\": 1"),
                            "s.json: error: unknown key \"colour\"");
        REQUIRE_THROWS_WITH(parse_edited("\"partials\": 1", "\"partials\": 1, \"speed\": 2"),
                            "s.json: error: unknown key \"speed\" in \"settings\"");
        REQUIRE_THROWS_WITH(parse_edited("\"source\": \"other.scl\"", "\"source\": 3"),
                            "s.json: error: \"tunings[1].source\" must be a string, found 3");
        REQUIRE_THROWS_WITH(parse_edited("\"tunings\": [", "\"tunings\": 4, \"x\": ["),
                            "s.json: error: \"tunings\" must be an array, found 4");
        REQUIRE_THROWS_WITH(parse_edited("\"settings\": {", "\"settings\": 1, \"y\": {"),
                            "s.json: error: \"settings\" must be a JSON object");
    }
    SECTION("values out of range") {
        REQUIRE_THROWS_WITH(parse_edited("\"reference_hz\": 415.0", "\"reference_hz\": 0"),
                            "s.json: error: \"settings.reference_hz\" must be a number from "
                            "0.001 to 100000, found 0");
        REQUIRE_THROWS_WITH(parse_edited("\"max_order\": 3", "\"max_order\": 13"),
                            "s.json: error: \"settings.max_order\" must be an integer from 2 to 12, "
                            "found 13");
        REQUIRE_THROWS_WITH(parse_edited("\"max_order\": 3", "\"max_order\": 3.5"),
                            "s.json: error: \"settings.max_order\" must be an integer from 2 to 12, "
                            "found 3.5");
        REQUIRE_THROWS_WITH(parse_edited("\"landing_tolerance_cents\": 2.5", "\"landing_tolerance_cents\": 0"),
                            "s.json: error: \"settings.landing_tolerance_cents\" must be a number "
                            "above 0 up to 600, found 0");
        REQUIRE_THROWS_WITH(parse_edited("\"span\": 3", "\"span\": 12"),
                            "s.json: error: \"settings.span\" must be an integer from 1 to 11, "
                            "found 12");
        REQUIRE_THROWS_WITH(parse_edited("\"grid_measure\": \"fit\"", "\"grid_measure\": \"best\""),
                            "s.json: error: grid measure \"best\" is neither \"worst\" nor \"fit\"");
        REQUIRE_THROWS_WITH(parse_edited("\"current\": 1", "\"current\": 2"),
                            "s.json: error: \"current\" must be an integer from 0 to 1, found 2");
        REQUIRE_THROWS_WITH(parse_edited("\"view\": \"grid\"", "\"view\": \"map\""),
                            "s.json: error: \"view\" must be one of lattice, grid, keys, sheet; "
                            "found \"map\"");
        REQUIRE_THROWS_WITH(parse_edited("\"volume\": 0.25", "\"volume\": 2"),
                            "s.json: error: \"volume\" must be a number from 0 to 1, found 2");
    }
    SECTION("a malformed pitch reference is reported by the note-name parser") {
        REQUIRE_THROWS_WITH(parse_edited("\"A4=415\"", "\"A4=\""),
                            "s.json: error: expected a frequency in Hz after '=' in \"A4=\"");
    }
    SECTION("bad selections") {
        // The current tuning has 3 degrees and the span is 3 periods: notes 0 to 9.
        REQUIRE_THROWS_WITH(parse_edited("\n    0,", "\n    10,"),
                            "s.json: error: \"selection\" must hold note numbers from 0 to 9 of "
                            "the current keyboard, found 10");
        REQUIRE_THROWS_WITH(parse_edited("\n    2,", "\n    0,"),
                            "s.json: error: \"selection\" must be ascending without repeats, found "
                            "[0,0,3]");
        REQUIRE_THROWS_WITH(parse_edited("\n    3\n", "\n    3,4,5,6,7,8,9\n"),
                            "s.json: error: \"selection\" has 9 entries; at most 8 are allowed");
    }
    SECTION("a broken embedded tuning names its entry and line") {
        REQUIRE_THROWS_WITH(parse_edited("5/4", "5/0"),
                            Catch::StartsWith("s.json tunings[0]:"));
    }
    SECTION("limits: number of tunings and file size") {
        Session many;
        for (int i = 0; i < 65; ++i) many.tunings.push_back({"t.scl", demo_scale()});
        REQUIRE_THROWS_WITH(parse(text_of(many)),
                            "s.json: error: \"tunings\" has 65 entries; at most 64 are allowed");
        std::string huge(max_session_bytes + 10, ' ');
        REQUIRE_THROWS_WITH(parse(huge), "s.json: error: the session file is larger than 64 MiB");
    }
    SECTION("unreadable paths") {
        REQUIRE_THROWS_WITH(load_session_file("/nonexistent/s.json"),
                            "/nonexistent/s.json: error: no such file");
        REQUIRE_THROWS_WITH(load_session_file("/tmp"),
                            "/tmp: error: is a folder, not a session file");
    }
}

TEST_CASE("settings outside their ranges are rejected by check_settings", "[session]") {
    SessionSettings s;
    CHECK_NOTHROW(check_settings(s, "x"));
    s.partials = 33;
    REQUIRE_THROWS_WITH(check_settings(s, "x"), "x: error: partials 33 is outside 1 to 32");
    s = {};
    s.reference_hz = 200000;
    REQUIRE_THROWS_WITH(check_settings(s, "x"),
                        "x: error: reference pitch 200000.000 Hz is outside 0.001 to 100000 Hz");
    s = {};
    s.max_order = 1;
    REQUIRE_THROWS_WITH(check_settings(s, "x"),
                        "x: error: combination-tone order 1 is outside 2 to 12");
}

TEST_CASE("a number too large for a double is rejected, not thrown through", "[session]") {
    // Regression: found by fuzzing (tests/fuzz/session/regression_number_too_large.json).
    std::istringstream in(R"({"format": "terzo-session", "version": 1e999})");
    CHECK_THROWS_WITH(read_session(in, "s.json"),
                      "s.json: error: not valid JSON: the number \"1e999\" is too large");
}

TEST_CASE("a description that is not UTF-8 is saved with U+FFFD instead of failing", "[session]") {
    // It used to throw nlohmann's type_error out of write_session, which ended the window.
    std::istringstream in("! l1.scl\nbad \xFF\n 1\n 2/1\n");
    Session s;
    s.tunings.push_back({"l1.\xFEscl", read_scl(in, "l1.scl")});
    const std::string text = text_of(s);
    Session back = parse(text);
    CHECK(back.tunings[0].scale.description() == "bad \xEF\xBF\xBD");
    CHECK(back.tunings[0].source == "l1.\xEF\xBF\xBDscl");
}

TEST_CASE("an unreadable session is moved aside without replacing an earlier one", "[session]") {
    auto dir = std::filesystem::temp_directory_path() / "terzo_session_unreadable";
    std::filesystem::remove_all(dir);
    std::filesystem::create_directories(dir);
    auto path = dir / "session.json";
    std::ofstream(path) << "first";
    CHECK(keep_unreadable_session(path) == dir / "session.json.unreadable");
    std::ofstream(path) << "second";
    CHECK(keep_unreadable_session(path) == dir / "session.json.unreadable-2");
    CHECK_FALSE(std::filesystem::exists(path));
    std::ifstream first(dir / "session.json.unreadable");
    std::string word;
    first >> word;
    CHECK(word == "first");
    std::filesystem::remove_all(dir);
}

TEST_CASE("a session file must be a regular file", "[session]") {
    CHECK_THROWS_WITH(load_session_file("/dev/zero"),
                      "/dev/zero: error: is not a regular file (a pipe, device or socket); terzo reads a session file only from a file");
}

TEST_CASE("a session keeps its key map, and a session without one reads as every key", "[session]") {
    Session s = sample();
    s.key_map.layout = KeyLayout::pattern;
    s.key_map.root_key = 48;
    s.key_map.pattern = {{0, silent_key, 1}, 2};
    s.key_map.reference = KeyReference{48, 130.0};
    const Session back = parse(text_of(s));
    CHECK(back.key_map == s.key_map);
    CHECK(text_of(back) == text_of(s));
    // A session written before key maps: the same text without the "key_map" member.
    std::string old = text_of(sample());
    const auto at = old.find(",\n  \"key_map\"");
    REQUIRE(at != std::string::npos);
    old = old.substr(0, at) + "\n}\n";
    CHECK(parse(old).key_map == KeyMapSpec{});
    SECTION("a bad key map in a session names its key") {
        CHECK_THROWS_WITH(parse_edited("\"layout\": \"every-key\"", "\"layout\": \"keys\""),
                          "s.json: error: \"keys\" is not a layout; use every-key, white-keys, "
                          "twelve-by-pitch or pattern");
        CHECK_THROWS_WITH(parse_edited("\"root_key\": 60", "\"root_key\": 600"),
                          "s.json: error: \"key_map.root_key\" must be a whole number from 0 to "
                          "127, found 600");
    }
}
