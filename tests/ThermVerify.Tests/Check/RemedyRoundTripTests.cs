using System.Globalization;
using System.Text.RegularExpressions;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Quantities;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Check;

/// <summary>
/// Every remedy of every bundled example, written into the design file the way a user would (the key set to the
/// printed value in the design's normal form, loaded again), clears the finding it addresses and brings no failing
/// finding the design did not already have; and no remedy asks for what the design already has or exceeds. The
/// examples run on a coarser grid than their own (the remedies then belong to that grid, and so do the checks here).
/// </summary>
public class RemedyRoundTripTests
{
    private static readonly CheckOptions Options = new() { MaximumSamplingPoints = 3 };

    [Theory]
    [MemberData(nameof(ExampleDesigns.All), MemberType = typeof(ExampleDesigns))]
    public void Every_remedy_written_into_the_design_clears_its_finding(string example)
    {
        var loaded = ExampleDesigns.Load(example);
        var range = loaded.Check.Range;
        AssertRoundTrip(example, loaded with { Check = loaded.Check with { StepKelvin = Math.Max(loaded.Check.StepKelvin, (range.MaxCelsius - range.MinCelsius) / 10) } });
    }

    /// <summary>
    /// The designs where remedies used to go wrong: a reservoir the design already has (a remedy once asked for "at least
    /// 80 fF" beside 4.7 nF), a bias current that dominates the buffer's static error (the remedy once named the offset),
    /// converter errors no single part clears (offset and gain calibrated out, the INL searched), and a large op-amp
    /// drift (the offset trimmed, the drift searched), and an op-amp whose voltage noise makes the codes flicker (its
/// noise searched on the simulated rms at the sampling capacitor). Each finding gets a proven remedy or says that none was found,
    /// and the findings whose parts add up get a combination.
    /// </summary>
    [Theory]
    [InlineData("reservoir-discharged")]
    [InlineData("bias-current")]
    [InlineData("converter-raised")]
    [InlineData("drift-raised")]
    [InlineData("noise-raised")]
    public void Remedies_of_the_hard_cases_are_proven_and_combine_where_no_single_change_clears(string name)
    {
        var (design, combined) = name switch
        {
            "reservoir-discharged" => (TestDesign.Make(("sensor.r25", "\"100 kohm\""), ("sensor.beta", "4190"), ("divider.fixed_resistor", "\"100 kohm\""),
                ("filter.reservoir_capacitor", "\"4.7 nF\""), ("adc.sample_rate", "\"1 MHz\""), ("adc.acquisition_time", "\"250 ns\""),
                ("adc.sampling_capacitance", "\"8 pF\""), ("adc.precharge", "\"discharged\""), ("check.range", "\"0 degC .. 40 degC\""), ("check.step", "\"10 K\"")), null),
            "bias-current" => (Buffered(b => b with { BiasCurrentAmperes = 1e-6 }), "buffer-static"),
            "converter-raised" => (Coarse(Oven() with { Adc = Oven().Adc with { OffsetErrorLsb = 10, InlLsb = 8 } }), "converter"),
            "drift-raised" => (Buffered(b => b with { OffsetDriftVoltsPerKelvin = 200e-6 }), "buffer-static"),
            // 1 µV/√Hz through a 1 MHz follower (noise bandwidth π/2·GBW, single pole): about 1.25 mV rms, over ½ LSB; a
            // converter without noise of its own, so that a quieter op-amp alone clears it (and is tried first).
            _ => (Buffer.BufferDesigns.Follower(("buffer.noise_voltage", "\"1 uV/rtHz\""), ("adc.noise", "\"0 LSB\"")), null),
        };
        var result = AssertRoundTrip(name, design);
        Assert.All(result.Findings, f => Assert.True(f.Remedies.Count > 0 || f.RemedyNote is not null, $"{name}: {f.Id} has neither a remedy nor a note"));
        if (combined is not null)
        {
            var finding = result.Findings.Single(f => f.Id == combined);
            Assert.Contains("no single change clears it", finding.RemedyNote);
            Assert.NotEmpty(Assert.Single(finding.Remedies).Together);
        }
        if (name == "noise-raised")
            Assert.Equal("buffer.noise_voltage", result.Findings.Single(f => f.Id == "noise").Remedies[0].Key);
        if (name == "bias-current")
            Assert.Contains(result.Findings.Single(f => f.Id == "buffer-static").Remedies.SelectMany(r => r.Together.Prepend(r)), r => r.Key == "buffer.bias_current");
    }

    private static FrontEndDesign Oven() => ExampleDesigns.Load("oven-pt1000.toml");

    private static FrontEndDesign Buffered(Func<BufferSpec, BufferSpec> change)
    {
        var d = ExampleDesigns.Load("buffered-cable-probe.toml");
        return Coarse(d with { Buffer = change(d.Buffer!) });
    }

    private static FrontEndDesign Coarse(FrontEndDesign d) =>
        d with { Check = d.Check with { StepKelvin = (d.Check.Range.MaxCelsius - d.Check.Range.MinCelsius) / 10 } };

