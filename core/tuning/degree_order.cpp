#include "core/tuning/degree_order.hpp"

#include <algorithm>
#include <cstdio>
#include <numeric>

#include "core/tuning/pitch_set.hpp"

namespace terzo {

namespace {

// "3/2", "2^(7/12)", or "551.318 c" for a cents-only pitch.
std::string pitch_text(const Pitch& p) {
    if (p.is_exact()) return p.str();
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.3f c", p.cents());
    return buf;
}

std::string degree_text(std::size_t i, const Pitch& p) {
    return "degree " + std::to_string(i) + " (" + pitch_text(p) + ")";
}

// a == b exactly when both are exact, else by their cents.
bool same(const Pitch& a, const Pitch& b) {
    if (auto eq = exactly_equal(a, b)) return *eq;
    return a.cents() == b.cents();
}

} // namespace

std::vector<DegreeOrderProblem> degree_order_problems(const Scale& scale) {
    std::vector<DegreeOrderProblem> out;
    const Pitch& period = scale.period();
    const Pitch unison;
    for (std::size_t i = 1; i < scale.size(); ++i) {
        const Pitch& p = scale.degree(i);
        const std::string me = degree_text(i, p);
        if (same(p, unison))
            out.push_back({i, me + " is the unison 1/1, degree 0"});
        else if (p.cents() < 0)
            out.push_back({i, me + " is below 1/1"});
        else if (same(p, period) || p.cents() > period.cents())
            out.push_back({i, me + " is " + (same(p, period) ? "the period" : "above the period") +
                                  " (" + pitch_text(period) + ")"});
        else if (i > 1 && same(p, scale.degree(i - 1)))
            out.push_back({i, me + " is the same pitch as degree " + std::to_string(i - 1)});
        else if (i > 1 && p.cents() < scale.degree(i - 1).cents())
            out.push_back({i, me + " is lower than " + degree_text(i - 1, scale.degree(i - 1))});
    }
    return out;
}

SortedScale sort_by_pitch(const Scale& scale) {
    std::vector<Pitch> reduced;
    reduced.reserve(scale.size());
    for (const Pitch& p : scale.degrees()) reduced.push_back(reduce_into_period(p, scale.period()));
    std::vector<std::size_t> order(scale.size());
    std::iota(order.begin(), order.end(), std::size_t{0});
    // Degree 0 is 1/1 (0 cents) and every reduced degree is at least that, so a stable sort
    // keeps degree 0 first.
    std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) {
        return reduced[a].cents() < reduced[b].cents();
    });
    std::vector<Pitch> above;
    for (std::size_t i = 1; i < order.size(); ++i) above.push_back(reduced[order[i]]);
    return {Scale(scale.description(), std::move(above), scale.period()), std::move(order)};
}

} // namespace terzo
