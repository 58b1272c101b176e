using System.Globalization;
using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Quantities;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Check.Buffer;

/// <summary>
/// The buffer's findings. Failures: a phase margin below the design's minimum (buffer.minimum_phase_margin, 45° by
/// default) and any stretch where the input leaves its common-mode range or the output its swing. Warnings:
/// the buffer's share of the settling error where it exceeds ½ LSB, failing when its own size exceeds the budget (the
/// static errors are the check's buffer column, FindingRules; the op-amp's noise counts in the check's noise finding,
/// Noise/NoiseFindingRules, with every other source of noise). Stability has no
/// voltage size, so its sizes are NaN (null in JSON).
/// </summary>
internal static class BufferFindingRules
{
    public static IReadOnlyList<Finding> Evaluate(FrontEndDesign design, IReadOnlyList<CheckPoint> points, StabilityReport stability,
        HeadroomResult headroom, RecoveryResult? recovery)
    {
        var model = new ClosedFormModel(design);
        var b = BufferCircuits.Require(design);
        var lsb = model.Adc.LsbVolts;
        var range = design.Check.Range;
        var findings = new List<Finding>();

        var worst = stability.Worst;
        if (!stability.Passed)
        {
            var remedies = new List<Remedy>();
            if (stability.IsolationForTargetOhms is { } r)
                remedies.Add(new Remedy("buffer.isolation_resistor", $"fit an isolation resistor for {stability.TargetPhaseMarginDegrees:0}° of phase margin of at least", r, "Ω",
                    "bisection on the simulated loop gain" + (stability.ClosedFormIsolationForTargetOhms is { } c ? $"; single-pole estimate {EngineeringFormat.Format(c, UnitKind.Ohm, 3)}" : "")));
            findings.Add(new Finding("buffer-stability", Severity.Fail,
                I($"the buffer's phase margin {worst.PhaseMarginDegrees:0.#}° is below the minimum {stability.MinimumPhaseMarginDegrees:0.#}°"),
                range.MinCelsius, range.MaxCelsius, worst.Celsius, double.NaN, double.NaN, double.NaN,
                $"the load capacitance behind the op-amp's output resistance adds a pole inside the loop; crossover {Hertz(worst.CrossoverHertz)}, " +
                I($"single-pole estimate {worst.ClosedFormPhaseMarginDegrees:0.#}°") +
                (stability.Step is { } s ? I($"; a {s.StepVolts * 1e3:0.##} mV step overshoots {s.OvershootPercent:0.#} %") : ""),
                null, null, remedies));
        }

        foreach (var v in headroom.Violations)
        {
            var isOutput = v.Limit == "output swing";
            var at = points.MinBy(p => Math.Abs(p.Celsius - v.WorstCelsius))!;
            // The pin reads the limit instead of the closed form's value (an input limit scaled by the stage gain).
            var sizeVolts = (v.LimitVolts - v.WorstVolts) * (isOutput ? 1 : model.BufferGain);
            var kelvin = model.CelsiusAtVolts(at.IdealVolts + sizeVolts) - at.Celsius;
            // The swing that would let the output reach the closed form's extreme (the proof re-checks it with that swing).
            var swing = v.Side == "high" ? b.Supply.MaxVolts - v.WorstVolts : v.WorstVolts - b.Supply.MinVolts;
            IReadOnlyList<Remedy> remedy = isOutput && swing >= 0
                ? [new Remedy("buffer.output_swing", "use an op-amp whose output swings to within, of each rail,", swing, "V",
                    "the largest closed-form output over the range (or rescale the divider or the gain)")]
                : [];
            findings.Add(new Finding(isOutput ? "buffer-output-clipped" : "buffer-input-range", Severity.Fail,
                isOutput
                    ? I($"the buffer's output leaves its swing ({v.Side} limit {v.LimitVolts:0.###} V): codes clip at {v.ClippedCode}")
                    : I($"the buffer's input leaves its common-mode range ({v.Side} limit {v.LimitVolts:0.###} V, code {v.ClippedCode})"),
                v.FromCelsius, v.ToCelsius, v.WorstCelsius, sizeVolts, sizeVolts / lsb, kelvin,
                I($"closed form crosses the limit at {v.FromCelsius:0.###} °C") + (v.ToCelsius < range.MaxCelsius && v.FromCelsius > range.MinCelsius ? I($" and {v.ToCelsius:0.###} °C") : "") +
                (isOutput ? "; beyond it the output stays at the limit whatever the temperature"
                          : "; beyond it the op-amp is outside its linear range (size: the reading taken to stop at the limit)"),
                v.WorstVolts, null, remedy));
        }

        if (recovery is { } rec && Math.Abs(rec.BufferShareVolts) > rec.AllowedVolts)
        {
            var remedies = new List<Remedy>();
            if (rec.NeededGainBandwidthHertz is { } g)
                remedies.Add(new Remedy("buffer.gain_bandwidth", "use an op-amp with gain-bandwidth of at least", g, "Hz", rec.Method));
            if (rec.NeededSlewRateVoltsPerSecond is { } sr)
                remedies.Add(new Remedy("buffer.slew_rate", "and slew rate of at least", sr, "V/s", rec.Method));
            var at = points.MinBy(p => Math.Abs(p.Celsius - rec.Celsius))!;
            var kelvin = model.CelsiusAtVolts(at.IdealVolts + rec.BufferShareVolts) - at.Celsius;
            findings.Add(new Finding("buffer-recovery", OwnSize(kelvin, at.BudgetKelvin), "the buffer does not recover from the sampling kick in time",
                rec.Celsius, rec.Celsius, rec.Celsius, rec.BufferShareVolts, rec.BufferShareVolts / lsb, kelvin,
                I($"settling error {rec.SettlingErrorVolts * 1e6:0.#} µV with the design's op-amp, {rec.IdealBufferSettlingErrorVolts * 1e6:0.#} µV with an ideal one"),
                null, rec.BufferShareVolts, remedies));
        }

        return findings;
    }

    /// <summary>The rule every finding follows: it fails when its own size exceeds the budget there (docs/methods.md).</summary>
    private static Severity OwnSize(double kelvin, double budgetKelvin) =>
        double.IsFinite(kelvin) && Math.Abs(kelvin) > budgetKelvin ? Severity.Fail : Severity.Warn;

    private static string Hertz(double? f) => f is { } v ? Quantities.EngineeringFormat.Format(v, Quantities.UnitKind.Hertz, 4) : "none";

    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
