using System.Globalization;
using ThermVerify.Check.Buffer;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Quantities;

namespace ThermVerify.Check;

/// <summary>
/// Turns the checked points into findings, one per column of the error split. The rules (docs/methods.md, section 9):
/// an effect is a finding where it moves the pin by more than ½ LSB (the converter: where it shifts the code by more
/// than ½ LSB); it FAILS when its own contribution to the reported temperature exceeds the budget at any temperature
/// (regions included), and WARNS otherwise, whatever the other effects at the same temperature do. The resolution
/// fails where ½ LSB alone exceeds the budget (IEEE Std 1241: ±Q/2). The over-budget finding fails wherever the total
/// is outside the budget and names the cause that dominates at its worst point.
/// </summary>
internal static class FindingRules
{
    public const string OverBudgetId = "over-budget";

    public static IReadOnlyList<Finding> Evaluate(FrontEndDesign design, ClosedFormModel model, IReadOnlyList<CheckPoint> points)
    {
        var lsb = model.Adc.LsbVolts;
        var findings = new List<Finding>();
        findings.AddRange(Resolution(design, model, points));

        Add("converter", "the converter's static errors (offset, gain, INL, reference) shift the code by more than ½ LSB",
            p => p.Simulated.ConverterVolts, p => p.Contributions.ConverterKelvin, p => ConverterCause(design, p, lsb), p => p.Simulated.ConverterVolts, simulated: false);
        Add("dc-loading", (design.Netlist is { } n ? "DC error at the pin: pin leakage, the netlist's parts' drift" + (n.Parsed.Elements.Any(x => x.Kind == 'D') ? ", its diodes" : "")
                : design.Bridge is not null ? "DC error at the pin: pin leakage, the bridge's resistors' drift"
                : design.CurrentSource is null ? "DC error at the pin: pin leakage, fixed-resistor drift"
                : "DC error at the pin: pin leakage, the current source's drift and output resistance, the reference resistor's drift and loading")
                + (design.Wiring is not null && design.CurrentSource is null ? ", sensor leads" : "")
                + (design.Protection is { HasClamps: true } ? ", clamp-diode leakage" : "") + (design.Protection?.InsulationOhms is null ? "" : ", insulation leakage"),
            p => p.Simulated.DcLoadingVolts, p => p.Contributions.DcLoadingKelvin,
            p => LoadingCause(design, p),
            p => p.Estimates.LoadingVolts);
        Add("reservoir-recovery", "the reservoir does not recover between samples",
            p => p.Simulated.RecoveryVolts, p => p.Contributions.RecoveryKelvin,
            p => I($"each acquisition drags the reservoir towards the precharge level ({p.Precharge.Name}); at this sample rate the source ") +
                 "cannot refill it (average current of a capacitor switched at f_s: R_eq = 1/(f_s·C_sh), Johns & Martin)",
            p => p.Estimates.AverageSamplingVolts);
        Add("settling", null, p => p.Simulated.SettlingVolts, p => p.Contributions.SettlingKelvin,
            p => SwitchOnWords.Applies(design, p) ? SwitchOnWords.Cause(design, p) : (FrontEndCircuit.ReservoirFarads(design) > 0
                    ? "the sampling capacitor shares its charge with the reservoir (ΔV·C_sh/(C_sh + C_ext), from the "
                    : "the acquisition is too short for the source resistance to charge the sampling capacitor (ΔV·e^(−t/τ), from the ")
                 + (p.FirstConversion ? "settled pin" : "pin with the average sampling current") + I($"; precharge {p.Precharge.Name}, {p.SampleKind} conversion)"),
            p => SwitchOnWords.Applies(design, p) ? SwitchOnWords.EstimateVolts(design, p)
                : p.FirstConversion ? p.Estimates.FirstConversionVolts : p.Estimates.SteadySettlingVolts);
        if (design.Amplifier is not null)
            Add("amplifier-static", "the amplifier's offset, drift, gain error, common mode and bias currents shift the pin by more than ½ LSB",
                p => p.Simulated.BufferVolts, p => p.Contributions.BufferKelvin, p => AmplifierWords.Cause(design, p), p => p.Estimates.BufferVolts);
        if (design.Buffer is not null)
            Add("buffer-static", "the buffer's offset, drift and bias currents shift the pin by more than ½ LSB",
                p => p.Simulated.BufferVolts, p => p.Contributions.BufferKelvin, p => BufferCause(design, p), p => p.Estimates.BufferVolts);
        Add("self-heating", "the sensor's self-heating moves the reading by more than ½ LSB",
            p => p.Simulated.SelfHeatingVolts, p => p.Contributions.SelfHeatingKelvin,
            p => (design.CurrentSource is null ? "the sensor dissipates its share of the divider's power" : "the sensor dissipates I²R of the excitation current") +
                 I($" and warms by P/δ (IEC 60539-1), δ = {design.Sensor.DissipationConstantWattsPerKelvin * 1e3:0.###} mW/K; ") +
                 I($"{p.Contributions.SelfHeatingKelvin * 1e3:0.#} mK at {p.Celsius:0.##} °C"),
            p => p.Estimates.SelfHeatingVolts, simulated: false);
        findings.AddRange(Noise.NoiseFindingRules.Evaluate(design, lsb, points));
        return findings;

        void Add(string id, string? title, Func<CheckPoint, double> volts, Func<CheckPoint, double> kelvin, Func<CheckPoint, string> cause,
            Func<CheckPoint, double> estimate, bool simulated = true)
        {
            if (Effect(points, volts, kelvin, lsb / 2) is not { } span) return;
            var w = span.Worst;
            var size = volts(w);
            findings.Add(new Finding(id, span.Severity,
                title ?? (SwitchOnWords.Applies(design, w) ? SwitchOnWords.Title : w.FirstConversion ? "the first conversion after a precharge does not settle" : "the sampled value does not settle"),
                span.From, span.To, w.Celsius, size, size / lsb, kelvin(w), cause(w), estimate(w), simulated ? size : null, []));
        }
    }

