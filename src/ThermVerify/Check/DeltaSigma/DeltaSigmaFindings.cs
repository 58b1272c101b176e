using System.Globalization;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Quantities;

namespace ThermVerify.Check.DeltaSigma;

/// <summary>
/// The delta-sigma converter's own findings, by the rule every effect follows (docs/methods.md): a finding where it
/// moves the reading by more than ½ LSB, failing where its own size in K exceeds the budget. Each remedy is found by
/// running the analysis behind the finding again on a copy of the design with the change applied, at every temperature
/// the finding was judged at, and proven as every remedy is: a check of the changed design has no finding of that id
/// and no failing finding the design did not already have (<see cref="AttachRemedies"/>).
/// </summary>
internal static class DeltaSigmaFindings
{
    public const string InputLoadingId = "input-loading";
    public const string ChannelSwitchId = "channel-switch";
    public const string InterferenceId = "interference";

    /// <summary>The analyses a check shows and judges: the input's load at the report temperatures, the channel switch at three, the rejection at mid-range.</summary>
    public static DeltaSigmaReport Analyse(FrontEndDesign design, ICheckEngine engine)
    {
        var d = design.Adc.DeltaSigma!;
        var filter = SincFilter.Of(d);
        var temperatures = Noise.ReadingNoiseAnalysis.ReportTemperatures(design.Check.Range);
        var loads = temperatures.Select(t => InputLoading.At(design, t, engine)).ToList();
        var switches = SwitchTemperatures(design).SelectMany(t => Starts(design).Select(s => ChannelSettling.At(design, t, engine, s))).ToList();
        var model = new ClosedFormModel(design);
        var worstSwitch = switches.MaxBy(s => Math.Abs(s.FirstUsedErrorVolts / model.At(s.Celsius).VoltsPerKelvin) / design.Check.BudgetAt(s.Celsius))!;
        var mid = (design.Check.Range.MinCelsius + design.Check.Range.MaxCelsius) / 2;
        return new DeltaSigmaReport(FilterWords(d), d.Decimation, d.ModulatorRateHertz, d.DataRateHertz, filter.NoiseBandwidthHertz,
            filter.SettlingConversions, loads, worstSwitch, MainsRejection.At(design, mid), mid);
    }

    public static ChannelStart Start(DeltaSigmaSpec d) => d.SharedFilter ? ChannelStart.SharedFilter : ChannelStart.OwnFilter;

    /// <summary>The starts a reading follows: the channel switch, and the excitation's switch-on where the divider is switched.</summary>
    public static ChannelStart[] Starts(FrontEndDesign design) =>
        ChannelSettling.SwitchOnLeadSeconds(design) > 0 ? [Start(design.Adc.DeltaSigma!), ChannelStart.SwitchOn] : [Start(design.Adc.DeltaSigma!)];

    public static string FilterWords(DeltaSigmaSpec d) =>
        I($"sinc{d.FilterOrder}") + (d.AverageLength > 1 ? I($" and the mean of {d.AverageLength} outputs") : "");

    private static double[] SwitchTemperatures(FrontEndDesign design) =>
        [.. new[] { design.Check.Range.MinCelsius, (design.Check.Range.MinCelsius + design.Check.Range.MaxCelsius) / 2, design.Check.Range.MaxCelsius }.Distinct()];

    public static IEnumerable<Finding> Evaluate(FrontEndDesign design, DeltaSigmaReport report)
    {
        var model = new ClosedFormModel(design);
        var lsb = model.Adc.LsbVolts;
        if (InputLoadingFinding(design, model, report, lsb) is { } loading) yield return loading;
        if (ChannelSwitchFinding(design, model, report, lsb) is { } channel) yield return channel;
        if (InterferenceFinding(design, report, lsb) is { } interference) yield return interference;
    }

