// Property sweeps: seeded random tallies from the whole space
// users type into, against references computed outside the engine by
// tests/reference/sweep.py (scipy's Cephes special functions, statsmodels,
// 50-digit mpmath, a quantile-substitution quadrature written there; each
// row names its source), and invariants that hold whatever the reference:
// P(best) adds to 1, P(best) of two groups is P(ahead), ORDER is
// antisymmetric, bounds are ordered inside [0, 1], planning answers are
// monotone in their targets, expected losses are >= 0.
#include <gtest/gtest.h>

#include <cmath>
#include <cstdlib>
#include <fstream>
#include <map>
#include <sstream>

#include "reference.hpp"
#include "tallyrates/apart/limits.hpp"
#include "tallyrates/bayes/across.hpp"
#include "tallyrates/bayes/comparison.hpp"
#include "tallyrates/bayes/law.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/same_rates.hpp"
#include "tallyrates/omnibus/residuals.hpp"
#include "tallyrates/pairs/margin.hpp"
#include "tallyrates/pairs/one_rate.hpp"
#include "tallyrates/pairs/pairwise.hpp"
#include "tallyrates/planning/planning.hpp"
#include "tallyrates/omnibus/trend.hpp"
#include "tallyrates/omnibus/tarone.hpp"
#include "support.hpp"

using namespace tallyrates;
using tallyrates::testing::csv_fields;
using tallyrates::testing::fields;
using tallyrates::testing::split_ints;

namespace {

namespace cell = tallyrates::testing::cell;

struct sweep_row {
    std::string family, name, quantity, source;
    std::vector<std::int64_t> x, n;
    double value = 0;
};

std::vector<sweep_row> sweep_rows(const std::string& family) {
    std::ifstream in(TALLYRATES_REFERENCE_DIR "/sweep.csv");
    if (!in) throw std::runtime_error("cannot open sweep.csv");
    std::vector<sweep_row> rows;
    std::string line;
    std::getline(in, line);
    while (std::getline(in, line)) {
        auto f = csv_fields(line);
        if (f.size() != 7 || f[0] != family) continue;
        // strtod, not stod: a reference below 1e-308 is a subnormal number, which stod refuses.
        rows.push_back({f[0], f[1], f[4], f[6], split_ints(f[2]), split_ints(f[3]), std::strtod(f[5].c_str(), nullptr)});
    }
    return rows;
}

// |got - want| <= absolute + relative * |want|.
void expect_within(double got, double want, double absolute, double relative, const sweep_row& r) {
    EXPECT_LE(std::fabs(got - want), absolute + relative * std::fabs(want))
        << r.name << " " << r.quantity << ": got " << got << ", reference " << want << " (" << r.source << ")";
}

// The engine's promise for a probability: 1e-10 absolute, and 1e-8
// relative below 1e-3; below about 1e-90, absolute only (its windows cut the
// laws at 1e-100, bayes/across.hpp).
void expect_probability(double got, double want, const sweep_row& r) {
    if (std::fabs(want) < 1e-80) expect_within(got, want, 1e-90, 0, r);
    else if (std::fabs(want) < 1e-3) expect_within(got, want, 1e-300, 1e-8, r);
    else expect_within(got, want, 1e-10, 0, r);
}

bayes::goal goal_of(const std::string& s) { return s == "low" ? bayes::goal::low : bayes::goal::high; }

one_rate::method one_method(const std::string& s) {
    if (s == "clopper-pearson") return one_rate::method::clopper_pearson;
    if (s == "jeffreys") return one_rate::method::jeffreys;
    if (s == "agresti-coull") return one_rate::method::agresti_coull;
    return one_rate::method::wilson;
}

pairwise::interval_method diff_method(const std::string& s) {
    if (s == "miettinen-nurminen") return pairwise::interval_method::miettinen_nurminen;
    if (s == "agresti-caffo") return pairwise::interval_method::agresti_caffo;
    if (s == "wald") return pairwise::interval_method::wald;
    return pairwise::interval_method::newcombe;
}

adjust::p_values adjust_of(const std::string& s) {
    if (s == "holm") return adjust::p_values::holm;
    if (s == "hochberg") return adjust::p_values::hochberg;
    if (s == "benjamini-hochberg") return adjust::p_values::benjamini_hochberg;
    if (s == "bonferroni") return adjust::p_values::bonferroni;
    if (s == "sidak") return adjust::p_values::sidak;
    return adjust::p_values::none;
}

std::size_t count_cases(const std::vector<sweep_row>& rows) {
    std::map<std::string, int> names;
    for (const auto& r : rows) ++names[r.name];
    return names.size();
}

}  // namespace

