namespace ThermVerify.Tolerances;

/// <summary>
/// The random stream of one unit, derived from the run's seed and the unit's index alone, so that a unit draws
/// the same parts whichever thread builds it. SplitMix64 (Steele, Lea, Flood, "Fast splittable pseudorandom number
/// generators", OOPSLA 2014) both mixes seed and index into a state and generates from it.
/// </summary>
internal struct UnitRandom
{
    private const ulong Gamma = 0x9E3779B97F4A7C15UL;
    private ulong state;
    private double spareNormal;
    private bool hasSpare;

    public UnitRandom(ulong seed, long unitIndex)
    {
        state = Mix(Mix(seed) ^ (ulong)unitIndex * 0xD1B54A32D192ED03UL);
        spareNormal = 0;
        hasSpare = false;
    }

    public ulong NextUInt64()
    {
        state += Gamma;
        return Mix(state);
    }

    /// <summary>Uniform on [0, 1), 53 random bits.</summary>
    public double NextUnit() => (NextUInt64() >> 11) * (1.0 / (1UL << 53));

    /// <summary>Standard normal by the Box–Muller transform (Box and Muller, Ann. Math. Statist. 29 (1958) 610).</summary>
    public double NextStandardNormal()
    {
        if (hasSpare)
        {
            hasSpare = false;
            return spareNormal;
        }
        var u1 = 1 - NextUnit(); // (0, 1]: the logarithm stays finite
        var u2 = NextUnit();
        var radius = Math.Sqrt(-2 * Math.Log(u1));
        spareNormal = radius * Math.Sin(2 * Math.PI * u2);
        hasSpare = true;
        return radius * Math.Cos(2 * Math.PI * u2);
    }

    private static ulong Mix(ulong z)
    {
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }
}
