using System.Globalization;
using ThermVerify.Baselines;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Quantities;

namespace ThermVerify.Reporting;

/// <summary>Number formats shared by the HTML and Markdown reports, so both print a figure the same way.</summary>
internal static class ReportFormat
{
    public static string V(double value, UnitKind unit) => double.IsFinite(value) ? EngineeringFormat.Format(value, unit, 4) : "n/a";
    public static string C(double celsius) => $"{N(celsius, "0.##")} °C";
    public static string N(double value, string format) => double.IsFinite(value) ? value.ToString(format, CultureInfo.InvariantCulture) : "n/a";

    public static string K(double kelvin, bool signed = true) =>
        !double.IsFinite(kelvin) ? "n/a" : N(kelvin, signed ? "+0.000;-0.000;0.000" : "0.000") + " K";

    public static string Verdict(CheckResult r)
    {
        var w = r.Worst;
        return r.Passed
            ? $"PASS: worst reported error {K(w.ErrorKelvin)} at {C(w.Celsius)} (budget {K(w.BudgetKelvin, false)})"
            : $"FAIL: worst reported error {K(w.ErrorKelvin)} at {C(w.Celsius)} (budget {K(w.BudgetKelvin, false)}); " +
              $"{r.Points.Count(p => !p.WithinBudget)} of {r.Points.Count} points over budget, {r.Findings.Count(f => f.Severity == Severity.Fail)} failing finding(s)";
    }

    public static string RemedyValue(Remedy r) => r.Value is not { } v ? "" : r.Unit switch
    {
        "ppm/K" => $"{N(v * 1e6, "0.###")} ppm/K",
        "fraction" => $"{N(v * 100, "0.####")} %",
        _ => KindOf(r.Unit) is { } kind ? V(v, kind) : $"{N(v, "0.###")} {r.Unit}",
    };

    /// <summary>The SI unit a result's unit symbol names (remedies, tolerances), printed with its prefix; null for the others.</summary>
    public static UnitKind? KindOf(string unit) => unit switch
    {
        "s" => UnitKind.Second,
        "F" => UnitKind.Farad,
        "Hz" => UnitKind.Hertz,
        "Ω" => UnitKind.Ohm,
        "V" => UnitKind.Volt,
        "A" => UnitKind.Ampere,
        "V/s" => UnitKind.VoltPerSecond,
        "V/K" => UnitKind.VoltPerKelvin,
        "W/K" => UnitKind.WattPerKelvin,
        "V/√Hz" => UnitKind.VoltPerRootHertz,
        _ => null,
    };

    /// <summary>A remedy in one line: the action and value with its key, and the other changes of a combination.</summary>
    public static string RemedyLine(Remedy r) =>
        $"{r.Action}{(r.Value is null ? "" : " " + RemedyValue(r))} [{r.Key}]" +
        string.Concat(r.Together.Select(t => $" together with: {t.Action}{(t.Value is null ? "" : " " + RemedyValue(t))} [{t.Key}]"));

    /// <summary>
    /// The contribution columns of a result: those that are not zero at every point (an effect the design does not
    /// have is left out; the columns shown still add up to the error). The split gives exactly zero for an effect the
    /// design does not have (no converter errors, nothing unmappable); a simulated effect below a nanokelvin is the
    /// residual of a transient (a follower's pin settles to 1e-14 V, 1e-11 K), not an effect worth a column.
    /// </summary>
    private const double ResidualKelvin = 1e-9;

    public static IReadOnlyList<(string Header, Func<CheckPoint, double> Kelvin)> ContributionColumns(IReadOnlyList<CheckPoint> points)
    {
        var all = new (string Header, Func<CheckPoint, double> Kelvin)[]
        {
            ("quantisation", p => p.Contributions.QuantisationKelvin),
            ("converter", p => p.Contributions.ConverterKelvin),
            ("DC loading", p => p.Contributions.DcLoadingKelvin),
            ("recovery", p => p.Contributions.RecoveryKelvin),
            ("settling", p => p.Contributions.SettlingKelvin),
            ("buffer", p => p.Contributions.BufferKelvin),
            ("self-heating", p => p.Contributions.SelfHeatingKelvin),
            ("rest", p => p.Contributions.RestKelvin),
        };
        return [.. all.Where((c, i) => i == 0 || points.Any(p => Math.Abs(c.Kelvin(p)) > ResidualKelvin))];
    }

