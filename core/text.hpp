// Text that leaves terzo: descriptions and file names are read as bytes (a .scl file may be
// in any encoding), and every writer of JSON or terminal text makes them valid UTF-8 here,
// each invalid sequence replaced by U+FFFD, so that one odd byte never stops a report and an
// escape sequence in a description never reaches a terminal raw. The .scl writer keeps the
// bytes as read.
#pragma once

#include <string>
#include <string_view>

#include <nlohmann/json.hpp>

namespace terzo {

/// The Unicode replacement character U+FFFD in UTF-8.
inline constexpr const char* replacement_character = "\xEF\xBF\xBD";

/// True when text is well-formed UTF-8 (no overlong forms, surrogates or values past U+10FFFF).
bool is_valid_utf8(std::string_view text);
/// text with each maximal invalid UTF-8 subpart replaced by U+FFFD (Unicode's recommended
/// practice, as in the W3C/WHATWG decoders); valid text is returned unchanged.
std::string valid_utf8(std::string_view text);
/// True when text is valid UTF-8 without control characters other than tab and newline.
bool is_printable(std::string_view text);
/// valid_utf8, then every control character (C0 except tab and newline, DEL, C1) replaced by
/// U+FFFD: text that is safe to show on a terminal.
std::string printable(std::string_view text);

/// A JSON document as terzo writes it (indent 2), strings' invalid UTF-8 replaced by U+FFFD;
/// never throws for a string's bytes.
template <class Json>
std::string json_text(const Json& j) {
    return j.dump(2, ' ', false, Json::error_handler_t::replace);
}

} // namespace terzo
