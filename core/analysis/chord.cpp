#include "core/analysis/chord.hpp"

#include <algorithm>
#include <cmath>

#include <boost/multiprecision/cpp_int.hpp>

#include "core/format.hpp"

namespace terzo {

namespace {

std::string trim(const std::string& s, std::size_t& first) {
    std::size_t b = s.find_first_not_of(" \t"), e = s.find_last_not_of(" \t");
    if (b == std::string::npos) {
        first = 0;
        return "";
    }
    first = b;
    return s.substr(b, e - b + 1);
}

// A chord note given as a ratio: it is a note of the scale when it coincides exactly with
// one; otherwise it keeps its own pitch and takes the degree and period of its landing.
Note ratio_note(const Keyboard& kb, const Ratio& r) {
    Pitch p = Pitch::from_ratio(r);
    Landing l = landing(kb, p);
    Note n;
    n.degree = l.degree;
    n.period = l.period;
    n.pitch = p;
    n.cents = p.cents();
    n.hz = kb.ref_hz() * static_cast<double>(std::exp2(r.log2()));
    n.on_scale = l.exact;
    return n;
}

} // namespace

std::vector<Note> parse_chord(const std::string& text, const Keyboard& kb, const SourcePos& pos) {
    std::vector<Note> notes;
    const long long size = static_cast<long long>(kb.scale().size());
    const long long max_degree = size * (max_span + 1);
    if (text.find_first_not_of(" \t") == std::string::npos)
        fail(pos, "no chord notes given; give degree numbers or ratios separated by commas, "
                  "such as 0,4,7");
    std::size_t start = 0;
    while (true) {
        std::size_t comma = text.find(',', start);
        std::string raw = text.substr(start, comma == std::string::npos ? std::string::npos : comma - start);
        std::size_t lead = 0;
        std::string item = trim(raw, lead);
        SourcePos at = pos;
        at.column = pos.column + int(start + lead); // pos.column is where the text starts, 1-based
        if (pos.column == 0) at.column = 0;
        if (item.empty()) fail(at, "empty chord note in " + terzo::excerpt(text) + " (give degree numbers or ratios separated by commas)");
        if (notes.size() == max_chord_notes)
            fail(at, "a chord has at most " + std::to_string(max_chord_notes) + " notes");
        if (item.find('/') != std::string::npos) {
            Ratio r = parse_ratio(item, at);
            if (r.sign() <= 0) fail(at, "chord ratio " + terzo::excerpt(item) + " is not positive");
            notes.push_back(ratio_note(kb, r));
        } else {
            bool digits = std::all_of(item.begin(), item.end(), [](char c) { return c >= '0' && c <= '9'; });
            if (!digits)
                fail(at, "chord note " + terzo::excerpt(item) + " is neither a degree number nor a ratio p/q");
            if (item.size() > 9 || std::stoll(item) > max_degree)
                fail(at, "degree " + (item.size() > 9 ? terzo::excerpt(item) : item) + " is beyond the last allowed degree " + std::to_string(max_degree) +
                             " (" + std::to_string(max_span + 1) + " periods of " + std::to_string(size) + " degrees)");
            long long n = std::stoll(item);
            notes.push_back(kb.note(int(n % size), int(n / size)));
        }
        if (comma == std::string::npos) break;
        start = comma + 1;
    }
    if (notes.size() < 2) fail(pos, "a chord needs at least two notes, got " + terzo::excerpt(text));
    return notes;
}

void for_each_chord_dyad(const Keyboard& kb, const std::vector<Note>& chord, const ToneOptions& options,
                         const std::function<void(const DyadTones&)>& visit) {
    check_options(options);
    std::vector<Note> notes = chord;
    std::stable_sort(notes.begin(), notes.end(), [](const Note& x, const Note& y) { return x.cents < y.cents; });
    check_tone_count(notes.size() * (notes.size() - 1) / 2, options);
    const ResultantEngine engine(kb, options);
    DyadTones dyad;
    for (std::size_t i = 0; i < notes.size(); ++i)
        for (std::size_t j = i + 1; j < notes.size(); ++j) {
            if (notes[i].cents == notes[j].cents) continue;
            dyad.low = notes[i];
            dyad.high = notes[j];
            engine.tones(notes[i], notes[j], dyad.tones);
            visit(dyad);
        }
}

std::vector<DyadTones> chord_tones(const Keyboard& kb, const std::vector<Note>& chord,
                                   const ToneOptions& options) {
    std::vector<DyadTones> out;
    for_each_chord_dyad(kb, chord, options, [&](const DyadTones& d) { out.push_back(d); });
    return out;
}

// Exact case: with every note a rational multiple of the lowest one, f_i = f_0 * q_i, the
// largest f dividing them all is f_0 * gcd(q_i), where the gcd of fractions in lowest terms
// is gcd(numerators) / lcm(denominators). For rational notes f_0 is itself rational; for
// tempered notes it is a prime vector, and the bass stays exact.
CommonBass common_bass(const Keyboard& kb, const std::vector<Note>& chord, double tolerance_cents) {
    TERZO_ASSERT(!chord.empty());
    using Big = Ratio::Big;
    CommonBass bass;
    const Note* lowest = &chord[0];
    for (const Note& n : chord)
        if (n.cents < lowest->cents) lowest = &n;

    std::vector<Ratio> q;
    bool exact = lowest->pitch.is_exact();
    for (const Note& n : chord) {
        if (!exact) break;
        Pitch r = n.pitch / lowest->pitch;
        if (!n.pitch.is_exact() || !r.is_rational()) {
            exact = false;
            break;
        }
        q.push_back(*r.ratio());
    }
    if (exact) {
        Big g = 0, l = 1;
        for (const Ratio& r : q) {
            g = boost::multiprecision::gcd(g, r.big_num());
            l = boost::multiprecision::lcm(l, r.big_den());
        }
        Ratio gq = Ratio::from_big(g, l);
        Pitch b = lowest->pitch * Pitch::from_ratio(gq);
        for (const Ratio& r : q) bass.multiples.push_back((r / gq).big_num().str());
        bass.cents = b.cents();
        bass.hz = kb.ref_hz() * std::exp2(bass.cents / 1200.0);
        if (auto r = b.ratio()) {
            bass.ratio = *r;
            bass.hz = kb.ref_hz() * static_cast<double>(r->is_small() ? r->to_long_double() : std::exp2(r->log2()));
        } else {
            bass.vector = b.vector();
        }
        bass.landing = landing(kb, b);
        return bass;
    }

    // Approximate case: try the lowest note as multiple m = 1, 2, ... of a bass f = f_0 / m;
    // round every note to its nearest multiple of f, refine f by least squares in log
    // frequency (the mean of log2(f_i / m_i)), and accept the first m whose worst note lies
    // within the tolerance. The first accepted m gives the highest such bass.
    bass.approximate = true;
    for (int m = 1; m <= max_bass_multiple; ++m) {
        const double f = lowest->hz / m;
        std::vector<double> mult;
        double mean = 0.0;
        bool representable = true;
        for (const Note& n : chord) {
            double k = std::max(1.0, std::round(n.hz / f));
            // A multiple beyond 2^53 is no longer an exact whole number in a double (and past
            // 2^63 not a long long: found by fuzzing); no audible bass lies that far down.
            if (k > 9007199254740992.0) representable = false;
            mult.push_back(k);
            mean += std::log2(n.hz / k);
        }
        if (!representable) continue;
        mean /= double(chord.size());
        const double refined = std::exp2(mean);
        double worst = 0.0;
        for (std::size_t i = 0; i < chord.size(); ++i)
            worst = std::max(worst, std::fabs(1200.0 * std::log2(chord[i].hz / (mult[i] * refined))));
        if (worst <= tolerance_cents) {
            for (double k : mult) bass.multiples.push_back(std::to_string(static_cast<long long>(k)));
            bass.hz = refined;
            bass.cents = 1200.0 * std::log2(refined / kb.ref_hz());
            bass.max_error_cents = worst;
            bass.landing = nearest_note(kb, bass.cents);
            return bass;
        }
    }
    bass.found = false;
    return bass;
}

} // namespace terzo
