using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>One static error that enters the circuit and is given as a bound: its key, its size, and how to set it.</summary>
internal sealed record CircuitBound(string Key, double Magnitude, Func<FrontEndDesign, double, FrontEndDesign> Set);

/// <summary>
/// The design's static errors written without a sign, which the check takes as bounds (docs/methods.md): pin leakage, the clamp diodes' leakage,
/// the fixed resistor's tempco, the gain stage's input current, and the op-amp's offset, drift and bias current enter the circuit; the converter's
/// offset and gain errors (the gain stage's with them) and the reference's tempco are converter properties, and INL is always a bound. Errors
/// written with a sign are part of the design as it stands.
/// </summary>
internal static class StaticBounds
{
    public static IReadOnlyList<CircuitBound> InCircuit(FrontEndDesign d)
    {
        var list = new List<CircuitBound>();
        void Add(string key, double value, bool signed, Func<FrontEndDesign, double, FrontEndDesign> set)
        {
            if (value != 0 && !signed) list.Add(new CircuitBound(key, Math.Abs(value), set));
        }
        Add("adc.pin_leakage", d.Adc.PinLeakageAmperes, d.Adc.PinLeakageSigned, (x, v) => x with { Adc = x.Adc with { PinLeakageAmperes = v } });
        if (d.Adc.NegativeInput is { } negative)
            Add("adc.negative_pin_leakage", negative.PinLeakageAmperes, negative.PinLeakageSigned,
                (x, v) => x with { Adc = x.Adc with { NegativeInput = x.Adc.NegativeInput! with { PinLeakageAmperes = v } } });
        if (d.Bridge is { } bridge)
        {
            Add("bridge.opposite_high_tempco", bridge.HighTempcoPerKelvin, bridge.HighTempcoSigned, (x, v) => x with { Bridge = x.Bridge! with { HighTempcoPerKelvin = v } });
            Add("bridge.opposite_low_tempco", bridge.LowTempcoPerKelvin, bridge.LowTempcoSigned, (x, v) => x with { Bridge = x.Bridge! with { LowTempcoPerKelvin = v } });
        }
        if (d.Adc.GainStage is { } stage)
            Add("adc.pga_input_current", stage.InputCurrentAmperes, stage.InputCurrentSigned,
                (x, v) => x with { Adc = x.Adc with { GainStage = x.Adc.GainStage! with { InputCurrentAmperes = v } } });
        if (d.Divider is { } divider)
            Add(d.Bridge is null ? "divider.fixed_tempco" : "bridge.fixed_tempco", divider.FixedTempcoPerKelvin, divider.FixedTempcoSigned, (x, v) => x with { Divider = x.Divider! with { FixedTempcoPerKelvin = v } });
        if (d.CurrentSource is { } source)
        {
            Add("current_source.current_tempco", source.CurrentTempcoPerKelvin, source.CurrentTempcoSigned,
                (x, v) => x with { CurrentSource = x.CurrentSource! with { CurrentTempcoPerKelvin = v } });
            Add("current_source.reference_resistor_tempco", source.ReferenceResistorTempcoPerKelvin, source.ReferenceResistorTempcoSigned,
                (x, v) => x with { CurrentSource = x.CurrentSource! with { ReferenceResistorTempcoPerKelvin = v } });
        }
        if (d.Netlist is { } netlist)
            foreach (var part in netlist.Parts)
                Add($"netlist.part.{part.Name}.tempco", part.TempcoPerKelvin, part.TempcoSigned, (x, v) => x with
                {
                    Netlist = x.Netlist! with { Parts = [.. x.Netlist.Parts.Select(p => p.Name == part.Name ? p with { TempcoPerKelvin = v } : p)] },
                });
        if (d.Protection is { } protection)
            Add("protection.clamp_leakage", protection.ClampLeakageAmperes, protection.ClampLeakageSigned,
                (x, v) => x with { Protection = x.Protection! with { ClampLeakageAmperes = v } });
        if (d.Wiring is { Wires: 3 } wiring)
        {
            Add("wiring.current_mismatch", wiring.CurrentMismatch, wiring.CurrentMismatchSigned, (x, v) => x with { Wiring = x.Wiring! with { CurrentMismatch = v } });
            Add("wiring.lead_mismatch", wiring.LeadMismatch, wiring.LeadMismatchSigned, (x, v) => x with { Wiring = x.Wiring! with { LeadMismatch = v } });
        }
        if (d.Amplifier is { } amplifier)
        {
            AmplifierSpec With(FrontEndDesign x) => x.Amplifier!;
            Add("amplifier.offset_voltage", amplifier.OffsetVolts, amplifier.OffsetSigned, (x, v) => x with { Amplifier = With(x) with { OffsetVolts = v } });
            Add("amplifier.offset_drift", amplifier.OffsetDriftVoltsPerKelvin, amplifier.OffsetDriftSigned,
                (x, v) => x with { Amplifier = With(x) with { OffsetDriftVoltsPerKelvin = v } });
            Add("amplifier.gain_error", amplifier.GainError, amplifier.GainErrorSigned, (x, v) => x with { Amplifier = With(x) with { GainError = v } });
            Add("amplifier.bias_current", amplifier.BiasCurrentAmperes, amplifier.BiasCurrentSigned, (x, v) => x with { Amplifier = With(x) with { BiasCurrentAmperes = v } });
            // A CMRR has no sign: always a bound.
            Add("amplifier.cmrr", amplifier.CommonModeFraction, false, (x, v) => x with { Amplifier = With(x) with { CommonModeFraction = v } });
        }
        if (d.Buffer is { Subcircuit: null } b)
        {
            Add("buffer.offset_voltage", b.OffsetVolts, b.OffsetSigned, (x, v) => x with { Buffer = x.Buffer! with { OffsetVolts = v } });
            Add("buffer.offset_drift", b.OffsetDriftVoltsPerKelvin, b.OffsetDriftSigned, (x, v) => x with { Buffer = x.Buffer! with { OffsetDriftVoltsPerKelvin = v } });
            Add("buffer.bias_current", b.BiasCurrentAmperes, b.BiasCurrentSigned, (x, v) => x with { Buffer = x.Buffer! with { BiasCurrentAmperes = v } });
        }
        return list;
    }

    /// <summary>The design with every bound in the circuit at zero: what the bounds are added to.</summary>
    public static FrontEndDesign Zeroed(FrontEndDesign d) => InCircuit(d).Aggregate(d, (x, b) => b.Set(x, 0));

    /// <summary>Whether the check has two corners to take (any bound, in the circuit or the converter).</summary>
    public static bool Any(FrontEndDesign d) =>
        InCircuit(d).Count > 0 || d.Adc.InlLsb != 0
        || (d.Adc.OffsetErrorLsb != 0 && !d.Adc.OffsetErrorSigned) || (d.Adc.GainError != 0 && !d.Adc.GainErrorSigned)
        || (!d.Adc.IsRatiometric && d.Adc.ReferenceTempcoPerKelvin != 0 && !d.Adc.ReferenceTempcoSigned)
        || d.Adc.GainStage is { GainError: not 0, GainErrorSigned: false };
}
