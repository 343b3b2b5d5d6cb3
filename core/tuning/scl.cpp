#include "core/tuning/scl.hpp"

#include <charconv>
#include <cmath>
#include <fstream>
#include <optional>
#include <string_view>
#include <system_error>
#include <vector>

namespace terzo {

namespace {

struct Line {
    int number;
    std::string text;
};

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

Scale read_scl(std::istream& in, const std::string& source) {
    std::vector<Line> lines; // the non-comment lines
    std::string text;
    int number = 0;
    while (std::getline(in, text)) {
        ++number;
        if (number == 1 && text.rfind("\xEF\xBB\xBF", 0) == 0) text.erase(0, 3); // UTF-8 BOM
        if (!text.empty() && text.back() == '\r') text.pop_back();
        if (text.find('\0') != std::string::npos)
            fail({source, number, 0}, "contains a NUL byte; a .scl file is plain text");
        if (!text.empty() && text[0] == '!') continue;
        lines.push_back({number, std::move(text)});
    }
    if (number == 0) fail({source, 0, 0}, "empty file; expected a description line");
    if (lines.empty()) fail({source, number, 0}, "only comments; expected a description line");

    std::string description(trim(lines[0].text));
    if (lines.size() < 2)
        fail({source, number, 0}, "missing the note count after the description on line " +
                                      std::to_string(lines[0].number));

    const Line& count_line = lines[1];
    auto [count_token, count_column] = first_token(count_line.text);
    SourcePos count_pos{source, count_line.number, count_column};
    if (count_token.empty()) fail(count_pos, "expected the note count, found an empty line");
    std::size_t count = 0;
    for (char c : count_token) {
        if (c < '0' || c > '9')
            fail(count_pos, "expected the note count (a whole number), found " +
                                excerpt(count_token));
        count = count * 10 + std::size_t(c - '0');
        if (count > max_scale_size)
            fail(count_pos, "note count " + std::string(count_token.substr(0, 40)) + " is larger than " +
                                std::to_string(max_scale_size) + ", the largest scale terzo accepts");
    }
    if (count == 0) fail(count_pos, "note count is 0; a scale needs at least its period");

    std::vector<Pitch> pitches;
    pitches.reserve(count);
    std::size_t i = 2;
    for (; i < lines.size() && pitches.size() < count; ++i) {
        auto [token, column] = first_token(lines[i].text);
        SourcePos pos{source, lines[i].number, column};
        if (token.empty())
            fail(pos, "expected pitch " + std::to_string(pitches.size() + 1) + " of " +
                          std::to_string(count) + ", found an empty line");
        pitches.push_back(parse_pitch(token, pos));
    }
    if (pitches.size() < count)
        fail({source, number, 0}, "the count on line " + std::to_string(count_line.number) +
                                      " says " + std::to_string(count) + " pitches, but the file has " +
                                      std::to_string(pitches.size()));
    for (; i < lines.size(); ++i) {
        if (!trim(lines[i].text).empty())
            fail({source, lines[i].number, first_token(lines[i].text).second},
                 "more pitches than the count of " + std::to_string(count) + " on line " +
                     std::to_string(count_line.number));
    }

    Pitch period = pitches.back();
    pitches.pop_back();
    if (period.cents() <= 0.0)
        fail({source, lines[i - 1].number, 0},
             "the period (the last pitch, " + period.str() + ") must be larger than 1/1");
    return Scale(std::move(description), std::move(pitches), std::move(period));
}

Scale read_scl_file(const std::filesystem::path& path) {
    std::error_code ec;
    if (std::filesystem::is_directory(path, ec))
        fail({path.string(), 0, 0}, "is a folder, not a .scl file");
    std::ifstream in(path, std::ios::binary);
    if (!in) fail({path.string(), 0, 0}, "cannot open the file for reading");
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

void write_scl(std::ostream& out, const Scale& scale, const std::string& file_name) {
    out << "! " << file_name << "\n!\n";
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
