using ThermVerify.Check.Buffer;
using ThermVerify.Quantities;
using static ThermVerify.Reporting.ReportFormat;

namespace ThermVerify.Reporting;

/// <summary>One buffer section of a report: a heading, sentences, and a table. Text, HTML and Markdown render the same sections.</summary>
internal sealed record BufferSection(string Id, string Title, IReadOnlyList<string> Notes, IReadOnlyList<string> Headers, IReadOnlyList<string[]> Rows);

/// <summary>The buffer's results as report sections: stability, headroom, static errors, recovery, noise.</summary>
internal static class BufferSections
{
    public static IReadOnlyList<BufferSection> Build(BufferReport b, int staticRows = 7) =>
        [Stability(b.Stability), Headroom(b.Headroom), Static(b.StaticErrors, staticRows), Recovery(b.Recovery), Noise(b.Noise)];

    private static BufferSection Stability(StabilityReport s)
    {
        var notes = new List<string>
        {
            $"Minimum phase margin {N(s.MinimumPhaseMarginDegrees, "0.#")}°: {(s.Passed ? "met" : "NOT met")}. Method: {s.Method}; beside it the single-pole hand calculation (r_o and the series resistance into the total load capacitance).",
        };
        if (s.Step is { } step)
            notes.Add($"Closed-loop step (transient): a {V(step.StepVolts, UnitKind.Volt)} step at the input overshoots {N(step.OvershootPercent, "0.#")} % at node '{step.Node}', " +
                      $"peak after {V(step.PeakSeconds, UnitKind.Second)}, " +
                      (double.IsFinite(step.SettlingSeconds) ? $"within 1 % after {V(step.SettlingSeconds, UnitKind.Second)}." : $"still outside 1 % when the run ends ({V(step.TimesSeconds[^1], UnitKind.Second)} after the step)."));
        if (s.IsolationForTargetOhms is { } r)
            notes.Add($"Isolation resistor for {N(s.TargetPhaseMarginDegrees, "0")}° (search on the loop gain): {V(r, UnitKind.Ohm)}" +
                      (s.ClosedFormIsolationForTargetOhms is { } c ? $"; single-pole estimate {V(c, UnitKind.Ohm)}." : "."));
        else if (s.Worst.PhaseMarginDegrees is { } pm && pm < s.TargetPhaseMarginDegrees)
            notes.Add($"No isolation resistor up to 1 MΩ gives {N(s.TargetPhaseMarginDegrees, "0")}° (or the search was skipped).");
        return new BufferSection("buffer-stability", "Buffer stability", notes,
            ["T (°C)", "crossover", "phase margin (°)", "single-pole (°)", "phase crossover", "gain margin (dB)"],
            [.. s.Loops.Select(l => new[]
            {
                N(l.Celsius, "0.##"), Opt(l.CrossoverHertz, UnitKind.Hertz), Opt(l.PhaseMarginDegrees, "0.0"), N(l.ClosedFormPhaseMarginDegrees, "0.0"),
                Opt(l.PhaseCrossoverHertz, UnitKind.Hertz), Opt(l.GainMarginDecibels, "0.0"),
            })]);
    }

    private static BufferSection Headroom(HeadroomResult h)
    {
        var notes = new List<string>
        {
            $"Input common-mode range {Range(h.InputLowVolts, h.InputHighVolts)}, output swing {Range(h.OutputLowVolts, h.OutputHighVolts)}; " +
            $"input over the range {Range(h.InputVolts.Min(), h.InputVolts.Max())}, output {Range(h.OutputVolts.Min(), h.OutputVolts.Max())} (closed form).",
            h.Violations.Count == 0
                ? $"Inside every limit; the smallest margin is {V(h.MinimumMarginVolts, UnitKind.Volt)}."
                : "Where a limit is crossed (crossing temperatures by bisection on the closed form):",
        };
        return new BufferSection("buffer-headroom", "Buffer headroom", notes,
            ["limit", "side", "limit (V)", "from (°C)", "to (°C)", "worst (°C)", "worst (V)", "code"],
            [.. h.Violations.Select(v => new[]
            {
                v.Limit, v.Side, N(v.LimitVolts, "0.####"), N(v.FromCelsius, "0.###"), N(v.ToCelsius, "0.###"), N(v.WorstCelsius, "0.##"),
                N(v.WorstVolts, "0.####"), v.ClippedCode.ToString(System.Globalization.CultureInfo.InvariantCulture),
            })]);
    }

