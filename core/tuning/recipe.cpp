#include "core/tuning/recipe.hpp"

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <optional>
#include <vector>

#include "core/format.hpp"
#include "core/tuning/scl.hpp"
#include "core/tuning/just.hpp"
#include "core/tuning/modifiers.hpp"
#include "core/tuning/note_names.hpp"
#include "core/tuning/temperament.hpp"

namespace terzo {

namespace {

std::string in_quotes(std::string_view s) {
    return "\"" + std::string(s) + "\"";
}

[[noreturn]] void fail_at(int column, const std::string& message) {
    fail({"recipe", 1, column}, message);
}

struct Token {
    std::string_view text;
    int column; // 1-based
};

bool is_space(char c) {
    return c == ' ' || c == '\t';
}

// Words are separated by spaces; '|' and ':' are tokens of their own wherever they appear.
std::vector<Token> tokenize(std::string_view text) {
    std::vector<Token> tokens;
    std::size_t i = 0;
    while (i < text.size()) {
        char c = text[i];
        if (is_space(c)) {
            ++i;
            continue;
        }
        if (static_cast<unsigned char>(c) < 0x20 || c == 0x7f)
            fail_at(static_cast<int>(i) + 1,
                    "control character in the recipe; a recipe is one line of text");
        std::size_t start = i;
        if (c == '|' || c == ':') {
            ++i;
        } else {
            while (i < text.size() && !is_space(text[i]) && text[i] != '|' && text[i] != ':' &&
                   static_cast<unsigned char>(text[i]) >= 0x20)
                ++i;
        }
        tokens.push_back({text.substr(start, i - start), static_cast<int>(start) + 1});
    }
    return tokens;
}

// An interval while it is being read: exact as a prime vector, or known only in cents.
struct Interval {
    std::optional<PrimeVector> exact;
    double cents = 0;

    static Interval of(const PrimeVector& v) { return {v, v.cents()}; }
    Pitch pitch() const { return exact ? Pitch::from_vector(*exact) : Pitch::from_cents(cents); }
    Interval times(const Interval& b) const {
        if (exact && b.exact) return of(*exact * *b.exact);
        return {std::nullopt, cents + b.cents};
    }
    Interval over(const Interval& b) const {
        if (exact && b.exact) return of(*exact / *b.exact);
        return {std::nullopt, cents - b.cents};
    }
    Interval power(const Ratio& e) const {
        if (exact) return of(exact->pow(e));
        return {std::nullopt, cents * static_cast<double>(e.to_long_double())};
    }
};

bool is_digit(char c) {
    return c >= '0' && c <= '9';
}

bool is_recipe_kind(std::string_view word) {
    if (word.empty()) return false;
    for (std::string_view kinds = recipe_kinds;;) {
        std::size_t comma = kinds.find(", ");
        if (kinds.substr(0, comma) == word) return true;
        if (comma == std::string_view::npos) return false;
        kinds.remove_prefix(comma + 2);
    }
}

std::string fraction_text(const Ratio& r) {
    return r.is_integer() ? r.big_num().str() : r.str();
}

// Reads the text of one token character by character, reporting columns inside it.
class Cursor {
  public:
    explicit Cursor(const Token& t) : text_(t.text), base_(t.column) {}
    bool done() const { return i_ >= text_.size(); }
    char peek() const { return done() ? '\0' : text_[i_]; }
    bool take(char c) {
        if (peek() != c) return false;
        ++i_;
        return true;
    }
    int column() const { return base_ + static_cast<int>(i_); }
    std::string_view rest() const { return text_.substr(std::min(i_, text_.size())); }
    std::string_view text() const { return text_; }

    // Digits as a whole number up to limit; the caller has checked a digit is next.
    long long number(long long limit, const std::string& what) {
        int col = column();
        long long v = 0;
        while (is_digit(peek())) {
            v = v * 10 + (text_[i_] - '0');
            ++i_;
            if (v > limit) fail_at(col, what + " is larger than " + std::to_string(limit));
        }
        return v;
    }
    void skip_digits() {
        while (is_digit(peek()))
            ++i_;
    }
    std::size_t index() const { return i_; }

