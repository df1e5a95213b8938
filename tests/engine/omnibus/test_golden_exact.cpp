// Golden exact p-values: p, p_low and p_high of the exact route for every
// table of tests/reference/ (every family), every golden table and the 2 x 12
// speed tables that finish within a second, in all three orderings, written
// by the enumeration that preceded the k-way merge network (commit da9bd6a)
// and kept in tests/golden/exact.txt.
//
// Not a check of correctness (test_omnibus.cpp compares the exact route with
// an independent rational enumeration and scipy); it pins that the faster
// enumeration gives the same p-values. Summation order differs between the
// two, so values are compared at 1e-12 relative (the rational rows are
// checked at the same tolerance), not bit for bit.
// Rewrite the file only on purpose:
//   TALLYRATES_GOLDEN_WRITE=tests/golden/exact.txt build/tests/engine_golden_exact
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <fstream>
#include <map>
#include <set>
#include <sstream>
#include <string>
#include <vector>

#include "golden_cases.hpp"
#include "reference.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/omnibus/same_rates.hpp"

namespace {

using namespace tallyrates;
using omnibus::ordering;

struct exact_case {
    std::string name;
    std::vector<std::int64_t> x, n;
};

std::vector<exact_case> cases() {
    std::vector<exact_case> out;
    std::set<std::pair<std::vector<std::int64_t>, std::vector<std::int64_t>>> seen;
    auto add = [&](const std::string& name, const std::vector<std::int64_t>& x, const std::vector<std::int64_t>& n) {
        if (x.size() >= 2 && x.size() == n.size() && seen.emplace(x, n).second) out.push_back({name, x, n});
    };
    for (const auto& g : tallyrates::testing::golden_tables()) add(g.name, g.x, g.n);
    // Every distinct table of the families' reference tables with at least two groups.
    for (const char* file : tallyrates::testing::family_tables)
        for (const auto& r : tallyrates::testing::reference_rows(file, "")) add(r.name, r.successes, r.attempts);
    for (const auto& u : {tallyrates::testing::unequal_twelve("unequal_120_mid", 120, 0.35, 0.65),
                          tallyrates::testing::unequal_twelve("unequal_150_far", 150, 0.10, 0.83),
                          tallyrates::testing::unequal_twelve("unequal_240_mid", 240, 0.35, 0.65)})
        add(u.name, u.x, u.n);
    // In the golden file's order, so that it does not depend on how the
    // reference tables are split. A table added to the reference files
    // later has no value from the enumeration before the merge: it is left
    // out (the exact route's checks against rational enumeration cover it),
    // unless the file is being written.
    std::map<std::string, std::size_t> place;
    for (const auto& line : tallyrates::testing::read_lines(TALLYRATES_GOLDEN_EXACT_FILE))
        place.emplace(line.substr(0, line.find(' ')), place.size());
    if (!std::getenv("TALLYRATES_GOLDEN_WRITE"))
        std::erase_if(out, [&](const exact_case& c) { return !place.contains(c.name); });
    std::stable_sort(out.begin(), out.end(), [&](const exact_case& a, const exact_case& b) {
        const auto pa = place.find(a.name), pb = place.find(b.name);
        return (pa == place.end() ? place.size() : pa->second) < (pb == place.end() ? place.size() : pb->second);
    });
    return out;
}

// One line per case and ordering: name, ordering, then p p_low p_high, or
// "refused" when the enumeration does not fit these caps.
std::vector<std::string> lines_now() {
    std::vector<std::string> out;
    for (const auto& c : cases()) {
        omnibus::table t;
        try {
            t = omnibus::table_of(counts::from_values(c.x, c.n));
        } catch (const invalid_input&) {
            continue;  // rows of other functions with fewer than two groups of attempts
        }
        if (t.groups() < 2 || t.all_alike()) continue;
        for (auto [o, word] : {std::pair{ordering::pearson, "x2"}, std::pair{ordering::lr, "g2"},
                               std::pair{ordering::probability, "prob"}}) {
            const auto e = omnibus::exact_p(t, o, 1ull << 26, 1u << 22);
            std::string line = c.name + " " + word;
            using tallyrates::testing::hex;
            line += e.complete ? " " + hex(e.p) + " " + hex(e.p_low) + " " + hex(e.p_high) : " refused";
            out.push_back(line);
        }
    }
    return out;
}

double from_hex(const std::string& s) { return std::strtod(s.c_str(), nullptr); }

}  // namespace

TEST(GoldenExact, PValuesAsBeforeTheKWayMerge) {
    const auto now = lines_now();
    if (tallyrates::testing::write_if_asked(now)) GTEST_SKIP() << "wrote the golden file";
    const auto before = tallyrates::testing::read_lines(TALLYRATES_GOLDEN_EXACT_FILE);
    ASSERT_EQ(before.size(), now.size()) << "line count differs from " TALLYRATES_GOLDEN_EXACT_FILE;
    std::size_t compared = 0;
    for (std::size_t k = 0; k < now.size(); ++k) {
        std::istringstream a(before[k]), b(now[k]);
        std::string name_a, word_a, name_b, word_b;
        a >> name_a >> word_a;
        b >> name_b >> word_b;
        ASSERT_EQ(name_a + " " + word_a, name_b + " " + word_b) << "line " << k + 1;
        std::vector<std::string> va, vb;
        for (std::string s; a >> s;) va.push_back(s);
        for (std::string s; b >> s;) vb.push_back(s);
        // A table refused before may now fit; one that fitted must still fit.
        if (va.size() == 1) continue;
        ASSERT_EQ(vb.size(), 3u) << before[k] << " now " << now[k];
        for (std::size_t i = 0; i < 3; ++i) {
            const double x = from_hex(va[i]), y = from_hex(vb[i]);
            EXPECT_LE(std::fabs(x - y), 1e-12 * std::fabs(x)) << before[k] << " now " << now[k];
        }
        ++compared;
    }
    EXPECT_GE(compared, 140u);
}
