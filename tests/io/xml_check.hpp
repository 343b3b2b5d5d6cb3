// Checks that a document is well-formed XML with an independent parser: Python's
// xml.etree.ElementTree (the python3 standard library), run on a temporary file.
#pragma once

#include <cstdio>
#include <filesystem>
#include <fstream>
#include <string>
#include <unistd.h>

namespace terzo::test {

/// Parses `xml` with xml.etree; returns the root tag and the number of elements
/// ("{http://www.w3.org/2000/svg}svg 42"), or the parser's error text.
inline std::string parse_with_python(const std::string& xml) {
    static int counter = 0;
    auto path =
        std::filesystem::temp_directory_path() / ("terzo_xml_check_" + std::to_string(::getpid()) +
                                                  "_" + std::to_string(++counter) + ".svg");
    { std::ofstream(path) << xml; }
    std::string cmd =
        "python3 -c \"import sys, xml.etree.ElementTree as E\n"
        "try:\n r = E.parse(sys.argv[1]).getroot(); print(r.tag, len(list(r.iter())))\n"
        "except Exception as e: print('error:', e)\" '" +
        path.string() + "' 2>&1";
    std::string out;
    if (FILE* p = popen(cmd.c_str(), "r")) {
        char buf[512];
        while (std::fgets(buf, sizeof buf, p))
            out += buf;
        pclose(p);
    }
    std::filesystem::remove(path);
    while (!out.empty() && out.back() == '\n')
        out.pop_back();
    return out;
}

/// How often `needle` occurs in `hay`.
inline int occurrences(const std::string& hay, const std::string& needle) {
    int n = 0;
    for (auto pos = hay.find(needle); pos != std::string::npos; pos = hay.find(needle, pos + 1))
        ++n;
    return n;
}

} // namespace terzo::test