  private:
    std::string_view text_;
    int base_;
    std::size_t i_ = 0;
};

// Interval expressions (one word, no spaces):
//   expr     := factor { ('*' | '/') factor }
//   factor   := primary [ '^' exponent ]
//   primary  := whole number | number 'c' (cents) | 'P' | 'S' | 's' | '(' expr ')'
//   exponent := whole number | '(' ['-'] whole number [ '/' whole number ] ')'
// A '/' between two whole numbers is the same as a ratio, so 3/2 reads as expected.
class IntervalReader {
  public:
    explicit IntervalReader(const Token& t) : c_(t) {}

    Interval read_all() {
        if (c_.done()) fail_at(c_.column(), "expected an interval such as 3/2, 2^(1/31) or 700c");
        Interval v = expr();
        if (!c_.done())
            fail_at(c_.column(), "unexpected " + in_quotes(c_.rest()) + " in the interval " +
                                     in_quotes(c_.text()));
        if (std::fabs(v.cents) > 1e7)
            fail_at(c_.column() - static_cast<int>(c_.text().size()),
                    "the interval " + in_quotes(c_.text()) +
                        " is out of range (at most 10000000 cents in size)");
        return v;
    }

  private:
    Interval expr() {
        Interval v = factor();
        for (;;) {
            if (c_.take('*'))
                v = v.times(factor());
            else if (c_.take('/'))
                v = v.over(factor());
            else
                return v;
        }
    }

    Interval factor() {
        Interval v = primary();
        if (c_.take('^')) v = v.power(exponent());
        return v;
    }

    Interval primary() {
        int col = c_.column();
        char ch = c_.peek();
        if (c_.take('(')) {
            if (++depth_ > max_depth)
                fail_at(col, "parentheses nested more than " + std::to_string(max_depth) + " deep");
            Interval v = expr();
            if (!c_.take(')'))
                fail_at(c_.column(),
                        "expected ')' to close the '(' at column " + std::to_string(col));
            --depth_;
            return v;
        }
        if (c_.take('P')) return Interval::of(pythagorean_comma());
        if (c_.take('S')) return Interval::of(syntonic_comma());
        if (c_.take('s')) return Interval::of(schisma());
        if (is_digit(ch) || ch == '.') return number();
        if (ch == '\0') fail_at(col, "the interval " + in_quotes(c_.text()) + " ends too early");
        fail_at(col, "unexpected " + in_quotes(std::string(1, ch)) + " in the interval " +
                         in_quotes(c_.text()) +
                         "; intervals are written like 3/2, 2^(1/31), (3/2)*S^(-1/4) or 700c");
    }

    // A whole number is a ratio n/1; digits with a '.' or followed by 'c' are cents.
    Interval number() {
        int col = c_.column();
        std::size_t start = c_.index();
        c_.skip_digits();
        bool dot = c_.take('.');
        if (dot) c_.skip_digits();
        std::string_view digits = c_.text().substr(start, c_.index() - start);
        if (c_.take('c')) {
            if (digits == ".")
                fail_at(col, "expected digits before 'c' in " + in_quotes(c_.text()));
            double v = std::strtod(std::string(digits).c_str(), nullptr);
            if (!std::isfinite(v) || v > 1e7)
                fail_at(col,
                        "cents value " + in_quotes(digits) + " is out of range (at most 10000000)");
            return {std::nullopt, v};
        }
        if (dot)
            fail_at(col, "a number with a decimal point is cents and ends in c, as in " +
                             std::string(digits) + "c");
        if (digits.size() > 18)
            fail_at(col, "the number " + in_quotes(digits) + " is too large (at most 18 digits)");
        long long n = std::stoll(std::string(digits));
        if (n == 0) fail_at(col, "0 is not an interval; a ratio must be positive");
        return Interval::of(PrimeVector::from_ratio(Ratio(n)));
    }

