using ThermVerify.Check.Noise;
using ThermVerify.Quantities;
using static ThermVerify.Reporting.ReportFormat;

namespace ThermVerify.Reporting;

/// <summary>
/// The reading's noise as a report section (text, Markdown and HTML render it as they render the buffer's): the method
/// and band, the converter noise declared or assumed, averaging and its cost in time and lag, and per temperature the
/// noise of one conversion and of a reading, ±kσ in K beside the LSB in K, the noise-free resolution and the density
/// at the pin at the stated frequencies.
/// </summary>
internal static class NoiseSections
{
    public static IReadOnlyList<BufferSection> Build(NoiseSummary? n)
    {
        if (n is null) return [];
        var w = n.Worst;
        var notes = new List<string>
        {
            $"Method: {n.Method}.",
            n.Band is { } band ? $"Band: {band}." : $"Band: the sampled noise is integrated from {V(n.FromHertz, UnitKind.Hertz)} to {V(n.ToHertz, UnitKind.Hertz)} (1000× the sampling network's fastest pole); " +
            (double.IsFinite(n.NoiseBandwidthHertz) ? $"equivalent noise bandwidth {V(n.NoiseBandwidthHertz, UnitKind.Hertz)} (the total over the density at the bottom of the band)." : "no equivalent bandwidth for an engine total."),
            $"Converter noise: {n.ConverterNoise}.",
            (n.ReadingsAveraged > 1
                ? $"Averaging: a reading is the mean of {n.ReadingsAveraged} conversions and takes {V(n.ReadingSeconds, UnitKind.Second)}; conversions are independent for kT/C and the converter, " +
                  $"the filtered part correlates over τ = {V(n.CorrelationSeconds, UnitKind.Second)} (ρ = {N(w.Correlation, "0.###")} between neighbours), so it counts as {N(n.EffectiveReadings, "0.#")} independent readings."
                : $"Averaging: none declared (noise.readings_averaged = 1); a reading is one conversion ({V(n.ReadingSeconds, UnitKind.Second)}); the filter's correlation time τ = {V(n.CorrelationSeconds, UnitKind.Second)}.") ,
            n.RampKelvinPerSecond is { } rate
                ? $"Ramp: on the declared {N(rate, "0.####")} K/s the reading lags {V(n.LagSeconds, UnitKind.Second)} (averaging (N − 1)·T_s/2 plus the filter's τ): {N(rate * n.LagSeconds, "0.####")} K, counted in the budget."
                : $"Ramp: none declared (noise.ramp_rate); the reading lags {V(n.LagSeconds, UnitKind.Second)} behind a changing temperature.",
            $"Largest sources at {C(w.Celsius)} (rms per conversion): " + string.Join(", ", w.Shares.Take(5).Select(s => $"{s.Source} ({s.Label}) {V(s.RmsVolts, UnitKind.Volt)}")) + ".",
        };
        var density = w.PinDensity.Select(d => $"at {V(d.Hertz, UnitKind.Hertz)} (V/√Hz)").ToArray();
        var rows = n.Points.Select(p => (string[])
        [
            N(p.Celsius, "0.##"), V(p.SingleRmsVolts, UnitKind.Volt), V(p.AveragedRmsVolts, UnitKind.Volt), N(p.AveragedRmsLsb, "0.###"),
            N(p.CoveredKelvin, "0.####"), N(p.LsbKelvin, "0.####"), N(p.NoiseFreeResolutionKelvin, "0.####"), V(p.AnalogRmsVolts, UnitKind.Volt), .. (n.SampledKtc ? [V(p.KtcRmsVolts, UnitKind.Volt)] : Array.Empty<string>()),
            .. p.PinDensity.Select(d => V(d.VoltsPerRootHertz, UnitKind.VoltPerRootHertz)),
        ]).ToList();
        return [new BufferSection("noise", "Noise of a reading", notes,
            ["T (°C)", "one conversion", "reading", "reading (LSB)", $"±{N(w.Coverage, "0.##")}σ (K)", "LSB (K)", "noise-free resolution (K)", "front end", .. (n.SampledKtc ? ["kT/C closed form"] : Array.Empty<string>()), .. density],
            rows)];
    }
}
