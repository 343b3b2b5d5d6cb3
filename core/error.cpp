#include "core/error.hpp"

#include <cstdio>
#include <cstdlib>

namespace terzo {

std::string excerpt(std::string_view text) {
    constexpr std::size_t limit = 100;
    if (text.size() <= limit) return "\"" + std::string(text) + "\"";
    return "\"" + std::string(text.substr(0, limit)) + "...\"";
}

std::string format_error(const SourcePos& pos, const std::string& message) {
    std::string out = pos.source.empty() ? std::string("input") : pos.source;
    if (pos.line > 0) {
        out += ':' + std::to_string(pos.line);
        if (pos.column > 0) out += ':' + std::to_string(pos.column);
    }
    out += ": error: ";
    out += message;
    return out;
}

InputError::InputError(SourcePos pos, std::string message)
    : std::runtime_error(format_error(pos, message)), pos_(std::move(pos)),
      message_(std::move(message)) {}

void fail(const SourcePos& pos, const std::string& message) { throw InputError(pos, message); }

namespace detail {
void assert_failed(const char* cond, const char* file, int line) {
    std::fprintf(stderr, "%s:%d: assertion failed: %s\n", file, line, cond);
    std::abort();
}
} // namespace detail

} // namespace terzo
