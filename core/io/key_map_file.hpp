// The key-map file: a KeyMapSpec as a small JSON document of our own, so a layout chosen once
// can be used again by export, render and the window, with any tuning of a size it accepts.
//
//   {
//     "format": "terzo-key-map",
//     "version": 1,
//     "root_key": 60,                      // 0..127, plays degree 0
//     "reference": {"key": 69, "hz": 440}, // or "A4=415", or null for the default reference
//     "layout": "pattern",                 // every-key, white-keys, twelve-by-pitch, pattern
//     "pattern": [0, "x", 1, 2, "x", 3],   // pattern only: degree numbers and "x" (silent)
//     "degrees_per_repeat": 4,             // pattern only, optional (default: the scale size)
//     "keys_per_period": 12,               // every-key only, optional (default: the scale size)
//     "degree_order": "pitch"              // "pitch" sorts the degrees first, "file" keeps them
//   }
//
// Reading is strict: unknown or misplaced keys, wrong types and values out of range are each
// one InputError naming the file, line and column. See docs/key-maps.md.
#pragma once

#include <filesystem>
#include <istream>
#include <ostream>
#include <string>

#include <nlohmann/json.hpp>

#include "core/io/json_positions.hpp"
#include "core/tuning/key_map.hpp"

namespace terzo {

/// Largest key-map file read (a pattern of 128 keys is far smaller).
inline constexpr std::size_t max_key_map_bytes = 1u << 20;

/// Writes spec as a key-map file (format "terzo-key-map", version 1).
void write_key_map(std::ostream& out, const KeyMapSpec& spec);
/// Reads a key-map file; source names it in messages. Throws InputError.
KeyMapSpec read_key_map(std::istream& in, const std::string& source);
/// Reads a key-map file from disk; throws InputError naming the path.
KeyMapSpec load_key_map_file(const std::filesystem::path& path);
/// The spec as JSON (also what a session stores).
nlohmann::ordered_json key_map_json(const KeyMapSpec& spec);
/// Reads the spec from a parsed JSON value found at path ("" for a whole file, "key_map" in a
/// session); positions, when given, put line and column into messages. Throws InputError.
KeyMapSpec key_map_from_json(const nlohmann::json& j, const std::string& source,
                             const std::string& path = "", const JsonPositions* positions = nullptr);

} // namespace terzo
