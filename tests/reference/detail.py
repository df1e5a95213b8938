#!/usr/bin/python3
"""Reference rows for the engine's internals shared by several families
(engine/src/detail/), each from outside the engine:

- hypergeometric: P(X = x) for draws from a population with marked items, as
  the exact ratio C(K, x) C(M - K, n - x) / C(M, n) in 50-digit mpmath, beside
  scipy.stats.hypergeom.pmf (the two must agree to 1e-12 relative here);
- xoshiro256**: the first outputs of the generator seeded through SplitMix64,
  and after one jump, from a Python transcription of the published algorithm
  (Blackman & Vigna 2018, ACM TOMS 47:36; Steele, Lea & Flood 2014 for
  SplitMix64) written from the paper, not from the engine's code: a second
  implementation, not a library.

Writes detail.csv (quantity, inputs, value, source):

    /usr/bin/python3 tests/reference/detail.py > tests/reference/detail.csv
"""
import csv
import sys

import mpmath
import scipy
from scipy.stats import hypergeom

MASK = (1 << 64) - 1


def hypergeometric_rows():
    cases = [(20, 7, 12), (500, 37, 120), (10000, 9000, 600), (60, 30, 30), (1000000, 500000, 40)]
    out = []
    for population, marked, draws in cases:
        low, high = max(0, draws - (population - marked)), min(draws, marked)
        mode = (draws + 1) * (marked + 1) // (population + 2)
        for x in sorted({low, high, mode, (low + mode) // 2, (mode + high) // 2}):
            with mpmath.workdps(50):
                exact = mpmath.binomial(marked, x) * mpmath.binomial(population - marked, draws - x) / mpmath.binomial(
                    population, draws)
            value = float(exact)
            if value < 1e-250:
                continue  # below what a double of the engine's tables holds
            check = hypergeom(population, marked, draws).pmf(x)
            assert abs(check - value) <= 1e-9 * value, (population, marked, draws, x, check, value)
            out.append(("hypergeometric", "%d %d %d %d" % (population, marked, draws, x), repr(value),
                        "mpmath %s binomial ratio, 50 digits; scipy %s hypergeom.pmf agrees" %
                        (mpmath.__version__, scipy.__version__)))
    return out


def rotl(x, k):
    return ((x << k) | (x >> (64 - k))) & MASK


class Xoshiro:
    """xoshiro256** 1.0 as published (Blackman & Vigna 2018), state from SplitMix64."""

    JUMP = (0x180EC6D33CFD0ABA, 0xD5A61266F0C9392C, 0xA9582618E03FC9AA, 0x39ABDC4529B1661C)

    def __init__(self, seed):
        self.s = []
        state = seed
        for _ in range(4):
            state = (state + 0x9E3779B97F4A7C15) & MASK
            z = state
            z = ((z ^ (z >> 30)) * 0xBF58476D1CE4E5B9) & MASK
            z = ((z ^ (z >> 27)) * 0x94D049BB133111EB) & MASK
            self.s.append(z ^ (z >> 31))

    def next(self):
        s = self.s
        result = (rotl((s[1] * 5) & MASK, 7) * 9) & MASK
        t = (s[1] << 17) & MASK
        s[2] ^= s[0]
        s[3] ^= s[1]
        s[1] ^= s[2]
        s[0] ^= s[3]
        s[2] ^= t
        s[3] = rotl(s[3], 45)
        return result

    def jump(self):
        acc = [0, 0, 0, 0]
        for word in self.JUMP:
            for bit in range(64):
                if word & (1 << bit):
                    acc = [a ^ b for a, b in zip(acc, self.s)]
                self.next()
        self.s = acc


def generator_rows():
    out = []
    source = "Python transcription of xoshiro256** 1.0 and SplitMix64 (Blackman & Vigna 2018)"
    for seed in (0, 1, 20260101):
        g = Xoshiro(seed)
        for k in range(3):
            out.append(("xoshiro_next", "%d %d" % (seed, k), str(g.next()), source))
        g.jump()
        for k in range(2):
            out.append(("xoshiro_after_jump", "%d %d" % (seed, k), str(g.next()), source))
    return out


def main():
    w = csv.writer(sys.stdout, lineterminator="\n")
    w.writerow(["quantity", "inputs", "value", "source"])
    for row in hypergeometric_rows() + generator_rows():
        w.writerow(row)


if __name__ == "__main__":
    main()