    /// <summary>Checks the design with remedies and proves each remedy by writing it into the design file; returns the check.</summary>
    private static CheckResult AssertRoundTrip(string example, FrontEndDesign design)
    {
        var result = FrontEndCheck.Run(design, Options);
        var failingBefore = result.Findings.Where(f => f.Severity == Severity.Fail).Select(f => f.Id).ToHashSet();
        foreach (var finding in result.Findings)
            foreach (var remedy in finding.Remedies)
            {
                var changes = remedy.Together.Prepend(remedy).ToList();
                foreach (var change in changes.Where(c => c.Value is not null))
                    AssertMovesAway(design, change);
                var changed = Written(design, changes);
                var check = FrontEndCheck.Run(changed, Options with { ComputeRemedies = false });
                var what = $"{example}: {finding.Id} with {string.Join(" and ", changes.Select(c => $"{c.Key} = {c.Value?.ToString("G6", CultureInfo.InvariantCulture) ?? "0"}"))}";
                Assert.DoesNotContain(check.Findings, f => f.Id == finding.Id);
                Assert.All(check.Findings.Where(f => f.Severity == Severity.Fail), f => Assert.True(failingBefore.Contains(f.Id), $"{what} brings a failing {f.Id}"));
            }
        return result;
    }

    /// <summary>"at least" asks for more than the design has, "at most" for less (in magnitude); an absent part counts as none.</summary>
    private static void AssertMovesAway(FrontEndDesign design, Remedy change)
    {
        var current = Current(design, change.Key);
        if (current is null) return;
        if (change.Action.Contains("at least", StringComparison.Ordinal))
            Assert.True(change.Value > current, $"{change.Key}: asks for at least {change.Value} where the design has {current}");
        else if (change.Action.Contains("at most", StringComparison.Ordinal) || change.Action.Contains("within", StringComparison.Ordinal))
            Assert.True(Math.Abs(change.Value!.Value) < Math.Abs(current.Value), $"{change.Key}: asks for at most {change.Value} where the design has {current}");
    }

    private static double? Current(FrontEndDesign d, string key) => key switch
    {
        "adc.acquisition_time" => d.Adc.AcquisitionTimeSeconds,
        "adc.sample_rate" => d.Adc.SampleRateHertz,
        "adc.pin_leakage" => d.Adc.PinLeakageAmperes,
        "adc.offset_error" => d.Adc.OffsetErrorLsb,
        "adc.gain_error" => d.Adc.GainError,
        "adc.inl" => d.Adc.InlLsb,
        "adc.bits" => d.Adc.Bits,
        "adc.reference_tempco" => d.Adc.ReferenceTempcoPerKelvin,
        "filter.reservoir_capacitor" => d.Filter.ReservoirCapacitorFarads > 0 ? d.Filter.ReservoirCapacitorFarads : null,
        "filter.series_resistor" => d.Filter.SeriesResistorOhms,
        "divider.fixed_tempco" => d.VoltageDivider.FixedTempcoPerKelvin,
        "bridge.fixed_tempco" => d.VoltageDivider.FixedTempcoPerKelvin,
        "bridge.opposite_high_tempco" => d.Bridge!.HighTempcoPerKelvin,
        "bridge.opposite_low_tempco" => d.Bridge!.LowTempcoPerKelvin,
        "amplifier.offset_voltage" => d.Amplifier!.OffsetVolts,
        "amplifier.offset_drift" => d.Amplifier!.OffsetDriftVoltsPerKelvin,
        "amplifier.gain_error" => d.Amplifier!.GainError,
        "amplifier.bias_current" => d.Amplifier!.BiasCurrentAmperes,
        "amplifier.cmrr" => d.Amplifier!.CommonModeFraction == 0 ? null : -20 * Math.Log10(Math.Abs(d.Amplifier.CommonModeFraction)),
        "current_source.current_tempco" => d.CurrentSource!.CurrentTempcoPerKelvin,
        "current_source.reference_resistor_tempco" => d.CurrentSource!.ReferenceResistorTempcoPerKelvin,
        "wiring.current_mismatch" => d.Wiring!.CurrentMismatch,
        "wiring.lead_mismatch" => d.Wiring!.LeadMismatch,
        "wiring.lead_resistance" => d.Wiring!.LeadOhms,
        "protection.clamp_leakage" => d.Protection!.ClampLeakageAmperes,
        "protection.insulation_resistance" => d.Protection!.InsulationOhms,
        "sensor.dissipation_constant" => d.Sensor.DissipationConstantWattsPerKelvin,
        "buffer.gain_bandwidth" => d.Buffer?.GainBandwidthHertz,
        "buffer.offset_voltage" => d.Buffer?.OffsetVolts,
        "buffer.offset_drift" => d.Buffer?.OffsetDriftVoltsPerKelvin,
        "buffer.bias_current" => d.Buffer?.BiasCurrentAmperes,
        "buffer.isolation_resistor" => d.Buffer is { IsolationResistorOhms: > 0 } b ? b.IsolationResistorOhms : null,
        "buffer.slew_rate" => d.Buffer?.SlewRateVoltsPerSecond,
        "buffer.noise_voltage" => d.Buffer?.NoiseVoltsPerRootHertz,
        "buffer.output_swing" => d.Buffer?.OutputSwingVolts,
        "noise.readings_averaged" => d.Noise.ReadingsAveraged,
        "adc.noise" => ThermVerify.Check.Noise.ReadingNoiseAnalysis.ConverterVolts(d, new ThermVerify.FrontEnd.ClosedFormModel(d).Adc.LsbVolts),
        "netlist.switch_on_lead" => d.Netlist!.SwitchOnLeadSeconds,
        _ when key.StartsWith("netlist.part.", StringComparison.Ordinal) && key.EndsWith(".tempco", StringComparison.Ordinal) =>
            d.Netlist!.Part(key["netlist.part.".Length..^".tempco".Length])!.TempcoPerKelvin,
        _ when key.StartsWith("netlist.fixed", StringComparison.Ordinal) => d.Netlist!.Parsed.Find(d.Netlist.FixedElement!)!.Value,
        _ => throw new InvalidOperationException($"a remedy for {key}: add it to this test"),
    };

