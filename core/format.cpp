#include "core/format.hpp"

#include <cmath>
#include <cstdio>

namespace terzo {

std::string fixed(double value, int decimals) {
    char buf[512];
    std::snprintf(buf, sizeof buf, "%.*f", decimals, value);
    std::string s = buf;
    if (s.size() > 1 && s[0] == '-' && s.find_first_not_of("-0.") == std::string::npos)
        s.erase(0, 1); // "-0.000" reads as a signed zero; print "0.000"
    return s;
}

std::string signed_fixed(double value, int decimals) {
    std::string s = fixed(value, decimals);
    if (s[0] != '-' && s.find_first_not_of("0.") != std::string::npos) s.insert(0, "+");
    return s;
}

std::string number_text(double value) {
    if (std::isnan(value)) return "nan";
    if (std::isinf(value)) return value > 0 ? "inf" : "-inf";
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.10g", value);
    return buf;
}

std::string runs_text(const std::vector<int>& sorted) {
    std::string s;
    for (std::size_t i = 0; i < sorted.size();) {
        std::size_t j = i;
        while (j + 1 < sorted.size() && sorted[j + 1] == sorted[j] + 1)
            ++j;
        if (!s.empty()) s += ", ";
        s += std::to_string(sorted[i]);
        if (j > i) s += "-" + std::to_string(sorted[j]);
        i = j + 1;
    }
    return s;
}

} // namespace terzo