    private static BufferSection Static(IReadOnlyList<StaticErrorPoint> points, int rows)
    {
        var picked = Enumerable.Range(0, rows).Select(i => points[(int)Math.Round(i * (points.Count - 1) / (double)Math.Max(rows - 1, 1))]).Distinct();
        return new BufferSection("buffer-static", "Buffer static errors",
            ["Offset, its drift and the bias currents through the divider's Thevenin resistance (Ohm's law), at the buffer's output."],
            ["T (°C)", "offset", "drift", "bias", "source", "total", "LSB", "K"],
            [.. picked.Select(p => new[]
            {
                N(p.Celsius, "0.##"), V(p.OffsetVolts, UnitKind.Volt), V(p.DriftVolts, UnitKind.Volt), V(p.BiasVolts, UnitKind.Volt), V(p.SourceOhms, UnitKind.Ohm),
                V(p.TotalVolts, UnitKind.Volt), N(p.TotalLsb, "+0.###;-0.###;0"), N(p.TotalKelvin, "+0.0000;-0.0000;0"),
            })]);
    }

    private static BufferSection Recovery(RecoveryResult? r)
    {
        if (r is null)
            return new BufferSection("buffer-recovery", "Buffer recovery after sampling", ["Not simulated: the output clips (see headroom)."], [], []);
        return new BufferSection("buffer-recovery", "Buffer recovery after sampling", [$"Method: {r.Method}."],
            ["T (°C)", "settling error", "with an ideal op-amp", "buffer's share", "share (LSB)", "from slew rate", "from bandwidth", "GBW needed", "slew rate needed"],
            [[
                N(r.Celsius, "0.##"), V(r.SettlingErrorVolts, UnitKind.Volt), V(r.IdealBufferSettlingErrorVolts, UnitKind.Volt), V(r.BufferShareVolts, UnitKind.Volt),
                N(r.BufferShareVolts / (2 * r.AllowedVolts), "+0.###;-0.###;0"),
                V(r.SlewShareVolts, UnitKind.Volt), V(r.BandwidthShareVolts, UnitKind.Volt), AtMost(r.NeededGainBandwidthHertz, r.GainBandwidthFloorHertz ?? 0, UnitKind.Hertz), AtMost(r.NeededSlewRateVoltsPerSecond, BufferRecovery.SlewRateFloorVoltsPerSecond, UnitKind.VoltPerSecond),
            ]]);
    }

    private static BufferSection Noise(NoiseReport n)
    {
        var w = n.Worst;
        var notes = new List<string>
        {
            $"Method: {n.Method}.",
            $"Largest contributors at {C(w.Celsius)}: " + string.Join(", ", w.Contributions.Take(5).Select(c => $"{c.Element} ({c.Label}) {V(c.RmsVolts, UnitKind.Volt)}")) + ".",
            $"Averaging N conversions at {C(w.Celsius)} (samples correlate as ρ = {N(n.SampleCorrelation, "0.###")}): " +
            string.Join("; ", n.Averaging.Select(a => $"N = {a.Conversions}: {V(a.CorrelatedRmsVolts, UnitKind.Volt)} ({N(a.CorrelatedRmsKelvin, "0.#####")} K), white σ/√N {V(a.WhiteRmsVolts, UnitKind.Volt)}")) + ".",
        };
        return new BufferSection("buffer-noise", "Noise at the ADC", notes,
            ["T (°C)", "rms", "LSB rms", "K rms", "switch (kT/C)", "kT/C closed form", "front end"],
            [.. n.Points.Select(p => new[]
            {
                N(p.Celsius, "0.##"), V(p.RmsVolts, UnitKind.Volt), N(p.RmsLsb, "0.####"), N(p.RmsKelvin, "0.#####"), V(p.SamplingRmsVolts, UnitKind.Volt),
                V(p.KtcVolts, UnitKind.Volt), V(p.FrontEndRmsVolts, UnitKind.Volt),
            })]);
    }

    private static string AtMost(double? value, double floor, UnitKind unit) =>
        value is { } v && v <= floor * (1 + 1e-9) ? "≤ " + V(v, unit) : Opt(value, unit);

    private static string Opt(double? value, UnitKind unit) => value is { } v ? V(v, unit) : "none";
    private static string Opt(double? value, string format) => value is { } v ? N(v, format) : "none";
    private static string Range(double low, double high) =>
        !double.IsFinite(low) && !double.IsFinite(high) ? "not limited" : $"{(double.IsFinite(low) ? V(low, UnitKind.Volt) : "−∞")} to {(double.IsFinite(high) ? V(high, UnitKind.Volt) : "+∞")}";
}
