#include <catch2/catch.hpp>

#include <sstream>

#include "core/io/key_map_file.hpp"

using namespace terzo;

namespace {

std::string written(const KeyMapSpec& spec) {
    std::ostringstream out;
    write_key_map(out, spec);
    return out.str();
}

KeyMapSpec read(const std::string& text) {
    std::istringstream in(text);
    return read_key_map(in, "map.json");
}

} // namespace

TEST_CASE("a key-map file is written one member a line", "[key_map_file]") {
    KeyMapSpec spec;
    spec.root_key = 62;
    spec.reference = KeyReference{69, 415.0};
    spec.layout = KeyLayout::pattern;
    spec.pattern = {{0, silent_key, 1, 2, silent_key, 3}, 4};
    CHECK(written(spec) == "{\n"
                           "  \"format\": \"terzo-key-map\",\n"
                           "  \"version\": 1,\n"
                           "  \"root_key\": 62,\n"
                           "  \"reference\": {\"key\": 69, \"hz\": 415.0},\n"
                           "  \"layout\": \"pattern\",\n"
                           "  \"pattern\": [0, \"x\", 1, 2, \"x\", 3],\n"
                           "  \"degrees_per_repeat\": 4,\n"
                           "  \"degree_order\": \"pitch\"\n"
                           "}\n");
}

TEST_CASE("every layout reads back to the same key map", "[key_map_file]") {
    KeyMapSpec spec;
    SECTION("every key, default reference") {}
    SECTION("every key, 24 keys a period, file order") {
        spec.keys_per_period = 24;
        spec.keep_file_order = true;
        spec.reference = KeyReference{60, 261.6255653005986};
    }
    SECTION("white keys") {
        spec.layout = KeyLayout::white_keys;
        spec.root_key = 65;
    }
    SECTION("twelve by pitch") { spec.layout = KeyLayout::twelve_by_pitch; }
    SECTION("a pattern without degrees per repeat") {
        spec.layout = KeyLayout::pattern;
        spec.pattern = {{0, 1, silent_key, 2}, 0};
    }
    CHECK(read(written(spec)) == spec);
}

TEST_CASE("a reference may be a named pitch", "[key_map_file]") {
    const KeyMapSpec spec = read(R"({"format": "terzo-key-map", "version": 1, "root_key": 60,
        "reference": "A4=415", "layout": "every-key", "degree_order": "pitch"})");
    REQUIRE(spec.reference);
    CHECK(spec.reference->key == 69);
    CHECK(spec.reference->hz == 415.0);
}

TEST_CASE("bad key-map files are refused at the line and column of the fault", "[key_map_file]") {
    const std::string head = "{\"format\": \"terzo-key-map\", \"version\": 1,\n";
    CHECK_THROWS_WITH(read(head + " \"root_key\": 128, \"layout\": \"every-key\", \"degree_order\": \"pitch\"}"),
                      "map.json:2:14: error: \"root_key\" must be a whole number from 0 to 127, found 128");
    CHECK_THROWS_WITH(read(head + " \"root_key\": 60, \"layout\": \"pattern\",\n \"pattern\": [0, \"y\"],"
                                  " \"degree_order\": \"pitch\"}"),
                      "map.json:3:17: error: \"pattern[1]\" must be a degree number from 0 to 4095 "
                      "or \"x\" (silent), found \"y\"");
    CHECK_THROWS_WITH(read(head + " \"root_key\": 60, \"layout\": \"white-keys\",\n  \"keys_per_period\": 12,"
                                  " \"degree_order\": \"pitch\"}"),
                      "map.json:3:3: error: \"keys_per_period\" belongs to the every-key layout only; "
                      "this one is white-keys");
    CHECK_THROWS_WITH(read(head + " \"root_key\": 60, \"layout\": \"every-key\", \"degree_order\": \"pitch\","
                                  "\n\"colour\": 1}"),
                      "map.json:3:1: error: unknown key \"colour\"");
    CHECK_THROWS_WITH(read(head + " \"root_key\": 60, \"layout\": \"all\", \"degree_order\": \"pitch\"}"),
                      "map.json:2:28: error: \"all\" is not a layout; use every-key, white-keys, "
                      "twelve-by-pitch or pattern");
    CHECK_THROWS_WITH(read(head + " \"root_key\": 60, \"reference\": {\"key\": 69, \"hz\": -1},"
                                  " \"layout\": \"every-key\", \"degree_order\": \"pitch\"}"),
                      "map.json:2:49: error: \"reference.hz\" must be a frequency above 0 and at "
                      "most 20000 Hz, found -1");
    CHECK_THROWS_WITH(read(head + " \"root_key\": 60, \"layout\": \"every-key\"}"),
                      "map.json:1:1: error: missing key \"degree_order\"");
    CHECK_THROWS_WITH(read("{\"format\": \"terzo-key-map\", \"version\": 2}"),
                      "map.json:1:40: error: key-map version 2 is not supported; this terzo reads version 1");
    CHECK_THROWS_WITH(read("{\"format\": \"terzo-session\"}"),
                      "map.json:1:12: error: not a terzo key map: \"format\" must be "
                      "\"terzo-key-map\", found \"terzo-session\"");
    CHECK_THROWS_WITH(read("{\"format\": "),
                      "map.json:1:12: error: not valid JSON: syntax error while parsing value - "
                      "unexpected end of input; expected '[', '{', or a literal");
    CHECK_THROWS_WITH(read("[1, 2]"), "map.json:1:1: error: a key map must be a JSON object, found [1,2]");
}