    /// <summary>
    /// Where an effect exceeds ½ LSB, its worst point (the largest contribution in K against the budget there) and its
    /// severity from its own size: FAIL when its contribution exceeds the budget anywhere. Null if it never exceeds ½ LSB.
    /// </summary>
    private static EffectSpan? Effect(IReadOnlyList<CheckPoint> points, Func<CheckPoint, double> volts, Func<CheckPoint, double> kelvin, double halfLsb)
    {
        var over = points.Where(p => Math.Abs(volts(p)) > halfLsb).ToList();
        if (over.Count == 0) return null;
        var worst = over.MaxBy(p => Math.Abs(kelvin(p)) / p.BudgetKelvin is var r && double.IsFinite(r) ? r : 0)!;
        if (Math.Abs(kelvin(worst)) == 0) worst = over.MaxBy(p => Math.Abs(volts(p)))!;
        var fails = points.Any(p => Math.Abs(kelvin(p)) > p.BudgetKelvin);
        return new EffectSpan(worst, over[0].Celsius, over[^1].Celsius, fails ? Severity.Fail : Severity.Warn);
    }

    private sealed record EffectSpan(CheckPoint Worst, double From, double To, Severity Severity);

    /// <summary>Quantisation alone: a failure where half an LSB is already more than the budget.</summary>
    private static IEnumerable<Finding> Resolution(FrontEndDesign design, ClosedFormModel model, IReadOnlyList<CheckPoint> points)
    {
        var over = points.Where(p => p.KelvinPerLsb / 2 > p.BudgetKelvin).ToList();
        if (over.Count == 0) yield break;
        var worst = over.MaxBy(p => p.KelvinPerLsb / 2 / p.BudgetKelvin)!;
        yield return new Finding("resolution", Severity.Fail, "the converter's resolution alone exceeds the budget",
            over[0].Celsius, over[^1].Celsius, worst.Celsius, model.Adc.LsbVolts / 2, 0.5, worst.KelvinPerLsb / 2,
            I($"one LSB is {worst.KelvinPerLsb:0.###} K at {worst.Celsius:0.##} °C, so quantisation alone reaches ±{worst.KelvinPerLsb / 2:0.###} K (IEEE Std 1241: ±Q/2)"),
            null, null, []);
    }

    /// <summary>The budget broken: where, by how much, and the cause that dominates at the worst point.</summary>
    public static Finding? OverBudget(ClosedFormModel model, IReadOnlyList<CheckPoint> points, IReadOnlyList<Finding> findings)
    {
        var over = points.Where(p => !p.WithinBudget).ToList();
        if (over.Count == 0) return null;
        var worst = over.MaxBy(p => double.IsFinite(p.ErrorKelvin) ? Math.Abs(p.ErrorKelvin) : double.PositiveInfinity)!;
        // The reading as a voltage: what the firmware takes the code to stand for, against the closed form.
        var volts = model.Adc.VoltsOf(worst.Code) - worst.IdealVolts;
        var cause = double.IsFinite(worst.ErrorKelvin)
            ? I($"the largest contribution at {worst.Celsius:0.##} °C is {Dominant(worst.Contributions)}") + NoiseNote(worst) +
              (findings.Count(f => f.Severity == Severity.Fail) == 0 ? "; no single effect exceeds the budget on its own: they add up" : "")
            : I($"at {worst.Celsius:0.##} °C the code {worst.Code} cannot come from a sensor inside its valid range");
        return new Finding(OverBudgetId, Severity.Fail, $"the reported temperature is outside the budget at {over.Count} of {points.Count} points",
            over[0].Celsius, over[^1].Celsius, worst.Celsius, volts, volts / model.Adc.LsbVolts, worst.ErrorKelvin, cause, null, volts, []);
    }

