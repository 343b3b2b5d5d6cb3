// Candidate lists (`terzo suggest --candidates`) on arbitrary text, enumerated in a 2/1, a 3/1
// and a cents-only period and filtered against a just keyboard: every pitch lies strictly
// inside its period, in order of size.
#include "core/analysis/candidates.hpp"
#include "core/tuning/recipe.hpp"
#include "fuzz_target.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    static const terzo::Keyboard just(terzo::build_recipe("list 9/8 5/4 4/3 3/2 5/3 7/4 15/8 2/1"));
    static const terzo::Pitch periods[] = {terzo::Pitch::from_ratio(terzo::Ratio(2)),
                                           terzo::Pitch::from_ratio(terzo::Ratio(3)),
                                           terzo::Pitch::from_cents(1210.5)};
    const std::string text = terzo::fuzz::as_text(data, size);
    terzo::fuzz::expect_clean([&] {
        const auto spec = terzo::parse_candidate_spec(text, {"--candidates", 0, 0});
        for (const terzo::Pitch& period : periods) {
            terzo::fuzz::expect_clean([&] {
                const auto c = terzo::candidate_pitches(spec, period, {"--candidates", 0, 0});
                terzo::fuzz::require(c.size() <= terzo::max_candidates, "candidate count");
                for (std::size_t i = 0; i < c.size(); ++i) {
                    terzo::fuzz::require(c[i].cents() > 0.0 && c[i].cents() < period.cents(), "inside the period");
                    if (i > 0) terzo::fuzz::require(c[i - 1].cents() <= c[i].cents(), "in order of size");
                }
                if (period == just.scale().period())
                    terzo::fuzz::require(terzo::new_candidates(just, c).size() <= c.size(), "filter");
            });
        }
    });
    return 0;
}
