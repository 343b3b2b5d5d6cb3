#include "core/analysis/rank.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <filesystem>
#include <optional>

#include "core/analysis/combination.hpp"
#include "core/analysis/compare.hpp"
#include "core/analysis/cost.hpp"
#include "core/analysis/fit.hpp"
#include "core/analysis/keyboard.hpp"
#include "core/analysis/parallel.hpp"
#include "core/tuning/scl.hpp"

namespace terzo {

namespace {

constexpr RankMetric all_metrics[] = {
    RankMetric::mean_fifth,       RankMetric::worst_fifth,       RankMetric::mean_major_third,
    RankMetric::worst_major_third, RankMetric::mean_minor_third, RankMetric::worst_minor_third,
    RankMetric::wolves,           RankMetric::fit,
};

bool has_scl_extension(const std::filesystem::path& p) {
    std::string e = p.extension().string();
    std::transform(e.begin(), e.end(), e.begin(), [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
    return e == ".scl";
}

} // namespace

std::string rank_metric_name(RankMetric m) {
    switch (m) {
    case RankMetric::mean_fifth:
        return "mean-fifth";
    case RankMetric::worst_fifth:
        return "worst-fifth";
    case RankMetric::mean_major_third:
        return "mean-major-third";
    case RankMetric::worst_major_third:
        return "worst-major-third";
    case RankMetric::mean_minor_third:
        return "mean-minor-third";
    case RankMetric::worst_minor_third:
        return "worst-minor-third";
    case RankMetric::wolves:
        return "wolves";
    case RankMetric::fit:
        break;
    }
    return "fit";
}

std::string rank_metric_names() {
    std::string s;
    for (RankMetric m : all_metrics) s += (s.empty() ? "" : ", ") + rank_metric_name(m);
    return s;
}

RankMetric parse_rank_metric(std::string_view text, const std::string& source) {
    for (RankMetric m : all_metrics)
        if (text == rank_metric_name(m)) return m;
    fail({source, 0, 0}, "unknown metric " + excerpt(text) + "; use one of " + rank_metric_names());
}

std::vector<std::string> collect_tunings(const std::vector<std::string>& arguments, std::vector<RankFailure>& failures) {
    namespace fs = std::filesystem;
    std::vector<std::string> files;
    auto add = [&](std::string path) {
        if (files.size() >= max_rank_files)
            fail({"FILES", 0, 0}, "more than 1000000 files to rank; name fewer folders");
        files.push_back(std::move(path));
    };
    for (const std::string& arg : arguments) {
        std::error_code ec;
        fs::file_status st = fs::status(arg, ec);
        if (ec || !fs::exists(st)) {
            failures.push_back({arg, arg + ": error: no such file or folder"});
            continue;
        }
        if (!fs::is_directory(st)) {
            add(arg);
            continue;
        }
        std::vector<std::string> found;
        fs::recursive_directory_iterator it(arg, fs::directory_options::skip_permission_denied, ec), end;
        for (; !ec && it != end; it.increment(ec)) {
            std::error_code e2;
            if (it->is_regular_file(e2) && has_scl_extension(it->path())) {
                found.push_back(it->path().string());
                if (files.size() + found.size() > max_rank_files)
                    fail({"FILES", 0, 0}, "more than 1000000 files to rank; name fewer folders");
            }
        }
        if (ec) failures.push_back({arg, arg + ": error: cannot read the folder: " + ec.message()});
        else if (found.empty()) failures.push_back({arg, arg + ": error: no .scl files in this folder or below it"});
        std::sort(found.begin(), found.end());
        for (auto& f : found) add(std::move(f));
    }
    return files;
}

double measure_tuning(const Scale& scale, RankMetric metric, const std::string& name) {
    if (metric == RankMetric::fit) {
        // The fit as `terzo resultants` prints it: every dyad of one period from the default
        // reference, default tone options.
        try {
            Keyboard kb(scale, default_ref_hz, 1, name);
            return keyboard_fit(kb, ToneOptions{}).rms_cents;
        } catch (const InputError& e) {
            if (e.pos().source == name) throw;
            // A limit of the resultants engine, whose message names options rank does not have.
            std::string m = e.message();
            m = m.substr(0, m.find("; lower"));
            fail({name, 0, 0}, "the fit is not computed: " + m);
        }
    }
    if (scale.size() == 12 && scale.period() == Pitch::from_ratio(Ratio(2))) {
        // The same figures as the key comparison's summary (cost_test.cpp checks that they
        // agree), from the twelve positions in doubles: ranking needs no exact purity test.
        static const CostModel model = [] {
            Cost c;
            c.deviations = {{KeyInterval::fifth, Statistic::mean, 1}};
            return CostModel(c);
        }();
        KeyDeviations d = key_deviations(positions_of(scale));
        switch (metric) {
        case RankMetric::mean_fifth:
            return model.statistic(KeyInterval::fifth, Statistic::mean, d.fifth);
        case RankMetric::worst_fifth:
            return model.statistic(KeyInterval::fifth, Statistic::worst, d.fifth);
        case RankMetric::mean_major_third:
            return model.statistic(KeyInterval::major_third, Statistic::mean, d.major_third);
        case RankMetric::worst_major_third:
            return model.statistic(KeyInterval::major_third, Statistic::worst, d.major_third);
        case RankMetric::mean_minor_third:
            return model.statistic(KeyInterval::minor_third, Statistic::mean, d.minor_third);
        case RankMetric::worst_minor_third:
            return model.statistic(KeyInterval::minor_third, Statistic::worst, d.minor_third);
        case RankMetric::wolves:
        case RankMetric::fit:
            break;
        }
        int wolves = 0; // compare.hpp's rule: beyond wolf_fifth_cents / wolf_third_cents
        for (int pc = 0; pc < 12; ++pc) {
            auto i = static_cast<std::size_t>(pc);
            wolves += std::fabs(d.fifth[i]) > wolf_fifth_cents;
            wolves += std::fabs(d.major_third[i]) > wolf_third_cents;
            wolves += std::fabs(d.minor_third[i]) > wolf_third_cents;
        }
        return wolves;
    }
    CompareSummary s = compare_keys(scale, CompareOptions{}, name).summary;
    switch (metric) {
    case RankMetric::mean_fifth:
        return s.mean_fifth;
    case RankMetric::worst_fifth:
        return s.worst_fifth;
    case RankMetric::mean_major_third:
        return s.mean_major_third;
    case RankMetric::worst_major_third:
        return s.worst_major_third;
    case RankMetric::mean_minor_third:
        return s.mean_minor_third;
    case RankMetric::worst_minor_third:
        return s.worst_minor_third;
    case RankMetric::wolves:
    case RankMetric::fit:
        break;
    }
    return static_cast<double>(s.wolves.size());
}

Ranking rank_tunings(const std::vector<std::string>& arguments, RankMetric metric, const SearchControl& control) {
    if (control.threads < 1 || control.threads > max_search_threads)
        fail({"--threads", 0, 0}, "thread count " + std::to_string(control.threads) + " is outside 1..64");
    Ranking r;
    std::vector<RankFailure> early;
    std::vector<std::string> files = collect_tunings(arguments, early);
    r.files = files.size();
    std::vector<std::optional<RankEntry>> entries(files.size());
    std::vector<std::optional<RankFailure>> failures(files.size()), skipped(files.size());
    std::atomic<std::uint64_t> done{0};
    detail::run_parallel(control.threads, files.size(), control, done, files.size(), [&](int, std::size_t i) {
        std::optional<Scale> s;
        try {
            s = read_scl_file(files[i]);
        } catch (const InputError& e) {
            failures[i] = RankFailure{files[i], e.what()};
        } catch (const std::exception& e) {
            failures[i] = RankFailure{files[i], files[i] + ": error: " + e.what()};
        }
        if (s) {
            try {
                entries[i] = RankEntry{files[i], s->description(), s->size(), measure_tuning(*s, metric, files[i])};
            } catch (const InputError& e) {
                skipped[i] = RankFailure{files[i], e.what()};
            }
        }
        done.fetch_add(1, std::memory_order_relaxed);
    });
    r.failures = std::move(early);
    std::size_t visited = 0;
    for (std::size_t i = 0; i < files.size(); ++i) {
        if (entries[i]) r.entries.push_back(std::move(*entries[i]));
        if (failures[i]) r.failures.push_back(std::move(*failures[i]));
        if (skipped[i]) r.skipped.push_back(std::move(*skipped[i]));
        visited += entries[i] || failures[i] || skipped[i];
    }
    r.cancelled = visited < files.size();
    std::stable_sort(r.entries.begin(), r.entries.end(), [](const RankEntry& a, const RankEntry& b) {
        if (a.value != b.value) return a.value < b.value;
        return a.path < b.path;
    });
    return r;
}

} // namespace terzo
