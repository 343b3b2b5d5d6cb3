// A small SVG 1.1 writer of our own: shapes and text in user units, escaped properly, and
// paper sizes for printable pages. Drawings (sheets, plots) are built on it elsewhere.
#pragma once

#include <sstream>
#include <string>
#include <string_view>

#include "core/error.hpp"

namespace terzo {

/// A printable page size in millimetres.
struct Paper {
    std::string name;
    double width_mm = 210, height_mm = 297;
};
/// ISO A4, 210 x 297 mm.
Paper paper_a4();
/// US Letter, 8.5 x 11 in = 215.9 x 279.4 mm.
Paper paper_letter();
/// "a4" or "letter"; throws InputError at pos otherwise.
Paper parse_paper(std::string_view text, const SourcePos& pos);

/// How a shape is painted; empty fill or stroke means none.
struct SvgStyle {
    std::string fill;
    std::string stroke;
    double stroke_width = 0;
};

/// How text is set.
struct SvgFont {
    double size = 3;
    enum class Anchor { start, middle, end } anchor = Anchor::start;
    bool bold = false;
    std::string fill = "#000";
};

/// An SVG document being drawn; str() closes it. Coordinates are user units, with the
/// canvas width x height; `unit` ("mm", or "" for plain pixels) sets the printed size.
class Svg {
  public:
    Svg(double width, double height, std::string unit, std::string title);

    void rect(double x, double y, double w, double h, const SvgStyle& style);
    void line(double x1, double y1, double x2, double y2, const SvgStyle& style);
    void circle(double cx, double cy, double r, const SvgStyle& style);
    /// A circular arc of radius r around (cx, cy) from angle a1 to a2 (degrees, clockwise
    /// from 12 o'clock), drawn clockwise.
    void arc(double cx, double cy, double r, double a1, double a2, const SvgStyle& style);
    void text(double x, double y, std::string_view content, const SvgFont& font);
    /// Opens a group with an optional tooltip title; close with end_group().
    void begin_group(std::string_view title = {});
    void end_group();

    /// The finished document.
    std::string str() const;

  private:
    std::ostringstream body_;
    double width_, height_;
    std::string unit_, title_;
    int open_groups_ = 0;
};

/// Escapes &, <, >, " and ' for XML text and attributes.
std::string xml_escape(std::string_view text);
/// A number for an attribute: at most 3 decimals, no trailing zeros ("12.5", "-0.333").
std::string svg_number(double v);

} // namespace terzo
