// Turning a TUNING argument (a .scl path, later also an inline recipe) into a Scale.
#pragma once

#include <string>

#include "core/tuning/scale.hpp"

namespace terzo {

/// Reads the tuning named by a command-line or GUI argument; throws InputError.
Scale load_tuning(const std::string& argument);

} // namespace terzo