    /// <summary>Which reading a point converts: the precharge case, the first or steady sample, the INL sign where INL is a bound.</summary>
    public static string ReadingCell(CheckPoint p) => ReferenceEquals(p.Precharge, Check.DeltaSigma.DeltaSigmaCheck.Reading)
        ? p.Precharge.Name + (p.Corner.Length > 0 ? $", {p.Corner}" : "")
        : $"{p.Precharge.Name}, {p.SampleKind}" + (p.Corner.Length > 0 ? $", {p.Corner}" : "");

    /// <summary>How the converter samples: a successive-approximation converter's rate and window, a delta-sigma converter's rates, input and filter.</summary>
    public static string ConverterTiming(Design.FrontEndDesign d) => d.Adc.DeltaSigma is { } ds
        ? $"delta-sigma, modulator {V(ds.ModulatorRateHertz, UnitKind.Hertz)}, {V(ds.DataRateHertz, UnitKind.Hertz)} data rate, " +
          $"{(ds.InputBuffered ? "buffered" : $"unbuffered ({V(ds.SamplingCapacitanceFarads, UnitKind.Farad)})")} input, {Check.DeltaSigma.DeltaSigmaFindings.FilterWords(ds)}" +
          $"{(ds.FilterReset ? " reset on a channel change" : " not reset on a channel change")}, {ds.ReadingsDiscarded} reading(s) discarded"
        : $"{V(d.Adc.SampleRateHertz, UnitKind.Hertz)}, acquisition {V(d.Adc.AcquisitionTimeSeconds, UnitKind.Second)}";

    /// <summary>
    /// The declared tolerances of nominal-valued parts, which `check` leaves at nominal and `worstcase` and `montecarlo`
    /// spread; null when the design declares none. Said in every check's header so that a PASS is not read as covering them.
    /// </summary>
    public static string? NominalPartsLine(Design.FrontEndDesign d)
    {
        var tolerances = Tolerances.NominalValuedTolerances.Of(d);
        if (tolerances.Count == 0) return null;
        var items = tolerances.Select(p => p.Kind == Tolerances.ToleranceKind.RtdClass && d.Sensor is Design.RtdSensorSpec { ToleranceClass: { } c }
            ? $"sensor.class {c}" : $"{p.Key} ±{Text.ToleranceText.HalfWidth(p)}");
        return $"parts at their nominal values in this verdict; `thermverify worstcase` and `montecarlo` spread {string.Join(", ", items)}";
    }

    /// <summary>The precharge setting and the cases it covers, for headers.</summary>
    public static string PrechargeLine(CheckResult r) =>
        r.PrechargeCases.Count == 1
            ? $"{PrechargeText(r.Design.Adc.Precharge)} ({r.PrechargeCases[0].Describe()})"
            : $"{PrechargeText(r.Design.Adc.Precharge)}: every case is checked ({string.Join(", ", r.PrechargeCases.Select(CaseText))}); the worst at each temperature is reported (column \"reading\")";

    private static string CaseText(PrechargeCase c) =>
        c.Volts is { } v && !c.Name.EndsWith(" V", StringComparison.Ordinal) ? $"{c.Name} {V(v, UnitKind.Volt)}" : c.Name;

    public static string PrechargeText(Design.PrechargeMode mode) => Precharge(mode);

    public static string Figure(double? value, string unit) => value is { } v ? $"{N(v, "0.####")} {unit}" : "none (unreadable code)";

    public static string Delta(FigureChange f) => f.Delta is { } d ? N(d, "+0.####;-0.####;0") : "";

    public static string ChangeText(Change c) => c switch
    {
        Change.Same => "same",
        Change.Better => "better",
        Change.Worse => "WORSE",
        Change.New => "new",
        _ => "gone",
    };

    /// <summary>Both ends, the worst point and evenly spread points between, in temperature order.</summary>
    public static IEnumerable<CheckPoint> Selected(IReadOnlyList<CheckPoint> points, CheckPoint worst, int rows) =>
        Enumerable.Range(0, rows - 1)
            .Select(i => points[(int)Math.Round(i * (points.Count - 1) / (double)Math.Max(rows - 2, 1))])
            .Append(worst).Distinct().OrderBy(p => p.Celsius);

    public static string[] PointHeaders(IReadOnlyList<CheckPoint> points) =>
        ["T (°C)", "ideal", "DC pin", "sample", "code", "reported (°C)", "error (K)", .. ContributionColumns(points).Select(c => c.Header),
            NoiseHeader(points) + " (K)", "budget (K)", "K/LSB", "noise-free (K)", "reading"];

