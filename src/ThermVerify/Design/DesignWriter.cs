using System.Globalization;
using System.Text;
using ThermVerify.Quantities;
using ThermVerify.Sensors;

namespace ThermVerify.Design;

/// <summary>
/// Prints a design back as TOML with every default made explicit and values in engineering notation, each printed
/// with just enough digits to load back to the same double. Keys with no default (not modelled) are left out.
/// </summary>
internal static partial class DesignWriter
{
    public static string ToToml(FrontEndDesign design)
    {
        var w = new Writer();
        w.Text("name", design.Name);
        if (design.Description is not null)
            w.Text("description", design.Description);
        WriteSensor(w, design.Sensor);
        if (design.Divider is { } divider)
        {
            if (design.Bridge is { } bridge)
                WriteBridge(w, divider, bridge);
            else
                WriteDivider(w, divider);
        }
        if (design.Amplifier is { } amplifier)
            WriteAmplifier(w, amplifier);
        if (design.CurrentSource is { } source)
            WriteCurrentSource(w, source);
        if (design.Wiring is { } wiring)
            WriteWiring(w, wiring, design.Bridge is not null);
        if (design.Buffer is not null)
            WriteBuffer(w, design.Buffer);
        if (design.Netlist is { } netlist)
            WriteNetlist(w, netlist);
        else
        {
            w.Section("filter");
            w.Value("series_resistor", design.Filter.SeriesResistorOhms, UnitKind.Ohm);
            w.Value("reservoir_capacitor", design.Filter.ReservoirCapacitorFarads, UnitKind.Farad);
        }
        if (design.Protection is { } protection)
            WriteProtection(w, protection);
        WriteAdc(w, design.Adc);
        WriteCheck(w, design.Check);
        WriteNoise(w, design.Noise);
        WriteTolerances(w, design.Tolerances);
        return w.ToString();
    }

    private static void WriteSensor(Writer w, SensorSpec sensor)
    {
        w.Section("sensor");
        w.Text("model", sensor.ModelName);
        switch (sensor)
        {
            case BetaSensorSpec b:
                if (b.ReferenceCelsius == 25)
                    w.Value("r25", b.R0Ohms, UnitKind.Ohm);
                else
                {
                    w.Value("r0", b.R0Ohms, UnitKind.Ohm);
                    w.Value("reference_temperature", b.ReferenceCelsius, UnitKind.Celsius);
                }
                w.Number("beta", b.BetaKelvin);
                w.Range("beta_between", b.BetaFromCelsius, b.BetaToCelsius, UnitKind.Celsius);
                w.Value("resistance_tolerance", b.ResistanceTolerance, UnitKind.Percent);
                w.Value("beta_tolerance", b.BetaTolerance, UnitKind.Percent);
                WriteValidRange(w, b.ValidRange);
                break;
            case SteinhartHartSensorSpec sh:
                w.Number("a", sh.A);
                w.Number("b", sh.B);
                w.Number("c", sh.C);
                w.Number("d", sh.D);
                w.Value("resistance_tolerance", sh.ResistanceTolerance, UnitKind.Percent);
                WriteValidRange(w, sh.ValidRange);
                break;
            case TableSensorSpec t:
                w.Text("file", t.File);
                w.Value("resistance_tolerance", t.ResistanceTolerance, UnitKind.Percent);
                break;
            case RtdSensorSpec r:
                w.Value("r0", r.R0Ohms, UnitKind.Ohm);
                if (r.ToleranceClass is { } c)
                    w.Text("class", c.ToString());
                w.Number("a", r.A);
                w.Number("b", r.B);
                w.Number("c", r.C);
                break;
            default:
                throw new ArgumentException($"unknown sensor spec {sensor.GetType().Name}", nameof(sensor));
        }
        if (sensor.DissipationConstantWattsPerKelvin is { } d)
            w.Value("dissipation_constant", d, UnitKind.WattPerKelvin);
    }

    private static void WriteValidRange(Writer w, TemperatureRange? range)
    {
        if (range is { } r)
            w.Range("valid_range", r.MinCelsius, r.MaxCelsius, UnitKind.Celsius);
    }

    private static void WriteDivider(Writer w, DividerSpec d)
    {
        w.Section("divider");
        WriteSensorHalf(w, d);
        if (d.SwitchOnLeadSeconds is { } lead)
            w.Value("switch_on_lead", lead, UnitKind.Second);
        if (d.ReadingIntervalSeconds is { } interval)
            w.Value("reading_interval", interval, UnitKind.Second);
    }

