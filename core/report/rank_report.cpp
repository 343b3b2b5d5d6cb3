#include "core/report/rank_report.hpp"

#include <sstream>

#include "core/format.hpp"
#include "core/report/table.hpp"
#include "core/text.hpp"

namespace terzo {

std::string ranking_text(const Ranking& r, RankMetric metric) {
    if (r.entries.empty()) return "";
    std::ostringstream out;
    Table t;
    t.header = {"rank", rank_metric_name(metric), "notes", "file", "description"};
    t.align = {Table::Align::right, Table::Align::right, Table::Align::right, Table::Align::left, Table::Align::left};
    for (std::size_t i = 0; i < r.entries.size(); ++i) {
        const auto& e = r.entries[i];
        // Cells are made printable before the table measures their widths.
        t.add({std::to_string(i + 1), metric == RankMetric::wolves ? std::to_string(static_cast<int>(e.value)) : fixed(e.value, 3),
               std::to_string(e.notes), printable(e.path), printable(e.description)});
    }
    write_text(out, t);
    return out.str();
}

nlohmann::ordered_json ranking_json(const Ranking& r, RankMetric metric) {
    nlohmann::ordered_json j;
    j["metric"] = rank_metric_name(metric);
    j["files"] = r.files;
    j["ranked"] = nlohmann::ordered_json::array();
    for (std::size_t i = 0; i < r.entries.size(); ++i)
        j["ranked"].push_back({{"rank", i + 1}, {"value", r.entries[i].value}, {"path", r.entries[i].path},
                               {"notes", r.entries[i].notes}, {"description", r.entries[i].description}});
    j["failed"] = nlohmann::ordered_json::array();
    for (const auto& f : r.failures) j["failed"].push_back({{"path", f.path}, {"error", f.message}});
    j["skipped"] = nlohmann::ordered_json::array();
    for (const auto& f : r.skipped) j["skipped"].push_back({{"path", f.path}, {"reason", f.message}});
    j["cancelled"] = r.cancelled;
    return j;
}

std::string ranking_messages(const Ranking& r, RankMetric metric, bool list_skipped, bool json, bool timed_out) {
    std::ostringstream out;
    if (!json) {
        for (const auto& f : r.failures) out << f.message << '\n';
        if (list_skipped)
            for (const auto& f : r.skipped) out << f.message << '\n';
        if (!r.skipped.empty())
            out << "terzo rank: " << r.skipped.size() << " tuning" << (r.skipped.size() == 1 ? "" : "s")
                << " skipped: " << rank_metric_name(metric) << " does not apply to " << (r.skipped.size() == 1 ? "it" : "them")
                << (metric == RankMetric::fit ? "" : " (key metrics need 12 notes; --by fit ranks any size)")
                << (list_skipped ? "" : "; --list-skipped names them") << "\n";
    }
    std::size_t odd = 0;
    const RankEntry* first = nullptr;
    for (const auto& e : r.entries)
        if (!is_printable(e.description)) {
            ++odd;
            if (!first) first = &e;
        }
    if (odd > 0)
        out << "terzo rank: note: " << odd << (odd == 1 ? " description holds" : " descriptions hold")
            << " bytes that are not UTF-8 or are control characters (the first in " << first->path
            << "); terminal output shows each as U+FFFD, JSON replaces the bytes that are not UTF-8\n";
    if (r.cancelled)
        out << "terzo rank: " << (timed_out ? "stopped at the time limit (--time-limit)" : "interrupted")
            << "; the ranking above covers the files read before stopping\n";
    if (!r.failures.empty())
        out << "terzo rank: " << r.failures.size() << " could not be ranked, " << r.entries.size() << " ranked\n";
    return out.str();
}

} // namespace terzo
