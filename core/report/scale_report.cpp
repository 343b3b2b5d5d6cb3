#include "core/report/scale_report.hpp"

#include "core/format.hpp"

namespace terzo {

nlohmann::ordered_json pitch_json(const Pitch& p) {
    nlohmann::ordered_json j;
    j["cents"] = p.cents();
    j["ratio"] = p.is_rational() ? nlohmann::ordered_json(p.ratio()->str()) : nlohmann::ordered_json(nullptr);
    j["exact"] = p.is_exact();
    j["value"] = p.str();
    return j;
}

nlohmann::ordered_json scale_json(const Scale& scale) {
    nlohmann::ordered_json degrees = nlohmann::ordered_json::array();
    for (std::size_t i = 0; i < scale.size(); ++i) {
        nlohmann::ordered_json d = {{"index", i}};
        d.update(pitch_json(scale.degree(i)));
        degrees.push_back(std::move(d));
    }
    return {{"description", scale.description()},
            {"size", scale.size()},
            {"period", pitch_json(scale.period())},
            {"degrees", std::move(degrees)}};
}

Table degree_table(const Scale& scale) {
    Table t;
    t.header = {"degree", "exact value", "cents", "step"};
    t.align = {Table::Align::right, Table::Align::left, Table::Align::right, Table::Align::right};
    auto row = [&](std::string index, const Pitch& p, const Pitch* previous) {
        t.add({std::move(index), p.is_exact() ? p.str() : "~ (cents only)", fixed(p.cents(), 3),
               previous ? signed_fixed(p.cents() - previous->cents(), 3) : ""});
    };
    for (std::size_t i = 0; i < scale.size(); ++i)
        row(std::to_string(i), scale.degree(i), i ? &scale.degree(i - 1) : nullptr);
    row("period", scale.period(), &scale.degree(scale.size() - 1));
    return t;
}

} // namespace terzo
