#include "core/analysis/sheet.hpp"

#include <cmath>
#include <cstdio>

namespace terzo {

namespace {

int floor_div(int a, int b) {
    return a / b - ((a % b != 0) && ((a < 0) != (b < 0)));
}

Pitch power(const Pitch& p, int k) {
    Pitch r;
    for (int i = 0; i < k; ++i)
        r = r * p;
    for (int i = 0; i > k; --i)
        r = r / p;
    return r;
}

} // namespace

NoteMap::NoteMap(const Scale& scale, int tonic, PitchReference ref, const std::string& source)
    : degrees_(scale.degrees()), period_(scale.period()), tonic_(tonic), ref_(ref) {
    if (scale.size() != 12)
        fail({source, 0, 0}, "this needs a 12-note tuning to name its notes C, C#, D …; it has " +
                                 std::to_string(scale.size()) + " degrees");
    const double period = scale.period().cents();
    if (period < min_octave_cents || period > max_octave_cents)
    {
        char cents[256];
        std::snprintf(cents, sizeof cents, " (%.3f c); an octave, stretched or not, is %.0f to %.0f c", period,
                      min_octave_cents, max_octave_cents);
        fail({source, 0, 0}, "this names notes by octaves, but the period of this tuning is " + scale.period().str() + cents);
    }
    TERZO_ASSERT(tonic >= 0 && tonic < 12);
    ref_position_cents_ = position(ref.note).cents();
}

int NoteMap::degree_of(const NoteName& n) const {
    int m = midi_key(n) - (60 + tonic_);
    return m - 12 * floor_div(m, 12);
}

Pitch NoteMap::position(const NoteName& n) const {
    int m = midi_key(n) - (60 + tonic_);
    int periods = floor_div(m, 12);
    return degrees_[static_cast<std::size_t>(m - 12 * periods)] * power(period_, periods);
}

Pitch NoteMap::interval(const NoteName& low, const NoteName& high) const {
    return position(high) / position(low);
}

double NoteMap::hz(const NoteName& n) const {
    return ref_.hz * std::exp2((position(n).cents() - ref_position_cents_) / 1200.0);
}

double NoteMap::offset_from_equal(const NoteName& n) const {
    return 1200.0 * std::log2(hz(n) / equal_tempered_hz(n, ref_));
}

std::vector<CircleFifth> fifth_circle(const NoteMap& map) {
    const CheckedInterval& fifth = checked_intervals()[0];
    std::vector<CircleFifth> circle;
    for (int i = 0; i < 12; ++i) {
        int pc = (map.tonic() + 7 * i) % 12;
        NoteName low{pc, 4}, high = note_of_key(midi_key(low) + 7);
        circle.push_back({pc, beat(map.interval(low, high), map.hz(low), fifth)});
    }
    return circle;
}

std::string step_name(TuningStep::Kind k) {
    switch (k) {
    case TuningStep::Kind::reference:
        return "reference";
    case TuningStep::Kind::fifth_up:
        return "fifth up";
    case TuningStep::Kind::fifth_down:
        return "fifth down";
    case TuningStep::Kind::fourth_up:
        return "fourth up";
    case TuningStep::Kind::fourth_down:
        return "fourth down";
    case TuningStep::Kind::octave_up:
        return "octave up";
    case TuningStep::Kind::octave_down:
        break;
    }
    return "octave down";
}

namespace {

// The step that tunes key `to` from key `from` (already set).
TuningStep step(const NoteMap& map, TuningStep::Kind kind, int from, int to) {
    static const CheckedInterval* by_kind[] = {nullptr,
                                               &checked_intervals()[0],
                                               &checked_intervals()[0],
                                               &checked_intervals()[1],
                                               &checked_intervals()[1],
                                               &octave_interval(),
                                               &octave_interval()};
    TuningStep s;
    s.kind = kind;
    s.from = note_of_key(from);
    s.to = note_of_key(to);
    s.to_hz = map.hz(s.to);
    NoteName low = note_of_key(std::min(from, to)), high = note_of_key(std::max(from, to));
    s.beat = beat(map.interval(low, high), map.hz(low), *by_kind[static_cast<int>(kind)]);
    return s;
}

// Common practice (no source): the temperament octave is set from one note by alternating
// fifths and fourths so that every step stays inside the octave, which walks the whole
// circle of fifths in eleven steps; the rest of the range follows by octaves.
std::vector<TuningStep> tuning_order(const NoteMap& map, int lo, int hi, int start, bool rising) {
    std::vector<TuningStep> order;
    const PitchReference& ref = map.reference();
    int ref_key = midi_key(ref.note);
    TuningStep first;
    if (ref.note.pitch_class == start % 12) {
        first.to = ref.note;
        first.to_hz = ref.hz;
        order.push_back(first);
        for (int k = ref_key; k != start;) {
            int next = k < start ? k + 12 : k - 12;
            order.push_back(
                step(map, k < start ? TuningStep::Kind::octave_up : TuningStep::Kind::octave_down,
                     k, next));
            k = next;
        }
    } else {
        first.to = note_of_key(start);
        first.to_hz = map.hz(first.to);
        order.push_back(first);
    }
    int top = lo + 11;
    for (int k = start, n = 0; n < 11; ++n) {
        int next;
        TuningStep::Kind kind;
        if (rising) {
            bool fifth = k + 7 <= top;
            next = fifth ? k + 7 : k - 5;
            kind = fifth ? TuningStep::Kind::fifth_up : TuningStep::Kind::fourth_down;
        } else {
            bool fifth = k - 7 >= lo;
            next = fifth ? k - 7 : k + 5;
            kind = fifth ? TuningStep::Kind::fifth_down : TuningStep::Kind::fourth_up;
        }
        order.push_back(step(map, kind, k, next));
        k = next;
    }
    auto already_set = [&](int k) {
        for (const TuningStep& s : order)
            if (midi_key(s.to) == k) return true;
        return false;
    };
    for (int k = top + 1; k <= hi; ++k)
        if (!already_set(k)) order.push_back(step(map, TuningStep::Kind::octave_up, k - 12, k));
    return order;
}

} // namespace

Sheet make_sheet(const Scale& scale, const SheetOptions& options, const std::string& source) {
    NoteMap map(scale, options.tonic, options.reference, source);
    int lo = midi_key(options.low), hi = midi_key(options.high);
    const SourcePos range_pos{"--range", 0, 0};
    if (lo < 0 || hi > 127)
        fail(range_pos, "the range " + note_text(options.low) + ".." + note_text(options.high) +
                            " leaves the MIDI keyboard C-1..G9");
    if (hi - lo < 12)
        fail(range_pos,
             "the range " + note_text(options.low) + ".." + note_text(options.high) +
                 " must span at least an octave (12 semitones) so that every note is set");
    int start;
    if (options.start) {
        start = midi_key(*options.start);
        if (start < lo || start > lo + 11)
            fail({"--start", 0, 0},
                 "start note " + note_text(*options.start) + " is outside the temperament octave " +
                     note_text(options.low) + ".." + note_text(note_of_key(lo + 11)));
    } else {
        int pc = options.reference.note.pitch_class;
        start = lo + ((pc - lo) % 12 + 12) % 12;
    }

    Sheet sheet;
    sheet.description = scale.description();
    sheet.options = options;
    for (int k = lo; k <= hi; ++k) {
        NoteName n = note_of_key(k);
        sheet.notes.push_back(
            {n, map.degree_of(n), map.position(n), map.hz(n), map.offset_from_equal(n)});
    }
    for (const CheckedInterval& kind : checked_intervals()) {
        for (int k = lo; k + kind.semitones <= hi; ++k) {
            NoteName low = note_of_key(k), high = note_of_key(k + kind.semitones);
            SheetInterval i;
            i.kind = &kind;
            i.low = low;
            i.high = high;
            i.low_hz = map.hz(low);
            i.high_hz = map.hz(high);
            i.size = map.interval(low, high);
            i.beat = beat(i.size, i.low_hz, kind);
            sheet.intervals.push_back(std::move(i));
        }
    }
    sheet.order = tuning_order(map, lo, hi, start, options.rising);
    sheet.circle = fifth_circle(map);
    return sheet;
}

} // namespace terzo
