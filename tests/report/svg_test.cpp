#include <catch2/catch.hpp>

#include "core/report/svg.hpp"
#include "xml_check.hpp"

using namespace terzo;

TEST_CASE("svg text and attributes are escaped", "[svg]") {
    CHECK(xml_escape("a < b & \"c\" > 'd'") == "a &lt; b &amp; &quot;c&quot; &gt; &apos;d&apos;");
    CHECK(xml_escape("F#4 \u266F") == "F#4 \u266F");
}

TEST_CASE("svg numbers have at most three decimals and no trailing zeros", "[svg]") {
    CHECK(svg_number(12.5) == "12.5");
    CHECK(svg_number(3.0) == "3");
    CHECK(svg_number(-1.0 / 3) == "-0.333");
    CHECK(svg_number(-0.0001) == "0");
    CHECK(svg_number(210) == "210");
}

TEST_CASE("paper sizes are A4 and US Letter", "[svg]") {
    // ISO 216 A4 is 210 x 297 mm; US Letter is 8.5 x 11 in (25.4 mm per inch) [CP].
    CHECK(paper_a4().width_mm == 210.0);
    CHECK(paper_a4().height_mm == 297.0);
    CHECK(paper_letter().width_mm == Approx(8.5 * 25.4));
    CHECK(paper_letter().height_mm == Approx(11 * 25.4));
    CHECK(parse_paper("letter", {"--paper", 0, 0}).name == "Letter");
    CHECK(parse_paper("a4", {"--paper", 0, 0}).name == "A4");
    REQUIRE_THROWS_WITH(parse_paper("a3", {"--paper", 0, 0}),
                        "--paper: error: unknown paper size \"a3\"; use a4 or letter");
}

TEST_CASE("a drawing is well-formed XML with every shape in place", "[svg]") {
    Svg svg(210, 297, "mm", "A <test> & \"page\"");
    svg.begin_group("tooltip & more");
    svg.rect(10, 10, 50, 20, {"#eee", "#000", 0.25});
    svg.line(0, 0, 210, 297, {"", "#123", 0.5});
    svg.circle(100, 100, 20, {"", "#ddd", 0.2});
    svg.arc(100, 100, 20, 0, 30, {"", "#b8322a", 1});
    svg.arc(100, 100, 20, 0, 270, {"", "#1f5fa8", 1});
    svg.text(20, 20, "Bb3 < C4 & \"D4\"", {3, SvgFont::Anchor::middle, true, "#444"});
    svg.end_group();
    std::string doc = svg.str();
    CHECK(
        doc.rfind(
            "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n<svg xmlns=\"http://www.w3.org/2000/svg\"",
            0) == 0);
    CHECK(doc.find("width=\"210mm\" height=\"297mm\" viewBox=\"0 0 210 297\"") !=
          std::string::npos);
    CHECK(doc.find("<title>A &lt;test&gt; &amp; &quot;page&quot;</title>") != std::string::npos);
    CHECK(doc.find("M 100 80 A 20 20 0 0 1 110 82.679") !=
          std::string::npos);                        // 30 degrees clockwise
    CHECK(doc.find(" 0 1 1 ") != std::string::npos); // the 270-degree arc is large
    CHECK(doc.find("font-weight=\"bold\"") != std::string::npos);
    // An independent parser: Python's xml.etree counts svg, title, background, g, title,
    // rect, line, circle, 2 paths and text.
    CHECK(test::parse_with_python(doc) == "{http://www.w3.org/2000/svg}svg 11");
}
