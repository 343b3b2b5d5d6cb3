#include "core/text.hpp"

namespace terzo {

namespace {

// Length of the well-formed UTF-8 sequence at text[i], or 0 when the bytes there are not one.
// When 0, *bad is set to the length of the maximal subpart to replace (at least 1).
std::size_t sequence_length(std::string_view text, std::size_t i, std::size_t* bad) {
    auto byte = [&](std::size_t k) { return static_cast<unsigned char>(text[k]); };
    const unsigned char b = byte(i);
    *bad = 1;
    if (b < 0x80) return 1;
    std::size_t n;
    unsigned char lo = 0x80, hi = 0xBF; // allowed range of the second byte (Unicode table 3-7)
    if (b >= 0xC2 && b <= 0xDF) n = 2;
    else if (b == 0xE0) n = 3, lo = 0xA0;
    else if (b >= 0xE1 && b <= 0xEC) n = 3;
    else if (b == 0xED) n = 3, hi = 0x9F;
    else if (b >= 0xEE && b <= 0xEF) n = 3;
    else if (b == 0xF0) n = 4, lo = 0x90;
    else if (b >= 0xF1 && b <= 0xF3) n = 4;
    else if (b == 0xF4) n = 4, hi = 0x8F;
    else return 0;
    for (std::size_t k = 1; k < n; ++k) {
        if (i + k >= text.size()) return 0;
        const unsigned char c = byte(i + k);
        if (k == 1 ? (c < lo || c > hi) : (c < 0x80 || c > 0xBF)) return 0;
        *bad = k + 1;
    }
    return n;
}

// Code point of a well-formed sequence of length n at text[i].
unsigned code_point(std::string_view text, std::size_t i, std::size_t n) {
    auto byte = [&](std::size_t k) { return static_cast<unsigned>(static_cast<unsigned char>(text[i + k])); };
    if (n == 1) return byte(0);
    unsigned cp = byte(0) & (0x7F >> n);
    for (std::size_t k = 1; k < n; ++k) cp = (cp << 6) | (byte(k) & 0x3F);
    return cp;
}

bool is_control(unsigned cp) {
    return (cp < 0x20 && cp != '\t' && cp != '\n') || (cp >= 0x7F && cp <= 0x9F);
}

// A control character at i that is not the \r of a \r\n line end (CSV ends rows with \r\n,
// RFC 4180; a lone \r could move a terminal's cursor back over a line).
bool control_at(std::string_view text, std::size_t i, std::size_t n) {
    if (text[i] == '\r' && i + 1 < text.size() && text[i + 1] == '\n') return false;
    return is_control(code_point(text, i, n));
}

// Walks text, replacing invalid sequences and (when controls) control characters.
std::string clean(std::string_view text, bool controls) {
    std::string out;
    out.reserve(text.size());
    for (std::size_t i = 0; i < text.size();) {
        std::size_t bad = 1;
        const std::size_t n = sequence_length(text, i, &bad);
        if (n == 0 || (controls && control_at(text, i, n))) {
            out += replacement_character;
            i += n == 0 ? bad : n;
        } else {
            out.append(text, i, n);
            i += n;
        }
    }
    return out;
}

bool check(std::string_view text, bool controls) {
    for (std::size_t i = 0; i < text.size();) {
        std::size_t bad = 1;
        const std::size_t n = sequence_length(text, i, &bad);
        if (n == 0 || (controls && control_at(text, i, n))) return false;
        i += n;
    }
    return true;
}

} // namespace

bool is_valid_utf8(std::string_view text) { return check(text, false); }
std::string valid_utf8(std::string_view text) { return clean(text, false); }
bool is_printable(std::string_view text) { return check(text, true); }
std::string printable(std::string_view text) { return clean(text, true); }

} // namespace terzo
