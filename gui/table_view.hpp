// Drawing a core Table (the same tables the CLI prints) as an ImGui table.
#pragma once

#include "core/report/table.hpp"

namespace terzo::gui {

/// Draws t with its header; height 0 sizes to the rows, otherwise scrolls within height.
void draw_table(const char* id, const Table& t, float height = 0.0f);

} // namespace terzo::gui