TEST(Sweep, BayesAgainstQuadratureOutsideTheEngine) {
    const auto rows = sweep_rows("bayes");
    std::map<std::string, int> checked;
    for (const auto& r : rows) {
        const auto f = fields(r.quantity);
        const std::string& what = f[0];
        const auto c = counts::from_values(r.x, r.n);
        if (what == "best" || what == "loss") {
            const bayes::prior p{std::stod(f[2]), std::stod(f[3])};
            const auto laws = bayes::posteriors(c, p);
            const std::size_t i = std::stoul(f[4]) - 1;
            // Probabilities: the engine's promise, 1e-10 absolute and 1e-8
            // relative; the expected loss is a difference of rates.
            if (what == "best") expect_probability(bayes::best(laws, i, goal_of(f[1])), r.value, r);
            else expect_within(bayes::loss(laws, i, goal_of(f[1])), r.value, 1e-9, 0, r);
        } else if (what == "ahead") {
            const bayes::prior p{std::stod(f[1]), std::stod(f[2])};
            expect_probability(
                bayes::ahead(cell::posterior(c, std::stod(f[3]), p), cell::posterior(c, std::stod(f[4]), p)), r.value,
                r);
        } else if (what == "central_low" || what == "central_high") {
            const bayes::prior p{std::stod(f[1]), std::stod(f[2])};
            const auto b = bayes::credible(cell::posterior(c, std::stod(f[3]), p), std::stod(f[4]), bayes::kind::central);
            expect_within(what == "central_low" ? b.low : b.high, r.value, 1e-10, 1e-8, r);
        } else if (what == "hpd_low" || what == "hpd_high") {
            const bayes::prior p{std::stod(f[1]), std::stod(f[2])};
            const auto b = bayes::credible(cell::posterior(c, std::stod(f[3]), p), std::stod(f[4]), bayes::kind::hpd);
            expect_within(what == "hpd_low" ? b.low : b.high, r.value, 1e-10, 0, r);
        } else if (what == "above") {
            const bayes::prior p{std::stod(f[2]), std::stod(f[3])};
            expect_within(bayes::above(cell::posterior(c, std::stod(f[4]), p), std::stod(f[5]), goal_of(f[1])), r.value,
                          1e-12, 1e-9, r);
        } else if (what == "next") {
            const bayes::prior p{std::stod(f[1]), std::stod(f[2])};
            expect_probability(
                bayes::next_at_least(cell::posterior(c, std::stod(f[3]), p), std::stoll(f[4]), std::stoll(f[5])),
                r.value, r);
        } else {
            ADD_FAILURE() << "unknown quantity " << r.quantity;
        }
        ++checked[what];
    }
    const auto cases = count_cases(rows);
    std::cout << "bayes sweep: " << cases << " tallies, " << rows.size() << " rows\n";
    EXPECT_GE(cases, 250u);
    EXPECT_GE(checked["best"], 800);
    EXPECT_GE(checked["next"], 200);
    EXPECT_GE(checked["hpd_low"], 50);
}

