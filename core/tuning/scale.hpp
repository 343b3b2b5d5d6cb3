// Scale: a tuning's degrees and the period that closes them. Degree 0 is always the unison
// 1/1; the period (usually 2/1) is kept apart from the degrees, as in the .scl format.
#pragma once

#include <string>
#include <vector>

#include "core/arith/pitch.hpp"

namespace terzo {

class Scale {
public:
    /// A scale from the pitches above the unison (in their given order) and the period.
    Scale(std::string description, std::vector<Pitch> degrees_above_unison, Pitch period);

    const std::string& description() const { return description_; }
    /// Number of degrees, the unison included (a 12-note scale has size 12).
    std::size_t size() const { return degrees_.size(); }
    /// Degree i, 0 <= i < size(); degree(0) is 1/1.
    const Pitch& degree(std::size_t i) const { return degrees_.at(i); }
    const std::vector<Pitch>& degrees() const { return degrees_; }
    const Pitch& period() const { return period_; }
    /// True when every degree and the period are exact.
    bool is_exact() const;
    /// True when every degree and the period are rational.
    bool is_rational() const;

    friend bool operator==(const Scale& a, const Scale& b) {
        return a.description_ == b.description_ && a.degrees_ == b.degrees_ &&
               a.period_ == b.period_;
    }

private:
    std::string description_;
    std::vector<Pitch> degrees_; // degrees_[0] is the unison
    Pitch period_;
};

} // namespace terzo
