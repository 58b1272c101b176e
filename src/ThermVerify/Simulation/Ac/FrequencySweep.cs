namespace ThermVerify.Simulation;

/// <summary>The frequencies of an AC or noise analysis.</summary>
internal sealed record FrequencySweep
{
    private FrequencySweep(double[] frequencies) => FrequenciesHertz = frequencies;

    public IReadOnlyList<double> FrequenciesHertz { get; }

    /// <summary>Logarithmic sweep, <paramref name="pointsPerDecade"/> points per decade, both ends included.</summary>
    public static FrequencySweep Logarithmic(double startHertz, double stopHertz, int pointsPerDecade)
    {
        if (!(startHertz > 0) || !(stopHertz > startHertz) || !double.IsFinite(stopHertz) || pointsPerDecade < 1)
            throw new ArgumentException($"A logarithmic sweep needs 0 < start < stop and at least one point per decade (got {startHertz} Hz, {stopHertz} Hz, {pointsPerDecade}).");
        var decades = Math.Log10(stopHertz / startHertz);
        var count = (int)Math.Ceiling(decades * pointsPerDecade - 1e-9) + 1;
        var f = new double[count];
        for (var k = 0; k < count; k++)
            f[k] = Math.Min(startHertz * Math.Pow(10, (double)k / pointsPerDecade), stopHertz);
        f[^1] = stopHertz;
        return new FrequencySweep(f);
    }

    /// <summary>Exactly the given frequencies (positive, increasing).</summary>
    public static FrequencySweep At(params double[] frequenciesHertz)
    {
        for (var i = 0; i < frequenciesHertz.Length; i++)
            if (!(frequenciesHertz[i] > 0) || !double.IsFinite(frequenciesHertz[i]) || (i > 0 && frequenciesHertz[i] <= frequenciesHertz[i - 1]))
                throw new ArgumentException("Frequencies must be positive, finite and increasing.");
        return new FrequencySweep([.. frequenciesHertz]);
    }
}