TEST(Sweep, PairsAgainstStatsmodelsAndScipy) {
    const auto rows = sweep_rows("pairs");
    std::map<std::string, int> checked;
    for (const auto& r : rows) {
        const auto f = fields(r.quantity);
        const std::string& what = f[0];
        const auto c = counts::from_values(r.x, r.n);
        if (what == "one_low" || what == "one_high") {
            const auto b = cell::one_bounds(c, std::stod(f[2]), std::stod(f[3]), one_method(f[1]));
            expect_within(what == "one_low" ? b.low : b.high, r.value, 1e-10, 1e-9, r);
        } else if (what == "diff_low" || what == "diff_high") {
            pairwise::interval_options o;
            o.level = std::stod(f[4]);
            o.how = diff_method(f[1]);
            o.adjust = adjust::simultaneous::none;
            const auto b = cell::difference_interval(c, std::stod(f[2]), std::stod(f[3]), o);
            // The Miettinen-Nurminen reference is a bisection inside a
            // bisection (pairs.py), settled to about 1e-8.
            expect_within(what == "diff_low" ? b.low : b.high, r.value, f[1] == "miettinen-nurminen" ? 5e-8 : 1e-9, 1e-9, r);
        } else if (what == "diff_low_family" || what == "diff_high_family") {
            pairwise::interval_options o;
            o.level = std::stod(f[5]);
            o.how = pairwise::interval_method::newcombe;
            o.adjust = f[1] == "sidak" ? adjust::simultaneous::sidak : adjust::simultaneous::bonferroni;
            o.comparisons = f[2] == "against" ? pairwise::family::against : pairwise::family::all;
            const auto b = cell::difference_interval(c, std::stod(f[3]), std::stod(f[4]), o);
            expect_within(what == "diff_low_family" ? b.low : b.high, r.value, 1e-9, 1e-9, r);
        } else if (what == "pair_p_against") {
            pairwise::test_options o;
            o.adjust = adjust_of(f[1]);
            o.comparisons = pairwise::family::against;
            expect_within(cell::same_rate_p(c, std::stod(f[2]), std::stod(f[3]), o), r.value, 1e-14, 1e-8, r);
        } else if (what == "pair_p") {
            pairwise::test_options o;
            o.adjust = adjust_of(f[1]);
            expect_within(cell::same_rate_p(c, std::stod(f[2]), std::stod(f[3]), o), r.value, 1e-14, 1e-8, r);
        } else {
            ADD_FAILURE() << "unknown quantity " << r.quantity;
        }
        ++checked[what];
    }
    const auto cases = count_cases(rows);
    std::cout << "pairs sweep: " << cases << " tallies, " << rows.size() << " rows\n";
    EXPECT_GE(cases, 250u);
    EXPECT_GE(checked["diff_low"], 700);
    EXPECT_GE(checked["pair_p"], 300);
    EXPECT_GE(checked["diff_low_family"], 150);
    EXPECT_GE(checked["pair_p_against"], 50);
}

TEST(Sweep, OmnibusAgainstScipyAndStatsmodels) {
    const auto rows = sweep_rows("omnibus");
    for (const auto& r : rows) {
        const auto f = fields(r.quantity);
        const std::string& what = f[0];
        const auto c = counts::from_values(r.x, r.n);
        if (what == "pearson_stat" || what == "lr_stat") {
            const auto t = omnibus::table_of(c);
            expect_within(omnibus::statistic(t, what == "lr_stat" ? omnibus::ordering::lr : omnibus::ordering::pearson),
                          r.value, 1e-9, 1e-9, r);
        } else if (what == "pearson_p") {
            omnibus::options o;
            o.how = omnibus::method::pearson;
            expect_within(omnibus::same_rates(c, o).p, r.value, 1e-300, 1e-7, r);
        } else if (what == "resid") {
            const auto res = omnibus::adjusted_residuals(c);
            const auto& v = res.at(std::stoul(f[1]) - 1);
            ASSERT_TRUE(v.has_value()) << r.name;
            expect_within(*v, r.value, 1e-9, 1e-9, r);
        } else if (what == "trend_z_conditional") {
            expect_within(trend::test(c, {}, trend::variance::conditional).z, r.value, 1e-9, 1e-9, r);
        } else {
            ADD_FAILURE() << "unknown quantity " << r.quantity;
        }
    }
    const auto cases = count_cases(rows);
    std::cout << "omnibus sweep: " << cases << " tallies, " << rows.size() << " rows\n";
    EXPECT_GE(cases, 250u);
}