    Ratio exponent() {
        int col = c_.column();
        if (is_digit(c_.peek())) return Ratio(c_.number(max_recipe_exponent, "the exponent"));
        if (c_.peek() == '-')
            fail_at(col, "put a negative or fractional exponent in parentheses, as in ^(-1/4)");
        if (!c_.take('(')) fail_at(col, "expected an exponent after '^', such as ^2 or ^(1/31)");
        bool negative = c_.take('-');
        if (!is_digit(c_.peek())) fail_at(c_.column(), "expected a whole number in the exponent");
        long long num = c_.number(max_recipe_exponent, "the exponent's numerator");
        long long den = 1;
        if (c_.take('/')) {
            int den_col = c_.column();
            if (!is_digit(c_.peek()))
                fail_at(den_col, "expected the exponent's denominator after '/'");
            den = c_.number(max_recipe_exponent, "the exponent's denominator");
            if (den == 0) fail_at(den_col, "the exponent's denominator is zero");
        }
        if (!c_.take(')')) fail_at(c_.column(), "expected ')' to close the exponent");
        return Ratio(negative ? -num : num, den);
    }

    // Deep nesting would only exhaust the stack; no interval needs more than a few levels.
    static constexpr int max_depth = 50;
    Cursor c_;
    int depth_ = 0;
};

// The tempering of one fifth: "0", "wolf", or signed terms such as -P/4, -1/4S, -s,
// +1/12P, -S/4-s or -(324/323): each term is [sign][coefficient]comma[/divisor].
std::optional<PrimeVector> read_tempering(const Token& t) {
    if (t.text == "0") return PrimeVector();
    if (t.text == "wolf") return std::nullopt;
    Cursor c(t);
    PrimeVector total;
    while (!c.done()) {
        int term_col = c.column();
        int sign = c.take('-') ? -1 : (c.take('+') ? 1 : 0);
        if (sign == 0)
            fail_at(term_col,
                    "write each tempering with its sign: -P/4 narrows a fifth by a quarter "
                    "Pythagorean comma, +P/4 widens it, 0 leaves it pure; found " +
                        in_quotes(c.rest()));
        Ratio coefficient(1);
        if (is_digit(c.peek())) {
            long long num = c.number(max_recipe_exponent, "the fraction");
            long long den = 1;
            if (c.take('/')) {
                int den_col = c.column();
                if (!is_digit(c.peek()))
                    fail_at(den_col, "expected the fraction's denominator after '/'");
                den = c.number(max_recipe_exponent, "the fraction's denominator");
                if (den == 0) fail_at(den_col, "the fraction's denominator is zero");
            }
            coefficient = Ratio(num, den);
        }
        int unit_col = c.column();
        PrimeVector unit;
        if (c.take('P'))
            unit = pythagorean_comma();
        else if (c.take('S'))
            unit = syntonic_comma();
        else if (c.take('s'))
            unit = schisma();
        else if (c.peek() == '(') {
            std::size_t open = c.index();
            int depth = 0;
            std::size_t close = open;
            for (; close < t.text.size(); ++close) {
                if (t.text[close] == '(') ++depth;
                if (t.text[close] == ')' && --depth == 0) break;
            }
            if (close >= t.text.size()) fail_at(unit_col, "expected ')' to close this '('");
            Token inner{t.text.substr(open + 1, close - open - 1), unit_col + 1};
            Interval v = IntervalReader(inner).read_all();
            if (!v.exact)
                fail_at(unit_col + 1,
                        "a fifth's tempering must be exact: write it with P, S, s or a "
                        "ratio, not in cents");
            unit = *v.exact;
            while (c.index() <= close)
                c.take(c.peek());
        } else {
            fail_at(unit_col, "expected a comma after the fraction: P (Pythagorean), S (syntonic), "
                              "s (schisma) or a ratio in parentheses; found " +
                                  in_quotes(c.rest()));
        }
        if (c.take('/')) {
            int den_col = c.column();
            if (!is_digit(c.peek())) fail_at(den_col, "expected a divisor after '/', as in -P/4");
            long long den = c.number(max_recipe_exponent, "the divisor");
            if (den == 0) fail_at(den_col, "the divisor is zero");
            coefficient /= Ratio(den);
        }
        total = total * unit.pow(coefficient * Ratio(sign));
    }
    return total;
}

class RecipeReader {
  public:
    explicit RecipeReader(std::string_view text) : tokens_(tokenize(text)) {}

