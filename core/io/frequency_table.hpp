// The frequency of every MIDI key of a key map as a table (CSV) or JSON: key, keyboard note
// name where the tuning has 12 degrees, degree and period, Hz, cents from 12-TET at the same
// reference, the exact interval from the root key when there is one, and the MTS bytes.
#pragma once

#include <nlohmann/json.hpp>

#include "core/report/table.hpp"
#include "core/tuning/key_map.hpp"

namespace terzo {

/// One row per key 0..127: key, note, degree, period, hz (6 decimals), cents_from_12tet
/// (6 decimals), ratio (exact text or empty), mts (frequency data, empty when out of range).
Table frequency_table(const KeyMap& map);
/// {"description", "size", "root_key", "reference": {"key", "note", "hz"}, "keys": [{"key",
/// "note" (null), "degree", "period", "hz", "cents_from_12tet", "ratio" (null), "exact",
/// "mts" (null)}, ...]} with numbers at full double precision.
nlohmann::ordered_json frequency_table_json(const KeyMap& map);

} // namespace terzo