TEST(Sweep, PlanningAgainstDirectSearch) {
    const auto rows = sweep_rows("planning");
    std::map<std::string, int> checked;
    for (const auto& r : rows) {
        const auto f = fields(r.quantity);
        const std::string& what = f[0];
        std::int64_t got = -1;
        if (what == "demo") got = planning::demonstration(std::stod(f[1]), std::stod(f[2]), std::stoll(f[3]));
        else if (what == "width") got = planning::width(std::stod(f[1]), std::stod(f[2]), std::stod(f[3]), one_method(f[4]));
        else if (what == "power" || what == "power_cc")
            got = planning::power(std::stod(f[1]), std::stod(f[2]), std::stod(f[3]), std::stod(f[4]),
                                  what == "power" ? planning::correction::none : planning::correction::continuity);
        else if (what == "more")
            got = planning::more_units(std::stod(f[1]), std::stod(f[2]), std::stoll(f[3]), std::stoll(f[4]));
        else if (what == "power_ratio" || what == "power_ratio_cc")
            got = planning::power(std::stod(f[1]), std::stod(f[2]), std::stod(f[3]), std::stod(f[4]),
                                  what == "power_ratio" ? planning::correction::none : planning::correction::continuity,
                                  std::stod(f[5]));
        else if (what == "ahead") {
            // Pilot at position 1, the running line at 2, a prior that need not be whole.
            const auto c = counts::from_values(r.x, r.n);
            const bayes::prior p{std::stod(f[1]), std::stod(f[2])};
            got = planning::ahead(cell::posterior(c, 1, p), cell::posterior(c, 2, p), std::stod(f[3]));
        }
        else ADD_FAILURE() << "unknown quantity " << r.quantity;
        EXPECT_EQ(static_cast<double>(got), r.value) << r.name << " " << r.quantity << " (" << r.source << ")";
        ++checked[what];
    }
    std::cout << "planning sweep: " << rows.size() << " targets (demo " << checked["demo"] << ", width "
              << checked["width"] << ", power " << checked["power"] << ", corrected power " << checked["power_cc"]
              << ", pilot runs " << checked["ahead"] << ", further units " << checked["more"]
              << ", unequal groups " << checked["power_ratio"] + checked["power_ratio_cc"] << ")\n";
    EXPECT_GE(checked["more"], 60);
    EXPECT_GE(checked["power_ratio"] + checked["power_ratio_cc"], 50);
    EXPECT_GE(checked["power_cc"], 50);
    EXPECT_GE(checked["ahead"], 5);
    EXPECT_GE(rows.size(), 250u);
}

// ---- invariants on tallies drawn here (no reference needed) ----

namespace {

// A deterministic draw from the engine's own specified generator would tie
// the test to the engine; a tiny linear congruential generator (Knuth's MMIX
// constants) is enough to spread tallies over the space.
struct draw {
    std::uint64_t state;
    double uniform() {
        state = state * 6364136223846793005ULL + 1442695040888963407ULL;
        return static_cast<double>(state >> 11) * 0x1.0p-53;
    }
    std::int64_t attempts() { return static_cast<std::int64_t>(std::pow(10.0, 7 * uniform())); }
    std::int64_t successes(std::int64_t n) {
        const double u = uniform();
        if (u < 0.1) return 0;
        if (u < 0.2) return n;
        const double p = u < 0.35 ? std::pow(10.0, -4 + 3 * uniform()) : u < 0.5 ? 1 - std::pow(10.0, -4 + 3 * uniform())
                                                                                  : uniform();
        return std::min(n, static_cast<std::int64_t>(std::floor(p * static_cast<double>(n) + uniform())));
    }
};

}  // namespace

TEST(Sweep, ClaimsAgainstMpmathAndScipy) {
    // Margins (Farrington & Manning 1990 in 50-digit mpmath), one-sided
    // Clopper-Pearson bounds (scipy beta.ppf) and one-sided
    // Miettinen-Nurminen bounds (pairs.py), random tallies of mixed sizes.
    const auto rows = sweep_rows("claims");
    std::map<std::string, int> checked;
    for (const auto& r : rows) {
        const auto f = fields(r.quantity);
        const std::string& what = f[0];
        const auto c = counts::from_values(r.x, r.n);
        if (what == "margin") {
            const auto claim = f[1] == "not-worse" ? pairwise::claim::not_worse
                               : f[1] == "better"  ? pairwise::claim::better
                                                   : pairwise::claim::equivalent;
            const auto [a, b] = pairwise::pair_at(c, std::stod(f[4]), std::stod(f[5]));
            const double p = pairwise::margin_p(a, b, std::stod(f[3]), claim, goal_of(f[2]));
            // The statistic's rounding at 10^7 attempts moves a p near 1e-12 by
            // about 1e-9 of itself; a p below 1e-300 is 0 in both.
            expect_within(p, r.value, 1e-12, 1e-8, r);
        } else if (what == "sided_low" || what == "sided_high") {
            const auto& g = c.with_attempts_at(std::stod(f[1]), "i");
            const auto b = one_rate::bounds(g, std::stod(f[2]), one_rate::method::clopper_pearson, sides::one);
            expect_within(what == "sided_low" ? b.low : b.high, r.value, 1e-12, 1e-9, r);
        } else if (what == "diffsided_low" || what == "diffsided_high") {
            pairwise::interval_options o;
            o.level = std::stod(f[3]);
            o.adjust = adjust::simultaneous::none;
            o.side = sides::one;
            const auto b = cell::difference_interval(c, std::stod(f[1]), std::stod(f[2]), o);
            expect_within(what == "diffsided_low" ? b.low : b.high, r.value, 5e-8, 1e-9, r);
        } else {
            ADD_FAILURE() << "unknown quantity " << r.quantity;
        }
        ++checked[what];
    }
    std::cout << "claims sweep: " << count_cases(rows) << " tallies, " << rows.size() << " rows\n";
    EXPECT_GE(checked["margin"], 120);
    EXPECT_GE(checked["sided_low"], 120);
    EXPECT_GE(checked["diffsided_low"], 25);
}

