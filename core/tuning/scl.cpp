#include "core/tuning/scl.hpp"

#include <charconv>
#include <cmath>
#include <fstream>
#include <optional>
#include <string_view>
#include <system_error>
#include <vector>

#include "core/input_file.hpp"

namespace terzo {

namespace {

bool is_space(char c) { return c == ' ' || c == '\t' || c == '\v' || c == '\f'; }

std::string_view trim(std::string_view s) {
    while (!s.empty() && (is_space(s.front()) || s.front() == '\r')) s.remove_prefix(1);
    while (!s.empty() && (is_space(s.back()) || s.back() == '\r')) s.remove_suffix(1);
    return s;
}

// The first whitespace-delimited token and its 1-based column.
std::pair<std::string_view, int> first_token(std::string_view line) {
    std::size_t start = 0;
    while (start < line.size() && is_space(line[start])) ++start;
    std::size_t end = start;
    while (end < line.size() && !is_space(line[end]) && line[end] != '\r') ++end;
    return {line.substr(start, end - start), static_cast<int>(start) + 1};
}

// Cents: optional sign, digits, one '.', digits; at least one digit; no exponent.
std::optional<double> parse_cents(std::string_view t) {
    std::size_t i = (!t.empty() && (t[0] == '-' || t[0] == '+')) ? 1 : 0;
    std::size_t digits = 0, dots = 0;
    for (std::size_t j = i; j < t.size(); ++j) {
        if (t[j] >= '0' && t[j] <= '9') ++digits;
        else if (t[j] == '.') ++dots;
        else return std::nullopt;
    }
    if (digits == 0 || dots != 1) return std::nullopt;
    std::string_view body = t.substr(t[0] == '+' ? 1 : 0);
    double v = 0;
    auto [ptr, ec] = std::from_chars(body.data(), body.data() + body.size(), v);
    if (ec == std::errc::result_out_of_range) return HUGE_VAL;
    if (ec != std::errc() || ptr != body.data() + body.size()) return std::nullopt;
    return v;
}

Pitch parse_pitch(std::string_view token, const SourcePos& pos) {
    const std::string q = excerpt(token);
    if (token.find('.') != std::string_view::npos) {
        auto c = parse_cents(token);
        if (!c) fail(pos, "expected cents such as 701.955, found " + q);
        if (!std::isfinite(*c) || std::fabs(*c) > 1e7)
            fail(pos, "cents value " + q + " is out of range (at most 10000000 in size)");
        return Pitch::from_cents(*c);
    }
    Ratio r = parse_ratio(token, pos);
    if (r.sign() == 0) fail(pos, "ratio is zero in " + q + "; a pitch ratio must be positive");
    if (r.sign() < 0) fail(pos, "ratio is negative in " + q + "; a pitch ratio must be positive");
    return Pitch::from_ratio(r);
}

} // namespace

namespace {

// Reads lines one at a time with the bytes counted, so that memory stays at one line
// however large the input, and a NUL byte is reported where it is met.
class LineReader {
public:
    LineReader(std::istream& in, const std::string& source) : in_(in), source_(source) {}
    bool next(std::string& line) {
        line.clear();
        std::streambuf* buf = in_.rdbuf();
        if (!buf) return false;
        bool any = false;
        for (int c; (c = buf->sbumpc()) != std::char_traits<char>::eof();) {
            any = true;
            if (++bytes_ > max_scl_bytes)
                fail({source_, number_ + 1, 0}, "the file is larger than " + size_text(max_scl_bytes) +
                                                    ", the most terzo reads as a .scl file");
            if (c == '\n') break;
            if (c == '\0')
                fail({source_, number_ + 1, static_cast<int>(line.size()) + 1},
                     "contains a NUL byte; a .scl file is plain text");
            line.push_back(static_cast<char>(c));
        }
        if (any) ++number_;
        return any;
    }
    int number() const { return number_; }

private:
    std::istream& in_;
    const std::string& source_;
    std::uintmax_t bytes_ = 0;
    int number_ = 0;
};

} // namespace

Scale read_scl(std::istream& in, const std::string& source) {
    LineReader reader(in, source);
    std::string text;
    std::optional<std::string> description;
    int description_line = 0, count_line = 0, period_line = 0;
    std::optional<std::size_t> count;
    std::vector<Pitch> pitches;
    while (reader.next(text)) {
        const int number = reader.number();
        if (number == 1 && text.rfind("\xEF\xBB\xBF", 0) == 0) text.erase(0, 3); // UTF-8 BOM
        if (!text.empty() && text.back() == '\r') text.pop_back();
        if (!text.empty() && text[0] == '!') continue;
        if (!description) {
            description = std::string(trim(text));
            description_line = number;
            continue;
        }
        if (!count) {
            auto [count_token, count_column] = first_token(text);
            SourcePos count_pos{source, number, count_column};
            if (count_token.empty()) fail(count_pos, "expected the note count, found an empty line");
            std::size_t n = 0;
            for (char c : count_token) {
                if (c < '0' || c > '9')
                    fail(count_pos, "expected the note count (a whole number), found " + excerpt(count_token));
                n = n * 10 + std::size_t(c - '0');
                if (n > max_scale_size)
                    fail(count_pos, "note count " + std::string(count_token.substr(0, 40)) + " is larger than " +
                                        std::to_string(max_scale_size) + ", the largest scale terzo accepts");
            }
            if (n == 0) fail(count_pos, "note count is 0; a scale needs at least its period");
            count = n;
            count_line = number;
            pitches.reserve(n);
            continue;
        }
        if (pitches.size() < *count) {
            auto [token, column] = first_token(text);
            SourcePos pos{source, number, column};
            if (token.empty())
                fail(pos, "expected pitch " + std::to_string(pitches.size() + 1) + " of " + std::to_string(*count) +
                              ", found an empty line");
            // Text after the pitch is a comment, but "3 / 2" is a ratio written with spaces,
            // and reading it as 3 would be silently wrong.
            std::string_view rest(text);
            rest.remove_prefix(static_cast<std::size_t>(column - 1) + token.size());
            std::string_view next = first_token(rest).first;
            if (!next.empty() && next[0] == '/' && token.find_first_of("./") == std::string_view::npos)
                fail(pos, "a ratio with spaces around its '/' in " + excerpt(trim(text)) +
                              "; write it without spaces, such as 3/2");
            pitches.push_back(parse_pitch(token, pos));
            period_line = number;
            continue;
        }
        if (!trim(text).empty())
            fail({source, number, first_token(text).second},
                 "more pitches than the count of " + std::to_string(*count) + " on line " + std::to_string(count_line));
    }
    const int number = reader.number();
    if (number == 0) fail({source, 0, 0}, "empty file; expected a description line");
    if (!description) fail({source, number, 0}, "only comments; expected a description line");
    if (!count)
        fail({source, number, 0}, "missing the note count after the description on line " +
                                      std::to_string(description_line));
    if (pitches.size() < *count)
        fail({source, number, 0}, "the count on line " + std::to_string(count_line) + " says " +
                                      std::to_string(*count) + " pitches, but the file has " +
                                      std::to_string(pitches.size()));

    Pitch period = pitches.back();
    pitches.pop_back();
    if (period.cents() <= 0.0)
        fail({source, period_line, 0}, "the period (the last pitch, " + period.str() + ") must be larger than 1/1");
    return Scale(std::move(*description), std::move(pitches), std::move(period));
}

std::vector<int> scl_pitch_lines(std::istream& in) {
    std::vector<int> out;
    std::string text;
    int number = 0, seen = 0; // seen: non-comment lines so far
    while (std::getline(in, text)) {
        ++number;
        if (number == 1 && text.rfind("\xEF\xBB\xBF", 0) == 0) text.erase(0, 3);
        if (!text.empty() && text[0] == '!') continue;
        if (++seen > 2 && !trim(text).empty()) out.push_back(number);
    }
    return out;
}

Scale read_scl_file(const std::filesystem::path& path) {
    std::ifstream in = open_input_file(path, max_scl_bytes, "a .scl file");
    return read_scl(in, path.string());
}

std::string scl_cents_text(double cents) {
    // The shortest fixed-point text that reads back as the same double can be long: about 330
    // characters for the smallest doubles (-3e-77 cents is "-0.000…0003"), 309 digits for the
    // largest.
    char buf[512];
    auto [ptr, ec] = std::to_chars(buf, buf + sizeof buf, cents, std::chars_format::fixed);
    TERZO_ASSERT(ec == std::errc());
    std::string s(buf, ptr);
    auto dot = s.find('.');
    if (dot == std::string::npos) {
        s += '.';
        dot = s.size() - 1;
    }
    while (s.size() - dot - 1 < 6) s += '0';
    return s;
}

void write_scl(std::ostream& out, const Scale& scale, const std::string& file_name,
               const std::vector<std::string>& comments) {
    out << "! " << file_name << "\n";
    for (std::string line : comments) {
        for (char& c : line)
            if (c == '\n' || c == '\r') c = ' ';
        out << "! " << line << "\n";
    }
    out << "!\n";
    // A description starting with '!' would read back as a comment; the reader trims the space.
    const std::string& d = scale.description();
    out << (d.empty() || d[0] != '!' ? "" : " ") << d << "\n";
    out << " " << scale.size() << "\n!\n";
    auto write_pitch = [&](const Pitch& p) {
        if (p.is_rational()) {
            out << " " << p.ratio()->str() << "\n";
        } else if (p.kind() == Pitch::Kind::tempered) {
            out << " " << scl_cents_text(p.cents()) << " " << p.str() << "\n";
        } else {
            out << " " << scl_cents_text(p.cents()) << "\n";
        }
    };
    for (std::size_t i = 1; i < scale.size(); ++i) write_pitch(scale.degree(i));
    write_pitch(scale.period());
}

} // namespace terzo