    /// <summary>The sensor's half, which a divider and a bridge write with the same keys.</summary>
    private static void WriteSensorHalf(Writer w, DividerSpec d)
    {
        w.Text("sensor_side", d.SensorSide == SensorSide.High ? "high" : "low");
        w.Value("fixed_resistor", d.FixedResistorOhms, UnitKind.Ohm);
        w.Value("fixed_tolerance", d.FixedTolerance, UnitKind.Percent);
        w.Value("fixed_tempco", d.FixedTempcoPerKelvin, UnitKind.PpmPerKelvin, d.FixedTempcoSigned);
        w.Value("excitation", d.ExcitationVolts, UnitKind.Volt);
        w.Value("excitation_tolerance", d.ExcitationTolerance, UnitKind.Percent);
    }

    private static void WriteBridge(Writer w, DividerSpec d, BridgeSpec b)
    {
        w.Section("bridge");
        WriteSensorHalf(w, d);
        w.Value("opposite_high", b.HighOhms, UnitKind.Ohm);
        w.Value("opposite_high_tolerance", b.HighTolerance, UnitKind.Percent);
        w.Value("opposite_high_tempco", b.HighTempcoPerKelvin, UnitKind.PpmPerKelvin, b.HighTempcoSigned);
        w.Value("opposite_low", b.LowOhms, UnitKind.Ohm);
        w.Value("opposite_low_tolerance", b.LowTolerance, UnitKind.Percent);
        w.Value("opposite_low_tempco", b.LowTempcoPerKelvin, UnitKind.PpmPerKelvin, b.LowTempcoSigned);
    }

    private static void WriteAmplifier(Writer w, AmplifierSpec a)
    {
        w.Section("amplifier");
        w.Number("gain", a.Gain);
        w.Value("gain_error", a.GainError, UnitKind.Percent, a.GainErrorSigned);
        w.Value("offset_voltage", a.OffsetVolts, UnitKind.Volt, a.OffsetSigned);
        w.Value("offset_drift", a.OffsetDriftVoltsPerKelvin, UnitKind.VoltPerKelvin, a.OffsetDriftSigned);
        if (a.CommonModeFraction != 0)
            w.Value("cmrr", -20 * Math.Log10(Math.Abs(a.CommonModeFraction)), UnitKind.Decibel);
        w.Value("bias_current", a.BiasCurrentAmperes, UnitKind.Ampere, a.BiasCurrentSigned);
        if (a.OutputRange is { } output)
            w.Range("output_range", output.MinVolts, output.MaxVolts, UnitKind.Volt);
        if (a.InputCommonMode is { } input)
            w.Range("input_common_mode", input.MinVolts, input.MaxVolts, UnitKind.Volt);
    }

    private static void WriteCurrentSource(Writer w, CurrentSourceSpec c)
    {
        w.Section("current_source");
        w.Value("current", c.CurrentAmperes, UnitKind.Ampere);
        w.Value("current_tolerance", c.CurrentTolerance, UnitKind.Percent);
        w.Value("current_tempco", c.CurrentTempcoPerKelvin, UnitKind.PpmPerKelvin, c.CurrentTempcoSigned);
        if (c.Compliance is { } compliance)
            w.Range("compliance", compliance.MinVolts, compliance.MaxVolts, UnitKind.Volt);
        if (c.OutputResistanceOhms is { } output)
            w.Value("output_resistance", output, UnitKind.Ohm);
        if (c.ReferenceResistorOhms is not { } reference) return;
        w.Value("reference_resistor", reference, UnitKind.Ohm);
        w.Value("reference_resistor_tolerance", c.ReferenceResistorTolerance, UnitKind.Percent);
        w.Value("reference_resistor_tempco", c.ReferenceResistorTempcoPerKelvin, UnitKind.PpmPerKelvin, c.ReferenceResistorTempcoSigned);
        if (c.ReferenceInputOhms is { } input)
            w.Value("reference_input_resistance", input, UnitKind.Ohm);
    }

    private static void WriteProtection(Writer w, ProtectionSpec x)
    {
        w.Section("protection");
        if (x.HasClamps)
        {
            w.Value("clamp_leakage", x.ClampLeakageAmperes, UnitKind.Ampere, x.ClampLeakageSigned);
            w.Value("clamp_leakage_temperature", x.ClampLeakageCelsius, UnitKind.Celsius);
            w.Value("clamp_leakage_doubling", x.ClampDoublingKelvin, UnitKind.Kelvin);
            if (x.ClampRailVolts is { } rail)
                w.Value("clamp_rail", rail, UnitKind.Volt);
            if (x.ClampCelsius is { } t)
                w.Value("clamp_temperature", t, UnitKind.Celsius);
        }
        if (x.InsulationOhms is { } insulation)
        {
            w.Value("insulation_resistance", insulation, UnitKind.Ohm);
            w.Value("insulation_to", x.InsulationToVolts, UnitKind.Volt);
        }
    }