    Scale read() {
        if (tokens_.empty())
            fail_at(1, std::string("empty recipe; start with one of ") + std::string(recipe_kinds));
        // Split into stages at '|': the construction first, then modifiers in order.
        std::vector<std::vector<Token>> stages(1);
        for (const Token& t : tokens_) {
            if (t.text == "|") {
                if (stages.back().empty()) fail_at(t.column, "expected a recipe before '|'");
                stages.emplace_back();
                bar_columns_.push_back(t.column);
            } else {
                stages.back().push_back(t);
            }
        }
        if (stages.back().empty())
            fail_at(bar_columns_.back() + 1,
                    "expected a modifier after '|': mode, transpose, stretch or subset");
        Scale scale = construct(stages[0]);
        for (std::size_t i = 1; i < stages.size(); ++i)
            scale = modify(scale, stages[i]);
        // Every construction checks its own size and no modifier adds degrees.
        TERZO_ASSERT(scale.size() <= max_scale_size);
        return scale;
    }

  private:
    // ---- small readers of single words ----

    static long long whole(const Token& t, const std::string& what, long long low, long long high) {
        for (char ch : t.text)
            if (!is_digit(ch))
                fail_at(t.column,
                        "expected " + what + " (a whole number), found " + in_quotes(t.text));
        if (t.text.size() > 18 || std::stoll(std::string(t.text)) > high)
            fail_at(t.column,
                    what + " " + std::string(t.text) + " is larger than " + std::to_string(high));
        long long v = std::stoll(std::string(t.text));
        if (v < low)
            fail_at(t.column,
                    what + " " + std::string(t.text) + " is smaller than " + std::to_string(low));
        return v;
    }

    static Pitch interval_above_unison(const Token& t, const std::string& what) {
        Pitch p = IntervalReader(t).read_all().pitch();
        if (p.cents() <= 0 || (p.is_exact() && exactly_equal(p, Pitch()).value_or(false)))
            fail_at(t.column, what + " " + in_quotes(t.text) + " must be larger than 1/1");
        return p;
    }

    static Ratio signed_fraction(const Token& t, const std::string& what) {
        Cursor c(t);
        bool negative = c.take('-');
        if (!negative) c.take('+');
        if (!is_digit(c.peek()))
            fail_at(c.column(),
                    "expected " + what + " such as 1/4 or 2/7, found " + in_quotes(t.text));
        long long num = c.number(max_recipe_exponent, what);
        long long den = 1;
        if (c.take('/')) {
            int col = c.column();
            if (!is_digit(c.peek()))
                fail_at(col, "expected a denominator after '/' in " + in_quotes(t.text));
            den = c.number(max_recipe_exponent, "the denominator");
            if (den == 0) fail_at(col, "the denominator is zero in " + in_quotes(t.text));
        }
        if (!c.done())
            fail_at(c.column(),
                    "unexpected " + in_quotes(c.rest()) + " in " + what + " " + in_quotes(t.text));
        return Ratio(negative ? -num : num, den);
    }

    // The token after position i, or an error naming what was expected there.
    const Token& next(const std::vector<Token>& words, std::size_t i,
                      const std::string& what) const {
        if (i < words.size()) return words[i];
        fail_at(end_column(words), "expected " + what + " here");
    }

    int end_column(const std::vector<Token>& words) const {
        const Token& last = words.back();
        return last.column + static_cast<int>(last.text.size());
    }

    static void no_more(const std::vector<Token>& words, std::size_t i, const std::string& usage) {
        if (i < words.size())
            fail_at(words[i].column,
                    "unexpected " + in_quotes(words[i].text) + "; the form is: " + usage);
    }

    // ---- constructions ----

