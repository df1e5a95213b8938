// random.hpp (detail) - our fully specified generator, so Monte Carlo results are
// bit-identical on every machine and compiler.
//
// xoshiro256** 1.0 and its jump function (Blackman & Vigna 2018, "Scrambled
// linear pseudorandom number generators", ACM TOMS 47:36, 2021), state filled
// from SplitMix64 (Steele, Lea & Flood 2014, OOPSLA). The C++ standard leaves
// std:: distributions implementation-defined, so none are used: uniforms are
// formed from the top 53 bits, and samplers use only + - * / (see
// hypergeometric.hpp).
#pragma once

#include <cstdint>

namespace tallyrates::detail {

class splitmix64 {
public:
    explicit splitmix64(std::uint64_t seed) : state_(seed) {}
    std::uint64_t next() {
        std::uint64_t z = (state_ += 0x9e3779b97f4a7c15ULL);
        z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9ULL;
        z = (z ^ (z >> 27)) * 0x94d049bb133111ebULL;
        return z ^ (z >> 31);
    }

private:
    std::uint64_t state_;
};

class xoshiro256ss {
public:
    explicit xoshiro256ss(std::uint64_t seed) {
        splitmix64 sm(seed);
        for (auto& w : s_) w = sm.next();
    }
    std::uint64_t next() {
        const std::uint64_t result = rotl(s_[1] * 5, 7) * 9;
        const std::uint64_t t = s_[1] << 17;
        s_[2] ^= s_[0];
        s_[3] ^= s_[1];
        s_[1] ^= s_[2];
        s_[0] ^= s_[3];
        s_[2] ^= t;
        s_[3] = rotl(s_[3], 45);
        return result;
    }
    // Equivalent to 2^128 calls of next(): gives non-overlapping streams.
    void jump() {
        static constexpr std::uint64_t poly[] = {0x180ec6d33cfd0abaULL, 0xd5a61266f0c9392cULL,
                                                 0xa9582618e03fc9aaULL, 0x39abdc4529b1661cULL};
        std::uint64_t t[4] = {0, 0, 0, 0};
        for (std::uint64_t p : poly)
            for (int b = 0; b < 64; ++b) {
                if (p & (std::uint64_t{1} << b))
                    for (int i = 0; i < 4; ++i) t[i] ^= s_[i];
                next();
            }
        for (int i = 0; i < 4; ++i) s_[i] = t[i];
    }
    // Uniform on [0, 1) with 53 random bits; exact in binary floating point.
    double uniform() { return static_cast<double>(next() >> 11) * 0x1.0p-53; }

private:
    static std::uint64_t rotl(std::uint64_t x, int k) { return (x << k) | (x >> (64 - k)); }
    std::uint64_t s_[4];
};

}  // namespace tallyrates::detail