    private static void WriteWiring(Writer w, WiringSpec x, bool bridge)
    {
        w.Section("wiring");
        w.Integer("wires", x.Wires);
        w.Value("lead_resistance", x.LeadOhms, UnitKind.Ohm);
        w.Value("lead_tempco", x.LeadTempcoPerKelvin, UnitKind.PpmPerKelvin);
        if (x.LeadCelsius is { } t)
            w.Value("lead_temperature", t, UnitKind.Celsius);
        // 3 wires: a current source's second current, or the leads in a bridge's arms.
        if (x.Wires == 3 && !bridge)
            w.Value("current_mismatch", x.CurrentMismatch, UnitKind.Percent, x.CurrentMismatchSigned);
        if (x.Wires == 3 && bridge)
            w.Value("lead_mismatch", x.LeadMismatch, UnitKind.Percent, x.LeadMismatchSigned);
    }

    private static void WriteBuffer(Writer w, BufferSpec b)
    {
        w.Section("buffer");
        w.Text("topology", b.Topology == BufferTopology.Follower ? "follower" : "non-inverting");
        w.Number("gain", b.Gain);
        w.Value("gain_bandwidth", b.GainBandwidthHertz, UnitKind.Hertz);
        if (b.DcGainDecibels is { } dc)
            w.Value("dc_gain", dc, UnitKind.Decibel);
        w.Value("output_resistance", b.OutputResistanceOhms, UnitKind.Ohm);
        w.Value("offset_voltage", b.OffsetVolts, UnitKind.Volt, b.OffsetSigned);
        w.Value("offset_drift", b.OffsetDriftVoltsPerKelvin, UnitKind.VoltPerKelvin, b.OffsetDriftSigned);
        w.Value("bias_current", b.BiasCurrentAmperes, UnitKind.Ampere, b.BiasCurrentSigned);
        w.Value("offset_current", b.OffsetCurrentAmperes, UnitKind.Ampere);
        w.Range("supply", b.Supply.MinVolts, b.Supply.MaxVolts, UnitKind.Volt);
        w.Value("output_swing", b.OutputSwingVolts, UnitKind.Volt);
        if (b.InputCommonMode is { } cm)
            w.Range("input_common_mode", cm.MinVolts, cm.MaxVolts, UnitKind.Volt);
        if (b.SlewRateVoltsPerSecond is { } sr)
            w.Value("slew_rate", sr, UnitKind.VoltPerSecond);
        w.Value("noise_voltage", b.NoiseVoltsPerRootHertz, UnitKind.VoltPerRootHertz);
        w.Value("noise_current", b.NoiseAmperesPerRootHertz, UnitKind.AmperePerRootHertz);
        if (b.NoiseCornerHertz is { } nc)
            w.Value("noise_corner", nc, UnitKind.Hertz);
        w.Value("isolation_resistor", b.IsolationResistorOhms, UnitKind.Ohm);
        w.Value("minimum_phase_margin", b.MinimumPhaseMarginDegrees, UnitKind.Degree);
        if (b.Subcircuit is { } sub)
        {
            w.Text("subckt_file", sub.File);
            w.Text("subckt_name", sub.Name);
        }
    }