    Scale construct(const std::vector<Token>& w) {
        std::string_view kind = w[0].text;
        if (kind == "equal") return equal(w);
        if (kind == "chain") return chain(w);
        if (kind == "meantone") return meantone(w);
        if (kind == "fifths") return fifths(w);
        if (kind == "harmonics" || kind == "subharmonics") return segment(w);
        if (kind == "diamond") return diamond(w);
        if (kind == "products") return products(w);
        if (kind == "list") return list(w);
        if (kind == "mode" || kind == "transpose" || kind == "stretch" || kind == "subset")
            fail_at(w[0].column, in_quotes(kind) +
                                     " changes a tuning and comes after one and '|', as in "
                                     "\"equal 12 | " +
                                     std::string(kind) + " ...\"");
        fail_at(w[0].column, "unknown recipe kind " + in_quotes(kind) +
                                 "; a recipe starts with one of " + std::string(recipe_kinds));
    }

    Scale equal(const std::vector<Token>& w) {
        const char* usage = "equal STEPS [of INTERVAL]";
        long long steps = whole(next(w, 1, "the number of steps"), "the number of steps", 1,
                                static_cast<long long>(max_scale_size));
        Pitch interval = Pitch::from_ratio(Ratio(2));
        std::size_t i = 2;
        if (i < w.size() && w[i].text == "of") {
            interval = interval_above_unison(
                next(w, i + 1, "the interval to divide, such as 3/1 or 1200c"),
                "the interval to divide");
            i += 2;
        }
        no_more(w, i, usage);
        std::string description = std::to_string(steps) + " equal divisions of " + interval.str();
        if (!interval.is_exact())
            description = std::to_string(steps) + " equal divisions of " +
                          fixed(interval.cents(), 3) + " cents";
        return equal_division(static_cast<int>(steps), interval, description);
    }

    Scale chain(const std::vector<Token>& w) {
        const char* usage = "chain GENERATOR [up K] [down M] [period INTERVAL]";
        const Token& gen_token = next(w, 1, "a generator interval such as 3/2");
        Pitch generator = IntervalReader(gen_token).read_all().pitch();
        if (generator.is_exact() && exactly_equal(generator, Pitch()).value_or(false))
            fail_at(gen_token.column, "the generator must not be 1/1");
        long long up = 0, down = 0;
        Pitch period = Pitch::from_ratio(Ratio(2));
        std::vector<std::string_view> seen;
        std::size_t i = 2;
        while (i < w.size()) {
            std::string_view word = w[i].text;
            if (word != "up" && word != "down" && word != "period")
                fail_at(w[i].column, "unexpected " + in_quotes(word) + "; the form is: " + usage);
            if (std::find(seen.begin(), seen.end(), word) != seen.end())
                fail_at(w[i].column, in_quotes(word) + " is given twice");
            seen.push_back(word);
            if (word == "period") {
                period =
                    interval_above_unison(next(w, i + 1, "the period, such as 2/1"), "the period");
            } else {
                long long& n = word == "up" ? up : down;
                n = whole(next(w, i + 1, "the number of generators " + std::string(word)),
                          "the number of generators " + std::string(word), 0,
                          static_cast<long long>(max_scale_size) - 1);
            }
            i += 2;
        }
        if (up + down + 1 > static_cast<long long>(max_scale_size))
            fail_at(w[1].column, "the chain has " + std::to_string(up + down + 1) +
                                     " notes, more than " + std::to_string(max_scale_size));
        std::string description = "chain of " + generator.str() + ": " + std::to_string(up) +
                                  " up, " + std::to_string(down) + " down, period " + period.str();
        return generator_chain(generator, static_cast<int>(up), static_cast<int>(down), period,
                               description);
    }