    public static string[] PointCells(CheckPoint p, IReadOnlyList<CheckPoint> points) =>
    [
        N(p.Celsius, "0.##"), V(p.IdealVolts, UnitKind.Volt), V(p.DcPinVolts, UnitKind.Volt), V(p.SampleVolts, UnitKind.Volt),
        p.Code.ToString(CultureInfo.InvariantCulture), double.IsFinite(p.ReportedCelsius) ? N(p.ReportedCelsius, "0.000") : "none",
        Signed(p.ErrorKelvin), .. ContributionColumns(points).Select(c => Signed(c.Kelvin(p))),
        NoiseCell(p), N(p.BudgetKelvin, "0.###"), N(p.KelvinPerLsb, "0.0000"), p.Noise is { } n ? N(n.NoiseFreeResolutionKelvin, "0.0000") : "none", ReadingCell(p),
    ];

    /// <summary>The header of the noise column: what the budget counts beside the error, at the design's coverage.</summary>
    public static string NoiseHeader(IReadOnlyList<CheckPoint> points) =>
        "noise ±" + N(points.Select(p => p.Noise?.Coverage).FirstOrDefault(c => c is not null) ?? Design.DesignDefaults.NoiseCoverage, "0.##") + "σ";

    /// <summary>±k·σ of the reading in K, with the ramp lag after a plus where the design declares a ramp.</summary>
    public static string NoiseCell(CheckPoint p) =>
        N(p.NoiseKelvin, "0.000") + (p.RampLagKelvin > 0 ? " + " + N(p.RampLagKelvin, "0.000") + " lag" : "");

    private static string Precharge(Design.PrechargeMode mode) => mode switch
    {
        Design.PrechargeMode.LastSample => "last-sample",
        Design.PrechargeMode.OtherChannel => "other-channel",
        Design.PrechargeMode.Discharged => "discharged",
        _ => "worst",
    };

    private static string Signed(double kelvin) => N(kelvin, "+0.000;-0.000;0.000");