    /// <summary>
    /// The result with the delta-sigma findings' remedies: each candidate found by its own analysis (cheap, run many
    /// times), then proven as every remedy is: <paramref name="check"/> checks a copy of the design with the change
    /// applied, which must have no finding of that id and no failing finding the design did not already have.
    /// </summary>
    public static CheckResult AttachRemedies(CheckResult result, ICheckEngine engine, Func<FrontEndDesign, CheckResult> check)
    {
        var design = result.Design;
        var report = result.DeltaSigma!;
        var lsb = result.Adc.LsbVolts;
        var failedBefore = result.Findings.Where(f => f.Severity == Severity.Fail).Select(f => f.Id).ToHashSet();
        Finding Attach(Finding f)
        {
            var candidates = f.Id switch
            {
                InputLoadingId => InputLoadingRemedies(design, lsb, engine),
                ChannelSwitchId => ChannelRemedies(design, report.ChannelSwitch, engine),
                InterferenceId => InterferenceRemedies(design, lsb, report.RejectionCelsius),
                _ => null,
            };
            if (candidates is null) return f;
            var proven = new List<Remedy>();
            foreach (var (remedy, changed) in candidates)
            {
                var c = check(changed);
                var newFailing = c.Findings.Where(x => x.Severity == Severity.Fail && !failedBefore.Contains(x.Id)).Select(x => x.Id).ToList();
                if (c.Findings.Any(x => x.Id == f.Id) || newFailing.Count > 0) continue;
                proven.Add(remedy with
                {
                    Proof = remedy.Proof + I($"; a check of the changed design has no {f.Id} finding and no new failing one ({(c.Passed ? "it passes" : "it still fails: " + string.Join(", ", c.Findings.Where(x => x.Severity == Severity.Fail).Select(x => x.Id)))})"),
                });
            }
            return proven.Count > 0 ? f with { Remedies = proven }
                : f with { RemedyNote = candidates.Count == 0 ? "no change searched clears it" : "the changes found clear it in its own analysis, but a check of the changed design does not prove them" };
        }
        return result with { Findings = [.. result.Findings.Select(Attach)] };
    }

    private static Finding? InputLoadingFinding(FrontEndDesign design, ClosedFormModel model, DeltaSigmaReport report, double lsb)
    {
        var over = report.InputLoading.Where(l => Math.Abs(l.ErrorVolts) > lsb / 2).ToList();
        if (over.Count == 0) return null;
        double K(InputLoad l) => Math.Abs(l.ErrorVolts / model.At(l.Celsius).VoltsPerKelvin);
        var w = over.MaxBy(l => K(l) / design.Check.BudgetAt(l.Celsius))!;
        var d = design.Adc.DeltaSigma!;
        var cause = d.InputBuffered
            ? I($"the buffer's input current {Show(d.InputCurrentAmperes, UnitKind.Ampere)} flows through R_s = {Show(w.SourceOhms, UnitKind.Ohm)} (Ohm's law)")
            : I($"the unbuffered input charges {Show(d.SamplingCapacitanceFarads, UnitKind.Farad)} at {Show(d.ModulatorRateHertz, UnitKind.Hertz)}: on average R_eq = 1/(f_mod·C) = {Show(w.EquivalentOhms, UnitKind.Ohm)} to ground ") +
              I($"(Johns & Martin) behind R_s = {Show(w.SourceOhms, UnitKind.Ohm)}; the switched run takes {Show(w.ErrorVolts, UnitKind.Volt)}, ") +
              I($"the average resistor {Show(w.AverageVolts - w.UnloadedVolts, UnitKind.Volt)}, the closed form −V·R_s/(R_s + R_eq) {Show(w.ClosedFormVolts - w.UnloadedVolts, UnitKind.Volt)}");
        return new Finding(InputLoadingId, over.Any(l => K(l) > design.Check.BudgetAt(l.Celsius)) ? Severity.Fail : Severity.Warn,
            "the converter's input loads the source by more than ½ LSB", over[0].Celsius, over[^1].Celsius, w.Celsius, w.ErrorVolts, w.ErrorVolts / lsb,
            w.ErrorVolts / model.At(w.Celsius).VoltsPerKelvin, // signed, as the other findings show their size in K
            cause, w.ClosedFormVolts - w.UnloadedVolts, w.ErrorVolts, []);
    }

