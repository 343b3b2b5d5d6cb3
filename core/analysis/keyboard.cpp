#include "core/analysis/keyboard.hpp"

#include <algorithm>
#include <cmath>

#include "core/format.hpp"

namespace terzo {

namespace {

// Powers of the period cached around the keyboard: combination tones of order <= 12 over
// at most 11 periods land within a few dozen periods of it.
constexpr int cached_periods_below = 64;
constexpr int cached_periods_above = 64;

// period^p as a Pitch: exact for rational and tempered periods, cents otherwise.
Pitch pitch_power(const Pitch& period, int p) {
    if (auto r = period.ratio()) return Pitch::from_ratio(r->pow(p));
    if (auto v = period.vector()) return Pitch::from_vector(v->pow(Ratio(p)));
    return Pitch::from_cents(period.cents() * p);
}

double hz_of(double ref_hz, const Pitch& pitch) {
    long double factor;
    if (auto r = pitch.ratio())
        factor = r->is_small() ? r->to_long_double() : std::exp2(r->log2());
    else if (auto v = pitch.vector())
        factor = std::exp2(v->log2());
    else
        factor = std::exp2(static_cast<long double>(pitch.cents()) / 1200.0L);
    return static_cast<double>(ref_hz * factor);
}

} // namespace

Keyboard::Keyboard(Scale scale, double ref_hz, int span, const std::string& tuning_name)
    : scale_(std::move(scale)), ref_hz_(ref_hz), span_(span),
      period_cents_(scale_.period().cents()) {
    if (!std::isfinite(ref_hz) || ref_hz < min_ref_hz || ref_hz > max_ref_hz)
        fail({"--ref-hz"}, "reference frequency " + number_text(ref_hz) +
                               " Hz is outside the allowed range 0.001 to 100000 Hz");
    if (span < 1 || span > max_span)
        fail({"--span"}, "span " + std::to_string(span) + " is outside the allowed range 1 to " +
                             std::to_string(max_span) + " periods");
    TERZO_ASSERT(period_cents_ > 0.0);
    // Landings count periods in an int; a period this small would make those counts (and
    // the notes between two tones) absurd.
    if (period_cents_ < min_period_cents)
        fail({tuning_name}, "period of " + number_text(period_cents_) + " cents is smaller than the " +
                             fixed(min_period_cents, 0) + " cent a keyboard needs");

    degree_ratios_.reserve(scale_.size());
    for (const Pitch& d : scale_.degrees()) degree_ratios_.push_back(d.ratio());
    if (auto r = scale_.period().ratio()) {
        power_offset_ = cached_periods_below;
        Ratio p = r->pow(-cached_periods_below);
        for (int i = -cached_periods_below; i <= span_ + cached_periods_above; ++i) {
            period_powers_.push_back(p);
            p *= *r;
        }
    }

    for (int p = 0; p < span_; ++p)
        for (std::size_t d = 0; d < scale_.size(); ++d) notes_.push_back(note(int(d), p));
    notes_.push_back(note(0, span_));
    for (const Note& n : notes_)
        if (!(n.hz >= min_note_hz && n.hz <= max_note_hz))
            fail({tuning_name}, "degree " + std::to_string(n.degree) + ", period " +
                                    std::to_string(n.period) + " would sound at " +
                                    number_text(n.hz) +
                                 " Hz, outside the 0.000001 to 1000000000 Hz a keyboard allows; "
                                 "check the tuning, --ref-hz and --span");

    for (std::size_t d = 0; d < scale_.size(); ++d) {
        double c = scale_.degree(d).cents();
        int shift = static_cast<int>(std::floor(c / period_cents_));
        double in = c - shift * period_cents_;
        if (in >= period_cents_) { // rounding at the top edge
            in -= period_cents_;
            ++shift;
        }
        sorted_.push_back({in, int(d), shift});
    }
    std::sort(sorted_.begin(), sorted_.end(), [](const SortedDegree& x, const SortedDegree& y) {
        return x.cents_in_period != y.cents_in_period ? x.cents_in_period < y.cents_in_period
                                                      : x.degree < y.degree;
    });
}

Note Keyboard::note(int degree, int period) const {
    TERZO_ASSERT(degree >= 0 && std::size_t(degree) < scale_.size());
    Note n;
    n.degree = degree;
    n.period = period;
    if (auto r = note_ratio(degree, period))
        n.pitch = Pitch::from_ratio(*r);
    else
        n.pitch = scale_.degree(std::size_t(degree)) * pitch_power(scale_.period(), period);
    n.cents = n.pitch.cents();
    n.hz = hz_of(ref_hz_, n.pitch);
    return n;
}

std::optional<Ratio> Keyboard::note_ratio(int degree, int period) const {
    TERZO_ASSERT(degree >= 0 && std::size_t(degree) < scale_.size());
    const auto& d = degree_ratios_[std::size_t(degree)];
    if (!d || period_powers_.empty()) return std::nullopt;
    int i = period + power_offset_;
    if (i >= 0 && std::size_t(i) < period_powers_.size()) return *d * period_powers_[std::size_t(i)];
    return *d * scale_.period().ratio()->pow(period);
}

} // namespace terzo
