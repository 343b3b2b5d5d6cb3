#include "cli/commands.hpp"

namespace terzo::cli {
void add_compare(CLI::App&) {}
} // namespace terzo::cli
