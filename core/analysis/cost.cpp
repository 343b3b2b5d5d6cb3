#include "core/analysis/cost.hpp"

#include <algorithm>
#include <charconv>
#include <cmath>

#include "core/analysis/chord.hpp"
#include "core/analysis/fit.hpp"
#include "core/analysis/keyboard.hpp"
#include "core/format.hpp"

namespace terzo {

std::string key_interval_name(KeyInterval k) {
    switch (k) {
    case KeyInterval::fifth:
        return "fifth";
    case KeyInterval::major_third:
        return "major-third";
    case KeyInterval::minor_third:
        break;
    }
    return "minor-third";
}

std::string statistic_name(Statistic s) {
    switch (s) {
    case Statistic::mean:
        return "mean";
    case Statistic::rms:
        return "rms";
    case Statistic::worst:
        break;
    }
    return "worst";
}

namespace {

std::vector<std::string_view> split(std::string_view text, char sep) {
    std::vector<std::string_view> out;
    std::size_t start = 0;
    for (;;) {
        std::size_t at = text.find(sep, start);
        out.push_back(text.substr(start, at == std::string_view::npos ? std::string_view::npos : at - start));
        if (at == std::string_view::npos) return out;
        start = at + 1;
    }
}

double parse_number(std::string_view text, std::string_view what, const std::string& source) {
    double v = 0;
    auto [ptr, ec] = std::from_chars(text.data(), text.data() + text.size(), v);
    if (text.empty() || ec != std::errc() || ptr != text.data() + text.size() || !std::isfinite(v) ||
        text.front() == '+')
        fail({source, 0, 0}, "expected " + std::string(what) + " (a decimal number), found " + excerpt(text));
    return v;
}

KeyInterval parse_interval(std::string_view text, const std::string& source) {
    if (text == "fifth") return KeyInterval::fifth;
    if (text == "major-third") return KeyInterval::major_third;
    if (text == "minor-third") return KeyInterval::minor_third;
    fail({source, 0, 0}, "expected fifth, major-third or minor-third, found " + excerpt(text));
}

} // namespace

DeviationPart parse_deviation_part(std::string_view text, const std::string& source) {
    auto f = split(text, ':');
    if (f.size() < 2 || f.size() > 3)
        fail({source, 0, 0}, "expected INTERVAL:STATISTIC[:WEIGHT] such as \"major-third:rms\", found " + excerpt(text));
    DeviationPart p;
    p.interval = parse_interval(f[0], source);
    if (f[1] == "mean") p.statistic = Statistic::mean;
    else if (f[1] == "rms") p.statistic = Statistic::rms;
    else if (f[1] == "worst") p.statistic = Statistic::worst;
    else fail({source, 0, 0}, "expected mean, rms or worst, found " + excerpt(f[1]));
    if (f.size() == 3) p.weight = parse_number(f[2], "a weight", source);
    return p;
}

BeatPart parse_beat_part(std::string_view text, const std::string& source) {
    auto f = split(text, ':');
    if (f.size() < 2 || f.size() > 3)
        fail({source, 0, 0}, "expected INTERVAL:HZ[:WEIGHT] such as \"major-third:8\", found " + excerpt(text));
    BeatPart p;
    p.interval = parse_interval(f[0], source);
    p.limit_hz = parse_number(f[1], "a beat rate in Hz", source);
    if (f.size() == 3) p.weight = parse_number(f[2], "a weight", source);
    return p;
}

FitPart parse_fit_part(std::string_view text, const std::string& source) {
    auto f = split(text, ':');
    if (f.size() > 2)
        fail({source, 0, 0}, "expected SHAPE[:WEIGHT] such as \"0+4+7\", found " + excerpt(text));
    FitPart p;
    p.shape.clear();
    for (std::string_view s : split(f[0], '+')) {
        int v = 0;
        auto [ptr, ec] = std::from_chars(s.data(), s.data() + s.size(), v);
        if (s.empty() || ec != std::errc() || ptr != s.data() + s.size())
            fail({source, 0, 0}, "expected semitones joined by '+' such as \"0+4+7\", found " + excerpt(s));
        p.shape.push_back(v);
    }
    if (f.size() == 2) p.weight = parse_number(f[1], "a weight", source);
    return p;
}

void check_cost(const Cost& cost, const std::string& source) {
    std::size_t n = cost.deviations.size() + cost.beats.size() + cost.fits.size();
    if (n == 0) fail({source, 0, 0}, "the cost has no part; give at least one");
    if (n > max_cost_parts)
        fail({source, 0, 0}, "the cost has " + std::to_string(n) + " parts; at most 32 are allowed");
    bool positive = false;
    auto weight = [&](double w) {
        if (!(w >= 0) || w > max_part_weight)
            fail({source, 0, 0}, "weight " + fixed(w, 3) + " is outside 0..1000000");
        positive = positive || w > 0;
    };
    for (const auto& p : cost.deviations) weight(p.weight);
    for (const auto& p : cost.beats) {
        weight(p.weight);
        if (!(p.limit_hz >= 0)) fail({source, 0, 0}, "a beat-rate limit must not be negative");
    }
    for (const auto& p : cost.fits) {
        weight(p.weight);
        if (p.shape.size() < 2) fail({source, 0, 0}, "a chord shape needs at least two notes");
        for (std::size_t i = 0; i < p.shape.size(); ++i) {
            if (p.shape[i] < 0 || p.shape[i] > 11 || (i > 0 && p.shape[i] <= p.shape[i - 1]))
                fail({source, 0, 0}, "a chord shape lists rising semitones from 0 to 11, such as 0+4+7");
        }
        if (p.order < 2 || p.order > max_order)
            fail({source, 0, 0}, "fit order " + std::to_string(p.order) + " is outside 2..12");
    }
    if (!positive) fail({source, 0, 0}, "no part of the cost has a positive weight");
    auto limit = [&](const std::optional<double>& v) {
        if (v && !(*v >= 0)) fail({source, 0, 0}, "a constraint in cents must not be negative");
    };
    limit(cost.constraints.max_fifth);
    limit(cost.constraints.max_major_third);
    limit(cost.constraints.max_minor_third);
}

const std::array<double, 12>& KeyDeviations::of(KeyInterval k) const {
    switch (k) {
    case KeyInterval::fifth:
        return fifth;
    case KeyInterval::major_third:
        return major_third;
    case KeyInterval::minor_third:
        break;
    }
    return minor_third;
}

KeyDeviations key_deviations(const Positions& pos) {
    static constexpr double major = 386.3137138648348, minor = 315.64128700055255;
    KeyDeviations d;
    for (int p = 0; p < 12; ++p) {
        auto up = [&](int semitones) {
            int q = p + semitones;
            return pos[static_cast<std::size_t>(q % 12)] + (q >= 12 ? 1200.0 : 0.0) - pos[static_cast<std::size_t>(p)];
        };
        auto i = static_cast<std::size_t>(p);
        d.fifth[i] = up(7) - pure_fifth_cents;
        d.major_third[i] = up(4) - major;
        d.minor_third[i] = up(3) - minor;
    }
    return d;
}

Positions positions_of(const Scale& scale) {
    TERZO_ASSERT(scale.size() == 12);
    Positions p{};
    for (std::size_t i = 0; i < 12; ++i) p[i] = scale.degree(i).cents();
    return p;
}

CostModel::CostModel(Cost cost, const std::string& source) : cost_(std::move(cost)) {
    check_cost(cost_, source);
    // A key's triad holds its fifth, its major third and its minor third (for a major key on r:
    // the major third from r and the minor third from r+4; for a minor key on r: the minor
    // third from r and the major third from r+3). Weighting each interval by the keys that
    // hold it makes these means equal to the key comparison's weighted means over the keys.
    for (int pc = 0; pc < 12; ++pc) {
        auto w = [&](int root, bool minor) {
            if (!cost_.weights) return 1.0;
            return cost_.weights->weight[static_cast<std::size_t>(((root % 12) + 12) % 12 + (minor ? 12 : 0))];
        };
        weight_[0][static_cast<std::size_t>(pc)] = w(pc, false) + w(pc, true);
        weight_[1][static_cast<std::size_t>(pc)] = w(pc, false) + w(pc - 3 + 12, true);
        weight_[2][static_cast<std::size_t>(pc)] = w(pc, true) + w(pc - 4 + 12, false);
    }
    for (int k = 0; k < 3; ++k)
        for (double w : weight_[static_cast<std::size_t>(k)]) total_[static_cast<std::size_t>(k)] += w;
}

double CostModel::statistic(KeyInterval k, Statistic s, const std::array<double, 12>& dev) const {
    const auto& w = weight_[static_cast<std::size_t>(k)];
    double total = total_[static_cast<std::size_t>(k)];
    if (total <= 0) return 0;
    double acc = 0;
    for (std::size_t i = 0; i < 12; ++i) {
        if (w[i] <= 0) continue;
        switch (s) {
        case Statistic::mean:
            acc += w[i] * std::fabs(dev[i]);
            break;
        case Statistic::rms:
            acc += w[i] * dev[i] * dev[i];
            break;
        case Statistic::worst:
            acc = std::max(acc, std::fabs(dev[i]));
            break;
        }
    }
    if (s == Statistic::mean) return acc / total;
    if (s == Statistic::rms) return std::sqrt(acc / total);
    return acc;
}

double CostModel::hz(const Positions& positions, int pc) const {
    // Same placement as the key comparison's NoteMap with the tonic C: pitch class pc in
    // octave 4 lies positions[pc] above C4, and the reference note sounds at its frequency.
    const NoteName& r = cost_.reference.note;
    double ref_cents = positions[static_cast<std::size_t>(r.pitch_class)] + 1200.0 * (r.octave - 4);
    return cost_.reference.hz * std::exp2((positions[static_cast<std::size_t>(pc)] - ref_cents) / 1200.0);
}

double CostModel::beat_excess(const BeatPart& part, const Positions& positions, const KeyDeviations& d) const {
    static constexpr int partial[3] = {3, 5, 6}; // p of 3/2, 5/4, 6/5
    const auto& dev = d.of(part.interval);
    int p = partial[static_cast<int>(part.interval)];
    double sum = 0;
    for (int pc = 0; pc < 12; ++pc) {
        // beats.hpp's formula: p * f_low * |2^(cents/1200) - 1|.
        double rate = std::fabs(p * hz(positions, pc) * std::expm1(dev[static_cast<std::size_t>(pc)] / 1200.0 * std::log(2.0)));
        if (interval_weight(part.interval, pc) > 0) sum += std::max(0.0, rate - part.limit_hz);
    }
    return sum;
}

double CostModel::fit_value(const FitPart& part, const Positions& positions) const {
    std::vector<Pitch> degrees;
    for (std::size_t i = 1; i < 12; ++i) degrees.push_back(Pitch::from_cents(positions[i]));
    Keyboard kb(Scale("candidate", degrees, Pitch::from_ratio(Ratio(2))), hz(positions, 0), 1);
    ToneOptions options;
    options.order = part.order;
    options.exact = false;
    double sum = 0;
    for (int root = 0; root < 12; ++root) {
        std::vector<Note> chord;
        for (int s : part.shape) chord.push_back(kb.note((root + s) % 12, (root + s) / 12));
        sum += fit(chord_tones(kb, chord, options)).rms_cents;
    }
    return sum / 12.0;
}

std::string CostModel::violation(const KeyDeviations& d) const {
    const Constraints& c = cost_.constraints;
    for (int pc = 0; pc < 12; ++pc) {
        auto i = static_cast<std::size_t>(pc);
        std::string where = " from " + pitch_class_name(pc);
        // A fifth counts as wide only beyond rounding (1e-9 c): a pure fifth built from an
        // exact 3/2 may come out a few ulps over.
        if (c.no_wide_fifths && d.fifth[i] > 1e-9)
            return "the fifth" + where + " is " + signed_fixed(d.fifth[i], 3) + " c, wider than pure";
        if (c.max_fifth && std::fabs(d.fifth[i]) > *c.max_fifth + 1e-9)
            return "the fifth" + where + " is " + signed_fixed(d.fifth[i], 3) + " c from pure";
        if (c.max_major_third && std::fabs(d.major_third[i]) > *c.max_major_third + 1e-9)
            return "the major third" + where + " is " + signed_fixed(d.major_third[i], 3) + " c from pure";
        if (c.max_minor_third && std::fabs(d.minor_third[i]) > *c.max_minor_third + 1e-9)
            return "the minor third" + where + " is " + signed_fixed(d.minor_third[i], 3) + " c from pure";
    }
    return {};
}

CostBreakdown CostModel::evaluate(const Positions& positions) const {
    KeyDeviations d = key_deviations(positions);
    CostBreakdown b;
    for (const auto& p : cost_.deviations) {
        double v = statistic(p.interval, p.statistic, d.of(p.interval));
        b.parts.push_back({key_interval_name(p.interval) + ":" + statistic_name(p.statistic), v, p.weight});
    }
    for (const auto& p : cost_.beats) {
        double v = beat_excess(p, positions, d);
        b.parts.push_back({"beats:" + key_interval_name(p.interval) + ">" + fixed(p.limit_hz, 2), v, p.weight});
    }
    for (const auto& p : cost_.fits) {
        std::string shape;
        for (int s : p.shape) shape += (shape.empty() ? "" : "+") + std::to_string(s);
        b.parts.push_back({"fit:" + shape, fit_value(p, positions), p.weight});
    }
    for (const auto& p : b.parts) b.total += p.weight * p.value;
    b.violation = violation(d);
    b.feasible = b.violation.empty();
    return b;
}

bool CostModel::transposition_invariant() const {
    return !cost_.weights && cost_.beats.empty() && cost_.fits.empty();
}

bool CostModel::inversion_invariant() const { return transposition_invariant(); }

} // namespace terzo