    private static Finding? ChannelSwitchFinding(FrontEndDesign design, ClosedFormModel model, DeltaSigmaReport report, double lsb)
    {
        var s = report.ChannelSwitch;
        if (!s.FirstUsedOff) return null;
        var d = design.Adc.DeltaSigma!;
        var kelvin = Math.Abs(s.FirstUsedErrorVolts / model.At(s.Celsius).VoltsPerKelvin);
        var discard = s.ReadingsToDiscard is { } n
            ? I($"discard {n} reading{(n == 1 ? "" : "s")} (readings_discarded = {n}): reading {n + 1} is the first within ½ LSB, {Show(s.SettledSeconds!.Value, UnitKind.Second)} after the switch")
            : I($"no reading within the {s.Readings.Count} followed comes within ½ LSB");
        var cause = (s.Start == ChannelStart.SwitchOn
                        ? I($"after the excitation is switched on (the pin from 0 V, the converter started {Show(ChannelSettling.SwitchOnLeadSeconds(design), UnitKind.Second)} later") 
                        : I($"after a channel switch (other channel at {Show(s.OtherChannelVolts, UnitKind.Volt)}; ") +
                          (d.SharedFilter ? "the shared filter starts from it" : "the channel's own filter starts unloaded")) +
                    I($"; the filter {(d.FilterReset ? "is reset" : "still holds the other channel")}) reading {d.ReadingsDiscarded + 1}, the first used, is {Show(s.FirstUsedErrorVolts, UnitKind.Volt)} off: ") +
                    I($"the pin's RC transient through {FilterWords(d)}, which alone settles in {s.FilterSettlingConversions} conversions; ") + discard;
        return new Finding(ChannelSwitchId, kelvin > design.Check.BudgetAt(s.Celsius) ? Severity.Fail : Severity.Warn,
            s.Start == ChannelStart.SwitchOn ? "the first reading used after the excitation is switched on is more than ½ LSB off" : "the first reading used after a channel switch is more than ½ LSB off", s.Celsius, s.Celsius, s.Celsius,
            s.FirstUsedErrorVolts, s.FirstUsedErrorVolts / lsb, s.FirstUsedErrorVolts / model.At(s.Celsius).VoltsPerKelvin, cause, null, s.FirstUsedErrorVolts, []);
    }

    private static Finding? InterferenceFinding(FrontEndDesign design, DeltaSigmaReport report, double lsb)
    {
        var over = report.Rejection.Where(r => r.ErrorVolts is { } v && v > lsb / 2).ToList();
        if (over.Count == 0) return null;
        var w = over.MaxBy(r => r.ErrorKelvin!.Value)!;
        var d = design.Adc.DeltaSigma!;
        var cause = I($"{Show(d.InterferenceVolts!.Value, UnitKind.Volt)} at the sensor at {Show(w.Hertz, UnitKind.Hertz)}: the front end passes {w.AnalogGain:G3} of it, ") +
                    I($"{FilterWords(d)} at {Show(d.DataRateHertz, UnitKind.Hertz)} rejects it by {w.DigitalDecibels:0.#} dB (|H(f)| of the filter); ") +
                    I($"a reading moves by up to {Show(w.ErrorVolts!.Value, UnitKind.Volt)} ({w.ErrorKelvin!.Value * 1e3:0.#} mK)");
        return new Finding(InterferenceId, w.ErrorKelvin!.Value > design.Check.BudgetAt(report.RejectionCelsius) ? Severity.Fail : Severity.Warn,
            "interference at a listed frequency moves a reading by more than ½ LSB", report.RejectionCelsius, report.RejectionCelsius, report.RejectionCelsius,
            w.ErrorVolts!.Value, w.ErrorVolts!.Value / lsb, w.ErrorKelvin!.Value, cause, null, w.ErrorVolts, []);
    }

