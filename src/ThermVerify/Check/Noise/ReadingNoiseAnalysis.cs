using System.Globalization;
using ThermVerify.Check.Buffer;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Quantities;
using ThermVerify.Simulation;

namespace ThermVerify.Check.Noise;

/// <summary>
/// The noise of a reading, for every design. The engine's noise analysis (adjoint method) at the sampling capacitor with
/// the switch closed gives each generator's density: every resistor's Johnson–Nyquist noise 4kTR at its own temperature,
/// the op-amp's voltage and current noise; integrated from 0.1 Hz to 1000× the network's fastest pole (the switch's
/// R·C_sh, the op-amp's gain-bandwidth), so the band is what the sampling network passes, not a chosen one. For a
/// passive network at one temperature the total is kT/C_sh whatever the resistances (equipartition), which the tests
/// check. The switch's share is new at every acquisition; the rest passes the filter and correlates between conversions
/// T_s apart as ρ = e^(−T_s/τ), τ = R_source·(C_res + C_pin) (single pole). The converter's own noise (declared, or
/// 0.5 LSB assumed) is independent per conversion. The mean of N consecutive conversions then has the variance
/// σ_fast²/N + σ_conv²/N + σ_slow²·[1 + 2Σ(1 − k/N)ρ^k]/N. Averaging and the filter lag a ramp: the mean of N is
/// (N − 1)·T_s/2 old, the filter adds τ (a first-order lag follows a ramp τ behind).
/// </summary>
internal static class ReadingNoiseAnalysis
{
    public const double FromHertz = 0.1;
    private const int PointsPerDecade = 10;

    /// <summary>The stated frequencies of the density at the pin: three decades and the sample rate's Nyquist frequency.</summary>
    public static double[] DensityHertz(FrontEndDesign design) =>
        [.. new[] { 10.0, 1e3, 1e5, design.Adc.SampleRateHertz / 2 }.Distinct().Order()];

    public static double ToHertz(FrontEndDesign design)
    {
        var adc = design.Adc;
        var fastest = Math.Max(design.Buffer?.GainBandwidthHertz ?? 0,
            1 / (2 * Math.PI * Math.Max(adc.SwitchResistanceOhms, 1) * adc.SamplingCapacitanceFarads));
        // A differential input's negative network has its own pole.
        if (adc.NegativeInput is { } n)
            fastest = Math.Max(fastest, 1 / (2 * Math.PI * Math.Max(n.SwitchResistanceOhms, 1) * n.SamplingCapacitanceFarads));
        return 1000 * fastest;
    }

    /// <summary>The converter's own rms noise per conversion in volts: declared (LSB or V) or the assumed default.</summary>
    public static double ConverterVolts(FrontEndDesign design, double lsbVolts) =>
        design.Adc.NoiseVolts ?? (design.Adc.NoiseLsb ?? DesignDefaults.ConverterNoiseLsb) * lsbVolts;

    /// <summary>The correlation time of the noise the filter carries between conversions: R_source·(C_res + C_pin).</summary>
    public static double CorrelationSeconds(FrontEndDesign design, ClosedFormPoint cf) =>
        EffectEstimator.SourceOhms(design, cf) * (FrontEndCircuit.ReservoirFarads(design) + design.Adc.PinCapacitanceFarads);

    /// <summary>The reading's noise at one temperature; the density at the pin only when asked (the report's rows).</summary>
    public static ReadingNoise At(FrontEndDesign design, ClosedFormModel model, double celsius, ICheckEngine engine, bool density = false) =>
        Reading(design, model, celsius, Sample(design, celsius, engine, density));

    /// <summary>
    /// The reading's noise at every temperature of a check: the front end's noise analysed on the sampling grid (every
    /// point when there are few, else evenly spread with both ends, as the sampling transients), its variances
    /// interpolated linearly in temperature between grid points (they follow the resistances smoothly); the converter's
    /// noise, the correlation and the slope are each point's own.
    /// </summary>
    public static IReadOnlyList<ReadingNoise> Over(FrontEndDesign design, ClosedFormModel model, IReadOnlyList<double> temperatures, int maximumPoints, ICheckEngine engine)
    {
        var grid = FrontEnd.SettlingGrid.Indices(temperatures.Count, maximumPoints);
        var sampled = grid.Select(i => Sample(design, temperatures[i], engine, density: false)).ToArray();
        var fast = FrontEnd.SettlingGrid.Interpolate(temperatures, grid, g => sampled[g].FastVariance);
        var slow = FrontEnd.SettlingGrid.Interpolate(temperatures, grid, g => sampled[g].SlowVariance);
        return [.. temperatures.Select((t, i) =>
        {
            var nearest = Enumerable.Range(0, grid.Length).MinBy(g => Math.Abs(grid[g] - i));
            return Reading(design, model, t, sampled[nearest] with { FastVariance = fast[i], SlowVariance = slow[i] });
        })];
    }

