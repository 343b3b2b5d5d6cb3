#include "core/io/frequency_table.hpp"

#include "core/format.hpp"
#include "core/io/mts.hpp"

namespace terzo {

namespace {

std::string mts_text(const MappedKey& k) {
    auto f = encode_frequency(k.midi_note);
    return f ? hex_text({f->semitone, f->msb, f->lsb}) : "";
}

} // namespace

Table frequency_table(const KeyMap& map) {
    Table t;
    t.header = {"key", "note", "degree", "period", "hz", "cents_from_12tet", "ratio", "mts"};
    using A = Table::Align;
    t.align = {A::right, A::left, A::right, A::right, A::right, A::right, A::left, A::left};
    for (int key = lowest_key; key <= highest_key; ++key) {
        const MappedKey k = map.at(key);
        t.add({std::to_string(key), key_note_name(map, key), std::to_string(k.degree),
               std::to_string(k.period_count), fixed(k.hz, 6), signed_fixed(k.cents_from_equal, 6),
               k.from_root.is_exact() ? k.from_root.str() : "", mts_text(k)});
    }
    return t;
}

nlohmann::ordered_json frequency_table_json(const KeyMap& map) {
    using json = nlohmann::ordered_json;
    json keys = json::array();
    for (int key = lowest_key; key <= highest_key; ++key) {
        const MappedKey k = map.at(key);
        const std::string name = key_note_name(map, key), mts = mts_text(k);
        keys.push_back({{"key", key},
                        {"note", name.empty() ? json(nullptr) : json(name)},
                        {"degree", k.degree},
                        {"period", k.period_count},
                        {"hz", k.hz},
                        {"cents_from_12tet", k.cents_from_equal},
                        {"ratio", k.from_root.is_exact() ? json(k.from_root.str()) : json(nullptr)},
                        {"exact", k.from_root.is_exact()},
                        {"mts", mts.empty() ? json(nullptr) : json(mts)}});
    }
    const KeyReference& ref = map.reference();
    return {{"description", map.scale().description()},
            {"size", map.scale().size()},
            {"root_key", map.root_key()},
            {"reference",
             {{"key", ref.key}, {"note", note_text(note_of_key(ref.key))}, {"hz", ref.hz}}},
            {"keys", std::move(keys)}};
}

} // namespace terzo
