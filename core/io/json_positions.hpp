// Reading JSON files with compiler-style positions: a syntax error names its line and column,
// and so can a value that parses but breaks a rule of the file's format, because every
// value's and key's position is looked up by its path ("reference.hz", "pattern[3]").
#pragma once

#include <cstddef>
#include <istream>
#include <map>
#include <string>

#include <nlohmann/json.hpp>

#include "core/error.hpp"

namespace terzo {

/// The whole of a stream as text; more than max_bytes throws InputError naming source and
/// saying "the <what> is larger than N MiB".
std::string read_limited(std::istream& in, std::size_t max_bytes, const std::string& source,
                         const std::string& what);

/// Line and column (1-based) of a byte offset into text.
std::pair<int, int> line_column(const std::string& text, std::size_t byte);

/// Parses text as JSON; a syntax error or a number too large for a double throws InputError
/// naming source and, where known, the line and column.
nlohmann::json parse_json(const std::string& text, const std::string& source);

/// Where each value and each object key of a JSON text starts.
class JsonPositions {
  public:
    /// Records the positions of text, which must be valid JSON (parse it first).
    JsonPositions(const std::string& text, std::string source);
    /// The position of the value at path ("" is the whole document), or of the source alone.
    SourcePos value(const std::string& path) const;
    /// The position of the key that names path (an object member), else as value().
    SourcePos key(const std::string& path) const;

  private:
    std::string source_;
    std::map<std::string, std::pair<int, int>> values_, keys_;
};

} // namespace terzo
