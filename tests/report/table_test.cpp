#include <catch2/catch.hpp>

#include <sstream>

#include "core/report/table.hpp"

using terzo::Table;

namespace {
Table sample() {
    Table t;
    t.header = {"key", "cents"};
    t.align = {Table::Align::left, Table::Align::right};
    t.add({"C", "0.000"});
    t.add({"F\u266F", "590.224"});
    t.add({"a,\"b\"", "1"});
    return t;
}
} // namespace

TEST_CASE("a text table pads columns to the widest cell", "[table]") {
    std::ostringstream out;
    write_text(out, sample());
    CHECK(out.str() == "key      cents\n"
                       "--------------\n"
                       "C        0.000\n"
                       "F\u266F     590.224\n"
                       "a,\"b\"        1\n");
}

TEST_CASE("CSV quotes cells with commas and quotes as RFC 4180 says", "[table]") {
    // RFC 4180 section 2, rules 6 and 7: such fields are enclosed in double quotes and an
    // inner double quote is doubled; records end with CRLF.
    std::ostringstream out;
    write_csv(out, sample());
    CHECK(out.str() == "key,cents\r\nC,0.000\r\nF\u266F,590.224\r\n\"a,\"\"b\"\"\",1\r\n");
}

TEST_CASE("Markdown tables mark right-aligned columns and escape pipes", "[table]") {
    Table t;
    t.header = {"a|b", "n"};
    t.align = {Table::Align::left, Table::Align::right};
    t.add({"x", "1"});
    std::ostringstream out;
    write_markdown(out, t);
    CHECK(out.str() == "| a\\|b | n |\n|---|---:|\n| x | 1 |\n");
}