    /// <summary>What a conversion samples of the front end at one temperature: the switch's share (new every time), the rest, by generator.</summary>
    internal sealed record SampledNoise(double FastVariance, double SlowVariance, IReadOnlyList<NoiseShare> Shares, IReadOnlyList<NoiseDensity> PinDensity);

    /// <summary>
    /// √(kT/C_sh) with the switch at the board temperature (the swept one without it), the closed form printed beside the
    /// analysis; a differential input keeps two capacitors' independent kT/C: √(kT/C₊ + kT/C₋).
    /// </summary>
    private static double KtcVolts(FrontEndDesign design, double celsius) =>
        Math.Sqrt(PhysicalConstants.BoltzmannJoulesPerKelvin * PhysicalConstants.ToKelvin(design.Check.BoardCelsius ?? celsius)
                  * (1 / design.Adc.SamplingCapacitanceFarads + (design.Adc.NegativeInput is { } n ? 1 / n.SamplingCapacitanceFarads : 0)));

    internal static SampledNoise Sample(FrontEndDesign design, double celsius, ICheckEngine engine, bool density)
    {
        var circuit = SamplingNoiseCircuit.Acquiring(design, celsius);
        var own = SamplingNoiseCircuit.OwnTemperatures(design, circuit);
        var hold = SamplingNoiseCircuit.Output(design);
        var sweep = FrequencySweep.Logarithmic(FromHertz, ToHertz(design), PointsPerDecade);
        if (design.Buffer?.Subcircuit is not null)
        {
            // The design's own op-amp subcircuit: the engine gives the total at the node; the switch's share is its kT/C.
            var total = SubcircuitBuffer.NoiseRmsVolts(circuit, hold, sweep, engine);
            var ktc = KtcVolts(design, celsius);
            var fast = Math.Min(ktc * ktc, total * total);
            return new SampledNoise(fast, total * total - fast,
                [new NoiseShare(BufferCircuits.OpAmpName, "total (the engine gives no split by generator)", total)], []);
        }
        var noise = NoiseAnalysis.Run(circuit, hold, sweep, elementCelsius: own);
        List<NoiseShare> shares = [.. noise.Generators.Distinct()
            .Select(g => new NoiseShare(g.Element, g.Label, noise.GeneratorRmsVolts(g.Element, g.Label)))
            .Where(x => x.RmsVolts > 0)];
        var all = noise.RmsVolts();
        var switchShare = shares.Where(x => x.Source is SamplingNoiseCircuit.SwitchResistor or SamplingNoiseCircuit.NegativeSwitchResistor).Sum(x => x.RmsVolts * x.RmsVolts);
        IReadOnlyList<NoiseDensity> pin = [];
        if (density)
        {
            var at = DensityHertz(design);
            var d = NoiseAnalysis.Run(circuit, FrontEndCircuit.PinNode(design), FrequencySweep.At(at), elementCelsius: own).OutputDensity;
            pin = [.. at.Select((f, k) => new NoiseDensity(f, d[k]))];
        }
        return new SampledNoise(switchShare, Math.Max(0, all * all - switchShare), shares, pin);
    }

    internal static ReadingNoise Reading(FrontEndDesign design, ClosedFormModel model, double celsius, SampledNoise s)
    {
        var cf = model.At(celsius);
        var lsb = model.Adc.LsbVolts;
        var converter = ConverterVolts(design, lsb);
        List<NoiseShare> shares = [.. s.Shares, new NoiseShare("converter", design.Adc.NoiseDeclared ? "declared" : "assumed", converter)];
        var tau = CorrelationSeconds(design, cf);
        var rho = tau > 0 ? Math.Exp(-1 / (design.Adc.SampleRateHertz * tau)) : 0;
        var n = design.Noise.ReadingsAveraged;
        var averaged = Math.Sqrt((s.FastVariance + converter * converter) / n + s.SlowVariance * CorrelatedFactor(n, rho));
        var analog = Math.Sqrt(s.FastVariance + s.SlowVariance);
        var rampLag = design.Noise.RampKelvinPerSecond is { } rate ? rate * LagSeconds(design, tau) : 0;
        return new ReadingNoise(celsius, analog, Math.Sqrt(s.FastVariance), Math.Sqrt(s.SlowVariance), KtcVolts(design, celsius), converter,
            Math.Sqrt(analog * analog + converter * converter), averaged, rho, cf.VoltsPerKelvin, lsb, design.Noise.Coverage, rampLag,
            [.. shares.OrderByDescending(x => x.RmsVolts)], s.PinDensity);
    }