    private static void WriteAdc(Writer w, AdcSpec a)
    {
        w.Section("adc");
        w.Integer("bits", a.Bits);
        if (a.ReferenceVolts is { } vref)
            w.Value("reference", vref, UnitKind.Volt);
        else
            w.Text("reference", "ratiometric");
        w.Value("reference_tolerance", a.ReferenceTolerance, UnitKind.Percent);
        if (a.ReferenceVolts is not null)
            w.Value("reference_tempco", a.ReferenceTempcoPerKelvin, UnitKind.PpmPerKelvin, a.ReferenceTempcoSigned);
        if (a.DeltaSigma is null)
        {
            w.Value("sample_rate", a.SampleRateHertz, UnitKind.Hertz);
            w.Value("acquisition_time", a.AcquisitionTimeSeconds, UnitKind.Second);
            w.Value("sampling_capacitance", a.SamplingCapacitanceFarads, UnitKind.Farad);
            w.Value("switch_resistance", a.SwitchResistanceOhms, UnitKind.Ohm);
        }
        w.Value("pin_capacitance", a.PinCapacitanceFarads, UnitKind.Farad);
        w.Value("pin_leakage", a.PinLeakageAmperes, UnitKind.Ampere, a.PinLeakageSigned);
        w.Value("pin_leakage_temperature", a.PinLeakageCelsius, UnitKind.Celsius);
        w.Value("leakage_doubling", a.LeakageDoublingKelvin, UnitKind.Kelvin);
        w.Value("offset_error", a.OffsetErrorLsb, UnitKind.Lsb, a.OffsetErrorSigned);
        w.Value("gain_error", a.GainError, UnitKind.Percent, a.GainErrorSigned);
        w.Value("inl", a.InlLsb, UnitKind.Lsb);
        if (a.GainStage is { } g)
        {
            // A delta-sigma converter's gain is written with its own keys below.
            if (a.DeltaSigma is null)
                w.Number("gain", g.Gain);
            w.Value("pga_gain_error", g.GainError, UnitKind.Percent, g.GainErrorSigned);
            w.Value("pga_input_current", g.InputCurrentAmperes, UnitKind.Ampere, g.InputCurrentSigned);
        }
        if (a.DeltaSigma is null)
            w.Text("precharge", a.Precharge switch
            {
                PrechargeMode.LastSample => "last-sample",
                PrechargeMode.OtherChannel => "other-channel",
                PrechargeMode.Discharged => "discharged",
                _ => "worst",
            });
        if (a.ChargeInjectionCoulombs != 0)
            w.Value("charge_injection", a.ChargeInjectionCoulombs, UnitKind.Coulomb);
        if (a.PrechargeVolts is { } pv)
            w.Value("precharge_voltage", pv, UnitKind.Volt);
        // The input is written where it is not the default single-ended one (whose normal form stays as it was).
        if (a.NegativeInput is { } negative)
        {
            w.Text("input", a.Input == AdcInput.Differential ? "differential" : "pseudo-differential");
            if (a.CommonModeRange is { } range)
                w.Range("common_mode_range", range.MinVolts, range.MaxVolts, UnitKind.Volt);
            w.Value("negative_sampling_capacitance", negative.SamplingCapacitanceFarads, UnitKind.Farad);
            w.Value("negative_switch_resistance", negative.SwitchResistanceOhms, UnitKind.Ohm);
            w.Value("negative_pin_capacitance", negative.PinCapacitanceFarads, UnitKind.Farad);
            w.Value("negative_pin_leakage", negative.PinLeakageAmperes, UnitKind.Ampere, negative.PinLeakageSigned);
            if (negative.PrechargeVolts is { } negativePrecharge)
                w.Value("negative_precharge_voltage", negativePrecharge, UnitKind.Volt);
        }
        w.Text("first_transition", a.FirstTransition == FirstTransition.HalfLsb ? "half-lsb" : "one-lsb");
        w.Text("firmware_inverse", a.FirmwareInverse == CodeInverse.BinMiddle ? "bin-middle" : "bin-edge");
        if (a.NoiseLsb is { } lsb)
            w.Value("noise", lsb, UnitKind.Lsb);
        else if (a.NoiseVolts is { } volts)
            w.Value("noise", volts, UnitKind.Volt);
        if (a.DeltaSigma is { } ds)
            WriteDeltaSigma(w, ds);
    }

    /// <summary>The delta-sigma keys of [adc], then its noise table (table arrays come after the section's own keys).</summary>
    private static void WriteDeltaSigma(Writer w, DeltaSigmaSpec d)
    {
        w.Text("kind", "delta-sigma");
        w.Value("modulator_rate", d.ModulatorRateHertz, UnitKind.Hertz);
        w.Value("data_rate", d.DataRateHertz, UnitKind.Hertz);
        w.Text("input", d.InputBuffered ? "buffered" : "unbuffered");
        if (d.InputBuffered)
            w.Value("input_current", d.InputCurrentAmperes, UnitKind.Ampere, d.InputCurrentSigned);
        else
            w.Value("sampling_capacitance", d.SamplingCapacitanceFarads, UnitKind.Farad);
        w.Number("gain", d.Gain);
        w.Text("filter", $"sinc{d.FilterOrder}");
        w.Integer("average_length", d.AverageLength);
        w.Boolean("filter_reset", d.FilterReset);
        w.Text("channel_filter", d.SharedFilter ? "shared" : "own");
        w.Integer("readings_discarded", d.ReadingsDiscarded);
        w.Values("rejection_frequencies", d.RejectionHertz, UnitKind.Hertz);
        if (d.InterferenceVolts is { } interference)
            w.Value("interference", interference, UnitKind.Volt);
        foreach (var row in d.NoiseTable)
        {
            w.Section("[adc.noise_table]");
            w.Value("data_rate", row.DataRateHertz, UnitKind.Hertz);
            w.Number("gain", row.Gain);
            w.Value("noise", row.RmsVolts, UnitKind.Volt);
        }
    }