    Scale meantone(const std::vector<Token>& w) {
        const char* usage = "meantone FRACTION [from NOTE] [notes N]";
        const Token& f_token = next(w, 1, "the fraction of the syntonic comma, such as 1/4");
        Ratio fraction = signed_fraction(f_token, "the fraction of the syntonic comma");
        int start = -3; // Eb
        const Token* start_token = nullptr;
        long long notes = 12;
        std::vector<std::string_view> seen;
        std::size_t i = 2;
        while (i < w.size()) {
            std::string_view word = w[i].text;
            if (word != "from" && word != "notes")
                fail_at(w[i].column, "unexpected " + in_quotes(word) + "; the form is: " + usage);
            if (std::find(seen.begin(), seen.end(), word) != seen.end())
                fail_at(w[i].column, in_quotes(word) + " is given twice");
            seen.push_back(word);
            if (word == "from") {
                start_token = &next(w, i + 1, "the chain's first note, such as Eb");
                start =
                    parse_fifths_position(start_token->text, {"recipe", 1, start_token->column});
            } else {
                notes = whole(next(w, i + 1, "the number of notes"), "the number of notes", 1,
                              static_cast<long long>(max_scale_size));
            }
            i += 2;
        }
        long long last = start + notes - 1;
        if (start > 0 || last < 0) {
            int col = start_token ? start_token->column : w[0].column;
            fail_at(col, "a chain of " + std::to_string(notes) + " fifths from " +
                             fifths_position_name(start) +
                             " does not contain C, which is 1/1; start on C or at most " +
                             std::to_string(notes - 1) + " fifths below it");
        }
        std::string description =
            fraction_text(fraction) + "-comma meantone, " + std::to_string(notes) + " notes from " +
            fifths_position_name(start) + " to " + fifths_position_name(static_cast<int>(last));
        return generator_chain(Pitch::from_vector(meantone_fifth(fraction)), static_cast<int>(last),
                               -start, Pitch::from_ratio(Ratio(2)), description);
    }

    Scale fifths(const std::vector<Token>& w) {
        const char* usage = "fifths [from NOTE]: T1 T2 ... T12";
        FifthCircle circle;
        std::size_t i = 1;
        std::string start_name = "C";
        if (i < w.size() && w[i].text == "from") {
            const Token& note = next(w, i + 1, "the note the first fifth starts on, such as C");
            circle.start_pitch_class = parse_pitch_class(note.text, {"recipe", 1, note.column});
            start_name = pitch_class_name(circle.start_pitch_class);
            i += 2;
        }
        const Token& colon = next(w, i, "':' and then the twelve fifths");
        if (colon.text != ":")
            fail_at(colon.column,
                    "expected ':' before the twelve fifths; the form is: " + std::string(usage));
        ++i;
        std::string list;
        int wolves = 0;
        for (int f = 0; f < 12; ++f, ++i) {
            if (i >= w.size())
                fail_at(end_column(w), "expected 12 fifths after ':', found " + std::to_string(f));
            auto t = read_tempering(w[i]);
            if (!t && ++wolves > 1) fail_at(w[i].column, "only one fifth can be the wolf");
            circle.tempering[static_cast<std::size_t>(f)] = t;
            list += " " + std::string(w[i].text);
        }
        if (i < w.size()) fail_at(w[i].column, "more than 12 fifths after ':'");
        std::string description = "fifths from " + start_name + ":" + list;
        if (auto wolf = wolf_index(circle)) {
            int from = (circle.start_pitch_class + 7 * *wolf) % 12;
            description += " (wolf " + pitch_class_name(from) + "-" +
                           pitch_class_name((from + 7) % 12) + " " +
                           fixed(circle_fifth(circle, *wolf).cents(), 3) + " c)";
        } else {
            PrimeVector leftover = circle_leftover(circle);
            if (leftover != PrimeVector()) {
                double c = leftover.cents();
                PrimeVector excess = c > 0 ? leftover : PrimeVector() / leftover;
                fail_at(colon.column + 2,
                        "the 12 fifths do not close the circle: together they are " + excess.str() +
                            " (" + fixed(std::fabs(c), 3) + " c) " +
                            (c > 0 ? "wider" : "narrower") +
                            " than 7 octaves; change a fifth, or write wolf for the fifth that "
                            "takes up "
                            "the difference");
            }
        }
        return fifth_circle_scale(circle, description);
    }