TEST(Sweep, ApartAgainstScipyAndEnumeration) {
    // Decision limits on random tallies of mixed sizes: normal limits from
    // scipy norm, exact limits against a standard from scipy binom, exact
    // limits of every group at once by enumerating every table (small
    // tallies), Tarone's z in exact fractions.
    const auto rows = sweep_rows("apart");
    std::map<std::string, int> checked;
    for (const auto& r : rows) {
        const auto f = fields(r.quantity);
        const auto c = counts::from_values(r.x, r.n);
        if (f[0] == "tarone_z") {
            // The numerator is a difference of two sums of size N: at 10^6 and
            // more units near 100 % about 1e-10 of z is lost to cancellation.
            expect_within(omnibus::tarone(c).z, r.value, 1e-12, 1e-9, r);
            ++checked[f[0]];
            continue;
        }
        ASSERT_EQ(f.size(), 7u) << r.quantity;
        apart::options o;
        o.how = f[0] == "normal" ? apart::method::normal : apart::method::exact;
        o.together = f[1] == "each" ? apart::family::each : apart::family::all;
        if (f[2] != "none") o.target = std::stod(f[2]);
        o.variation = f[3] == "time" ? apart::spread::time : apart::spread::none;
        o.level = std::stod(f[4]);
        const auto res = apart::limits(c, o);
        const auto& lim = res.rows.at(std::stoul(f[5]) - 1).limits;
        // Exact limits are whole counts over n (equal); normal ones formulas.
        expect_within(f[6] == "low" ? lim.low : lim.high, r.value, o.how == apart::method::exact ? 0.0 : 1e-12, 1e-12,
                      r);
        ++checked[f[0] + "|" + f[1]];
    }
    std::cout << "apart sweep: " << count_cases(rows) << " tallies, " << rows.size() << " rows\n";
    EXPECT_GE(checked["normal|all"], 100);
    EXPECT_GE(checked["exact|each"], 100);
    EXPECT_GE(checked["exact|all"], 30);
    EXPECT_GE(checked["tarone_z"], 100);
}

TEST(Sweep, BayesianInvariants) {
    draw d{20261205};
    int tallies = 0;
    for (int t = 0; t < 100; ++t) {
        const std::size_t groups = 2 + static_cast<std::size_t>(d.uniform() * (t % 10 == 0 ? 29 : 6));
        std::vector<bayes::beta_law> laws;
        const double pa = t % 3 == 0 ? 1.0 : t % 3 == 1 ? 0.5 : 0.05 + 99.95 * d.uniform() * d.uniform();
        for (std::size_t g = 0; g < groups; ++g) {
            const auto n = d.attempts();
            const auto x = d.successes(n);
            laws.push_back({pa + static_cast<double>(x), pa + static_cast<double>(n - x)});
        }
        for (const auto g : {bayes::goal::high, bayes::goal::low}) {
            double total = 0;
            for (std::size_t i = 0; i < groups; ++i) {
                const double b = bayes::best(laws, i, g);
                EXPECT_GE(b, 0.0);
                EXPECT_LE(b, 1.0);
                total += b;
                EXPECT_GE(bayes::loss(laws, i, g), 0.0);
            }
            EXPECT_NEAR(total, 1.0, 1e-9) << "tally " << t << ", " << groups << " groups";
        }
        const std::span<const bayes::beta_law> two(laws.data(), 2);
        const double ahead = bayes::ahead(laws[0], laws[1]);
        EXPECT_NEAR(bayes::best(two, 0, bayes::goal::high), ahead, 1e-9 + 1e-8 * ahead) << "tally " << t;
        EXPECT_NEAR(ahead + bayes::ahead(laws[1], laws[0]), 1.0, 1e-9) << "tally " << t;
        for (const auto how : {bayes::kind::central, bayes::kind::hpd}) {
            const auto b = bayes::credible(laws[0], 0.9, how);
            EXPECT_LE(0.0, b.low);
            EXPECT_LE(b.low, b.high);
            EXPECT_LE(b.high, 1.0);
        }
        ++tallies;
    }
    std::cout << "bayes invariants: " << tallies << " tallies, both goals\n";
}

