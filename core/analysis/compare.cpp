#include "core/analysis/compare.hpp"

#include <algorithm>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <fstream>
#include <numeric>

#include "core/analysis/chord.hpp"
#include "core/input_file.hpp"
#include "core/analysis/fit.hpp"

namespace terzo {

std::string key_name(const Key& k, Spelling spelling) {
    return pitch_class_name(k.root, spelling) + (k.minor ? " minor" : " major");
}

KeyWeights parse_key_weights(std::istream& in, const std::string& source) {
    KeyWeights w;
    std::array<int, 24> seen_on{};
    std::string line;
    int line_no = 0;
    bool any_positive = false;
    while (std::getline(in, line)) {
        ++line_no;
        if (line_no > 10000) fail({source, line_no, 1}, "a weights file has at most 10000 lines");
        if (!line.empty() && line.back() == '\r') line.pop_back();
        // Split into fields, remembering each field's column.
        std::vector<std::pair<std::string_view, int>> fields;
        std::string_view rest(line);
        for (std::size_t i = 0; i < rest.size();) {
            if (rest[i] == ' ' || rest[i] == '\t') {
                ++i;
                continue;
            }
            if (rest[i] == '#')
                break; // a field that starts with '#' opens a comment ("F#" does not)
            std::size_t j = i;
            while (j < rest.size() && rest[j] != ' ' && rest[j] != '\t')
                ++j;
            fields.push_back({rest.substr(i, j - i), static_cast<int>(i) + 1});
            i = j;
        }
        if (fields.empty()) continue;
        SourcePos pos{source, line_no, fields[0].second};
        if (fields.size() != 3)
            fail(pos, "expected \"<note> major|minor <weight>\" such as \"Bb major 2\", found " +
                          std::to_string(fields.size()) + " field" +
                          (fields.size() == 1 ? "" : "s"));
        Key key;
        key.root = parse_pitch_class(fields[0].first, pos);
        SourcePos mode_pos{source, line_no, fields[1].second};
        if (fields[1].first == "minor")
            key.minor = true;
        else if (fields[1].first != "major")
            fail(mode_pos, "expected major or minor, found " + excerpt(fields[1].first));
        SourcePos weight_pos{source, line_no, fields[2].second};
        std::string_view text = fields[2].first;
        double value = 0;
        auto [ptr, ec] = std::from_chars(text.data(), text.data() + text.size(), value);
        if (ec != std::errc() || ptr != text.data() + text.size() || !std::isfinite(value) ||
            text.front() == '-' || text.front() == '+')
            fail(weight_pos,
                 "expected a weight (a non-negative decimal number), found " + excerpt(text));
        if (value > max_key_weight)
            fail(weight_pos, "weight " + std::string(text) + " is larger than the limit 1000000");
        if (seen_on[static_cast<std::size_t>(key.index())] != 0)
            fail(pos, key_name(key) + " is already given on line " +
                          std::to_string(seen_on[static_cast<std::size_t>(key.index())]));
        seen_on[static_cast<std::size_t>(key.index())] = line_no;
        w.weight[static_cast<std::size_t>(key.index())] = value;
        any_positive = any_positive || value > 0;
    }
    if (!any_positive) fail({source, 0, 0}, "no key has a positive weight");
    return w;
}

KeyWeights read_key_weights(const std::filesystem::path& path) {
    std::ifstream in = open_input_file(path, max_key_weights_bytes, "a weights file");
    return parse_key_weights(in, path.string());
}

CompareSummary summarize(const std::vector<KeyReport>& keys,
                         const std::optional<KeyWeights>& weights) {
    CompareSummary s;
    s.weighted = weights.has_value();
    double total = 0, fit_total = 0, fit_sum = 0;
    for (const KeyReport& k : keys) {
        double w = weights ? weights->weight[static_cast<std::size_t>(k.key.index())] : 1.0;
        if (w <= 0) continue;
        total += w;
        double f = std::fabs(k.fifth_beat.cents), M = std::fabs(k.major_third.cents),
               m = std::fabs(k.minor_third.cents);
        s.mean_fifth += w * f;
        s.mean_major_third += w * M;
        s.mean_minor_third += w * m;
        s.worst_fifth = std::max(s.worst_fifth, f);
        s.worst_major_third = std::max(s.worst_major_third, M);
        s.worst_minor_third = std::max(s.worst_minor_third, m);
        if (k.fit) {
            fit_total += w;
            fit_sum += w * *k.fit;
        }
    }
    if (total > 0) {
        s.mean_fifth /= total;
        s.mean_major_third /= total;
        s.mean_minor_third /= total;
    }
    if (fit_total > 0) s.mean_fit = fit_sum / fit_total;
    // Distinct intervals: the fifth and major third of each major key, the minor third of each
    // minor key (together every fifth, major and minor third on each of the 12 notes once).
    std::vector<Wolf> fifths, major_thirds, minor_thirds;
    auto consider = [](const char* name, int from, const Beat& b, double threshold, int& pure,
                       std::vector<Wolf>& wolves) {
        if (b.tempering == Tempering::pure) ++pure;
        if (std::fabs(b.cents) > threshold) wolves.push_back({name, from, b.cents});
    };
    for (const KeyReport& k : keys) {
        if (!k.key.minor) {
            consider("fifth", k.key.root, k.fifth_beat, wolf_fifth_cents, s.pure_fifths, fifths);
            consider("major third", k.key.root, k.major_third, wolf_third_cents,
                     s.pure_major_thirds, major_thirds);
        } else {
            consider("minor third", k.key.root, k.minor_third, wolf_third_cents,
                     s.pure_minor_thirds, minor_thirds);
        }
    }
    s.wolves = fifths;
    s.wolves.insert(s.wolves.end(), major_thirds.begin(), major_thirds.end());
    s.wolves.insert(s.wolves.end(), minor_thirds.begin(), minor_thirds.end());
    return s;
}

KeyComparison compare_keys(const Scale& scale, const CompareOptions& options,
                           const std::string& name) {
    NoteMap map(scale, options.tonic, options.reference, name);
    if (options.octave < 0 || options.octave > 8)
        fail({"--octave", 0, 0}, "octave " + std::to_string(options.octave) + " is outside 0..8");
    const auto& kinds = checked_intervals(); // fifth, fourth, major third, minor third, major sixth
    KeyComparison c;
    c.name = name;
    c.description = scale.description();
    for (int index = 0; index < 24; ++index) {
        KeyReport r;
        r.key = {index % 12, index >= 12};
        r.root = NoteName{r.key.root, options.octave};
        int root = midi_key(r.root);
        r.third = note_of_key(root + (r.key.minor ? 3 : 4));
        r.fifth = note_of_key(root + 7);
        auto b = [&](const NoteName& lo, const NoteName& hi, const CheckedInterval& k) {
            return beat(map.interval(lo, hi), map.hz(lo), k);
        };
        r.fifth_beat = b(r.root, r.fifth, kinds[0]);
        if (r.key.minor) {
            r.minor_third = b(r.root, r.third, kinds[3]);
            r.major_third = b(r.third, r.fifth, kinds[2]);
        } else {
            r.major_third = b(r.root, r.third, kinds[2]);
            r.minor_third = b(r.third, r.fifth, kinds[3]);
        }
        c.keys.push_back(r);
    }
    if (options.fit) {
        ToneOptions tones;
        tones.order = options.fit_order;
        check_options(tones);
        // The keyboard's reference is the tonic in octave 4, so note (degree, period) of the
        // keyboard is the same sound as the NoteMap's note.
        const double tonic_hz = map.hz(NoteName{options.tonic, 4});
        if (!(tonic_hz >= min_ref_hz && tonic_hz <= max_ref_hz)) {
            char text[256];
            std::snprintf(text, sizeof text,
                          "at this reference the tonic in octave 4 would sound at %g Hz; the fit needs it within %g to %g Hz",
                          tonic_hz, min_ref_hz, max_ref_hz);
            fail({"--pitch", 0, 0}, text);
        }
        Keyboard keyboard(scale, tonic_hz, 1, name);
        auto keyboard_note = [&](const NoteName& n) {
            int m = midi_key(n) - (60 + options.tonic);
            int period = m >= 0 ? m / 12 : -((-m + 11) / 12);
            return keyboard.note(m - 12 * period, period);
        };
        for (KeyReport& r : c.keys) {
            std::vector<Note> triad = {keyboard_note(r.root), keyboard_note(r.third),
                                       keyboard_note(r.fifth)};
            r.fit = fit(chord_tones(keyboard, triad, tones)).rms_cents;
        }
    }
    c.circle = fifth_circle(map);
    c.summary = summarize(c.keys, options.weights);
    return c;
}

Ratio nearest_simple_ratio(double cents, int odd_limit) {
    TERZO_ASSERT(odd_limit >= 1 && odd_limit % 2 == 1 && odd_limit <= max_odd_limit);
    Ratio best(1);
    double best_dev = INFINITY;
    for (int n = 1; n <= odd_limit; n += 2) {
        for (int d = 1; d <= odd_limit; d += 2) {
            if (std::gcd(n, d) != 1) continue;
            double base = 1200.0 * std::log2(static_cast<double>(n) / d);
            // The octave shift k that brings n/d * 2^k nearest to the target.
            long k = std::lround((cents - base) / 1200.0);
            if (std::fabs(static_cast<double>(k)) > 60)
                continue; // beyond 2^60 the ratio would not fit
            for (long kk = k - 1; kk <= k + 1; ++kk) {
                double dev = std::fabs(cents - base - 1200.0 * static_cast<double>(kk));
                if (dev < best_dev) {
                    Ratio two_k = Ratio(2).pow(kk);
                    best = Ratio(n, d) * two_k;
                    best_dev = dev;
                }
            }
        }
    }
    return best;
}

std::vector<IntervalClass> interval_classes(const Scale& scale, int odd_limit,
                                            const std::string& name) {
    if (odd_limit < 1 || odd_limit > max_odd_limit || odd_limit % 2 == 0)
        fail({"--odd-limit", 0, 0},
             "odd limit " + std::to_string(odd_limit) + " must be an odd number from 1 to 99");
    std::size_t n = scale.size();
    if (n > max_class_degrees)
        fail({name, 0, 0},
             "interval classes are made for tunings of at most 256 degrees; this one has " +
                 std::to_string(n));
    std::vector<IntervalClass> classes;
    for (std::size_t k = 1; k < n; ++k) {
        std::vector<Pitch> sizes;
        for (std::size_t i = 0; i < n; ++i) {
            std::size_t j = i + k;
            Pitch top = j < n ? scale.degree(j) : scale.degree(j - n) * scale.period();
            sizes.push_back(top / scale.degree(i));
        }
        std::stable_sort(sizes.begin(), sizes.end(),
                         [](const Pitch& a, const Pitch& b) { return a.cents() < b.cents(); });
        IntervalClass ic;
        ic.steps = static_cast<int>(k);
        for (const Pitch& p : sizes) {
            bool same = false;
            if (!ic.sizes.empty()) {
                const Pitch& last = ic.sizes.back().size;
                auto eq = exactly_equal(p, last);
                same = eq ? *eq : std::fabs(p.cents() - last.cents()) <= 1e-6;
            }
            if (same) {
                ++ic.sizes.back().count;
                continue;
            }
            IntervalSize s;
            s.size = p;
            s.count = 1;
            s.nearest = nearest_simple_ratio(p.cents(), odd_limit);
            s.deviation = p.cents() - cents(s.nearest);
            ic.sizes.push_back(std::move(s));
        }
        classes.push_back(std::move(ic));
    }
    return classes;
}

} // namespace terzo