    /// <summary>The design's normal form with each key set to the remedy's value (a value-less remedy removes the error: 0), loaded again.</summary>
    private static FrontEndDesign Written(FrontEndDesign design, IEnumerable<Remedy> changes)
    {
        var text = DesignWriter.ToToml(design);
        // A netlist's fixed resistor is changed in the netlist, which the design file does not hold: applied after loading.
        var fixedValue = changes.FirstOrDefault(c => c.Key.StartsWith("netlist.fixed", StringComparison.Ordinal))?.Value;
        foreach (var change in changes.Where(c => !c.Key.StartsWith("netlist.fixed", StringComparison.Ordinal)))
        {
            if (change.Key.StartsWith("netlist.part.", StringComparison.Ordinal))
            {
                // A [[netlist.part]] entry, found by its name: its tempco line.
                var name = change.Key["netlist.part.".Length..change.Key.LastIndexOf('.')];
                var entry = text.IndexOf($"[[netlist.part]]\nname = \"{name}\"\n", StringComparison.Ordinal);
                var tempco = new Regex("^tempco = .*$", RegexOptions.Multiline);
                var at = tempco.Match(text, entry);
                text = text[..at.Index] + $"tempco = {Toml(change)}" + text[(at.Index + at.Length)..];
                continue;
            }
            var dot = change.Key.IndexOf('.');
            var (section, key) = (change.Key[..dot], change.Key[(dot + 1)..]);
            var value = Toml(change);
            if (section == "buffer" && !text.Contains("\n[buffer]\n", StringComparison.Ordinal))
            {
                // The follower the remedy describes: rail-to-rail on the excitation (or reference), 100 Ω open-loop output resistance.
                var top = Math.Max(design.VoltageDivider.ExcitationVolts, design.Adc.ReferenceVolts ?? 0).ToString("R", CultureInfo.InvariantCulture);
                text = text.Replace("\n[filter]\n", $"\n[buffer]\n{key} = {value}\nsupply = \"0 V .. {top} V\"\noutput_resistance = \"100 ohm\"\n\n[filter]\n", StringComparison.Ordinal);
                continue;
            }
            var header = $"\n[{section}]\n";
            var start = text.IndexOf(header, StringComparison.Ordinal) + header.Length;
            var end = text.IndexOf("\n[", start, StringComparison.Ordinal);
            var body = text[start..(end < 0 ? text.Length : end + 1)];
            var line = new Regex($"^{Regex.Escape(key)} = .*$", RegexOptions.Multiline);
            var edited = line.IsMatch(body) ? line.Replace(body, $"{key} = {value}") : $"{key} = {value}\n" + body;
            text = text[..start] + edited + text[(start + body.Length)..];
        }
        var loaded = DesignLoader.Parse(text, "remedied.toml", ExampleDesigns.Folder());
        return fixedValue is { } v ? loaded with { Netlist = loaded.Netlist!.WithValue(loaded.Netlist.FixedElement!, v) } : loaded;
    }

    private static string Toml(Remedy r)
    {
        var v = r.Value ?? 0;
        var unit = r.Unit switch
        {
            "s" => UnitKind.Second, "F" => UnitKind.Farad, "Hz" => UnitKind.Hertz, "Ω" => UnitKind.Ohm, "A" => UnitKind.Ampere,
            "V" => UnitKind.Volt, "V/K" => UnitKind.VoltPerKelvin, "V/s" => UnitKind.VoltPerSecond, "W/K" => UnitKind.WattPerKelvin,
            "V/√Hz" => UnitKind.VoltPerRootHertz, "ppm/K" => UnitKind.PpmPerKelvin, "fraction" => UnitKind.Percent, "LSB" => UnitKind.Lsb,
            "bits" or "conversions" => (UnitKind?)null,
            _ => throw new InvalidOperationException($"unit {r.Unit}: add it to this test"),
        };
        return unit is { } u ? $"\"{EngineeringFormat.FormatExact(v, u)}\"" : ((int)v).ToString(CultureInfo.InvariantCulture);
    }
}