    /// <summary>The size at the pin of the effect a finding is about, at one point (null for findings that are not a column).</summary>
    public static double? ColumnVolts(string findingId, CheckPoint p) => findingId switch
    {
        "converter" => p.Simulated.ConverterVolts,
        "dc-loading" => p.Simulated.DcLoadingVolts,
        "reservoir-recovery" => p.Simulated.RecoveryVolts,
        "settling" => p.Simulated.SettlingVolts,
        "buffer-static" => p.Simulated.BufferVolts,
        "self-heating" => p.Simulated.SelfHeatingVolts,
        Noise.NoiseFindingRules.NoiseId => p.Noise?.CoveredVolts ?? 0,
        Noise.NoiseFindingRules.RampLagId => p.Noise?.RampLagVolts ?? 0,
        _ => null,
    };

    /// <summary>The columns of a point ordered by the size of their contribution, largest first (the rest last).</summary>
    public static IReadOnlyList<(string Column, string FindingId, double Kelvin)> ByContribution(ErrorContributions c) =>
        [.. c.Columns.Where(x => x.FindingId.Length > 0).OrderByDescending(x => Math.Abs(x.Kelvin))];

    /// <summary>What noise and the ramp's lag add to the static error at the point (they count in the budget beside it).</summary>
    private static string NoiseNote(CheckPoint p) =>
        (p.NoiseKelvin > 0 ? I($"; noise adds ±{p.NoiseKelvin:0.###} K (±{p.Noise!.Coverage:0.##}σ)") : "") +
        (p.RampLagKelvin > 0 ? I($" and the lag on the ramp {p.RampLagKelvin:0.###} K") : "") +
        (p.NoiseKelvin + p.RampLagKelvin > 0 ? I($" to the static {p.ErrorKelvin:+0.###;-0.###} K, against the budget ±{p.BudgetKelvin:0.###} K") : "");

    private static string Dominant(ErrorContributions c)
    {
        var top = c.Columns.MaxBy(p => Math.Abs(p.Kelvin));
        return I($"{top.Column} ({top.Kelvin:+0.###;-0.###} K)");
    }

    private static string Tempco(double perKelvin, bool signed) => Bounded(I($"{Math.Abs(perKelvin) * 1e6:0.###} ppm/K"), signed, perKelvin);

