// Number formatting shared by every front end, so that the CLI, the GUI and the file
// writers print the same value the same way.
#pragma once

#include <string>
#include <vector>

namespace terzo {

/// Fixed-point text with the given decimals: fixed(701.955, 3) == "701.955".
std::string fixed(double value, int decimals);
/// Fixed-point text with an explicit sign: signed_fixed(13.686, 3) == "+13.686"; zero is "0.000".
std::string signed_fixed(double value, int decimals);
/// A number as the user would type it, up to 10 significant digits, for messages about a
/// value given on the command line: number_text(0) == "0", number_text(-5) == "-5",
/// number_text(261.6255653) == "261.6255653", number_text(1e12) == "1e+12"; "nan", "inf".
std::string number_text(double value);
/// Sorted whole numbers as runs: runs_text({0, 1, 2, 3, 125, 127}) == "0-3, 125, 127".
std::string runs_text(const std::vector<int>& sorted);

} // namespace terzo
