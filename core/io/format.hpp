// Number formatting shared by every front end, so that the CLI, the GUI and the file
// writers print the same value the same way.
#pragma once

#include <string>

namespace terzo {

/// Fixed-point text with the given decimals: fixed(701.955, 3) == "701.955".
std::string fixed(double value, int decimals);
/// Fixed-point text with an explicit sign: signed_fixed(13.686, 3) == "+13.686"; zero is "0.000".
std::string signed_fixed(double value, int decimals);

} // namespace terzo
