// The recipe parser on arbitrary text: it rejects with an InputError at a column inside the
// text, or builds a scale within the size limit whose .scl text reads back to the same sizes.
#include <cmath>
#include <sstream>

#include "core/tuning/scl.hpp"
#include "core/tuning/recipe.hpp"
#include "fuzz_target.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    std::string text = terzo::fuzz::as_text(data, size);
    try {
        terzo::Scale scale = terzo::build_recipe(text);
        terzo::fuzz::require(scale.size() >= 1 && scale.size() <= terzo::max_scale_size, "size in range");
        std::ostringstream out;
        terzo::write_scl(out, scale, "fuzz.scl");
        std::istringstream in(out.str());
        terzo::Scale again = terzo::read_scl(in, "again.scl");
        terzo::fuzz::require(again.size() == scale.size(), "same size after .scl");
        for (std::size_t i = 0; i < scale.size(); ++i)
            terzo::fuzz::require(std::fabs(again.degree(i).cents() - scale.degree(i).cents()) < 1e-6,
                                 "same cents after .scl");
    } catch (const terzo::InputError& e) {
        terzo::fuzz::require(!e.message().empty(), "an error says something");
        terzo::fuzz::require(e.pos().column >= 0 && e.pos().column <= static_cast<int>(size) + 1,
                             "the column lies within the recipe");
    }
    return 0;
}