    /// <summary>
    /// The design as far as the front end's sampled noise depends on it: the converter's own noise and the firmware's
    /// averaging set to their defaults (they act after the sampling), so that a search over them analyses the front end once.
    /// </summary>
    internal static FrontEndDesign FrontEndOnly(FrontEndDesign design) =>
        design with { Noise = NoiseSpec.Default, Adc = design.Adc with { NoiseLsb = null, NoiseVolts = null } };

    /// <summary>How far behind a ramp the reading is: the mean of N conversions is (N − 1)·T_s/2 old; the filter adds τ.</summary>
    public static double LagSeconds(FrontEndDesign design, double tauSeconds) =>
        (design.Noise.ReadingsAveraged - 1) / (2 * design.Adc.SampleRateHertz) + tauSeconds;

    /// <summary>The summary the reports show, over the given temperatures (the density at the pin at each).</summary>
    public static NoiseSummary Summary(FrontEndDesign design, IReadOnlyList<double> temperatures, ICheckEngine engine)
    {
        var model = new ClosedFormModel(design);
        var points = temperatures.Select(t => At(design, model, t, engine, density: true)).ToList();
        var worst = points.MaxBy(p => p.CoveredKelvin)!;
        var tau = CorrelationSeconds(design, model.At(worst.Celsius));
        var n = design.Noise.ReadingsAveraged;
        // White density at the bottom of the band, against the total: the band of a brick-wall filter that passes the same noise.
        var bandwidth = EquivalentBandwidth(design, worst.Celsius, engine);
        var converter = design.Adc.NoiseDeclared
            ? (design.Adc.NoiseLsb is { } l ? I($"{l:0.###} LSB rms (declared)") : EngineeringFormat.Format(design.Adc.NoiseVolts!.Value, UnitKind.Volt, 3) + " rms (declared)")
            : I($"{DesignDefaults.ConverterNoiseLsb:0.###} LSB rms assumed (the design declares no adc.noise; an effective resolution one bit short of {design.Adc.Bits} bits)");
        var method = I($"noise analysis (adjoint) at the sampling capacitor with the switch closed, each resistor at its own temperature, ") +
                     I($"{Hz(FromHertz)} to {Hz(ToHertz(design))}; the converter's noise {converter}; ") +
                     (n > 1 ? I($"the mean of {n} conversions: kT/C and the converter's noise fall as 1/√N, the filtered part correlates as e^(−T_s/τ), τ = {Sec(tau)}; ") : "one conversion per reading; ") +
                     I($"counted in the budget as ±{design.Noise.Coverage:0.##}σ");
        return new NoiseSummary(points, FromHertz, ToHertz(design), bandwidth, converter, !design.Adc.NoiseDeclared, n, n / design.Adc.SampleRateHertz,
            tau, 1 / CorrelatedFactor(n, worst.Correlation), design.Noise.RampKelvinPerSecond, LagSeconds(design, tau), method);
    }

    /// <summary>The temperatures the report's noise table shows: five across the range.</summary>
    public static double[] ReportTemperatures(Sensors.TemperatureRange range) =>
        [.. Enumerable.Range(0, 5).Select(i => range.MinCelsius + i * (range.MaxCelsius - range.MinCelsius) / 4).Distinct()];

    /// <summary>Variance of the mean of N samples of a process with correlation ρ^k at lag k, over the variance of one (AR(1), from memory).</summary>
    public static double CorrelatedFactor(int n, double rho)
    {
        var sum = 1.0;
        var power = 1.0;
        for (var k = 1; k < n; k++)
        {
            power *= rho;
            if (power < 1e-18) break;
            sum += 2 * (1 - (double)k / n) * power;
        }
        return sum / n;
    }

    /// <summary>σ²/S(f_low): the bandwidth of an ideal filter passing the front end's density at the bottom of the band, giving the same noise.</summary>
    private static double EquivalentBandwidth(FrontEndDesign design, double celsius, ICheckEngine engine)
    {
        if (design.Buffer?.Subcircuit is not null) return double.NaN;
        var circuit = SamplingNoiseCircuit.Acquiring(design, celsius);
        var noise = NoiseAnalysis.Run(circuit, SamplingNoiseCircuit.Output(design), FrequencySweep.Logarithmic(FromHertz, ToHertz(design), PointsPerDecade),
            elementCelsius: SamplingNoiseCircuit.OwnTemperatures(design, circuit));
        var total = noise.RmsVolts();
        return total * total / noise.OutputPsd[0];
    }

    private static string Hz(double f) => EngineeringFormat.Format(f, UnitKind.Hertz, 3);
    private static string Sec(double s) => EngineeringFormat.Format(s, UnitKind.Second, 3);
    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
