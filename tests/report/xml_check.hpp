// Checks that a document is well-formed XML with an independent parser: Python's
// xml.etree.ElementTree (the python3 standard library), run on a temporary file.
#pragma once

#include <fstream>
#include <string>

#include "tests/support/run.hpp"

namespace terzo::test {

/// Parses `xml` with xml.etree; returns the root tag and the number of elements
/// ("{http://www.w3.org/2000/svg}svg 42"), or the parser's error text.
inline std::string parse_with_python(const std::string& xml) {
    ScratchFolder dir("xml-check");
    const auto path = dir.path / "document.svg";
    { std::ofstream(path) << xml; }
    return output_of("python3 -c \"import sys, xml.etree.ElementTree as E\n"
                     "try:\n r = E.parse(sys.argv[1]).getroot(); print(r.tag, len(list(r.iter())))\n"
                     "except Exception as e: print('error:', e)\" '" +
                     path.string() + "'");
}

/// How often `needle` occurs in `hay`.
inline int occurrences(const std::string& hay, const std::string& needle) {
    int n = 0;
    for (auto pos = hay.find(needle); pos != std::string::npos; pos = hay.find(needle, pos + 1))
        ++n;
    return n;
}

} // namespace terzo::test