    private static List<(Remedy Remedy, FrontEndDesign Changed)> InputLoadingRemedies(FrontEndDesign design, double lsb, ICheckEngine engine)
    {
        var d = design.Adc.DeltaSigma!;
        var temperatures = Noise.ReadingNoiseAnalysis.ReportTemperatures(design.Check.Range);
        double Worst(FrontEndDesign changed) => temperatures.Max(t => Math.Abs(InputLoading.At(changed, t, engine).ErrorVolts));
        bool Clears(FrontEndDesign changed) => Worst(changed) <= lsb / 2;
        string Proof(FrontEndDesign changed) => I($"the input's load analysed again with the change at {temperatures.Length} temperatures: at most {Show(Worst(changed), UnitKind.Volt)}, within ½ LSB ({Show(lsb / 2, UnitKind.Volt)})");
        var list = new List<(Remedy Remedy, FrontEndDesign Changed)>();
        if (!d.InputBuffered)
        {
            var buffered = With(design, d with { InputBuffered = true, SamplingCapacitanceFarads = 0, InputCurrentAmperes = 0 });
            if (Clears(buffered))
                list.Add((new Remedy("adc.input", "turn the converter's input buffer on (input = \"buffered\"; declare its input_current, which then loads the source instead)",
                    null, "", "the unbuffered input's switched load removed") { Proof = Proof(buffered) }, buffered));
        }
        // The series resistor: the closed form V·R_s/(R_s + R_eq) ≤ ½ LSB gives the start; proven, and lowered by 10 % steps until proven.
        var series = design.Filter.SeriesResistorOhms;
        if (series > 0)
            for (var candidate = Math.Floor(series * 0.9 * 1000) / 1000; candidate >= series * 1e-3; candidate = Round3(candidate * 0.5))
            {
                var changed = design with { Filter = design.Filter with { SeriesResistorOhms = candidate } };
                if (!Clears(changed)) continue;
                // Walk back up by 10 % steps to the largest value still proven.
                var best = candidate;
                for (var up = Round3(best * 1.1); up < series && Clears(design with { Filter = design.Filter with { SeriesResistorOhms = up } }); up = Round3(up * 1.1))
                    best = up;
                var proven = design with { Filter = design.Filter with { SeriesResistorOhms = best } };
                list.Add((new Remedy("filter.series_resistor", "reduce the filter's series resistor", best, "Ω", "halved until the load clears, then raised by 10 % steps while it stays clear") { Proof = Proof(proven) }, proven));
                break;
            }
        // A smaller reservoir lets the input capacitor recharge within each modulator phase; a larger one only reaches the average.
        var reservoir = design.Filter.ReservoirCapacitorFarads;
        foreach (var factor in new[] { 0.1, 0.01, 0.001, 0 })
        {
            var candidate = reservoir * factor;
            var changed = design with { Filter = design.Filter with { ReservoirCapacitorFarads = candidate } };
            if (reservoir > 0 && Clears(changed))
            {
                list.Add((new Remedy("filter.reservoir_capacitor", candidate == 0 ? "remove the reservoir (the input recharges within each modulator phase)"
                    : "reduce the reservoir so the input recharges within each modulator phase", candidate, "F", "decades down from the design's value, the first that clears")
                    { Proof = Proof(changed) }, changed));
                break;
            }
        }
        foreach (var factor in new[] { 10.0, 100.0 })
        {
            var changed = design with { Filter = design.Filter with { ReservoirCapacitorFarads = reservoir * factor } };
            if (reservoir > 0 && Clears(changed))
            {
                list.Add((new Remedy("filter.reservoir_capacitor", "enlarge the reservoir", reservoir * factor, "F", "decades up from the design's value") { Proof = Proof(changed) }, changed));
                break;
            }
        }
        return list;
    }

