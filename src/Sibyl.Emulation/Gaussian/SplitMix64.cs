namespace Sibyl.Emulation.Gaussian;

/// <summary>
/// Steele, Lea &amp; Flood (2014), "Fast splittable pseudorandom number generators", OOPSLA: a tiny seeded generator,
/// so that optimiser restarts are reproducible on every platform and runtime version.
/// </summary>
internal struct SplitMix64(ulong seed)
{
    private ulong _state = seed;

    public ulong NextUInt64()
    {
        ulong z = _state += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    /// <summary>Uniform in [0, 1) with 53 random bits.</summary>
    public double NextDouble() => (NextUInt64() >> 11) * (1.0 / (1UL << 53));
}