    Scale segment(const std::vector<Token>& w) {
        bool sub = w[0].text == "subharmonics";
        std::string usage = std::string(w[0].text) + " LOW HIGH";
        const Token& lo_t = next(w, 1, "the lowest harmonic number");
        const Token& hi_t = next(w, 2, "the highest harmonic number");
        long long lo = whole(lo_t, "the lowest harmonic number", 1, max_recipe_integer);
        long long hi = whole(hi_t, "the highest harmonic number", 1, max_recipe_integer);
        no_more(w, 3, usage);
        if (hi <= lo)
            fail_at(hi_t.column, "the highest harmonic number must be larger than the lowest");
        if (hi - lo > static_cast<long long>(max_scale_size))
            fail_at(hi_t.column, "harmonics " + std::to_string(lo) + " to " + std::to_string(hi) +
                                     " make " + std::to_string(hi - lo) + " degrees, more than " +
                                     std::to_string(max_scale_size));
        std::string description = std::string(sub ? "subharmonics " : "harmonics ") +
                                  std::to_string(lo) + " to " + std::to_string(hi);
        return sub ? subharmonic_segment(lo, hi, description)
                   : harmonic_segment(lo, hi, description);
    }

    std::vector<std::int64_t> integer_set(const std::vector<Token>& w, std::size_t from,
                                          bool odd_only, const std::string& what) {
        std::vector<std::int64_t> set;
        for (std::size_t i = from; i < w.size(); ++i) {
            long long v = whole(w[i], what, 1, max_recipe_integer);
            if (odd_only && v % 2 == 0)
                fail_at(w[i].column, "the tonality diamond is built from odd numbers; " +
                                         std::string(w[i].text) +
                                         " is even (octaves are already included)");
            if (std::find(set.begin(), set.end(), v) != set.end() && odd_only)
                fail_at(w[i].column, std::string(w[i].text) + " is listed twice");
            if (set.size() == max_recipe_set)
                fail_at(w[i].column, "more than " + std::to_string(max_recipe_set) + " numbers");
            set.push_back(v);
        }
        if (set.empty()) fail_at(end_column(w), "expected " + what + "s here");
        return set;
    }

    Scale diamond(const std::vector<Token>& w) {
        auto odds = integer_set(w, 1, true, "an odd number");
        std::string description = "tonality diamond of";
        for (auto o : odds)
            description += " " + std::to_string(o);
        return tonality_diamond(odds, description);
    }

    Scale products(const std::vector<Token>& w) {
        const Token& k_t = next(w, 1, "how many factors each product has");
        long long k =
            whole(k_t, "the number of factors", 1, static_cast<long long>(max_recipe_set));
        const Token& of = next(w, 2, "\"of\" and the set of factors");
        if (of.text != "of")
            fail_at(of.column, "expected \"of\"; the form is: products K of N1 N2 ...");
        auto factors = integer_set(w, 3, false, "a factor");
        if (k > static_cast<long long>(factors.size()))
            fail_at(k_t.column, "cannot choose " + std::to_string(k) + " factors from " +
                                    std::to_string(factors.size()));
        std::int64_t count = choose_count(static_cast<int>(factors.size()), static_cast<int>(k),
                                          static_cast<std::int64_t>(max_scale_size));
        if (count < 0)
            fail_at(k_t.column, "choosing " + std::to_string(k) + " of " +
                                    std::to_string(factors.size()) + " factors makes more than " +
                                    std::to_string(max_scale_size) + " products");
        std::string description = "products of " + std::to_string(k) + " from";
        for (auto f : factors)
            description += " " + std::to_string(f);
        return product_set(static_cast<int>(k), factors, description);
    }

    Scale list(const std::vector<Token>& w) {
        if (w.size() < 2)
            fail_at(end_column(w), "expected the degrees above 1/1 and last the period");
        if (w.size() - 1 > max_scale_size)
            fail_at(w[max_scale_size + 1].column,
                    "more than " + std::to_string(max_scale_size) + " pitches");
        std::vector<Pitch> pitches;
        for (std::size_t i = 1; i < w.size(); ++i)
            pitches.push_back(IntervalReader(w[i]).read_all().pitch());
        Pitch period = pitches.back();
        pitches.pop_back();
        if (period.cents() <= 0)
            fail_at(w.back().column, "the period (the last pitch, " + in_quotes(w.back().text) +
                                         ") must be larger than 1/1");
        std::string description = "list of " + std::to_string(w.size() - 1) + " pitches";
        return Scale(description, std::move(pitches), period);
    }