    /// <summary>The design's settings and the precharge cases the check covered (the worst of them is each point's "reading").</summary>
    /// <summary>The excitation in a line: the divider, or the current source with its reference resistor.</summary>
    public static (string Label, string Value) Excitation(Design.FrontEndDesign d)
    {
        if (d.Netlist is { } n)
            return ("netlist", $"{n.File} ({n.Parsed.Elements.Count} elements): sensor {string.Join(", ", n.SensorElements)}, converter at node {n.PinNode}" +
                               (n.NegativePinNode is { } negative ? $" against node {negative}" : "") +
                               (n.Excitation.Count > 0 ? $", excitation {string.Join(", ", n.Excitation)}" : "") +
                               (n.SwitchOnLeadSeconds is { } lead ? $", switched on {V(lead, UnitKind.Second)} before the first sample" : ""));
        if (d is { Divider: { } half, Bridge: { } bridge })
            return ("bridge", $"sensor on the {(half.SensorSide == Design.SensorSide.High ? "high" : "low")} side, fixed {V(half.FixedResistorOhms, UnitKind.Ohm)}, " +
                              $"opposite half {V(bridge.HighOhms, UnitKind.Ohm)} over {V(bridge.LowOhms, UnitKind.Ohm)}, excitation {V(half.ExcitationVolts, UnitKind.Volt)}" +
                              (d.Amplifier is null ? ", read differentially" : "") +
                              (d.Amplifier is { } amp ? $", through an amplifier of gain {amp.Gain.ToString("0.###", System.Globalization.CultureInfo.InvariantCulture)}" : "") +
                              (d.Wiring is { } bridgeLeads ? $", {bridgeLeads.Wires} wires of {V(bridgeLeads.LeadOhms, UnitKind.Ohm)}{(bridgeLeads.Wires == 3 ? " in the bridge's arms" : "")}" : ""));
        if (d.Divider is { } divider)
            return ("divider", $"sensor on the {(divider.SensorSide == Design.SensorSide.High ? "high" : "low")} side, fixed {V(divider.FixedResistorOhms, UnitKind.Ohm)}, excitation {V(divider.ExcitationVolts, UnitKind.Volt)}" +
                               (d.Wiring is { } leads ? $", 2 wires of {V(leads.LeadOhms, UnitKind.Ohm)}" : ""));
        var c = d.CurrentSource!;
        return ("current", $"{V(c.CurrentAmperes, UnitKind.Ampere)} through the sensor" +
                           (c.ReferenceResistorOhms is { } r ? $", reference resistor {V(r, UnitKind.Ohm)}" : "") +
                           (c.Compliance is { } range ? $", compliance {V(range.MinVolts, UnitKind.Volt)} to {V(range.MaxVolts, UnitKind.Volt)}" : "") +
                           (d.Wiring is { } w ? $", {w.Wires} wires of {V(w.LeadOhms, UnitKind.Ohm)}" : ""));
    }

    /// <summary>The converter's reference in words: a voltage, the divider's excitation, or the reference resistor's I·R_ref.</summary>
    public static string Reference(Design.FrontEndDesign d, AdcTransfer adc) =>
        (!d.Adc.IsRatiometric ? V(d.NominalReferenceVolts, UnitKind.Volt)
        : d.Netlist?.ReferenceNode is { } node ? $"ratiometric, v({node}) = {V(d.NominalReferenceVolts, UnitKind.Volt)}"
        : d.CurrentSource is null ? "ratiometric" : $"ratiometric, I·R_ref = {V(d.NominalReferenceVolts, UnitKind.Volt)}") + GainStage(d, adc);

    /// <summary>The programmable-gain stage in words, with the full scale it leaves at the pin (empty without one).</summary>
    private static string GainStage(Design.FrontEndDesign d, AdcTransfer adc) => d.Adc.GainStage is not { } g ? ""
        : $", gain stage ×{N(g.Gain, "0.####")}" + (g.GainError != 0 ? $" (gain error {(g.GainErrorSigned ? N(g.GainError * 100, "+0.####;-0.####") : "±" + N(Math.Abs(g.GainError) * 100, "0.####"))} %)" : "") +
          (g.InputCurrentAmperes != 0 ? $", input current {(g.InputCurrentSigned && g.InputCurrentAmperes > 0 ? "+" : "")}{V(g.InputCurrentAmperes, UnitKind.Ampere)}" : "") +
          $": full scale at the pin {V(adc.ReferenceVolts, UnitKind.Volt)}";

    public static IEnumerable<(string Label, string Value)> Settings(CheckResult result) =>
        Settings(result.Design, result.SensorDescription, result.Adc).Append(("precharge", PrechargeLine(result)))
            .Concat(NominalPartsLine(result.Design) is { } parts ? [("nominal", parts)] : []);

    /// <summary>The design in a few lines, for any report on it: sensor, divider, buffer, filter, ADC and the check's range and budget.</summary>
    public static IEnumerable<(string Label, string Value)> Settings(Design.FrontEndDesign d, string sensorDescription, AdcTransfer adc)
    {
        yield return ("sensor", sensorDescription);
        yield return Excitation(d);
        if (d.Buffer is { } b) yield return ("buffer", $"gain {N(b.Gain, "0.###")}, isolation {V(b.IsolationResistorOhms, UnitKind.Ohm)}");
        yield return ("filter", d.Filter.SeriesResistorOhms == 0 && d.Filter.ReservoirCapacitorFarads == 0 ? "none"
            : $"series {V(d.Filter.SeriesResistorOhms, UnitKind.Ohm)}, reservoir {V(d.Filter.ReservoirCapacitorFarads, UnitKind.Farad)}");
        yield return ("ADC", $"{d.Adc.Bits} bits, reference {Reference(d, adc)}, " +
                             $"1 LSB{(d.Adc.GainStage is null ? "" : " at the pin")} = {V(adc.LsbVolts, UnitKind.Volt)}, {V(d.Adc.SampleRateHertz, UnitKind.Hertz)}, acquisition {V(d.Adc.AcquisitionTimeSeconds, UnitKind.Second)}, " +
                             $"C_sh {V(d.Adc.SamplingCapacitanceFarads, UnitKind.Farad)}, precharge {Precharge(d.Adc.Precharge)}");
        yield return ("conventions", adc.Describe());
        yield return ("check", $"{V(d.Check.Range.MinCelsius, UnitKind.Celsius)} to {V(d.Check.Range.MaxCelsius, UnitKind.Celsius)} in {V(d.Check.StepKelvin, UnitKind.Kelvin)} steps, budget {V(d.Check.BudgetKelvin, UnitKind.Kelvin)}" +
                               string.Concat(d.Check.Regions.Select(r => $"; {C(r.Range.MinCelsius)} to {C(r.Range.MaxCelsius)}: {V(r.BudgetKelvin, UnitKind.Kelvin)}")));
    }
}
