#include <catch2/catch.hpp>

#include <cmath>

#include "core/arith/prime_vector.hpp"

using terzo::PrimeVector;
using terzo::Ratio;

TEST_CASE("a ratio factors into integer prime exponents", "[prime_vector]") {
    PrimeVector v = PrimeVector::from_ratio(Ratio(81, 80)); // 3^4 / (2^4 * 5)
    CHECK(v.exponent(2) == Ratio(-4));
    CHECK(v.exponent(3) == Ratio(4));
    CHECK(v.exponent(5) == Ratio(-1));
    CHECK(v.exponent(7) == Ratio(0));
    CHECK(v.is_rational());
    CHECK(*v.to_ratio() == Ratio(81, 80));
    CHECK(v.str() == "81/80");
}

TEST_CASE("a quarter-comma meantone fifth is exactly the fourth root of five", "[prime_vector]") {
    // 3/2 * (80/81)^(1/4) = 2^(-1+1) * 3^(1-1) * 5^(1/4) = 5^(1/4): docs/references.md 2.2 gives the
    // fifth as 696.578428 = 300 * log2(5) (common practice).
    PrimeVector fifth = PrimeVector::from_ratio(Ratio(3, 2)) *
                        PrimeVector::from_ratio(Ratio(80, 81)).pow(Ratio(1, 4));
    CHECK(fifth == PrimeVector::prime_power(5, Ratio(1, 4)));
    CHECK(fifth.str() == "5^(1/4)");
    CHECK(fifth.cents() == Approx(696.578428).margin(1e-6));
    CHECK_FALSE(fifth.is_rational());
    // Four such fifths less two octaves are exactly 5/4.
    CHECK(*(fifth.pow(4) / PrimeVector::from_ratio(Ratio(4))).to_ratio() == Ratio(5, 4));
}

TEST_CASE("an equal division step is a rational power of its interval", "[prime_vector]") {
    PrimeVector step = PrimeVector::prime_power(2, Ratio(1, 31));
    CHECK(step.str() == "2^(1/31)");
    CHECK(step.cents() == Approx(1200.0 / 31).margin(1e-9));
    CHECK(*step.pow(31).to_ratio() == Ratio(2));
    // A sixth-comma meantone fifth: 3/2 * (80/81)^(1/6) = 2^(-1/3)*3^(1/3)*5^(1/6)... written out:
    PrimeVector sixth = PrimeVector::from_ratio(Ratio(3, 2)) *
                        PrimeVector::from_ratio(Ratio(80, 81)).pow(Ratio(1, 6));
    CHECK(sixth.str() == "2^(-1/3)*3^(1/3)*5^(1/6)");
    // docs/references.md 2.2: 1/6-comma fifth 698.370619 c.
    CHECK(sixth.cents() == Approx(698.370619).margin(1e-6));
}

TEST_CASE("primality and factoring agree with trial division", "[prime_vector]") {
    // Reference: naive trial division, independent of the Miller-Rabin/Pollard code.
    auto naive_prime = [](std::uint64_t n) {
        if (n < 2) return false;
        for (std::uint64_t d = 2; d * d <= n; ++d)
            if (n % d == 0) return false;
        return true;
    };
    for (std::uint64_t n = 0; n < 20000; ++n) REQUIRE(terzo::is_prime(n) == naive_prime(n));
    // Large cases: a 61-bit Mersenne prime and a product of two large primes.
    CHECK(terzo::is_prime(2305843009213693951ULL));
    CHECK_FALSE(terzo::is_prime(1000000007ULL * 998244353ULL));
    // The largest primes below 2^64 and 2^63 (sympy.prevprime, sympy 1.14).
    CHECK(terzo::is_prime(18446744073709551557ULL));
    CHECK(terzo::is_prime(9223372036854775783ULL));
    // Composites that pass the strong test for every base up to the n-th prime: the smallest
    // such number for n = 1..9 (OEIS A014233; each checked composite with sympy.factorint).
    for (std::uint64_t n : {2047ULL, 1373653ULL, 25326001ULL, 3215031751ULL, 2152302898747ULL,
                            3474749660383ULL, 341550071728321ULL, 3825123056546413051ULL})
        CHECK_FALSE(terzo::is_prime(n));
    // Carmichael numbers, which fool the Fermat test for every base prime to them (OEIS A002997;
    // factored and checked with sympy).
    for (std::uint64_t n : {561ULL, 41041ULL, 825265ULL, 321197185ULL, 5394826801ULL})
        CHECK_FALSE(terzo::is_prime(n));
    CHECK(terzo::factor(1000000007ULL * 998244353ULL) ==
          std::vector<std::uint64_t>{998244353ULL, 1000000007ULL});
    CHECK(terzo::factor(531441) == std::vector<std::uint64_t>(12, 3));
    CHECK(terzo::factor(1).empty());
}

TEST_CASE("a vector with a huge integer exponent does not build a huge ratio", "[prime_vector]") {
    PrimeVector v = PrimeVector::prime_power(3, Ratio(2585)); // 2585 * log2(3) > 4096 bits
    CHECK(v.is_rational());
    CHECK_FALSE(v.to_ratio().has_value());
    CHECK(v.cents() == Approx(2585 * 1901.955000865).epsilon(1e-12));
    CHECK(PrimeVector::prime_power(3, Ratio(2584)).to_ratio().has_value()); // 4095.5 bits
}