TEST(Sweep, PairAndOneRateInvariants) {
    draw d{7};
    for (int t = 0; t < 400; ++t) {
        const auto n1 = d.attempts(), n2 = d.attempts();
        const std::vector<std::int64_t> x{d.successes(n1), d.successes(n2)}, n{n1, n2};
        const auto c = counts::from_values(x, n);
        const double level = 0.5 + 0.4999 * d.uniform();
        for (const auto m : {one_rate::method::wilson, one_rate::method::clopper_pearson, one_rate::method::jeffreys,
                             one_rate::method::agresti_coull}) {
            const auto b = cell::one_bounds(c, 1, level, m);
            const double rate = static_cast<double>(x[0]) / static_cast<double>(n1);
            EXPECT_LE(0.0, b.low);
            EXPECT_LE(b.low, b.high);
            EXPECT_LE(b.high, 1.0);
            if (m != one_rate::method::agresti_coull) {  // its centre is shifted: it may leave out x / n
                EXPECT_LE(b.low, rate + 1e-12) << t;
                EXPECT_GE(b.high, rate - 1e-12) << t;
            }
        }
        pairwise::interval_options o;
        o.level = level;
        for (const auto m : {pairwise::interval_method::newcombe, pairwise::interval_method::miettinen_nurminen,
                             pairwise::interval_method::agresti_caffo, pairwise::interval_method::wald}) {
            o.how = m;
            const auto b = cell::difference_interval(c, 1, 2, o);
            EXPECT_LE(-1.0, b.low);
            EXPECT_LE(b.low, b.high);
            EXPECT_LE(b.high, 1.0);
        }
        const double p = cell::same_rate_p(c, 1, 2, pairwise::test_options{});
        EXPECT_GE(p, 0.0);
        EXPECT_LE(p, 1.0);
    }
}

TEST(Sweep, PlanningIsMonotoneInItsTargets) {
    draw d{11};
    for (int t = 0; t < 200; ++t) {
        const double rate = 1 - std::pow(10.0, -0.3 - 3.5 * d.uniform());
        const double conf = 0.5 + 0.49 * d.uniform();
        const auto failures = static_cast<std::int64_t>(4 * d.uniform());
        const auto n = planning::demonstration(rate, conf, failures);
        // A stricter target never needs fewer attempts.
        EXPECT_LE(n, planning::demonstration(rate, std::min(0.999, conf + 0.005), failures)) << t;
        EXPECT_LE(n, planning::demonstration(1 - (1 - rate) * 0.9, conf, failures)) << t;
        EXPECT_LE(n, planning::demonstration(rate, conf, failures + 1)) << t;
        const double p1 = 0.01 + 0.98 * d.uniform(), p2 = std::clamp(p1 + (d.uniform() - 0.5) * 0.4, 0.001, 0.999);
        if (std::fabs(p1 - p2) > 1e-3) {
            const auto a = planning::power(p1, p2, 0.8, 0.05, planning::correction::none);
            EXPECT_LE(a, planning::power(p1, p2, 0.9, 0.05, planning::correction::none));
            EXPECT_LE(a, planning::power(p1, p2, 0.8, 0.01, planning::correction::none));
            EXPECT_LE(a, planning::power(p1, p2, 0.8, 0.05, planning::correction::continuity));
        }
        const double half = std::pow(10.0, -2.5 + 1.7 * d.uniform()), r = d.uniform();
        // Widths saw-tooth in n, but the smallest n that meets a half-width
        // cannot fall when the half-width shrinks.
        EXPECT_LE(planning::width(r, half * 1.1, 0.95, one_rate::method::wilson),
                  planning::width(r, half, 0.95, one_rate::method::wilson))
            << r << " " << half;
        const bayes::beta_law pilot{1 + 20 * d.uniform(), 1 + 2 * d.uniform()}, other{900, 60};
        EXPECT_LE(planning::ahead(pilot, other, 0.8), planning::ahead(pilot, other, 0.9)) << t;
    }
}
