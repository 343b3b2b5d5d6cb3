// A streaming JSON writer: values go out as they are given, through a small buffer, with no
// document tree in memory. Compact by default; pretty prints two spaces per level, the layout
// of nlohmann::json's dump(2). Numbers are the shortest text that reads back to the same
// double ({fmt}), with ".0" on whole numbers so they stay floating point.
#pragma once

#include <cstdint>
#include <memory>
#include <ostream>
#include <string>
#include <string_view>
#include <vector>

namespace terzo {

class JsonStream {
public:
    /// Writes to `out`; `pretty` indents two spaces per level.
    JsonStream(std::ostream& out, bool pretty);
    /// Flushes what is buffered (the document should be complete by then).
    ~JsonStream();
    JsonStream(const JsonStream&) = delete;
    JsonStream& operator=(const JsonStream&) = delete;

    void begin_object();
    void end_object();
    void begin_array();
    void end_array();
    /// The key of the next value in the current object (a name of ours: written unescaped).
    void key(std::string_view name);

    void value(std::string_view text); ///< a string, escaped
    void value(const char* text) { value(std::string_view(text)); }
    void value(double number);         ///< null when not finite (as JSON has no such number)
    void value(std::int64_t number);
    void value(int number) { value(std::int64_t(number)); }
    void value(std::size_t number);
    void value(bool b);
    void null();

    /// Writes the buffered bytes to the stream.
    void flush();

private:
    void before_value();
    void open(char c);
    void close(char c);
    void newline_indent();
    /// At least n free bytes at pos_ (flushing first if needed); n <= slack.
    char* room(std::size_t n);
    void put(std::string_view s);

    std::ostream& out_;
    bool pretty_;
    bool after_key_ = false;
    std::vector<char> has_items_; // per open container: has it an item yet
    std::unique_ptr<char[]> buf_;
    char* pos_;
    char* end_;
};

} // namespace terzo
