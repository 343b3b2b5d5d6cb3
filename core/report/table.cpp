#include "core/report/table.hpp"

#include <algorithm>

#include "core/error.hpp"

namespace terzo {

namespace {

// Display width counting UTF-8 code points, so that "♯" or "¢" pad like one character.
std::size_t width(const std::string& s) {
    return static_cast<std::size_t>(
        std::count_if(s.begin(), s.end(), [](char c) { return (static_cast<unsigned char>(c) & 0xC0) != 0x80; }));
}

Table::Align align_of(const Table& t, std::size_t i) {
    return i < t.align.size() ? t.align[i] : Table::Align::left;
}

std::string csv_cell(const std::string& s) {
    if (s.find_first_of(",\"\r\n") == std::string::npos) return s;
    std::string q = "\"";
    for (char c : s) {
        if (c == '"') q += '"';
        q += c;
    }
    return q + '"';
}

} // namespace

void Table::add(std::vector<std::string> row) {
    TERZO_ASSERT(row.size() == header.size());
    rows.push_back(std::move(row));
}

void write_text(std::ostream& out, const Table& t) {
    std::vector<std::size_t> w(t.header.size(), 0);
    for (std::size_t i = 0; i < t.header.size(); ++i) w[i] = width(t.header[i]);
    for (const auto& r : t.rows)
        for (std::size_t i = 0; i < r.size(); ++i) w[i] = std::max(w[i], width(r[i]));
    auto line = [&](const std::vector<std::string>& cells) {
        std::string s;
        for (std::size_t i = 0; i < cells.size(); ++i) {
            std::string pad(w[i] - width(cells[i]), ' ');
            if (i) s += "  ";
            s += align_of(t, i) == Table::Align::right ? pad + cells[i] : cells[i] + pad;
        }
        while (!s.empty() && s.back() == ' ') s.pop_back();
        out << s << '\n';
    };
    line(t.header);
    std::size_t total = 0;
    for (std::size_t i = 0; i < w.size(); ++i) total += w[i] + (i ? 2 : 0);
    out << std::string(total, '-') << '\n';
    for (const auto& r : t.rows) line(r);
}

void write_csv(std::ostream& out, const Table& t) {
    auto line = [&](const std::vector<std::string>& cells) {
        for (std::size_t i = 0; i < cells.size(); ++i) out << (i ? "," : "") << csv_cell(cells[i]);
        out << "\r\n";
    };
    line(t.header);
    for (const auto& r : t.rows) line(r);
}

void write_markdown(std::ostream& out, const Table& t) {
    auto cell = [](const std::string& s) {
        std::string e;
        for (char c : s) {
            if (c == '|') e += '\\';
            e += c;
        }
        return e;
    };
    out << '|';
    for (const auto& h : t.header) out << ' ' << cell(h) << " |";
    out << "\n|";
    for (std::size_t i = 0; i < t.header.size(); ++i)
        out << (align_of(t, i) == Table::Align::right ? "---:|" : "---|");
    out << '\n';
    for (const auto& r : t.rows) {
        out << '|';
        for (const auto& c : r) out << ' ' << cell(c) << " |";
        out << '\n';
    }
}

} // namespace terzo