    // ---- modifiers ----

    Scale modify(const Scale& scale, const std::vector<Token>& w) {
        std::string_view kind = w[0].text;
        std::string description = scale.description() + " | ";
        for (std::size_t i = 0; i < w.size(); ++i)
            description += (i ? " " : "") + std::string(w[i].text);
        long long last = static_cast<long long>(scale.size()) - 1;
        if (kind == "mode") {
            const Token& t = next(w, 1, "the degree the mode starts on");
            no_more(w, 2, "mode DEGREE");
            long long k = whole(t, "the degree", 0, max_recipe_integer);
            if (k > last)
                fail_at(t.column, "degree " + std::string(t.text) +
                                      " is out of range: the scale has degrees 0 to " +
                                      std::to_string(last));
            return rotate_to_degree(scale, static_cast<std::size_t>(k), description);
        }
        if (kind == "transpose") {
            const Token& t = next(w, 1, "a number of degrees or, for 12 notes, a note name");
            no_more(w, 2, "transpose DEGREES or transpose NOTE");
            long long k = 0;
            if (is_digit(t.text[0])) {
                k = whole(t, "the number of degrees", 0, max_recipe_integer);
                if (k > last)
                    fail_at(t.column, "transposing by " + std::string(t.text) +
                                          " degrees is out of range: the scale has degrees 0 to " +
                                          std::to_string(last));
            } else {
                if (scale.size() != 12)
                    fail_at(t.column,
                            "transposing to a note name needs a 12-note scale, and this one has " +
                                std::to_string(scale.size()) +
                                " degrees; give a number of degrees");
                k = parse_pitch_class(t.text, {"recipe", 1, t.column});
            }
            return transpose_pattern(scale, static_cast<std::size_t>(k), description);
        }
        if (kind == "stretch") {
            const Token& t = next(w, 1, "the new period, such as 1201c or 2^(1201/1200)");
            no_more(w, 2, "stretch PERIOD");
            return stretch_period(scale, interval_above_unison(t, "the new period"), description);
        }
        if (kind == "subset") {
            if (w.size() < 2)
                fail_at(end_column(w), "expected the degrees to keep, such as 0 2 4 5 7 9 11");
            std::vector<std::size_t> keep;
            long long previous = -1;
            for (std::size_t i = 1; i < w.size(); ++i) {
                long long d = whole(w[i], "a degree", 0, max_recipe_integer);
                if (d > last)
                    fail_at(w[i].column, "degree " + std::string(w[i].text) +
                                             " is out of range: the scale has degrees 0 to " +
                                             std::to_string(last));
                if (d <= previous)
                    fail_at(w[i].column, "list the degrees in rising order, each once");
                keep.push_back(static_cast<std::size_t>(d));
                previous = d;
            }
            return keep_degrees(scale, keep, description);
        }
        if (is_recipe_kind(kind))
            fail_at(w[0].column, "only one tuning per recipe; after '|' comes a modifier: mode, "
                                 "transpose, stretch or subset");
        fail_at(w[0].column, "unknown modifier " + in_quotes(kind) +
                                 "; after '|' comes mode, transpose, stretch or subset");
    }

    std::vector<Token> tokens_;
    std::vector<int> bar_columns_;
};

} // namespace

bool starts_like_recipe(std::string_view text) {
    std::size_t start = 0;
    while (start < text.size() && is_space(text[start]))
        ++start;
    std::size_t end = start;
    while (end < text.size() && !is_space(text[end]) && text[end] != ':' && text[end] != '|')
        ++end;
    return is_recipe_kind(text.substr(start, end - start));
}

Scale build_recipe(std::string_view text) {
    if (text.size() > max_recipe_length)
        fail_at(static_cast<int>(max_recipe_length) + 1,
                "the recipe is longer than " + std::to_string(max_recipe_length) + " characters");
    return RecipeReader(text).read();
}

} // namespace terzo
