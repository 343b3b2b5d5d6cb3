// Errors in user input (files, recipes, arguments), reported the way compilers do so that
// editors can jump to them: "name:line:column: error: message". Programmer errors use
// TERZO_ASSERT instead, which prints file:line and aborts.
#pragma once

#include <stdexcept>
#include <string>
#include <string_view>

namespace terzo {

/// Where a piece of input came from; line and column are 1-based, 0 means "not known".
struct SourcePos {
    std::string source; ///< file name, "recipe", or a command-line option such as "--ref-hz"
    int line = 0;
    int column = 0;
};

/// The one exception type for bad input; what() is the formatted message.
class InputError : public std::runtime_error {
public:
    InputError(SourcePos pos, std::string message);
    const SourcePos& pos() const { return pos_; }
    /// The message without the position prefix.
    const std::string& message() const { return message_; }

private:
    SourcePos pos_;
    std::string message_;
};

/// Throws InputError; the single place the message format is decided.
[[noreturn]] void fail(const SourcePos& pos, const std::string& message);

/// An excerpt of the input a message talks about, in double quotes, cut to its first 100 bytes
/// (then "...") so that a 10 MB line never becomes a 10 MB message.
std::string excerpt(std::string_view text);

/// Formats "source:line:column: error: message", leaving out unknown parts.
std::string format_error(const SourcePos& pos, const std::string& message);

} // namespace terzo

/// Checks an invariant; on failure prints file:line and the condition, then aborts.
#define TERZO_ASSERT(cond)                                                                     \
    ((cond) ? static_cast<void>(0) : ::terzo::detail::assert_failed(#cond, __FILE__, __LINE__))

namespace terzo::detail {
[[noreturn]] void assert_failed(const char* cond, const char* file, int line);
}
