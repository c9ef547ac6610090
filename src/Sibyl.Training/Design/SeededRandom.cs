namespace Sibyl.Training.Design;

/// <summary>
/// xoshiro256** (Blackman &amp; Vigna 2021, ACM Trans. Math. Softw. 47, 36), seeded through SplitMix64 as its
/// authors recommend. Written out here rather than taken from <see cref="Random"/> because a design must be
/// reproducible from its seed on every machine and every future runtime, and the runtime does not promise that
/// its seeded sequence never changes.
/// </summary>
public sealed class SeededRandom
{
    private ulong _s0, _s1, _s2, _s3;

    /// <summary>Creates a generator whose whole sequence is fixed by <paramref name="seed"/>.</summary>
    public SeededRandom(ulong seed)
    {
        ulong state = seed;
        _s0 = SplitMix64(ref state);
        _s1 = SplitMix64(ref state);
        _s2 = SplitMix64(ref state);
        _s3 = SplitMix64(ref state);
    }

    /// <summary>Next 64 random bits.</summary>
    public ulong NextBits()
    {
        ulong result = ulong.RotateLeft(_s1 * 5, 7) * 9;
        ulong t = _s1 << 17;
        _s2 ^= _s0;
        _s3 ^= _s1;
        _s1 ^= _s2;
        _s0 ^= _s3;
        _s2 ^= t;
        _s3 = ulong.RotateLeft(_s3, 45);
        return result;
    }

    /// <summary>Uniform in [0, 1), with 53 random bits.</summary>
    public double NextDouble() => (NextBits() >> 11) * (1.0 / (1UL << 53));

    /// <summary>Uniform integer in [0, <paramref name="count"/>), without modulo bias (Lemire 2019).</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="count"/> is not positive.</exception>
    public int NextInt(int count)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(count);
        ulong range = (ulong)count;
        ulong product = Math.BigMul(NextBits(), range, out ulong low);
        if (low < range)
        {
            ulong threshold = (0UL - range) % range;
            while (low < threshold)
            {
                product = Math.BigMul(NextBits(), range, out low);
            }
        }

        return (int)product;
    }

    /// <summary>A seed for an independent stream, derived from this one (for example the held-out design).</summary>
    public static ulong Derive(ulong seed, ulong stream)
    {
        ulong state = seed ^ (0x9E3779B97F4A7C15UL * (stream + 1));
        return SplitMix64(ref state);
    }

    private static ulong SplitMix64(ref ulong state)
    {
        ulong z = state += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }
}
