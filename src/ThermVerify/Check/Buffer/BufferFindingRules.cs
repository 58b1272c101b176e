using System.Globalization;
using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Quantities;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Check.Buffer;

/// <summary>
/// The buffer's findings. Failures: a phase margin below the design's minimum (buffer.minimum_phase_margin, 45° by
/// default) and any stretch where the input leaves its common-mode range or the output its swing. Warnings: static
/// errors, the buffer's share of the settling error and the sampled noise where each exceeds ½ LSB. Stability has no
/// voltage size, so its sizes are NaN (null in JSON).
/// </summary>
internal static class BufferFindingRules
{
    public static IReadOnlyList<Finding> Evaluate(FrontEndDesign design, IReadOnlyList<CheckPoint> points, StabilityReport stability,
        HeadroomResult headroom, IReadOnlyList<StaticErrorPoint> statics, RecoveryResult? recovery, NoiseReport noise)
    {
        var model = new ClosedFormModel(design);
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
            var remedy = isOutput
                ? new Remedy("buffer.output_swing", $"use an op-amp whose output reaches {(v.Side == "high" ? "up" : "down")} to", v.WorstVolts, "V",
                    "the largest closed-form output over the range (or rescale the divider or the gain)")
                : new Remedy("buffer.input_common_mode", $"use an op-amp whose input common-mode range reaches {(v.Side == "high" ? "up" : "down")} to", v.WorstVolts, "V",
                    "the extreme closed-form input over the range (or rescale the divider)");
            findings.Add(new Finding(isOutput ? "buffer-output-clipped" : "buffer-input-range", Severity.Fail,
                isOutput
                    ? I($"the buffer's output leaves its swing ({v.Side} limit {v.LimitVolts:0.###} V): codes clip at {v.ClippedCode}")
                    : I($"the buffer's input leaves its common-mode range ({v.Side} limit {v.LimitVolts:0.###} V, code {v.ClippedCode})"),
                v.FromCelsius, v.ToCelsius, v.WorstCelsius, sizeVolts, sizeVolts / lsb, kelvin,
                I($"closed form crosses the limit at {v.FromCelsius:0.###} °C") + (v.ToCelsius < range.MaxCelsius && v.FromCelsius > range.MinCelsius ? I($" and {v.ToCelsius:0.###} °C") : "") +
                (isOutput ? "; beyond it the output stays at the limit whatever the temperature"
                          : "; beyond it the op-amp is outside its linear range (size: the reading taken to stop at the limit)"),
                v.WorstVolts, null, [remedy]));
        }

        var overStatic = statics.Where(s => Math.Abs(s.TotalVolts) > lsb / 2).ToList();
        if (overStatic.Count > 0)
        {
            var s = overStatic.MaxBy(p => Math.Abs(p.TotalVolts))!;
            findings.Add(new Finding("buffer-static", Severity.Warn, "the buffer's offset and bias currents shift the pin by more than ½ LSB",
                overStatic[0].Celsius, overStatic[^1].Celsius, s.Celsius, s.TotalVolts, s.TotalLsb, s.TotalKelvin,
                I($"offset {s.OffsetVolts * 1e3:0.###} mV, drift {s.DriftVolts * 1e3:0.###} mV, bias current through {s.SourceOhms:0} Ω {s.BiasVolts * 1e6:0.###} µV (Ohm's law)"),
                s.TotalVolts, null,
                [new Remedy("buffer.offset_voltage", "use an op-amp with offset (including drift over the range) of at most", lsb / 2 / model.BufferGain, "V",
                    "½ LSB at the pin divided by the stage gain")]));
        }

        if (recovery is { } rec && Math.Abs(rec.BufferShareVolts) > rec.AllowedVolts)
        {
            var remedies = new List<Remedy>();
            if (rec.NeededGainBandwidthHertz is { } g)
                remedies.Add(new Remedy("buffer.gain_bandwidth", "use an op-amp with gain-bandwidth of at least", g, "Hz", rec.Method));
            if (rec.NeededSlewRateVoltsPerSecond is { } sr)
                remedies.Add(new Remedy("buffer.slew_rate", "and slew rate of at least", sr, "V/s", rec.Method));
            findings.Add(new Finding("buffer-recovery", Severity.Warn, "the buffer does not recover from the sampling kick in time",
                rec.Celsius, rec.Celsius, rec.Celsius, rec.BufferShareVolts, rec.BufferShareVolts / lsb, double.NaN,
                I($"settling error {rec.SettlingErrorVolts * 1e6:0.#} µV with the design's op-amp, {rec.IdealBufferSettlingErrorVolts * 1e6:0.#} µV with an ideal one"),
                null, rec.BufferShareVolts, remedies));
        }

        var noisy = noise.Points.Where(p => p.RmsVolts > lsb / 2).ToList();
        if (noisy.Count > 0)
        {
            var p = noise.Worst;
            var n = (int)Math.Ceiling(Math.Pow(p.RmsVolts / (lsb / 2), 2));
            findings.Add(new Finding("buffer-noise", Severity.Warn, "the sampled noise exceeds ½ LSB rms: codes flicker",
                noisy[0].Celsius, noisy[^1].Celsius, p.Celsius, p.RmsVolts, p.RmsLsb, p.RmsKelvin,
                I($"largest contributor {p.Contributions[0].Element} ({p.Contributions[0].Label}) {p.Contributions[0].RmsVolts * 1e6:0.#} µV rms"),
                null, p.RmsVolts,
                [new Remedy("firmware averaging", "average at least this many conversions (white noise, σ/√N)", n, "conversions", noise.Method)]));
        }
        return findings;
    }

    private static string Hertz(double? f) => f is { } v ? Quantities.EngineeringFormat.Format(v, Quantities.UnitKind.Hertz, 4) : "none";

    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
