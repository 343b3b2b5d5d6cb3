#include "core/tuning/scale.hpp"

#include <algorithm>

namespace terzo {

Scale::Scale(std::string description, std::vector<Pitch> degrees_above_unison, Pitch period)
    : description_(std::move(description)), period_(std::move(period)) {
    degrees_.reserve(degrees_above_unison.size() + 1);
    degrees_.push_back(Pitch());
    for (auto& p : degrees_above_unison) degrees_.push_back(std::move(p));
}

bool Scale::is_exact() const {
    return period_.is_exact() &&
           std::all_of(degrees_.begin(), degrees_.end(), [](const Pitch& p) { return p.is_exact(); });
}

bool Scale::is_rational() const {
    return period_.is_rational() && std::all_of(degrees_.begin(), degrees_.end(),
                                                [](const Pitch& p) { return p.is_rational(); });
}

} // namespace terzo
