#include "core/report/json_stream.hpp"

#include <cmath>
#include <iterator>

#include <fmt/format.h>

#include "core/error.hpp"

namespace terzo {

namespace {

// Bytes gathered before each write to the stream: large enough that the stream's own cost
// per call vanishes, small enough that memory stays flat.
constexpr std::size_t flush_bytes = 1 << 16;

} // namespace

JsonStream::JsonStream(std::ostream& out, bool pretty) : out_(out), pretty_(pretty) {
    buf_.reserve(flush_bytes + 4096);
}

JsonStream::~JsonStream() { flush(); }

void JsonStream::flush() {
    out_.write(buf_.data(), std::streamsize(buf_.size()));
    buf_.clear();
}

void JsonStream::newline_indent() {
    buf_ += '\n';
    buf_.append(2 * has_items_.size(), ' ');
}

void JsonStream::before_value() {
    if (after_key_) {
        after_key_ = false;
        return;
    }
    if (!has_items_.empty()) {
        if (has_items_.back()) buf_ += ',';
        has_items_.back() = true;
        if (pretty_) newline_indent();
    }
    if (buf_.size() >= flush_bytes) flush();
}

void JsonStream::open(char c) {
    before_value();
    buf_ += c;
    has_items_.push_back(false);
}

void JsonStream::close(char c) {
    TERZO_ASSERT(!has_items_.empty() && !after_key_);
    const bool items = has_items_.back();
    has_items_.pop_back();
    if (pretty_ && items) newline_indent();
    buf_ += c;
    if (has_items_.empty()) { // the document is complete
        buf_ += '\n';
        flush();
    }
}

void JsonStream::begin_object() { open('{'); }
void JsonStream::end_object() { close('}'); }
void JsonStream::begin_array() { open('['); }
void JsonStream::end_array() { close(']'); }

void JsonStream::key(std::string_view name) {
    TERZO_ASSERT(!after_key_);
    value(name);
    buf_ += pretty_ ? ": " : ":";
    after_key_ = true;
}

void JsonStream::value(std::string_view text) {
    before_value();
    buf_ += '"';
    // Most text (every key, names, ratios) needs no escape: copy it whole.
    auto plain = [](char ch) {
        const auto c = static_cast<unsigned char>(ch);
        return c >= 0x20 && c != '"' && c != '\\';
    };
    std::size_t i = 0;
    while (i < text.size() && plain(text[i])) ++i;
    buf_.append(text.data(), i);
    for (; i < text.size(); ++i) {
        const char ch = text[i];
        const auto c = static_cast<unsigned char>(ch);
        switch (c) {
        case '"': buf_ += "\\\""; break;
        case '\\': buf_ += "\\\\"; break;
        case '\b': buf_ += "\\b"; break;
        case '\f': buf_ += "\\f"; break;
        case '\n': buf_ += "\\n"; break;
        case '\r': buf_ += "\\r"; break;
        case '\t': buf_ += "\\t"; break;
        default:
            if (c < 0x20)
                fmt::format_to(std::back_inserter(buf_), "\\u{:04x}", unsigned(c));
            else
                buf_ += ch;
        }
    }
    buf_ += '"';
}

void JsonStream::value(double number) {
    before_value();
    if (!std::isfinite(number)) {
        buf_ += "null";
        return;
    }
    char text[32];
    const std::size_t n = std::size_t(fmt::format_to_n(text, sizeof text, "{}", number).size);
    buf_.append(text, n);
    // Whole numbers keep a decimal point, so a reader sees a floating-point value.
    if (std::string_view(text, n).find_first_of(".en") == std::string_view::npos) buf_ += ".0";
}

void JsonStream::value(std::int64_t number) {
    before_value();
    const fmt::format_int text(number);
    buf_.append(text.data(), text.size());
}

void JsonStream::value(std::size_t number) {
    before_value();
    const fmt::format_int text(number);
    buf_.append(text.data(), text.size());
}

void JsonStream::value(bool b) {
    before_value();
    buf_ += b ? "true" : "false";
}

void JsonStream::null() {
    before_value();
    buf_ += "null";
}

} // namespace terzo
