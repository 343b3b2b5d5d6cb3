#include "core/io/json_positions.hpp"

#include <iterator>
#include <vector>

namespace terzo {

namespace {

using Json = nlohmann::json;

// An input iterator over the text that publishes how many bytes the parser has taken, so
// that a SAX handler can tell where each token ended.
struct CountingIterator {
    using iterator_category = std::input_iterator_tag;
    using value_type = char;
    using difference_type = std::ptrdiff_t;
    using pointer = const char*;
    using reference = const char&;
    const char* p = nullptr;
    const char* base = nullptr;
    std::size_t* taken = nullptr;
    reference operator*() const { return *p; }
    CountingIterator& operator++() {
        ++p;
        *taken = static_cast<std::size_t>(p - base);
        return *this;
    }
    CountingIterator operator++(int) {
        CountingIterator old = *this;
        ++*this;
        return old;
    }
    friend bool operator==(const CountingIterator& a, const CountingIterator& b) { return a.p == b.p; }
    friend bool operator!=(const CountingIterator& a, const CountingIterator& b) { return a.p != b.p; }
};

// Records the start of every value and key. The parser reports a token after reading it (a
// number one character past it), never after reading the next one, so a token starts at the
// first byte after the previous report that is not white space, ':' or ','.
class Recorder : public nlohmann::json_sax<Json> {
  public:
    Recorder(const std::string& text, const std::size_t& taken,
             std::map<std::string, std::pair<int, int>>& values,
             std::map<std::string, std::pair<int, int>>& keys)
        : text_(text), taken_(taken), values_(values), keys_(keys) {}

    bool null() override { return value(); }
    bool boolean(bool) override { return value(); }
    bool number_integer(number_integer_t) override { return value(); }
    bool number_unsigned(number_unsigned_t) override { return value(); }
    bool number_float(number_float_t, const string_t&) override { return value(); }
    bool string(string_t&) override { return value(); }
    bool binary(binary_t&) override { return value(); }
    bool start_object(std::size_t) override {
        value();
        frames_.push_back({false, 0, current_});
        return true;
    }
    bool key(string_t& k) override {
        Frame& f = frames_.back();
        f.member = f.path.empty() ? k : f.path + "." + k;
        keys_[f.member] = start();
        return true;
    }
    bool end_object() override { return end(); }
    bool start_array(std::size_t) override {
        value();
        frames_.push_back({true, 0, current_});
        return true;
    }
    bool end_array() override { return end(); }
    bool parse_error(std::size_t, const std::string&, const nlohmann::detail::exception&) override {
        return false;
    }

  private:
    struct Frame {
        bool array;
        std::size_t index;
        std::string path, member;
    };
    std::pair<int, int> start() {
        std::size_t i = last_;
        while (i < text_.size() && (text_[i] == ' ' || text_[i] == '\t' || text_[i] == '\n' ||
                                    text_[i] == '\r' || text_[i] == ':' || text_[i] == ','))
            ++i;
        last_ = taken_;
        return line_column(text_, i);
    }
    bool value() {
        if (frames_.empty())
            current_.clear();
        else if (frames_.back().array)
            current_ = frames_.back().path + "[" + std::to_string(frames_.back().index++) + "]";
        else
            current_ = frames_.back().member;
        values_[current_] = start();
        return true;
    }
    bool end() {
        frames_.pop_back();
        last_ = taken_;
        return true;
    }

    const std::string& text_;
    const std::size_t& taken_;
    std::map<std::string, std::pair<int, int>>& values_;
    std::map<std::string, std::pair<int, int>>& keys_;
    std::vector<Frame> frames_;
    std::string current_;
    std::size_t last_ = 0;
};

} // namespace

std::string read_limited(std::istream& in, std::size_t max_bytes, const std::string& source,
                         const std::string& what) {
    std::string text;
    char buf[65536];
    while (in.read(buf, sizeof buf) || in.gcount() > 0) {
        text.append(buf, static_cast<std::size_t>(in.gcount()));
        if (text.size() > max_bytes)
            fail({source, 0, 0}, "the " + what + " is larger than " +
                                     std::to_string(max_bytes >> 20) + " MiB");
    }
    return text;
}

std::pair<int, int> line_column(const std::string& text, std::size_t byte) {
    int line = 1, column = 1;
    for (std::size_t i = 0; i < byte && i < text.size(); ++i) {
        if (text[i] == '\n') {
            ++line;
            column = 1;
        } else {
            ++column;
        }
    }
    return {line, column};
}

Json parse_json(const std::string& text, const std::string& source) {
    try {
        return Json::parse(text);
    } catch (const Json::parse_error& e) {
        auto [line, column] = line_column(text, e.byte == 0 ? 0 : e.byte - 1);
        std::string what = e.what();
        // nlohmann's text is "[json.exception.parse_error.101] parse error at line 1, column
        // 2: syntax error while parsing value - invalid literal; last read: 'x'"; keep the part
        // after the position, which says what was wrong.
        auto colon = what.find(": ", what.find("column"));
        std::string detail = colon == std::string::npos ? what : what.substr(colon + 2);
        fail({source, line, column}, "not valid JSON: " + detail);
    } catch (const Json::out_of_range& e) {
        // A number too large for a double ("1e999"): nlohmann reports it as out_of_range, with
        // no position.
        std::string what = e.what();
        auto quote = what.find("parsing '");
        std::string number =
            quote == std::string::npos ? "" : what.substr(quote + 9, what.size() - quote - 10);
        fail({source, 0, 0}, "not valid JSON: the number " + excerpt(number) + " is too large");
    }
}

JsonPositions::JsonPositions(const std::string& text, std::string source)
    : source_(std::move(source)) {
    std::size_t taken = 0;
    CountingIterator first{text.data(), text.data(), &taken};
    CountingIterator last{text.data() + text.size(), text.data(), &taken};
    Recorder r(text, taken, values_, keys_);
    Json::sax_parse(first, last, &r);
}

SourcePos JsonPositions::value(const std::string& path) const {
    auto it = values_.find(path);
    if (it == values_.end()) return {source_, 0, 0};
    return {source_, it->second.first, it->second.second};
}

SourcePos JsonPositions::key(const std::string& path) const {
    auto it = keys_.find(path);
    if (it == keys_.end()) return value(path);
    return {source_, it->second.first, it->second.second};
}

} // namespace terzo
