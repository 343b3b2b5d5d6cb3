#include "core/report/json_stream.hpp"

#include "core/text.hpp"

#include <cmath>
#include <cstring>

#include <fmt/compile.h>
#include <fmt/format.h>

#include "core/error.hpp"

namespace terzo {

namespace {

// Bytes gathered before each write to the stream: large enough that the stream's own cost
// per call vanishes, small enough that memory stays flat. `slack` is the most one piece of
// output (a number, an escaped character, an indent step) may need at once.
constexpr std::size_t flush_bytes = 1 << 16;
constexpr std::size_t slack = 256;

bool plain(char ch) {
    const auto c = static_cast<unsigned char>(ch);
    return c >= 0x20 && c != '"' && c != '\\';
}

} // namespace

JsonStream::JsonStream(std::ostream& out, bool pretty)
    : out_(out), pretty_(pretty), buf_(new char[flush_bytes + slack]), pos_(buf_.get()),
      end_(buf_.get() + flush_bytes + slack) {}

JsonStream::~JsonStream() { flush(); }

void JsonStream::flush() {
    out_.write(buf_.get(), std::streamsize(pos_ - buf_.get()));
    pos_ = buf_.get();
}

char* JsonStream::room(std::size_t n) {
    TERZO_ASSERT(n <= slack);
    if (std::size_t(end_ - pos_) < n) flush();
    return pos_;
}

void JsonStream::put(std::string_view s) {
    while (!s.empty()) {
        if (pos_ == end_) flush();
        const std::size_t n = std::min(s.size(), std::size_t(end_ - pos_));
        std::memcpy(pos_, s.data(), n);
        pos_ += n;
        s.remove_prefix(n);
    }
}

void JsonStream::newline_indent() {
    put("\n");
    for (std::size_t i = 0; i < has_items_.size(); ++i) put("  ");
}

void JsonStream::before_value() {
    if (after_key_) {
        after_key_ = false;
        return;
    }
    if (!has_items_.empty()) {
        if (has_items_.back()) put(",");
        has_items_.back() = true;
        if (pretty_) newline_indent();
    }
    if (std::size_t(pos_ - buf_.get()) >= flush_bytes) flush();
}

void JsonStream::open(char c) {
    before_value();
    put(std::string_view(&c, 1));
    has_items_.push_back(false);
}

void JsonStream::close(char c) {
    TERZO_ASSERT(!has_items_.empty() && !after_key_);
    const bool items = has_items_.back();
    has_items_.pop_back();
    if (pretty_ && items) newline_indent();
    put(std::string_view(&c, 1));
    if (has_items_.empty()) { // the document is complete
        put("\n");
        flush();
    }
}

void JsonStream::begin_object() { open('{'); }
void JsonStream::end_object() { close('}'); }
void JsonStream::begin_array() { open('['); }
void JsonStream::end_array() { close(']'); }

void JsonStream::key(std::string_view name) {
    TERZO_ASSERT(!after_key_);
    before_value();
    put("\"");
    put(name); // keys are our own names: nothing to escape
    put(pretty_ ? "\": " : "\":");
    after_key_ = true;
}

void JsonStream::value(std::string_view text) {
    // Descriptions and file names are bytes (core/text.hpp): invalid UTF-8 becomes U+FFFD.
    if (!is_valid_utf8(text)) {
        const std::string fixed = valid_utf8(text);
        value(std::string_view(fixed));
        return;
    }
    before_value();
    put("\"");
    // Most text (every key, names, ratios) needs no escape: copied in runs.
    while (!text.empty()) {
        std::size_t i = 0;
        while (i < text.size() && plain(text[i])) ++i;
        put(text.substr(0, i));
        if (i == text.size()) break;
        const auto c = static_cast<unsigned char>(text[i]);
        switch (c) {
        case '"': put("\\\""); break;
        case '\\': put("\\\\"); break;
        case '\b': put("\\b"); break;
        case '\f': put("\\f"); break;
        case '\n': put("\\n"); break;
        case '\r': put("\\r"); break;
        case '\t': put("\\t"); break;
        default: pos_ = fmt::format_to(room(8), FMT_COMPILE("\\u{:04x}"), unsigned(c)); break;
        }
        text.remove_prefix(i + 1);
    }
    put("\"");
}

void JsonStream::value(double number) {
    before_value();
    if (!std::isfinite(number)) {
        put("null");
        return;
    }
    char* start = room(40);
    pos_ = fmt::format_to(start, FMT_COMPILE("{}"), number);
    // Whole numbers keep a decimal point, so a reader sees a floating-point value.
    if (std::string_view(start, std::size_t(pos_ - start)).find_first_of(".e") == std::string_view::npos) put(".0");
}

void JsonStream::value(std::int64_t number) {
    before_value();
    pos_ = fmt::format_to(room(24), FMT_COMPILE("{}"), number);
}

void JsonStream::value(std::size_t number) {
    before_value();
    pos_ = fmt::format_to(room(24), FMT_COMPILE("{}"), number);
}

void JsonStream::value(bool b) {
    before_value();
    put(b ? "true" : "false");
}

void JsonStream::null() {
    before_value();
    put("null");
}

} // namespace terzo
