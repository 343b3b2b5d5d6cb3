// Ratio text and arithmetic: parse two ratios from the input and check the exact operations
// against boost::rational<cpp_int>, so overflow handling is fuzzed at the 64-bit edge.
#include <boost/rational.hpp>

#include "core/arith/ratio.hpp"
#include "fuzz_target.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    using terzo::Ratio;
    using Ref = boost::rational<Ratio::Big>;
    std::string text = terzo::fuzz::as_text(data, size);
    auto space = text.find(' ');
    std::string a = text.substr(0, space), b = space == std::string::npos ? "1" : text.substr(space + 1);
    terzo::fuzz::expect_clean([&] {
        Ratio x = terzo::parse_ratio(a, {"fuzz", 1, 1});
        Ratio y = terzo::parse_ratio(b, {"fuzz", 1, 1});
        Ref rx(x.big_num(), x.big_den()), ry(y.big_num(), y.big_den());
        auto same = [](const Ratio& r, const Ref& ref) {
            return r.big_num() == ref.numerator() && r.big_den() == ref.denominator();
        };
        terzo::fuzz::require(same(x + y, rx + ry), "sum");
        terzo::fuzz::require(same(x - y, rx - ry), "difference");
        terzo::fuzz::require(same(x * y, rx * ry), "product");
        if (!y.is_zero()) terzo::fuzz::require(same(x / y, rx / ry), "quotient");
        terzo::fuzz::require((x < y) == (rx < ry), "order");
    });
    return 0;
}
