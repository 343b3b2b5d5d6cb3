#include <catch2/catch.hpp>

#include <sstream>

#include "core/report/scale_report.hpp"

using namespace terzo;

namespace {
Scale mixed_scale() {
    return Scale("three kinds", {Pitch::from_ratio(Ratio(5, 4)),
                                 Pitch::from_vector(PrimeVector::prime_power(5, Ratio(1, 4))),
                                 Pitch::from_cents(968.8)},
                 Pitch::from_ratio(Ratio(2)));
}
} // namespace

TEST_CASE("a scale's JSON has the documented keys in order", "[scale_report]") {
    auto j = scale_json(mixed_scale());
    CHECK(j.dump() ==
          R"j({"description":"three kinds","size":4,)j"
          R"j("period":{"cents":1200.0,"ratio":"2/1","exact":true,"value":"2/1"},)j"
          R"j("degrees":[{"index":0,"cents":0.0,"ratio":"1/1","exact":true,"value":"1/1"},)j"
          R"j({"index":1,"cents":386.3137138648348,"ratio":"5/4","exact":true,"value":"5/4"},)j"
          R"j({"index":2,"cents":696.5784284662087,"ratio":null,"exact":true,"value":"5^(1/4)"},)j"
          R"j({"index":3,"cents":968.8,"ratio":null,"exact":false,"value":"968.800000"}]})j");
}

TEST_CASE("the degree table shows exact values, cents and steps", "[scale_report]") {
    std::ostringstream out;
    write_text(out, degree_table(mixed_scale()));
    CHECK(out.str() == "degree  exact value        cents      step\n"
                       "------------------------------------------\n"
                       "     0  1/1                0.000\n"
                       "     1  5/4              386.314  +386.314\n"
                       "     2  5^(1/4)          696.578  +310.265\n"
                       "     3  ~ (cents only)   968.800  +272.222\n"
                       "period  2/1             1200.000  +231.200\n");
}