    private static string LoadingCause(FrontEndDesign design, CheckPoint p)
    {
        var parts = new List<string>();
        var stage = design.Adc.GainStage is { InputCurrentAmperes: not 0 } g
            ? "the gain stage's input current " + Bounded(Amps(Math.Abs(g.InputCurrentAmperes)), g.InputCurrentSigned, g.InputCurrentAmperes) : null;
        var leak = design.Adc.PinLeakageAmperes != 0
            ? "pin leakage " + Bounded(Amps(Math.Abs(EffectEstimator.LeakageAmps(design, p.Celsius))), design.Adc.PinLeakageSigned, design.Adc.PinLeakageAmperes) : null;
        if (leak is not null || stage is not null)
            parts.Add(string.Join(" and ", new[] { leak, stage }.OfType<string>()) + " " +
                      I($"through the {Ohms(p.Estimates.SourceOhms)} the pin sees (Ohm's law) {Volts(p.Estimates.LeakageVolts)}"));
        if (design is { Divider: { } half, Bridge: { } bridge } && (half.FixedTempcoPerKelvin != 0 || bridge.HighTempcoPerKelvin != 0 || bridge.LowTempcoPerKelvin != 0))
            parts.Add(I($"the bridge's tempcos (fixed {Tempco(half.FixedTempcoPerKelvin, half.FixedTempcoSigned)}, opposite high {Tempco(bridge.HighTempcoPerKelvin, bridge.HighTempcoSigned)}, ") +
                      I($"opposite low {Tempco(bridge.LowTempcoPerKelvin, bridge.LowTempcoSigned)}) at {(design.Check.BoardCelsius ?? p.Celsius):0.##} °C through both halves {Volts(p.Estimates.FixedDriftVolts)}"));
        else if (design.Divider is { FixedTempcoPerKelvin: not 0 } divider)
            parts.Add(I($"the fixed resistor's tempco of {Bounded(I($"{Math.Abs(divider.FixedTempcoPerKelvin) * 1e6:0.###} ppm/K"), divider.FixedTempcoSigned, divider.FixedTempcoPerKelvin)} ") +
                      I($"at {(design.Check.BoardCelsius ?? p.Celsius):0.##} °C {Volts(p.Estimates.FixedDriftVolts)}"));
        if (design.Netlist is { } netlist && netlist.Parts.Where(x => x.TempcoPerKelvin != 0).ToList() is { Count: > 0 } drifting)
            parts.Add(I($"the tempco of {string.Join(", ", drifting.Select(x => I($"{x.Name} {Bounded(I($"{Math.Abs(x.TempcoPerKelvin) * 1e6:0.###} ppm/K"), x.TempcoSigned, x.TempcoPerKelvin)}")))} ") +
                      I($"at {(design.Check.BoardCelsius ?? p.Celsius):0.##} °C through the netlist's ideal transfer {Volts(p.Estimates.FixedDriftVolts)}"));
        if (design.Netlist is { } withDiodes && withDiodes.Parsed.Elements.Where(x => x.Kind == 'D').Select(x => x.Name).ToList() is { Count: > 0 } diodes)
            parts.Add(I($"the netlist's diodes ({string.Join(", ", diodes)}), open in the closed form, whose conduction and leakage only the simulation ") +
                      I($"counts: {Volts(p.Simulated.DcLoadingVolts - p.Estimates.LoadingVolts)} beyond the estimate"));
        if (design.CurrentSource is { } source)
            parts.Add(CurrentWords.Loading(design, source, p));
        else if (design.Wiring is { Wires: 3 } armLeads)
            parts.Add(I($"the 3 leads of {Ohms(armLeads.LeadOhms)} each at {(armLeads.LeadCelsius ?? design.Check.BoardCelsius ?? p.Celsius):0.##} °C in the bridge's arms ") +
                      I($"(one beside the sensor{(armLeads.LeadMismatch == 0 ? "" : " " + Bounded(I($"{Math.Abs(armLeads.LeadMismatch) * 100:0.###} %"), armLeads.LeadMismatchSigned, armLeads.LeadMismatch) + " longer")}, one beside the fixed resistor, one in the sense line: ") +
                      I($"the divider with R_s + R_L·(1 + m) and R_f + R_L; the mismatch term E·m·R_L·R_f/(R_s + R_f)²) {Volts(p.Estimates.LeadVolts)}"));
        else if (design.Wiring is { } wiring)
            parts.Add(I($"the 2 leads of {Ohms(wiring.LeadOhms)} each at {(wiring.LeadCelsius ?? design.Check.BoardCelsius ?? p.Celsius):0.##} °C in the sensor's arm ") +
                      I($"(the divider with R_s + 2·R_L) {Volts(p.Estimates.LeadVolts)}"));
        if (design.Protection is { } protection)
            parts.AddRange(ProtectionWords.Loading(design, protection, p));
        if (design.Adc.DeltaSigma is { } d)
            parts.Add(d.InputBuffered
                ? I($"the converter's input buffer drawing {Amps(d.InputCurrentAmperes)} through the {Ohms(p.Estimates.SourceOhms)} the pin sees (Ohm's law) {Volts(p.Estimates.InputLoadVolts)}")
                : I($"the converter's unbuffered input, on average R_eq = 1/(f_mod·C) = {Ohms(FrontEnd.DeltaSigma.InputLoading.EquivalentOhms(d))} to ground behind ") +
                  I($"the {Ohms(p.Estimates.SourceOhms)} the pin sees (−V·R_s/(R_s + R_eq), Johns & Martin) {Volts(p.Estimates.InputLoadVolts)}"));
        return string.Join(", and ", parts) + CornerNote(p);
    }

    private static string ConverterCause(FrontEndDesign design, CheckPoint p, double lsb)
    {
        var adc = design.Adc;
        var parts = new List<string>();
        if (adc.OffsetErrorLsb != 0) parts.Add("offset " + Bounded(I($"{Math.Abs(adc.OffsetErrorLsb):0.###} LSB"), adc.OffsetErrorSigned, adc.OffsetErrorLsb));
        if (adc.GainError != 0) parts.Add("gain error " + Bounded(I($"{Math.Abs(adc.GainError) * 100:0.###} %"), adc.GainErrorSigned, adc.GainError));
        if (adc.InlLsb != 0) parts.Add(I($"INL ±{adc.InlLsb:0.###} LSB as a bow"));
        if (adc.GainStage is { GainError: not 0 } stage)
            parts.Add(I($"the gain stage's gain error ") + Bounded(I($"{Math.Abs(stage.GainError) * 100:0.###} %"), stage.GainErrorSigned, stage.GainError)
                      + I($" at gain {stage.Gain:G6} (G·(1 + e)·V: {p.SampleVolts / lsb * Math.Abs(stage.GainError):0.##} LSB)"));
        if (adc.ReferenceTempcoPerKelvin != 0 && !adc.IsRatiometric)
            parts.Add("reference tempco " + Bounded(I($"{Math.Abs(adc.ReferenceTempcoPerKelvin) * 1e6:0.###} ppm/K"), adc.ReferenceTempcoSigned, adc.ReferenceTempcoPerKelvin)
                      + ReferenceDrift(design, p, lsb));
        return string.Join(", ", parts) + I($" (IEEE Std 1241 terms): the code moves by {p.Simulated.ConverterVolts / lsb:+0.##;-0.##} LSB at {p.Celsius:0.##} °C") + CornerNote(p);
    }

    /// <summary>
    /// The reference's own part, closed form: at the board temperature it is V_ref·(1 + δ) with δ = tc·(T − 25 °C), so a
    /// sample V reads as the code V/(Q·(1 + δ)) and moves by V/Q·(1/(1 + δ) − 1) LSB (code = V/Q, IEEE Std 1241). A bound
    /// takes the sign of the point's corner: the upper corner lowers the reference.
    /// </summary>
    private static string ReferenceDrift(FrontEndDesign design, CheckPoint p, double lsb)
    {
        var board = design.Check.BoardCelsius ?? p.Celsius;
        var tempco = design.Adc.ReferenceTempcoPerKelvin;
        var drift = design.Adc.ReferenceTempcoSigned ? tempco * (board - 25) : (p.Corner == "bounds down" ? 1 : -1) * Math.Abs(tempco * (board - 25));
        return I($" (the reference at {board:0.##} °C is {drift * 100:+0.####;-0.####} % off, V/Q·(1/(1 + δ) − 1) = {p.SampleVolts / lsb * (1 / (1 + drift) - 1):+0.##;-0.##} LSB)");
    }

    private static string BufferCause(FrontEndDesign design, CheckPoint p)
    {
        var b = design.Buffer!;
        var words = new List<string>();
        if (b.OffsetVolts != 0) words.Add("offset " + Bounded(Volts(Math.Abs(b.OffsetVolts)), b.OffsetSigned, b.OffsetVolts));
        if (b.OffsetDriftVoltsPerKelvin != 0) words.Add("drift " + Bounded(EngineeringFormat.Format(Math.Abs(b.OffsetDriftVoltsPerKelvin), UnitKind.VoltPerKelvin, 4), b.OffsetDriftSigned, b.OffsetDriftVoltsPerKelvin) +
                                                        I($" with the op-amp at {(design.Check.BoardCelsius ?? p.Celsius):0.##} °C"));
        if (b.BiasCurrentAmperes != 0) words.Add("bias current " + Bounded(Amps(Math.Abs(b.BiasCurrentAmperes)), b.BiasCurrentSigned, b.BiasCurrentAmperes));
        var thevenin = p.SensorOhms * design.VoltageDivider.FixedResistorOhms / (p.SensorOhms + design.VoltageDivider.FixedResistorOhms);
        return string.Join(", ", words) + I($": offset and drift {Volts(p.Estimates.BufferOffsetVolts)} (times the stage gain), bias current through the divider's {Ohms(thevenin)} ") +
               I($"{Volts(p.Estimates.BiasCurrentVolts)} (Ohm's law), and the finite open-loop gain") + CornerNote(p);
    }

    /// <summary>A value as the design gives it: "±25 nA (a bound)" or "+25 nA" when written with its sign.</summary>
    internal static string Bounded(string magnitude, bool signed, double value) =>
        signed ? (value < 0 ? "−" : "+") + magnitude : "±" + magnitude + " (a bound)";

    /// <summary>Which corner of the bounds the point's reading is at.</summary>
    internal static string CornerNote(CheckPoint p) => p.Corner.Length > 0 ? I($"; the bounds at the corner that reads worse here ({p.Corner})") : "";

    internal static string Volts(double v) => EngineeringFormat.Format(v, UnitKind.Volt, 4);
    private static string Amps(double a) => EngineeringFormat.Format(a, UnitKind.Ampere, 4);
    private static string Ohms(double r) => EngineeringFormat.Format(r, UnitKind.Ohm, 4);
    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