    private static List<(Remedy Remedy, FrontEndDesign Changed)> ChannelRemedies(FrontEndDesign design, ChannelSettlingResult worst, ICheckEngine engine)
    {
        var d = design.Adc.DeltaSigma!;
        var temperatures = SwitchTemperatures(design);
        (bool Clear, string Proof) Prove(FrontEndDesign changed)
        {
            var runs = temperatures.SelectMany(t => Starts(changed).Select(s => ChannelSettling.At(changed, t, engine, s))).ToList();
            var largest = runs.Max(r => Math.Abs(r.FirstUsedErrorVolts));
            return (runs.All(r => !r.FirstUsedOff),
                I($"the channel switch analysed again with the change at {temperatures.Length} temperatures: the first reading used is at most {Show(largest, UnitKind.Volt)} off, within ½ LSB"));
        }
        var list = new List<(Remedy Remedy, FrontEndDesign Changed)>();
        if (worst.ReadingsToDiscard is { } n && n > d.ReadingsDiscarded)
        {
            // The count at the worst temperature; proven at all of them, one more at a time if another needs more.
            for (var k = n; k <= Math.Min(n + 4, DeltaSigmaReader.MaximumDiscarded); k++)
            {
                var changed = With(design, d with { ReadingsDiscarded = k });
                var (clear, proof) = Prove(changed);
                if (!clear) continue;
                list.Add((new Remedy("adc.readings_discarded", I($"discard {k} readings after each channel switch"), k, "",
                    "the readings after the switch followed through the filter until every later one is within ½ LSB") { Proof = proof }, changed));
                break;
            }
        }
        if (!d.FilterReset)
        {
            var changed = With(design, d with { FilterReset = true });
            if (Prove(changed) is { Clear: true } p)
                list.Add((new Remedy("adc.filter_reset", "reset the filter on each channel change", null, "", "the other channel's samples cleared from the filter") { Proof = p.Proof }, changed));
        }
        return list;
    }

    private static List<(Remedy Remedy, FrontEndDesign Changed)> InterferenceRemedies(FrontEndDesign design, double lsb, double celsius)
    {
        var d = design.Adc.DeltaSigma!;
        var list = new List<(Remedy Remedy, FrontEndDesign Changed)>();
        // A slower data rate (whole decimations only): the fastest whose rejection clears every listed frequency, proven.
        for (var k = 2; k <= 100; k++)
        {
            var rate = d.DataRateHertz / k;
            var decimation = d.ModulatorRateHertz / (rate * d.AverageLength);
            if (Math.Abs(decimation - Math.Round(decimation)) > 1e-9 * decimation) continue;
            if (d.FilterOrder * (Math.Round(decimation) - 1) + (d.AverageLength - 1) * Math.Round(decimation) + 1 > DeltaSigmaReader.MaximumImpulseSamples) break;
            var changed = With(design, d with { DataRateHertz = rate });
            var rows = MainsRejection.At(changed, celsius);
            var largest = rows.Max(r => r.ErrorVolts ?? 0);
            if (largest > lsb / 2) continue;
            list.Add((new Remedy("adc.data_rate", "lower the data rate until the filter rejects the listed frequencies enough (its zeros at multiples of the data rate, its lobes falling beyond)", rate, "Hz",
                "data rates of whole decimations below the design's, the fastest that clears") { Proof = I($"the rejection computed again at {Show(rate, UnitKind.Hertz)}: at most {Show(largest, UnitKind.Volt)}, within ½ LSB; a slower reading also lags a ramp more") }, changed));
            break;
        }
        return list;
    }

    private static FrontEndDesign With(FrontEndDesign design, DeltaSigmaSpec d) => design with { Adc = design.Adc with { DeltaSigma = d, SampleRateHertz = d.DataRateHertz } };

    private static double Round3(double x) => x <= 0 ? 0 : double.Parse(x.ToString("G3", CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);

    private static string Show(double value, UnitKind unit) => EngineeringFormat.Format(value, unit, 3);
    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
