// The tuner's sheet as a report: terminal/CSV/Markdown tables, JSON with the keys documented
// in the README, and a printable SVG page (tables plus a circle of fifths showing how each
// fifth is tempered). Every form carries the same advice: the instrument's maker decides.
#pragma once

#include <nlohmann/json.hpp>
#include <string>

#include "core/analysis/sheet.hpp"
#include "core/report/svg.hpp"
#include "core/report/table.hpp"

namespace terzo {

/// The sentence printed on every sheet.
extern const char* const tuning_advice;

/// A beat rate for a table cell: "0.59 narrow", "6.93 wide", "pure".
std::string beat_cell(const Beat& b, int decimals = 2);

/// One row per note: note, degree, Hz, cents from 12-TET, then the beat rate of each checked
/// interval rising from the note (empty where it leaves the range).
Table sheet_notes_table(const Sheet& s);
/// One row per checked interval: interval, low, high, their Hz, cents from pure, beats, tempering.
Table sheet_intervals_table(const Sheet& s);
/// One row per tuning step: step, note to tune, from, by, Hz, beats, tempering.
Table sheet_order_table(const Sheet& s);
/// The twelve fifths: fifth, cents from 3/2, beats at octave 4, tempering.
Table sheet_circle_table(const Sheet& s);

/// The whole sheet as JSON (keys documented in the README).
nlohmann::ordered_json sheet_json(const Sheet& s);

/// A printable page. Throws InputError at "--svg" when the range does not fit on one page.
std::string sheet_svg(const Sheet& s, const Paper& paper);

/// Draws the circle of fifths around (cx, cy): note names outside, each fifth as an arc
/// coloured by tempering (narrow blue, wide red, pure grey) and thicker the further it is
/// from pure, with its cents from 3/2 inside.
void draw_fifth_circle(Svg& svg, const std::vector<CircleFifth>& circle, double cx, double cy,
                       double r, Spelling spelling, double font_size);

} // namespace terzo
