#include "core/report/svg.hpp"

#include <cmath>
#include <cstdio>

namespace terzo {

Paper paper_a4() {
    return {"A4", 210.0, 297.0};
}
Paper paper_letter() {
    return {"Letter", 215.9, 279.4};
}

Paper parse_paper(std::string_view text, const SourcePos& pos) {
    if (text == "a4" || text == "A4") return paper_a4();
    if (text == "letter" || text == "Letter") return paper_letter();
    fail(pos, "unknown paper size \"" + std::string(text) + "\"; use a4 or letter");
}

std::string xml_escape(std::string_view text) {
    std::string out;
    for (char c : text) {
        switch (c) {
        case '&':
            out += "&amp;";
            break;
        case '<':
            out += "&lt;";
            break;
        case '>':
            out += "&gt;";
            break;
        case '"':
            out += "&quot;";
            break;
        case '\'':
            out += "&apos;";
            break;
        default:
            out += c;
        }
    }
    return out;
}

std::string svg_number(double v) {
    TERZO_ASSERT(std::isfinite(v));
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.3f", v);
    std::string s = buf;
    while (!s.empty() && s.back() == '0')
        s.pop_back();
    if (!s.empty() && s.back() == '.') s.pop_back();
    if (s == "-0") s = "0";
    return s;
}

namespace {

std::string style_attributes(const SvgStyle& s) {
    std::string a = " fill=\"" + (s.fill.empty() ? std::string("none") : xml_escape(s.fill)) + "\"";
    if (!s.stroke.empty())
        a += " stroke=\"" + xml_escape(s.stroke) + "\" stroke-width=\"" +
             svg_number(s.stroke_width) + "\"";
    return a;
}

const double pi = 3.14159265358979323846;

} // namespace

Svg::Svg(double width, double height, std::string unit, std::string title)
    : width_(width), height_(height), unit_(std::move(unit)), title_(std::move(title)) {}

void Svg::rect(double x, double y, double w, double h, const SvgStyle& style) {
    body_ << "<rect x=\"" << svg_number(x) << "\" y=\"" << svg_number(y) << "\" width=\""
          << svg_number(w) << "\" height=\"" << svg_number(h) << "\"" << style_attributes(style)
          << "/>\n";
}

void Svg::line(double x1, double y1, double x2, double y2, const SvgStyle& style) {
    body_ << "<line x1=\"" << svg_number(x1) << "\" y1=\"" << svg_number(y1) << "\" x2=\""
          << svg_number(x2) << "\" y2=\"" << svg_number(y2) << "\"" << style_attributes(style)
          << "/>\n";
}

void Svg::circle(double cx, double cy, double r, const SvgStyle& style) {
    body_ << "<circle cx=\"" << svg_number(cx) << "\" cy=\"" << svg_number(cy) << "\" r=\""
          << svg_number(r) << "\"" << style_attributes(style) << "/>\n";
}

void Svg::arc(double cx, double cy, double r, double a1, double a2, const SvgStyle& style) {
    auto x = [&](double a) { return cx + r * std::sin(a * pi / 180); };
    auto y = [&](double a) { return cy - r * std::cos(a * pi / 180); };
    double sweep = std::fmod(a2 - a1 + 720.0, 360.0);
    body_ << "<path d=\"M " << svg_number(x(a1)) << ' ' << svg_number(y(a1)) << " A "
          << svg_number(r) << ' ' << svg_number(r) << " 0 " << (sweep > 180 ? 1 : 0) << " 1 "
          << svg_number(x(a2)) << ' ' << svg_number(y(a2)) << "\"" << style_attributes(style)
          << "/>\n";
}

void Svg::text(double x, double y, std::string_view content, const SvgFont& font) {
    static const char* anchors[] = {"start", "middle", "end"};
    body_ << "<text x=\"" << svg_number(x) << "\" y=\"" << svg_number(y) << "\" font-size=\""
          << svg_number(font.size) << "\" text-anchor=\"" << anchors[static_cast<int>(font.anchor)]
          << "\"";
    if (font.bold) body_ << " font-weight=\"bold\"";
    if (font.fill != "#000") body_ << " fill=\"" << xml_escape(font.fill) << "\"";
    body_ << '>' << xml_escape(content) << "</text>\n";
}

void Svg::begin_group(std::string_view title) {
    ++open_groups_;
    body_ << "<g>";
    if (!title.empty()) body_ << "<title>" << xml_escape(title) << "</title>";
    body_ << '\n';
}

void Svg::end_group() {
    TERZO_ASSERT(open_groups_ > 0);
    --open_groups_;
    body_ << "</g>\n";
}

std::string Svg::str() const {
    TERZO_ASSERT(open_groups_ == 0);
    std::ostringstream out;
    out << "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n"
        << "<svg xmlns=\"http://www.w3.org/2000/svg\" version=\"1.1\" width=\""
        << svg_number(width_) << unit_ << "\" height=\"" << svg_number(height_) << unit_
        << "\" viewBox=\"0 0 " << svg_number(width_) << ' ' << svg_number(height_)
        << "\" font-family=\"DejaVu Sans, Helvetica, Arial, sans-serif\">\n"
        << "<title>" << xml_escape(title_) << "</title>\n"
        << "<rect x=\"0\" y=\"0\" width=\"" << svg_number(width_) << "\" height=\""
        << svg_number(height_) << "\" fill=\"#fff\"/>\n"
        << body_.str() << "</svg>\n";
    return out.str();
}

} // namespace terzo
