#include "core/analysis/candidates.hpp"

#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <numeric>
#include <string>

namespace terzo {

namespace {

bool is_blank(char c) { return c == ' ' || c == '\t'; }

bool all_digits(std::string_view s) {
    return !s.empty() && std::all_of(s.begin(), s.end(), [](char c) { return c >= '0' && c <= '9'; });
}

bool is_prime(int n) {
    if (n < 2) return false;
    for (int d = 2; d * d <= n; ++d)
        if (n % d == 0) return false;
    return true;
}

// The largest prime factor of n > 0 (1 for n = 1).
int largest_prime(long long n) {
    int largest = 1;
    for (int d = 2; (long long)d * d <= n; ++d)
        while (n % d == 0) {
            largest = d;
            n /= d;
        }
    return n > 1 ? int(n) : largest;
}

// Strictly between the unison and the period.
bool inside_period(const Pitch& p, const Pitch& period) {
    const double c = p.cents();
    return c > 0.0 && c < period.cents() && !exactly_equal(p, period).value_or(false);
}

// "N" after "kind:", a whole number in [low, high].
int limit_value(std::string_view kind, std::string_view value, int low, int high,
                const SourcePos& at) {
    const std::string item = std::string(kind) + ":" + std::string(value);
    if (!all_digits(value))
        fail(at, "expected a whole number after \"" + std::string(kind) + ":\" in " + excerpt(item));
    if (value.size() > 6 || std::atoi(std::string(value).c_str()) < low ||
        std::atoi(std::string(value).c_str()) > high)
        fail(at, std::string(kind) + " value in " + excerpt(item) + " is outside the allowed range " +
                     std::to_string(low) + " to " + std::to_string(high));
    return std::atoi(std::string(value).c_str());
}

std::string not_a_candidate(std::string_view item) {
    return "candidate " + excerpt(item) +
           " is not a ratio p/q, a cents value such as 350.0, or odd:N, prime:N, edo:N";
}

// A cents value as in a .scl file: optional '-', digits, '.', digits (at least one digit).
Pitch parse_cents_item(std::string_view item, const SourcePos& at) {
    std::string_view body = item.substr(item[0] == '-' ? 1 : 0);
    const std::size_t dot = body.find('.');
    const std::string_view whole = body.substr(0, dot), fraction = body.substr(dot + 1);
    const bool ok = body.find('.', dot + 1) == std::string_view::npos &&
                    (whole.empty() || all_digits(whole)) &&
                    (fraction.empty() || all_digits(fraction)) && whole.size() + fraction.size() > 0;
    if (!ok) fail(at, not_a_candidate(item));
    const double c = std::strtod(std::string(item).c_str(), nullptr);
    if (!(std::fabs(c) <= 100000.0))
        fail(at, "cents value " + excerpt(item) + " is outside the allowed range -100000 to 100000");
    return Pitch::from_cents(c);
}

} // namespace

Pitch period_power(const Pitch& period, int n) {
    if (auto r = period.ratio()) return Pitch::from_ratio(r->pow(n));
    if (auto v = period.vector()) return Pitch::from_vector(v->pow(Ratio(n)));
    return Pitch::from_cents(period.cents() * n);
}

CandidateSpec parse_candidate_spec(std::string_view text, const SourcePos& pos) {
    if (text.size() > max_candidate_spec_length)
        fail(pos, "candidate list is longer than " + std::to_string(max_candidate_spec_length) +
                      " bytes");
    if (std::all_of(text.begin(), text.end(), is_blank))
        fail(pos, "no candidates given; give odd:N, prime:N with odd:N, edo:N, ratios or cents "
                  "separated by commas, such as odd:15 or 7/4,11/8");
    CandidateSpec spec;
    std::size_t start = 0;
    while (true) {
        const std::size_t comma = text.find(',', start);
        std::string_view raw = text.substr(start, comma == std::string_view::npos ? std::string_view::npos
                                                                                : comma - start);
        std::size_t lead = 0;
        while (lead < raw.size() && is_blank(raw[lead])) ++lead;
        std::size_t end = raw.size();
        while (end > lead && is_blank(raw[end - 1])) --end;
        const std::string_view item = raw.substr(lead, end - lead);
        SourcePos at = pos;
        at.column = pos.column == 0 ? 0 : pos.column + int(start + lead);
        if (item.empty())
            fail(at, "empty candidate in " + excerpt(text) + " (give items separated by commas)");

        if (const std::size_t colon = item.find(':'); colon != std::string_view::npos) {
            const std::string_view kind = item.substr(0, colon), value = item.substr(colon + 1);
            if (kind == "odd") {
                if (spec.odd_limit != 0) fail(at, "odd:N is given twice");
                spec.odd_limit = limit_value(kind, value, 1, max_candidate_odd_limit, at);
            } else if (kind == "prime") {
                if (spec.prime_limit != 0) fail(at, "prime:N is given twice");
                spec.prime_limit = limit_value(kind, value, 2, max_candidate_prime, at);
                if (!is_prime(spec.prime_limit))
                    fail(at, "prime limit " + std::to_string(spec.prime_limit) + " is not a prime number");
            } else if (kind == "edo") {
                spec.divisions.push_back(limit_value(kind, value, 1, max_candidate_division, at));
            } else {
                fail(at, "unknown candidate kind " + excerpt(kind) + "; use odd:N, prime:N, edo:N, "
                                                                    "ratios or cents");
            }
        } else if (item.find('.') != std::string_view::npos) {
            spec.explicit_pitches.push_back(parse_cents_item(item, at));
        } else {
            if (item.find_first_not_of("0123456789/-") != std::string_view::npos)
                fail(at, not_a_candidate(item));
            Ratio r = parse_ratio(item, at);
            if (r.sign() <= 0) fail(at, "candidate ratio " + excerpt(item) + " is not positive");
            spec.explicit_pitches.push_back(Pitch::from_ratio(r));
        }
        if (comma == std::string_view::npos) break;
        start = comma + 1;
    }
    if (spec.prime_limit != 0 && spec.odd_limit == 0)
        fail(pos, "prime:" + std::to_string(spec.prime_limit) +
                      " needs an odd limit as well, such as prime:11,odd:27");
    return spec;
}

std::vector<Pitch> candidate_pitches(const CandidateSpec& spec, const Pitch& period,
                                     const SourcePos& pos) {
    std::vector<Pitch> out;
    const double period_cents = period.cents();
    auto add = [&](Pitch p) {
        if (out.size() == max_candidates)
            fail(pos, "the candidates would be more than " + std::to_string(max_candidates) +
                          " pitches in one period; choose lower limits or fewer divisions");
        out.push_back(std::move(p));
    };

    // Just ratios 2^k * a/b with a, b odd and coprime: every k that puts the ratio inside the
    // period (for a 2/1 period exactly one k, for a 3/1 period one or two).
    if (spec.odd_limit > 0)
        for (long long a = 1; a <= spec.odd_limit; a += 2)
            for (long long b = 1; b <= spec.odd_limit; b += 2) {
                if (std::gcd(a, b) != 1) continue;
                if (spec.prime_limit > 0 &&
                    (largest_prime(a) > spec.prime_limit || largest_prime(b) > spec.prime_limit))
                    continue;
                const Ratio base(a, b);
                const double c = cents(base);
                const int k_low = int(std::floor(-c / 1200.0)) - 1;
                const int k_high = int(std::ceil((period_cents - c) / 1200.0)) + 1;
                for (int k = k_low; k <= k_high; ++k) {
                    Pitch p = Pitch::from_ratio(base * Ratio(2).pow(k));
                    if (inside_period(p, period)) add(std::move(p));
                }
            }

    for (int n : spec.divisions)
        for (int k = 1; 1200.0 * (k - 1) / n < period_cents; ++k) {
            Pitch p = Pitch::from_vector(PrimeVector::prime_power(2, Ratio(k, n)));
            if (p.cents() >= period_cents + 1.0) break;
            if (inside_period(p, period)) add(std::move(p));
        }

    for (const Pitch& given : spec.explicit_pitches) {
        Pitch p = given * period_power(period, -int(std::floor(given.cents() / period_cents)));
        if (p.cents() < 0.0) p = p * period;
        if (p.cents() >= period_cents || exactly_equal(p, period).value_or(false)) p = p / period;
        if (inside_period(p, period)) add(std::move(p));
    }

    std::stable_sort(out.begin(), out.end(),
                     [](const Pitch& x, const Pitch& y) { return x.cents() < y.cents(); });
    // Exact duplicates (7/4 from odd:7 and again from the list; 2^(8/16) and 2^(1/2)), and
    // cents-only values given twice.
    std::vector<Pitch> unique;
    for (Pitch& p : out) {
        bool seen = false;
        for (auto it = unique.rbegin(); it != unique.rend() && it->cents() >= p.cents() - 1e-6; ++it)
            if (exactly_equal(*it, p).value_or(!it->is_exact() && !p.is_exact() && it->cents() == p.cents())) {
                seen = true;
                break;
            }
        if (!seen) unique.push_back(std::move(p));
    }
    return unique;
}

std::vector<Pitch> new_candidates(const Keyboard& keyboard, const std::vector<Pitch>& candidates,
                                  double cents_only_tolerance) {
    const double period = keyboard.period_cents();
    // An exact comparison is consulted where floating point cannot tell (1e-6 c, as landing()).
    constexpr double rounding_cents = 1e-6;
    std::vector<Pitch> out;
    for (const Pitch& c : candidates) {
        bool present = false;
        for (const auto& e : keyboard.sorted_degrees()) {
            for (int wrap : {-1, 0, 1}) {
                const double distance = std::fabs(c.cents() - (e.cents_in_period + wrap * period));
                if (distance > std::max(cents_only_tolerance, rounding_cents)) continue;
                const Pitch degree = keyboard.note(e.degree, wrap - e.shift).pitch;
                if (c.is_exact() && degree.is_exact())
                    present = distance <= rounding_cents && exactly_equal(c, degree).value_or(false);
                else
                    present = distance <= cents_only_tolerance;
                if (present) break;
            }
            if (present) break;
        }
        if (!present) out.push_back(c);
    }
    return out;
}

} // namespace terzo