    private static void WriteNoise(Writer w, NoiseSpec n)
    {
        w.Section("noise");
        w.Number("coverage", n.Coverage);
        w.Integer("readings_averaged", n.ReadingsAveraged);
        if (n.RampKelvinPerSecond is { } ramp)
            w.Value("ramp_rate", ramp, UnitKind.KelvinPerSecond);
    }

    private static void WriteCheck(Writer w, CheckSpec c)
    {
        w.Section("check");
        w.Range("range", c.Range.MinCelsius, c.Range.MaxCelsius, UnitKind.Celsius);
        w.Value("step", c.StepKelvin, UnitKind.Kelvin);
        w.Value("budget", c.BudgetKelvin, UnitKind.Kelvin);
        w.Value("settle_limit", c.SettleLimitLsb, UnitKind.Lsb);
        if (c.BoardCelsius is { } board)
            w.Value("board_temperature", board, UnitKind.Celsius);
        foreach (var region in c.Regions)
        {
            w.Section("[check.region]");
            w.Range("range", region.Range.MinCelsius, region.Range.MaxCelsius, UnitKind.Celsius);
            w.Value("budget", region.BudgetKelvin, UnitKind.Kelvin);
        }
    }

    private static void WriteTolerances(Writer w, ToleranceSpec t)
    {
        w.Section("tolerances");
        w.Text("distribution", t.Distribution == ToleranceShape.Normal ? "normal" : "uniform");
        if (t.Distribution == ToleranceShape.Normal)
            w.Number("coverage_factor", t.CoverageFactor);
        w.Value("leakage_spread", t.LeakageSpread, UnitKind.Percent);
    }

    private sealed class Writer
    {
        private readonly StringBuilder _text = new();

        public void Section(string name) => _text.Append('\n').Append('[').Append(name).Append("]\n");

        public void Text(string key, string value) => Line(key, Quote(value));

        public void Value(string key, double value, UnitKind unit) => Line(key, Quote(EngineeringFormat.FormatExact(value, unit)));

        /// <summary>A static error: a value written with its sign keeps it ("+1 mV"), a bound is written without one.</summary>
        public void Value(string key, double value, UnitKind unit, bool signed) =>
            Line(key, Quote((signed && value >= 0 ? "+" : "") + EngineeringFormat.FormatExact(value, unit)));

        public void Range(string key, double min, double max, UnitKind unit) =>
            Line(key, Quote($"{EngineeringFormat.FormatExact(min, unit)} .. {EngineeringFormat.FormatExact(max, unit)}"));

        public void Number(string key, double value) => Line(key, value.ToString("R", CultureInfo.InvariantCulture));

        public void Integer(string key, int value) => Line(key, value.ToString(CultureInfo.InvariantCulture));

        /// <summary>A list of names, as a TOML array of strings.</summary>
        public void Names(string key, IEnumerable<string> names) => Line(key, "[" + string.Join(", ", names.Select(Quote)) + "]");

        /// <summary>The header of one entry of an array of tables ([[name]]).</summary>
        public void Entry(string name) => _text.Append('\n').Append("[[").Append(name).Append("]]\n");

        public void Boolean(string key, bool value) => Line(key, value ? "true" : "false");

        public void Values(string key, IEnumerable<double> values, UnitKind unit) =>
            Line(key, "[" + string.Join(", ", values.Select(v => Quote(EngineeringFormat.FormatExact(v, unit)))) + "]");

        private void Line(string key, string value) => _text.Append(key).Append(" = ").Append(value).Append('\n');

        /// <summary>A TOML basic string.</summary>
        private static string Quote(string value)
        {
            var b = new StringBuilder("\"");
            foreach (var ch in value)
            {
                b.Append(ch switch
                {
                    '"' => "\\\"",
                    '\\' => "\\\\",
                    '\n' => "\\n",
                    '\t' => "\\t",
                    '\r' => "\\r",
                    < ' ' or '\u007F' => $"\\u{(int)ch:X4}",
                    _ => ch.ToString(),
                });
            }
            return b.Append('"').ToString();
        }

        public override string ToString() => _text.ToString();
    }
}
