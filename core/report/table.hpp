// A plain table of text cells and the three ways terzo prints one: aligned terminal text,
// CSV (RFC 4180 quoting) and Markdown. Every tabular report builds a Table and picks a writer.
#pragma once

#include <ostream>
#include <string>
#include <vector>

namespace terzo {

struct Table {
    enum class Align { left, right };
    std::vector<std::string> header;
    std::vector<Align> align; ///< per column; missing entries mean left
    std::vector<std::vector<std::string>> rows;

    /// Appends a row; it must have as many cells as the header.
    void add(std::vector<std::string> row);
};

/// Columns padded to their widest cell, two spaces apart, a rule under the header.
void write_text(std::ostream& out, const Table& t);
/// Comma-separated, quoting cells that hold a comma, quote or line break.
void write_csv(std::ostream& out, const Table& t);
/// A GitHub-style pipe table with alignment markers.
void write_markdown(std::ostream& out, const Table& t);

} // namespace terzo
