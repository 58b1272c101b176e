namespace ThermVerify.Simulation;

/// <summary>
/// Output noise power spectral density per generator and in total. Integrals over frequency assume a
/// power law between neighbouring sweep points (straight lines on log–log axes), integrated exactly per
/// segment, which is exact for white, 1/f and 1/f² stretches and needs far fewer points than the
/// trapezoidal rule.
/// </summary>
internal sealed class NoiseResult
{
    private readonly (string Element, string Label)[] generators;
    private readonly double[,] psd;

    internal NoiseResult(double[] frequencies, (string Element, string Label)[] generators, double[,] psd, IReadOnlyList<SimulationWarning> warnings)
    {
        FrequenciesHertz = frequencies;
        this.generators = generators;
        this.psd = psd;
        Warnings = warnings;
    }

    public IReadOnlyList<double> FrequenciesHertz { get; }

    public IReadOnlyList<SimulationWarning> Warnings { get; }

    /// <summary>Names of the elements that contribute noise.</summary>
    public IReadOnlyList<string> Contributors => [.. generators.Select(g => g.Element).Distinct()];

    /// <summary>Total output noise PSD in V²/Hz at each frequency.</summary>
    public double[] OutputPsd => Sum(_ => true);

    /// <summary>Total output noise density in V/√Hz at each frequency.</summary>
    public double[] OutputDensity => [.. OutputPsd.Select(Math.Sqrt)];

    /// <summary>Output noise PSD (V²/Hz) from one element's generators.</summary>
    public double[] ContributionPsd(string element)
    {
        if (!generators.Any(g => g.Element == element))
            throw new ArgumentException($"Element '{element}' contributes no noise. Contributors: {string.Join(", ", Contributors)}.");
        return Sum(g => g.Element == element);
    }

    /// <summary>RMS output noise over the whole sweep.</summary>
    public double RmsVolts() => Math.Sqrt(Integrate(OutputPsd, FrequenciesHertz[0], FrequenciesHertz[^1]));

    /// <summary>RMS output noise between two frequencies inside the sweep.</summary>
    public double RmsVolts(double fromHertz, double toHertz) => Math.Sqrt(Integrate(OutputPsd, fromHertz, toHertz));

    public double ContributionRmsVolts(string element) =>
        Math.Sqrt(Integrate(ContributionPsd(element), FrequenciesHertz[0], FrequenciesHertz[^1]));

    /// <summary>Every noise generator as (element, label), e.g. an op-amp's voltage and current noise apart.</summary>
    public IReadOnlyList<(string Element, string Label)> Generators => generators;

    /// <summary>RMS output noise of the generators with this element and label over the whole sweep.</summary>
    public double GeneratorRmsVolts(string element, string label) =>
        Math.Sqrt(Integrate(Sum(g => g.Element == element && g.Label == label), FrequenciesHertz[0], FrequenciesHertz[^1]));

    private double[] Sum(Func<(string Element, string Label), bool> which)
    {
        var total = new double[FrequenciesHertz.Count];
        for (var g = 0; g < generators.Length; g++)
            if (which(generators[g]))
                for (var k = 0; k < total.Length; k++)
                    total[k] += psd[g, k];
        return total;
    }

    private double Integrate(double[] s, double from, double to)
    {
        var f = FrequenciesHertz;
        if (!(from >= f[0] * (1 - 1e-12)) || !(to <= f[^1] * (1 + 1e-12)) || !(to > from))
            throw new ArgumentOutOfRangeException(nameof(from), $"Integration band {from:G4} Hz to {to:G4} Hz must lie inside the sweep {f[0]:G4} Hz to {f[^1]:G4} Hz.");
        var total = 0.0;
        for (var k = 1; k < f.Count; k++)
        {
            double f0 = f[k - 1], f1 = f[k];
            var lo = Math.Max(f0, from);
            var hi = Math.Min(f1, to);
            if (hi <= lo)
                continue;
            total += PowerLawSegment(f0, s[k - 1], f1, s[k], lo, hi);
        }
        return total;
    }

    /// <summary>∫ S df from lo to hi with S = s0·(f/f0)^α through both end points.</summary>
    private static double PowerLawSegment(double f0, double s0, double f1, double s1, double lo, double hi)
    {
        if (s0 <= 0 || s1 <= 0)
            return 0.5 * (s0 + s1) * (hi - lo);
        var alpha = Math.Log(s1 / s0) / Math.Log(f1 / f0);
        var e = alpha + 1;
        if (Math.Abs(e) < 1e-9)
            return s0 * f0 * Math.Log(hi / lo);
        return s0 * f0 * (Math.Pow(hi / f0, e) - Math.Pow(lo / f0, e)) / e;
    }
}
